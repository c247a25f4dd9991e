// Reference tests for panes given by measured normal-incidence values
// (src/lib/physics/measured-pane.ts).
//
// The check values are the cases of src/lib/reference-cases/measured-pane.ts (inversion of measured T and R,
// Karlsson–Roos polynomial) and src/lib/reference-cases/absorbing-pane.ts (the slab values of the 6 mm model
// pane), evaluated independently in float64 by scripts/reference/measured-pane.ts and
// scripts/reference/absorbing-pane.ts. Each case gives its tolerance.
// Karlsson–Roos values are IMPLEMENTATION-ONLY checks: the polynomial as recalled (from memory,
// J. Karlsson & A. Roos, Solar Energy 69(4):321–329, 2000), evaluated independently; they are not
// validated against the paper.
import { describe, expect, it } from "vitest";
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import {
  invertUncoatedPane,
  karlssonRoosTransmittanceRatio,
  measuredBandAt,
  MeasuredPaneError,
  prepareMeasuredPane,
  referenceCurveReflectance,
  referenceInternalTransmittance,
  UNCOATED_FACE_TOLERANCE,
  type MeasuredBandModel,
} from "@/lib/physics/measured-pane";
import { asRadians, type Radians } from "@/lib/physics/units";
import { absorbingPaneDomain, losslessCase, pane6mmCases, ratio6mmCases } from "@/lib/reference-cases/absorbing-pane";
import {
  invertedAt60Case,
  karlssonRoosCases,
  measuredPaneDomain,
  printedRoundTripCase,
  workedInversionCase,
} from "@/lib/reference-cases/measured-pane";
import { measuredPaneValues } from "@/lib/validation/engines/measured-pane";
import { caseById, deg, expectCase, expectValue, expectedOf } from "./fixtures";

const unpolarized = (model: MeasuredBandModel, theta: Radians) => {
  const l = measuredBandAt(model, theta);
  return { T: 0.5 * (l.s.T + l.p.T), Rf: 0.5 * (l.s.Rf + l.p.Rf), Rb: 0.5 * (l.s.Rb + l.p.Rb) };
};

/** The engine's values of a measured-pane case: the evaluator the validation report runs. */
const engine = measuredPaneValues;

it("case ids are unique", () => {
  expect(new Set(measuredPaneDomain.cases.map((c) => c.id)).size).toBe(measuredPaneDomain.cases.length);
});

