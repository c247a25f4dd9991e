/**
 * External shading devices of a rectangular window (horizontal overhang, vertical side fins,
 * uniform horizon obstruction): their specifications, construction checks and the normalised
 * geometry shared by the beam and diffuse models of this folder.
 *
 * Geometry, in the surface frame (see ../surface-geometry.ts): u along the width (horizontal, to the
 * right of a person outside facing the surface), v up the slope, n the outward normal. The
 * window is the rectangle [0, W] × [0, H] in the plane n = 0. "Left" and "right" are as seen from
 * outside. Devices are thin opaque plates perpendicular to the surface:
 * - overhang: the plate v = H + G, 0 ≤ n ≤ P, −E_l ≤ u ≤ W + E_r (G = gap between window head
 *   and the overhang's underside; E_l, E_r = extension past each jamb, infinite when omitted);
 * - fins (both jambs, same depth): the plates u = −E and u = W + E, 0 ≤ n ≤ F,
 *   −B ≤ v ≤ H + A (E = gap between jamb and fin; A, B = extension above the head and below the
 *   sill, infinite when omitted).
 * On a vertical surface these are the usual horizontal overhang and vertical fins; on a tilted
 * surface they tilt with it.
 */

/** Horizontal overhang above the window. */
export interface OverhangSpec {
  /** Projection P perpendicular to the surface [m], ≥ 0. */
  readonly depthM: number;
  /** Gap G between the window head and the overhang's underside [m], ≥ 0; default 0. */
  readonly gapAboveHeadM?: number;
  /** Extension E_l past the left jamb [m], ≥ 0; omitted or Infinity = infinitely long. */
  readonly extendLeftM?: number;
  /** Extension E_r past the right jamb [m], ≥ 0; omitted or Infinity = infinitely long. */
  readonly extendRightM?: number;
}

/** Vertical fins on both jambs (same depth and gap on both sides). */
export interface FinsSpec {
  /** Depth F perpendicular to the surface [m], ≥ 0. */
  readonly depthM: number;
  /** Gap E between each jamb and its fin [m], ≥ 0; default 0 (flush). */
  readonly gapFromJambM?: number;
  /** Extension above the window head [m], ≥ 0; omitted or Infinity = infinitely tall. */
  readonly extendAboveM?: number;
  /** Extension below the sill [m], ≥ 0; omitted or Infinity = infinitely tall. */
  readonly extendBelowM?: number;
}

/** Window, devices and horizon of one surface. */
export interface ShadingSpec {
  /** Window width W along u [m], > 0. */
  readonly windowWidthM: number;
  /** Window height H along v (up the slope) [m], > 0. */
  readonly windowHeightM: number;
  /** Surface tilt β [rad], 0…π (π/2 = vertical); needed for the horizon test and the diffuse factors. */
  readonly surfaceTiltRad: number;
  readonly overhang?: OverhangSpec;
  readonly fins?: FinsSpec;
  /** Uniform horizon obstruction elevation h [rad], in [0, π/2); sun below it → no beam. Default 0. */
  readonly horizonAngleRad?: number;
  /** Gauss–Legendre points per window axis for the diffuse factors, 2…64; default 16. */
  readonly diffuseQuadraturePoints?: number;
}

/** Diffuse reduction factors of a surface (1 = no reduction). */
export interface DiffuseShadingFactors {
  /** Multiplies the isotropic sky diffuse (Liu–Jordan; the isotropic parts of Hay–Davies and Perez). */
  readonly skyIsotropic: number;
  /** Multiplies the Perez horizon-band term. */
  readonly horizonBand: number;
  /** Multiplies the ground-reflected irradiance. */
  readonly ground: number;
}

/** Default Gauss–Legendre points per window axis for the diffuse factors. */
export const DEFAULT_DIFFUSE_QUADRATURE_POINTS = 16;

/**
 * Checks a length: finite and ≥ 0 (or > 0 when `positive`).
 * @param x length [m]; @param quantity name used in the error message
 * @throws RangeError naming the quantity
 */
export function checkLength(x: number, quantity: string, positive = false): number {
  if (!Number.isFinite(x) || x < 0 || (positive && x === 0)) {
    throw new RangeError(`${quantity} must be a finite length ${positive ? "> 0" : "≥ 0"} m; got ${x}`);
  }
  return x;
}

/**
 * Checks an extension past a window edge: ≥ 0, or omitted / Infinity for infinitely long.
 * @param x extension [m] or undefined; @param quantity name used in the error message
 * @returns the extension [m], Infinity when omitted
 * @throws RangeError naming the quantity
 */
export function checkExtension(x: number | undefined, quantity: string): number {
  if (x === undefined || x === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (Number.isNaN(x) || x < 0) throw new RangeError(`${quantity} must be ≥ 0 m, or omitted/Infinity for infinitely long; got ${x}`);
  return x;
}

/** Checked, normalised geometry (infinite extents as Infinity). */
export interface ShadingGeometry {
  readonly w: number;
  readonly h: number;
  readonly cb: number;
  readonly sb: number;
  /** Overhang depth P (0 = none), gap G, underside level V0 = H + G, extensions. */
  readonly p: number;
  readonly g: number;
  readonly v0: number;
  readonly el: number;
  readonly er: number;
  /** Fin depth F (0 = none), gap E, bottom and top v of the fins. */
  readonly f: number;
  readonly e: number;
  readonly vb: number;
  readonly vt: number;
  readonly sinHorizon: number;
}
