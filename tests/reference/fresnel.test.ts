// Reference tests for interface optics (src/lib/physics/fresnel.ts).
//
// The check values are the cases of src/lib/reference-cases/fresnel.ts: the Fresnel equations of
// E. Hecht, Optics, 4th ed., §4.6 and Born & Wolf, Principles of Optics, 7th ed., §1.5 (sections from
// memory), evaluated independently in float64 by scripts/reference/fresnel.ts, with the sign convention
// r_p(0) = r_s(0). Each case gives its tolerance (half a unit in the last printed digit).
import Complex from "complex.js";
import { describe, expect, it } from "vitest";
import {
  brewsterAngle,
  criticalAngle,
  fresnelInterface,
  fresnelReflectanceP,
  fresnelReflectanceS,
  fresnelReflectancesReal,
  fresnelTransmittanceAtDepth,
  normalWaveVectorComponents,
  snellRefractionAngle,
} from "@/lib/physics/fresnel";
import { asRadians } from "@/lib/physics/units";
import {
  airGlassCases,
  brewsterCases,
  closedFormCases,
  criticalCases,
  fresnelDomain,
  internalCases,
  phaseCases,
  reciprocityCases,
  signConventionCases,
  totalInternalReflectionCases,
  type FresnelCaseInput,
} from "@/lib/reference-cases/fresnel";
import { fresnelValues } from "@/lib/validation/engines/fresnel";
import { deg, expectCase } from "./fixtures";

/** The engine's values of a Fresnel case: the evaluator the validation report runs. */
const engine = fresnelValues;

const interfaceInput = (input: FresnelCaseInput) => {
  if (input.kind !== "interface") throw new Error(`expected an interface case, got ${input.kind}`);
  return input;
};

it("every Fresnel case is in one of the groups below", () => {
  const groups = [
    airGlassCases,
    signConventionCases,
    brewsterCases,
    criticalCases,
    internalCases,
    totalInternalReflectionCases,
    phaseCases,
    reciprocityCases,
    closedFormCases,
  ];
  expect(groups.reduce((n, g) => n + g.length, 0)).toBe(fresnelDomain.cases.length);
  expect(new Set(fresnelDomain.cases.map((c) => c.id)).size).toBe(fresnelDomain.cases.length);
});

describe("Fresnel reflectance, air → glass", () => {
  it("has all 12 rows of the air → glass table", () => expect(airGlassCases).toHaveLength(12));
  for (const c of airGlassCases) {
    it(c.label, () => {
      const { n1, n2, thetaDeg } = interfaceInput(c.input);
      const f = fresnelInterface(n1, n2, deg(thetaDeg));
      expectCase(engine(c.input), c); // R_s, R_p, R, θt
      // the real fast path must agree with the complex route
      const fast = fresnelReflectancesReal(n1, n2, deg(thetaDeg));
      expect(Math.abs(fast.Rs - f.Rs)).toBeLessThan(1e-15);
      expect(Math.abs(fast.Rp - f.Rp)).toBeLessThan(1e-15);
      // cos θt = q_x / n2
      expect(Math.abs(fast.cosThetaT - f.qx.re / n2)).toBeLessThan(1e-15);
    });
  }

  // sign convention r_p(0) = r_s(0): below Brewster's angle r_p has the sign of r_s, above it r_p changes sign
  for (const c of signConventionCases) it(`sign convention: ${c.label}`, () => expectCase(engine(c.input), c));

  it("lossless media conserve energy: T_j + R_j = 1", () => {
    // energy conservation at a lossless interface (exact; float64 rounding stays below 1e-14)
    for (const n2 of [1.2, 1.5, 1.52, 2.4]) {
      for (let d = 0; d <= 89.5; d += 0.5) {
        const f = fresnelInterface(1, n2, deg(d));
        expect(Math.abs(f.Ts + f.Rs - 1)).toBeLessThan(1e-14);
        expect(Math.abs(f.Tp + f.Rp - 1)).toBeLessThan(1e-14);
      }
    }
  });

  it("no interface (n1 = n2): R = 0", () => {
    // n1 = n2 gives R = 0 (closed form)
    for (const d of [0, 30, 60, 89]) {
      const f = fresnelInterface(1.52, 1.52, deg(d));
      // |r| ≈ 1e-13 from the rounding of n1² − n1² sin² θ near grazing incidence
      expect(f.Rs).toBeLessThan(1e-24);
      expect(f.Rp).toBeLessThan(1e-24);
      expect(Math.abs(f.T - 1)).toBeLessThan(1e-14);
    }
  });
});

