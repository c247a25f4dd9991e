// The API's glazing calculation end to end (request → response), checked against the worked values of the
// glazing-physics handbook: [calc F2/F4/F5/F7/F8] = computed from the published formulas of
// EN 410:2011 / ISO 9050:2003 (adding method, g), EN 673:2011 (U) and the Fresnel/slab model
// (Duffie & Beckman ch. 5; Rubin 1982). Tolerance 5e-7 = half a unit in the printed 6th decimal
// unless stated.
import { describe, expect, it } from "vitest";
import { GlazingRequest, type GlazingRequestInput } from "@/lib/contracts/glazing";
import { calculateGlazing } from "@/lib/calc/glazing";

const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const pane4 = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const air16 = { kind: "gap", widthMm: 16, gas: "air" } as const;
const calc = (body: GlazingRequestInput) => calculateGlazing(GlazingRequest.parse(body));
const close = (actual: number, expected: number, tol = 5e-7) => expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol);

describe("double glazing 6 | 16 air | 6, uncoated", () => {
  const r = calc({ layers: [pane6, air16, pane6], anglesDeg: [0, 30, 60, 80] });
  const at = (deg: number) => r.angles.find((a) => a.angleDeg === deg)!;

  it("normal incidence: τ, ρ, α1, α2 [calc F4] and g [calc F7]", () => {
    close(at(0).solarTransmittance, 0.666439);
    close(at(0).solarReflectanceFront, 0.122195);
    close(at(0).layerAbsorptance[0]!, 0.119267);
    close(at(0).layerAbsorptance[1]!, 0.092099);
    close(at(0).gValue, 0.741378);
  });

  it("oblique incidence, stack solved per polarisation [calc F4, F7]", () => {
    close(at(30).gValue, 0.73334);
    close(at(60).solarTransmittance, 0.560292);
    close(at(60).solarReflectanceFront, 0.193315);
    close(at(60).layerAbsorptance[0]!, 0.145683);
    close(at(60).layerAbsorptance[1]!, 0.10071);
    close(at(60).gValue, 0.644037);
    close(at(80).gValue, 0.259083);
  });

  it("hemispherical values [calc F5, 400-node Gauss–Legendre in the handbook]", () => {
    close(r.hemispherical.solarTransmittance, 0.577379);
    close(r.hemispherical.solarReflectanceFront, 0.191431);
    close(r.hemispherical.layerAbsorptance[0]!, 0.136229);
    close(r.hemispherical.layerAbsorptance[1]!, 0.0949614, 5e-8);
  });

  it("energy balance T + R + ΣA = 1 at every angle (conservation; no source needed)", () => {
    for (const a of r.angles) close(a.solarTransmittance + a.solarReflectanceFront + a.layerAbsorptance.reduce((s, x) => s + x, 0), 1, 1e-12);
  });

  it("the labelled simplification (each pane averaged first) gives the handbook's lower T at 60° [calc F4]", () => {
    const avg = calc({ layers: [pane6, air16, pane6], anglesDeg: [60], polarization: "averaged" });
    close(avg.angles[0]!.solarTransmittance, 0.538);
    expect(avg.warnings.join(" ")).toMatch(/averag/i);
  });
});

describe("U-values through the API calculation [calc F8]", () => {
  it.each([
    ["single 4 mm", [pane4], 5.79783],
    ["4 | 16 air | 4", [pane4, air16, pane4], 2.74205],
    ["4 | 16 argon | 4", [pane4, { kind: "gap", widthMm: 16, gas: "argon" }, pane4], 2.61595],
    ["4 | 16 Ar 90 % | 4, ε = 0.03 on face 3", [pane4, { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } }, { ...pane4, emissivityFront: 0.03 }], 1.1044],
    [
      "4 | 16 Ar | 4 | 16 Ar | 4, ε = 0.03 on faces 2 and 5",
      [{ ...pane4, emissivityBack: 0.03 }, { kind: "gap", widthMm: 16, gas: "argon" }, pane4, { kind: "gap", widthMm: 16, gas: "argon" }, { ...pane4, emissivityFront: 0.03 }],
      0.54374,
    ],
  ] as const)("%s → U %f W/m²K", (_label, layers, u) => {
    close(calc({ layers: layers as never }).uValue, u, 5e-6);
  });

  it("accepts gas fractions that add up to 1 only within typing precision", () => {
    const a = calc({ layers: [pane4, { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1004 } }, pane4] }).uValue;
    const b = calc({ layers: [pane4, { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } }, pane4] }).uValue;
    close(a, b, 1e-3);
  });
});

describe("single 6 mm pane [calc F2, F7]", () => {
  it("g at 0° and 60°, hemispherical g", () => {
    const r = calc({ layers: [pane6], anglesDeg: [0, 60] });
    close(r.angles[0]!.gValue, 0.843195);
    close(r.angles[1]!.gValue, 0.760809);
    close(r.hemispherical.gValue, 0.768774);
  });
});

describe("warnings", () => {
  it("flags a highly absorbing pane for thermal stress (threshold 0.5: common practice, no source)", () => {
    const tinted = { kind: "pane", thicknessMm: 10, refractiveIndex: 1.52, absorptionPerMm: 0.15 } as const;
    const r = calc({ layers: [tinted, air16, pane4] });
    expect(r.angles[0]!.layerAbsorptance[0]!).toBeGreaterThan(0.5);
    expect(r.warnings.join(" ")).toMatch(/Pane 1 absorbs .* thermal stress/);
  });
  it("notes unusual gap widths, a tilted unit and missing light values", () => {
    const r = calc({ layers: [pane4, { kind: "gap", widthMm: 40, gas: "air" }, pane4], tiltDeg: 30 });
    const text = r.warnings.join(" ");
    expect(text).toMatch(/Gap 1 is 40 mm/);
    expect(text).toMatch(/tilted 30°/);
    expect(text).toMatch(/Light transmittance needs measured visible values/);
    expect(r.angles[0]!.visibleTransmittance).toBeNull();
  });
  it("gives light transmittance when every pane has measured visible values", () => {
    const m = {
      kind: "pane",
      thicknessMm: 4,
      measured: { solarTransmittance: 0.83, solarReflectanceFront: 0.075, solarReflectanceBack: 0.075, visibleTransmittance: 0.9, visibleReflectanceFront: 0.08, visibleReflectanceBack: 0.08 },
    } as const;
    const r = calc({ layers: [m, air16, m] });
    expect(r.angles[0]!.visibleTransmittance).toBeGreaterThan(0.75);
    expect(r.angles[0]!.visibleTransmittance).toBeLessThan(0.9);
    expect(r.hemispherical.visibleTransmittance).toBeLessThan(r.angles[0]!.visibleTransmittance!);
  });
});
