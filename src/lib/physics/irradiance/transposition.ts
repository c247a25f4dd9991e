/**
 * Sky-diffuse models behind one dispatcher, and the total irradiance on a tilted surface.
 * Each model gives per-site-hour coefficients of the same shape (transposition-surface.ts):
 *   I_sky = max(0, isotropic·(1 + cos β)/2 + circumsolarPerCos·max(cos θ, 0) + horizon·sin β)
 * - "isotropic": Liu & Jordan (1960), isotropic-liu-jordan1960.ts;
 * - "hay-davies": Hay & Davies (1980), hay-davies1980.ts;
 * - "perez": Perez et al. (1990), all-sites composite coefficients, perez1990.ts.
 * Irradiance in W/m², angles in radians.
 * @see pvlib-python `irradiance.get_sky_diffuse` and `irradiance.get_total_irradiance` (same
 *   composition of beam, sky diffuse and ground-reflected parts)
 */
import { checkNonNegative, checkRange } from "../units";
import { groundReflectedOnSurface } from "./ground-reflection";
import { emptyHayDavies1980SkyCoefficients, skyCoefficientsHayDavies1980, type HayDavies1980SkyCoefficients } from "./hay-davies1980";
import { skyCoefficientsIsotropicLiuJordan1960 } from "./isotropic-liu-jordan1960";
import { emptyPerez1990SkyCoefficients, skyCoefficientsPerez1990, type Perez1990SkyCoefficients } from "./perez1990";
import {
  beamOnSurface,
  checkSkyHour,
  DEFAULT_GROUND_ALBEDO,
  emptySkyCoefficients,
  prepareTranspositionSurface,
  skyDiffuseFromCoefficients,
  type SkyDiffuseCoefficients,
  type SkyHourInput,
} from "./transposition-surface";

/** Sky-diffuse model names (the spelling of the public API). */
export type SkyDiffuseModel = "perez" | "hay-davies" | "isotropic";

/** Per-site-hour input of {@link skyDiffuseCoefficients}. */
export interface SkyModelHourInput extends SkyHourInput {
  /** Relative air mass [-] (Perez only; required there). */
  readonly relativeAirMass?: number;
}

/** Reusable output records of {@link skyDiffuseCoefficients}, one per model (no allocation per hour). */
export interface SkyCoefficientsWorkspace {
  readonly perez: Perez1990SkyCoefficients;
  readonly hayDavies: HayDavies1980SkyCoefficients;
  readonly isotropic: SkyDiffuseCoefficients;
}

/** A fresh, zeroed {@link SkyCoefficientsWorkspace}. */
export function emptySkyCoefficientsWorkspace(): SkyCoefficientsWorkspace {
  return { perez: emptyPerez1990SkyCoefficients(), hayDavies: emptyHayDavies1980SkyCoefficients(), isotropic: emptySkyCoefficients() };
}

/**
 * Per-site-hour sky-diffuse coefficients of the chosen model (see the module comment).
 * @param model "perez", "hay-davies" or "isotropic"
 * @param hour DHI, DNI, E0, zenith, and the relative air mass for Perez
 * @param workspace optional records to fill (no allocation then); the result is one of them
 * @returns the model's coefficients [W/m²] (Perez and Hay–Davies records carry their intermediate values too)
 * @throws RangeError naming the offending input, an unknown model, or a missing air mass for Perez
 */
export function skyDiffuseCoefficients(
  model: SkyDiffuseModel,
  hour: SkyModelHourInput,
  workspace?: SkyCoefficientsWorkspace,
): SkyDiffuseCoefficients {
  if (model === "perez") {
    if (hour.relativeAirMass === undefined) throw new RangeError("relative air mass is required by the Perez model");
    return skyCoefficientsPerez1990(hour, hour.relativeAirMass, workspace?.perez);
  }
  if (model === "hay-davies") return skyCoefficientsHayDavies1980(hour, workspace?.hayDavies);
  if (model === "isotropic") return skyCoefficientsIsotropicLiuJordan1960(hour.dhiWPerM2, workspace?.isotropic);
  throw new RangeError(`sky diffuse model must be isotropic, hay-davies or perez; got ${String(model)}`);
}

/** Inputs of {@link tiltedSurfaceIrradiance}. */
export interface TiltedSurfaceInput extends SkyModelHourInput {
  readonly ghiWPerM2: number;
  readonly tiltRad: number;
  /** cos θ on the surface [-]. */
  readonly cosTheta: number;
  /** Ground albedo [-], default 0.2. */
  readonly albedo?: number;
  readonly model: SkyDiffuseModel;
}

/** Irradiance components on a surface [W/m²]. */
export interface TiltedSurfaceIrradiance {
  readonly beamWPerM2: number;
  readonly skyDiffuseWPerM2: number;
  readonly groundWPerM2: number;
  readonly totalWPerM2: number;
}

/**
 * Total irradiance on a tilted surface (scalar form):
 *   I = DNI·max(cos θ, 0) + I_sky(model) + GHI ρ_g (1 − cos β)/2   [W/m²]
 * @throws RangeError naming the offending input (Perez without a relative air mass included)
 * @see pvlib-python `irradiance.get_total_irradiance` (same composition)
 */
export function tiltedSurfaceIrradiance(input: TiltedSurfaceInput): TiltedSurfaceIrradiance {
  checkSkyHour(input);
  checkNonNegative(input.ghiWPerM2, "GHI", " W/m²");
  checkRange(input.cosTheta, "cos incidence", -1, 1);
  const surface = prepareTranspositionSurface(input.tiltRad, input.albedo ?? DEFAULT_GROUND_ALBEDO);
  const coefficients = skyDiffuseCoefficients(input.model, input);
  const beamWPerM2 = beamOnSurface(input.dniWPerM2, input.cosTheta);
  const skyDiffuseWPerM2 = skyDiffuseFromCoefficients(coefficients, surface, input.cosTheta);
  const groundWPerM2 = groundReflectedOnSurface(input.ghiWPerM2, surface);
  return { beamWPerM2, skyDiffuseWPerM2, groundWPerM2, totalWPerM2: beamWPerM2 + skyDiffuseWPerM2 + groundWPerM2 };
}
