/**
 * Reference cases: total solar energy transmittance g and the secondary internal heat transfer factors N_k
 * per EN 410:2011 (h_e 23, h_i = 3.6 + 4.4 ε_i/0.837, i.e. 8.0 for uncoated glass), with the gap
 * conductance from EN 673:2011.
 *
 * Pure data. Thermal make-ups in mm (uncoated faces ε 0.837), angles in degrees. The optical inputs (T, R,
 * A_k) of a g case are the printed optics of the named uncoated panes (refractive index, absorption
 * coefficient per mm, thickness), printed to 6 decimals: the g case checks the EN 410 formula on those
 * printed inputs. `npx tsx scripts/reference/g-value.ts` recomputes both: the optics from the panes
 * (Fresnel + absorbing slab + adding method, 400-node Gauss–Legendre for hemispherical values) and the
 * g values and factors from the EN 410 / EN 673 formulae.
 *
 * Tolerance for g and q_i: each printed optical input carries ≤ 5e-7, which reaches g as ≤ 5e-7·(1 + Σ N_k)
 * ≤ 9e-7 (double glazing, Σ N_k = 0.78); the printed g itself carries 5e-7 → 1.5e-6 in total. N_k and Λ are
 * computed from unrounded EN 673 values: half a printed unit (5e-7 for N, 5e-6 for Λ and h_s).
 */
import { half } from "./build";
import { LOW_IRON_4MM, PANE_6MM, type PaneMm } from "./panes";
import type { CaseSource, ReferenceCase, ReferenceDomain, Tolerance } from "./types";

/** A pane for the thermal network: thickness in mm, corrected emissivities of its two faces. */
export interface GValueThermalPane {
  readonly thicknessMm: number;
  readonly emissivityFront: number;
  readonly emissivityBack: number;
}

export interface GValueThermalGap {
  readonly widthMm: number;
  readonly gas: "air" | "argon" | "krypton";
}

/** The printed optics of a stack of uncoated panes in air, at one angle of incidence or hemispherical. */
export interface GValueOptics {
  /** The panes, outdoor first, each separated by a gas gap (no optical effect). */
  readonly panes: readonly PaneMm[];
  /** Angle of incidence from the normal, or the hemispherical (cosine-weighted, diffuse) average. */
  readonly incidence: { readonly thetaDeg: number } | "hemispherical";
  readonly solarTransmittance: number;
  /** Printed where the source prints it. */
  readonly solarReflectanceFront?: number;
  /** In-unit absorptance of each pane, outdoor first. */
  readonly absorptances: readonly number[];
  /** Rounding of the printed optical values. */
  readonly printedRounding: Tolerance;
  /** Rounding of each printed absorptance where it differs from `printedRounding`. */
  readonly absorptancesRounding?: readonly Tolerance[];
  /** How the printed optics were obtained. */
  readonly origin: string;
}

/**
 * `factors`: the EN 410 thermal network of a unit (N_k, Λ, h_s); `g`: g and q_i from printed optics and
 * the unit's N_k. `glassConduction: 'none'` leaves the glass out of Λ (Λ = h_s).
 */
export interface GValueCaseInput {
  readonly kind: "factors" | "g";
  readonly unit: { readonly panes: readonly GValueThermalPane[]; readonly gaps: readonly GValueThermalGap[] };
  readonly glassConduction?: "surfaces" | "none";
  readonly optics?: GValueOptics;
}

export type GValueCase = ReferenceCase<GValueCaseInput>;

const UNCOATED = 0.837;
const thermalPane = (thicknessMm: number): GValueThermalPane => ({ thicknessMm, emissivityFront: UNCOATED, emissivityBack: UNCOATED });
const single6 = { panes: [thermalPane(6)], gaps: [] };
const single4 = { panes: [thermalPane(4)], gaps: [] };
const double6Air16 = { panes: [thermalPane(6), thermalPane(6)], gaps: [{ widthMm: 16, gas: "air" as const }] };

const HALF_6TH = half(6);
const HALF_7TH = half(7);
const G_TOL: Tolerance = {
  abs: 1.5e-6,
  reason: "printed optical inputs carry ≤ 5e-7 each (≤ 9e-7 in g), the printed g another 5e-7",
};

