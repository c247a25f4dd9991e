// Reference tests for precomputed angular tables (src/lib/physics/angular-table.ts).
//
// Interpolation is checked against closed forms (linear interpolation of a quadratic on a
// uniform grid errs by exactly h²/4 at mid-interval: Numerical Recipes, 3rd ed., §3.1, and
// elementary Taylor expansion) and against direct evaluation of the optics core, which is itself
// held to published values in the other reference tests. Speed is measured by the benchmark
// (scripts/bench/optics.ts), not here.
import { describe, expect, it } from "vitest";
import { angleGridAngle, AngularTable, angularTablesFromFunction, cosGridAngle, maxInterpolationError } from "@/lib/physics/angular-table";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import type { Radians } from "@/lib/physics/units";
import { clear6mmSpec, coated6mmSpec } from "./fixtures";

const clear4: PaneSpec = { kind: "physical", thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 20 };
const clear6: PaneSpec = clear6mmSpec;
const lowIron4: PaneSpec = { kind: "physical", thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 2 };
const coated6 = coated6mmSpec;

describe("grids and closed forms", () => {
  it("grid angles: θ_0 = π/2 (grazing), θ_N = 0 (normal)", () => {
    expect(cosGridAngle(0, 1024)).toBe(Math.PI / 2);
    expect(cosGridAngle(1024, 1024)).toBe(0);
    expect(angleGridAngle(0, 1024)).toBe(Math.PI / 2);
    expect(angleGridAngle(1024, 1024)).toBe(0);
  });

  it("reproduces functions linear in the grid variable exactly", () => {
    // X = √(cos θ) is linear in s on the cos grid; X = √(1 − 2θ/π) is linear in w on the angle grid
    const bySqrtCos = AngularTable.fromFunction((t) => Math.sqrt(Math.cos(t)), 64);
    const bySqrtAngle = AngularTable.fromFunction((t) => Math.sqrt(1 - (2 * t) / Math.PI), 64);
    for (let u = 0.001; u <= 1; u += 0.0137) expect(Math.abs(bySqrtCos.atCos(u) - Math.sqrt(u))).toBeLessThan(1e-14);
    for (let t = 0; t < Math.PI / 2; t += 0.0137) {
      expect(Math.abs(bySqrtAngle.at(t) - Math.sqrt(1 - (2 * t) / Math.PI))).toBeLessThan(1e-14);
    }
  });

  it("linear interpolation of a quadratic errs by h²/4 at mid-interval (closed form)", () => {
    // X = cos θ = s² on the cos grid; X = 1 − 2θ/π = w² on the angle grid; h = 1/N
    const N = 64;
    const h = 1 / N;
    const cosT = AngularTable.fromFunction((t) => Math.cos(t), N);
    const linT = AngularTable.fromFunction((t) => 1 - (2 * t) / Math.PI, N);
    for (let i = 0; i < N; i++) {
      const s = (i + 0.5) * h;
      expect(Math.abs(cosT.atCos(s * s) - s * s - (h * h) / 4)).toBeLessThan(1e-15);
      const t = (Math.PI / 2) * (1 - s * s);
      expect(Math.abs(linT.at(t) - (1 - (2 * t) / Math.PI) - (h * h) / 4)).toBeLessThan(1e-14);
    }
  });

  it("returns the samples at the grid points", () => {
    const f = (t: number) => Math.exp(-t) * Math.cos(t);
    const table = AngularTable.fromFunction(f, 128);
    for (let i = 0; i <= 128; i++) {
      expect(Math.abs(table.atCos((i / 128) ** 2) - f(cosGridAngle(i, 128)))).toBeLessThan(1e-14);
      expect(Math.abs(table.at(angleGridAngle(i, 128)) - f(angleGridAngle(i, 128)))).toBeLessThan(1e-13);
    }
  });
});

