/**
 * Diffuse reduction factors of a window's shading devices: window-averaged view factors to the
 * sky and the ground, and the horizon-band visibility, relative to the unobstructed surface
 * (geometry and frame: device-specs.ts).
 *
 * Diffuse light (once per surface; devices treated as black, i.e. light reflected by the devices
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
 * @see W. Nusselt, "Graphische Bestimmung des Winkelverhältnisses bei der Wärmestrahlung",
 *   VDI-Zeitschrift 72:673, 1928 (unit-sphere method; from memory)
 * @see H. C. Hottel & A. F. Sarofim, Radiative Transfer, McGraw-Hill, 1967 (crossed strings;
 *   view-factor algebra; from memory)
 * @see F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and Mass Transfer, Table 13.2
 *   (perpendicular rectangles with a common edge; from memory)
 */
import { gaussLegendre } from "../quadrature";
import type { DiffuseShadingFactors, ShadingGeometry } from "./device-specs";

const HALF_PI = Math.PI / 2;
/** Stand-in for "infinitely long" in the horizon-band geometry only [m] (angles err ~1e-9 rad). */
const FAR_M = 1e9;

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
export interface Blocker {
  kind: number;
  k: number;
  phiA: number;
  phiB: number;
}

export function newBlockers(): Blocker[] {
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
export function pointViewFactors(geo: ShadingGeometry, up: number, vp: number, out: Float64Array, breaks: Float64Array, blockers: Blocker[]): void {
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
export function pointHorizonBand(geo: ShadingGeometry, up: number, vp: number, corners: Float64Array, lo: Float64Array, hi: Float64Array): number {
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
    u0: number,
    v0: number,
    n0: number,
    u1: number,
    v1: number,
    n1: number,
    u2: number,
    v2: number,
    n2: number,
    u3: number,
    v3: number,
    n3: number,
  ): void => {
    corners[0] = u0;
    corners[1] = v0;
    corners[2] = n0;
    corners[3] = u1;
    corners[4] = v1;
    corners[5] = n1;
    corners[6] = u2;
    corners[7] = v2;
    corners[8] = n2;
    corners[9] = u3;
    corners[10] = v3;
    corners[11] = n3;
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

export function computeDiffuseFactors(geo: ShadingGeometry, points: number, noDevices: boolean): DiffuseShadingFactors {
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
