/**
 * Reference cases: one uncoated absorbing pane (incoherent multiple reflections in a slab, per polarisation).
 *
 * Every expected value is computed independently, in float64, by scripts/reference/absorbing-pane.ts from the
 * slab series T = (1 − ρ)²τ/(1 − ρ²τ²), R = ρ + ρ(1 − ρ)²τ²/(1 − ρ²τ²) with τ = exp(−αd/cos θt) and the Fresnel
 * face reflectance ρ of each polarisation. Values are printed to about 6 digits; each tolerance is half a unit in
 * the last printed digit unless its reason says otherwise.
 */
import { ev } from "./build";
import { LOSSLESS_6MM, LOW_IRON_4MM, PANE_6MM, type PaneMm } from "./panes";
import type { CaseSource, ReferenceCase, ReferenceDomain, Tolerance } from "./types";

/**
 * One pane in air at an angle of incidence in degrees. Quantities: thetaTDeg, tau (internal transmittance along
 * the refracted path), Ts, Rs, As, Tp, Rp, Ap, T, R, A; TOverT0 = T(θ)/T(0); TAveragedFaces = the slab series
 * applied once to the averaged face reflectance (R_s + R_p)/2, a common wrong route kept as a detector.
 */
export interface AbsorbingPaneCaseInput {
  readonly pane: PaneMm;
  readonly thetaDeg: number;
}

export const ABSORBING_PANE_SCRIPT = "scripts/reference/absorbing-pane.ts";

const computed: CaseSource = {
  kind: "computed",
  formula:
    "incoherent slab series per polarisation with Fresnel face reflectances, J. A. Duffie & W. A. Beckman, " +
    "Solar Engineering of Thermal Processes, 4th ed., Wiley 2013, ch. 5 (from memory); M. Rubin, Solar optical " +
    "properties of windows, Int. J. Energy Research 6:123–133, 1982; Fresnel equations, E. Hecht, Optics, 4th ed., §4.6",
  script: ABSORBING_PANE_SCRIPT,
  fromMemory: true,
};

const THETA_T: Tolerance = {
  abs: 1e-4,
  reason:
    "one unit in the 4th printed decimal: the printed 40.3835 at 80° is mis-rounded (asin(sin 80°/1.52) = " +
    "40.38344514° in a 30-digit evaluation), so this column allows a full unit",
};

/** 6 mm pane: θ, θt, τ, T_s, R_s, A_s, T_p, R_p, A_p, T, R, A. */
const rows6mm: readonly (readonly number[])[] = [
  [0, 0, 0.88692, 0.814159, 0.073327, 0.112514, 0.814159, 0.073327, 0.112514, 0.814159, 0.073327, 0.112514],
  [30, 19.2049, 0.88067, 0.778422, 0.103169, 0.118408, 0.834096, 0.046969, 0.118935, 0.806259, 0.075069, 0.118671],
  [60, 34.733, 0.864142, 0.591038, 0.277128, 0.131834, 0.861506, 0.002664, 0.13583, 0.726272, 0.139896, 0.133832],
  [80, 40.3835, 0.854245, 0.224751, 0.65126, 0.123989, 0.520287, 0.340222, 0.139491, 0.372519, 0.495741, 0.13174],
];
const rowQuantities = ["tau", "Ts", "Rs", "As", "Tp", "Rp", "Ap", "T", "R", "A"];

export const pane6mmCases: readonly ReferenceCase<AbsorbingPaneCaseInput>[] = rows6mm.map((row) => ({
  id: `absorbing-pane/6mm/${row[0]}deg`,
  label: `6 mm pane (n = 1.52, α = 0.02 /mm) at ${row[0]}°: θt, τ and T, R, A for s, p and unpolarised`,
  input: { pane: PANE_6MM, thetaDeg: row[0]! },
  expected: [ev("thetaTDeg", row[1]!, THETA_T, "deg"), ...rowQuantities.map((q, i) => ev(q, row[i + 2]!))],
  source: computed,
}));

export const averagedFacesCase: ReferenceCase<AbsorbingPaneCaseInput> = {
  id: "absorbing-pane/6mm/60deg/averaged-faces",
  label: "6 mm pane at 60°: T per polarisation, and the wrong route that averages R_s and R_p before the slab series",
  input: { pane: PANE_6MM, thetaDeg: 60 },
  expected: [ev("TAveragedFaces", 0.716271), ev("T", 0.726272)],
  source: computed,
};

export const pane6mm58Case: ReferenceCase<AbsorbingPaneCaseInput> = {
  id: "absorbing-pane/6mm/58deg",
  label: "6 mm pane at 58° (near the effective angle of the diffuse value): T",
  input: { pane: PANE_6MM, thetaDeg: 58 },
  expected: [ev("T", 0.739292)],
  source: computed,
};

const ratioCases = (name: string, paneLabel: string, pane: PaneMm, ratios: readonly number[]) =>
  [30, 45, 60, 70, 80, 85].map((theta, i): ReferenceCase<AbsorbingPaneCaseInput> => ({
    id: `absorbing-pane/${name}/${theta}deg/ratio`,
    label: `${paneLabel} at ${theta}°: T(θ)/T(0)`,
    input: { pane, thetaDeg: theta },
    expected: [ev("TOverT0", ratios[i]!)],
    source: computed,
  }));

/** Normalised angular curve T(θ)/T(0) of the 6 mm pane (also the reference curve for coated panes). */
export const ratio6mmCases = ratioCases("6mm", "6 mm pane", PANE_6MM, [0.990297, 0.967005, 0.892051, 0.756402, 0.45755, 0.223722]);

export const lowIron0Case: ReferenceCase<AbsorbingPaneCaseInput> = {
  id: "absorbing-pane/low-iron-4mm/0deg",
  label: "4 mm low-iron pane (n = 1.52, α = 0.002 /mm) at 0°: τ, T, R, A",
  input: { pane: LOW_IRON_4MM, thetaDeg: 0 },
  expected: [ev("tau", 0.992032), ev("T", 0.910975), ev("R", 0.08106), ev("A", 0.007965)],
  source: computed,
};

export const ratioLowIronCases = ratioCases(
  "low-iron-4mm",
  "4 mm low-iron pane",
  LOW_IRON_4MM,
  [0.996951, 0.981738, 0.916678, 0.786857, 0.493574, 0.263579],
);

export const losslessCase: ReferenceCase<AbsorbingPaneCaseInput> = {
  id: "absorbing-pane/lossless-6mm/0deg",
  label: "lossless pane n = 1.52 at 0°: T = 2n/(n² + 1)",
  input: { pane: LOSSLESS_6MM, thetaDeg: 0 },
  expected: [ev("T", 0.918318)],
  source: computed,
};

export const absorbingPaneDomain: ReferenceDomain<AbsorbingPaneCaseInput> = {
  domain: "absorbing-pane",
  title: "One uncoated absorbing pane (slab series per polarisation)",
  cases: [...pane6mmCases, averagedFacesCase, pane6mm58Case, ...ratio6mmCases, lowIron0Case, ...ratioLowIronCases, losslessCase],
};
