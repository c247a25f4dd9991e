// Total solar energy transmittance g per EN 410:2011 (h_e 23, h_i 8.0 for uncoated glass), with the gap
// conductance from EN 673:2011. The check values, tolerances and sources are the cases of
// @/lib/reference-cases/g-value: computed from the EN 410 formulae (from memory) and reproduced
// independently by scripts/reference/g-value.ts.
//
// The optical inputs (T, A) of the g cases are the printed optics (6 decimals) of the panes each case names
// (Fresnel + absorbing slab + adding method, hemispherical by 400-node Gauss–Legendre); the same script
// recomputes them from the panes. Here they are inputs: these tests check the EN 410 part alone.
// Tolerance for g and q_i: each printed input carries ≤ 5e-7, which reaches g as ≤ 5e-7·(1 + Σ N_k) ≤ 9e-7
// (double glazing, Σ N_k = 0.78); the printed g itself carries 5e-7 → 1.5e-6 in total. N_k and Λ come
// from unrounded EN 673 values: half a printed unit (5e-7 for N, 5e-6 for Λ).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  EN410_EDITION,
  gValue,
  internalHeatTransferCoefficientEn410,
  secondaryHeatTransfer,
  secondaryHeatTransferFactors,
  secondaryHeatTransferFactorsEn410,
} from "@/lib/physics/g-value";
import { uValueEn673, type GlazingThermalInput } from "@/lib/physics/u-value";
import { gValueDomain, type GValueCase, type GValueCaseInput } from "@/lib/reference-cases/g-value";
import { evaluateGValue } from "@/lib/validation/engines/g-value";
import { caseById, expectEvaluation, expectedOf } from "./fixtures";

const gValueCase = (id: string): GValueCase => caseById(gValueDomain.cases, id);
const opticsOf = (c: GValueCase) => {
  if (!c.input.optics) throw new Error(`${c.id} has no optical input`);
  return c.input.optics;
};
/** The case's make-up (mm) as the engine takes it (m). */
const toUnit = (unit: GValueCaseInput["unit"]): GlazingThermalInput => ({
  panes: unit.panes.map((p) => ({ thicknessM: p.thicknessMm * 1e-3, emissivityFront: p.emissivityFront, emissivityBack: p.emissivityBack })),
  gaps: unit.gaps.map((g) => ({ widthM: g.widthMm * 1e-3, gas: g.gas })),
});
const factorsOf = (c: GValueCase) =>
  secondaryHeatTransferFactorsEn410(toUnit(c.input.unit), c.input.glassConduction ? { glassConduction: c.input.glassConduction } : {}).factors;
/** q_i (where the case gives it) and g from the case's printed optics, each within the case's tolerance. */
const expectG = (c: GValueCase) => {
  const o = opticsOf(c);
  const n = factorsOf(c);
  const qi = c.expected.find((e) => e.quantity === "secondaryHeatTransfer");
  if (qi) expect(Math.abs(secondaryHeatTransfer(o.absorptances, n) - qi.value)).toBeLessThan(qi.tolerance.abs);
  const g = expectedOf(c, "gValue");
  expect(Math.abs(gValue(o.solarTransmittance, o.absorptances, n) - g.value)).toBeLessThan(g.tolerance.abs);
};
const gCases = (panes: number) => gValueDomain.cases.filter((c) => c.input.kind === "g" && c.input.unit.panes.length === panes);

const double6Air16: GlazingThermalInput = {
  panes: [{ thicknessM: 0.006 }, { thicknessM: 0.006 }],
  gaps: [{ widthM: 0.016, gas: "air" }],
};

// Every case through the evaluator the validation report runs; the blocks below check each part one by one.
describe("every g-value case, through the validation evaluator", () => {
  it.each(gValueDomain.cases)("$id", (c) => expectEvaluation(evaluateGValue(c), c));
});

