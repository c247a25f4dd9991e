// Reference tests for interface optics (src/lib/physics/fresnel.ts).
//
// Check values marked [calc F1] are from the glazing-physics reference, §1: an independent
// float64 (python3 + numpy) evaluation of the Fresnel equations as printed in E. Hecht,
// Optics, 4th ed., §4.6 and Born & Wolf, Principles of Optics, 7th ed., §1.5 (sections from
// memory), with the sign convention r_p(0) = r_s(0). Printed to ~6 digits: each comparison
// allows half a unit in the last printed digit (helper `printed`).
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
import { asRadians, toDegrees } from "@/lib/physics/units";
import { printed, deg } from "./fixtures";


/** |actual − value| ≤ half a unit in the last digit of the printed value. */

describe("Fresnel reflectance, air → glass", () => {
  // [calc F1] glazing-physics reference §1, table "Check values, n1 = 1 (air)":
  // θ [deg], n2, R_s, R_p, R, θt [deg]
  const table: [number, number, string, string, string, string][] = [
    [0, 1.5, "0.040000", "0.040000", "0.040000", "0"],
    [30, 1.5, "0.057796", "0.025249", "0.041523", "19.4712"],
    [45, 1.5, "0.092013", "0.008466", "0.050240", "28.1255"],
    [60, 1.5, "0.176571", "0.001802", "0.089187", "35.2644"],
    [75, 1.5, "0.399356", "0.106765", "0.253061", "40.0870"],
    [85, 1.5, "0.732345", "0.493254", "0.612800", "41.6156"],
    [0, 1.52, "0.042580", "0.042580", "0.042580", "0"],
    [30, 1.52, "0.061209", "0.027078", "0.044144", "19.2049"],
    [45, 1.52, "0.096733", "0.009357", "0.053045", "27.7233"],
    [60, 1.52, "0.183438", "0.001527", "0.092483", "34.7330"],
    [75, 1.52, "0.407851", "0.105580", "0.256715", "39.4554"],
    [85, 1.52, "0.737674", "0.492173", "0.614923", "40.9493"],
  ];
  it("has all 12 rows of the reference table", () => expect(table).toHaveLength(12));
  it.each(table)("θ=%s°, n2=%s: R_s, R_p, R, θt", (theta, n2, Rs, Rp, R, thetaT) => {
    const f = fresnelInterface(1, n2, deg(theta));
    printed(f.Rs, Rs);
    printed(f.Rp, Rp);
    printed(f.R, R);
    printed(toDegrees(snellRefractionAngle(1, n2, deg(theta))!), thetaT);
    // the real fast path must agree with the complex route
    const fast = fresnelReflectancesReal(1, n2, deg(theta));
    expect(Math.abs(fast.Rs - f.Rs)).toBeLessThan(1e-15);
    expect(Math.abs(fast.Rp - f.Rp)).toBeLessThan(1e-15);
    // cos θt = q_x / n2
    expect(Math.abs(fast.cosThetaT - f.qx.re / n2)).toBeLessThan(1e-15);
  });

  it("normal incidence: R = ((n−1)/(n+1))² = 0.04 for n = 1.5", () => {
    // closed form R = ((n−1)/(n+1))², Hecht §4.6 (from memory)
    expect(fresnelReflectanceS(1, 1.5, deg(0))).toBeCloseTo(0.04, 15);
    expect(fresnelReflectanceP(1, 1.5, deg(0))).toBeCloseTo(0.04, 15);
  });

  it("r_p(0) = r_s(0) = (n1 − n2)/(n1 + n2), both directions", () => {
    // closed form at normal incidence; sign convention r_p(0) = r_s(0)
    for (const [n1, n2] of [
      [1, 1.5],
      [1, 1.52],
      [1.52, 1],
      [1.33, 2.4],
    ] as const) {
      const f = fresnelInterface(n1, n2, deg(0));
      const expected = (n1 - n2) / (n1 + n2);
      expect(Math.abs(f.rs.re - expected)).toBeLessThan(1e-15);
      expect(Math.abs(f.rp.re - expected)).toBeLessThan(1e-15);
      expect(f.rs.im).toBe(0);
      expect(f.rp.im).toBe(0);
    }
  });

  it("sign convention: 1 → 1.52 at 30° and 60°", () => {
    // [calc F1] §1 "Sign convention": 30°: r_s = −0.247404, r_p = −0.164555;
    // 60°: r_s = −0.428297, r_p = +0.039079 (above Brewster r_p changes sign)
    const a = fresnelInterface(1, 1.52, deg(30));
    printed(a.rs.re, "-0.247404");
    printed(a.rp.re, "-0.164555");
    const b = fresnelInterface(1, 1.52, deg(60));
    printed(b.rs.re, "-0.428297");
    printed(b.rp.re, "0.039079");
  });

  it("t_s, t_p match the textbook forms 2n1cosθi/(n1cosθi + n2cosθt) and 2n1cosθi/(n1cosθt + n2cosθi)", () => {
    // closed forms, Hecht §4.6 (from memory); real indices, 45°
    const n1 = 1;
    const n2 = 1.52;
    const ci = Math.cos(deg(45));
    const ct = Math.cos(snellRefractionAngle(n1, n2, deg(45))!);
    const f = fresnelInterface(n1, n2, deg(45));
    expect(f.ts.re).toBeCloseTo((2 * n1 * ci) / (n1 * ci + n2 * ct), 14);
    expect(f.tp.re).toBeCloseTo((2 * n1 * ci) / (n1 * ct + n2 * ci), 14);
  });

  it("lossless media conserve energy: T_j + R_j = 1", () => {
    // [calc F1] §1 edge cases: "For non-absorbing media, T_j + R_j = 1 to 1e-15"
    for (const n2 of [1.2, 1.5, 1.52, 2.4]) {
      for (let d = 0; d <= 89.5; d += 0.5) {
        const f = fresnelInterface(1, n2, deg(d));
        expect(Math.abs(f.Ts + f.Rs - 1)).toBeLessThan(1e-14);
        expect(Math.abs(f.Tp + f.Rp - 1)).toBeLessThan(1e-14);
      }
    }
  });

  it("grazing incidence: R = 1 and T = 0", () => {
    // §1 edge cases: θi = 90°: R = 1 and T = 0 (closed-form limit)
    const f = fresnelInterface(1, 1.52, asRadians(Math.PI / 2));
    expect(f.Rs).toBe(1);
    expect(f.Rp).toBe(1);
    expect(f.Ts).toBe(0);
    expect(f.Tp).toBe(0);
  });

  it("no interface (n1 = n2): R = 0", () => {
    // §1 edge cases: n1 = n2 gives R = 0 (closed form)
    for (const d of [0, 30, 60, 89]) {
      const f = fresnelInterface(1.52, 1.52, deg(d));
      // |r| ≈ 1e-13 from the rounding of n1² − n1² sin² θ near grazing incidence
      expect(f.Rs).toBeLessThan(1e-24);
      expect(f.Rp).toBeLessThan(1e-24);
      expect(Math.abs(f.T - 1)).toBeLessThan(1e-14);
    }
  });
});

