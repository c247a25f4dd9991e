// Total solar energy transmittance g per EN 410:2011 (h_e 23, h_i 8.0 for uncoated glass), with
// the gap conductance from EN 673:2011. Check values are copied here with their labels.
//
// Labels:
//   [calc F7]  glazing-physics handbook §7: computed in float64, optics from §2/§4, h_e 23, h_i 8.0.
//   [calc F2]  handbook §2 (one absorbing pane, n 1.52); [calc F4] handbook §4 (two panes);
//   [calc F5]  handbook §5 (hemispherical averages, 400-node Gauss–Legendre).
//   [pub mem]  EN 410:2011 formulae as quoted in handbook §7, from memory.
//   [cp]       common practice (no source).
//
// The optical inputs (T, A) are the handbook's printed values, 6 decimals, since the optics are
// computed elsewhere. Tolerance for g and q_i: each printed input carries ≤ 5e-7, which reaches g
// as ≤ 5e-7·(1 + Σ N_k) ≤ 9e-7 (double glazing, Σ N_k = 0.78); the printed g itself carries
// 5e-7 → 1.5e-6 in total. N_k and Λ are computed here from unrounded EN 673 values: half a
// printed unit (5e-7 for N, 5e-6 for Λ).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  EN410_EDITION,
  gValue,
  internalHeatTransferCoefficientEn410,
  secondaryHeatTransfer,
  secondaryHeatTransferFactors,
  secondaryHeatTransferFactorsEn410,
} from '@/lib/physics/g-value';
import { uValueEn673, type GlazingThermalInput } from '@/lib/physics/u-value';

const G_TOL = 1.5e-6;

const single6: GlazingThermalInput = { panes: [{ thicknessM: 0.006 }], gaps: [] };
const single4: GlazingThermalInput = { panes: [{ thicknessM: 0.004 }], gaps: [] };
const double6Air16: GlazingThermalInput = {
  panes: [{ thicknessM: 0.006 }, { thicknessM: 0.006 }],
  gaps: [{ widthM: 0.016, gas: 'air' }],
};

describe('single pane', () => {
  // [pub mem] EN 410 single glazing q_i = α_e h_i/(h_e + h_i) → N = 8/31 = 0.258065 [calc F7].
  it('N = h_i / (h_e + h_i) = 8/31', () => {
    const r = secondaryHeatTransferFactorsEn410(single6);
    expect(r.factors).toHaveLength(1);
    expect(r.factors[0]).toBeCloseTo(8 / 31, 12);
    expect(Math.abs(r.factors[0]! - 0.258065)).toBeLessThan(5e-7);
    expect(r.internalCoefficientWPerM2K).toBeCloseTo(8, 12);
    expect(r.externalCoefficientWPerM2K).toBe(23);
    expect(r.standard).toBe(EN410_EDITION);
  });

  // [calc F7] 6 mm pane, n 1.52, α 0.02/mm; T and A from [calc F2] as printed in §7.
  const single6mmTable = [
    { thetaDeg: 0, t: 0.814159, a: 0.112514, qi: 0.029036, g: 0.843195 },
    { thetaDeg: 30, t: 0.806259, a: 0.118671, qi: 0.030625, g: 0.836884 },
    { thetaDeg: 60, t: 0.726272, a: 0.133832, qi: 0.034537, g: 0.760809 },
    { thetaDeg: 80, t: 0.372519, a: 0.13174, qi: 0.033997, g: 0.406516 },
  ];
  const nSingle = secondaryHeatTransferFactorsEn410(single6).factors;
  for (const row of single6mmTable) {
    // [cp] N fixed at its normal-incidence thermal value at every angle.
    it(`6 mm at ${row.thetaDeg}°: g = ${row.g}`, () => {
      expect(Math.abs(secondaryHeatTransfer([row.a], nSingle) - row.qi)).toBeLessThan(G_TOL);
      expect(Math.abs(gValue(row.t, [row.a], nSingle) - row.g)).toBeLessThan(G_TOL);
    });
  }

  // [calc F5] 6 mm pane hemispherical T 0.736431, A 0.125328 → [calc F7] hemispherical g 0.768774
  // (F5 applied to g(θ); g is linear in T and A, so hemispherical T and A give the same g).
  it('hemispherical g of the 6 mm pane = 0.768774', () => {
    expect(Math.abs(gValue(0.736431, [0.125328], nSingle) - 0.768774)).toBeLessThan(G_TOL);
  });

  // [calc F2] low-iron 4 mm, θ 0: T 0.910975, A 0.007965 → [calc F7] g 0.913030.
  it('low-iron 4 mm: g = 0.913030', () => {
    const n = secondaryHeatTransferFactorsEn410(single4).factors;
    expect(Math.abs(gValue(0.910975, [0.007965], n) - 0.91303)).toBeLessThan(G_TOL);
  });

  // [closed form] h_i = 3.6 + 4.4·0.2/0.837 = 4.651374 for a room-side low-e surface (ε 0.2),
  // so N = h_i/(23 + h_i).
  it('room-side emissivity lowers h_i and N', () => {
    const r = secondaryHeatTransferFactorsEn410({ panes: [{ thicknessM: 0.006, emissivityBack: 0.2 }], gaps: [] });
    const hi = 3.6 + (4.4 * 0.2) / 0.837;
    expect(r.internalCoefficientWPerM2K).toBeCloseTo(hi, 12);
    expect(internalHeatTransferCoefficientEn410(0.2)).toBeCloseTo(hi, 12);
    expect(r.roomSideEmissivity).toBe(0.2);
    expect(r.factors[0]).toBeCloseTo(hi / (23 + hi), 12);
  });
});

