// Reference tests for hemispherical (diffuse) averages (src/lib/physics/hemispherical.ts and
// optics.ts).
//
// X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ (ISO 15099:2003 and Duffie & Beckman ch. 5, from memory).
// The check values are the cases of src/lib/reference-cases/hemispherical.ts, computed independently in
// float64 by scripts/reference/hemispherical.ts with its own 400-node Gauss–Legendre rule, per polarisation
// where stacks are involved. Each case gives its tolerance (half a unit in the last printed digit).
import { describe, expect, it } from "vitest";
import { DEFAULT_HEMISPHERICAL_NODES, hemisphericalAverage, hemisphericalQuadrature } from "@/lib/physics/hemispherical";
import { gaussLegendre } from "@/lib/physics/quadrature";
import { asRadians } from "@/lib/physics/units";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import {
  double6mmCase,
  hemisphericalDomain,
  lowIron4mmCase,
  quadratureCases,
  single6mmCase,
  type HemisphericalCaseInput,
} from "@/lib/reference-cases/hemispherical";
import { hemisphericalValues } from "@/lib/validation/engines/hemispherical";
import { expectCase, pane6mm, lowIron4mm, paneFromMm } from "./fixtures";

const specsOf = (input: HemisphericalCaseInput): PaneSpec[] => input.panes.map((p) => ({ kind: "physical", ...paneFromMm(p) }));

/** The engine's hemispherical values of a case: the evaluator the validation report runs. */
const engine = hemisphericalValues;

it("the case panes are the test panes of the fixtures; ids are unique", () => {
  expect(paneFromMm(single6mmCase.input.panes[0]!)).toEqual(pane6mm);
  expect(paneFromMm(lowIron4mmCase.input.panes[0]!)).toEqual(lowIron4mm);
  expect(new Set(hemisphericalDomain.cases.map((c) => c.id)).size).toBe(hemisphericalDomain.cases.length);
});

describe("Gauss–Legendre rule", () => {
  it("2 and 3 nodes: closed forms ±1/√3 (w = 1); 0, ±√(3/5) (w = 8/9, 5/9)", () => {
    // Abramowitz & Stegun, Handbook of Mathematical Functions, Table 25.4 (from memory); closed forms
    const r2 = gaussLegendre(2);
    expect(Math.abs(Math.abs(r2.x[0]!) - 1 / Math.sqrt(3))).toBeLessThan(1e-15);
    expect(Math.abs(r2.w[0]! - 1)).toBeLessThan(1e-15);
    const r3 = gaussLegendre(3);
    const sorted = [...r3.x].sort((a, b) => a - b);
    expect(Math.abs(sorted[0]! + Math.sqrt(0.6))).toBeLessThan(1e-15);
    expect(Math.abs(sorted[1]!)).toBeLessThan(1e-15);
    expect(Math.abs(sorted[2]! - Math.sqrt(0.6))).toBeLessThan(1e-15);
    const wMid = r3.w[r3.x.findIndex((x) => Math.abs(x) < 1e-12)]!;
    expect(Math.abs(wMid - 8 / 9)).toBeLessThan(1e-15);
  });

  it("integrates x^k exactly for k ≤ 2n − 1: ∫_{-1}^{1} x^k dx = 2/(k+1) (even k), 0 (odd k)", () => {
    for (const n of [5, 20, 32]) {
      const { x, w } = gaussLegendre(n);
      for (let k = 0; k <= 2 * n - 1; k++) {
        let acc = 0;
        for (let i = 0; i < n; i++) acc += w[i]! * x[i]! ** k;
        expect(Math.abs(acc - (k % 2 === 0 ? 2 / (k + 1) : 0))).toBeLessThan(1e-13);
      }
    }
  });
});

describe("hemispherical weights", () => {
  it(`default ${DEFAULT_HEMISPHERICAL_NODES} nodes (≥ 20); weights sum to 1`, () => {
    // ∫_0^{π/2} sin 2θ dθ = 1 (closed form)
    const q = hemisphericalQuadrature();
    expect(DEFAULT_HEMISPHERICAL_NODES).toBeGreaterThanOrEqual(20);
    expect(q.thetaRad).toHaveLength(DEFAULT_HEMISPHERICAL_NODES);
    expect(Math.abs(q.weight.reduce((a, b) => a + b, 0) - 1)).toBeLessThan(1e-15);
    expect(hemisphericalAverage(() => 1)).toBeCloseTo(1, 15);
  });

  it("closed forms: ∫ cos θ sin 2θ dθ = 2/3, ∫ cos² θ sin 2θ dθ = 1/2, ∫ θ sin 2θ dθ = π/4", () => {
    expect(Math.abs(hemisphericalAverage((t) => Math.cos(t)) - 2 / 3)).toBeLessThan(1e-14);
    expect(Math.abs(hemisphericalAverage((t) => Math.cos(t) ** 2) - 0.5)).toBeLessThan(1e-14);
    expect(Math.abs(hemisphericalAverage((t) => t) - Math.PI / 4)).toBeLessThan(1e-14);
  });

  for (const c of quadratureCases) it(c.label, () => expectCase(engine(c.input), c));

  it("refuses bad node counts and non-finite integrands", () => {
    expect(() => hemisphericalQuadrature(0)).toThrow(/nodes/);
    expect(() => hemisphericalQuadrature(2.5)).toThrow(/nodes/);
    expect(() => gaussLegendre(5000)).toThrow(/nodes/);
    expect(() => hemisphericalAverage(() => Number.NaN)).toThrow(/not finite/);
  });
});

describe("hemispherical glazing values", () => {
  it(single6mmCase.label, () => expectCase(engine(single6mmCase.input), single6mmCase));

  it(lowIron4mmCase.label, () => expectCase(engine(lowIron4mmCase.input), lowIron4mmCase));

  it(double6mmCase.label, () => {
    const g = prepareGlazing(specsOf(double6mmCase.input));
    const h = g.hemispherical().solar;
    expectCase(engine(double6mmCase.input), double6mmCase);
    // energy balance survives the averaging (weights sum to 1)
    expect(Math.abs(h.T + h.Rf + h.absorptanceFront[0]! + h.absorptanceFront[1]! - 1)).toBeLessThan(1e-14);
    // computed once, then served from the cache
    expect(g.hemispherical()).toBe(g.hemispherical());
    // the diffuse value lies near the value at 58–60° (rule of thumb, our own comparison) — checked for the
    // single pane only
    const single = prepareGlazing([{ kind: "physical", ...pane6mm }]);
    const t58 = single.at(asRadians((58 * Math.PI) / 180)).solar.T;
    expect(Math.abs(single.hemispherical().solar.T - t58)).toBeLessThan(0.003);
  });

  it("a different node count (40) changes the 6 mm value by < 1e-7", () => {
    // 20 nodes already agree with 400 nodes to < 1e-7 (the 20-node and converged 6 mm cases differ by 2e-8)
    const spec: PaneSpec = { kind: "physical", ...pane6mm };
    const a = prepareGlazing([spec], { hemisphericalNodes: 40 }).hemispherical().solar.T;
    const b = prepareGlazing([spec]).hemispherical().solar.T;
    expect(Math.abs(a - b)).toBeLessThan(1e-7);
    expect(() => prepareGlazing([spec], { hemisphericalNodes: 10 })).toThrow(/hemisphericalNodes/);
  });
});
