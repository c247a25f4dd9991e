/**
 * One uncoated, homogeneous, absorbing pane (slab) in air, much thicker than the coherence
 * length: intensities of the multiply reflected beams add (no interference). Each
 * polarisation j ∈ {s, p} is treated separately:
 *   ρ = R_j(θ)                         Fresnel reflectance of one air/glass face
 *   τ = exp(−α d / cos θt)             internal transmittance along the refracted path
 *   T_j = (1 − ρ)² τ / (1 − ρ² τ²)
 *   R_j = ρ + ρ (1 − ρ)² τ² / (1 − ρ² τ²)       (same from both sides: the faces are alike)
 *   A_j = (1 − ρ)(1 − τ) / (1 − ρ τ)            (= 1 − T_j − R_j, summed as a series so that
 *                                                it is never negative through rounding)
 *   unpolarised: X = (X_s + X_p)/2
 * Averaging R_s and R_p before the series is a common error at oblique incidence (at 60° it
 * loses 0.01 in T for a 6 mm pane); this module never does it.
 *
 * @see J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley
 *   2013, ch. 5 (transmission through glazing; from memory)
 * @see M. Rubin, "Solar optical properties of windows", Int. J. Energy Research 6:123–133, 1982
 */
import { fresnelReflectancesReal } from "./fresnel";
import { checkIncidenceAngleRad, type Radians } from "./units";

/** Physical description of an uncoated pane, SI units. */
export interface AbsorbingPaneSpec {
  /** thickness d [m], in (0, 1] */
  readonly thicknessM: number;
  /** real refractive index n [-], in (1, 5] (glasses and plastics; beyond that almost surely a unit error) */
  readonly refractiveIndex: number;
  /** Beer–Lambert (natural-log, intensity) absorption coefficient α [1/m], ≥ 0; α = 4πk/λ at one wavelength */
  readonly absorptionPerM: number;
}

/** Slab optics for one polarisation (or averaged) [-]: T + R + A = 1. */
export interface SlabOptics {
  readonly T: number;
  readonly R: number;
  readonly A: number;
}

/** Slab optics at one angle, per polarisation and unpolarised. */
export interface AbsorbingPaneOptics extends SlabOptics {
  readonly s: SlabOptics;
  readonly p: SlabOptics;
  /** cosine of the refraction angle inside the pane [-] */
  readonly cosThetaT: number;
  /** internal (one-pass) transmittance τ [-] */
  readonly internalTransmittance: number;
}

/** Upper bound of the accepted refractive index (see {@link AbsorbingPaneSpec}). */
export const MAX_PANE_REFRACTIVE_INDEX = 5;
/** Upper bound of the accepted thickness [m]. */
export const MAX_PANE_THICKNESS_M = 1;

/**
 * Validates a pane description.
 * @param spec thickness [m], refractive index [-], absorption coefficient [1/m]
 * @returns the same values as a frozen object
 * @throws RangeError naming the quantity when a value is non-finite or out of range
 */
export function checkAbsorbingPane(spec: AbsorbingPaneSpec): AbsorbingPaneSpec {
  const { thicknessM, refractiveIndex, absorptionPerM } = spec;
  if (!Number.isFinite(thicknessM) || thicknessM <= 0 || thicknessM > MAX_PANE_THICKNESS_M) {
    throw new RangeError(`pane thickness must be finite, in (0, ${MAX_PANE_THICKNESS_M}] m; got ${thicknessM}`);
  }
  if (!Number.isFinite(refractiveIndex) || refractiveIndex <= 1 || refractiveIndex > MAX_PANE_REFRACTIVE_INDEX) {
    throw new RangeError(`pane refractive index must be finite, in (1, ${MAX_PANE_REFRACTIVE_INDEX}]; got ${refractiveIndex}`);
  }
  if (!Number.isFinite(absorptionPerM) || absorptionPerM < 0) {
    throw new RangeError(`pane absorption coefficient must be finite and ≥ 0 1/m; got ${absorptionPerM}`);
  }
  return Object.freeze({ thicknessM, refractiveIndex, absorptionPerM });
}