describe("closed forms: normal incidence, transmission amplitudes, grazing incidence, an absorbing medium", () => {
  // Hecht §4.6 and Born & Wolf, optics of metals (from memory); the cases say which, to float64 rounding.
  for (const c of closedFormCases) it(c.label, () => expectCase(engine(c.input), c));

  it("the single-polarisation helpers give the interface's R_s and R_p", () => {
    for (const d of [0, 30, 60, 85]) {
      const f = fresnelInterface(1, 1.5, deg(d));
      expect(Math.abs(fresnelReflectanceS(1, 1.5, deg(d)) - f.Rs)).toBeLessThan(1e-15);
      expect(Math.abs(fresnelReflectanceP(1, 1.5, deg(d)) - f.Rp)).toBeLessThan(1e-15);
    }
  });
});

describe("Brewster and critical angles", () => {
  for (const c of brewsterCases) {
    it(`${c.label}: θB, R_s, and R_p = 0 there`, () => {
      const r = engine(c.input);
      expectCase(r, c);
      expect(r.Rp).toBeLessThan(1e-28);
    });
  }

  for (const c of criticalCases) it(c.label, () => expectCase(engine(c.input), c));

  it("no critical angle from air to glass or between equal media", () => {
    expect(criticalAngle(1, 1.52)).toBeNull();
    expect(criticalAngle(1.52, 1.52)).toBeNull();
  });

  it("at the critical angle R = 1 (cos θt = 0, up to the rounding of asin)", () => {
    // θi = θc exactly gives cos θt = 0, so R = 1 (closed form)
    const f = fresnelInterface(1.52, 1, criticalAngle(1.52, 1)!);
    expect(f.Rs).toBeGreaterThan(1 - 1e-6);
    expect(f.Rp).toBeGreaterThan(1 - 1e-6);
    expect(f.Rs).toBeLessThanOrEqual(1 + 1e-15);
  });

  it("Snell: no refracted angle beyond the critical angle", () => {
    expect(snellRefractionAngle(1.52, 1, deg(45))).toBeNull();
    // the fast real path refuses angles beyond the critical angle instead of returning NaN
    expect(() => fresnelReflectancesReal(1.52, 1, deg(45))).toThrow(RangeError);
  });
});

describe("internal incidence, glass (1.52) → air, and total internal reflection", () => {
  for (const c of internalCases) {
    it(c.label, () => {
      const { n1, n2, thetaDeg } = interfaceInput(c.input);
      expectCase(engine(c.input), c); // q_x = n2 cos θt with n2 = 1
      expect(fresnelInterface(n1, n2, deg(thetaDeg)).qx.im).toBe(0);
    });
  }

  for (const c of totalInternalReflectionCases) {
    it(`${c.label}: |r_s| = |r_p| = 1, T = 0`, () => {
      const { n1, n2, thetaDeg } = interfaceInput(c.input);
      const f = fresnelInterface(n1, n2, deg(thetaDeg));
      expect(Math.abs(f.rs.abs() - 1)).toBeLessThan(1e-15);
      expect(Math.abs(f.rp.abs() - 1)).toBeLessThan(1e-15);
      expect(f.Ts).toBe(0);
      expect(f.Tp).toBe(0);
      expect(Math.abs(f.qx.re)).toBeLessThan(1e-15);
      expectCase(engine(c.input), c); // decaying branch: Im(q_x) ≥ 0
    });
  }

  // with the convention r_p(0) = r_s(0)
  for (const c of phaseCases) it(c.label, () => expectCase(engine(c.input), c));

  for (const c of reciprocityCases) {
    it(`reciprocity: ${c.label}`, () => {
      // Stokes relations, Hecht §4.10 (from memory)
      if (c.input.kind !== "reciprocity") throw new Error("expected a reciprocity case");
      const { n1, n2, thetaDeg } = c.input;
      expectCase(engine(c.input), c);
      const back = fresnelInterface(n2, n1, snellRefractionAngle(n1, n2, deg(thetaDeg))!);
      const fwd = fresnelInterface(n1, n2, deg(thetaDeg));
      expect(Math.abs(back.Rs - fwd.Rs)).toBeLessThan(1e-15);
      expect(Math.abs(back.Rp - fwd.Rp)).toBeLessThan(1e-15);
    });
  }
});

