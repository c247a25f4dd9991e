/**
 * Independent recomputation of the layer-stack reference cases (src/lib/reference-cases/layer-stack.ts).
 *
 * Formula: the net-radiation (adding) method for planar specular layers, whose two- and three-layer forms are the
 * multiple-glazing formulas of EN 410:2011 §5 and ISO 9050:2003 §4 (clause numbers from memory):
 *   τ = τ1τ2/(1 − ρ1′ρ2),  ρ = ρ1 + τ1²ρ2/(1 − ρ1′ρ2),  α_e1 = α1 + τ1α1′ρ2/(1 − ρ1′ρ2),  α_e2 = τ1α2/(1 − ρ1′ρ2).
 * For N layers the fluxes I⁺_k (inwards) and I⁻_k (outwards) in gap k (0 = outdoors, N = indoors) satisfy
 *   I⁺_k = T_k I⁺_{k−1} + Rb_k I⁻_k,  I⁻_{k−1} = Rf_k I⁺_{k−1} + T_k I⁻_k,  A_k = Af_k I⁺_{k−1} + Ab_k I⁻_k,
 * with I⁺_0 = 1, I⁻_N = 0 for radiation from outdoors (T = I⁺_N, Rf = I⁻_0) and the mirror image for Rb. This
 * script solves that linear system directly (Gaussian elimination), not by the two-layer recursion.
 * Layers: uncoated slabs per polarisation from scripts/reference/absorbing-pane.ts (Duffie & Beckman, 4th ed.,
 * ch. 5, from memory; Rubin 1982). Written from these formulas alone; it does not use the product's code.
 *
 * Run: npx tsx scripts/reference/layer-stack.ts
 */
import { LAYER_STACK_SCRIPT, layerStackDomain, type LayerStackCaseInput, type StackLayer } from "@/lib/reference-cases/layer-stack";
import { paneAt } from "./absorbing-pane";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const DEG = Math.PI / 180;

export interface Layer {
  readonly T: number;
  readonly Rf: number;
  readonly Rb: number;
}

export interface StackResult {
  readonly T: number;
  readonly Rf: number;
  readonly Rb: number;
  /** Front absorptances A_1..A_N (radiation from outdoors). */
  readonly A: readonly number[];
}

/** Solves a dense linear system M x = y by Gaussian elimination with partial pivoting. */
function solve(M: number[][], y: number[]): number[] {
  const n = y.length;
  const a = M.map((row, i) => [...row, y[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r]![c]!) > Math.abs(a[p]![c]!)) p = r;
    [a[c], a[p]] = [a[p]!, a[c]!];
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const f = a[r]![c]! / a[c]![c]!;
      for (let k = c; k <= n; k++) a[r]![k]! -= f * a[c]![k]!;
    }
  }
  return a.map((row, i) => row[n]! / row[i]!);
}

/** Net-radiation fluxes for incident flux `inside` from indoors and `outside` from outdoors. */
function fluxes(layers: readonly Layer[], outside: number, inside: number) {
  const N = layers.length;
  // unknowns: up[k] = I⁺_k (k = 0..N) at index k, down[k] = I⁻_k at index N + 1 + k
  const size = 2 * (N + 1);
  const M = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  const y = new Array<number>(size).fill(0);
  const up = (k: number) => k;
  const down = (k: number) => N + 1 + k;
  let row = 0;
  M[row]![up(0)] = 1;
  y[row++] = outside;
  M[row]![down(N)] = 1;
  y[row++] = inside;
  layers.forEach((l, i) => {
    const k = i + 1;
    // I⁺_k − T_k I⁺_{k−1} − Rb_k I⁻_k = 0
    M[row]![up(k)] = 1;
    M[row]![up(k - 1)] = -l.T;
    M[row]![down(k)] = -l.Rb;
    row++;
    // I⁻_{k−1} − Rf_k I⁺_{k−1} − T_k I⁻_k = 0
    M[row]![down(k - 1)] = 1;
    M[row]![up(k - 1)] = -l.Rf;
    M[row]![down(k)] = -l.T;
    row++;
  });
  const x = solve(M, y);
  return { up: (k: number) => x[up(k)]!, down: (k: number) => x[down(k)]! };
}

/** T, Rf, Rb and front absorptances of a stack of layers. */
export function stack(layers: readonly Layer[]): StackResult {
  const N = layers.length;
  const f = fluxes(layers, 1, 0);
  const b = fluxes(layers, 0, 1);
  const A = layers.map((l, i) => (1 - l.T - l.Rf) * f.up(i) + (1 - l.T - l.Rb) * f.down(i + 1));
  return { T: f.up(N), Rf: f.down(0), Rb: b.up(N), A };
}

/** A case layer at theta (radians), for s and p. */
export function layerAt(layer: StackLayer, theta: number): { s: Layer; p: Layer } {
  if (layer.kind === "given") return { s: layer, p: layer };
  const o = paneAt(layer.pane, theta);
  return { s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R }, p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R } };
}

const mean = (a: StackResult, b: StackResult): StackResult => ({
  T: 0.5 * (a.T + b.T),
  Rf: 0.5 * (a.Rf + b.Rf),
  Rb: 0.5 * (a.Rb + b.Rb),
  A: a.A.map((x, i) => 0.5 * (x + b.A[i]!)),
});

/** The stack at theta (radians) by the given route. */
export function stackAt(layers: readonly StackLayer[], theta: number, route: LayerStackCaseInput["route"]): StackResult {
  const sp = layers.map((l) => layerAt(l, theta));
  switch (route) {
    case "s":
      return stack(sp.map((l) => l.s));
    case "p":
      return stack(sp.map((l) => l.p));
    case "per-polarization":
      return mean(stack(sp.map((l) => l.s)), stack(sp.map((l) => l.p)));
    case "averaged":
      return stack(sp.map((l) => ({ T: 0.5 * (l.s.T + l.p.T), Rf: 0.5 * (l.s.Rf + l.p.Rf), Rb: 0.5 * (l.s.Rb + l.p.Rb) })));
  }
}

/** Quantities T, Rf, Rb, A1..AN of a stack result. */
export function stackQuantities(r: StackResult): Recomputed {
  const out: Record<string, number> = { T: r.T, Rf: r.Rf, Rb: r.Rb };
  r.A.forEach((a, i) => (out[`A${i + 1}`] = a));
  return out;
}

export function recomputeLayerStack(input: LayerStackCaseInput): Recomputed {
  return stackQuantities(stackAt(input.layers, input.thetaDeg * DEG, input.route));
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const layerStackComparison = () =>
  compareDomain(layerStackDomain, LAYER_STACK_SCRIPT, (c) => recomputeLayerStack(c.input), { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[layerStackDomain.title, layerStackComparison]]);
