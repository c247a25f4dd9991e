// Gas properties of glazing fills at the EN 673 mean temperature (10 °C, 283 K) and the EN 673
// linear-by-volume mixing rule. The check values, their tolerances and their sources are the cases of
// @/lib/reference-cases/gas-properties:
//   - ρ, μ, λ, c: EN 673:2011 clause 6, gas property table at 10 °C (values from memory);
//   - Prandtl numbers: computed from Pr = μc/λ, recomputed by scripts/reference/gas-properties.ts;
//   - mixtures: closed form P_mix = Σ F_i P_i (EN 673:2011 clause 6, from memory).
// Checks that are not tabular (mixing identities, properties, bad input) stay here.
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import {
  GAS_NAMES,
  GAS_PROPERTIES_EN673,
  gasPropertiesEn673,
  gasVolumeFractions,
  isGasName,
  type GasName,
  type GasProperties,
} from "@/lib/physics/gas-properties";
import { gasPropertiesDomain, type GasPropertiesCase } from "@/lib/reference-cases/gas-properties";
import { evaluateGasProperties } from "@/lib/validation/engines/gas-properties";
import { caseById, expectEvaluation, expectedOf } from "./fixtures";

const gasCase = (id: string): GasPropertiesCase => caseById(gasPropertiesDomain.cases, id);

const KEYS = ["densityKgPerM3", "dynamicViscosityPaS", "conductivityWPerMK", "specificHeatJPerKgK"] as const;

/** ρ [kg/m³], μ [kg/(m·s)], λ [W/(mK)], c [J/(kg·K)] at 10 °C: EN 673:2011 clause 6 table (from memory). */
const en673Table10C = Object.fromEntries(
  (["air", "argon", "krypton"] as const).map((name) => {
    const c = gasCase(`gas-properties/${name}/10C`);
    return [name, Object.fromEntries(KEYS.map((k) => [k, expectedOf(c, k).value])) as unknown as GasProperties];
  }),
) as Record<GasName, GasProperties>;

const pr = (g: GasProperties) => (g.dynamicViscosityPaS * g.specificHeatJPerKgK) / g.conductivityWPerMK;

// Every case through the evaluator the validation report runs; the blocks below check the table and the mixing rule.
describe("every gas-properties case, through the validation evaluator", () => {
  it.each(gasPropertiesDomain.cases)("$id", (c) => expectEvaluation(evaluateGasProperties(c), c));
});

describe("EN 673 gas table at 10 °C", () => {
  it("holds exactly air, argon and krypton", () => {
    expect([...GAS_NAMES].sort()).toEqual(["air", "argon", "krypton"]);
    expect(Object.keys(GAS_PROPERTIES_EN673).sort()).toEqual(["air", "argon", "krypton"]);
  });

  const tabulated = gasPropertiesDomain.cases.filter((c) => c.source.kind === "published");
  it("has a tabulated case for each gas", () => {
    expect(tabulated.map((c) => c.input.gas).sort()).toEqual(["air", "argon", "krypton"]);
  });
  for (const c of tabulated) {
    // Printed to 4 significant digits, stored as printed → exact equality (tolerance 0).
    it(c.label, () => {
      expect(gasPropertiesEn673(c.input.gas)).toEqual(en673Table10C[c.input.gas as GasName]);
      for (const e of c.expected) expect(e.tolerance.abs).toBe(0);
    });
  }

  // Pr = μc/λ printed to 6 decimals → tolerance 5e-7 (scripts/reference/gas-properties.ts).
  for (const id of ["gas-properties/air/prandtl", "gas-properties/argon/prandtl"]) {
    const c = gasCase(id);
    it(c.label, () => {
      const e = expectedOf(c, "prandtl");
      expect(Math.abs(pr(gasPropertiesEn673(c.input.gas)) - e.value)).toBeLessThan(e.tolerance.abs);
    });
  }
});

