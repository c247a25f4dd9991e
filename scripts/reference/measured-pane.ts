/**
 * Independent recomputation of the measured-pane reference cases (src/lib/reference-cases/measured-pane.ts).
 *
 * 1. Inversion of an uncoated pane's measured normal-incidence T and R. The slab series of
 *    J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley 2013, ch. 5 (from memory)
 *    and M. Rubin, Int. J. Energy Research 6:123–133, 1982 gives at θ = 0, with face reflectance r and internal
 *    transmittance τ: T = (1 − r)²τ/(1 − r²τ²) and R = r(1 + Tτ). Eliminating τ (our own algebra, no published
 *    source for the inversion itself) leaves a quadratic in r:
 *      b = 1 + 2R − R² + T²,  r = [b − sqrt(b² − 4R(2 − R))] / [2(2 − R)]   (smaller root)
 *      τ = (R − r)/(r T),  n = (1 + √r)/(1 − √r)  (air, normal-incidence Fresnel),  α = −ln(τ)/d
 *    The pane at other angles: the slab series per polarisation of scripts/reference/absorbing-pane.ts.
 * 2. Karlsson–Roos transmittance polynomial, J. Karlsson & A. Roos, "Modelling the angular behaviour of the total
 *    solar energy transmittance of windows", Solar Energy 69(4):321–329, 2000 (formula and coefficients from memory):
 *      z = θ/90°,  T(θ)/T(0) = 1 − a z^α − b z^β − c z^γ,  a = 8, b = 0.25/q, c = 1 − a − b,
 *      α = 5.2 + 0.7q, β = 2, γ = (5.26 + 0.06p) + (0.73 + 0.04p)q
 * Written from these formulas alone; it does not use the product's code.
 *
 * Run: npx tsx scripts/reference/measured-pane.ts
 */
import { MEASURED_PANE_SCRIPT, measuredPaneDomain, type MeasuredPaneCaseInput } from "@/lib/reference-cases/measured-pane";
import { paneAt } from "./absorbing-pane";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const DEG = Math.PI / 180;

export interface Inversion {
  readonly b: number;
  readonly faceReflectance: number;
  readonly internalTransmittance: number;
  readonly refractiveIndex: number;
  readonly absorptionPerMm: number;
}

/** Measured normal-incidence T, R of an uncoated pane of thickness d [mm] → r, τ, n, α [1/mm]. */
export function invert(T: number, R: number, thicknessMm: number): Inversion {
  const b = 1 + 2 * R - R * R + T * T;
  const r = (b - Math.sqrt(b * b - 4 * R * (2 - R))) / (2 * (2 - R));
  const tau = (R - r) / (r * T);
  const sr = Math.sqrt(r);
  return {
    b,
    faceReflectance: r,
    internalTransmittance: tau,
    refractiveIndex: (1 + sr) / (1 - sr),
    absorptionPerMm: -Math.log(tau) / thicknessMm,
  };
}

/** Karlsson–Roos T(θ)/T(0) at θ in degrees. */
export function karlssonRoosRatio(thetaDeg: number, p: number, q: number): number {
  const z = thetaDeg / 90;
  const a = 8;
  const b = 0.25 / q;
  const c = 1 - a - b;
  const alpha = 5.2 + 0.7 * q;
  const beta = 2;
  const gamma = 5.26 + 0.06 * p + (0.73 + 0.04 * p) * q;
  return 1 - a * z ** alpha - b * z ** beta - c * z ** gamma;
}

/** All quantities the measured-pane cases name, for one case input. */
export function recomputeMeasuredPane(input: MeasuredPaneCaseInput): Recomputed {
  switch (input.kind) {
    case "inversion":
      return { ...invert(input.T, input.R, input.thicknessMm) };
    case "uncoated-at-angle": {
      const R = 0.5 * (input.solar.Rf + input.solar.Rb);
      const inv = invert(input.solar.T, R, input.thicknessMm);
      const o = paneAt(
        { thicknessMm: input.thicknessMm, refractiveIndex: inv.refractiveIndex, absorptionPerMm: inv.absorptionPerMm },
        input.thetaDeg * DEG,
      );
      return { T: o.T, Rf: o.R, Rb: o.R, A: 1 - o.T - o.R };
    }
    case "karlsson-roos":
      return { TOverT0: karlssonRoosRatio(input.thetaDeg, input.p, input.q) };
  }
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const measuredPaneComparison = () =>
  compareDomain(measuredPaneDomain, MEASURED_PANE_SCRIPT, (c) => recomputeMeasuredPane(c.input), { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[measuredPaneDomain.title, measuredPaneComparison]]);