describe("uncoated pane: inversion of measured T and R to n and α", () => {
  it(workedInversionCase.label, () => {
    // b is exact decimal arithmetic: 1 + 0.15 − 0.005625 + 0.6889 (tolerance 1e-15 in the case)
    expectCase(engine(workedInversionCase.input), workedInversionCase);
  });

  it(invertedAt60Case.label, () => {
    // n and α fed back through the slab series at 60°
    if (invertedAt60Case.input.kind !== "uncoated-at-angle") throw new Error("expected an angle case");
    const pane = prepareMeasuredPane({ thicknessM: 0.006, solar: invertedAt60Case.input.solar });
    expect(pane.coated).toBe(false);
    expectCase(engine(invertedAt60Case.input), invertedAt60Case);
  });

  it("round trip: the slab at 0° inverts back to n = 1.52, α = 0.02 /mm within 1e-9", () => {
    // exact slab values in, exact n, α out (the inversion is the closed-form inverse of the slab series)
    const slab = absorbingPaneOptics({ thicknessM: 0.006, refractiveIndex: 1.52, absorptionPerM: 20 }, deg(0));
    const inv = invertUncoatedPane(slab.T, slab.R, 0.006);
    expect(Math.abs(inv.refractiveIndex - 1.52)).toBeLessThan(1e-9);
    expect(Math.abs(inv.absorptionPerM / 1000 - 0.02)).toBeLessThan(1e-9);
  });

  it(printedRoundTripCase.label, () => {
    // the 6 mm pane's printed normal-incidence T and R are those of the absorbing-pane case
    const slab0 = caseById(absorbingPaneDomain.cases, "absorbing-pane/6mm/0deg");
    if (printedRoundTripCase.input.kind !== "inversion") throw new Error("expected an inversion case");
    expect(printedRoundTripCase.input.T).toBe(expectedOf(slab0, "T").value);
    expect(printedRoundTripCase.input.R).toBe(expectedOf(slab0, "R").value);
    // the tolerances of the case cover the rounding of those printed inputs
    expectCase(engine(printedRoundTripCase.input), printedRoundTripCase);
  });

  it("uses the same slab model as a physical pane, per polarisation", () => {
    const slab = absorbingPaneOptics({ thicknessM: 0.006, refractiveIndex: 1.52, absorptionPerM: 20 }, deg(0));
    const pane = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: slab.T, Rf: slab.R, Rb: slab.R } });
    for (const d of [0, 30, 60, 80]) {
      const phys = absorbingPaneOptics({ thicknessM: 0.006, refractiveIndex: 1.52, absorptionPerM: 20 }, deg(d));
      const l = measuredBandAt(pane.solar, deg(d));
      expect(Math.abs(l.s.T - phys.s.T)).toBeLessThan(1e-9);
      expect(Math.abs(l.p.T - phys.p.T)).toBeLessThan(1e-9);
      expect(Math.abs(l.s.Rf - phys.s.R)).toBeLessThan(1e-9);
      expect(l.s.Rf).toBe(l.s.Rb);
    }
  });

  it("visible values are inverted on their own", () => {
    const pane = prepareMeasuredPane({
      thicknessM: 0.006,
      solar: { T: 0.83, Rf: 0.075, Rb: 0.075 },
      visible: { T: 0.88, Rf: 0.08, Rb: 0.08 },
    });
    expect(pane.visible?.kind).toBe("uncoated");
    const v = unpolarized(pane.visible!, deg(0));
    expect(Math.abs(v.T - 0.88)).toBeLessThan(1e-12);
    expect(Math.abs(v.Rf - 0.08)).toBeLessThan(1e-12);
  });

  describe("refuses values no uncoated slab can have, naming the quantity", () => {
    const cases: [string, number, number, MeasuredPaneError["reason"], RegExp][] = [
      ["T + R > 1", 0.9, 0.2, "energy-balance", /solar\.T \+ solar\.R/],
      ["T = 0", 0, 0.1, "no-transmittance", /solar\.T/],
      ["R = 0", 0.9, 0, "no-reflectance", /solar\.R/],
      ["T not a number", Number.NaN, 0.1, "not-a-fraction", /solar\.T/],
      ["R negative", 0.8, -0.01, "not-a-fraction", /solar\.R/],
      ["implied n > 5", 0.1, 0.6, "refractive-index", /refractive index/],
    ];
    it.each(cases)("%s", (_label, T, R, reason, message) => {
      let error: unknown;
      try {
        invertUncoatedPane(T, R, 0.006);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(MeasuredPaneError);
      expect(error).toBeInstanceOf(RangeError);
      expect((error as MeasuredPaneError).reason).toBe(reason);
      expect((error as Error).message).toMatch(message);
    });

    it("thickness", () => {
      expect(() => invertUncoatedPane(0.8, 0.07, 0)).toThrow(/thickness/);
      expect(() => prepareMeasuredPane({ thicknessM: Number.NaN, solar: { T: 0.8, Rf: 0.07, Rb: 0.07 } })).toThrow(/thickness/);
    });

    it("measured values of a coated pane that break energy balance", () => {
      expect(() => prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.6, Rf: 0.5, Rb: 0.1 } })).toThrow(/solar\.T \+ solar\.Rf/);
      expect(() =>
        prepareMeasuredPane({
          thicknessM: 0.006,
          solar: { T: 0.6, Rf: 0.1, Rb: 0.3 },
          visible: { T: 0.7, Rf: 0.1, Rb: 0.35 },
        }),
      ).toThrow(/visible\.T \+ visible\.Rb/);
    });
  });
});