describe("mixtures (EN 673: properties linear in volume fraction)", () => {
  // Closed form P_mix = Σ F_i P_i with the EN 673 table: ρ, c to float64 rounding; μ and λ as the ratio
  // to the expected value, to 12 decimals.
  const mixed = gasCase("gas-properties/argon90-air10/mixed");
  it(mixed.label, () => {
    const m = gasPropertiesEn673(mixed.input.gas);
    expect(m.densityKgPerM3).toBeCloseTo(expectedOf(mixed, "densityKgPerM3").value, 12);
    expect(m.dynamicViscosityPaS / expectedOf(mixed, "dynamicViscosityPaS").value).toBeCloseTo(1, 12);
    expect(m.conductivityWPerMK / expectedOf(mixed, "conductivityWPerMK").value).toBeCloseTo(1, 12);
    expect(m.specificHeatJPerKgK).toBeCloseTo(expectedOf(mixed, "specificHeatJPerKgK").value, 9);
  });

  // Pr of the mixture from the mixed properties (6 decimals → 5e-7). The 90 % Ar U values of
  // u-value.test.ts confirm that all four properties mix linearly.
  const mixedPr = gasCase("gas-properties/argon90-air10/prandtl");
  it("mixes μ, c and λ separately (Pr of the mixture is not the mixed Pr)", () => {
    const m = gasPropertiesEn673(mixedPr.input.gas);
    const prMix = pr(m);
    const e = expectedOf(mixedPr, "prandtl");
    expect(Math.abs(prMix - e.value)).toBeLessThan(e.tolerance.abs);
    // A naive mixing of Pr itself would give 0.9·0.666933 + 0.1·0.711173 = 0.671357.
    expect(Math.abs(prMix - 0.671357)).toBeGreaterThan(0.01);
  });

  it("a record with one gas at fraction 1 equals the pure gas", () => {
    for (const name of GAS_NAMES) {
      expect(gasPropertiesEn673({ [name]: 1 })).toEqual(gasPropertiesEn673(name));
    }
  });

  it("accepts fractions whose sum is off by less than 1e-6", () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.1 + 5e-7 })).not.toThrow();
    expect(gasVolumeFractions({ krypton: 0.25, argon: 0.75 })).toEqual({ air: 0, argon: 0.75, krypton: 0.25 });
  });

  // [closed form] linearity: every mixed property lies between the smallest and largest pure value
  // and equals Σ F_i P_i.
  it("property: mixed values are the volume-weighted sums (fast-check)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (u, v) => {
        const air = u;
        const argon = (1 - u) * v;
        const krypton = 1 - air - argon;
        if (krypton < 0) return true;
        const m = gasPropertiesEn673({ air, argon, krypton });
        for (const key of KEYS) {
          const values = GAS_NAMES.map((g) => en673Table10C[g][key]);
          const expected = air * en673Table10C.air[key] + argon * en673Table10C.argon[key] + krypton * en673Table10C.krypton[key];
          expect(Math.abs(m[key] - expected)).toBeLessThanOrEqual(1e-12 * Math.max(...values));
          expect(m[key]).toBeGreaterThanOrEqual(Math.min(...values) * (1 - 1e-12));
          expect(m[key]).toBeLessThanOrEqual(Math.max(...values) * (1 + 1e-12));
        }
        return true;
      }),
    );
  });
});

describe("bad gas input throws RangeError naming the problem", () => {
  it("unknown gas name", () => {
    expect(() => gasPropertiesEn673("xenon" as GasName)).toThrow(RangeError);
    expect(() => gasPropertiesEn673("xenon" as GasName)).toThrow(/unknown gas 'xenon'/);
    expect(isGasName("xenon")).toBe(false);
    expect(isGasName("argon")).toBe(true);
  });

  it("unknown gas in a record of fractions", () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, sf6: 0.1 } as never)).toThrow(/gas fractions: unknown gas 'sf6'/);
  });

  it("fractions that do not sum to 1", () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.05 })).toThrow(RangeError);
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.05 })).toThrow(/sum to 1/);
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.1 + 2e-6 })).toThrow(/sum to 1/);
    expect(() => gasPropertiesEn673({})).toThrow(/sum to 1/);
  });

  it("fractions out of [0, 1] or not finite", () => {
    expect(() => gasPropertiesEn673({ argon: 1.2, air: -0.2 })).toThrow(/volume fraction of (argon|air)/);
    expect(() => gasPropertiesEn673({ argon: Number.NaN, air: 1 })).toThrow(/volume fraction of argon/);
  });
});