describe("single pane", () => {
  // EN 410 single glazing (from memory): q_i = α_e h_i/(h_e + h_i) → N = 8/31 = 0.258065.
  const factor = gValueCase("g-value/single-6/factor");
  it("N = h_i / (h_e + h_i) = 8/31", () => {
    const r = secondaryHeatTransferFactorsEn410(toUnit(factor.input.unit));
    const n = expectedOf(factor, "factors[0]");
    expect(r.factors).toHaveLength(1);
    expect(r.factors[0]).toBeCloseTo(8 / 31, 12);
    expect(Math.abs(r.factors[0]! - n.value)).toBeLessThan(n.tolerance.abs);
    expect(r.internalCoefficientWPerM2K).toBeCloseTo(8, 12);
    expect(r.externalCoefficientWPerM2K).toBe(23);
    expect(r.standard).toBe(EN410_EDITION);
  });

  // 6 mm pane (n 1.52, α 0.02/mm) at 0/30/60/80° and hemispherical; low-iron 4 mm at 0°. N fixed at its
  // normal-incidence thermal value at every angle (common practice, no source); g is linear in T and A, so
  // hemispherical T and A give the hemispherical g.
  it("has the 6 mm pane at four angles and hemispherical, and the low-iron pane", () => {
    expect(gCases(1).map((c) => c.id)).toEqual([
      "g-value/single-6/0deg",
      "g-value/single-6/30deg",
      "g-value/single-6/60deg",
      "g-value/single-6/80deg",
      "g-value/single-6/hemispherical",
      "g-value/low-iron-4/0deg",
    ]);
  });
  for (const c of gCases(1)) it(c.label, () => expectG(c));

  // Closed form: h_i = 3.6 + 4.4·0.2/0.837 = 4.651374 for a room-side low-e surface (ε 0.2),
  // so N = h_i/(23 + h_i).
  it("room-side emissivity lowers h_i and N", () => {
    const r = secondaryHeatTransferFactorsEn410({ panes: [{ thicknessM: 0.006, emissivityBack: 0.2 }], gaps: [] });
    const hi = 3.6 + (4.4 * 0.2) / 0.837;
    expect(r.internalCoefficientWPerM2K).toBeCloseTo(hi, 12);
    expect(internalHeatTransferCoefficientEn410(0.2)).toBeCloseTo(hi, 12);
    expect(r.roomSideEmissivity).toBe(0.2);
    expect(r.factors[0]).toBeCloseTo(hi / (23 + hi), 12);
  });
});