describe("accuracy against direct evaluation: ≤ 1e-5 over 0–90°, both lookups", () => {
  const glazings: [string, PaneSpec[]][] = [
    ["single 6 mm", [clear6]],
    ["single 4 mm low-iron", [lowIron4]],
    ["double 6 mm", [clear6, clear6]],
    ["triple 4 mm", [clear4, clear4, clear4]],
    ["triple, outer coated", [coated6, clear4, clear4]],
    ["six low-iron panes", Array<PaneSpec>(6).fill(lowIron4)],
  ];
  it.each(glazings)("%s: T, Rf, Rb and each A", (_name, panes) => {
    const g = prepareGlazing(panes);
    const n = panes.length;
    const row = (t: Radians): number[] => {
      const s = g.at(t).solar;
      return [s.T, s.Rf, s.Rb, ...s.absorptanceFront];
    };
    const tables = angularTablesFromFunction(row, 3 + n);
    tables.forEach((table, j) => {
      const err = maxInterpolationError(table, (t) => row(t)[j]!, 4500); // 0.02° sweep
      expect(err, `quantity ${j}`).toBeLessThanOrEqual(1e-5);
    });
  });

  it("visible band of a coated glazing", () => {
    const g = prepareGlazing([coated6, { ...coated6, solar: { T: 0.8, Rf: 0.08, Rb: 0.08 }, visible: { T: 0.89, Rf: 0.08, Rb: 0.08 } }]);
    const f = (t: Radians) => g.at(t).visible!.T;
    expect(maxInterpolationError(AngularTable.fromFunction(f), f, 4500)).toBeLessThanOrEqual(1e-5);
  });
});

describe("lookup contract", () => {
  const g = prepareGlazing([clear4, clear4, clear4]);
  const table = AngularTable.fromFunction((t) => g.at(t).solar.T);
  const T0 = g.at(0 as Radians).solar.T;

  it("cos θ ≤ 0 (sun behind the surface or grazing) gives 0", () => {
    expect(table.atCos(0)).toBe(0);
    expect(table.atCos(-0)).toBe(0);
    expect(table.atCos(-0.5)).toBe(0);
    expect(table.atCos(Number.NEGATIVE_INFINITY)).toBe(0);
  });

  it("cos θ ≥ 1 (rounding of a dot product) gives the normal-incidence value", () => {
    expect(table.atCos(1)).toBe(T0);
    expect(table.atCos(1 + 1e-12)).toBe(T0);
    expect(table.at(0)).toBe(T0);
  });

  it("θ beyond π/2 gives 0; −θ behaves like θ; both lookups agree", () => {
    expect(table.at(Math.PI / 2 + 1e-12)).toBe(0);
    expect(table.at(2)).toBe(0);
    expect(table.at(Math.PI)).toBe(0);
    for (const t of [0.1, 0.7, 1.2, 1.5, 1.57]) {
      expect(table.at(-t)).toBe(table.at(t));
      expect(Math.abs(table.at(t) - table.atCos(Math.cos(t)))).toBeLessThan(2e-5);
    }
    // at exactly grazing (float64 π/2) the value is X(90°) = 0 for T
    expect(Math.abs(table.at(Math.PI / 2))).toBeLessThan(1e-15);
  });

  it("NaN throws instead of returning a silent number", () => {
    expect(() => table.atCos(Number.NaN)).toThrow(RangeError);
    expect(() => table.at(Number.NaN)).toThrow(RangeError);
  });

  it("refuses bad construction input", () => {
    expect(() => AngularTable.fromFunction(() => 1, 8)).toThrow(/intervals/);
    expect(() => AngularTable.fromFunction(() => 1, 100.5)).toThrow(/intervals/);
    expect(() => AngularTable.fromFunction((t) => (t > 1 ? Number.NaN : 1), 64)).toThrow(/not finite/);
    expect(() => AngularTable.fromSamples(new Float64Array(65), new Float64Array(33))).toThrow(/differ/);
    expect(() => angularTablesFromFunction(() => [1], 2, 64)).toThrow(/expected 2 values/);
  });
});
