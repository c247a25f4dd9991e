/**
 * Perez et al. (1990) anisotropic sky: isotropic dome, circumsolar disc and horizon band, with
 * brightening coefficients F1, F2 from the sky clearness ε and brightness Δ (all-sites composite
 * coefficient table). Irradiance in W/m², angles in radians.
 * @see R. Perez, P. Ineichen, R. Seals, J. Michalsky & R. Stewart, "Modeling daylight
 *   availability and irradiance components from direct and global irradiance", Solar Energy
 *   44(5):271–289, 1990; pvlib-python `irradiance.perez`
 */
import { checkPositive, checkRange, RAD_PER_DEG } from "../units";
import { checkSkyHour, type SkyDiffuseCoefficients, type SkyHourInput } from "./transposition-surface";

/** Upper edges of Perez sky-clearness bins 1…7 (bin 8: ε ≥ 6.2). */
export const PEREZ_EPSILON_BIN_EDGES: readonly number[] = Object.freeze([1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2]);

/**
 * Perez et al. (1990) "all sites composite" coefficients, one row per clearness bin 1…8:
 * [f11, f12, f13, f21, f22, f23]. Copied from the published table as reproduced in pvlib's
 * `_get_perez_coefficients('allsitescomposite1990')`.
 * @see R. Perez, P. Ineichen, R. Seals, J. Michalsky & R. Stewart, "Modeling daylight
 *   availability and irradiance components from direct and global irradiance", Solar Energy
 *   44(5):271–289, 1990, table of coefficients
 */
export const PEREZ_1990_ALL_SITES_COMPOSITE: readonly (readonly number[])[] = Object.freeze([
  Object.freeze([-0.008, 0.588, -0.062, -0.06, 0.072, -0.022]),
  Object.freeze([0.13, 0.683, -0.151, -0.019, 0.066, -0.029]),
  Object.freeze([0.33, 0.487, -0.221, 0.055, -0.064, -0.026]),
  Object.freeze([0.568, 0.187, -0.295, 0.109, -0.152, -0.014]),
  Object.freeze([0.873, -0.392, -0.362, 0.226, -0.462, 0.001]),
  Object.freeze([1.132, -1.237, -0.412, 0.288, -0.823, 0.056]),
  Object.freeze([1.06, -1.6, -0.359, 0.264, -1.127, 0.131]),
  Object.freeze([0.678, -0.327, -0.25, 0.156, -1.377, 0.251]),
]);

/** Perez κ for the zenith in radians. */
export const PEREZ_KAPPA = 1.041;

/** Perez coefficients of one site-hour, with the model's intermediate quantities. */
export interface Perez1990SkyCoefficients extends SkyDiffuseCoefficients {
  /** Sky clearness ε [-] (NaN when DHI = 0). */
  epsilon: number;
  /** Clearness bin 1…8 (0 when DHI = 0: the model is not evaluated). */
  bin: number;
  /** Sky brightness Δ = DHI·AM/E0 [-] (AM relative). */
  delta: number;
  /** Circumsolar brightening coefficient F1 ≥ 0 [-]. */
  f1: number;
  /** Horizon brightening coefficient F2 [-] (may be negative). */
  f2: number;
  /** b = max(cos 85°, cos z) [-]. */
  b: number;
}

/** A mutable, zeroed Perez record (reuse it as `out`). */
export function emptyPerez1990SkyCoefficients(): Perez1990SkyCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0, epsilon: 0, bin: 0, delta: 0, f1: 0, f2: 0, b: 0 };
}

const COS_85 = Math.cos(85 * RAD_PER_DEG);

