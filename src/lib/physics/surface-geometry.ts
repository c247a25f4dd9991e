/**
 * Geometry of a plane surface (façade, roof, skylight) and the angle of incidence of the
 * sun's beam on it.
 *
 * Conventions (all angles in radians inside the core; degrees only at the edge):
 * - Frame: ENU = (east, north, up), unit vectors, right-handed.
 * - Surface azimuth γ_s: azimuth of the horizontal projection of the OUTWARD normal, clockwise
 *   from north (N 0, E π/2, S π, W 3π/2). A south façade has γ_s = π.
 * - Tilt β from horizontal: 0 = facing straight up, π/2 = vertical, π = facing straight down.
 * - Sun: altitude α (above the horizon) and azimuth γ, clockwise from north.
 *
 * Unit vectors:
 *   outward normal   n = (sin β sin γ_s,  sin β cos γ_s,  cos β)
 *   along the width  u = (−cos γ_s,       sin γ_s,        0)      horizontal, pointing to the right
 *                                                                 of a person outside who faces the surface
 *   up the slope     v = (−cos β sin γ_s, −cos β cos γ_s, sin β)  in the plane, v = n × u
 *   sun              s = (cos α sin γ,    cos α cos γ,    sin α)
 * (u, v, n) is right-handed (u × v = n). For β = 0 or π the surface azimuth only fixes the
 * orientation of u and v in the plane.
 *
 * Angle of incidence θ between s and n:
 *   cos θ = s·n = cos α sin β cos(γ − γ_s) + sin α cos β
 *         = cos z cos β + sin z sin β cos(γ − γ_s),   z = π/2 − α
 * θ ∈ [0, π]. The beam reaches the surface only if the sun is above the horizon (α > 0, i.e.
 * s_up > 0) AND cos θ > 0 (sun in front of the surface); at cos θ ≤ 0 the surface is
 * self-shaded and receives no beam (use max(cos θ, 0)).
 *
 * @see J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley,
 *   2013, ch. 1 (angle of incidence on a tilted, oriented surface; section cited from memory)
 */
import { asRadians, toDegrees, toRadians, asDegrees, type Degrees, type Radians } from "./units";

/** A 3-vector in the ENU frame (components are unitless direction cosines here). */
export interface EnuVector {
  readonly east: number;
  readonly north: number;
  readonly up: number;
}

/** Orientation of a plane surface, checked: azimuth in [0, 2π), tilt in [0, π]. */
export interface SurfaceOrientation {
  /** Azimuth of the outward normal's horizontal projection, clockwise from north [rad], in [0, 2π). */
  readonly azimuthRad: Radians;
  /** Tilt from horizontal [rad], 0 (facing up) … π/2 (vertical) … π (facing down). */
  readonly tiltRad: Radians;
}

/**
 * Orthonormal frame of a surface, for hot loops: the nine direction cosines of u (along the
 * width, horizontal), v (up the slope) and n (outward normal) in ENU, plus cos β and sin β.
 * All fields are plain numbers so that per-hour code does three dot products and no trig.
 */
export interface SurfaceFrame {
  readonly orientation: SurfaceOrientation;
  /** Outward unit normal n. */
  readonly normal: EnuVector;
  /** Unit vector u along the width (horizontal, to the right of an outside observer facing the surface). */
  readonly along: EnuVector;
  /** Unit vector v up the slope (in the plane, v = n × u). */
  readonly upSlope: EnuVector;
  /** cos β [-] (β = tilt); exactly 0 for a vertical surface given as 90°. */
  readonly cosTilt: number;
  /** sin β [-]; exactly 1 for a vertical surface given as 90°. */
  readonly sinTilt: number;
}

const TWO_PI = 2 * Math.PI;
const HALF_PI = Math.PI / 2;

/** Snaps cos/sin values within 1e-15 of 0 or ±1 to those values (cos(π/2) = 6e-17 in float64). */
function snapUnit(x: number): number {
  if (Math.abs(x) < 1e-15) return 0;
  if (Math.abs(x - 1) < 1e-15) return 1;
  if (Math.abs(x + 1) < 1e-15) return -1;
  return x;
}

function checkFinite(x: number, quantity: string): void {
  if (!Number.isFinite(x)) throw new RangeError(`${quantity} must be a finite number; got ${x}`);
}

/**
 * Builds a checked surface orientation from radians; the azimuth is wrapped to [0, 2π).
 * @param azimuthRad outward-normal azimuth, clockwise from north [rad], any finite value
 * @param tiltRad tilt from horizontal [rad], in [0, π]
 * @throws RangeError naming "surface azimuth" or "surface tilt"
 */
