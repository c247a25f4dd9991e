/**
 * Independent recomputation of the g-value reference cases (`src/lib/reference-cases/g-value.ts`): the
 * EN 410 secondary heat transfer and g, and the printed optical inputs of the cases from the panes they name.
 *
 * Formulas and sources:
 *   EN 410:2011, Glass in building — Determination of luminous and solar characteristics of glazing
 *   (secondary heat transfer factor clause; clause numbers and formulae from memory):
 *     g = τ_e + q_i,  q_i = Σ N_k α_e,k,  h_e = 23, h_i = 3.6 + 4.4 ε_i/0.837 W/(m²K)
 *     single glazing N = h_i/(h_e + h_i);
 *     double glazing q_i = [(α_e1 + α_e2)/h_e + α_e2/Λ] / [1/h_e + 1/h_i + 1/Λ]
 *     general form used here: N_k = (1/h_e + Σ_{j<k} 1/Λ_j) / (1/h_e + Σ_j 1/Λ_j + 1/h_i)
 *     (the resistance from pane k to outside over the total; equal to the double-glazing formula)
 *     1/Λ between panes: the gap's 1/h_s (EN 673:2011, scripts/reference/u-value.ts) plus the glass:
 *     the whole outermost and innermost pane, half of every middle pane (from memory).
 *   The optical inputs, for uncoated panes in air, per polarisation s and p, then averaged:
 *     Fresnel reflectance of an air/glass face: E. Hecht, Optics, 4th ed., 2002, §4.6 (from memory);
 *     absorbing slab, incoherent multiple reflections, τ = exp(−α d/cos θ_t): J. A. Duffie & W. A. Beckman,
 *     Solar Engineering of Thermal Processes, 4th ed., 2013, ch. 5 (from memory); M. Rubin, "Solar optical
 *     properties of windows", Int. J. Energy Research 6:123–133, 1982;
 *     panes combined by the adding (net-radiation) method: EN 410:2011 / ISO 9050:2003 multiple-glazing
 *     formulae (clause numbers from memory), solved here as the linear flux balance between the panes;
 *     hemispherical X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ (ISO 15099:2003, optical section, from memory;
 *     Duffie & Beckman ch. 5, from memory) by 400-node Gauss–Legendre quadrature (nodes by Newton's method
 *     on P_n: M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions, 1964, §25.4.29, from memory).
 * The g cases check the EN 410 formula on the printed optical inputs; this script also recomputes those
 * inputs from the panes and g from the unrounded optics. Uses nothing from the product's code.
 *
 * Run: npx tsx scripts/reference/g-value.ts
 */
import { gValueDomain, type GValueCase, type GValueCaseInput, type GValueOptics, type GValueOpticalPane } from '@/lib/reference-cases/g-value';
import type { ReferenceCase } from '@/lib/reference-cases/types';
import { compareCases, compareDomain, EXACT_BOUND, runWhenMain, type ComparisonRow, type Recomputed } from './compare';
import { EXTERNAL_COEFFICIENT, GLASS_CONDUCTIVITY, internalCoefficient, uValueUnit } from './u-value';

// ---------------------------------------------------------------------------------------------------------
// Optics of uncoated panes

/** One layer for one polarisation: transmittance, front and back reflectance (equal for a bare pane). */
interface Layer {
  readonly t: number;
  readonly rf: number;
  readonly rb: number;
}

/** Fresnel power reflectance of an air → glass face (real index n) for s and p. */
export function fresnelAirGlass(n: number, thetaRad: number): { s: number; p: number; cosT: number } {
  const ci = Math.cos(thetaRad);
  const si = Math.sin(thetaRad);
  const cosT = Math.sqrt(1 - (si / n) ** 2);
  const rs = (ci - n * cosT) / (ci + n * cosT);
  const rp = (cosT - n * ci) / (cosT + n * ci);
  return { s: rs * rs, p: rp * rp, cosT };
}

/** The absorbing slab for one polarisation: face reflectance R, internal transmittance τ. */
function slab(R: number, tau: number): Layer {
  const d = 1 - R * R * tau * tau;
  const t = ((1 - R) ** 2 * tau) / d;
  const r = R + (R * (1 - R) ** 2 * tau * tau) / d;
  return { t, rf: r, rb: r };
}

/** Solves A x = b by Gaussian elimination with partial pivoting (small dense systems). */
function solve(a: number[][], b: number[]): number[] {
  const n = b.length;
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[piv]![col]!)) piv = r;
    [a[col], a[piv]] = [a[piv]!, a[col]!];
    [b[col], b[piv]] = [b[piv]!, b[col]!];
    for (let r = col + 1; r < n; r++) {
      const f = a[r]![col]! / a[col]![col]!;
      if (f === 0) continue;
      for (let c = col; c < n; c++) a[r]![c]! -= f * a[col]![c]!;
      b[r]! -= f * b[col]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = b[r]!;
    for (let c = r + 1; c < n; c++) s -= a[r]![c]! * x[c]!;
    x[r] = s / a[r]![r]!;
  }
  return x;
}

