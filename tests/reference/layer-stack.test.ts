// Reference tests for multi-layer glazing (src/lib/physics/layer-stack.ts and the optics.ts
// façade).
//
// [calc F4 with F2 layers]: glazing-physics reference §4, an independent float64 (python3 +
// numpy) solution of the net-radiation system with slab layers of §2 (6 mm, n = 1.52,
// α = 0.02 /mm); the two-layer and three-layer forms are the multiple-glazing formulas of
// EN 410:2011 §5 and ISO 9050:2003 §4 (clause numbers from memory). Printed to 6 decimals:
// each comparison allows half a unit in the last printed digit.
import { describe, expect, it } from "vitest";
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import {
  combineLayers,
  combineTwoLayers,
  glazingOpticsAt,
  type LayerOptics,
  type PolarizedLayerSource,
} from "@/lib/physics/layer-stack";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import { type Radians } from "@/lib/physics/units";
import { printed, deg, pane6mm } from "./fixtures";



const spec6mm: PaneSpec = { kind: "physical", ...pane6mm };
const source6mm: PolarizedLayerSource = (theta) => {
  const o = absorbingPaneOptics(pane6mm, theta);
  return { s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R }, p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R } };
};
const layer6mmAt = (theta: Radians): LayerOptics => {
  const o = absorbingPaneOptics(pane6mm, theta);
  return { T: o.T, Rf: o.R, Rb: o.R };
};

describe("double glazing, two 6 mm panes", () => {
  it("θ = 0: T, R, A1, A2", () => {
    // [calc F4] §4: T = 0.666439, R = 0.122195, A1 = 0.119267, A2 = 0.092099
    const s = combineLayers([layer6mmAt(deg(0)), layer6mmAt(deg(0))]);
    printed(s.T, "0.666439");
    printed(s.Rf, "0.122195");
    printed(s.absorptanceFront[0]!, "0.119267");
    printed(s.absorptanceFront[1]!, "0.092099");
  });

  // [calc F4] §4, table "Same pair, θ = 60°": route, T, R, A1, A2
  const table60 = [
    ["per-polarization", "0.560292", "0.193315", "0.145683", "0.100710"],
    ["s only", "0.378386", "0.381989", "0.155224", "0.084401"],
    ["p only", "0.742198", "0.004641", "0.136142", "0.117019"],
    ["averaged", "0.538000", "0.215160", "0.147701", "0.099139"],
  ] as const;
  it("has the four rows of the 60° table", () => expect(table60).toHaveLength(4));
  it.each(table60)("θ = 60°, route %s", (route, T, R, A1, A2) => {
    const theta = deg(60);
    const layer = source6mm(theta);
    const result =
      route === "s only"
        ? combineLayers([layer.s, layer.s])
        : route === "p only"
          ? combineLayers([layer.p, layer.p])
          : glazingOpticsAt([source6mm, source6mm], theta, { polarization: route });
    printed(result.T, T);
    printed(result.Rf, R);
    printed(result.absorptanceFront[0]!, A1);
    printed(result.absorptanceFront[1]!, A2);
  });

  it("the per-polarisation route is the default, in glazingOpticsAt and in prepareGlazing", () => {
    // [calc F4] §4: per polarisation T = 0.560292 at 60° (averaged route: 0.538000)
    printed(glazingOpticsAt([source6mm, source6mm], deg(60)).T, "0.560292");
    const g = prepareGlazing([spec6mm, spec6mm]);
    expect(g.polarization).toBe("per-polarization");
    const o = g.at(deg(60)).solar;
    printed(o.T, "0.560292");
    printed(o.Rf, "0.193315");
    printed(o.absorptanceFront[0]!, "0.145683");
    printed(o.absorptanceFront[1]!, "0.100710");
    const avg = prepareGlazing([spec6mm, spec6mm], { polarization: "averaged" });
    printed(avg.at(deg(60)).solar.T, "0.538000");
    expect(avg.warnings.map((w) => w.code)).toContain("averaged-polarization");
  });

  it("both routes agree at normal incidence", () => {
    // §4: "At normal incidence both routes agree" (s and p coincide at 0°)
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

  it("T, R, A1, A2, A3", () => {
    // [calc F4] §4: T = 0.547493, R = 0.155056, A = 0.123808, 0.097980, 0.075661
    printed(s.T, "0.547493");
    printed(s.Rf, "0.155056");
    printed(s.absorptanceFront[0]!, "0.123808");
    printed(s.absorptanceFront[1]!, "0.097980");
    printed(s.absorptanceFront[2]!, "0.075661");
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
    printed(o.T, "0.547493");
    printed(o.absorptanceFront[2]!, "0.075661");
    expect(g.at(deg(0)).visible).toBeNull(); // physical panes have no visible data
  });
});

describe("asymmetric layer", () => {
  it("outer (T, Rf, Rb) = (0.60, 0.10, 0.25) + 6 mm pane at 0°", () => {
    // [calc F4] §4 asymmetric example (hypothetical layer): T = 0.497618, Rf = 0.126891,
    // Rb = 0.242135, A1 = 0.306723, A2 = 0.068769
    const s = combineLayers([{ T: 0.6, Rf: 0.1, Rb: 0.25 }, layer6mmAt(deg(0))]);
    printed(s.T, "0.497618");
    printed(s.Rf, "0.126891");
    printed(s.Rb, "0.242135");
    printed(s.absorptanceFront[0]!, "0.306723");
    printed(s.absorptanceFront[1]!, "0.068769");
  });

  it("radiation from indoors is the mirror image: reversed stack, Rf ↔ Rb", () => {
    // symmetry of the net-radiation system (exact)
    const layers: LayerOptics[] = [
      { T: 0.6, Rf: 0.1, Rb: 0.25 },
      layer6mmAt(deg(0)),
      { T: 0.3, Rf: 0.4, Rb: 0.05 },
    ];
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
    expect(() =>
      glazingOpticsAt([source6mm], deg(30), { polarization: "sideways" as unknown as "averaged" }),
    ).toThrow(/polarization/);
  });
});
