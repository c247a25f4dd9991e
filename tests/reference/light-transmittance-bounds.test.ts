// Light transmittance of a unit whose panes may give τv alone: the adding method at normal incidence
// (ISO 9050:2003 §5 and EN 410:2011 §5 give it for double and triple glazing:
//   τ = τ1·τ2 / (1 − ρ1'·ρ2)  and  τ = τ1·τ2·τ3 / ((1 − ρ1'·ρ2)(1 − ρ2'·ρ3) − τ2²·ρ1'·ρ3)),
// and the bounds that unknown light reflectances allow (0 … 1 − τv).
import { describe, expect, it } from "vitest";
import { lightTransmittanceBounds } from "@/lib/physics/light-transmittance-bounds";
import { prepareGlazing } from "@/lib/physics/optics";
import { lightTransmittanceDomain } from "@/lib/reference-cases/light-transmittance";
import { lightTransmittanceValues } from "@/lib/validation/engines/light-transmittance";
import { expectCase } from "./fixtures";

const close = (a: number, b: number, tol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol);

describe("light transmittance at normal incidence, adding method", () => {
  // The cases of src/lib/reference-cases/light-transmittance.ts (closed forms of ISO 9050:2003 §5 / EN 410:2011 §5,
  // the usually listed τv of clear double glazing), through the evaluator the validation report runs.
  it.each(lightTransmittanceDomain.cases)("$label", (c) => expectCase(lightTransmittanceValues(c.input), c));

  it("agrees with the project's angular optics at 0° when every light value is known", () => {
    const panes = [
      { T: 0.83, Rf: 0.075, Rb: 0.075, vis: { T: 0.9, Rf: 0.08, Rb: 0.08 } },
      { T: 0.5, Rf: 0.25, Rb: 0.3, vis: { T: 0.78, Rf: 0.05, Rb: 0.04 } },
    ];
    const g = prepareGlazing(
      panes.map((p) => ({ kind: "measured" as const, thicknessM: 0.004, solar: { T: p.T, Rf: p.Rf, Rb: p.Rb }, visible: p.vis })),
      {},
    );
    const v = g.at(0 as never).visible!;
    close(lightTransmittanceBounds(panes.map((p) => p.vis)).low, v.T, 1e-9);
  });

  it("unknown reflectances give a range that holds every possible value", () => {
    const known = { T: 0.9, Rf: 0.08, Rb: 0.08 };
    // the bounds themselves: case light-transmittance/unknown-reflectance; any reflectance in between lands inside the range
    const b = lightTransmittanceBounds([known, { T: 0.7 }]);
    for (const r of [0, 0.05, 0.15, 0.3]) {
      const t = lightTransmittanceBounds([known, { T: 0.7, Rf: r, Rb: r }]).low;
      expect(t).toBeGreaterThanOrEqual(b.low - 1e-15);
      expect(t).toBeLessThanOrEqual(b.high + 1e-15);
    }
  });

  it("refuses values that are not fractions", () => {
    expect(() => lightTransmittanceBounds([{ T: 1.2 }])).toThrow(RangeError);
    expect(() => lightTransmittanceBounds([])).toThrow(RangeError);
  });
});
