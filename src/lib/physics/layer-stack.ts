/**
 * Multi-layer glazing by the adding / net-radiation method: parallel, planar, specular layers
 * separated by non-absorbing gaps, each layer known by (T, Rf, Rb) at the angle of interest
 * (f = the face towards outdoors; T is the same in both directions for specular layers).
 *
 * Two layers (the EN 410 / ISO 9050 double-glazing formulas, τ = τ1τ2/(1 − ρ1′ρ2) …):
 *   D = 1 − Rb1 Rf2,  T = T1 T2 / D,  Rf = Rf1 + T1² Rf2 / D,  Rb = Rb2 + T2² Rb1 / D
 * N layers: gap k lies behind layer k (gap 0 = outdoors, gap N = indoors). With
 *   T⁽ᵏ⁾, Rb⁽ᵏ⁾ = transmittance and back reflectance of layers 1..k (adding rule),
 *   ρ_k        = front reflectance of layers k+1..N (ρ_N = 0),
 * the fluxes in gap k for unit irradiance from outdoors are
 *   I⁺_k = T⁽ᵏ⁾ / (1 − Rb⁽ᵏ⁾ ρ_k)   (travelling inwards),   I⁻_k = ρ_k I⁺_k   (outwards),
 * and layer k absorbs A_k = Af_k I⁺_{k−1} + Ab_k I⁻_k, with Af = 1 − T − Rf, Ab = 1 − T − Rb.
 * This solves the net-radiation system I⁺_k = T_k I⁺_{k−1} + Rb_k I⁻_k,
 * I⁻_{k−1} = Rf_k I⁺_{k−1} + T_k I⁻_k, I⁺_0 = 1, I⁻_N = 0 in O(N), and T + Rf + Σ A_k = 1.
 * Radiation from indoors is the mirror image.
 *
 * @see EN 410:2011 §5 and ISO 9050:2003 §4 (multiple glazing; clause numbers from memory)
 * @see Duffie & Beckman, Solar Engineering of Thermal Processes, 4th ed., ch. 5 (from memory)
 * @see M. Rubin, Int. J. Energy Research 6:123–133, 1982
 */
import { checkIncidenceAngleRad, type Radians } from "./units";

/** One layer at one angle and polarisation [-]: transmittance, front (outdoor-side) and back reflectance. */
export interface LayerOptics {
  readonly T: number;
  readonly Rf: number;
  readonly Rb: number;
}

/** A layer's optics per polarisation. Layers with no s/p data give the same values for both. */
export interface PolarizedLayerOptics {
  readonly s: LayerOptics;
  readonly p: LayerOptics;
}

/** Optics of a stack [-]. Index 0 of the absorptance lists is the outermost layer. */
export interface StackOptics {
  /** transmittance (same in both directions) */
  readonly T: number;
  /** reflectance for radiation from outdoors */
  readonly Rf: number;
  /** reflectance for radiation from indoors */
  readonly Rb: number;
  /** absorptance of each layer for radiation incident from outdoors (EN 410 α_e1, α_e2, …) */
  readonly absorptanceFront: readonly number[];
  /** absorptance of each layer for radiation incident from indoors */
  readonly absorptanceBack: readonly number[];
}

/** Largest number of layers accepted. */
export const MAX_LAYERS = 6;

/** Tolerance on T + R ≤ 1 for a layer, for rounding in the caller's arithmetic [-]. */
export const LAYER_SUM_TOLERANCE = 1e-12;

/**
 * Checks one layer: finite, each value in [0, 1], T + Rf ≤ 1 and T + Rb ≤ 1 (within
 * {@link LAYER_SUM_TOLERANCE}).
 * @param layer T, Rf, Rb [-]
 * @param index position in the stack (0 = outermost), used in the message
 * @throws RangeError naming the layer and the quantity
 */
export function checkLayer(layer: LayerOptics, index = 0): void {
  const name = `layer ${index + 1}`;
  for (const key of ["T", "Rf", "Rb"] as const) {
    const v = layer[key];
    if (!(v >= 0 && v <= 1)) throw new RangeError(`${name}: ${key} must be a finite fraction in [0, 1]; got ${v}`);
  }
  if (layer.T + layer.Rf > 1 + LAYER_SUM_TOLERANCE) {
    throw new RangeError(`${name}: T + Rf must not exceed 1 (negative absorptance); got ${layer.T + layer.Rf}`);
  }
  if (layer.T + layer.Rb > 1 + LAYER_SUM_TOLERANCE) {
    throw new RangeError(`${name}: T + Rb must not exceed 1 (negative absorptance); got ${layer.T + layer.Rb}`);
  }
}

