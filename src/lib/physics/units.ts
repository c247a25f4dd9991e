/**
 * Branded angle units. The brand exists only in the type system (no runtime cost): a plain
 * number must be converted or branded once at the edge, then the core works in radians.
 */

/** Angle in radians. */
export type Radians = number & { readonly __unit: "rad" };
/** Angle in degrees (edge of the system only: input forms, tables for people). */
export type Degrees = number & { readonly __unit: "deg" };

/** Brands a number already in radians (no conversion, no check). */
export const asRadians = (a: number): Radians => a as Radians;
/** Brands a number already in degrees (no conversion, no check). */
export const asDegrees = (a: number): Degrees => a as Degrees;

/** Radians per degree, π/180 (multiply an angle in degrees by it to get radians). */
export const RAD_PER_DEG = Math.PI / 180;
/** Degrees per radian, 180/π (multiply an angle in radians by it to get degrees). */
export const DEG_PER_RAD = 180 / Math.PI;

/** Degrees → radians: rad = deg · π/180. */
export const toRadians = (a: Degrees): Radians => ((a * Math.PI) / 180) as Radians;
/** Radians → degrees: deg = rad · 180/π. */
export const toDegrees = (a: Radians): Degrees => ((a * 180) / Math.PI) as Degrees;

/** Normal incidence, 0 rad. */
export const NORMAL_INCIDENCE_RAD = 0 as Radians;
/** Grazing incidence, π/2 rad (the float64 value Math.PI / 2). */
export const GRAZING_INCIDENCE_RAD = (Math.PI / 2) as Radians;

/**
 * Checks an angle of incidence: finite and within [0, π/2] rad (normal to grazing).
 * @param thetaRad angle from the surface normal [rad]
 * @param quantity name used in the error message
 * @throws RangeError naming the quantity when the angle is not finite or out of range
 */
export function checkIncidenceAngleRad(thetaRad: number, quantity = "angle of incidence"): Radians {
  if (!Number.isFinite(thetaRad) || thetaRad < 0 || thetaRad > GRAZING_INCIDENCE_RAD) {
    throw new RangeError(`${quantity} must be a finite angle in [0, π/2] rad; got ${thetaRad}`);
  }
  return thetaRad as Radians;
}

/**
 * cos θ for an angle of incidence, exactly 0 at θ = π/2 (Math.cos(Math.PI/2) is 6.1e-17,
 * which would leave a spurious 1e-16 transmittance at grazing incidence).
 * @param thetaRad angle from the surface normal [rad], already checked
 * @returns cos θ [-]
 */
export const cosIncidence = (thetaRad: Radians): number => (thetaRad === GRAZING_INCIDENCE_RAD ? 0 : Math.cos(thetaRad));

// ---------------------------------------------------------------------------------------------
// Construction-time checks (RangeError naming the quantity)

/**
 * Checks that a number is finite and within [min, max].
 * @param x value to check
 * @param quantity name used in the error message
 * @param unit unit suffix of the message, e.g. " m" or " W/m²" (default none)
 * @throws RangeError naming the quantity
 */
export function checkRange(x: number, quantity: string, min: number, max: number, unit = ""): void {
  if (!Number.isFinite(x) || x < min || x > max) {
    throw new RangeError(`${quantity} must be a finite number in [${min}, ${max}]${unit}; got ${x}`);
  }
}

/**
 * Checks that a number is finite and ≥ 0.
 * @throws RangeError naming the quantity
 */
export function checkNonNegative(x: number, quantity: string, unit = ""): void {
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`${quantity} must be a finite number ≥ 0${unit}; got ${x}`);
}

/**
 * Checks that a number is finite and > 0.
 * @throws RangeError naming the quantity
 */
export function checkPositive(x: number, quantity: string, unit = ""): void {
  if (!Number.isFinite(x) || x <= 0) throw new RangeError(`${quantity} must be a finite number > 0${unit}; got ${x}`);
}