describe("coated pane: Karlsson–Roos transmittance", () => {
  // IMPLEMENTATION-ONLY check values (the polynomial as recalled, from memory): T(θ)/T(0) for (p, q)
  it("has the 3 × 7 implementation-only values", () => expect(karlssonRoosCases).toHaveLength(21));
  for (const c of karlssonRoosCases) {
    it(c.label, () => {
      if (c.input.kind !== "karlsson-roos") throw new Error("expected a Karlsson–Roos case");
      expectCase(engine(c.input), c);
      expect(karlssonRoosTransmittanceRatio(deg(0), c.input.p, c.input.q)).toBe(1);
    });
  }

  it("falls monotonically from 1 to 0 over the accepted (p, q)", () => {
    for (const p of [1, 2, 3]) {
      for (let q = 1; q <= 10; q += 0.5) {
        let prev = 1;
        for (let d = 0; d <= 90; d += 0.5) {
          const v = karlssonRoosTransmittanceRatio(deg(d), p, q);
          expect(v).toBeGreaterThanOrEqual(0);
          expect(v).toBeLessThanOrEqual(prev + 1e-15);
          prev = v;
        }
        expect(prev).toBe(0);
      }
    }
  });

  it("default per-layer parameters (p, q) = (1, 4) stay within 0.011 of an uncoated 6 mm slab's own curve up to 80°", () => {
    // Sanity check of the chosen default against the slab model (Duffie & Beckman ch. 5, from memory),
    // our own comparison (no published source): the reference curve T(θ)/T(0) of the 6 mm pane (case values)
    const ref = ratio6mmCases.filter((c) => c.input.thetaDeg <= 80).map((c) => [c.input.thetaDeg, expectedOf(c, "TOverT0").value] as const);
    expect(ref.map(([d]) => d)).toEqual([30, 45, 60, 70, 80]);
    for (const [d, r] of ref) expect(Math.abs(karlssonRoosTransmittanceRatio(deg(d), 1, 4) - r)).toBeLessThan(0.011);
  });

  it("refuses p, q outside the accepted ranges", () => {
    expect(() => karlssonRoosTransmittanceRatio(deg(30), 4, 4)).toThrow(/pane count p/);
    expect(() => karlssonRoosTransmittanceRatio(deg(30), 1, 0.5)).toThrow(/glazing-type index q/);
    expect(() => prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.6, Rf: 0.1, Rb: 0.2 } }, { karlssonRoosQ: 11 })).toThrow(/q/);
  });
});