/**
 * Incoherent multiple-reflection series of a slab with two identical faces:
 *   T = (1 − ρ)² τ / (1 − ρ²τ²),  R = ρ + ρ(1 − ρ)² τ² / (1 − ρ²τ²),  A = (1 − ρ)(1 − τ)/(1 − ρτ)
 * With ρ = 1 (grazing incidence) the slab reflects everything: T = A = 0, R = 1.
 * @param faceReflectance ρ, reflectance of one face [-], in [0, 1]
 * @param internalTransmittance τ, one-pass internal transmittance [-], in [0, 1]
 * @returns T, R (either side), A [-]
 * @throws RangeError when an input is outside [0, 1] or not finite
 * @see Duffie & Beckman, Solar Engineering of Thermal Processes, 4th ed., ch. 5 (from memory);
 *   Rubin, Int. J. Energy Research 6:123–133, 1982
 */
export function slabFromFaceReflectance(faceReflectance: number, internalTransmittance: number): SlabOptics {
  if (!(faceReflectance >= 0 && faceReflectance <= 1)) {
    throw new RangeError(`face reflectance must be in [0, 1]; got ${faceReflectance}`);
  }
  if (!(internalTransmittance >= 0 && internalTransmittance <= 1)) {
    throw new RangeError(`internal transmittance must be in [0, 1]; got ${internalTransmittance}`);
  }
  return slabSeries(faceReflectance, internalTransmittance);
}

function slabSeries(rho: number, tau: number): SlabOptics {
  if (rho >= 1) return { T: 0, R: 1, A: 0 };
  const oneMinusRho = 1 - rho;
  const rt = rho * tau;
  const denom = (1 - rt) * (1 + rt); // 1 − ρ²τ² > 0 since ρ < 1
  const T = (oneMinusRho * oneMinusRho * tau) / denom;
  const R = rho + (rho * oneMinusRho * oneMinusRho * tau * tau) / denom;
  const A = (oneMinusRho * (1 - tau)) / (1 - rt);
  return { T, R, A };
}

/**
 * Optics of an uncoated absorbing pane at one angle of incidence, per polarisation (see the
 * module comment for the formulas).
 * @param spec thickness [m], refractive index [-], absorption coefficient [1/m]
 * @param thetaRad angle of incidence in air [rad], in [0, π/2]
 * @returns T, R (same from both sides), A for s, p and unpolarised [-]; cos θt; τ
 * @throws RangeError naming the quantity for invalid input
 * @see Duffie & Beckman, 4th ed., ch. 5 (from memory); Rubin 1982
 */
export function absorbingPaneOptics(spec: AbsorbingPaneSpec, thetaRad: Radians): AbsorbingPaneOptics {
  const pane = checkAbsorbingPane(spec);
  checkIncidenceAngleRad(thetaRad);
  return absorbingPaneOpticsUnchecked(pane, thetaRad);
}

/**
 * {@link absorbingPaneOptics} without input checks, for callers that validated once.
 * @param pane a value returned by {@link checkAbsorbingPane}
 * @param thetaRad angle of incidence in air [rad], in [0, π/2]
 */
export function absorbingPaneOpticsUnchecked(pane: AbsorbingPaneSpec, thetaRad: Radians): AbsorbingPaneOptics {
  const face = fresnelReflectancesReal(1, pane.refractiveIndex, thetaRad);
  // cos θt ≥ sqrt(1 − 1/n²) > 0 because n > 1, so the path length d / cos θt stays finite.
  const tau = Math.exp((-pane.absorptionPerM * pane.thicknessM) / face.cosThetaT);
  const s = slabSeries(face.Rs, tau);
  const p = slabSeries(face.Rp, tau);
  return {
    s,
    p,
    T: 0.5 * (s.T + p.T),
    R: 0.5 * (s.R + p.R),
    A: 0.5 * (s.A + p.A),
    cosThetaT: face.cosThetaT,
    internalTransmittance: tau,
  };
}
