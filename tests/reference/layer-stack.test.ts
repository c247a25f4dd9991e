// Reference tests for multi-layer glazing (src/lib/physics/layer-stack.ts and the optics.ts
// façade).
//
// The check values are the cases of src/lib/reference-cases/layer-stack.ts: the net-radiation system with
// slab layers (6 mm, n = 1.52, α = 0.02 /mm) per polarisation, solved independently in float64 by
// scripts/reference/layer-stack.ts; its two-layer and three-layer forms are the multiple-glazing formulas of
// EN 410:2011 §5 and ISO 9050:2003 §4 (clause numbers from memory). Each case gives its tolerance.
import { describe, expect, it } from "vitest";
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import { combineLayers, combineTwoLayers, glazingOpticsAt, type LayerOptics, type PolarizedLayerSource } from "@/lib/physics/layer-stack";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import { type Radians } from "@/lib/physics/units";
import {
  asymmetricCase,
  double0Case,
  double60Cases,
  layerStackDomain,
  triple0Case,
  type LayerStackCaseInput,
} from "@/lib/reference-cases/layer-stack";
import { layerStackValues, stackQuantities as quantities, unpolarizedLayerOf } from "@/lib/validation/engines/layer-stack";
import { caseById, deg, expectCase, expectValue, expectedOf, pane6mm } from "./fixtures";

const spec6mm: PaneSpec = { kind: "physical", ...pane6mm };
const source6mm: PolarizedLayerSource = (theta) => {
  const o = absorbingPaneOptics(pane6mm, theta);
  return { s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R }, p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R } };
};
const layer6mmAt = (theta: Radians): LayerOptics => {
  const o = absorbingPaneOptics(pane6mm, theta);
  return { T: o.T, Rf: o.R, Rb: o.R };
};

/** The engine's values of a layer-stack case by the case's route: the evaluator the validation report runs. */
const engine = layerStackValues;

/** A normal-incidence case through combineLayers with unpolarised layers (s and p coincide at 0°). */
function engineUnpolarized(input: LayerStackCaseInput): Record<string, number> {
  return quantities(combineLayers(input.layers.map((l) => unpolarizedLayerOf(l, deg(input.thetaDeg)))));
}

it("case ids are unique", () => {
  expect(new Set(layerStackDomain.cases.map((c) => c.id)).size).toBe(layerStackDomain.cases.length);
});