describe("Brewster and critical angles", () => {
  it("Brewster angle atan(n2/n1) and R_p = 0 there", () => {
    // [calc F1] §1: atan(1.5) = 56.3099°, R_s = 0.147929; atan(1.52) = 56.6593°, R_s = 0.156692
    for (const [n2, thetaB, Rs] of [
      [1.5, "56.3099", "0.147929"],
      [1.52, "56.6593", "0.156692"],
    ] as const) {
      const b = brewsterAngle(1, n2);
      printed(toDegrees(b), thetaB);
      const f = fresnelInterface(1, n2, b);
      printed(f.Rs, Rs);
      expect(f.Rp).toBeLessThan(1e-28);
    }
  });

  it("critical angle asin(n2/n1) from glass to air; none from air to glass", () => {
    // [calc F1] §1: asin(1/1.5) = 41.8103°; asin(1/1.52) = 41.1395°
    printed(toDegrees(criticalAngle(1.5, 1)!), "41.8103");
    printed(toDegrees(criticalAngle(1.52, 1)!), "41.1395");
    expect(criticalAngle(1, 1.52)).toBeNull();
    expect(criticalAngle(1.52, 1.52)).toBeNull();
  });

  it("at the critical angle R = 1 (cos θt = 0, up to the rounding of asin)", () => {
    // §1 edge cases: θi = θc exactly gives cos θt = 0, so R = 1
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
  // [calc F1] §1 "Internal incidence, 1.52 → 1": θ, R_s, R_p, R, cos θt (real)
  it.each([
    [30, "0.114875", "0.004320", "0.059598", "0.649923"],
    [40, "0.476976", "0.164595", "0.320785", "0.213069"],
  ] as const)("θ=%s°", (theta, Rs, Rp, R, cosT) => {
    const f = fresnelInterface(1.52, 1, deg(theta));
    printed(f.Rs, Rs);
    printed(f.Rp, Rp);
    printed(f.R, R);
    printed(f.qx.re, cosT); // q_x = n2 cos θt with n2 = 1
    expect(f.qx.im).toBe(0);
  });

  // [calc F1] §1: 45° → cos θt = 0.393954 i; 60° → 0.856037 i; R_s = R_p = 1
  it.each([
    [45, "0.393954"],
    [60, "0.856037"],
  ] as const)("θ=%s°: |r_s| = |r_p| = 1, cos θt imaginary, T = 0", (theta, cosTim) => {
    const f = fresnelInterface(1.52, 1, deg(theta));
    expect(Math.abs(f.rs.abs() - 1)).toBeLessThan(1e-15);
    expect(Math.abs(f.rp.abs() - 1)).toBeLessThan(1e-15);
    expect(f.Ts).toBe(0);
    expect(f.Tp).toBe(0);
    expect(Math.abs(f.qx.re)).toBeLessThan(1e-15);
    printed(f.qx.im, cosTim); // decaying branch: Im(q_x) ≥ 0
  });

  it("phases at 60°: arg r_s = −96.80°, arg r_p = +42.04°", () => {
    // [calc F1] §1, with the convention r_p(0) = r_s(0)
    const f = fresnelInterface(1.52, 1, deg(60));
    printed((f.rs.arg() * 180) / Math.PI, "-96.80");
    printed((f.rp.arg() * 180) / Math.PI, "42.04");
  });

  it("reciprocity: glass → air at the refracted angle equals air → glass", () => {
    // [calc F1] §1 edge cases: 1.52 → 1 at 19.2049° gives R_s = 0.0612087, R_p = 0.0270783,
    // the same as 1 → 1.52 at 30° (Stokes relations, Hecht §4.10, from memory)
    const thetaT = snellRefractionAngle(1, 1.52, deg(30))!;
    printed(toDegrees(thetaT), "19.2049");
    const back = fresnelInterface(1.52, 1, thetaT);
    const fwd = fresnelInterface(1, 1.52, deg(30));
    printed(back.Rs, "0.0612087");
    printed(back.Rp, "0.0270783");
    expect(Math.abs(back.Rs - fwd.Rs)).toBeLessThan(1e-15);
    expect(Math.abs(back.Rp - fwd.Rp)).toBeLessThan(1e-15);
  });
});

describe("absorbing medium (complex index)", () => {
  const metal = new Complex(0.2, 3); // metal-like N = n + ik

  it("normal incidence: R = ((n−1)² + k²)/((n+1)² + k²) = 9.64/10.44", () => {
    // closed form for an absorbing medium, Born & Wolf, chapter on the optics of metals (from memory)
    const f = fresnelInterface(1, metal, deg(0));
    expect(Math.abs(f.Rs - 9.64 / 10.44)).toBeLessThan(1e-15);
    expect(Math.abs(f.Rp - 9.64 / 10.44)).toBeLessThan(1e-15);
    // r_p(0) = r_s(0) also for complex n2
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