describe("absorbing medium (complex index)", () => {
  const metal = new Complex(0.2, 3); // metal-like N = n + ik

  it("normal incidence: r_p(0) = r_s(0) also for complex n2 (R itself: case fresnel/closed-form/absorbing/0.2+3i/normal)", () => {
    const f = fresnelInterface(1, metal, deg(0));
    expect(f.rp.sub(f.rs).abs()).toBeLessThan(1e-15);
  });

  it("0 < R < 1 at every angle, flux that enters = 1 − R for s and p, no NaN", () => {
    // Energy conservation at the interface with a lossless medium 1 (closed form). For p this
    // fails with the real-index form Re(n2 cos θt)/(n1 cos θi)·|t_p|², so it checks the p derivation.
    for (let d = 0; d <= 90; d += 0.5) {
      const f = fresnelInterface(1, metal, deg(d));
      for (const v of [f.Rs, f.Rp, f.Ts, f.Tp]) expect(Number.isFinite(v)).toBe(true);
      expect(f.Rs).toBeGreaterThan(0);
      expect(f.Rs).toBeLessThanOrEqual(1);
      expect(f.Rp).toBeGreaterThan(0);
      expect(f.Rp).toBeLessThanOrEqual(1);
      if (d < 90) {
        expect(f.Rs).toBeLessThan(1);
        expect(f.Rp).toBeLessThan(1);
      }
      expect(Math.abs(f.Ts + f.Rs - 1)).toBeLessThan(1e-13);
      expect(Math.abs(f.Tp + f.Rp - 1)).toBeLessThan(1e-13);
      expect(f.qx.im).toBeGreaterThanOrEqual(0); // decaying branch
    }
  });

  it("thick absorbing layer transmits nothing; thin layer follows Beer–Lambert α = 4πk/λ", () => {
    // α = 4πk/λ (Beer–Lambert for intensity; Born & Wolf, optics of metals, from memory)
    const lambda = 550e-9;
    const thick = fresnelTransmittanceAtDepth(1, metal, deg(30), 1e-6, lambda);
    expect(thick.unpolarized).toBeLessThan(1e-25);
    expect(Number.isNaN(thick.s) || Number.isNaN(thick.p)).toBe(false);
    const d = 5e-9;
    const thin = fresnelTransmittanceAtDepth(1, metal, deg(0), d, lambda);
    const R0 = 9.64 / 10.44;
    const expected = (1 - R0) * Math.exp(((-4 * Math.PI * 3) / lambda) * d);
    expect(Math.abs(thin.unpolarized - expected)).toBeLessThan(1e-15);
  });

  it("weakly absorbing glass behaves like the real index", () => {
    for (const d of [0, 30, 60, 85]) {
      const a = fresnelInterface(1, new Complex(1.52, 1e-9), deg(d));
      const b = fresnelInterface(1, 1.52, deg(d));
      expect(Math.abs(a.Rs - b.Rs)).toBeLessThan(1e-12);
      expect(Math.abs(a.Rp - b.Rp)).toBeLessThan(1e-12);
    }
  });
});

describe("input checks", () => {
  it("refuses bad angles and indices with a message naming the quantity", () => {
    expect(() => fresnelInterface(1, 1.52, asRadians(-0.1))).toThrow(/angle of incidence/);
    expect(() => fresnelInterface(1, 1.52, asRadians(Math.PI / 2 + 1e-9))).toThrow(/angle of incidence/);
    expect(() => fresnelInterface(1, 1.52, asRadians(Number.NaN))).toThrow(RangeError);
    expect(() => fresnelInterface(Number.NaN, 1.52, deg(0))).toThrow(/incident medium/);
    expect(() => fresnelInterface(1, 0, deg(0))).toThrow(/transmitting medium/);
    expect(() => fresnelInterface(1, new Complex(1.5, -0.1), deg(0))).toThrow(/transmitting medium/);
    expect(() => fresnelInterface(1, Number.POSITIVE_INFINITY, deg(0))).toThrow(RangeError);
    expect(() => normalWaveVectorComponents(-1, 1.5, deg(0))).toThrow(/incident medium/);
    expect(() => fresnelTransmittanceAtDepth(1, 1.5, deg(0), -1, 5e-7)).toThrow(/depth/);
    expect(() => fresnelTransmittanceAtDepth(1, 1.5, deg(0), 1, 0)).toThrow(/wavelength/);
    expect(() => brewsterAngle(0, 1.5)).toThrow(RangeError);
  });
});