/**
 * Net-radiation balance of N layers lit from outside: I⁺_k, I⁻_k are the inward and outward fluxes in
 * space k (0 outdoors, N indoors); I⁺_0 = 1, I⁻_N = 0, I⁺_k = T_k I⁺_{k−1} + Rb_k I⁻_k,
 * I⁻_{k−1} = Rf_k I⁺_{k−1} + T_k I⁻_k; A_k = (1 − T_k − Rf_k) I⁺_{k−1} + (1 − T_k − Rb_k) I⁻_k.
 */
function stack(layers: readonly Layer[]): { t: number; r: number; a: number[] } {
  const n = layers.length;
  const size = 2 * (n + 1); // unknowns: I⁺_0..I⁺_N, then I⁻_0..I⁻_N
  const ip = (k: number) => k;
  const im = (k: number) => n + 1 + k;
  const a = Array.from({ length: size }, () => new Array<number>(size).fill(0));
  const b = new Array<number>(size).fill(0);
  let row = 0;
  a[row]![ip(0)] = 1;
  b[row++] = 1;
  a[row]![im(n)] = 1;
  b[row++] = 0;
  layers.forEach((l, i) => {
    const k = i + 1;
    a[row]![ip(k)] = 1;
    a[row]![ip(k - 1)] = -l.t;
    a[row++]![im(k)] = -l.rb;
    a[row]![im(k - 1)] = 1;
    a[row]![ip(k - 1)] = -l.rf;
    a[row++]![im(k)] = -l.t;
  });
  const x = solve(a, b);
  const abs = layers.map((l, i) => (1 - l.t - l.rf) * x[ip(i)]! + (1 - l.t - l.rb) * x[im(i + 1)]!);
  return { t: x[ip(n)]!, r: x[im(0)]!, a: abs };
}

export interface StackOptics {
  readonly solarTransmittance: number;
  readonly solarReflectanceFront: number;
  readonly absorptances: readonly number[];
}

/**
 * T, R and A_k of uncoated panes in air at angle θ. `polarization: 'per-stack'` solves the whole stack for s
 * and for p and averages the results; 'averaged' averages each pane's s and p first.
 */
export function stackOptics(panes: readonly GValueOpticalPane[], thetaRad: number, polarization: 'per-stack' | 'averaged' = 'per-stack'): StackOptics {
  const perPane = panes.map((p) => {
    const f = fresnelAirGlass(p.refractiveIndex, thetaRad);
    const tau = Math.exp((-p.absorptionPerMm * p.thicknessMm) / f.cosT);
    return { s: slab(f.s, tau), p: slab(f.p, tau) };
  });
  const avg = (x: Layer, y: Layer): Layer => ({ t: (x.t + y.t) / 2, rf: (x.rf + y.rf) / 2, rb: (x.rb + y.rb) / 2 });
  if (polarization === 'averaged') {
    const r = stack(perPane.map((l) => avg(l.s, l.p)));
    return { solarTransmittance: r.t, solarReflectanceFront: r.r, absorptances: r.a };
  }
  const s = stack(perPane.map((l) => l.s));
  const p = stack(perPane.map((l) => l.p));
  return {
    solarTransmittance: (s.t + p.t) / 2,
    solarReflectanceFront: (s.r + p.r) / 2,
    absorptances: s.a.map((x, k) => (x + p.a[k]!) / 2),
  };
}

