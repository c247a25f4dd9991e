/**
 * Coated pane from measured values: estimated angular dependence (Karlsson & Roos transmittance
 * curve, reference-curve reflectance per face).
 *
 * Coated (Rf ≠ Rb beyond the tolerance in some band): optical constants are unknown, so the
 * angular dependence is estimated:
 * - T(θ) = T(0) · KR(θ), the Karlsson & Roos (2000) polynomial, applied per layer with p = 1
 *   and q = 4 by default (see {@link karlssonRoosTransmittanceRatio});
 * - each face's reflectance follows a normalised reference curve (common practice, no
 *   source): R_c(θ) = R_c(0) + (1 − R_c(0)) · [R_ref(θ) − R_ref(0)] / [1 − R_ref(0)], where
 *   "ref" is an uncoated slab of the same thickness with n = 1.52 and α chosen so that
 *   T_ref(0) = T_c(0) (α = 0 when T_c(0) exceeds the lossless slab's 2n/(n² + 1));
 * - A ≥ 0 is enforced per face by R ≤ 1 − T;
 * - the visible band uses the same curves; the Karlsson–Roos fit was made for total solar
 *   energy transmittance, so applying it to light transmittance is our extension.
 * Coated layers have no s/p split: they return the same values for s and p, so the stack's
 * per-polarisation route treats them as unpolarised. Expect errors of several percentage
 * points beyond 60°; results are estimates.
 *
 * @see J. Karlsson & A. Roos, "Modelling the angular behaviour of the total solar energy
 *   transmittance of windows", Solar Energy 69(4):321–329, 2000 (from memory)
 */
import { slabFromFaceReflectance } from "../absorbing-pane";
import { fresnelReflectancesReal } from "../fresnel";
import { checkIncidenceAngleRad, GRAZING_INCIDENCE_RAD, type Radians } from "../units";
import { checkFraction } from "./measured-values";

/** Refractive index of the uncoated reference pane used for coated reflectance curves [-]. */
export const REFERENCE_PANE_REFRACTIVE_INDEX = 1.52;

/** Karlsson–Roos parameters used per coated layer: p = 1 (one layer), q = 4 (see {@link karlssonRoosTransmittanceRatio}). */
export const KARLSSON_ROOS_LAYER_DEFAULT = Object.freeze({ p: 1, q: 4 });

/**
 * Karlsson & Roos angular model for the total solar energy transmittance of glazing:
 *   z = θ / (π/2),  T(θ)/T(0) = 1 − a z^α − b z^β − c z^γ
 *   a = 8,  b = 0.25/q,  c = 1 − a − b,  α = 5.2 + 0.7q,  β = 2,  γ = (5.26 + 0.06p) + (0.73 + 0.04p)q
 * p: number of panes; q: glazing-type index (meanings as recalled, from memory, pending
 * verification against the paper's table). Coefficients are cited from memory, pending
 * verification. Here the model is applied per coated layer with p = 1 (one layer) and q = 4
 * by default (a mid-range glazing-type index; our choice, no source); with these values it
 * stays within 0.011 of an uncoated 6 mm n = 1.52 slab's own T(θ)/T(0) up to 80°. Accepted ranges (our guard, chosen so that the curve stays in [0, 1] and falls
 * monotonically): p ∈ {1, 2, 3}, q ∈ [1, 10]; the result is clamped to [0, 1].
 * @param thetaRad angle of incidence [rad], in [0, π/2]
 * @param p number of panes, 1..3
 * @param q glazing-type index, 1..10
 * @returns T(θ)/T(0) [-], 1 at θ = 0 and 0 at θ = π/2
 * @see J. Karlsson & A. Roos, Solar Energy 69(4):321–329, 2000 (from memory);
 *   J. Karlsson, M. Rubin & A. Roos, Solar Energy 71(1):23–31, 2001 (from memory)
 */
export function karlssonRoosTransmittanceRatio(thetaRad: Radians, p: number, q: number): number {
  checkIncidenceAngleRad(thetaRad);
  checkKarlssonRoos(p, q);
  return karlssonRoosUnchecked(thetaRad, p, q);
}