describe('double glazing 6 / 16 air / 6, uncoated', () => {
  const r = secondaryHeatTransferFactorsEn410(double6Air16);

  // [calc F7] h_s = 5.31315 (§8) and Λ = 1/(d1/λ + 1/h_s + d2/λ) = 4.99470 W/m²K.
  it('Λ = 4.99470 from h_s = 5.31315', () => {
    expect(Math.abs(r.thermal.gaps[0]!.conductanceWPerM2K - 5.31315)).toBeLessThan(5e-6);
    expect(r.conductancesBetweenPanesWPerM2K).toHaveLength(1);
    expect(Math.abs(r.conductancesBetweenPanesWPerM2K[0]! - 4.9947)).toBeLessThan(5e-6);
    expect(r.glassConduction).toBe('surfaces');
  });

  // [calc F7] N1 = 0.117926, N2 = 0.660962.
  it('N1 = 0.117926, N2 = 0.660962', () => {
    expect(r.factors).toHaveLength(2);
    expect(Math.abs(r.factors[0]! - 0.117926)).toBeLessThan(5e-7);
    expect(Math.abs(r.factors[1]! - 0.660962)).toBeLessThan(5e-7);
  });

  // [pub mem] EN 410 double-glazing formula
  //   q_i = [(α1 + α2)/h_e + α2/Λ] / [1/h_e + 1/h_i + 1/Λ]
  // with the printed Λ = 4.99470 [calc F7] must equal Σ N_k α_k (closed-form identity; the
  // printed Λ carries 5e-6 → < 1e-7 in q_i for α ≤ 0.2).
  it('Σ N_k α_k equals the EN 410 double-glazing formula', () => {
    const lambda = 4.9947;
    const [a1, a2] = [0.119267, 0.092099];
    const en410 = ((a1 + a2) / 23 + a2 / lambda) / (1 / 23 + 1 / 8 + 1 / lambda);
    expect(Math.abs(secondaryHeatTransfer([a1, a2], r.factors) - en410)).toBeLessThan(1e-7);
  });

  // [calc F7] T, A1, A2 from [calc F4] (per polarisation, then averaged), h_e 23, h_i 8.0.
  const double6mmTable = [
    { thetaDeg: 0, t: 0.666439, a1: 0.119267, a2: 0.092099, qi: 0.074939, g: 0.741378 },
    { thetaDeg: 30, t: 0.654858, a1: 0.125812, a2: 0.096293, qi: 0.078482, g: 0.73334 },
    { thetaDeg: 60, t: 0.560292, a1: 0.145683, a2: 0.10071, qi: 0.083745, g: 0.644037 },
    { thetaDeg: 80, t: 0.196926, a1: 0.161459, a2: 0.065233, qi: 0.062157, g: 0.259083 },
  ];
  for (const row of double6mmTable) {
    it(`at ${row.thetaDeg}°: q_i = ${row.qi}, g = ${row.g}`, () => {
      expect(Math.abs(secondaryHeatTransfer([row.a1, row.a2], r.factors) - row.qi)).toBeLessThan(G_TOL);
      expect(Math.abs(gValue(row.t, [row.a1, row.a2], r.factors) - row.g)).toBeLessThan(G_TOL);
    });
  }

  // [calc F7] "If Λ = h_s (gap only), g(0) = 0.740801": the glass-conduction choice moves g by ~0.0006.
  it('Λ = h_s only: g(0) = 0.740801', () => {
    const gapOnly = secondaryHeatTransferFactorsEn410(double6Air16, { glassConduction: 'none' });
    expect(gapOnly.conductancesBetweenPanesWPerM2K[0]).toBeCloseTo(gapOnly.thermal.gaps[0]!.conductanceWPerM2K, 12);
    const g = gValue(0.666439, [0.119267, 0.092099], gapOnly.factors);
    expect(Math.abs(g - 0.740801)).toBeLessThan(G_TOL);
    expect(Math.abs(g - 0.741378)).toBeGreaterThan(4e-4);
  });

  // [closed form] For two panes the network total 1/h_e + 1/Λ + 1/h_i equals 1/U of EN 673.
  it('network total equals 1/U', () => {
    const total = 1 / 23 + r.resistancesBetweenPanesM2KPerW[0]! + 1 / 8;
    expect(total).toBeCloseTo(1 / uValueEn673(double6Air16).uValueWPerM2K, 12);
  });
});