describe("double glazing, two 6 mm panes", () => {
  it(double0Case.label, () => {
    expectCase(engineUnpolarized(double0Case.input), double0Case);
    expectCase(engine(double0Case.input), double0Case);
  });

  it("has the four rows of the 60° table", () => expect(double60Cases).toHaveLength(4));
  for (const c of double60Cases) it(c.label, () => expectCase(engine(c.input), c));

  it("the per-polarisation route is the default, in glazingOpticsAt and in prepareGlazing", () => {
    // per polarisation T = 0.560292 at 60° (averaged route: 0.538000), case values
    const perPol = caseById(double60Cases, "layer-stack/double-6-6/60deg/per-polarization");
    const averaged = caseById(double60Cases, "layer-stack/double-6-6/60deg/averaged");
    expectValue(glazingOpticsAt([source6mm, source6mm], deg(60)).T, expectedOf(perPol, "T"), perPol.id);
    const g = prepareGlazing([spec6mm, spec6mm]);
    expect(g.polarization).toBe("per-polarization");
    const o = g.at(deg(60)).solar;
    expectCase({ T: o.T, Rf: o.Rf, A1: o.absorptanceFront[0]!, A2: o.absorptanceFront[1]! }, perPol);
    const avg = prepareGlazing([spec6mm, spec6mm], { polarization: "averaged" });
    expectValue(avg.at(deg(60)).solar.T, expectedOf(averaged, "T"), averaged.id);
    expect(avg.warnings.map((w) => w.code)).toContain("averaged-polarization");
  });

  it("both routes agree at normal incidence", () => {
    // s and p coincide at 0°, so both routes agree there (exact)
    const a = glazingOpticsAt([source6mm, source6mm], deg(0), { polarization: "per-polarization" });
    const b = glazingOpticsAt([source6mm, source6mm], deg(0), { polarization: "averaged" });
    expect(Math.abs(a.T - b.T)).toBeLessThan(1e-15);
    expect(Math.abs(a.Rf - b.Rf)).toBeLessThan(1e-15);
  });

  it("EN 410 two-layer formulas equal the N-layer solver", () => {
    // EN 410:2011 §5 / ISO 9050:2003 §4: τ = τ1τ2/(1 − ρ1′ρ2), ρ = ρ1 + τ1²ρ2/(1 − ρ1′ρ2), evaluated here
    const a: LayerOptics = { T: 0.6, Rf: 0.1, Rb: 0.25 };
    const b = layer6mmAt(deg(0));
    const two = combineTwoLayers(a, b);
    const D = 1 - a.Rb * b.Rf;
    expect(Math.abs(two.T - (a.T * b.T) / D)).toBeLessThan(1e-15);
    expect(Math.abs(two.Rf - (a.Rf + (a.T * a.T * b.Rf) / D))).toBeLessThan(1e-15);
    const n = combineLayers([a, b]);
    expect(Math.abs(n.T - two.T)).toBeLessThan(1e-15);
    expect(Math.abs(n.Rf - two.Rf)).toBeLessThan(1e-15);
    expect(Math.abs(n.Rb - two.Rb)).toBeLessThan(1e-15);
    // EN 410 α_e1 = α1 + τ1 α1′ ρ2/(1 − ρ1′ρ2), α_e2 = τ1 α2/(1 − ρ1′ρ2)
    const af1 = 1 - a.T - a.Rf;
    const ab1 = 1 - a.T - a.Rb;
    const af2 = 1 - b.T - b.Rf;
    expect(Math.abs(n.absorptanceFront[0]! - (af1 + (a.T * b.Rf * ab1) / D))).toBeLessThan(1e-15);
    expect(Math.abs(n.absorptanceFront[1]! - (a.T * af2) / D)).toBeLessThan(1e-15);
  });
});

describe("triple glazing, three 6 mm panes, θ = 0", () => {
  const l = layer6mmAt(deg(0));
  const s = combineLayers([l, l, l]);

  it(triple0Case.label, () => {
    expectCase(quantities(s), triple0Case);
    expectCase(engine(triple0Case.input), triple0Case);
  });

  it("equals the EN 410 three-layer closed form and the two-layer recursion", () => {
    // EN 410:2011 / ISO 9050:2003 (from memory): τ = τ1τ2τ3/[(1 − ρ1′ρ2)(1 − ρ2′ρ3) − τ2²ρ1′ρ3]
    const closed = (l.T * l.T * l.T) / ((1 - l.Rb * l.Rf) * (1 - l.Rb * l.Rf) - l.T * l.T * l.Rb * l.Rf);
    expect(Math.abs(s.T - closed)).toBeLessThan(1e-15);
    const rec = combineTwoLayers(combineTwoLayers(l, l), l);
    expect(Math.abs(s.T - rec.T)).toBeLessThan(1e-15);
    expect(Math.abs(s.Rf - rec.Rf)).toBeLessThan(1e-15);
    expect(Math.abs(s.Rb - rec.Rb)).toBeLessThan(1e-15);
  });

  it("through prepareGlazing (identical panes share one model)", () => {
    const g = prepareGlazing([spec6mm, spec6mm, spec6mm]);
    const o = g.at(deg(0)).solar;
    expectValue(o.T, expectedOf(triple0Case, "T"), triple0Case.id);
    expectValue(o.absorptanceFront[2]!, expectedOf(triple0Case, "A3"), triple0Case.id);
    expect(g.at(deg(0)).visible).toBeNull(); // physical panes have no visible data
  });
});