/** Nodes and weights of n-point Gauss–Legendre quadrature on [−1, 1] (Newton iteration on P_n). */
export function gaussLegendre(n: number): { x: number[]; w: number[] } {
  const x = new Array<number>(n).fill(0);
  const w = new Array<number>(n).fill(0);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    // recompute P'_n at the converged node for the weight
    let p0 = 1;
    let p1 = z;
    for (let k = 2; k <= n; k++) {
      const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
      p0 = p1;
      p1 = p2;
    }
    dp = (n * (z * p1 - p0)) / (z * z - 1);
    x[i] = -z;
    x[n - 1 - i] = z;
    w[i] = w[n - 1 - i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

const GL400 = gaussLegendre(400);

/** Hemispherical (cosine-weighted) average ∫_0^{π/2} X(θ) sin 2θ dθ by 400-node Gauss–Legendre. */
export function hemispherical(panes: readonly GValueOpticalPane[]): StackOptics {
  const half = Math.PI / 4;
  let t = 0;
  let r = 0;
  const a = panes.map(() => 0);
  GL400.x.forEach((xi, i) => {
    const theta = half * (xi + 1);
    const weight = GL400.w[i]! * half * Math.sin(2 * theta);
    const o = stackOptics(panes, theta);
    t += weight * o.solarTransmittance;
    r += weight * o.solarReflectanceFront;
    o.absorptances.forEach((x, k) => (a[k]! += weight * x));
  });
  return { solarTransmittance: t, solarReflectanceFront: r, absorptances: a };
}

/** The optics of a case's panes at its incidence, recomputed. */
export function recomputeOptics(o: GValueOptics): StackOptics {
  return o.incidence === 'hemispherical' ? hemispherical(o.panes) : stackOptics(o.panes, (o.incidence.thetaDeg * Math.PI) / 180);
}

// ---------------------------------------------------------------------------------------------------------
// EN 410 thermal network

export interface Network {
  readonly gapConductances: readonly number[];
  readonly resistancesBetweenPanes: readonly number[];
  readonly factors: readonly number[];
}

export function network(unit: GValueCaseInput['unit'], glassConduction: 'surfaces' | 'none' = 'surfaces'): Network {
  const u = uValueUnit(unit);
  const last = unit.panes.length - 1;
  const glass = (k: number) => (unit.panes[k]!.thicknessMm / 1000 / GLASS_CONDUCTIVITY) * (k === 0 || k === last ? 1 : 0.5);
  const resistances = u.gaps.map((g, k) => 1 / g.conductanceWPerM2K + (glassConduction === 'surfaces' ? glass(k) + glass(k + 1) : 0));
  const re = 1 / EXTERNAL_COEFFICIENT;
  const ri = 1 / internalCoefficient(unit.panes[last]!.emissivityBack);
  const total = re + resistances.reduce((s, x) => s + x, 0) + ri;
  const factors = unit.panes.map((_, k) => (re + resistances.slice(0, k).reduce((s, x) => s + x, 0)) / total);
  return { gapConductances: u.gaps.map((g) => g.conductanceWPerM2K), resistancesBetweenPanes: resistances, factors };
}

/** q_i and g from optics and factors. */
export function gValue(t: number, absorptances: readonly number[], factors: readonly number[]): { qi: number; g: number } {
  const qi = absorptances.reduce((s, a, k) => s + a * factors[k]!, 0);
  return { qi, g: t + qi };
}

// ---------------------------------------------------------------------------------------------------------
// Comparisons

/** The values this script computes for a case (g from the printed optical inputs). */
export function recomputeGValueCase(c: GValueCase): Recomputed {
  const net = network(c.input.unit, c.input.glassConduction);
  const out: Record<string, number> = {};
  net.factors.forEach((n, k) => (out[`factors[${k}]`] = n));
  net.gapConductances.forEach((h, k) => (out[`gaps[${k}].conductanceWPerM2K`] = h));
  net.resistancesBetweenPanes.forEach((r, k) => (out[`conductancesBetweenPanesWPerM2K[${k}]`] = 1 / r));
  const o = c.input.optics;
  if (o) {
    const { qi, g } = gValue(o.solarTransmittance, o.absorptances, net.factors);
    out.secondaryHeatTransfer = qi;
    out.gValue = g;
  }
  return out;
}

const SCRIPT = 'scripts/reference/g-value.ts';

/** Every case of the domain this script answers for, next to its recomputation. */
export function gValueComparison(): ComparisonRow[] {
  return compareDomain(gValueDomain, SCRIPT, recomputeGValueCase, { rule: EXACT_BOUND, closedForm: true });
}

/** Pseudo-cases: each printed optical input of a g case next to its rounding, for the comparison table. */
function opticalInputCases(): ReferenceCase<GValueOptics>[] {
  const out: ReferenceCase<GValueOptics>[] = [];
  for (const c of gValueDomain.cases) {
    const o = c.input.optics;
    if (!o) continue;
    const expected = [
      { quantity: 'solarTransmittance', unit: '-', value: o.solarTransmittance, tolerance: o.printedRounding },
      ...(o.solarReflectanceFront === undefined ? [] : [{ quantity: 'solarReflectanceFront', unit: '-', value: o.solarReflectanceFront, tolerance: o.printedRounding }]),
      ...o.absorptances.map((a, k) => ({ quantity: `absorptances[${k}]`, unit: '-', value: a, tolerance: o.absorptancesRounding?.[k] ?? o.printedRounding })),
    ];
    out.push({ id: `${c.id} (optical input)`, label: c.label, input: o, expected, source: c.source });
  }
  return out;
}

/** The printed optical inputs of the g cases against the optics recomputed from the named panes. */
export function opticalInputComparison(): ComparisonRow[] {
  return compareCases(opticalInputCases(), (c) => {
    const r = recomputeOptics(c.input);
    const out: Record<string, number> = { solarTransmittance: r.solarTransmittance, solarReflectanceFront: r.solarReflectanceFront };
    r.absorptances.forEach((a, k) => (out[`absorptances[${k}]`] = a));
    return out;
  }, EXACT_BOUND);
}

/** g of the g cases from the recomputed, unrounded optics against the printed g. */
export function gFromRecomputedOpticsComparison(): ComparisonRow[] {
  return compareCases(
    gValueDomain.cases.filter((c) => c.input.optics),
    (c) => {
      const r = recomputeOptics(c.input.optics!);
      const { qi, g } = gValue(r.solarTransmittance, r.absorptances, network(c.input.unit, c.input.glassConduction).factors);
      return { secondaryHeatTransfer: qi, gValue: g };
    },
    EXACT_BOUND,
  );
}

runWhenMain(import.meta.url, [
  ['EN 410:2011 g and N_k (g from the printed optical inputs)', gValueComparison],
  ['Printed optical inputs, recomputed from the named panes', opticalInputComparison],
  ['g from the recomputed (unrounded) optics', gFromRecomputedOpticsComparison],
]);
