/**
 * External shading of a rectangular window by a horizontal overhang and vertical side fins,
 * plus a uniform horizon obstruction: the sunlit fraction of the window for the beam (per hour)
 * and reduction factors for the diffuse components (once per surface).
 *
 * Geometry, in the surface frame (see surface-geometry.ts): u along the width (horizontal, to the
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
 *
 * BEAM. With the sun unit vector s = (s_u, s_v, s_n) in the surface frame and s_n > 0, a point
 * at depth d in front of the surface casts its shadow displaced by d·k on the surface plane,
 * k = (−s_u/s_n, −s_v/s_n). For a vertical façade −k_v = tan α / cos γ = tan Ω (profile angle)
 * and |k_u| = |tan γ| (γ = horizontal shadow angle), which gives the textbook rules:
 *   overhang band h_s = clamp(P tan Ω − G, 0, H),  fin strip w_s = clamp(F |tan γ| − E, 0, W),
 *   infinite devices: f_sunlit = (W − w_s)(H − h_s)/(W H).
 * Finite devices: the shadow of each plate is a parallelogram, spanned by its edge on the wall
 * and the offset (depth)·k. All three plates' shadows are bounded by lines of only three
 * directions: horizontal (u), up-slope (v) and k. So each shadow, clipped to the window, is an
 * axis-aligned box intersected with a slab w_lo ≤ w ≤ w_hi of the oblique coordinate
 * w = k_v·u − k_u·v, and so is the intersection of two shadows. The union area follows exactly
 * by inclusion–exclusion, A(O ∪ F) = A(O) + A(F) − A(O ∩ F) (only the fin on the sun's side can
 * shade), and each "box ∩ slab" area is computed in closed form from integrals of clamped
 * linear functions. No polygon clipping, no allocation, no trig per call. Cost in our
 * measurement (Node 20): ≈ 12 ns per call with infinite devices, ≈ 90 ns with finite ones.
 * The beam reaches the window only if s_n > 0 (sun in front) and the sun's elevation exceeds
 * the horizon obstruction angle (sin α = s_n cos β + s_v sin β > sin h); otherwise 0.
 *
 * DIFFUSE (once per surface; devices treated as black, i.e. light reflected by the devices
 * themselves is neglected — a simplification, common practice). Factors relative to the
 * unobstructed surface:
 * - skyIsotropic: window-averaged view factor to the sky dome with the devices, divided by the
 *   unobstructed (1 + cos β)/2. Exact view factors of a point to the visible sky, by Nusselt's
 *   unit-sphere method (view factor = projected area on the base plane / π) integrated in polar
 *   coordinates of the base disc in closed form; each device and the horizon bound the visible
 *   radius by r² = 1/(1 + k² sin² φ) or 1/(1 + k² cos² φ), whose φ-integrals are elementary.
 *   The average over the window is a Gauss–Legendre product rule (default 16 × 16 points),
 *   taken piecewise in v between the levels where the horizontal plane through a point passes a
 *   device's outer corner (kinks or jumps of the point functions there): a numerical
 *   approximation of the exact area integral, checked against the crossed-string (2-D) and
 *   perpendicular-rectangle (3-D) closed forms in the tests (≤ 1e-5; 16 and 64 points agree to
 *   1e-6). Cost ≈ 2 ms per surface, computed on first use of `diffuse`.
 * - ground: the same for the view of the ground, unobstructed (1 − cos β)/2. Fins block part of
 *   it; an overhang on a surface tilted ≤ 90° never sees the ground (computed, not assumed).
 * - horizonBand: for the Perez horizon-brightening term, which models a thin band at the
 *   horizon weighted by sin β: the window average of (1/2)∫ cos ψ dψ over the horizontal
 *   directions ψ (relative to the normal's azimuth) not blocked by a device; exact per point
 *   (each plate cuts the horizontal plane through the point in a segment), Gauss–Legendre over
 *   the window.
 * - circumsolar (Hay–Davies, Perez): use the beam sunlit fraction of the same hour (the
 *   circumsolar region is treated as coming from the sun's direction; common practice).
 * The horizon obstruction angle acts on the beam (and hence the circumsolar part) only; its
 * effect on the isotropic, horizon-band and ground parts is NOT modelled here.
 *
 * @see ASHRAE Handbook—Fundamentals, fenestration chapter (overhang/fin shadow geometry, profile
 *   angle; from memory)
 * @see W. Nusselt, "Graphische Bestimmung des Winkelverhältnisses bei der Wärmestrahlung",
 *   VDI-Zeitschrift 72:673, 1928 (unit-sphere method; from memory)
 * @see H. C. Hottel & A. F. Sarofim, Radiative Transfer, McGraw-Hill, 1967 (crossed strings;
 *   view-factor algebra; from memory)
 * @see F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and Mass Transfer, Table 13.2
 *   (perpendicular rectangles with a common edge; from memory)
 */
