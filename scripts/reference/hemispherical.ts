/**
 * Independent recomputation of the hemispherical reference cases (src/lib/reference-cases/hemispherical.ts).
 *
 * Formula: the hemispherical (diffuse) average of a property for isotropic incident radiance on a plane,
 *   X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ   (= 2∫ X cos θ sin θ dθ; X ≡ 1 gives 1),
 * ISO 15099:2003, optical section, and J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes,
 * 4th ed., Wiley 2013, ch. 5 (both from memory). Evaluated with this script's own Gauss–Legendre rule: nodes are
 * the zeros of the Legendre polynomial P_n (Newton iteration on the three-term recurrence), weights
 * w_i = 2/[(1 − x_i²) P_n′(x_i)²] (M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions, 1964,
 * §25.4.29, from memory); 400 nodes unless a case names its own count.
 * X(θ): the stack of uncoated slabs per polarisation, then averaged, from scripts/reference/layer-stack.ts.
 * Written from these formulas alone; it does not use the product's code.
 *
 * Run: npx tsx scripts/reference/hemispherical.ts
 */
import { HEMISPHERICAL_SCRIPT, hemisphericalDomain, type HemisphericalCaseInput } from "@/lib/reference-cases/hemispherical";
import { stackAt, stackQuantities, type StackResult } from "./layer-stack";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

/** Gauss–Legendre nodes x and weights w on [−1, 1]. */
export function gaussLegendreRule(n: number): { x: number[]; w: number[] } {
  const x: number[] = [];
  const w: number[] = [];
  for (let i = 1; i <= n; i++) {
    // usual initial guess for the i-th zero, cos(π(i − 1/4)/(n + 1/2)) (common practice, no source), then Newton
    let z = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      // p1 = P_n(z), p0 = P_{n−1}(z); P_n′(z) = n (z P_n − P_{n−1}) / (z² − 1)
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x.push(z);
    w.push(2 / ((1 - z * z) * dp * dp));
  }
  return { x, w };
}

/** ∫_0^{π/2} X(θ) sin 2θ dθ for each component of a vector-valued X, with n Gauss–Legendre nodes. */
export function hemispherical(X: (theta: number) => readonly number[], n = 400): number[] {
  const { x, w } = gaussLegendreRule(n);
  let acc: number[] | null = null;
  for (let i = 0; i < n; i++) {
    const theta = (Math.PI / 4) * (x[i]! + 1);
    const weight = (Math.PI / 4) * w[i]! * Math.sin(2 * theta);
    const v = X(theta);
    acc ??= new Array<number>(v.length).fill(0);
    v.forEach((vj, j) => (acc![j]! += weight * vj));
  }
  return acc!;
}

export function recomputeHemispherical(input: HemisphericalCaseInput): Recomputed {
  const layers = input.panes.map((pane) => ({ kind: "pane" as const, pane }));
  const vec = (r: StackResult) => [r.T, r.Rf, r.Rb, ...r.A];
  const h = hemispherical((theta) => vec(stackAt(layers, theta, "per-polarization")), input.nodes ?? 400);
  return stackQuantities({ T: h[0]!, Rf: h[1]!, Rb: h[2]!, A: h.slice(3) });
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const hemisphericalComparison = () =>
  compareDomain(hemisphericalDomain, HEMISPHERICAL_SCRIPT, (c) => recomputeHemispherical(c.input), { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[hemisphericalDomain.title, hemisphericalComparison]]);
