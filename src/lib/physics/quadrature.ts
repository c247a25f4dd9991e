/**
 * Gauss–Legendre quadrature on [−1, 1]: nodes, weights and the node-count check, shared by the
 * hemispherical averages (hemispherical.ts) and the window averages of the shading devices'
 * diffuse view factors (shading/diffuse-view-factors.ts).
 */

/** Largest node count accepted. */
export const MAX_QUADRATURE_NODES = 1000;

/** Gauss–Legendre nodes x_i and weights w_i on [−1, 1]: ∫ f dx ≈ Σ w_i f(x_i), exact for degree ≤ 2n−1. */
export interface GaussLegendreRule {
  readonly x: Float64Array;
  readonly w: Float64Array;
}

const ruleCache = new Map<number, GaussLegendreRule>();

/**
 * Checks a quadrature node count: an integer in [1, MAX_QUADRATURE_NODES].
 * @throws RangeError naming the number of quadrature nodes
 */
export function checkNodeCount(n: number): void {
  if (!Number.isInteger(n) || n < 1 || n > MAX_QUADRATURE_NODES) {
    throw new RangeError(`number of quadrature nodes must be an integer in [1, ${MAX_QUADRATURE_NODES}]; got ${n}`);
  }
}

/**
 * Gauss–Legendre rule of n nodes on [−1, 1]: nodes are the roots of the Legendre polynomial
 * P_n (Newton iteration from x ≈ cos(π(i − 1/4)/(n + 1/2)), three-term recurrence), weights
 * w_i = 2 / ((1 − x_i²) P_n′(x_i)²). Cached per n; the arrays are shared, do not modify them.
 * @param n number of nodes, 1..1000
 * @returns nodes (descending) and weights
 * @see M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions, 1964, §25.4.29 (from memory)
 * @see W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §4.6 (from memory)
 */
export function gaussLegendre(n: number): GaussLegendreRule {
  checkNodeCount(n);
  const cached = ruleCache.get(n);
  if (cached) return cached;
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  for (let i = 0; i < half; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let iter = 0; iter < 100; iter++) {
      let p0 = 1;
      let p1 = 0;
      for (let j = 0; j < n; j++) {
        const p2 = p1;
        p1 = p0;
        p0 = ((2 * j + 1) * z * p1 - j * p2) / (j + 1);
      }
      // p0 = P_n(z), p1 = P_{n−1}(z)
      dp = (n * (z * p0 - p1)) / (z * z - 1);
      const dz = p0 / dp;
      z -= dz;
      if (Math.abs(dz) <= 1e-16) break;
    }
    x[i] = z;
    x[n - 1 - i] = -z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
    w[n - 1 - i] = w[i]!;
  }
  if (n % 2 === 1) x[half - 1] = 0;
  const rule = Object.freeze({ x, w });
  ruleCache.set(n, rule);
  return rule;
}
