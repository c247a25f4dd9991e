/**
 * Check values for the diffuse view factors of a window with an overhang or side fins: the share of the
 * isotropic sky, of the ground and of the horizon band the window still sees, averaged over the window.
 *
 * Inputs in metres and degrees (surface tilt from horizontal, 90 = vertical). Every value is computed by
 * `scripts/reference/shading-diffuse.ts` from the view-factor closed forms named in its source, printed to
 * 9 decimals (rounding 5e-10, far below the tolerances, which are the engine's quadrature accuracy).
 */
import type { CaseSource, ExpectedValue, ReferenceCase, ReferenceDomain, Tolerance } from "./types";

export interface ShadingDiffuseInput {
  readonly windowWidthM: number;
  readonly windowHeightM: number;
  readonly surfaceTiltDeg: number;
  /** Without `extendLeftM`/`extendRightM` the overhang is infinitely long. */
  readonly overhang?: { readonly depthM: number; readonly gapAboveHeadM?: number; readonly extendLeftM?: number; readonly extendRightM?: number };
  /** Infinitely tall fins on both jambs. */
  readonly fins?: { readonly depthM: number; readonly gapFromJambM: number };
}

export const SHADING_DIFFUSE_SCRIPT = "scripts/reference/shading-diffuse.ts";

const crossedStrings: CaseSource = {
  kind: "computed",
  formula:
    "Hottel's crossed-string rule for 2-D (infinitely long) configurations, F₁₂ = [(crossed strings) − (uncrossed strings)]/(2 L₁): " +
    "H. C. Hottel & A. F. Sarofim, Radiative Transfer, McGraw-Hill 1967; F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and " +
    "Mass Transfer, ch. 13 (from memory); sky factor 1 − 2F for a vertical window (half the view is sky), 1 − F/((1 + cos β)/2) tilted",
  script: SHADING_DIFFUSE_SCRIPT,
  fromMemory: true,
};
const finBand: CaseSource = {
  kind: "computed",
  formula:
    "horizon band of a window between infinitely tall fins: (√((W + E)² + F²) − √(E² + F²))/W, from ½∫cos ψ dψ over the open " +
    "horizontal directions averaged over the width (our derivation, closed form); sky and ground by the crossed-string rule " +
    "(H. C. Hottel & A. F. Sarofim, Radiative Transfer, 1967, from memory)",
  script: SHADING_DIFFUSE_SCRIPT,
  fromMemory: true,
};
const perpendicular: CaseSource = {
  kind: "computed",
  formula:
    "view factor between perpendicular rectangles with a common edge, F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and " +
    "Mass Transfer, Table 13.2 (from memory); sky factor 1 − 2F; with a gap G the view-factor algebra A₁F₁₂ = A₁₃F₁₃,₂ − A₃F₃₂",
  script: SHADING_DIFFUSE_SCRIPT,
  fromMemory: true,
};

const SMOOTH: Tolerance = { abs: 1e-7, reason: "16-point Gauss–Legendre over the window of an integrand smooth in the height only" };
const CORNERS: Tolerance = {
  abs: 1e-5,
  reason: "16 × 16 Gauss rule of an integrand with singular derivatives at the device's corners (errors 2e-6…7e-6 measured)",
};
const ACROSS: Tolerance = { abs: 1e-5, reason: "the engine's 16-point Gauss–Legendre rule across the width, with fins at both jambs" };
const UNSEEN: Tolerance = { abs: 5e-13, reason: "the device cannot be seen in this part of the view: 1 up to float64 rounding" };

const v = (quantity: "skyIsotropic" | "ground" | "horizonBand", value: number, tolerance: Tolerance): ExpectedValue => ({
  quantity,
  unit: "-",
  value,
  tolerance,
});
const window = { windowWidthM: 1.5, windowHeightM: 1.2 } as const;

