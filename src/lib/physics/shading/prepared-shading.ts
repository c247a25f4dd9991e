/**
 * Shading of one window prepared for the hourly loop: checks the device specification once,
 * then gives the beam sunlit fraction per hour (infinite devices in closed form, finite ones by
 * beam-finite-devices.ts) and the diffuse reduction factors once per surface
 * (diffuse-view-factors.ts). Geometry and frame: device-specs.ts.
 */
import { sunAlongNormal, sunAlongWidth, sunUpSlope, sunVectorEnu, surfaceFrame, type SurfaceOrientation } from "../surface-geometry";
import { finiteSunlitFraction, FIN_IN, P_COUNT, P_E, P_EL, P_ER, P_H, P_INV_AREA, P_V0, P_VB, P_VT, P_W } from "./beam-finite-devices";
import {
  checkExtension,
  checkLength,
  DEFAULT_DIFFUSE_QUADRATURE_POINTS,
  type DiffuseShadingFactors,
  type ShadingGeometry,
  type ShadingSpec,
} from "./device-specs";
import { computeDiffuseFactors, newBlockers, pointHorizonBand, pointViewFactors } from "./diffuse-view-factors";

const HALF_PI = Math.PI / 2;

/** Prepared shading of one window (compute once per surface; models: beam-finite-devices.ts, diffuse-view-factors.ts). */
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
  declare private readonly geo: ShadingGeometry;
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
      el === Number.POSITIVE_INFINITY && er === Number.POSITIVE_INFINITY && below === Number.POSITIVE_INFINITY && above === Number.POSITIVE_INFINITY;
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
   * Sunlit fraction of the window for the beam, f ∈ [0, 1] (exact; method in beam-finite-devices.ts).
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
export function sunlitFractionAt(shading: PreparedShading, surface: SurfaceOrientation, sunAltitudeRad: number, sunAzimuthRad: number): number {
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
