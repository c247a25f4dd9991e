/**
 * Relative optical air mass (Kasten & Young 1989), absolute air mass, and site pressure from
 * elevation (standard-atmosphere barometric formula). Air mass is dimensionless; pressure in Pa.
 */
import { checkPositive, checkRange, RAD_PER_DEG } from "../units";

/** Standard sea-level pressure [Pa]. */
export const STANDARD_PRESSURE_PA = 101325;

/**
 * Relative optical air mass, Kasten & Young (1989), valid up to the horizon:
 *   AM = 1 / [cos z + 0.50572 (96.07995 − z)^(−1.6364)],  z = apparent zenith in DEGREES
 * (the formula's constants are in degrees, hence the degree argument). Note AM(0) = 0.999712,
 * not 1; AM(90°) = 37.92 (sec z would be infinite).
 * @param apparentZenithDeg refraction-corrected zenith angle [deg], in [0, 90]
 * @returns AM [-]
 * @throws RangeError naming "apparent zenith" (sun below the horizon: the model is not defined)
 * @see F. Kasten & A. T. Young, "Revised optical air mass tables and approximation formula",
 *   Applied Optics 28(22):4735–4738, 1989; pvlib-python `atmosphere.get_relative_airmass`
 *   (default model 'kastenyoung1989')
 */
export function relativeAirMassKastenYoung1989(apparentZenithDeg: number): number {
  checkRange(apparentZenithDeg, "apparent zenith", 0, 90, "°");
  return 1 / (Math.cos(apparentZenithDeg * RAD_PER_DEG) + 0.50572 * Math.pow(96.07995 - apparentZenithDeg, -1.6364));
}

/**
 * Absolute (pressure-corrected) air mass: AM_abs = AM · p / 101325 Pa.
 * @param relativeAirMass AM [-], > 0
 * @param pressurePa site pressure [Pa], > 0
 * @throws RangeError naming "relative air mass" or "pressure"
 * @see pvlib-python `atmosphere.get_absolute_airmass`
 */
export function absoluteAirMass(relativeAirMass: number, pressurePa: number = STANDARD_PRESSURE_PA): number {
  checkPositive(relativeAirMass, "relative air mass");
  checkPositive(pressurePa, "pressure", " Pa");
  return (relativeAirMass * pressurePa) / STANDARD_PRESSURE_PA;
}

/**
 * Site pressure from elevation by the barometric formula of the standard troposphere
 * (base 101325 Pa, 288.15 K at sea level, lapse rate 6.5 K/km, g = 9.80665 m/s², dry air):
 *   p = 100 · ((44331.514 − h) / 11880.516)^(1/0.1902632)  [Pa],  h in m
 * (gives 101325.0 Pa at h = 0 and 89874.8 Pa at 1000 m).
 * @param elevationM site elevation above sea level [m], in [−500, 11000] (troposphere)
 * @returns pressure [Pa]
 * @throws RangeError naming "elevation"
 * @see pvlib-python `atmosphere.alt2pres` (formula and assumptions as documented there, citing
 *   "A Quick Derivation relating altitude to air pressure", Portland State Aerospace Society,
 *   v1.03, 2004)
 */
export function pressureFromElevation(elevationM: number): number {
  checkRange(elevationM, "elevation", -500, 11000, " m");
  return 100 * Math.pow((44331.514 - elevationM) / 11880.516, 1 / 0.1902632);
}