const cases: readonly ReferenceCase<ShadingDiffuseInput>[] = [
  ...(
    [
      [0.6, 0.3, 0.787274207],
      [1.0, 0, 0.468374946],
      [0.3, 0.6, 0.961673638],
    ] as const
  ).map(([p, g, sky]): ReferenceCase<ShadingDiffuseInput> => ({
    id: `shading-diffuse/overhang-infinite/p${p}-g${g}`,
    label: `vertical 1.5 × 1.2 m window, infinite overhang P ${p} m, G ${g} m: sky factor ${sky}, ground and horizon band 1`,
    input: { ...window, surfaceTiltDeg: 90, overhang: { depthM: p, gapAboveHeadM: g } },
    expected: [v("skyIsotropic", sky, SMOOTH), v("ground", 1, UNSEEN), v("horizonBand", 1, UNSEEN)],
    source: crossedStrings,
  })),
  ...(
    [
      [0.4, 0, 0.768278313],
      [0.8, 0.1, 0.655085738],
    ] as const
  ).map(([f, e, value]): ReferenceCase<ShadingDiffuseInput> => ({
    id: `shading-diffuse/fins-infinite/f${f}-e${e}`,
    label: `vertical 1.5 × 1.2 m window, infinite fins F ${f} m set back E ${e} m on both jambs: sky, ground and horizon band ${value}`,
    input: { ...window, surfaceTiltDeg: 90, fins: { depthM: f, gapFromJambM: e } },
    expected: [v("skyIsotropic", value, ACROSS), v("ground", value, ACROSS), v("horizonBand", value, ACROSS)],
    source: finBand,
  })),
  ...(
    [
      [1.5, 1.2, 0.6, 0.692109475],
      [1.0, 2.0, 1.0, 0.767147397],
      [3.0, 1.0, 0.5, 0.650746043],
    ] as const
  ).map(([w, h, p, sky]): ReferenceCase<ShadingDiffuseInput> => ({
    id: `shading-diffuse/overhang-finite/${w}x${h}-p${p}`,
    label: `vertical ${w} × ${h} m window, overhang P ${p} m exactly as wide as the window at the head: sky factor ${sky}`,
    input: { windowWidthM: w, windowHeightM: h, surfaceTiltDeg: 90, overhang: { depthM: p, extendLeftM: 0, extendRightM: 0 } },
    expected: [v("skyIsotropic", sky, CORNERS)],
    source: perpendicular,
  })),
  {
    id: "shading-diffuse/overhang-finite/gap-0.3",
    label: "vertical 1.5 × 1.2 m window, overhang P 0.6 m as wide as the window, G 0.3 m above the head: sky factor 0.852233778",
    input: { ...window, surfaceTiltDeg: 90, overhang: { depthM: 0.6, gapAboveHeadM: 0.3, extendLeftM: 0, extendRightM: 0 } },
    expected: [v("skyIsotropic", 0.852233778, CORNERS)],
    source: perpendicular,
  },
  {
    id: "shading-diffuse/horizontal/plate",
    label: "horizontal 1.5 × 1.2 m window (tilt 0°) with an infinite plate P 0.6 m at G 0.3 m: sky factor 1 − F = 0.893637104, ground 1",
    input: { ...window, surfaceTiltDeg: 0, overhang: { depthM: 0.6, gapAboveHeadM: 0.3 } },
    expected: [v("skyIsotropic", 0.893637104, SMOOTH), v("ground", 1, { abs: 0, reason: "a horizontal window sees no ground: exact" })],
    source: crossedStrings,
  },
  {
    id: "shading-diffuse/tilt-30/overhang-infinite",
    label: "1.5 × 1.2 m window tilted 30°, infinite overhang P 0.6 m at G 0.3 m: sky factor 0.886000591, ground 1",
    input: { ...window, surfaceTiltDeg: 30, overhang: { depthM: 0.6, gapAboveHeadM: 0.3 } },
    expected: [v("skyIsotropic", 0.886000591, SMOOTH), v("ground", 1, UNSEEN)],
    source: crossedStrings,
  },
];

export const shadingDiffuse: ReferenceDomain<ShadingDiffuseInput> = {
  domain: "shading-diffuse",
  title: "Diffuse view factors of a window with overhangs and fins",
  cases,
};
