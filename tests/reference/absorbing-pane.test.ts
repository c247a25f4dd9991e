// Reference tests for one uncoated absorbing pane (src/lib/physics/absorbing-pane.ts).
//
// The check values are the cases of src/lib/reference-cases/absorbing-pane.ts: the incoherent slab series of
// Duffie & Beckman, Solar Engineering of Thermal Processes, 4th ed., ch. 5 (from memory) and M. Rubin,
// Int. J. Energy Research 6:123–133 (1982), per polarisation, evaluated independently in float64 by
// scripts/reference/absorbing-pane.ts. Each case gives its tolerance.
import { describe, expect, it } from "vitest";
import { absorbingPaneOptics, checkAbsorbingPane, slabFromFaceReflectance } from "@/lib/physics/absorbing-pane";
import { asRadians } from "@/lib/physics/units";
import { fresnelReflectancesReal } from "@/lib/physics/fresnel";
import {
  absorbingPaneDomain,
  averagedFacesCase,
  losslessCase,
  lowIron0Case,
  pane6mm58Case,
  pane6mmCases,
  ratio6mmCases,
  ratioLowIronCases,
} from "@/lib/reference-cases/absorbing-pane";
import { absorbingPaneValues } from "@/lib/validation/engines/absorbing-pane";
import { deg, expectCase, expectValue, expectedOf, pane6mm, lowIron4mm, paneFromMm } from "./fixtures";

/** The engine's values of an absorbing-pane case: the evaluator the validation report runs. */
const engine = absorbingPaneValues;

it("the case panes are the test panes of the fixtures", () => {
  expect(paneFromMm(pane6mmCases[0]!.input.pane)).toEqual(pane6mm);
  expect(paneFromMm(lowIron0Case.input.pane)).toEqual(lowIron4mm);
  expect(new Set(absorbingPaneDomain.cases.map((c) => c.id)).size).toBe(absorbingPaneDomain.cases.length);
});

describe("6 mm pane, n = 1.52, α = 0.02 /mm", () => {
  it("has the four rows of the 6 mm table", () => expect(pane6mmCases).toHaveLength(4));
  for (const c of pane6mmCases) {
    it(c.label, () => {
      const o = absorbingPaneOptics(pane6mm, deg(c.input.thetaDeg));
      // θt (tolerance of the case: one unit in the last printed digit) and Snell's law in closed form
      expect(Math.abs(o.cosThetaT - Math.cos(Math.asin(Math.sin(deg(c.input.thetaDeg)) / 1.52)))).toBeLessThan(1e-15);
      expectCase(engine(c.input), c);
    });
  }

  it("catches the common error of averaging R_s and R_p before the slab series", () => {
    // that route gives T = 0.716271 at 60°, the correct value is 0.726272 (case values)
    const r = engine(averagedFacesCase.input);
    expectCase(r, averagedFacesCase);
    expect(r.T! - r.TAveragedFaces!).toBeGreaterThan(0.009);
  });

  it(pane6mm58Case.label, () => expectCase(engine(pane6mm58Case.input), pane6mm58Case));

  for (const c of ratio6mmCases) it(`reference curve: ${c.label}`, () => expectCase(engine(c.input), c));
});

describe("4 mm low-iron pane, n = 1.52, α = 0.002 /mm", () => {
  it(lowIron0Case.label, () => expectCase(engine(lowIron0Case.input), lowIron0Case));

  for (const c of ratioLowIronCases) it(`reference curve: ${c.label}`, () => expectCase(engine(c.input), c));
});

