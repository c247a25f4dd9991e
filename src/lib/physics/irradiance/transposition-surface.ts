/**
 * Transposition of irradiance onto a tilted or vertical surface: per-surface constants (view
 * factors, sin β), the per-surface-hour beam and sky-diffuse sums, and the shape shared by all
 * sky-diffuse models' per-site-hour coefficients. Irradiance in W/m², angles in radians.
 *
 * Hot path. The hourly schedule evaluates many surfaces for each site-hour, so each
 * transposition model is split in two:
 *  1. per site-hour (once per hour, any trig/exp allowed): skyDiffuseCoefficients
 *     (transposition.ts), which dispatches to the model files → a few W/m² coefficients;
 *  2. per surface (once): {@link prepareTranspositionSurface} → view factors and sin β;
 *  3. per surface-hour: {@link skyDiffuseFromCoefficients}, {@link beamOnSurface},
 *     groundReflectedOnSurface (ground-reflection.ts): multiplications, additions and a max, nothing else.
 * For every model the sky diffuse on the surface has the same shape:
 *   I_sky = isotropic·(1 + cos β)/2 + circumsolarPerCos·max(cos θ, 0) + horizon·sin β,
 * clamped at ≥ 0 (only Perez can go negative, through F2 < 0), which is what lets one
 * per-surface-hour function serve all three models and lets shading factors be applied per
 * component (isotropic, circumsolar, horizon band).
 */
import { checkNonNegative, checkRange, type Radians } from "../units";

/** Default ground albedo ρ_g [-] (common practice for grass/soil/concrete mix; no source). */
export const DEFAULT_GROUND_ALBEDO = 0.2;

/** Per-surface constants for transposition (compute once per surface). */
export interface TranspositionSurface {
  /** Tilt β [rad]. */
  readonly tiltRad: Radians;
  /** View factor of the surface to the sky dome, (1 + cos β)/2 [-]. */
  readonly skyViewFactor: number;
  /** View factor to the ground, (1 − cos β)/2 [-]. */
  readonly groundViewFactor: number;
  /** sin β [-] (weight of the Perez horizon band). */
  readonly sinTilt: number;
  /** Ground albedo ρ_g [-]. */
  readonly albedo: number;
  /** ρ_g (1 − cos β)/2 [-]: multiply by GHI to get the ground-reflected irradiance. */
  readonly groundFactor: number;
}

/**
 * Per-surface transposition constants: (1 + cos β)/2, (1 − cos β)/2, sin β, ρ_g (1 − cos β)/2.
 * cos β and sin β within 1e-15 of 0 or 1 are snapped (so β = 90° gives exactly 1/2 and 1).
 * @param tiltRad β [rad], in [0, π]
 * @param albedo ground albedo ρ_g [-], in [0, 1], default 0.2
 * @throws RangeError naming "surface tilt" or "ground albedo"
 * @see B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960 (isotropic view factors)
 */
export function prepareTranspositionSurface(tiltRad: number, albedo: number = DEFAULT_GROUND_ALBEDO): TranspositionSurface {
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  checkRange(albedo, "ground albedo", 0, 1);
  let cb = Math.cos(tiltRad);
  let sb = Math.sin(tiltRad);
  if (Math.abs(cb) < 1e-15) cb = 0;
  if (Math.abs(sb) < 1e-15) sb = 0;
  if (Math.abs(1 - sb) < 1e-15) sb = 1;
  return Object.freeze({
    tiltRad: tiltRad as Radians,
    skyViewFactor: (1 + cb) / 2,
    groundViewFactor: (1 - cb) / 2,
    sinTilt: sb,
    albedo,
    groundFactor: (albedo * (1 - cb)) / 2,
  });
}

/**
 * Beam irradiance on the surface: DNI · max(cos θ, 0) [W/m²]. Hot path, no checks. The caller
 * passes DNI = 0 when the sun is below the horizon.
 * @param dniWPerM2 direct normal irradiance [W/m²]; @param cosTheta cos of the angle of incidence [-]
 */
export function beamOnSurface(dniWPerM2: number, cosTheta: number): number {
  return cosTheta > 0 ? dniWPerM2 * cosTheta : 0;
}

/**
 * Per-site-hour coefficients of a sky-diffuse model, all in W/m², such that
 *   I_sky = max(0, isotropicWPerM2·(1 + cos β)/2 + circumsolarPerCos·max(cos θ, 0) + horizonWPerM2·sin β).
 */
export interface SkyDiffuseCoefficients {
  /** Weight of the isotropic dome [W/m²]. */
  isotropicWPerM2: number;
  /** Circumsolar irradiance per unit max(cos θ, 0) [W/m²]. */
  circumsolarPerCos: number;
  /** Horizon band irradiance per unit sin β [W/m²] (Perez only; 0 otherwise). */
  horizonWPerM2: number;
}

/** A mutable, zeroed coefficients record (reuse it as `out` to avoid one allocation per hour). */
export function emptySkyCoefficients(): SkyDiffuseCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0 };
}

/**
 * Sky diffuse irradiance on the surface from per-hour coefficients and per-surface constants:
 *   I_sky = max(0, iso·(1 + cos β)/2 + cs·max(cos θ, 0) + hz·sin β)  [W/m²]
 * Hot path: 3 multiplications, 2 additions, 2 comparisons; no checks, no allocation.
 * @param c per-site-hour coefficients; @param surface per-surface constants
 * @param cosTheta cos θ for this surface and hour [-]
 */
export function skyDiffuseFromCoefficients(c: SkyDiffuseCoefficients, surface: TranspositionSurface, cosTheta: number): number {
  const a = cosTheta > 0 ? cosTheta : 0;
  const sky = c.isotropicWPerM2 * surface.skyViewFactor + c.circumsolarPerCos * a + c.horizonWPerM2 * surface.sinTilt;
  return sky > 0 ? sky : 0;
}

/** Per-site-hour sky and sun quantities shared by the anisotropic models. */
export interface SkyHourInput {
  /** Diffuse horizontal irradiance [W/m²], ≥ 0. */
  readonly dhiWPerM2: number;
  /** Direct normal irradiance [W/m²], ≥ 0. */
  readonly dniWPerM2: number;
  /** Extraterrestrial normal irradiance E0 [W/m²]. */
  readonly extraterrestrialWPerM2: number;
  /** Solar zenith z [rad] (apparent), in [0, π]. */
  readonly zenithRad: number;
}

/** Checks a site-hour: DHI, DNI ≥ 0, E0 in [1000, 2000] W/m², zenith in [0, π]. @throws RangeError naming the input */
export function checkSkyHour(h: SkyHourInput): void {
  checkNonNegative(h.dhiWPerM2, "DHI", " W/m²");
  checkNonNegative(h.dniWPerM2, "DNI", " W/m²");
  checkRange(h.extraterrestrialWPerM2, "extraterrestrial irradiance", 1000, 2000, " W/m²");
  checkRange(h.zenithRad, "solar zenith", 0, Math.PI, " rad");
}
