/**
 * Precomputed angular table of one optical quantity X(θ) (e.g. the beam transmittance of a
 * whole glazing), for hot loops such as hourly schedules. Two lookups, each on its own grid
 * of N + 1 points (N = 1024 intervals by default; 2 × 8 KiB, stays in L1 cache), linear
 * interpolation:
 * - `atCos(u)`, u = cos θ: grid uniform in s = √u, i.e. cos θ_i = (i/N)². The hourly code
 *   gets cos θ directly as the dot product of the sun vector and the surface normal, so this
 *   lookup needs one sqrt and no trigonometry. This is the fast path for hot loops.
 * - `at(θ)`, θ in radians: grid uniform in w = √(1 − 2θ/π), i.e. θ_i = (π/2)(1 − (i/N)²), so
 *   that this lookup needs no cosine either (one sqrt).
 *
 * Why these grids and not uniform steps in θ or cos θ: glazing optics are smooth except for a
 * knee near grazing incidence. A pane of small absorption has A ≈ ε·g(u/ε) with
 * ε ≈ αd/cos θt (A rises linearly in u for u ≪ ε and levels off at ≈ ε), so in u or in θ the
 * knee gets arbitrarily sharp as α → 0, and uniform steps in u or θ miss 1e-5 by an order of
 * magnitude for low-iron glass. In s = √u (and in w, since u ≈ (π/2)w² near grazing) the knee
 * has width ∝ √ε and height ∝ ε, so the second derivative stays O(1) for every α; the error of
 * linear interpolation, ≤ h²/8 · max|X''| with h = 1/N, then falls as N⁻² everywhere. Near
 * normal incidence X is even in θ, hence smooth in u and in w. Our own numerical study found
 * ≤ 1.4e-6 (s grid) and ≤ 1e-5 (w grid, worst case an implausible n = 1.01 pane) for T, R and A
 * of 1–6 pane glazings with N = 1024; tests hold glazings to ≤ 1e-5.
 *
 * Lookup contract (both lookups agree):
 * - `atCos(u)`: u ≤ 0 (sun behind the surface, or exactly grazing) → 0: no beam reaches the
 *   glazing. u ≥ 1 → X(0) (tolerates dot products that round above 1). NaN → RangeError.
 * - `at(θ)`: θ = angle between the sun direction and the outward surface normal [rad],
 *   normally in [0, π]. |θ| ≤ π/2 (float64 π/2) → interpolated X(|θ|); |θ| > π/2 → 0;
 *   NaN → RangeError.
 * Returning 0 beyond 90° suits transmittance, reflectance and absorptance of beam radiation;
 * tabulate only quantities for which "no beam" means 0.
 *
 * @see W. H. Press et al., Numerical Recipes, 3rd ed., 2007, §3.1 (linear interpolation; from memory)
 */
import type { Radians } from "./units";

/** Default number of table intervals N. */
export const DEFAULT_TABLE_INTERVALS = 1024;
/** Accepted range of the interval count. */
export const TABLE_INTERVALS_RANGE = Object.freeze({ min: 16, max: 1 << 20 });

const HALF_PI = Math.PI / 2;
const TWO_OVER_PI = 2 / Math.PI;

function checkIntervals(n: number): void {
  if (!Number.isInteger(n) || n < TABLE_INTERVALS_RANGE.min || n > TABLE_INTERVALS_RANGE.max) {
    throw new RangeError(`table intervals must be an integer in [${TABLE_INTERVALS_RANGE.min}, ${TABLE_INTERVALS_RANGE.max}]; got ${n}`);
  }
}

/**
 * Angle of point i of the cos-lookup grid: θ_i = acos((i/N)²) [rad]; θ_0 = π/2, θ_N = 0.
 * @param i grid index, 0..N; @param intervals N
 */
export function cosGridAngle(i: number, intervals: number): Radians {
  const s = i / intervals;
  return Math.acos(s * s) as Radians;
}

/**
 * Angle of point i of the angle-lookup grid: θ_i = (π/2)(1 − (i/N)²) [rad]; θ_0 = π/2, θ_N = 0.
 * @param i grid index, 0..N; @param intervals N
 */
export function angleGridAngle(i: number, intervals: number): Radians {
  const w = i / intervals;
  return (HALF_PI * (1 - w * w)) as Radians;
}

function checkSamples(values: ArrayLike<number>, name: string): Float64Array {
  checkIntervals(values.length - 1);
  const copy = Float64Array.from(values);
  for (let i = 0; i < copy.length; i++) {
    if (!Number.isFinite(copy[i]!)) throw new RangeError(`${name} sample ${i} is not finite: ${copy[i]}`);
  }
  return copy;
}

/** Angular table of one quantity (see the module comment for grids and contract). */
export class AngularTable {
  /** number of intervals N of each grid */
  readonly intervals: number;
  /** X at cos θ_i = (i/N)², i = 0..N (index 0 = grazing, N = normal); do not modify */
  readonly cosGridValues: Float64Array;
  /** X at θ_i = (π/2)(1 − (i/N)²), i = 0..N (index 0 = grazing, N = normal); do not modify */
  readonly angleGridValues: Float64Array;

  private constructor(cosGridValues: Float64Array, angleGridValues: Float64Array) {
    this.cosGridValues = cosGridValues;
    this.angleGridValues = angleGridValues;
    this.intervals = cosGridValues.length - 1;
  }