describe("double glazing 6 / 16 air / 6, uncoated", () => {
  const network = gValueCase("g-value/double-6-16air-6/network");
  const r = secondaryHeatTransferFactorsEn410(toUnit(network.input.unit));
  const hs = expectedOf(network, "gaps[0].conductanceWPerM2K");
  const lambda = expectedOf(network, "conductancesBetweenPanesWPerM2K[0]");

  // h_s = 5.31315 (EN 673, as in the U-value cases) and Λ = 1/(d1/λ + 1/h_s + d2/λ) = 4.99470 W/m²K.
  it(`Λ = ${lambda.value} from h_s = ${hs.value}`, () => {
    expect(Math.abs(r.thermal.gaps[0]!.conductanceWPerM2K - hs.value)).toBeLessThan(hs.tolerance.abs);
    expect(r.conductancesBetweenPanesWPerM2K).toHaveLength(1);
    expect(Math.abs(r.conductancesBetweenPanesWPerM2K[0]! - lambda.value)).toBeLessThan(lambda.tolerance.abs);
    expect(r.glassConduction).toBe("surfaces");
  });

  const n1 = expectedOf(network, "factors[0]");
  const n2 = expectedOf(network, "factors[1]");
  it(`N1 = ${n1.value}, N2 = ${n2.value}`, () => {
    expect(r.factors).toHaveLength(2);
    expect(Math.abs(r.factors[0]! - n1.value)).toBeLessThan(n1.tolerance.abs);
    expect(Math.abs(r.factors[1]! - n2.value)).toBeLessThan(n2.tolerance.abs);
  });

  // EN 410 double-glazing formula (from memory)
  //   q_i = [(α1 + α2)/h_e + α2/Λ] / [1/h_e + 1/h_i + 1/Λ]
  // with the printed Λ = 4.99470 must equal Σ N_k α_k (closed-form identity; the printed Λ carries
  // 5e-6 → < 1e-7 in q_i for α ≤ 0.2).
  it("Σ N_k α_k equals the EN 410 double-glazing formula", () => {
    const [a1, a2] = opticsOf(gValueCase("g-value/double-6-16air-6/0deg")).absorptances as [number, number];
    const l = lambda.value;
    const en410 = ((a1 + a2) / 23 + a2 / l) / (1 / 23 + 1 / 8 + 1 / l);
    expect(Math.abs(secondaryHeatTransfer([a1, a2], r.factors) - en410)).toBeLessThan(1e-7);
  });

  // T, A1, A2 printed for the pair of 6 mm panes (stack solved per polarisation, then averaged), h_e 23, h_i 8.0.
  it("has the pair at four angles, with the glass left out of Λ, and hemispherical", () => {
    expect(gCases(2).map((c) => c.id)).toEqual([
      "g-value/double-6-16air-6/0deg",
      "g-value/double-6-16air-6/30deg",
      "g-value/double-6-16air-6/60deg",
      "g-value/double-6-16air-6/80deg",
      "g-value/double-6-16air-6/0deg/gap-only",
      "g-value/double-6-16air-6/hemispherical",
    ]);
  });
  for (const c of gCases(2)) it(c.label, () => expectG(c));

  // "If Λ = h_s (gap only), g(0) = 0.740801": the glass-conduction choice moves g by ~0.0006.
  it("Λ = h_s only: the glass-conduction choice moves g(0) by more than 4e-4", () => {
    const gapOnly = gValueCase("g-value/double-6-16air-6/0deg/gap-only");
    expect(gapOnly.input.glassConduction).toBe("none");
    const withGlass = gValueCase("g-value/double-6-16air-6/0deg");
    const noGlass = secondaryHeatTransferFactorsEn410(toUnit(gapOnly.input.unit), { glassConduction: "none" });
    expect(noGlass.conductancesBetweenPanesWPerM2K[0]).toBeCloseTo(noGlass.thermal.gaps[0]!.conductanceWPerM2K, 12);
    const o = opticsOf(gapOnly);
    const g = gValue(o.solarTransmittance, o.absorptances, noGlass.factors);
    const e = expectedOf(gapOnly, "gValue");
    expect(Math.abs(g - e.value)).toBeLessThan(e.tolerance.abs);
    expect(Math.abs(g - expectedOf(withGlass, "gValue").value)).toBeGreaterThan(4e-4);
  });

  // Closed form: for two panes the network total 1/h_e + 1/Λ + 1/h_i equals 1/U of EN 673.
  it("network total equals 1/U", () => {
    const total = 1 / 23 + r.resistancesBetweenPanesM2KPerW[0]! + 1 / 8;
    expect(total).toBeCloseTo(1 / uValueEn673(double6Air16).uValueWPerM2K, 12);
  });
});