import { gaussLegendre } from "./hemispherical";
import {
  sunAlongNormal,
  sunAlongWidth,
  sunUpSlope,
  sunVectorEnu,
  surfaceFrame,
  type SurfaceOrientation,
} from "./surface-geometry";
import type { Radians } from "./units";

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

const HALF_PI = Math.PI / 2;
/** Stand-in for "infinitely long" in the horizon-band geometry only [m] (angles err ~1e-9 rad). */
const FAR_M = 1e9;

function checkLength(x: number, quantity: string, positive = false): number {
  if (!Number.isFinite(x) || x < 0 || (positive && x === 0)) {
    throw new RangeError(`${quantity} must be a finite length ${positive ? "> 0" : "≥ 0"} m; got ${x}`);
  }
  return x;
}

function checkExtension(x: number | undefined, quantity: string): number {
  if (x === undefined || x === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  if (Number.isNaN(x) || x < 0) throw new RangeError(`${quantity} must be ≥ 0 m, or omitted/Infinity for infinitely long; got ${x}`);
  return x;
}

// ---------------------------------------------------------------------------------------------
// §11 scalar forms (vertical façade, infinite devices): for tests and documentation

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
    throw new RangeError(`profile angle needs the sun in front of the façade: altitude in (0, π/2) and |γ| < π/2; got α=${sunAltitudeRad}, γ=${shadowAngleRad}`);
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

// ---------------------------------------------------------------------------------------------
// Exact areas of "box ∩ half-plane" and "box ∩ slab"

/**
 * Scratch buffers of the finite-device path, module-level and reused so that the hot path
 * allocates nothing. V8 boxes every double passed to or returned from a function it does not
 * inline; passing the numbers through typed arrays avoids most of that (about 2× faster in our
 * measurement).
 * - FIN_IN: k_u, k_v, h_s, w_s of the current call.
 * - REGIONS: up to 3 regions (overhang shadow, fin shadow, their intersection), each an
 *   axis-aligned box [u0, u1] × [v0, v1] cut to the slab w_lo ≤ k_v·u − k_u·v ≤ w_hi, stored as
 *   (u0, u1, v0, v1, w_lo, w_hi).
 */
const FIN_IN = new Float64Array(4);
const REGIONS = new Float64Array(18);

/** Layout of the per-window parameter array used by {@link finiteSunlitFraction}. */
const P_W = 0;
const P_H = 1;
const P_EL = 2;
const P_ER = 3;
const P_V0 = 4;
const P_E = 5;
const P_VB = 6;
const P_VT = 7;
const P_INV_AREA = 8;
const P_COUNT = 9;

/**
 * Sunlit fraction with finite devices, exactly: 1 − [A(O) + A(F) − A(O ∩ F)]/(W H), each area
 * that of an axis-aligned box ∩ a slab of w = a u + b v (a = k_v, b = −k_u). The area of a box ∩
 * half-plane {a u + b v ≤ c}: reflect the box so that a, b ≥ 0; with w_min the smallest w on the
 * box, integrate the clamped chord length along the axis of the larger coefficient,
 *   a ≥ b: ∫_0^{Lv} clamp((c − w_min − b y)/a, 0, Lu) dy   (else the roles of u and v swap),
 * so the chord slope is ≤ 1 and no difference of large numbers occurs. The integral of a clamped
 * linear function is elementary: (L/|g1 − g0|)·∫_lo^hi clamp(x, 0, M) dx. A slab is the
 * difference of two half-planes; a slab covering the whole box gives the box area, one missing
 * it gives 0. Inputs in FIN_IN and `params`; hot path: no allocation, no checks.
 */
function finiteSunlitFraction(params: Float64Array): number {
  const ku = FIN_IN[0]!;
  const kv = FIN_IN[1]!;
  const hs = FIN_IN[2]!;
  const ws = FIN_IN[3]!;
  const w = params[P_W]!;
  const h = params[P_H]!;
  const R = REGIONS;
  let count = 0;
  let oLo = 0;
  let oHi = 0;
  if (hs > 0) {
    const v0 = params[P_V0]!;
    oLo = (w + params[P_ER]!) * kv - v0 * ku;
    oHi = -params[P_EL]! * kv - v0 * ku;
    R[0] = 0;
    R[1] = w;
    R[2] = h - hs;
    R[3] = h;
    R[4] = oLo;
    R[5] = oHi;
    count = 1;
  }
  let signs = 0;
  if (ws > 0) {
    const e = params[P_E]!;
    const vb = params[P_VB]!;
    const vt = params[P_VT]!;
    let fu0: number;
    let fu1: number;
    let fLo: number;
    let fHi: number;
    if (ku > 0) {
      // left fin at u = −E; w decreases with v along it
      fu0 = 0;
      fu1 = ws;
      const base = -e * kv;
      fLo = base - vt * ku;
      fHi = base - vb * ku;
    } else {
      // right fin at u = W + E; w increases with v along it
      fu0 = w - ws;
      fu1 = w;
      const base = (w + e) * kv;
      fLo = base - vb * ku;
      fHi = base - vt * ku;
    }
    let o = 6 * count;
    R[o] = fu0;
    R[o + 1] = fu1;
    R[o + 2] = 0;
    R[o + 3] = h;
    R[o + 4] = fLo;
    R[o + 5] = fHi;
    count++;
    if (hs > 0) {
      // the intersection of the two shadows: box ∩ box, slab ∩ slab; subtracted (sign bit 2)
      o = 12;
      R[o] = fu0;
      R[o + 1] = fu1;
      R[o + 2] = h - hs;
      R[o + 3] = h;
      R[o + 4] = oLo > fLo ? oLo : fLo;
      R[o + 5] = oHi < fHi ? oHi : fHi;
      count = 3;
      signs = 4;
    }
  }
  // Σ ± area(box_r ∩ slab_r)
  const a0 = kv;
  const b0 = -ku;
  const a = a0 < 0 ? -a0 : a0;
  const b = b0 < 0 ? -b0 : b0;
  const alongU = a >= b;
  const inv = 1 / (alongU ? a : b);
  let total = 0;
  for (let r = 0; r < count; r++) {
    const o = 6 * r;
    const u0 = R[o]!;
    const u1 = R[o + 1]!;
    const v0 = R[o + 2]!;
    const v1 = R[o + 3]!;
    const wLo = R[o + 4]!;
    const wHi = R[o + 5]!;
    if (!(u1 > u0) || !(v1 > v0) || !(wHi > wLo)) continue;
    const lu = u1 - u0;
    const lv = v1 - v0;
    const wMin = a0 * (a0 < 0 ? u1 : u0) + b0 * (b0 < 0 ? v1 : v0);
    const wMax = wMin + a * lu + b * lv;
    if (wHi <= wMin || wLo >= wMax) continue;
    let area = 0;
    if (wLo <= wMin && wHi >= wMax) area = lu * lv;
    else {
      const len = alongU ? lv : lu;
      const m = alongU ? lu : lv;
      const drop = (alongU ? b : a) * len * inv;
      for (let k = 0; k < 2; k++) {
        const c = k === 0 ? wHi : wLo;
        let part: number;
        if (k === 0 && c >= wMax) part = lu * lv;
        else if (k === 1 && c <= wMin) part = 0;
        else {
          // ∫_0^len clamp(g, 0, m) for g linear from g0 = hi down to hi − drop
          const hi = (c - wMin) * inv;
          const lo = hi - drop;
          if (hi <= 0) part = 0;
          else if (lo >= m) part = len * m;
          else if (drop === 0) part = len * hi;
          else {
            const x0 = lo > 0 ? lo : 0;
            const x1 = hi < m ? hi : m;
            let sum = (x1 * x1 - x0 * x0) / 2;
            if (hi > m) sum += m * (hi - m);
            part = (len * sum) / drop;
          }
        }
        area += k === 0 ? part : -part;
      }
    }
    if (area > 0) total += (signs >> r) & 1 ? -area : area;
  }
  const frac = 1 - total * params[P_INV_AREA]!;
  return frac < 0 ? 0 : frac > 1 ? 1 : frac;
}

// ---------------------------------------------------------------------------------------------
// Prepared shading

/** Checked, normalised geometry (infinite extents as Infinity). */
interface Geometry {
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

/** Prepared shading of one window (compute once per surface; see the module comment). */
export class PreparedShading {
  // Fields are `declare`d and assigned only in the constructor: with define-semantics class
  // fields they would start as `undefined`, and V8 would then keep every number boxed, which made
  // the hot path ~3× slower in our measurement.
  /** The spec as given (checked at construction; later changes to it are not seen). */
  declare readonly spec: ShadingSpec;
  // Flat numeric fields for the hot path (one hidden class, no nested lookups).
  declare private readonly w: number;
  declare private readonly h: number;
  declare private readonly cb: number;
  declare private readonly sb: number;
  declare private readonly sinHorizon: number;
  declare private readonly p: number;
  declare private readonly g: number;
  declare private readonly f: number;
  declare private readonly e: number;
  declare private readonly invArea: number;
  declare private readonly params: Float64Array;
  declare private readonly noDevices: boolean;
  declare private readonly allInfinite: boolean;
  declare private readonly geo: Geometry;
  declare private readonly quadraturePoints: number;
  declare private diffuseCache: DiffuseShadingFactors | undefined;

  constructor(spec: ShadingSpec) {
    const w = checkLength(spec.windowWidthM, "window width", true);
    const h = checkLength(spec.windowHeightM, "window height", true);
    const tilt = spec.surfaceTiltRad;
    if (!Number.isFinite(tilt) || tilt < 0 || tilt > Math.PI) {
      throw new RangeError(`surface tilt must be a finite angle in [0, π] rad; got ${tilt}`);
    }
    const horizon = spec.horizonAngleRad ?? 0;
    if (!Number.isFinite(horizon) || horizon < 0 || horizon >= HALF_PI) {
      throw new RangeError(`horizon angle must be a finite angle in [0, π/2) rad; got ${horizon}`);
    }
    const n = spec.diffuseQuadraturePoints ?? DEFAULT_DIFFUSE_QUADRATURE_POINTS;
    if (!Number.isInteger(n) || n < 2 || n > 64) {
      throw new RangeError(`diffuse quadrature points must be an integer in [2, 64]; got ${n}`);
    }
    const o = spec.overhang;
    const p = o ? checkLength(o.depthM, "overhang depth") : 0;
    const g = o ? checkLength(o.gapAboveHeadM ?? 0, "overhang gap above the window head") : 0;
    const el = o ? checkExtension(o.extendLeftM, "overhang extension past the left jamb") : Number.POSITIVE_INFINITY;
    const er = o ? checkExtension(o.extendRightM, "overhang extension past the right jamb") : Number.POSITIVE_INFINITY;
    const fs = spec.fins;
    const f = fs ? checkLength(fs.depthM, "fin depth") : 0;
    const e = fs ? checkLength(fs.gapFromJambM ?? 0, "fin gap from the jamb") : 0;
    const above = fs ? checkExtension(fs.extendAboveM, "fin extension above the window head") : Number.POSITIVE_INFINITY;
    const below = fs ? checkExtension(fs.extendBelowM, "fin extension below the sill") : Number.POSITIVE_INFINITY;
    let cb = Math.cos(tilt);
    let sb = Math.sin(tilt);
    if (Math.abs(cb) < 1e-15) cb = 0;
    if (Math.abs(sb) < 1e-15) sb = 0;
    if (Math.abs(1 - sb) < 1e-15) sb = 1;
    this.spec = spec;
    this.w = w;
    this.h = h;
    this.cb = cb;
    this.sb = sb;
    this.sinHorizon = horizon === 0 ? 0 : Math.sin(horizon);
    this.p = p;
    this.g = g;
    this.f = f;
    this.e = e;
    this.invArea = 1 / (w * h);
    this.noDevices = p === 0 && f === 0;
    this.allInfinite =
      el === Number.POSITIVE_INFINITY &&
      er === Number.POSITIVE_INFINITY &&
      below === Number.POSITIVE_INFINITY &&
      above === Number.POSITIVE_INFINITY;
    const params = new Float64Array(P_COUNT);
    params[P_W] = w;
    params[P_H] = h;
    params[P_EL] = el;
    params[P_ER] = er;
    params[P_V0] = h + g;
    params[P_E] = e;
    params[P_VB] = -below;
    params[P_VT] = h + above;
    params[P_INV_AREA] = 1 / (w * h);
    this.params = params;
    this.geo = { w, h, cb, sb, p, g, v0: h + g, el, er, f, e, vb: -below, vt: h + above, sinHorizon: this.sinHorizon };
    this.quadraturePoints = n;
    this.diffuseCache = undefined;
  }

  /**
   * Sunlit fraction of the window for the beam, f ∈ [0, 1] (exact; method in the module comment).
   * Hot path: no trig, no allocation, no checks (NaN input gives 0).
   * @param sn sun unit-vector component along the outward normal n (= cos θ) [-]
   * @param su component along u (the width, to the right seen from outside) [-]
   * @param sv component along v (up the slope) [-]
   * @returns 0 when the sun is behind the surface (sn ≤ 0) or at/below the horizon obstruction
   */
  sunlitFraction(sn: number, su: number, sv: number): number {
    if (!(sn > 0)) return 0;
    if (!(sn * this.cb + sv * this.sb > this.sinHorizon)) return 0;
    if (this.noDevices) return 1;
    const ku = -su / sn;
    const kv = -sv / sn;
    const w = this.w;
    const h = this.h;
    // Overhang: shaded band at the top, as for an infinitely long overhang (an upper bound).
    let hs = 0;
    if (this.p > 0 && kv < 0) {
      hs = -this.p * kv - this.g;
      hs = hs < 0 ? 0 : hs > h ? h : hs;
    }
    // Fin on the sun's side: shaded strip along that jamb, as for an infinitely tall fin.
    let ws = 0;
    if (this.f > 0) {
      ws = (ku > 0 ? this.f * ku : -this.f * ku) - this.e;
      ws = ws < 0 ? 0 : ws > w ? w : ws;
    }
    if (hs === 0 && ws === 0) return 1;
    if (this.allInfinite) return (w - ws) * (h - hs) * this.invArea;
    FIN_IN[0] = ku;
    FIN_IN[1] = kv;
    FIN_IN[2] = hs;
    FIN_IN[3] = ws;
    return finiteSunlitFraction(this.params);
  }

  /**
   * View factors of one window point to the visible sky and to the visible ground with the
   * devices (exact; for tests and documentation; the window averages are in {@link diffuse}).
   * @param uM, vM point on the window [m], inside (0, W) × (0, H)
   * @returns { sky, ground } view factors [-] (unobstructed: (1 ± cos β)/2)
   * @throws RangeError naming "window point" when the point is not inside the window
   */
  pointViewFactors(uM: number, vM: number): { readonly sky: number; readonly ground: number } {
    const geo = this.geo;
    if (!(uM > 0 && uM < geo.w && vM > 0 && vM < geo.h)) {
      throw new RangeError(`window point must lie inside (0, W) × (0, H); got (${uM}, ${vM})`);
    }
    const out = new Float64Array(2);
    pointViewFactors(geo, uM, vM, out, new Float64Array(48), newBlockers());
    return { sky: out[0]!, ground: out[1]! };
  }

  /**
   * Horizon-band visibility of one window point: (1/2)∫ cos ψ dψ over the horizontal directions
   * ψ ∈ [−π/2, π/2] (from the normal's azimuth) that no device blocks (exact; for tests and
   * documentation). 1 when sin β = 0 (the band has no weight then).
   * @param uM, vM point on the window [m], inside (0, W) × (0, H)
   * @throws RangeError naming "window point" when the point is not inside the window
   */
  pointHorizonBand(uM: number, vM: number): number {
    const geo = this.geo;
    if (!(uM > 0 && uM < geo.w && vM > 0 && vM < geo.h)) {
      throw new RangeError(`window point must lie inside (0, W) × (0, H); got (${uM}, ${vM})`);
    }
    if (!(geo.sb > 0) || this.noDevices) return 1;
    return pointHorizonBand(geo, uM, vM, new Float64Array(12), new Float64Array(3), new Float64Array(3));
  }

  /** Diffuse reduction factors (computed on first use, then cached). */
  get diffuse(): DiffuseShadingFactors {
    if (this.diffuseCache === undefined) this.diffuseCache = computeDiffuseFactors(this.geo, this.quadraturePoints, this.noDevices);
    return this.diffuseCache;
  }
}

/**
 * Prepares the shading of one window: checks the spec (RangeError naming the quantity) and
 * returns an object whose `sunlitFraction(sn, su, sv)` is the per-hour hot path and whose
 * `diffuse` holds the per-surface diffuse factors.
 */
export function prepareShading(spec: ShadingSpec): PreparedShading {
  return new PreparedShading(spec);
}

/**
 * Sunlit fraction from sun angles (scalar form, for tests and documentation): builds the sun
 * vector and the surface frame, then calls the hot path.
 * @param shading prepared shading; @param surface orientation of the surface (its tilt must match the spec)
 * @param sunAltitudeRad α [rad]; @param sunAzimuthRad γ, clockwise from north [rad]
 * @throws RangeError naming the quantity for bad angles or a tilt that differs from the spec
 */
export function sunlitFractionAt(
  shading: PreparedShading,
  surface: SurfaceOrientation,
  sunAltitudeRad: number,
  sunAzimuthRad: number,
): number {
  if (Math.abs(surface.tiltRad - shading.spec.surfaceTiltRad) > 1e-12) {
    throw new RangeError(`surface tilt ${surface.tiltRad} rad differs from the shading spec's ${shading.spec.surfaceTiltRad} rad`);
  }
  const s = sunVectorEnu(sunAltitudeRad, sunAzimuthRad);
  const frame = surfaceFrame(surface);
  return shading.sunlitFraction(
    sunAlongNormal(frame, s.east, s.north, s.up),
    sunAlongWidth(frame, s.east, s.north),
    sunUpSlope(frame, s.east, s.north, s.up),
  );
}

// ---------------------------------------------------------------------------------------------
// Diffuse: exact point view factors, Gauss–Legendre over the window

/** Radius-squared bound forms on the base disc, as functions of the polar angle φ. */
const ZERO = 0;
const ONE = 1;
/** r² = 1/(1 + k² sin² φ) */
const SIN_FORM = 2;
/** r² = 1/(1 + k² cos² φ) */
const COS_FORM = 3;

function formValue(kind: number, k: number, s: number, c: number): number {
  if (kind === ZERO) return 0;
  if (kind === ONE) return 1;
  if (kind === SIN_FORM) return 1 / (1 + k * k * s * s);
  return 1 / (1 + k * k * c * c);
}

/**
 * ∫_a^b r²(φ) dφ with a, b in the same closed quadrant:
 *   1/(1 + k² sin²φ): (1/m)[atan(m tan φ)]_a^b = (1/m) atan2(m sin(b − a), cos a cos b + m² sin a sin b)
 *   1/(1 + k² cos²φ): (1/m)[atan(tan φ / m)]_a^b = (1/m) atan2(m sin(b − a), m² cos a cos b + sin a sin b)
 * with m = √(1 + k²); the denominators are ≥ 0 within a quadrant, so atan2 picks the right branch.
 */
function formIntegral(kind: number, k: number, a: number, b: number): number {
  if (kind === ZERO) return 0;
  if (kind === ONE) return b - a;
  const m2 = 1 + k * k;
  const m = Math.sqrt(m2);
  const ca = Math.cos(a);
  const sa = Math.sin(a);
  const cbb = Math.cos(b);
  const sbb = Math.sin(b);
  const sd = Math.sin(b - a);
  if (kind === SIN_FORM) return Math.atan2(m * sd, ca * cbb + m2 * sa * sbb) / m;
  return Math.atan2(m * sd, m2 * ca * cbb + sa * sbb) / m;
}

/** One device seen from one window point: radius bound form, active on [phiA, phiB]. */
interface Blocker {
  kind: number;
  k: number;
  phiA: number;
  phiB: number;
}

function newBlockers(): Blocker[] {
  return [0, 1, 2].map(() => ({ kind: ZERO, k: 0, phiA: 0, phiB: 0 }));
}

const PHI_MIN = -HALF_PI;
const PHI_MAX = 3 * HALF_PI;

/**
 * View factors of the point (up, vp) of the window to the visible sky and to the visible ground
 * (devices black). Nusselt: F = (1/2π) ∫ (r_hi² − r_lo²) dφ over the base disc, with r_hi the
 * nearer of the visible-region bound and the devices' bounds. φ is measured in the window plane
 * from u towards v, over [−π/2, 3π/2] so that neither fin's range wraps.
 */
function pointViewFactors(geo: Geometry, up: number, vp: number, out: Float64Array, breaks: Float64Array, blockers: Blocker[]): void {
  const { cb, sb } = geo;
  const tanB = cb === 0 ? Number.POSITIVE_INFINITY : Math.abs(sb / cb);
  let nb = 0;
  let nBlock = 0;
  const addBreak = (x: number): void => {
    if (x > PHI_MIN && x < PHI_MAX) breaks[nb++] = x;
  };
  breaks[nb++] = PHI_MIN;
  breaks[nb++] = 0;
  breaks[nb++] = HALF_PI;
  breaks[nb++] = Math.PI;
  breaks[nb++] = PHI_MAX;
  const crossRatios = (kFin: number): void => {
    // fin (cos form) against the overhang and the horizon bound (sin forms): |tan φ| = k_f / k
    const ks: number[] = [];
    if (geo.p > 0) ks.push(geo.p / (geo.v0 - vp));
    if (Number.isFinite(tanB) && tanB > 0) ks.push(tanB);
    for (const k of ks) {
      const t = Math.atan(kFin / k);
      addBreak(t);
      addBreak(-t);
      addBreak(Math.PI - t);
      addBreak(Math.PI + t);
    }
  };
  if (geo.p > 0) {
    const d = geo.v0 - vp;
    const bl = blockers[nBlock++]!;
    bl.kind = SIN_FORM;
    bl.k = geo.p / d;
    bl.phiA = Math.atan2(d, geo.w + geo.er - up);
    bl.phiB = Math.atan2(d, -geo.el - up);
    addBreak(bl.phiA);
    addBreak(bl.phiB);
  }
  if (geo.f > 0) {
    const dl = up + geo.e;
    const left = blockers[nBlock++]!;
    left.kind = COS_FORM;
    left.k = geo.f / dl;
    left.phiA = Math.PI - Math.atan2(geo.vt - vp, dl);
    left.phiB = Math.PI - Math.atan2(geo.vb - vp, dl);
    addBreak(left.phiA);
    addBreak(left.phiB);
    crossRatios(left.k);
    const dr = geo.w + geo.e - up;
    const right = blockers[nBlock++]!;
    right.kind = COS_FORM;
    right.k = geo.f / dr;
    right.phiA = Math.atan2(geo.vb - vp, dr);
    right.phiB = Math.atan2(geo.vt - vp, dr);
    addBreak(right.phiA);
    addBreak(right.phiB);
    crossRatios(right.k);
  }
  // insertion sort (≤ 30 values)
  for (let i = 1; i < nb; i++) {
    const x = breaks[i]!;
    let j = i - 1;
    while (j >= 0 && breaks[j]! > x) {
      breaks[j + 1] = breaks[j]!;
      j--;
    }
    breaks[j + 1] = x;
  }
  let sky = 0;
  let ground = 0;
  for (let i = 0; i + 1 < nb; i++) {
    const a = breaks[i]!;
    const b = breaks[i + 1]!;
    if (!(b - a > 1e-15)) continue;
    const mid = (a + b) / 2;
    const s = Math.sin(mid);
    const c = Math.cos(mid);
    // nearest device bound on this piece
    let bKind = ONE;
    let bK = 0;
    let bVal = 1;
    for (let j = 0; j < nBlock; j++) {
      const bl = blockers[j]!;
      if (mid < bl.phiA || mid > bl.phiB) continue;
      const v = formValue(bl.kind, bl.k, s, c);
      if (v < bVal) {
        bVal = v;
        bKind = bl.kind;
        bK = bl.k;
      }
    }
    // visible regions without devices: sky [skyLo, skyHi], ground [gLo, gHi] (kinds, k = tan β)
    let skyLo = ZERO;
    let skyHi = ONE;
    let gLo = ZERO;
    let gHi = ZERO;
    if (cb > 0) {
      if (s < 0) {
        skyHi = SIN_FORM;
        gLo = SIN_FORM;
        gHi = ONE;
      }
    } else if (cb === 0) {
      if (s < 0) {
        skyHi = ZERO;
        gHi = ONE;
      }
    } else if (s > 0) {
      skyLo = SIN_FORM;
      gHi = SIN_FORM;
    } else {
      skyHi = ZERO;
      gHi = ONE;
    }
    sky += visibleIntegral(skyLo, skyHi, tanB, bKind, bK, bVal, a, b, s, c);
    ground += visibleIntegral(gLo, gHi, tanB, bKind, bK, bVal, a, b, s, c);
  }
  out[0] = sky / (2 * Math.PI);
  out[1] = ground / (2 * Math.PI);
}

/** ∫ (min(hi, device) − lo)⁺ dφ over one piece, choosing the active forms at the midpoint. */
function visibleIntegral(
  loKind: number,
  hiKind: number,
  tanB: number,
  bKind: number,
  bK: number,
  bVal: number,
  a: number,
  b: number,
  s: number,
  c: number,
): number {
  if (hiKind === ZERO) return 0;
  const hiVal = formValue(hiKind, tanB, s, c);
  let upKind = hiKind;
  let upK = tanB;
  let upVal = hiVal;
  if (bVal < hiVal) {
    upKind = bKind;
    upK = bK;
    upVal = bVal;
  }
  const loVal = formValue(loKind, tanB, s, c);
  if (!(upVal > loVal)) return 0;
  return formIntegral(upKind, upK, a, b) - formIntegral(loKind, tanB, a, b);
}

/**
 * Fraction (cos-weighted) of the horizontal directions in front of the surface that no device
 * blocks, seen from the point (up, vp): (1/2) ∫ cos ψ dψ over the visible ψ ∈ [−π/2, π/2].
 * Each plate cuts the horizontal plane through the point in a segment, which blocks the
 * interval of ψ between its end points.
 */
function pointHorizonBand(geo: Geometry, up: number, vp: number, corners: Float64Array, lo: Float64Array, hi: Float64Array): number {
  const { cb, sb } = geo;
  let n = 0;
  const plate = (): void => {
    // corners: 4 × (u, v, n); find where the plate's outline crosses the horizontal plane
    let psiMin = Number.POSITIVE_INFINITY;
    let psiMax = Number.NEGATIVE_INFINITY;
    let hits = 0;
    for (let i = 0; i < 4; i++) {
      const j = (i + 1) % 4;
      const ui = corners[3 * i]!;
      const vi = corners[3 * i + 1]!;
      const ni = corners[3 * i + 2]!;
      const uj = corners[3 * j]!;
      const vj = corners[3 * j + 1]!;
      const nj = corners[3 * j + 2]!;
      const hi0 = (vi - vp) * sb + ni * cb;
      const hj0 = (vj - vp) * sb + nj * cb;
      let pu: number;
      let pv: number;
      let pn: number;
      if (hi0 === 0) {
        pu = ui;
        pv = vi;
        pn = ni;
      } else if ((hi0 < 0 && hj0 > 0) || (hi0 > 0 && hj0 < 0)) {
        const t = hi0 / (hi0 - hj0);
        pu = ui + t * (uj - ui);
        pv = vi + t * (vj - vi);
        pn = ni + t * (nj - ni);
      } else continue;
      const psi = Math.atan2(-(pu - up), -cb * (pv - vp) + sb * pn);
      if (psi < psiMin) psiMin = psi;
      if (psi > psiMax) psiMax = psi;
      hits++;
    }
    if (hits >= 2 && psiMax > psiMin) {
      lo[n] = Math.max(psiMin, -HALF_PI);
      hi[n] = Math.min(psiMax, HALF_PI);
      n++;
    }
  };
  const setCorners = (
    u0: number, v0: number, n0: number, u1: number, v1: number, n1: number,
    u2: number, v2: number, n2: number, u3: number, v3: number, n3: number,
  ): void => {
    corners[0] = u0; corners[1] = v0; corners[2] = n0;
    corners[3] = u1; corners[4] = v1; corners[5] = n1;
    corners[6] = u2; corners[7] = v2; corners[8] = n2;
    corners[9] = u3; corners[10] = v3; corners[11] = n3;
  };
  const far = (x: number): number => (x === Number.POSITIVE_INFINITY ? FAR_M : x === Number.NEGATIVE_INFINITY ? -FAR_M : x);
  if (geo.p > 0) {
    const ul = -far(geo.el);
    const ur = geo.w + far(geo.er);
    setCorners(ul, geo.v0, 0, ur, geo.v0, 0, ur, geo.v0, geo.p, ul, geo.v0, geo.p);
    plate();
  }
  if (geo.f > 0) {
    const vb = far(geo.vb);
    const vt = far(geo.vt);
    const ul = -geo.e;
    setCorners(ul, vb, 0, ul, vt, 0, ul, vt, geo.f, ul, vb, geo.f);
    plate();
    const ur = geo.w + geo.e;
    setCorners(ur, vb, 0, ur, vt, 0, ur, vt, geo.f, ur, vb, geo.f);
    plate();
  }
  // union of ≤ 3 intervals: sort by start, merge, integrate cos ψ
  for (let i = 1; i < n; i++) {
    const l = lo[i]!;
    const h = hi[i]!;
    let j = i - 1;
    while (j >= 0 && lo[j]! > l) {
      lo[j + 1] = lo[j]!;
      hi[j + 1] = hi[j]!;
      j--;
    }
    lo[j + 1] = l;
    hi[j + 1] = h;
  }
  let blocked = 0;
  let curLo = Number.NaN;
  let curHi = Number.NaN;
  for (let i = 0; i < n; i++) {
    const l = lo[i]!;
    const h = hi[i]!;
    if (i > 0 && l <= curHi) {
      if (h > curHi) curHi = h;
    } else {
      if (i > 0) blocked += Math.sin(curHi) - Math.sin(curLo);
      curLo = l;
      curHi = h;
    }
  }
  if (n > 0) blocked += Math.sin(curHi) - Math.sin(curLo);
  return (2 - blocked) / 2;
}

function computeDiffuseFactors(geo: Geometry, points: number, noDevices: boolean): DiffuseShadingFactors {
  if (noDevices) return Object.freeze({ skyIsotropic: 1, horizonBand: 1, ground: 1 });
  const { x, w: wt } = gaussLegendre(points);
  const out = new Float64Array(2);
  const breaks = new Float64Array(48);
  const blockers = newBlockers();
  const corners = new Float64Array(12);
  const lo = new Float64Array(3);
  const hi = new Float64Array(3);
  // The horizontal plane through a window point passes through a device's outer corner when
  // v = (corner's v) + depth·cos β / sin β. At such levels the point functions have a kink or, for
  // the overhang's outer edge (horizontal) on a surface facing below the horizontal, a jump (horizon
  // band) or the onset of a zero sky view; the v-integral is taken piecewise between those levels
  // so that Gauss–Legendre keeps its fast convergence.
  const vEdges = [0, geo.h];
  if (geo.sb > 0) {
    const cut = (level: number): void => {
      if (level > 0 && level < geo.h) vEdges.push(level);
    };
    if (geo.p > 0) cut(geo.v0 + (geo.p * geo.cb) / geo.sb);
    if (geo.f > 0) {
      cut(geo.vb + (geo.f * geo.cb) / geo.sb);
      cut(geo.vt + (geo.f * geo.cb) / geo.sb);
    }
    vEdges.sort((a, b) => a - b);
  }
  let sky = 0;
  let ground = 0;
  let band = 0;
  for (let k = 0; k + 1 < vEdges.length; k++) {
    const v0 = vEdges[k]!;
    const dv = vEdges[k + 1]! - v0;
    if (!(dv > 0)) continue;
    for (let i = 0; i < points; i++) {
      const up = (geo.w * (x[i]! + 1)) / 2;
      for (let j = 0; j < points; j++) {
        const vp = v0 + (dv * (x[j]! + 1)) / 2;
        const weight = ((wt[i]! * wt[j]!) / 4) * (dv / geo.h);
        pointViewFactors(geo, up, vp, out, breaks, blockers);
        sky += weight * out[0]!;
        ground += weight * out[1]!;
        if (geo.sb > 0) band += weight * pointHorizonBand(geo, up, vp, corners, lo, hi);
      }
    }
  }
  const skyRef = (1 + geo.cb) / 2;
  const groundRef = (1 - geo.cb) / 2;
  const clamp01 = (v: number): number => (v < 0 ? 0 : v > 1 ? 1 : v);
  return Object.freeze({
    skyIsotropic: skyRef > 0 ? clamp01(sky / skyRef) : 1,
    horizonBand: geo.sb > 0 ? clamp01(band) : 1,
    ground: groundRef > 0 ? clamp01(ground / groundRef) : 1,
  });
}
