/**
 * Hay & Davies (1980) anisotropic sky: the diffuse horizontal irradiance is split by the
 * anisotropy index Ai = DNI/E0 into a circumsolar part, which arrives from the sun's direction,
 * and an isotropic remainder. Irradiance in W/m², angles in radians.
 * @see J. E. Hay & J. A. Davies, "Calculation of the solar radiation incident on an inclined
 *   surface", Proc. First Canadian Solar Radiation Data Workshop, 1980, p. 59;
 *   pvlib-python `irradiance.haydavies`
 */
import { checkRange } from "../units";
import { checkSkyHour, type SkyDiffuseCoefficients, type SkyHourInput } from "./transposition-surface";

/** Lower bound of cos z in the Hay–Davies beam ratio Rb (= cos 88.9997°; value as in pvlib). */
export const HAY_DAVIES_MIN_COS_ZENITH = 0.01745;

/** Hay & Davies coefficients of one site-hour, with the anisotropy index. */
export interface HayDavies1980SkyCoefficients extends SkyDiffuseCoefficients {
  /** Anisotropy index Ai = DNI/E0 [-]. */
  anisotropyIndex: number;
}

/** A mutable, zeroed Hay & Davies record (reuse it as `out`). */
export function emptyHayDavies1980SkyCoefficients(): HayDavies1980SkyCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0, anisotropyIndex: 0 };
}

/**
 * Hay & Davies per-site-hour coefficients. With anisotropy index Ai = DNI/E0 and
 * Rb = max(cos θ, 0)/max(cos z, 0.01745):
 *   I_sky = DHI [Ai Rb + (1 − Ai)(1 + cos β)/2]
 * so isotropic = DHI (1 − Ai), circumsolarPerCos = DHI Ai / max(cos z, 0.01745), horizon = 0.
 * @param out optional record to fill (no allocation then)
 * @returns the coefficients and Ai [-]
 * @throws RangeError naming the offending input
 * @see J. E. Hay & J. A. Davies, "Calculation of the solar radiation incident on an inclined
 *   surface", Proc. First Canadian Solar Radiation Data Workshop, 1980, p. 59;
 *   pvlib-python `irradiance.haydavies`
 */
export function skyCoefficientsHayDavies1980(
  hour: SkyHourInput,
  out: HayDavies1980SkyCoefficients = emptyHayDavies1980SkyCoefficients(),
): HayDavies1980SkyCoefficients {
  checkSkyHour(hour);
  const ai = hour.dniWPerM2 / hour.extraterrestrialWPerM2;
  const cz = Math.max(Math.cos(hour.zenithRad), HAY_DAVIES_MIN_COS_ZENITH);
  out.isotropicWPerM2 = hour.dhiWPerM2 * (1 - ai);
  out.circumsolarPerCos = (hour.dhiWPerM2 * ai) / cz;
  out.horizonWPerM2 = 0;
  out.anisotropyIndex = ai;
  return out;
}

/**
 * Hay & Davies beam ratio Rb = max(cos θ, 0) / max(cos z, 0.01745) [-].
 * @see pvlib-python `irradiance.haydavies`
 */
export function beamRatioHayDavies1980(cosTheta: number, zenithRad: number): number {
  return Math.max(cosTheta, 0) / Math.max(Math.cos(zenithRad), HAY_DAVIES_MIN_COS_ZENITH);
}

/**
 * Hay & Davies sky diffuse on a surface (scalar form) [W/m²]:
 *   I_sky = DHI [Ai Rb + (1 − Ai)(1 + cos β)/2],  Ai = DNI/E0, Rb = max(cos θ,0)/max(cos z, 0.01745)
 * @param cosTheta cos of the angle of incidence on the surface [-]
 * @throws RangeError naming the offending input
 * @see Hay & Davies 1980; pvlib-python `irradiance.haydavies`
 */
export function skyDiffuseHayDavies1980(hour: SkyHourInput, tiltRad: number, cosTheta: number): number {
  checkSkyHour(hour);
  checkRange(cosTheta, "cos incidence", -1, 1);
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  const ai = hour.dniWPerM2 / hour.extraterrestrialWPerM2;
  const rb = beamRatioHayDavies1980(cosTheta, hour.zenithRad);
  return Math.max(0, hour.dhiWPerM2 * (ai * rb + ((1 - ai) * (1 + Math.cos(tiltRad))) / 2));
}
