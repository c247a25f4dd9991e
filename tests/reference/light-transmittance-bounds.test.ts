// Light transmittance of a unit whose panes may give τv alone: the adding method at normal incidence
// (ISO 9050:2003 §5 and EN 410:2011 §5 give it for double and triple glazing:
//   τ = τ1·τ2 / (1 − ρ1'·ρ2)  and  τ = τ1·τ2·τ3 / ((1 − ρ1'·ρ2)(1 − ρ2'·ρ3) − τ2²·ρ1'·ρ3)),
// and the bounds that unknown light reflectances allow (0 … 1 − τv).
import { describe, expect, it } from "vitest";
import { lightTransmittanceBounds } from "@/lib/physics/light-transmittance-bounds";
import { prepareGlazing } from "@/lib/physics/optics";

const close = (a: number, b: number, tol = 1e-12) => expect(Math.abs(a - b)).toBeLessThanOrEqual(tol);

describe("light transmittance at normal incidence, adding method", () => {
  it("double glazing equals ISO 9050's closed form τ1τ2/(1 − ρ1'ρ2)", () => {
    // Clear 4 mm float, τv 0.90 and ρv 0.08 per face (typical data-sheet values: common practice, no source).
    const b = lightTransmittanceBounds([
      { T: 0.9, Rf: 0.08, Rb: 0.08 },
      { T: 0.9, Rf: 0.08, Rb: 0.08 },
    ]);
    expect(b.exact).toBe(true);
    close(b.low, (0.9 * 0.9) / (1 - 0.08 * 0.08));
    close(b.high, b.low);
    // Such a unit is usually listed with τv ≈ 0.81–0.82 (from memory, makers' tables of 4 | 16 | 4 clear).
    expect(b.low).toBeGreaterThan(0.81);
    expect(b.low).toBeLessThan(0.82);
  });

  it("triple glazing equals ISO 9050's closed form", () => {
    const p = [
      { T: 0.89, Rf: 0.08, Rb: 0.09 },
      { T: 0.8, Rf: 0.1, Rb: 0.05 },
      { T: 0.88, Rf: 0.07, Rb: 0.08 },
    ];
    const [a, m, c] = p as [(typeof p)[0], (typeof p)[0], (typeof p)[0]];
    const closed = (a.T * m.T * c.T) / ((1 - a.Rb * m.Rf) * (1 - m.Rb * c.Rf) - m.T * m.T * a.Rb * c.Rf);
    close(lightTransmittanceBounds(p).low, closed);
  });

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

  it("a single pane giving τv alone is exact: no unknown reflectance enters", () => {
    const b = lightTransmittanceBounds([{ T: 0.71 }]);
    expect(b).toEqual({ low: 0.71, high: 0.71, exact: true });
  });

  it("unknown reflectances give a range that holds every possible value", () => {
    const known = { T: 0.9, Rf: 0.08, Rb: 0.08 };
    const b = lightTransmittanceBounds([known, { T: 0.7 }]);
    expect(b.exact).toBe(false);
    close(b.low, 0.9 * 0.7); // ρ of the second pane's outer face 0: no inter-reflection
    close(b.high, (0.9 * 0.7) / (1 - 0.08 * 0.3)); // at most 1 − τv = 0.3
    // Any reflectance in between lands inside the range.
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