/**
 * Perez 1990 per-site-hour coefficients (all-sites-composite table):
 *   ε = [(DHI + DNI)/DHI + κ z³]/(1 + κ z³),  κ = 1.041, z in radians
 *   Δ = DHI · AM / E0  (AM = relative air mass)
 *   bin by ε at 1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2 → 1…8 (edge values go to the upper bin)
 *   F1 = max(0, f11 + f12 Δ + f13 z),  F2 = f21 + f22 Δ + f23 z
 *   I_sky = DHI [(1 − F1)(1 + cos β)/2 + F1 a/b + F2 sin β],  a = max(0, cos θ), b = max(cos 85°, cos z)
 * so isotropic = DHI (1 − F1), circumsolarPerCos = DHI F1 / b, horizon = DHI F2.
 * DHI = 0 gives all coefficients 0 (ε undefined). The model is defined for the sun above the
 * horizon; for z ≥ 90° (twilight with DHI > 0) pass AM = AM(90°) = 37.92, as pvlib's continuous
 * Perez variant does.
 * @param hour DHI, DNI, E0, z; @param relativeAirMass AM [-], > 0 (Kasten–Young, as in the model's development)
 * @param out optional record to fill (no allocation then)
 * @returns the coefficients and the intermediate values ε, bin, Δ, F1, F2, b
 * @throws RangeError naming the offending input
 * @see Perez et al., Solar Energy 44(5):271–289, 1990; pvlib-python `irradiance.perez`
 */
export function skyCoefficientsPerez1990(
  hour: SkyHourInput,
  relativeAirMass: number,
  out: Perez1990SkyCoefficients = emptyPerez1990SkyCoefficients(),
): Perez1990SkyCoefficients {
  checkSkyHour(hour);
  checkPositive(relativeAirMass, "relative air mass");
  const { dhiWPerM2: dhi, dniWPerM2: dni, extraterrestrialWPerM2: e0, zenithRad: z } = hour;
  const b = Math.max(COS_85, Math.cos(z));
  out.b = b;
  if (dhi === 0) {
    out.isotropicWPerM2 = 0;
    out.circumsolarPerCos = 0;
    out.horizonWPerM2 = 0;
    out.epsilon = Number.NaN;
    out.bin = 0;
    out.delta = 0;
    out.f1 = 0;
    out.f2 = 0;
    return out;
  }
  const kz3 = PEREZ_KAPPA * z * z * z;
  const epsilon = ((dhi + dni) / dhi + kz3) / (1 + kz3);
  let bin = 1;
  for (const edge of PEREZ_EPSILON_BIN_EDGES) if (epsilon >= edge) bin++;
  const row = PEREZ_1990_ALL_SITES_COMPOSITE[bin - 1]!;
  const delta = (dhi * relativeAirMass) / e0;
  const f1 = Math.max(0, row[0]! + row[1]! * delta + row[2]! * z);
  const f2 = row[3]! + row[4]! * delta + row[5]! * z;
  out.isotropicWPerM2 = dhi * (1 - f1);
  out.circumsolarPerCos = (dhi * f1) / b;
  out.horizonWPerM2 = dhi * f2;
  out.epsilon = epsilon;
  out.bin = bin;
  out.delta = delta;
  out.f1 = f1;
  out.f2 = f2;
  return out;
}

/**
 * Perez 1990 sky diffuse on a surface (scalar form, the printed formula) [W/m²], clamped at ≥ 0 as in pvlib:
 *   I_sky = max(0, DHI [(1 − F1)(1 + cos β)/2 + F1 a/b + F2 sin β])
 * @param cosTheta cos of the angle of incidence [-]
 * @throws RangeError naming the offending input
 * @see Perez et al. 1990; pvlib-python `irradiance.perez`
 */
export function skyDiffusePerez1990(hour: SkyHourInput, relativeAirMass: number, tiltRad: number, cosTheta: number): number {
  checkRange(cosTheta, "cos incidence", -1, 1);
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  const { f1, f2, b } = skyCoefficientsPerez1990(hour, relativeAirMass);
  const a = Math.max(0, cosTheta);
  const term1 = ((1 - f1) * (1 + Math.cos(tiltRad))) / 2;
  return Math.max(0, hour.dhiWPerM2 * (term1 + (f1 * a) / b + f2 * Math.sin(tiltRad)));
}