/** x / d, or 0 when d = 0 (two perfect mirrors facing each other: then no flux reaches the gap, x = 0). */
const ratio = (x: number, d: number): number => (d > 0 ? x / d : 0);

/**
 * Two layers combined (adding rule; EN 410 / ISO 9050 double glazing):
 *   T = T1 T2 / D,  Rf = Rf1 + T1² Rf2 / D,  Rb = Rb2 + T2² Rb1 / D,  D = 1 − Rb1 Rf2
 * @param outer layer 1 (outdoor side) [-]; @param inner layer 2 [-]
 * @returns the pair as one layer [-]
 * @see EN 410:2011 §5; ISO 9050:2003 §4 (clause numbers from memory)
 */
export function combineTwoLayers(outer: LayerOptics, inner: LayerOptics): LayerOptics {
  checkLayer(outer, 0);
  checkLayer(inner, 1);
  const D = 1 - outer.Rb * inner.Rf;
  return {
    T: ratio(outer.T * inner.T, D),
    Rf: outer.Rf + ratio(outer.T * outer.T * inner.Rf, D),
    Rb: inner.Rb + ratio(inner.T * inner.T * outer.Rb, D),
  };
}

/**
 * Reusable buffers for {@link solveStackInto}, so that repeated solves allocate nothing.
 * Fill `T`, `Rf`, `Rb` (index 0 = outermost) before solving.
 */
export class StackWorkspace {
  readonly T = new Float64Array(MAX_LAYERS);
  readonly Rf = new Float64Array(MAX_LAYERS);
  readonly Rb = new Float64Array(MAX_LAYERS);
  /** scratch, 4 × (MAX_LAYERS + 1) */
  readonly scratch = new Float64Array(4 * (MAX_LAYERS + 1));
}

/**
 * Length of the output buffer of {@link solveStackInto} for n layers: 3 + 2n.
 * @param layerCount number of layers n
 */
export const stackResultLength = (layerCount: number): number => 3 + 2 * layerCount;

/**
 * Net-radiation solve of n layers held in a {@link StackWorkspace}, without allocation and
 * without input checks (the caller has checked the layers, e.g. with {@link checkLayer}).
 * Output layout: out[o] = T, out[o+1] = Rf, out[o+2] = Rb, out[o+3+k] = A_k from outdoors,
 * out[o+3+n+k] = A_k from indoors (k = 0 outermost). Formulas: see the module comment.
 * @param n number of layers, 1..6
 * @param ws layers in ws.T / ws.Rf / ws.Rb [-]
 * @param out receives 3 + 2n values [-]
 * @param offset first index written in out
 * @see EN 410:2011 §5; ISO 9050:2003 §4 (from memory)
 */
export function solveStackInto(n: number, ws: StackWorkspace, out: Float64Array, offset = 0): void {
  const { T, Rf, Rb, scratch } = ws;
  const m = MAX_LAYERS + 1;
  // scratch blocks: [0..m) Tcum (layers 1..k), [m..2m) RbCum (layers 1..k),
  // [2m..3m) rho (front reflectance of layers k+1..N), [3m..4m) Tin (transmittance of k+1..N)
  const cT = 0;
  const cRb = m;
  const cRho = 2 * m;
  const cTin = 3 * m;
  scratch[cT] = 1;
  scratch[cRb] = 0;
  for (let k = 1; k <= n; k++) {
    const t = T[k - 1]!;
    const prevT = scratch[cT + k - 1]!;
    const prevRb = scratch[cRb + k - 1]!;
    const D = 1 - prevRb * Rf[k - 1]!;
    scratch[cT + k] = ratio(prevT * t, D);
    scratch[cRb + k] = Rb[k - 1]! + ratio(t * t * prevRb, D);
  }
  scratch[cRho + n] = 0;
  scratch[cTin + n] = 1;
  for (let k = n; k >= 1; k--) {
    const t = T[k - 1]!;
    const rho = scratch[cRho + k]!;
    const D = 1 - Rb[k - 1]! * rho;
    scratch[cRho + k - 1] = Rf[k - 1]! + ratio(t * t * rho, D);
    scratch[cTin + k - 1] = ratio(t * scratch[cTin + k]!, D);
  }
  out[offset] = scratch[cT + n]!;
  out[offset + 1] = scratch[cRho]!;
  out[offset + 2] = scratch[cRb + n]!;
  // Gap fluxes, front incidence: Ip_k = Tcum_k / (1 − RbCum_k ρ_k), Im_k = ρ_k Ip_k.
  // Back incidence: Jm_k = Tin_k / (1 − RbCum_k ρ_k) (outwards), Jp_k = RbCum_k Jm_k (inwards).
  let prevIp = 1; // gap 0
  let prevJp = 0; // gap 0: nothing travels inwards from outdoors for back incidence
  for (let k = 1; k <= n; k++) {
    const rho = scratch[cRho + k]!;
    const rbCum = scratch[cRb + k]!;
    const D = 1 - rbCum * rho;
    const ip = ratio(scratch[cT + k]!, D);
    const im = rho * ip;
    const jm = ratio(scratch[cTin + k]!, D);
    const jp = rbCum * jm;
    const t = T[k - 1]!;
    const af = Math.max(0, 1 - t - Rf[k - 1]!);
    const ab = Math.max(0, 1 - t - Rb[k - 1]!);
    out[offset + 2 + k] = af * prevIp + ab * im;
    out[offset + 2 + n + k] = af * prevJp + ab * jm;
    prevIp = ip;
    prevJp = jp;
  }
}