export function surfaceOrientation(azimuthRad: number, tiltRad: number): SurfaceOrientation {
  checkFinite(azimuthRad, "surface azimuth");
  if (!Number.isFinite(tiltRad) || tiltRad < 0 || tiltRad > Math.PI) {
    throw new RangeError(`surface tilt must be a finite angle in [0, π] rad (0–180°); got ${tiltRad}`);
  }
  let az = azimuthRad % TWO_PI;
  if (az < 0) az += TWO_PI;
  if (az >= TWO_PI) az = 0;
  return Object.freeze({ azimuthRad: asRadians(az), tiltRad: asRadians(tiltRad) });
}

/**
 * Builds a checked surface orientation from degrees (edge of the system).
 * @param azimuthDeg outward-normal azimuth, clockwise from north [deg] (S façade = 180)
 * @param tiltDeg tilt from horizontal [deg], 0…180 (vertical = 90)
 * @throws RangeError naming "surface azimuth" or "surface tilt"
 */
export function surfaceOrientationDeg(azimuthDeg: number, tiltDeg: number): SurfaceOrientation {
  checkFinite(azimuthDeg, "surface azimuth");
  if (!Number.isFinite(tiltDeg) || tiltDeg < 0 || tiltDeg > 180) {
    throw new RangeError(`surface tilt must be a finite angle in [0, 180]°; got ${tiltDeg}`);
  }
  return surfaceOrientation(toRadians(asDegrees(azimuthDeg)), toRadians(asDegrees(tiltDeg)));
}

/**
 * Frame (u, v, n) of a surface in ENU (formulas in the module comment). cos β and sin β are
 * snapped to exact 0/±1 within 1e-15 so that a vertical surface has no spurious 6e-17 terms.
 * @param orientation checked orientation
 * @returns the frame; compute once per surface
 */
export function surfaceFrame(orientation: SurfaceOrientation): SurfaceFrame {
  const cb = snapUnit(Math.cos(orientation.tiltRad));
  const sb = snapUnit(Math.sin(orientation.tiltRad));
  const cg = snapUnit(Math.cos(orientation.azimuthRad));
  const sg = snapUnit(Math.sin(orientation.azimuthRad));
  return Object.freeze({
    orientation,
    normal: Object.freeze({ east: sb * sg, north: sb * cg, up: cb }),
    along: Object.freeze({ east: -cg, north: sg, up: 0 }),
    upSlope: Object.freeze({ east: -cb * sg, north: -cb * cg, up: sb }),
    cosTilt: cb,
    sinTilt: sb,
  });
}

/**
 * Unit vector towards the sun in ENU: s = (cos α sin γ, cos α cos γ, sin α).
 * Compute once per site-hour.
 * @param altitudeRad sun altitude α above the horizon [rad], in [−π/2, π/2]
 * @param azimuthRad sun azimuth γ, clockwise from north [rad]
 * @throws RangeError naming "sun altitude" or "sun azimuth"
 */
export function sunVectorEnu(altitudeRad: number, azimuthRad: number): EnuVector {
  if (!Number.isFinite(altitudeRad) || altitudeRad < -HALF_PI || altitudeRad > HALF_PI) {
    throw new RangeError(`sun altitude must be a finite angle in [−π/2, π/2] rad; got ${altitudeRad}`);
  }
  checkFinite(azimuthRad, "sun azimuth");
  const ca = Math.cos(altitudeRad);
  return Object.freeze({
    east: ca * Math.sin(azimuthRad),
    north: ca * Math.cos(azimuthRad),
    up: Math.sin(altitudeRad),
  });
}

/**
 * cos θ = n · s, the dot product of the unit normal and the unit sun vector (hot path: three
 * multiplications, two additions; no checks). Positive = sun in front of the surface.
 * @param normal outward unit normal in ENU
 * @param sunE, sunN, sunU sun unit vector components (east, north, up) [-]
 * @returns cos θ [-], in [−1, 1] up to rounding
 */
export function cosIncidence(normal: EnuVector, sunE: number, sunN: number, sunU: number): number {
  return normal.east * sunE + normal.north * sunN + normal.up * sunU;
}

/**
 * Whether the beam reaches the surface: sun above the horizon (s_up > 0) and in front of the
 * surface (cos θ > 0). Grazing (cos θ = 0) counts as no beam. Hot path, no checks.
 * @param sunUp up component of the sun unit vector = sin α [-]
 * @param cosTheta cos θ [-]
 */
