/**
 * Isotropic sky (Liu & Jordan 1960): the sky dome has uniform radiance, so a surface of tilt β
 * receives I_sky = DHI (1 + cos β)/2 [W/m²].
 * @see B. Y. H. Liu & R. C. Jordan, "The interrelationship and characteristic distribution of
 *   direct, diffuse and total solar radiation", Solar Energy 4:1–19, 1960 (from memory);
 *   pvlib-python `irradiance.isotropic`
 */
import { checkNonNegative } from "../units";
import { emptySkyCoefficients, prepareTranspositionSurface, type SkyDiffuseCoefficients } from "./transposition-surface";

/**
 * Isotropic sky (Liu & Jordan): I_sky = DHI (1 + cos β)/2 [W/m²].
 * @param dhiWPerM2 DHI [W/m²], ≥ 0; @param tiltRad β [rad], [0, π]
 * @throws RangeError naming "DHI" or "surface tilt"
 * @see B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960; pvlib-python `irradiance.isotropic`
 */
export function skyDiffuseIsotropicLiuJordan1960(dhiWPerM2: number, tiltRad: number): number {
  checkNonNegative(dhiWPerM2, "DHI", " W/m²");
  return dhiWPerM2 * prepareTranspositionSurface(tiltRad).skyViewFactor;
}

/**
 * Isotropic-sky per-site-hour coefficients: isotropic = DHI, circumsolarPerCos = 0, horizon = 0.
 * @param dhiWPerM2 DHI [W/m²], ≥ 0
 * @param out optional record to fill (no allocation then)
 * @throws RangeError naming "DHI"
 * @see Liu & Jordan 1960; pvlib-python `irradiance.isotropic`
 */
export function skyCoefficientsIsotropicLiuJordan1960(
  dhiWPerM2: number,
  out: SkyDiffuseCoefficients = emptySkyCoefficients(),
): SkyDiffuseCoefficients {
  checkNonNegative(dhiWPerM2, "DHI", " W/m²");
  out.isotropicWPerM2 = dhiWPerM2;
  out.circumsolarPerCos = 0;
  out.horizonWPerM2 = 0;
  return out;
}
