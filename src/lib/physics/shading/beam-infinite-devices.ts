/**
 * Beam shading of a window on a vertical façade by an infinitely long overhang and infinitely
 * tall side fins, in scalar form (sun angles in, shaded lengths out), for tests and documentation.
 * With the horizontal shadow angle γ = az_sun − az_façade and the profile angle
 * tan Ω = tan α / cos γ (α = sun altitude):
 *   overhang band h_s = clamp(P tan Ω − G, 0, H),  fin strip w_s = clamp(F |tan γ| − E, 0, W),
 *   f_sunlit = (W − w_s)(H − h_s)/(W H).
 * The per-hour hot path, which also covers tilted surfaces and finite devices, is
 * PreparedShading.sunlitFraction (prepared-shading.ts).
 *
 * @see ASHRAE Handbook—Fundamentals, fenestration chapter (overhang/fin shadow geometry, profile
 *   angle; from memory)
 */
import type { Radians } from "../units";

const HALF_PI = Math.PI / 2;

/**
 * Horizontal shadow angle γ = az_sun − az_façade wrapped to (−π, π] [rad].
 * @param sunAzimuthRad sun azimuth, clockwise from north [rad]
 * @param facadeAzimuthRad façade outward-normal azimuth [rad]
 */
export function horizontalShadowAngleRad(sunAzimuthRad: number, facadeAzimuthRad: number): Radians {
  let g = (sunAzimuthRad - facadeAzimuthRad) % (2 * Math.PI);
  if (g <= -Math.PI) g += 2 * Math.PI;
  if (g > Math.PI) g -= 2 * Math.PI;
  return g as Radians;
}

/**
 * Profile (vertical shadow) angle Ω: tan Ω = tan α / cos γ [rad], for a sun in front of a
 * vertical façade (|γ| < π/2, α > 0).
 * @param sunAltitudeRad α [rad]; @param shadowAngleRad γ [rad]
 * @throws RangeError when the sun is not in front of the façade (Ω undefined)
 * @see ASHRAE Handbook—Fundamentals, fenestration chapter (from memory)
 */
export function profileAngleRad(sunAltitudeRad: number, shadowAngleRad: number): Radians {
  const c = Math.cos(shadowAngleRad);
  if (!(c > 0) || !(sunAltitudeRad > 0) || !(sunAltitudeRad < HALF_PI)) {
    throw new RangeError(
      `profile angle needs the sun in front of the façade: altitude in (0, π/2) and |γ| < π/2; got α=${sunAltitudeRad}, γ=${shadowAngleRad}`,
    );
  }
  return Math.atan(Math.tan(sunAltitudeRad) / c) as Radians;
}

/**
 * Height of the shaded band at the top of the window under an infinitely long overhang:
 *   h_s = clamp(P tan Ω − G, 0, H)  [m]
 */
export function overhangShadedHeightM(depthM: number, gapM: number, windowHeightM: number, profileRad: number): number {
  return Math.min(windowHeightM, Math.max(0, depthM * Math.tan(profileRad) - gapM));
}

/**
 * Width of the shaded strip on the jamb on the sun's side, infinitely tall fin:
 *   w_s = clamp(F |tan γ| − E, 0, W)  [m]
 */
export function finShadedWidthM(depthM: number, gapM: number, windowWidthM: number, shadowAngleRad: number): number {
  return Math.min(windowWidthM, Math.max(0, depthM * Math.abs(Math.tan(shadowAngleRad)) - gapM));
}
