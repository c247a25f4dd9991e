/**
 * Check values for the beam shading of a window by an overhang and side fins (infinitely long devices) on a
 * vertical façade.
 *
 * Inputs in metres and degrees: window width W and height H; overhang depth P with its underside G above the
 * head; fins of depth F set back E from the jambs; façade azimuth (south = 180) and the sun's altitude and
 * azimuth (clockwise from north).
 */
import { printed as p } from "./build";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

export interface ShadingInput {
  readonly windowWidthM: number;
  readonly windowHeightM: number;
  readonly overhang: { readonly depthM: number; readonly gapAboveHeadM: number };
  readonly fins: { readonly depthM: number; readonly gapFromJambM: number };
  readonly surfaceAzimuthDeg: number;
  readonly surfaceTiltDeg: number;
  readonly sunAltitudeDeg: number;
  readonly sunAzimuthDeg: number;
}

const geometry: CaseSource = {
  kind: "computed",
  formula:
    "overhang and side-fin shadow geometry of a vertical window: γ = az_sun − az_façade, tan Ω = tan(alt)/cos γ, " +
    "h_s = clamp(P tan Ω − G, 0, H), w_s = clamp(F |tan γ| − E, 0, W), f = (W − w_s)(H − h_s)/(W H): " +
    "ASHRAE Handbook—Fundamentals, fenestration chapter (from memory)",
  script: "scripts/reference/shading.ts",
  fromMemory: true,
};

/** The worked-example window: W = 1.5, H = 1.2, P = 0.6, G = 0.3, F = 0.4, E = 0, on a south façade. */
const window = {
  windowWidthM: 1.5,
  windowHeightM: 1.2,
  overhang: { depthM: 0.6, gapAboveHeadM: 0.3 },
  fins: { depthM: 0.4, gapFromJambM: 0 },
  surfaceAzimuthDeg: 180,
  surfaceTiltDeg: 90,
} as const;
const example: ShadingInput = { ...window, sunAltitudeDeg: 50, sunAzimuthDeg: 210 };
const exampleLabel = "worked example (W 1.5, H 1.2, P 0.6, G 0.3, F 0.4, E 0 m; south façade; sun altitude 50°, azimuth 210°)";

const tableRows: [number, number, string, string, string, string][] = [
  [65, 180, "65.0000", "0.986704", "0", "0.177747"],
  [20, 240, "36.0524", "0.136764", "0.692820", "0.476790"],
  [50, 100, "81.7099", "1.2", "1.5", "0"],
];

const cases: readonly ReferenceCase<ShadingInput>[] = [
  {
    id: "shading/example/angles",
    label: `${exampleLabel}: γ = 30°, tan Ω = 1.376119, Ω = 53.9948°, P tan Ω = 0.825671 m`,
    input: example,
    expected: [
      {
        quantity: "horizontalShadowAngleDeg",
        unit: "deg",
        value: 30,
        tolerance: { abs: 1e-12, reason: "exactly 210° − 180°; float64 rounding of the degree–radian round trip" },
      },
      p("tanProfileAngle", "-", "1.376119"),
      p("profileAngleDeg", "deg", "53.9948"),
      p("shadowDropM", "m", "0.825671"),
    ],
    source: geometry,
  },
  {
    id: "shading/example/shaded-band-and-strip",
    label: `${exampleLabel}: h_s = 0.525671 m, w_s = 0.230940 m`,
    input: example,
    expected: [p("overhangShadedHeightM", "m", "0.525671"), p("finShadedWidthM", "m", "0.230940")],
    source: geometry,
  },
  {
    id: "shading/example/sunlit-fractions",
    label: `${exampleLabel}: f_sunlit = 0.475424 (both), 0.561941 (overhang alone), 0.846040 (fins alone)`,
    input: example,
    expected: [p("sunlitFraction", "-", "0.475424"), p("sunlitFractionOverhangOnly", "-", "0.561941"), p("sunlitFractionFinsOnly", "-", "0.846040")],
    source: geometry,
  },
  ...tableRows.map(([alt, az, om, hs, ws, f]): ReferenceCase<ShadingInput> => ({
    id: `shading/example-window/alt${alt}-az${az}`,
    label: `worked-example window, sun altitude ${alt}°, azimuth ${az}°: Ω = ${om}°, h_s = ${hs} m, w_s = ${ws} m, f = ${f}`,
    input: { ...window, sunAltitudeDeg: alt, sunAzimuthDeg: az },
    expected: [p("profileAngleDeg", "deg", om), p("overhangShadedHeightM", "m", hs), p("finShadedWidthM", "m", ws), p("sunlitFraction", "-", f)],
    source: geometry,
  })),
];

export const shading: ReferenceDomain<ShadingInput> = {
  domain: "shading",
  title: "Beam shading of a window by overhangs and side fins",
  cases,
};