describe("asymmetric layer", () => {
  it(asymmetricCase.label, () => {
    // hypothetical layer, not a product
    const s = combineLayers([{ T: 0.6, Rf: 0.1, Rb: 0.25 }, layer6mmAt(deg(0))]);
    expect(asymmetricCase.input.layers[0]).toEqual({ kind: "given", T: 0.6, Rf: 0.1, Rb: 0.25 });
    expectCase(quantities(s), asymmetricCase);
    expectCase(engine(asymmetricCase.input), asymmetricCase);
  });

  it("radiation from indoors is the mirror image: reversed stack, Rf ↔ Rb", () => {
    // symmetry of the net-radiation system (exact)
    const layers: LayerOptics[] = [{ T: 0.6, Rf: 0.1, Rb: 0.25 }, layer6mmAt(deg(0)), { T: 0.3, Rf: 0.4, Rb: 0.05 }];
    const fwd = combineLayers(layers);
    const rev = combineLayers([...layers].reverse().map((l) => ({ T: l.T, Rf: l.Rb, Rb: l.Rf })));
    expect(Math.abs(fwd.T - rev.T)).toBeLessThan(1e-15);
    expect(Math.abs(fwd.Rb - rev.Rf)).toBeLessThan(1e-15);
    expect(Math.abs(fwd.Rf - rev.Rb)).toBeLessThan(1e-15);
    fwd.absorptanceBack.forEach((a, k) => {
      expect(Math.abs(a - rev.absorptanceFront[layers.length - 1 - k]!)).toBeLessThan(1e-15);
    });
    expect(Math.abs(fwd.T + fwd.Rf + fwd.absorptanceFront.reduce((x, y) => x + y) - 1)).toBeLessThan(1e-15);
    expect(Math.abs(fwd.T + fwd.Rb + fwd.absorptanceBack.reduce((x, y) => x + y) - 1)).toBeLessThan(1e-15);
  });
});

describe("limits and input checks", () => {
  it("one layer returns itself", () => {
    const s = combineLayers([{ T: 0.6, Rf: 0.1, Rb: 0.25 }]);
    expect(s.T).toBe(0.6);
    expect(s.Rf).toBe(0.1);
    expect(s.Rb).toBe(0.25);
    expect(Math.abs(s.absorptanceFront[0]! - 0.3)).toBeLessThan(1e-15);
    expect(Math.abs(s.absorptanceBack[0]! - 0.15)).toBeLessThan(1e-15);
  });

  it("perfect mirrors facing each other give no NaN", () => {
    const mirror: LayerOptics = { T: 0, Rf: 1, Rb: 1 };
    const s = combineLayers([mirror, mirror, { T: 0.5, Rf: 0.2, Rb: 0.2 }]);
    expect(s.T).toBe(0);
    expect(s.Rf).toBe(1);
    for (const a of [...s.absorptanceFront, ...s.absorptanceBack]) expect(Number.isNaN(a)).toBe(false);
  });

  it("grazing incidence: T = 0, R = 1 for the whole stack", () => {
    const s = glazingOpticsAt([source6mm, source6mm, source6mm], deg(90));
    expect(s.T).toBe(0);
    expect(s.Rf).toBe(1);
  });

  it("refuses bad layer counts and layer values, naming them", () => {
    const ok: LayerOptics = { T: 0.5, Rf: 0.1, Rb: 0.1 };
    expect(() => combineLayers([])).toThrow(/number of layers/);
    expect(() => combineLayers(Array(7).fill(ok))).toThrow(/number of layers/);
    expect(() => combineLayers([ok, { T: 0.8, Rf: 0.3, Rb: 0.1 }])).toThrow(/layer 2: T \+ Rf/);
    expect(() => combineLayers([{ T: 0.5, Rf: 0.1, Rb: 0.6 }])).toThrow(/layer 1: T \+ Rb/);
    expect(() => combineLayers([{ T: Number.NaN, Rf: 0.1, Rb: 0.1 }])).toThrow(/layer 1: T/);
    expect(() => combineLayers([{ T: 0.5, Rf: -0.1, Rb: 0.1 }])).toThrow(/Rf/);
    expect(() => glazingOpticsAt([source6mm], deg(91))).toThrow(/angle of incidence/);
    expect(() => glazingOpticsAt([source6mm], deg(30), { polarization: "sideways" as unknown as "averaged" })).toThrow(/polarization/);
  });
});