describe("general N-pane network", () => {
  // Closed form: Λ → ∞ reduces the double formula to the single-pane one: N1 = N2 = h_i/(h_e + h_i).
  it("reduces to the single-pane factor as the resistance between panes vanishes", () => {
    const n = secondaryHeatTransferFactors({
      externalCoefficientWPerM2K: 23,
      internalCoefficientWPerM2K: 8,
      resistancesBetweenPanesM2KPerW: [1e-12],
    });
    expect(n[0]).toBeCloseTo(8 / 31, 9);
    expect(n[1]).toBeCloseTo(8 / 31, 9);
  });

  // EN 410 triple glazing (from memory): Λ12 from the outer surface to the centre of pane 2,
  // Λ23 from that centre to the innermost surface. Closed form: then 1/Λ12 + 1/Λ23 + 1/h_e + 1/h_i = 1/U.
  it("triple: half of the middle pane on each side; total equals 1/U", () => {
    const unit: GlazingThermalInput = {
      panes: [{ thicknessM: 0.006, emissivityBack: 0.03 }, { thicknessM: 0.004 }, { thicknessM: 0.008, emissivityFront: 0.03 }],
      gaps: [
        { widthM: 0.016, gas: "argon" },
        { widthM: 0.012, gas: "krypton" },
      ],
    };
    const r = secondaryHeatTransferFactorsEn410(unit);
    const [g1, g2] = r.thermal.gaps;
    expect(r.resistancesBetweenPanesM2KPerW[0]).toBeCloseTo(0.006 + 1 / g1!.conductanceWPerM2K + 0.002, 12);
    expect(r.resistancesBetweenPanesM2KPerW[1]).toBeCloseTo(0.002 + 1 / g2!.conductanceWPerM2K + 0.008, 12);
    const total = 1 / 23 + r.resistancesBetweenPanesM2KPerW[0]! + r.resistancesBetweenPanesM2KPerW[1]! + 1 / 8;
    expect(total).toBeCloseTo(r.thermal.totalResistanceM2KPerW, 12);
    expect(r.factors[0]).toBeCloseTo(1 / 23 / total, 12);
    expect(r.factors[2]).toBeCloseTo(1 - 1 / 8 / total, 12);
  });

  // Closed form: N_k = (resistance to outside)/(total) is increasing and lies in (0, 1); the
  // heat absorbed in every layer splits into an inward part N_k and an outward part 1 − N_k.
  it("property: 0 < N_1 < … < N_n < 1 and N_n = 1 − (1/h_i)/total (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 50, noNaN: true }),
        fc.double({ min: 2, max: 12, noNaN: true }),
        fc.array(fc.double({ min: 1e-3, max: 2, noNaN: true }), { maxLength: 4 }),
        (he, hi, rs) => {
          const n = secondaryHeatTransferFactors({
            externalCoefficientWPerM2K: he,
            internalCoefficientWPerM2K: hi,
            resistancesBetweenPanesM2KPerW: rs,
          });
          expect(n).toHaveLength(rs.length + 1);
          const total = 1 / he + rs.reduce((s, x) => s + x, 0) + 1 / hi;
          expect(n[n.length - 1]!).toBeCloseTo(1 - 1 / hi / total, 12);
          for (let k = 0; k < n.length; k++) {
            expect(n[k]!).toBeGreaterThan(0);
            expect(n[k]!).toBeLessThan(1);
            if (k > 0) expect(n[k]!).toBeGreaterThan(n[k - 1]!);
          }
        },
      ),
    );
  });
});

describe("bad input throws RangeError naming the quantity", () => {
  const n2 = [0.117926, 0.660962];
  const cases: [string, () => unknown, RegExp][] = [
    ["T > 1", () => gValue(1.2, [0.1, 0.1], n2), /solarTransmittance/],
    ["T NaN", () => gValue(Number.NaN, [0.1, 0.1], n2), /solarTransmittance/],
    ["negative absorptance", () => gValue(0.6, [-0.1, 0.1], n2), /absorptances\[0\]/],
    ["N > 1", () => gValue(0.6, [0.1, 0.1], [0.1, 1.5]), /factors\[1\]/],
    ["length mismatch", () => gValue(0.6, [0.1], n2), /absorptances: 1 value\(s\) but factors: 2/],
    ["energy balance", () => gValue(0.8, [0.15, 0.1], n2), /solarTransmittance \+ absorptances/],
    [
      "h_e",
      () => secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 0, internalCoefficientWPerM2K: 8, resistancesBetweenPanesM2KPerW: [] }),
      /externalCoefficientWPerM2K/,
    ],
    [
      "h_i",
      () =>
        secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 23, internalCoefficientWPerM2K: Infinity, resistancesBetweenPanesM2KPerW: [] }),
      /internalCoefficientWPerM2K/,
    ],
    [
      "resistance",
      () =>
        secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 23, internalCoefficientWPerM2K: 8, resistancesBetweenPanesM2KPerW: [0.2, -1] }),
      /resistancesBetweenPanesM2KPerW\[1\]/,
    ],
    ["room-side emissivity", () => internalHeatTransferCoefficientEn410(1.5), /roomSideEmissivity/],
    ["glass conduction option", () => secondaryHeatTransferFactorsEn410(double6Air16, { glassConduction: "half" as never }), /glassConduction/],
    ["gap width via the unit", () => secondaryHeatTransferFactorsEn410({ ...double6Air16, gaps: [{ widthM: -1, gas: "air" }] }), /gaps\[0\]\.widthM/],
  ];
  for (const [name, run, message] of cases) {
    it(name, () => {
      expect(run).toThrow(RangeError);
      expect(run).toThrow(message);
    });
  }
});
