// Gas properties of glazing fills at the EN 673 mean temperature (10 °C, 283 K) and the EN 673
// linear-by-volume mixing rule. Check values are copied here (the tests read no outside file).
//
// Sources and labels:
//   [EN 673 table, mem]  EN 673:2011 clause 6, gas property table at 10 °C, values from memory as
//                        reproduced in the glazing-physics handbook §8; a public table of the same
//                        gases at −10/0/10/20 °C agrees at 10 °C.
//   [calc F8]            glazing-physics handbook §8, computed with float64 from the EN 673 formulae.
//   [closed form]        arithmetic from the formula stated next to the check.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  GAS_NAMES,
  GAS_PROPERTIES_EN673,
  gasPropertiesEn673,
  gasVolumeFractions,
  isGasName,
  type GasName,
  type GasProperties,
} from '@/lib/physics/gas-properties';

// [EN 673 table, mem] ρ [kg/m³], μ [kg/(m·s)], λ [W/(mK)], c [J/(kg·K)] at 10 °C.
const en673Table10C: Record<GasName, GasProperties> = {
  air: { densityKgPerM3: 1.232, dynamicViscosityPaS: 1.761e-5, conductivityWPerMK: 2.496e-2, specificHeatJPerKgK: 1008 },
  argon: { densityKgPerM3: 1.699, dynamicViscosityPaS: 2.164e-5, conductivityWPerMK: 1.684e-2, specificHeatJPerKgK: 519 },
  krypton: { densityKgPerM3: 3.56, dynamicViscosityPaS: 2.4e-5, conductivityWPerMK: 0.9e-2, specificHeatJPerKgK: 245 },
};

const KEYS = ['densityKgPerM3', 'dynamicViscosityPaS', 'conductivityWPerMK', 'specificHeatJPerKgK'] as const;

describe('EN 673 gas table at 10 °C', () => {
  it('holds exactly air, argon and krypton', () => {
    expect([...GAS_NAMES].sort()).toEqual(['air', 'argon', 'krypton']);
    expect(Object.keys(GAS_PROPERTIES_EN673).sort()).toEqual(['air', 'argon', 'krypton']);
  });

  for (const name of ['air', 'argon', 'krypton'] as const) {
    // [EN 673 table, mem]: printed to 4 significant digits, stored as printed → exact equality.
    it(`${name}: ρ, μ, λ, c as tabulated`, () => {
      expect(gasPropertiesEn673(name)).toEqual(en673Table10C[name]);
    });
  }

  // [calc F8] handbook §8 intermediate values: Pr = μc/λ = 0.711173 (air), 0.666933 (argon),
  // printed to 6 decimals → tolerance 5e-7.
  it('gives the handbook Prandtl numbers for air and argon', () => {
    const pr = (g: GasProperties) => (g.dynamicViscosityPaS * g.specificHeatJPerKgK) / g.conductivityWPerMK;
    expect(Math.abs(pr(gasPropertiesEn673('air')) - 0.711173)).toBeLessThan(5e-7);
    expect(Math.abs(pr(gasPropertiesEn673('argon')) - 0.666933)).toBeLessThan(5e-7);
  });
});

describe('mixtures (EN 673: properties linear in volume fraction)', () => {
  // [closed form] EN 673 rule P_mix = Σ F_i P_i with the [EN 673 table, mem] values:
  // 90 % argon / 10 % air → ρ = 0.9·1.699 + 0.1·1.232 = 1.6523 kg/m³,
  // μ = 0.9·2.164e-5 + 0.1·1.761e-5 = 2.1237e-5, λ = 0.9·1.684e-2 + 0.1·2.496e-2 = 1.7652e-2,
  // c = 0.9·519 + 0.1·1008 = 567.9. Tolerance 1e-12 relative: float64 rounding only.
  it('90 % argon / 10 % air', () => {
    const m = gasPropertiesEn673({ argon: 0.9, air: 0.1 });
    expect(m.densityKgPerM3).toBeCloseTo(1.6523, 12);
    expect(m.dynamicViscosityPaS / 2.1237e-5).toBeCloseTo(1, 12);
    expect(m.conductivityWPerMK / 1.7652e-2).toBeCloseTo(1, 12);
    expect(m.specificHeatJPerKgK).toBeCloseTo(567.9, 9);
  });

  // [closed form] Pr of the mixture from the mixed properties above:
  // 2.1237e-5 · 567.9 / 1.7652e-2 = 0.683237 (6 decimals → 5e-7). The handbook's 90 % Ar
  // U-values [calc F8], tested in u-value.test.ts, confirm that all four properties mix linearly.
  it('mixes μ, c and λ separately (Pr of the mixture is not the mixed Pr)', () => {
    const m = gasPropertiesEn673({ argon: 0.9, air: 0.1 });
    const prMix = (m.dynamicViscosityPaS * m.specificHeatJPerKgK) / m.conductivityWPerMK;
    expect(Math.abs(prMix - 0.683237)).toBeLessThan(5e-7);
    // A naive mixing of Pr itself would give 0.9·0.666933 + 0.1·0.711173 = 0.671357.
    expect(Math.abs(prMix - 0.671357)).toBeGreaterThan(0.01);
  });

  it('a record with one gas at fraction 1 equals the pure gas', () => {
    for (const name of GAS_NAMES) {
      expect(gasPropertiesEn673({ [name]: 1 })).toEqual(gasPropertiesEn673(name));
    }
  });

  it('accepts fractions whose sum is off by less than 1e-6', () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.1 + 5e-7 })).not.toThrow();
    expect(gasVolumeFractions({ krypton: 0.25, argon: 0.75 })).toEqual({ air: 0, argon: 0.75, krypton: 0.25 });
  });

  // [closed form] linearity: every mixed property lies between the smallest and largest pure value
  // and equals Σ F_i P_i.
  it('property: mixed values are the volume-weighted sums (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (u, v) => {
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
        },
      ),
    );
  });
});

describe('bad gas input throws RangeError naming the problem', () => {
  it('unknown gas name', () => {
    expect(() => gasPropertiesEn673('xenon' as GasName)).toThrow(RangeError);
    expect(() => gasPropertiesEn673('xenon' as GasName)).toThrow(/unknown gas 'xenon'/);
    expect(isGasName('xenon')).toBe(false);
    expect(isGasName('argon')).toBe(true);
  });

  it('unknown gas in a record of fractions', () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, sf6: 0.1 } as never)).toThrow(/gas fractions: unknown gas 'sf6'/);
  });

  it('fractions that do not sum to 1', () => {
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.05 })).toThrow(RangeError);
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.05 })).toThrow(/sum to 1/);
    expect(() => gasPropertiesEn673({ argon: 0.9, air: 0.1 + 2e-6 })).toThrow(/sum to 1/);
    expect(() => gasPropertiesEn673({})).toThrow(/sum to 1/);
  });

  it('fractions out of [0, 1] or not finite', () => {
    expect(() => gasPropertiesEn673({ argon: 1.2, air: -0.2 })).toThrow(/volume fraction of (argon|air)/);
    expect(() => gasPropertiesEn673({ argon: Number.NaN, air: 1 })).toThrow(/volume fraction of argon/);
  });
});
