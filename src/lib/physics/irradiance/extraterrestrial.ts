/**
 * Extraterrestrial normal irradiance E0 and the Earth–Sun distance factor (R_av/R)²: Spencer's
 * (1971) Fourier series, the simple cosine form, and the form used with the ASHRAE clear-sky model.
 * Units: W/m²; the day of the year is 1 on 1 January and may be fractional.
 */
import { checkRange } from "../units";

/** Solar constant used by pvlib's `get_extra_radiation` by default [W/m²]. */
export const SOLAR_CONSTANT_W_PER_M2 = 1366.1;

/** Checks a day of the year: finite, in [1, 367). @throws RangeError naming "day of year" */
export function checkDayOfYear(dayOfYear: number): void {
  checkRange(dayOfYear, "day of year", 1, 366.999999);
}

/**
 * Earth–Sun distance factor (R_av/R)² by Spencer's Fourier series, with B = 2π(doy − 1)/365:
 *   E0/Esc = 1.00011 + 0.034221 cos B + 0.00128 sin B + 0.000719 cos 2B + 0.000077 sin 2B
 * @param dayOfYear day of the year, 1 = 1 January, real values allowed, [1, 367)
 * @returns the factor [-] (≈ 0.967 … 1.035)
 * @throws RangeError naming "day of year"
 * @see J. W. Spencer, "Fourier series representation of the position of the sun", Search 2(5):172,
 *   1971 (from memory); pvlib-python `irradiance.get_extra_radiation(method='spencer')`
 */
export function extraterrestrialFactorSpencer1971(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  const b = (2 * Math.PI * (dayOfYear - 1)) / 365;
  return 1.00011 + 0.034221 * Math.cos(b) + 0.00128 * Math.sin(b) + 0.000719 * Math.cos(2 * b) + 0.000077 * Math.sin(2 * b);
}

/**
 * Extraterrestrial normal irradiance E0 = Esc · (Spencer factor) [W/m²].
 * @param dayOfYear day of the year, [1, 367)
 * @param solarConstantWPerM2 Esc [W/m²], default 1366.1 (pvlib's default; 1361 per
 *   Kopp & Lean, GRL 38 L01706, 2011, from memory; 1367 in older work)
 * @throws RangeError naming "day of year" or "solar constant"
 */
export function extraterrestrialIrradianceSpencer1971(dayOfYear: number, solarConstantWPerM2: number = SOLAR_CONSTANT_W_PER_M2): number {
  checkRange(solarConstantWPerM2, "solar constant", 1000, 2000, " W/m²");
  return solarConstantWPerM2 * extraterrestrialFactorSpencer1971(dayOfYear);
}

/**
 * Simple Earth–Sun distance factor: E0/Esc = 1 + 0.033 cos(2π·doy/365).
 * @param dayOfYear [1, 367) @returns factor [-]
 * @see Duffie & Beckman, Solar Engineering of Thermal Processes, 4th ed., eq. 1.4.1a (from memory)
 */
export function extraterrestrialFactorSimple(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365);
}

/**
 * Extraterrestrial normal irradiance as used with the ASHRAE clear-sky model:
 *   E0 = 1367 [1 + 0.033 cos(2π (n − 3)/365)]  [W/m²]
 * @param dayOfYear n, [1, 367)
 * @see ASHRAE Handbook—Fundamentals (2009 and later), ch. 14 "Climatic design information",
 *   clear-sky model (formula from memory; verify)
 */
export function extraterrestrialIrradianceAshrae2009(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  return 1367 * (1 + 0.033 * Math.cos((2 * Math.PI * (dayOfYear - 3)) / 365));
}