export function beamReachesSurface(sunUp: number, cosTheta: number): boolean {
  return sunUp > 0 && cosTheta > 0;
}

/**
 * Component of the sun vector along the surface normal n (= cos θ). Hot path, no checks.
 * Together with {@link sunAlongWidth} and {@link sunUpSlope} this expresses the sun in the
 * surface frame, as used by the shading code.
 */
export function sunAlongNormal(frame: SurfaceFrame, sunE: number, sunN: number, sunU: number): number {
  const n = frame.normal;
  return n.east * sunE + n.north * sunN + n.up * sunU;
}

/** Component of the sun vector along u (the width, horizontal). Hot path, no checks. */
export function sunAlongWidth(frame: SurfaceFrame, sunE: number, sunN: number): number {
  const u = frame.along;
  return u.east * sunE + u.north * sunN;
}

/** Component of the sun vector along v (up the slope). Hot path, no checks. */
export function sunUpSlope(frame: SurfaceFrame, sunE: number, sunN: number, sunU: number): number {
  const v = frame.upSlope;
  return v.east * sunE + v.north * sunN + v.up * sunU;
}

/**
 * cos θ from angles (scalar form, for tests and documentation):
 *   cos θ = cos α sin β cos(γ − γ_s) + sin α cos β
 * @param sunAltitudeRad α [rad]; @param sunAzimuthRad γ [rad]; @param surface orientation
 * @returns cos θ [-], clamped to [−1, 1]
 * @see Duffie & Beckman, 4th ed., ch. 1 (from memory)
 */
export function cosIncidenceFromAngles(sunAltitudeRad: number, sunAzimuthRad: number, surface: SurfaceOrientation): number {
  const c =
    Math.cos(sunAltitudeRad) * Math.sin(surface.tiltRad) * Math.cos(sunAzimuthRad - surface.azimuthRad) +
    Math.sin(sunAltitudeRad) * Math.cos(surface.tiltRad);
  return Math.min(1, Math.max(-1, c));
}

/**
 * Angle of incidence θ ∈ [0, π] of the sun's direction on a surface: θ = acos(cos θ) with
 * cos θ from {@link cosIncidenceFromAngles}. θ > π/2 means the sun is behind the surface.
 * @param sunAltitudeRad α [rad], in [−π/2, π/2]; @param sunAzimuthRad γ [rad]
 * @param surface checked orientation
 * @returns θ [rad]
 * @throws RangeError naming "sun altitude" or "sun azimuth"
 */
export function angleOfIncidenceRad(sunAltitudeRad: number, sunAzimuthRad: number, surface: SurfaceOrientation): Radians {
  if (!Number.isFinite(sunAltitudeRad) || sunAltitudeRad < -HALF_PI || sunAltitudeRad > HALF_PI) {
    throw new RangeError(`sun altitude must be a finite angle in [−π/2, π/2] rad; got ${sunAltitudeRad}`);
  }
  checkFinite(sunAzimuthRad, "sun azimuth");
  return asRadians(Math.acos(cosIncidenceFromAngles(sunAltitudeRad, sunAzimuthRad, surface)));
}

/**
 * Angle of incidence in degrees (edge form):
 *   cos θ = cos(alt) sin(β) cos(az_sun − az_surf) + sin(alt) cos(β),  θ ∈ [0°, 180°].
 * @param sunAltitudeDeg sun altitude [deg], −90…90
 * @param sunAzimuthDeg sun azimuth, clockwise from north [deg]
 * @param surfaceAzimuthDeg outward-normal azimuth, clockwise from north [deg]
 * @param tiltDeg tilt from horizontal [deg], 0…180
 * @returns θ [deg]
 * @throws RangeError naming the offending quantity
 * @see Duffie & Beckman, 4th ed., ch. 1 (from memory)
 */
export function angleOfIncidenceDeg(sunAltitudeDeg: number, sunAzimuthDeg: number, surfaceAzimuthDeg: number, tiltDeg: number): Degrees {
  if (!Number.isFinite(sunAltitudeDeg) || sunAltitudeDeg < -90 || sunAltitudeDeg > 90) {
    throw new RangeError(`sun altitude must be a finite angle in [−90, 90]°; got ${sunAltitudeDeg}`);
  }
  checkFinite(sunAzimuthDeg, "sun azimuth");
  const surface = surfaceOrientationDeg(surfaceAzimuthDeg, tiltDeg);
  const theta = angleOfIncidenceRad(toRadians(asDegrees(sunAltitudeDeg)), toRadians(asDegrees(sunAzimuthDeg)), surface);
  return toDegrees(theta);
}