/**
 * Reads a solve result (layout of {@link solveStackInto}, offset 0) into a {@link StackOptics}
 * with fresh absorptance arrays.
 * @param n number of layers; @param out result buffer [-]
 */
export function stackOpticsFromResult(n: number, out: Float64Array): StackOptics {
  const absorptanceFront: number[] = new Array<number>(n);
  const absorptanceBack: number[] = new Array<number>(n);
  for (let k = 0; k < n; k++) {
    absorptanceFront[k] = out[3 + k]!;
    absorptanceBack[k] = out[3 + n + k]!;
  }
  return { T: out[0]!, Rf: out[1]!, Rb: out[2]!, absorptanceFront, absorptanceBack };
}

/**
 * Checks a layer count: an integer in 1..{@link MAX_LAYERS}.
 * @param n number of layers (or panes)
 * @param counted "layers" (a stack of layers, the default) or "panes" (a glazing), for the message
 * @throws RangeError "number of layers must be 1..6" or "a glazing has 1..6 panes"
 */
export function checkLayerCount(n: number, counted: "layers" | "panes" = "layers"): void {
  if (!Number.isInteger(n) || n < 1 || n > MAX_LAYERS) {
    throw new RangeError(
      counted === "panes" ? `a glazing has 1..${MAX_LAYERS} panes; got ${n}` : `number of layers must be 1..${MAX_LAYERS}; got ${n}`,
    );
  }
}

/**
 * Combines 1..6 layers (outdoor side first) by the net-radiation method (module comment).
 * @param layers T, Rf, Rb of each layer [-], outermost first
 * @returns T, Rf (from outdoors), Rb (from indoors) and per-layer absorptances for radiation
 *   from outdoors and from indoors [-]; T + Rf + ΣA_front = 1 = T + Rb + ΣA_back
 * @throws RangeError for a bad layer count or a layer that is out of range
 * @see EN 410:2011 §5; ISO 9050:2003 §4 (from memory); Rubin 1982
 */
export function combineLayers(layers: readonly LayerOptics[]): StackOptics {
  const n = layers.length;
  checkLayerCount(n);
  const ws = new StackWorkspace();
  layers.forEach((layer, k) => {
    checkLayer(layer, k);
    ws.T[k] = layer.T;
    ws.Rf[k] = layer.Rf;
    ws.Rb[k] = layer.Rb;
  });
  const out = new Float64Array(stackResultLength(n));
  solveStackInto(n, ws, out);
  return stackOpticsFromResult(n, out);
}

/**
 * How polarisation is carried through a stack at oblique incidence.
 * - "per-polarization": run the whole stack for s and for p with each layer's s/p values, then
 *   average the two results (correct for specular uncoated panes: the first pane partly
 *   polarises the beam and the next ones transmit p better).
 * - "averaged": average each layer over s and p first, then run the stack once. This assumes
 *   the polarisation is scrambled between layers and underestimates T at oblique incidence;
 *   it is a labelled simplification kept for comparison.
 * Both agree at normal incidence.
 */
export type PolarizationRoute = "per-polarization" | "averaged";

/**
 * Checks a polarisation route.
 * @throws RangeError naming "polarization" for anything but "per-polarization" or "averaged"
 */
export function checkPolarizationRoute(route: PolarizationRoute): PolarizationRoute {
  if (route !== "per-polarization" && route !== "averaged") {
    throw new RangeError(`polarization must be "per-polarization" or "averaged"; got ${String(route)}`);
  }
  return route;
}