describe("closed forms and limits", () => {
  it("no absorption: T = (1 − R)/(1 + R) per polarisation; at 0°, T = 2n/(n² + 1) = 0.918318", () => {
    // closed form of the lossless slab (Duffie & Beckman ch. 5, from memory);
    // 2n/(n² + 1) = 0.918318 for n = 1.52 (case value)
    const lossless = paneFromMm(losslessCase.input.pane);
    expectValue(absorbingPaneOptics(lossless, deg(0)).T, expectedOf(losslessCase, "T"), losslessCase.id);
    expect(Math.abs(absorbingPaneOptics(lossless, deg(0)).T - (2 * 1.52) / (1.52 ** 2 + 1))).toBeLessThan(1e-15);
    for (const d of [10, 40, 70, 89]) {
      const o = absorbingPaneOptics(lossless, deg(d));
      const f = fresnelReflectancesReal(1, 1.52, deg(d));
      expect(Math.abs(o.s.T - (1 - f.Rs) / (1 + f.Rs))).toBeLessThan(1e-15);
      expect(Math.abs(o.p.T - (1 - f.Rp) / (1 + f.Rp))).toBeLessThan(1e-15);
      expect(o.A).toBe(0);
    }
  });

  it("grazing incidence: T = A = 0, R = 1", () => {
    // θ → 90° gives R → 1, T → 0 (closed-form limit)
    const o = absorbingPaneOptics(pane6mm, asRadians(Math.PI / 2));
    expect(o.T).toBe(0);
    expect(o.R).toBe(1);
    expect(o.A).toBe(0);
    const near = absorbingPaneOptics(pane6mm, deg(89.9999));
    expect(near.T).toBeGreaterThan(0);
    expect(near.T).toBeLessThan(1e-5);
  });

  it("opaque limit: huge α gives T = 0 and R = face reflectance, no NaN", () => {
    // closed form: τ → 0 leaves R_slab = ρ (first-surface reflection only)
    const dark = { thicknessM: 0.01, refractiveIndex: 1.52, absorptionPerM: 1e6 };
    const o = absorbingPaneOptics(dark, deg(45));
    const f = fresnelReflectancesReal(1, 1.52, deg(45));
    expect(o.T).toBe(0);
    expect(o.s.R).toBe(f.Rs);
    expect(o.p.R).toBe(f.Rp);
    expect(Math.abs(o.A - (1 - 0.5 * (f.Rs + f.Rp)))).toBeLessThan(1e-15);
  });

  it("T + R + A = 1 and each in [0, 1], for s and p, at every angle", () => {
    // energy balance of the slab series (exact)
    for (const spec of [pane6mm, lowIron4mm, { thicknessM: 0.012, refractiveIndex: 1.9, absorptionPerM: 300 }]) {
      for (let d = 0; d <= 90; d += 0.25) {
        const o = absorbingPaneOptics(spec, deg(d));
        for (const part of [o.s, o.p, o]) {
          expect(Math.abs(part.T + part.R + part.A - 1)).toBeLessThan(1e-15);
          for (const v of [part.T, part.R, part.A]) {
            expect(v).toBeGreaterThanOrEqual(0);
            expect(v).toBeLessThanOrEqual(1);
          }
        }
      }
    }
  });
});

describe("input checks", () => {
  it.each([
    [{ thicknessM: 0, refractiveIndex: 1.52, absorptionPerM: 20 }, /thickness/],
    [{ thicknessM: -0.004, refractiveIndex: 1.52, absorptionPerM: 20 }, /thickness/],
    [{ thicknessM: Number.NaN, refractiveIndex: 1.52, absorptionPerM: 20 }, /thickness/],
    [{ thicknessM: 6, refractiveIndex: 1.52, absorptionPerM: 20 }, /thickness/],
    [{ thicknessM: 0.004, refractiveIndex: 1, absorptionPerM: 20 }, /refractive index/],
    [{ thicknessM: 0.004, refractiveIndex: 0.5, absorptionPerM: 20 }, /refractive index/],
    [{ thicknessM: 0.004, refractiveIndex: Number.POSITIVE_INFINITY, absorptionPerM: 20 }, /refractive index/],
    [{ thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: -1 }, /absorption coefficient/],
    [{ thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: Number.NaN }, /absorption coefficient/],
  ])("refuses %o", (spec, message) => {
    expect(() => checkAbsorbingPane(spec)).toThrow(RangeError);
    expect(() => absorbingPaneOptics(spec, deg(0))).toThrow(message);
  });

  it("refuses angles outside [0, π/2] and bad slab inputs", () => {
    expect(() => absorbingPaneOptics(pane6mm, asRadians(2))).toThrow(/angle of incidence/);
    expect(() => slabFromFaceReflectance(1.1, 0.5)).toThrow(/face reflectance/);
    expect(() => slabFromFaceReflectance(0.1, Number.NaN)).toThrow(/internal transmittance/);
  });
});
