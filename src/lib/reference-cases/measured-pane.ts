/**
 * Reference cases: panes given by measured normal-incidence values. An uncoated pane's measured T and R are
 * inverted to an equivalent index n and absorption coefficient α (closed-form inverse of the slab series); a coated
 * pane's transmittance follows the Karlsson–Roos angular polynomial.
 *
 * Every expected value is computed independently, in float64, by scripts/reference/measured-pane.ts. Values are
 * printed to about 6 digits; each tolerance is half a unit in the last printed digit unless its reason says otherwise.
 */
import { ev, half } from "./build";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

export type MeasuredPaneCaseInput =
  /**
   * Inversion of measured normal-incidence T and R of an uncoated pane of the given thickness. Quantities:
   * b = 1 + 2R − R² + T², faceReflectance r, internalTransmittance τ, refractiveIndex n, absorptionPerMm α.
   */
  | { readonly kind: "inversion"; readonly T: number; readonly R: number; readonly thicknessMm: number }
  /** The inverted uncoated pane evaluated at an angle in degrees: quantities T, Rf, Rb, A (front). */
  | {
      readonly kind: "uncoated-at-angle";
      readonly thicknessMm: number;
      readonly solar: { readonly T: number; readonly Rf: number; readonly Rb: number };
      readonly thetaDeg: number;
    }
  /** Karlsson–Roos transmittance ratio T(θ)/T(0) for pane count p and glazing-type index q: quantity TOverT0. */
  | { readonly kind: "karlsson-roos"; readonly p: number; readonly q: number; readonly thetaDeg: number };

export const MEASURED_PANE_SCRIPT = "scripts/reference/measured-pane.ts";

const inversion: CaseSource = {
  kind: "computed",
  formula:
    "closed-form inverse, at normal incidence, of the incoherent slab series of J. A. Duffie & W. A. Beckman, Solar " +
    "Engineering of Thermal Processes, 4th ed., Wiley 2013, ch. 5 (from memory) and M. Rubin, Int. J. Energy " +
    "Research 6:123–133, 1982 (the inversion is our own algebra: R = r(1 + Tτ) eliminated to a quadratic in r); " +
    "angles by the same slab series with Fresnel faces, E. Hecht, Optics, 4th ed., §4.6",
  script: MEASURED_PANE_SCRIPT,
  fromMemory: true,
};

const karlssonRoos: CaseSource = {
  kind: "computed",
  formula:
    "Karlsson–Roos angular polynomial T(θ)/T(0) = 1 − a z^α − b z^β − c z^γ, z = θ/90°, J. Karlsson & A. Roos, " +
    "Modelling the angular behaviour of the total solar energy transmittance of windows, Solar Energy 69(4):321–329, " +
    "2000 (formula and coefficients from memory; implementation-only check values, not validated against the paper)",
  script: MEASURED_PANE_SCRIPT,
  fromMemory: true,
};

const P6 = half(6);

export const workedInversionCase: ReferenceCase<MeasuredPaneCaseInput> = {
  id: "measured-pane/inversion/T0.830-R0.075-6mm",
  label: "uncoated pane measured T = 0.830, R = 0.075, d = 6 mm: b, r, τ and the equivalent n and α",
  input: { kind: "inversion", T: 0.83, R: 0.075, thicknessMm: 6 },
  expected: [
    ev("b", 1.833275, { abs: 1e-15, reason: "exact decimal 1 + 0.15 − 0.005625 + 0.6889, float64 rounding only" }),
    ev("faceReflectance", 0.0428372, half(7)),
    ev("internalTransmittance", 0.904594),
    ev("refractiveIndex", 1.52198, half(5)),
    ev("absorptionPerMm", 0.0167114, half(7), "1/mm"),
  ],
  source: inversion,
};

export const invertedAt60Case: ReferenceCase<MeasuredPaneCaseInput> = {
  id: "measured-pane/uncoated/T0.830-R0.075-6mm/60deg",
  label: "the inverted pane (T = 0.830, R = 0.075, 6 mm) at 60°: T, Rf, Rb, A",
  input: { kind: "uncoated-at-angle", thicknessMm: 6, solar: { T: 0.83, Rf: 0.075, Rb: 0.075 }, thetaDeg: 60 },
  expected: [ev("T", 0.743947), ev("Rf", 0.142721), ev("Rb", 0.142721), ev("A", 0.113333)],
  source: inversion,
};

export const printedRoundTripCase: ReferenceCase<MeasuredPaneCaseInput> = {
  id: "measured-pane/inversion/round-trip-printed-6mm",
  label: "round trip: the 6 mm pane's printed T = 0.814159, R = 0.073327 at 0° invert back to n = 1.52, α = 0.02 /mm",
  input: { kind: "inversion", T: 0.814159, R: 0.073327, thicknessMm: 6 },
  expected: [
    ev("refractiveIndex", 1.52, {
      abs: 5e-6,
      reason: "the printed inputs are rounded to ±5e-7, which moves n by up to 4e-6 (propagated through the closed form)",
    }),
    ev(
      "absorptionPerMm",
      0.02,
      {
        abs: 3e-7,
        reason: "the printed inputs are rounded to ±5e-7, which moves α by up to 2.5e-7 /mm (propagated through the closed form)",
      },
      "1/mm",
    ),
  ],
  source: inversion,
};

const KR_ANGLES = [30, 45, 60, 70, 80, 85, 90];
/** (p, q) and T(θ)/T(0) at KR_ANGLES; the 90° value is printed as 0. */
const krRows: readonly [number, number, readonly number[]][] = [
  [1, 1, [0.968983, 0.909959, 0.771175, 0.601766, 0.348053, 0.185807, 0]],
  [2, 4, [0.992381, 0.971076, 0.874389, 0.700178, 0.391388, 0.195146, 0]],
  [3, 4, [0.992264, 0.968537, 0.8561, 0.656645, 0.325937, 0.141226, 0]],
];

export const karlssonRoosCases: readonly ReferenceCase<MeasuredPaneCaseInput>[] = krRows.flatMap(([p, q, values]) =>
  KR_ANGLES.map((theta, i): ReferenceCase<MeasuredPaneCaseInput> => ({
    id: `measured-pane/karlsson-roos/p${p}-q${q}/${theta}deg`,
    label: `Karlsson–Roos T(θ)/T(0), p = ${p}, q = ${q}, at ${theta}° (implementation-only check)`,
    input: { kind: "karlsson-roos", p, q, thetaDeg: theta },
    expected: [ev("TOverT0", values[i]!, theta === 90 ? half(0) : P6)],
    source: karlssonRoos,
  })),
);

export const measuredPaneDomain: ReferenceDomain<MeasuredPaneCaseInput> = {
  domain: "measured-pane",
  title: "Panes given by measured values: inversion of T and R, angular model of coated panes",
  cases: [workedInversionCase, invertedAt60Case, printedRoundTripCase, ...karlssonRoosCases],
};