/**
 * Net-radiation solve of a stack of polarised layers along one {@link PolarizationRoute}, with
 * reusable buffers (no allocation per solve, no input checks: the caller has checked the layer
 * count, the route and the layers). "per-polarization": the stack is solved for s and for p and
 * the two results averaged; "averaged": each layer's s and p values are averaged first and the
 * stack is solved once.
 * @see EN 410:2011 §5; ISO 9050:2003 §4 (from memory); Rubin 1982
 */
export class PolarizedStackSolver {
  private readonly ws = new StackWorkspace();
  private readonly outS: Float64Array;
  private readonly outP: Float64Array;

  /**
   * @param layerCount number of layers n, 1..6 (checked by the caller)
   * @param route polarisation route (checked by the caller)
   */
  constructor(
    readonly layerCount: number,
    readonly route: PolarizationRoute,
  ) {
    this.outS = new Float64Array(stackResultLength(layerCount));
    this.outP = new Float64Array(stackResultLength(layerCount));
  }

  /**
   * Solves the stack.
   * @param layers s/p optics of each layer at the angle of interest [-], outermost first, n entries
   * @returns a buffer (reused by the next call) with the s/p average in the layout of
   *   {@link solveStackInto}: T, Rf, Rb, A_front[0..n), A_back[0..n) [-]
   */
  solve(layers: readonly PolarizedLayerOptics[]): Float64Array {
    const n = this.layerCount;
    const { ws, outS, outP } = this;
    if (this.route === "averaged") {
      for (let k = 0; k < n; k++) {
        const l = layers[k]!;
        ws.T[k] = 0.5 * (l.s.T + l.p.T);
        ws.Rf[k] = 0.5 * (l.s.Rf + l.p.Rf);
        ws.Rb[k] = 0.5 * (l.s.Rb + l.p.Rb);
      }
      solveStackInto(n, ws, outS);
      return outS;
    }
    for (let k = 0; k < n; k++) {
      const l = layers[k]!.s;
      ws.T[k] = l.T;
      ws.Rf[k] = l.Rf;
      ws.Rb[k] = l.Rb;
    }
    solveStackInto(n, ws, outS);
    for (let k = 0; k < n; k++) {
      const l = layers[k]!.p;
      ws.T[k] = l.T;
      ws.Rf[k] = l.Rf;
      ws.Rb[k] = l.Rb;
    }
    solveStackInto(n, ws, outP);
    for (let i = 0; i < outS.length; i++) outS[i] = 0.5 * (outS[i]! + outP[i]!);
    return outS;
  }
}

/** Gives a layer's s/p optics at an angle of incidence in air [rad]. */
export type PolarizedLayerSource = (thetaRad: Radians) => PolarizedLayerOptics;

/**
 * Optics of a glazing of parallel layers at one angle of incidence (one-off evaluation; for
 * repeated evaluation prepare the glazing with prepareGlazing in optics.ts, which uses the same
 * {@link PolarizedStackSolver}). Gaps are air or gas with n = 1, so every layer sees the same
 * external angle θ (angle of incidence in air on the outer face).
 * @param panes layer sources, outermost first, 1..6
 * @param thetaRad angle of incidence in air [rad], in [0, π/2]
 * @param options.polarization route, default "per-polarization" (see {@link PolarizationRoute})
 * @returns stack optics [-], averaged over s and p
 * @throws RangeError for bad angle, layer count, route or layer values
 * @see EN 410:2011 §5; ISO 9050:2003 §4 (from memory); Rubin 1982
 */
export function glazingOpticsAt(
  panes: readonly PolarizedLayerSource[],
  thetaRad: Radians,
  options: { readonly polarization?: PolarizationRoute } = {},
): StackOptics {
  const n = panes.length;
  checkLayerCount(n);
  checkIncidenceAngleRad(thetaRad);
  const route = options.polarization ?? "per-polarization";
  const layers = panes.map((source) => source(thetaRad));
  checkPolarizationRoute(route);
  if (route === "averaged") {
    layers.forEach((l, k) => checkLayer({ T: 0.5 * (l.s.T + l.p.T), Rf: 0.5 * (l.s.Rf + l.p.Rf), Rb: 0.5 * (l.s.Rb + l.p.Rb) }, k));
  } else {
    layers.forEach((l, k) => checkLayer(l.s, k));
    layers.forEach((l, k) => checkLayer(l.p, k));
  }
  return stackOpticsFromResult(n, new PolarizedStackSolver(n, route).solve(layers));
}