/** Checks the Karlsson–Roos parameters: p ∈ {1, 2, 3}, q ∈ [1, 10]. @throws RangeError naming p or q */
export function checkKarlssonRoos(p: number, q: number): void {
  if (!(p === 1 || p === 2 || p === 3)) {
    throw new RangeError(`Karlsson–Roos pane count p must be 1, 2 or 3; got ${p}`);
  }
  if (!(Number.isFinite(q) && q >= 1 && q <= 10)) {
    throw new RangeError(`Karlsson–Roos glazing-type index q must be in [1, 10]; got ${q}`);
  }
}

/** {@link karlssonRoosTransmittanceRatio} without checks (hot path). */
export function karlssonRoosUnchecked(thetaRad: number, p: number, q: number): number {
  const z = thetaRad / GRAZING_INCIDENCE_RAD;
  const a = 8;
  const b = 0.25 / q;
  const c = 1 - a - b;
  const alpha = 5.2 + 0.7 * q;
  const gamma = 5.26 + 0.06 * p + (0.73 + 0.04 * p) * q;
  const lnz = Math.log(z); // −∞ at z = 0, where exp(−∞) = 0 gives z^α = z^γ = 0 (α, γ > 0)
  const v = 1 - a * Math.exp(alpha * lnz) - b * z * z - c * Math.exp(gamma * lnz);
  return v < 0 ? 0 : v > 1 ? 1 : v;
}

/**
 * Normalised reference-curve rule for the reflectance of one coated face (common practice, no source):
 *   R_c(θ) = R_c(0) + (1 − R_c(0)) · [R_ref(θ) − R_ref(0)] / [1 − R_ref(0)]
 * clamped to [0, 1].
 * @param coatedNormal R_c(0) [-]
 * @param referenceAtAngle R_ref(θ) [-] of an uncoated reference pane
 * @param referenceNormal R_ref(0) [-], < 1
 * @returns R_c(θ) [-]
 */
export function referenceCurveReflectance(coatedNormal: number, referenceAtAngle: number, referenceNormal: number): number {
  checkFraction(coatedNormal, "coated reflectance");
  checkFraction(referenceAtAngle, "reference reflectance");
  if (!(referenceNormal >= 0 && referenceNormal < 1)) {
    throw new RangeError(`reference normal reflectance must be in [0, 1); got ${referenceNormal}`);
  }
  return referenceCurveUnchecked(coatedNormal, referenceAtAngle, referenceNormal);
}

/** {@link referenceCurveReflectance} without checks (hot path). */
export function referenceCurveUnchecked(c0: number, rTheta: number, r0: number): number {
  const v = c0 + ((1 - c0) * (rTheta - r0)) / (1 - r0);
  return v < 0 ? 0 : v > 1 ? 1 : v;
}

/**
 * Internal transmittance τ of the reference slab (index n) that transmits T at normal incidence:
 * the root of T r² τ² + (1 − r)² τ − T = 0 with r = ((n − 1)/(n + 1))², written as
 *   τ = 2T / [(1 − r)² + sqrt((1 − r)⁴ + 4 T² r²)],  clamped to ≤ 1.
 * @param T normal transmittance [-], in [0, 1]
 * @param n refractive index [-]
 * @returns τ [-], in [0, 1]
 * @see Duffie & Beckman, 4th ed., ch. 5 (slab series; from memory)
 */
export function referenceInternalTransmittance(T: number, n: number = REFERENCE_PANE_REFRACTIVE_INDEX): number {
  checkFraction(T, "transmittance");
  const r = ((n - 1) / (n + 1)) ** 2;
  const u = (1 - r) * (1 - r);
  const tau = (2 * T) / (u + Math.sqrt(u * u + 4 * T * T * r * r));
  return Math.min(1, tau);
}

/** Unpolarised reflectance of the reference slab at θ, with τ(θ) = exp(−αd / cos θt). */
export function referenceReflectanceAt(n: number, opticalDepthNormal: number, thetaRad: Radians): number {
  const face = fresnelReflectancesReal(1, n, thetaRad);
  const tau = opticalDepthNormal === 0 ? 1 : Math.exp(-opticalDepthNormal / face.cosThetaT); // αd = ∞ → 0
  const s = slabFromFaceReflectance(face.Rs, tau);
  const p = slabFromFaceReflectance(face.Rp, tau);
  return 0.5 * (s.R + p.R);
}