const ORIGIN_ANGLE =
  "Fresnel reflectance of each air/glass face (E. Hecht, Optics, 4th ed., 2002, §4.6, from memory), absorbing slab with " +
  "incoherent multiple reflections (J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., 2013, ch. 5, " +
  "from memory; M. Rubin, Int. J. Energy Research 6:123–133, 1982), panes combined by the adding method for s and p separately, " +
  "then averaged (EN 410:2011 / ISO 9050:2003 multiple-glazing formulae, clause numbers from memory)";
const ORIGIN_HEMISPHERICAL =
  `${ORIGIN_ANGLE}; hemispherical value ∫ X(θ) sin 2θ dθ over 0–90° (ISO 15099:2003, optical section, from memory; ` +
  "Duffie & Beckman ch. 5, from memory), by 400-node Gauss–Legendre quadrature";

const optics = (
  panes: readonly PaneMm[],
  incidence: GValueOptics["incidence"],
  solarTransmittance: number,
  solarReflectanceFront: number | undefined,
  absorptances: readonly number[],
  absorptancesRounding?: readonly Tolerance[],
): GValueOptics => ({
  panes,
  incidence,
  solarTransmittance,
  ...(solarReflectanceFront === undefined ? {} : { solarReflectanceFront }),
  absorptances,
  printedRounding: HALF_6TH,
  ...(absorptancesRounding === undefined ? {} : { absorptancesRounding }),
  origin: incidence === "hemispherical" ? ORIGIN_HEMISPHERICAL : ORIGIN_ANGLE,
});

const EN410_FORMULA =
  "EN 410:2011 g = τ_e + q_i with q_i = Σ N_k α_e,k: single glazing N = h_i/(h_e + h_i), double glazing " +
  "q_i = [(α_e1 + α_e2)/h_e + α_e2/Λ]/[1/h_e + 1/h_i + 1/Λ] (general N-pane form N_k = resistance from pane k to outside " +
  "over the total resistance), h_e = 23, h_i = 3.6 + 4.4 ε_i/0.837 (secondary heat transfer factor clause; clause number " +
  "and formulae from memory); 1/Λ = d1/λ + 1/h_s + d2/λ with h_s from EN 673:2011 (from memory)";
const EN410: CaseSource = { kind: "computed", formula: EN410_FORMULA, script: "scripts/reference/g-value.ts", fromMemory: true };
const EN410_ANGLE: CaseSource = {
  kind: "computed",
  formula: `${EN410_FORMULA}; N_k kept at the normal-incidence thermal values at every angle (common practice, no source)`,
  script: "scripts/reference/g-value.ts",
  fromMemory: true,
};

const gCase = (
  id: string,
  label: string,
  unit: GValueCaseInput["unit"],
  o: GValueOptics,
  g: number,
  qi: number | null,
  extra: Partial<Pick<GValueCaseInput, "glassConduction">> = {},
): GValueCase => ({
  id,
  label,
  input: { kind: "g", unit, ...extra, optics: o },
  expected: [
    ...(qi === null ? [] : [{ quantity: "secondaryHeatTransfer", unit: "-", value: qi, tolerance: G_TOL }]),
    { quantity: "gValue", unit: "-", value: g, tolerance: G_TOL },
  ],
  source: o.incidence !== "hemispherical" && o.incidence.thetaDeg === 0 ? EN410 : EN410_ANGLE,
});