describe("coated pane: angular model", () => {
  // A hypothetical coated pane (not a product): same T(0) as the 6 mm model pane, so that the
  // reference slab is that pane and its slab values (absorbing-pane cases) can be used.
  const slab = (theta: number) => pane6mmCases.find((c) => c.input.thetaDeg === theta)!;
  const T0 = expectedOf(slab(0), "T").value;
  const coated = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: T0, Rf: 0.1, Rb: 0.05 } });

  it("is classified as coated (|Rf − Rb| > 0.005)", () => {
    expect(coated.coated).toBe(true);
    expect(coated.solar.kind).toBe("coated");
  });

  it("reference slab matching T(0) is the 6 mm, α = 0.02 /mm pane", () => {
    // τ = 0.886920 and R = 0.073327 at 0° for that pane (case values); T(0) printed to 6 decimals
    // moves τ by at most ~6e-7 (our propagation), hence 1e-6.
    if (coated.solar.kind !== "coated") throw new Error("expected coated");
    expect(T0).toBe(0.814159);
    expect(Math.abs(coated.solar.reference.internalTransmittanceNormal - expectedOf(slab(0), "tau").value)).toBeLessThan(1e-6);
    expect(Math.abs(coated.solar.reference.reflectanceNormal - expectedOf(slab(0), "R").value)).toBeLessThan(1e-6);
  });

  it("reflectance follows the normalised reference curve, per face (common practice, no source)", () => {
    // common practice (no source): R_c(θ) = R_c(0) + (1 − R_c(0))·[R_ref(θ) − R_ref(0)]/[1 − R_ref(0)],
    // evaluated here with the reference slab values (absorbing-pane cases) R_ref(0) = 0.073327,
    // R_ref(60°) = 0.139896, R_ref(80°) = 0.495741; tolerance 3e-6 covers the rounding of those printed inputs.
    const R0 = expectedOf(slab(0), "R").value;
    const rule = (c0: number, r: number) => c0 + ((1 - c0) * (r - R0)) / (1 - R0);
    for (const [d, refR] of [60, 80].map((t) => [t, expectedOf(slab(t), "R").value] as const)) {
      const l = measuredBandAt(coated.solar, deg(d));
      expect(Math.abs(l.s.Rf - rule(0.1, refR))).toBeLessThan(3e-6);
      expect(Math.abs(l.s.Rb - rule(0.05, refR))).toBeLessThan(3e-6);
      expect(Math.abs(referenceCurveReflectance(0.1, refR, R0) - rule(0.1, refR))).toBeLessThan(1e-15);
    }
  });

  it("transmittance is T(0)·KR(θ; 1, q); with q = 1 it follows the implementation-only (1, 1) row", () => {
    // IMPLEMENTATION-ONLY (p, q) = (1, 1) cases: 0.771175 at 60°, 0.348053 at 80°
    const q1 = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.6, Rf: 0.1, Rb: 0.2 } }, { karlssonRoosQ: 1 });
    for (const theta of [60, 80]) {
      const c = caseById(karlssonRoosCases, `measured-pane/karlsson-roos/p1-q1/${theta}deg`);
      expectValue(measuredBandAt(q1.solar, deg(theta)).s.T / 0.6, expectedOf(c, "TOverT0"), c.id);
    }
    const l = measuredBandAt(coated.solar, deg(45));
    expect(l.s.T).toBe(T0 * karlssonRoosTransmittanceRatio(deg(45), 1, 4));
  });

  it("normal incidence returns the measured values; grazing gives T = 0, R = 1", () => {
    const l0 = measuredBandAt(coated.solar, deg(0));
    expect(l0.s).toEqual({ T: T0, Rf: 0.1, Rb: 0.05 });
    const l90 = measuredBandAt(coated.solar, asRadians(Math.PI / 2));
    expect(l90.s.T).toBe(0);
    expect(l90.s.Rf).toBe(1);
    expect(l90.s.Rb).toBe(1);
  });

  it("has no s/p split", () => {
    for (const d of [0, 30, 60, 85]) {
      const l = measuredBandAt(coated.solar, deg(d));
      expect(l.p).toEqual(l.s);
    }
  });

  it("keeps A ≥ 0 on each face even for a non-absorbing, highly reflective coating", () => {
    // T + Rf = 1 at 0°: without the R ≤ 1 − T rule the front absorptance would turn negative
    const mirror = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.3, Rf: 0.7, Rb: 0.4 } });
    for (let d = 0; d <= 90; d += 0.5) {
      const l = measuredBandAt(mirror.solar, deg(d)).s;
      expect(1 - l.T - l.Rf).toBeGreaterThanOrEqual(0);
      expect(1 - l.T - l.Rb).toBeGreaterThanOrEqual(0);
    }
  });

  it("very clear coated pane: the reference slab is lossless, T_ref(0) = 2n/(n² + 1)", () => {
    // closed form of the lossless slab at 0°, 2n/(n² + 1) = 0.918318 for n = 1.52 (absorbing-pane case)
    expect(referenceInternalTransmittance(0.95)).toBe(1);
    expectValue((2 * 1.52) / (1.52 ** 2 + 1), expectedOf(losslessCase, "T"), losslessCase.id);
    expect(Math.abs(referenceInternalTransmittance((2 * 1.52) / (1.52 ** 2 + 1)) - 1)).toBeLessThan(1e-12);
    // an opaque coated pane (T = 0) keeps working: the reference slab is opaque too
    const opaque = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0, Rf: 0.3, Rb: 0.1 } });
    const l = measuredBandAt(opaque.solar, deg(40));
    expect(l.s.T).toBe(0);
    expect(Number.isFinite(l.s.Rf)).toBe(true);
  });
});

describe("uncoated / coated classification", () => {
  it(`treats |Rf − Rb| ≤ ${UNCOATED_FACE_TOLERANCE} as uncoated, with R = (Rf + Rb)/2`, () => {
    const a = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.83, Rf: 0.0775, Rb: 0.0725 } });
    expect(a.coated).toBe(false);
    if (a.solar.kind !== "uncoated") throw new Error("expected uncoated");
    // same inversion as the worked example with R = 0.075
    expectValue(a.solar.inversion.refractiveIndex, expectedOf(workedInversionCase, "refractiveIndex"), workedInversionCase.id);
    const b = prepareMeasuredPane({ thicknessM: 0.006, solar: { T: 0.83, Rf: 0.078, Rb: 0.072 } });
    expect(b.coated).toBe(true);
  });

  it("a coating seen in the visible band makes the whole pane coated", () => {
    const p = prepareMeasuredPane({
      thicknessM: 0.006,
      solar: { T: 0.6, Rf: 0.1, Rb: 0.1 },
      visible: { T: 0.7, Rf: 0.05, Rb: 0.09 },
    });
    expect(p.coated).toBe(true);
    expect(p.solar.kind).toBe("coated");
    expect(p.visible?.kind).toBe("coated");
  });
});
