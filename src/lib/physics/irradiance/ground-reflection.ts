/**
 * Ground-reflected irradiance on a surface, isotropic ground: GHI · ρ_g (1 − cos β)/2 [W/m²].
 * @see B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960 (isotropic view factors)
 */
import { checkNonNegative } from "../units";
import { DEFAULT_GROUND_ALBEDO, prepareTranspositionSurface, type TranspositionSurface } from "./transposition-surface";

/**
 * Ground-reflected irradiance on the surface, isotropic ground: GHI · ρ_g (1 − cos β)/2 [W/m²].
 * Hot path, no checks.
 * @see Liu & Jordan 1960; pvlib-python `irradiance.get_ground_diffuse`
 */
export function groundReflectedOnSurface(ghiWPerM2: number, surface: TranspositionSurface): number {
  return ghiWPerM2 * surface.groundFactor;
}

/**
 * Ground-reflected irradiance (isotropic ground): GHI ρ_g (1 − cos β)/2 [W/m²].
 * @param ghiWPerM2 GHI [W/m²], ≥ 0; @param tiltRad β [rad]; @param albedo ρ_g [-], default 0.2
 * @throws RangeError naming "GHI", "surface tilt" or "ground albedo"
 * @see pvlib-python `irradiance.get_ground_diffuse`
 */
export function groundReflected(ghiWPerM2: number, tiltRad: number, albedo: number = DEFAULT_GROUND_ALBEDO): number {
  checkNonNegative(ghiWPerM2, "GHI", " W/m²");
  return groundReflectedOnSurface(ghiWPerM2, prepareTranspositionSurface(tiltRad, albedo));
}