export const gValueCases: readonly GValueCase[] = [
  // Single glazing: q_i = α_e h_i/(h_e + h_i), N = 8/31.
  {
    id: "g-value/single-6/factor",
    label: "single pane: N = h_i/(h_e + h_i) = 8/31 = 0.258065",
    input: { kind: "factors", unit: single6 },
    expected: [{ quantity: "factors[0]", unit: "-", value: 0.258065, tolerance: HALF_6TH }],
    source: EN410,
  },
  gCase(
    "g-value/single-6/0deg",
    "6 mm pane (n 1.52, α 0.02/mm) at 0°: g = 0.843195",
    single6,
    optics([PANE_6MM], { thetaDeg: 0 }, 0.814159, 0.073327, [0.112514]),
    0.843195,
    0.029036,
  ),
  gCase(
    "g-value/single-6/30deg",
    "6 mm pane (n 1.52, α 0.02/mm) at 30°: g = 0.836884",
    single6,
    optics([PANE_6MM], { thetaDeg: 30 }, 0.806259, 0.075069, [0.118671]),
    0.836884,
    0.030625,
  ),
  gCase(
    "g-value/single-6/60deg",
    "6 mm pane (n 1.52, α 0.02/mm) at 60°: g = 0.760809",
    single6,
    optics([PANE_6MM], { thetaDeg: 60 }, 0.726272, 0.139896, [0.133832]),
    0.760809,
    0.034537,
  ),
  gCase(
    "g-value/single-6/80deg",
    "6 mm pane (n 1.52, α 0.02/mm) at 80°: g = 0.406516",
    single6,
    optics([PANE_6MM], { thetaDeg: 80 }, 0.372519, 0.495741, [0.13174]),
    0.406516,
    0.033997,
  ),
  // g is linear in T and A, so hemispherical T and A give the hemispherical g.
  gCase(
    "g-value/single-6/hemispherical",
    "hemispherical g of the 6 mm pane = 0.768774",
    single6,
    optics([PANE_6MM], "hemispherical", 0.736431, 0.138241, [0.125328]),
    0.768774,
    null,
  ),
  gCase(
    "g-value/low-iron-4/0deg",
    "low-iron 4 mm pane (n 1.52, α 0.002/mm) at 0°: g = 0.913030",
    single4,
    optics([LOW_IRON_4MM], { thetaDeg: 0 }, 0.910975, 0.08106, [0.007965]),
    0.91303,
    null,
  ),

  // Double glazing 6 / 16 air / 6, uncoated.
  {
    id: "g-value/double-6-16air-6/network",
    label: "double 6/16 air/6: h_s = 5.31315, Λ = 4.99470 W/m²K, N1 = 0.117926, N2 = 0.660962",
    input: { kind: "factors", unit: double6Air16 },
    expected: [
      { quantity: "gaps[0].conductanceWPerM2K", unit: "W/(m²K)", value: 5.31315, tolerance: half(5) },
      { quantity: "conductancesBetweenPanesWPerM2K[0]", unit: "W/(m²K)", value: 4.9947, tolerance: half(5) },
      { quantity: "factors[0]", unit: "-", value: 0.117926, tolerance: HALF_6TH },
      { quantity: "factors[1]", unit: "-", value: 0.660962, tolerance: HALF_6TH },
    ],
    source: EN410,
  },
  gCase(
    "g-value/double-6-16air-6/0deg",
    "double 6/16 air/6 at 0°: q_i = 0.074939, g = 0.741378",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], { thetaDeg: 0 }, 0.666439, 0.122195, [0.119267, 0.092099]),
    0.741378,
    0.074939,
  ),
  gCase(
    "g-value/double-6-16air-6/30deg",
    "double 6/16 air/6 at 30°: q_i = 0.078482, g = 0.733340",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], { thetaDeg: 30 }, 0.654858, undefined, [0.125812, 0.096293]),
    0.73334,
    0.078482,
  ),
  gCase(
    "g-value/double-6-16air-6/60deg",
    "double 6/16 air/6 at 60°: q_i = 0.083745, g = 0.644037",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], { thetaDeg: 60 }, 0.560292, 0.193315, [0.145683, 0.10071]),
    0.644037,
    0.083745,
  ),
  gCase(
    "g-value/double-6-16air-6/80deg",
    "double 6/16 air/6 at 80°: q_i = 0.062157, g = 0.259083",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], { thetaDeg: 80 }, 0.196926, undefined, [0.161459, 0.065233]),
    0.259083,
    0.062157,
  ),
  // The glass-conduction choice moves g by ~0.0006.
  gCase(
    "g-value/double-6-16air-6/0deg/gap-only",
    "double 6/16 air/6 at 0° with Λ = h_s (gap only, glass left out): g = 0.740801",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], { thetaDeg: 0 }, 0.666439, 0.122195, [0.119267, 0.092099]),
    0.740801,
    null,
    { glassConduction: "none" },
  ),
  // Hemispherical optics of the double glazing (400-node Gauss–Legendre, per polarisation); g = T + N1 A1 + N2 A2
  // from those printed optics and the network above.
  gCase(
    "g-value/double-6-16air-6/hemispherical",
    "hemispherical g of the double 6/16 air/6 = 0.656210",
    double6Air16,
    optics([PANE_6MM, PANE_6MM], "hemispherical", 0.577379, 0.191431, [0.136229, 0.0949614], [HALF_6TH, HALF_7TH]),
    0.65621,
    null,
  ),
];

export const gValueDomain: ReferenceDomain<GValueCaseInput> = {
  domain: "g-value",
  title: "Total solar energy transmittance g and secondary heat transfer (EN 410:2011)",
  cases: gValueCases,
};