  /**
   * Builds a table by evaluating X on both grids (2N + 2 evaluations).
   * @param quantity X(θ) for θ in [0, π/2] [rad]; must return finite values
   * @param intervals N, default 1024
   * @throws RangeError for a bad N or a non-finite X
   */
  static fromFunction(quantity: (thetaRad: Radians) => number, intervals = DEFAULT_TABLE_INTERVALS): AngularTable {
    const [table] = angularTablesFromFunction((th) => [quantity(th)], 1, intervals);
    return table!;
  }

  /**
   * Wraps samples already taken on the two grids (copied).
   * @param cosGridValues N + 1 samples at θ = {@link cosGridAngle}(i, N)
   * @param angleGridValues N + 1 samples at θ = {@link angleGridAngle}(i, N)
   * @throws RangeError for bad lengths or a non-finite sample
   */
  static fromSamples(cosGridValues: ArrayLike<number>, angleGridValues: ArrayLike<number>): AngularTable {
    const a = checkSamples(cosGridValues, "cos-grid");
    const b = checkSamples(angleGridValues, "angle-grid");
    if (a.length !== b.length) throw new RangeError(`the two grids differ in length: ${a.length} vs ${b.length}`);
    return new AngularTable(a, b);
  }

  /**
   * X at u = cos θ, linear interpolation in √u; 0 for u ≤ 0; X(0) for u ≥ 1.
   * @param cosTheta cos θ [-]
   * @returns X [unit of the quantity]
   * @throws RangeError when cosTheta is NaN
   */
  atCos(cosTheta: number): number {
    if (cosTheta > 0) {
      const n = this.intervals;
      const v = this.cosGridValues;
      if (cosTheta >= 1) return v[n]!;
      const x = Math.sqrt(cosTheta) * n;
      const i = x | 0; // 0 ≤ i ≤ n − 1 since 0 < x < n
      const a = v[i]!;
      return a + (x - i) * (v[i + 1]! - a);
    }
    if (cosTheta !== cosTheta) throw new RangeError("cos θ is NaN");
    return 0;
  }

  /**
   * X at angle θ, linear interpolation in √(1 − 2|θ|/π); 0 for |θ| > π/2.
   * @param thetaRad angle between sun direction and outward surface normal [rad], normally in [0, π]
   * @returns X [unit of the quantity]
   * @throws RangeError when thetaRad is NaN
   */
  at(thetaRad: number): number {
    const t = thetaRad < 0 ? -thetaRad : thetaRad;
    if (t <= HALF_PI) {
      const n = this.intervals;
      const v = this.angleGridValues;
      const x = Math.sqrt(1 - t * TWO_OVER_PI) * n;
      if (x >= n) return v[n]!;
      const i = x | 0;
      const a = v[i]!;
      return a + (x - i) * (v[i + 1]! - a);
    }
    if (t !== t) throw new RangeError("angle θ is NaN");
    return 0;
  }
}

/**
 * Builds several tables from one vector-valued evaluation (e.g. T and each pane's absorptance),
 * evaluating the (possibly costly) function once per grid point (2N + 2 evaluations in all).
 * @param quantities θ [rad] → at least `count` values
 * @param count number of quantities
 * @param intervals N, default 1024
 * @returns one table per quantity, in order
 * @throws RangeError for a bad N/count, a short result or a non-finite value
 */
export function angularTablesFromFunction(
  quantities: (thetaRad: Radians) => ArrayLike<number>,
  count: number,
  intervals = DEFAULT_TABLE_INTERVALS,
): AngularTable[] {
  checkIntervals(intervals);
  if (!Number.isInteger(count) || count < 1) throw new RangeError(`count must be a positive integer; got ${count}`);
  const fill = (angle: (i: number, n: number) => Radians): Float64Array[] => {
    const columns = Array.from({ length: count }, () => new Float64Array(intervals + 1));
    for (let i = 0; i <= intervals; i++) {
      const theta = angle(i, intervals);
      const row = quantities(theta);
      if (row.length < count) throw new RangeError(`expected ${count} values at θ = ${theta} rad; got ${row.length}`);
      for (let c = 0; c < count; c++) {
        const v = row[c]!;
        if (!Number.isFinite(v)) throw new RangeError(`quantity ${c} is not finite at θ = ${theta} rad: ${v}`);
        columns[c]![i] = v;
      }
    }
    return columns;
  };
  const byCos = fill(cosGridAngle);
  const byAngle = fill(angleGridAngle);
  return byCos.map((col, c) => AngularTable.fromSamples(col, byAngle[c]!));
}

/**
 * Largest interpolation error of a table against direct evaluation over a uniform sweep of θ in
 * [0, π/2], through both lookups (for tests and benchmarks).
 * @param table the table
 * @param quantity direct evaluation X(θ)
 * @param steps number of sweep intervals (steps + 1 angles), default 9000 (0.01°)
 * @returns max |table − X| over both lookups [unit of the quantity]
 */
export function maxInterpolationError(table: AngularTable, quantity: (thetaRad: Radians) => number, steps = 9000): number {
  let worst = 0;
  for (let i = 0; i <= steps; i++) {
    const theta = ((i / steps) * Math.PI) / 2; // the last one is the float64 π/2 (cos = 6e-17 > 0)
    const direct = quantity(theta as Radians);
    worst = Math.max(worst, Math.abs(table.at(theta) - direct), Math.abs(table.atCos(Math.cos(theta)) - direct));
  }
  return worst;
}