describe('general N-pane network', () => {
  // [closed form] Λ → ∞ reduces the double formula to the single-pane one: N1 = N2 = h_i/(h_e + h_i).
  it('reduces to the single-pane factor as the resistance between panes vanishes', () => {
    const n = secondaryHeatTransferFactors({
      externalCoefficientWPerM2K: 23,
      internalCoefficientWPerM2K: 8,
      resistancesBetweenPanesM2KPerW: [1e-12],
    });
    expect(n[0]).toBeCloseTo(8 / 31, 9);
    expect(n[1]).toBeCloseTo(8 / 31, 9);
  });

  // [pub mem] EN 410 triple glazing: Λ12 from the outer surface to the centre of pane 2,
  // Λ23 from that centre to the innermost surface. [closed form] then 1/Λ12 + 1/Λ23 + 1/h_e + 1/h_i = 1/U.
  it('triple: half of the middle pane on each side; total equals 1/U', () => {
    const unit: GlazingThermalInput = {
      panes: [{ thicknessM: 0.006, emissivityBack: 0.03 }, { thicknessM: 0.004 }, { thicknessM: 0.008, emissivityFront: 0.03 }],
      gaps: [
        { widthM: 0.016, gas: 'argon' },
        { widthM: 0.012, gas: 'krypton' },
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

  // [closed form] N_k = (resistance to outside)/(total) is increasing and lies in (0, 1); the
  // heat absorbed in every layer splits into an inward part N_k and an outward part 1 − N_k.
  it('property: 0 < N_1 < … < N_n < 1 and N_n = 1 − (1/h_i)/total (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 50, noNaN: true }),
        fc.double({ min: 2, max: 12, noNaN: true }),
        fc.array(fc.double({ min: 1e-3, max: 2, noNaN: true }), { maxLength: 4 }),
        (he, hi, rs) => {
          const n = secondaryHeatTransferFactors({ externalCoefficientWPerM2K: he, internalCoefficientWPerM2K: hi, resistancesBetweenPanesM2KPerW: rs });
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

describe('bad input throws RangeError naming the quantity', () => {
  const n2 = [0.117926, 0.660962];
  const cases: [string, () => unknown, RegExp][] = [
    ['T > 1', () => gValue(1.2, [0.1, 0.1], n2), /solarTransmittance/],
    ['T NaN', () => gValue(Number.NaN, [0.1, 0.1], n2), /solarTransmittance/],
    ['negative absorptance', () => gValue(0.6, [-0.1, 0.1], n2), /absorptances\[0\]/],
    ['N > 1', () => gValue(0.6, [0.1, 0.1], [0.1, 1.5]), /factors\[1\]/],
    ['length mismatch', () => gValue(0.6, [0.1], n2), /absorptances: 1 value\(s\) but factors: 2/],
    ['energy balance', () => gValue(0.8, [0.15, 0.1], n2), /solarTransmittance \+ absorptances/],
    ['h_e', () => secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 0, internalCoefficientWPerM2K: 8, resistancesBetweenPanesM2KPerW: [] }), /externalCoefficientWPerM2K/],
    ['h_i', () => secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 23, internalCoefficientWPerM2K: Infinity, resistancesBetweenPanesM2KPerW: [] }), /internalCoefficientWPerM2K/],
    ['resistance', () => secondaryHeatTransferFactors({ externalCoefficientWPerM2K: 23, internalCoefficientWPerM2K: 8, resistancesBetweenPanesM2KPerW: [0.2, -1] }), /resistancesBetweenPanesM2KPerW\[1\]/],
    ['room-side emissivity', () => internalHeatTransferCoefficientEn410(1.5), /roomSideEmissivity/],
    ['glass conduction option', () => secondaryHeatTransferFactorsEn410(double6Air16, { glassConduction: 'half' as never }), /glassConduction/],
    ['gap width via the unit', () => secondaryHeatTransferFactorsEn410({ ...double6Air16, gaps: [{ widthM: -1, gas: 'air' }] }), /gaps\[0\]\.widthM/],
  ];
  for (const [name, run, message] of cases) {
    it(name, () => {
      expect(run).toThrow(RangeError);
      expect(run).toThrow(message);
    });
  }
});
