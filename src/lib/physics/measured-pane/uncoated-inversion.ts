/**
 * Uncoated pane from measured values: closed-form inversion of normal-incidence T and R to an
 * equivalent refractive index n and absorption coefficient α of the slab model.
 *
 * Uncoated (|Rf − Rb| ≤ UNCOATED_FACE_TOLERANCE (measured-band-model.ts) in every band given): the values
 * are inverted in closed form to an equivalent refractive index n and absorption
 * coefficient α of the slab model (absorbing-pane.ts), which then gives T, R and A per
 * polarisation at any angle. From band-weighted data n and α are "effective" values, useful
 * to scale that pane to other angles, not material constants.
 *
 * @see R. A. Furler, "Angular dependence of optical properties of homogeneous glasses",
 *   ASHRAE Transactions 98(1), 1992 (LBL-31727): angular scaling of homogeneous glass from
 *   normal-incidence data through equivalent optical constants
 */
import { checkAbsorbingPane } from "../absorbing-pane";
import { checkFraction, checkThickness, MeasuredPaneError } from "./measured-values";

/** Range of refractive index usual for window glass [-] (common practice, no source); outside it a warning is due. */
export const PLAUSIBLE_GLASS_INDEX_RANGE = Object.freeze({ min: 1.45, max: 1.65 });

/** Result of the normal-incidence inversion of an uncoated pane. */
export interface UncoatedInversion {
  /** b = 1 + 2R − R² + T² [-] */
  readonly b: number;
  /** single-face reflectance r [-] */
  readonly faceReflectance: number;
  /** one-pass internal transmittance τ [-] */
  readonly internalTransmittance: number;
  /** equivalent refractive index n [-] */
  readonly refractiveIndex: number;
  /** equivalent absorption coefficient α [1/m] */
  readonly absorptionPerM: number;
}

/**
 * Inverts the slab model at normal incidence. With r the single-face reflectance and τ the
 * internal transmittance, R = r(1 + Tτ) and T = (1 − r)²τ/(1 − r²τ²); eliminating τ:
 *   b = 1 + 2R − R² + T²
 *   r = [b − sqrt(b² − 4R(2 − R))] / [2(2 − R)]  (smaller root; evaluated as 2R / (b + sqrt(…)))
 *   τ = (R − r) / (r T),   n = (1 + √r)/(1 − √r)  (from air),   α = −ln(τ)/d
 * Exact for the slab model; a slab computed at 0° inverts back to its n and α to ~1e-12.
 * For T, R in [0, 1] with T > 0, R > 0 and T + R ≤ 1 the discriminant is ≥ (1 − R)⁴, r lies in
 * (0, R) and τ in (0, 1]; those three checks are kept as guards against rounding.
 * @param T measured normal transmittance [-]
 * @param R measured normal reflectance [-] (same both faces)
 * @param thicknessM pane thickness d [m]
 * @param band name used in error messages, e.g. "solar"
 * @returns b, r, τ, n [-] and α [1/m]
 * @throws MeasuredPaneError naming the quantity when T + R > 1, T ≤ 0, R ≤ 0, the discriminant
 *   is negative, r ∉ (0, R), τ ∉ (0, 1] or n is outside the accepted range
 * @see Duffie & Beckman, 4th ed., ch. 5 (slab series; from memory); Furler, ASHRAE Trans. 98(1), 1992
 */
export function invertUncoatedPane(T: number, R: number, thicknessM: number, band = "solar"): UncoatedInversion {
  checkThickness(thicknessM);
  checkFraction(T, `${band}.T`);
  checkFraction(R, `${band}.R`);
  if (T + R > 1) {
    throw new MeasuredPaneError(`${band}.T + ${band}.R`, "energy-balance", `T + R must not exceed 1; got ${T + R}`);
  }
  if (T <= 0) {
    throw new MeasuredPaneError(`${band}.T`, "no-transmittance", "an uncoated pane needs T > 0 for the inversion");
  }
  if (R <= 0) {
    throw new MeasuredPaneError(`${band}.R`, "no-reflectance", "an uncoated pane in air reflects light: R must be > 0");
  }
  const b = 1 + 2 * R - R * R + T * T;
  const disc = b * b - 4 * R * (2 - R);
  if (disc < 0) {
    throw new MeasuredPaneError(`${band}.T, ${band}.R`, "negative-discriminant", `no uncoated slab has these values (discriminant ${disc} < 0)`);
  }
  const r = (2 * R) / (b + Math.sqrt(disc));
  if (!(r > 0 && r < R)) {
    throw new MeasuredPaneError(`${band}.R`, "face-reflectance", `single-face reflectance ${r} must lie in (0, R = ${R})`);
  }
  let tau = (R - r) / (r * T);
  if (tau > 1 && tau <= 1 + 1e-9) tau = 1; // rounding when T + R = 1 (no absorption)
  if (!(tau > 0 && tau <= 1)) {
    throw new MeasuredPaneError(`${band}.T, ${band}.R`, "internal-transmittance", `internal transmittance ${tau} must lie in (0, 1]`);
  }
  const sr = Math.sqrt(r);
  const n = (1 + sr) / (1 - sr);
  const alpha = tau === 1 ? 0 : -Math.log(tau) / thicknessM;
  try {
    checkAbsorbingPane({ thicknessM, refractiveIndex: n, absorptionPerM: alpha });
  } catch (e) {
    throw new MeasuredPaneError(
      `${band}.R`,
      "refractive-index",
      `equivalent refractive index ${n} is outside the accepted range (${(e as Error).message})`,
    );
  }
  return { b, faceReflectance: r, internalTransmittance: tau, refractiveIndex: n, absorptionPerM: alpha };
}
