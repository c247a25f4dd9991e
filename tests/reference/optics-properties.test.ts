// Property-based tests (fast-check) of the optics core and its façade (src/lib/physics/optics.ts).
//
// The invariants are physical laws, not regression values:
// - energy conservation T + R + ΣA = 1 for radiation from either side (net-radiation method,
//   EN 410:2011 §5 / ISO 9050:2003 §4, from memory);
// - reciprocity: the transmittance of specular layers is the same in both directions, so a
//   glazing turned round transmits the same (Stokes relations, Hecht, Optics, 4th ed., §4.10,
//   from memory);
// - every fraction lies in [0, 1];
// - the sign convention r_p(0) = r_s(0) = (n1 − n2)/(n1 + n2) (closed form at normal incidence).
import Complex from "complex.js";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import { fresnelInterface } from "@/lib/physics/fresnel";
import type { MeasuredValues } from "@/lib/physics/measured-pane";
import type { StackOptics } from "@/lib/physics/layer-stack";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import { asRadians, type Radians } from "@/lib/physics/units";
import { clear6mmSpec, coated6mmSpec } from "./fixtures";

const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });

const physicalPane: fc.Arbitrary<PaneSpec> = fc
  .record({ d: dbl(0.002, 0.02), n: dbl(1.3, 2.2), a: dbl(0, 300) })
  .map(({ d, n, a }) => ({ kind: "physical", thicknessM: d, refractiveIndex: n, absorptionPerM: a }));

/** Measured values of an uncoated pane, made from a slab at 0° (so that they are invertible). */
const uncoatedValues = (d: number): fc.Arbitrary<MeasuredValues> =>
  fc.record({ n: dbl(1.4, 1.9), a: dbl(1, 300), split: dbl(0, 1) }).map(({ n, a, split }) => {
    const o = absorbingPaneOptics({ thicknessM: d, refractiveIndex: n, absorptionPerM: a }, asRadians(0));
    const delta = Math.min(0.002, o.A / 4) * split; // |Rf − Rb| stays within the uncoated tolerance
    return { T: o.T, Rf: o.R + delta, Rb: o.R - delta };
  });

const uncoatedMeasuredPane: fc.Arbitrary<PaneSpec> = dbl(0.002, 0.02).chain((d) =>
  fc
    .record({ solar: uncoatedValues(d), visible: fc.option(uncoatedValues(d), { nil: undefined }) })
    .map(({ solar, visible }) => ({ kind: "measured" as const, thicknessM: d, solar, ...(visible ? { visible } : {}) })),
);

const coatedValues: fc.Arbitrary<MeasuredValues> = fc
  .record({ T: dbl(0, 0.9), f: dbl(0.02, 1), b: dbl(0.02, 1) })
  .map(({ T, f, b }) => ({ T, Rf: f * (1 - T), Rb: b * (1 - T) }))
  .filter((v) => Math.abs(v.Rf - v.Rb) > 0.006);

const coatedMeasuredPane: fc.Arbitrary<PaneSpec> = fc
  .record({ d: dbl(0.003, 0.012), solar: coatedValues, visible: fc.option(coatedValues, { nil: undefined }) })
  .map(({ d, solar, visible }) => ({ kind: "measured" as const, thicknessM: d, solar, ...(visible ? { visible } : {}) }));

const anyPane = fc.oneof(physicalPane, uncoatedMeasuredPane, coatedMeasuredPane);
const glazing = fc.array(anyPane, { minLength: 1, maxLength: 6 });
const angle: fc.Arbitrary<Radians> = fc.oneof(dbl(0, Math.PI / 2), fc.constantFrom(0, Math.PI / 2, Math.PI / 3)).map((x) => asRadians(x));
const route = fc.constantFrom("per-polarization" as const, "averaged" as const);

/** The same pane seen from the other side. */
const turned = (p: PaneSpec): PaneSpec =>
  p.kind === "physical"
    ? p
    : {
        kind: "measured",
        thicknessM: p.thicknessM,
        solar: { T: p.solar.T, Rf: p.solar.Rb, Rb: p.solar.Rf },
        ...(p.visible ? { visible: { T: p.visible.T, Rf: p.visible.Rb, Rb: p.visible.Rf } } : {}),
      };

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);

function expectBalanced(b: StackOptics): void {
  expect(Math.abs(b.T + b.Rf + sum(b.absorptanceFront) - 1)).toBeLessThan(1e-12);
  expect(Math.abs(b.T + b.Rb + sum(b.absorptanceBack) - 1)).toBeLessThan(1e-12);
  for (const v of [b.T, b.Rf, b.Rb, ...b.absorptanceFront, ...b.absorptanceBack]) {
    expect(Number.isFinite(v)).toBe(true);
    expect(v).toBeGreaterThanOrEqual(0);
    expect(v).toBeLessThanOrEqual(1 + 1e-15);
  }
}

describe("properties of random glazings (1–6 panes, physical, uncoated measured, coated measured)", () => {
  it("T + R + ΣA = 1 from either side, and every value in [0, 1], at every angle", () => {
    fc.assert(
      fc.property(glazing, angle, route, (panes, theta, polarization) => {
        const o = prepareGlazing(panes, { polarization }).at(theta);
        expectBalanced(o.solar);
        if (o.visible) expectBalanced(o.visible);
      }),
      { numRuns: 300 },
    );
  });

  it("the glazing turned round transmits the same; its front reflectance is the original back reflectance", () => {
    fc.assert(
      fc.property(glazing, angle, route, (panes, theta, polarization) => {
        const a = prepareGlazing(panes, { polarization }).at(theta).solar;
        const b = prepareGlazing([...panes].reverse().map(turned), { polarization }).at(theta).solar;
        expect(Math.abs(a.T - b.T)).toBeLessThan(1e-12);
        expect(Math.abs(a.Rb - b.Rf)).toBeLessThan(1e-12);
        expect(Math.abs(a.Rf - b.Rb)).toBeLessThan(1e-12);
        a.absorptanceBack.forEach((x, k) => expect(Math.abs(x - b.absorptanceFront[panes.length - 1 - k]!)).toBeLessThan(1e-12));
      }),
      { numRuns: 200 },
    );
  });

  it("visible values exist exactly when every pane has measured visible values", () => {
    fc.assert(
      fc.property(glazing, (panes) => {
        const g = prepareGlazing(panes);
        const all = panes.every((p) => p.kind === "measured" && p.visible !== undefined);
        expect(g.hasVisible).toBe(all);
        expect(g.at(asRadians(0.3)).visible === null).toBe(!all);
      }),
      { numRuns: 100 },
    );
  });

  it("hemispherical values also balance and lie in [0, 1]", () => {
    fc.assert(
      fc.property(glazing, (panes) => {
        const h = prepareGlazing(panes).hemispherical();
        expectBalanced(h.solar);
        if (h.visible) expectBalanced(h.visible);
      }),
      { numRuns: 40 },
    );
  });

  it("per-polarisation and averaged routes agree at normal incidence", () => {
    fc.assert(
      fc.property(glazing, (panes) => {
        const a = prepareGlazing(panes).at(asRadians(0)).solar;
        const b = prepareGlazing(panes, { polarization: "averaged" }).at(asRadians(0)).solar;
        expect(Math.abs(a.T - b.T)).toBeLessThan(1e-12);
        expect(Math.abs(a.Rf - b.Rf)).toBeLessThan(1e-12);
      }),
      { numRuns: 100 },
    );
  });
});

describe("properties of one interface", () => {
  const index = fc.oneof(
    dbl(1, 3),
    fc.record({ re: dbl(0.05, 5), im: dbl(0, 10) }).map(({ re, im }) => new Complex(re, im)),
  );

  it("r_p(0) = r_s(0) = (n1 − n2)/(n1 + n2) for random real and complex n2", () => {
    fc.assert(
      fc.property(dbl(1, 3), index, (n1, n2) => {
        const f = fresnelInterface(n1, n2, asRadians(0));
        const N2 = typeof n2 === "number" ? new Complex(n2, 0) : n2;
        const expected = new Complex(n1, 0).sub(N2).div(N2.add(n1));
        expect(f.rp.sub(f.rs).abs()).toBeLessThan(1e-14);
        expect(f.rs.sub(expected).abs()).toBeLessThan(1e-14);
      }),
      { numRuns: 300 },
    );
  });

  it("T_j + R_j = 1 for a lossless incident medium, any angle, real or complex n2", () => {
    fc.assert(
      fc.property(dbl(1, 3), index, angle, (n1, n2, theta) => {
        const f = fresnelInterface(n1, n2, theta);
        expect(Math.abs(f.Ts + f.Rs - 1)).toBeLessThan(1e-12);
        expect(Math.abs(f.Tp + f.Rp - 1)).toBeLessThan(1e-12);
        for (const v of [f.Rs, f.Rp, f.Ts, f.Tp]) {
          expect(v).toBeGreaterThanOrEqual(0);
          expect(v).toBeLessThanOrEqual(1 + 1e-12);
        }
      }),
      { numRuns: 300 },
    );
  });
});

describe("glazing façade", () => {
  const clear: PaneSpec = clear6mmSpec;
  const coated: PaneSpec = coated6mmSpec;

  it("warns that a coated pane's angular values are estimates", () => {
    const g = prepareGlazing([coated, clear]);
    expect(g.warnings).toHaveLength(1);
    expect(g.warnings[0]).toMatchObject({ code: "coated-angular-estimate", paneIndex: 0 });
    expect(g.panes[0]).toMatchObject({ kind: "measured", coated: true });
    expect(prepareGlazing([clear, clear]).warnings).toHaveLength(0);
  });

  it("warns when an uncoated pane's equivalent index is unusual for glass", () => {
    // T = 0.95, R = 0.02 implies n ≈ 1.2 (anti-reflective glass measured as if uncoated)
    const g = prepareGlazing([{ kind: "measured", thicknessM: 0.004, solar: { T: 0.95, Rf: 0.02, Rb: 0.02 } }]);
    expect(g.warnings.map((w) => w.code)).toEqual(["unusual-equivalent-index"]);
  });

  it("identical panes give identical results to separately specified equal panes", () => {
    const a = prepareGlazing([clear, clear, clear]).at(asRadians(1));
    const b = prepareGlazing([clear, { ...clear }, { ...clear }]).at(asRadians(1));
    expect(a).toEqual(b);
  });

  it("names the pane and the quantity in errors", () => {
    expect(() => prepareGlazing([])).toThrow(/1\.\.6 panes/);
    expect(() => prepareGlazing(Array<PaneSpec>(7).fill(clear))).toThrow(/1\.\.6 panes/);
    expect(() => prepareGlazing([clear, { ...clear, thicknessM: -1 }])).toThrow(/pane 2: pane thickness/);
    expect(() => prepareGlazing([clear, clear, { kind: "measured", thicknessM: 0.004, solar: { T: 0.9, Rf: 0.2, Rb: 0.2 } }])).toThrow(
      /pane 3 solar\.T \+ solar\.Rf/,
    );
    expect(() => prepareGlazing([clear]).at(asRadians(-0.1))).toThrow(/angle of incidence/);
    expect(() => prepareGlazing([clear], { polarization: "none" as unknown as "averaged" })).toThrow(/polarization/);
  });

  it("returns fresh arrays from at(), frozen ones from hemispherical()", () => {
    const g = prepareGlazing([clear, clear]);
    const a = g.at(asRadians(0.5));
    (a.solar.absorptanceFront as number[])[0] = 99;
    expect(g.at(asRadians(0.5)).solar.absorptanceFront[0]).not.toBe(99);
    expect(Object.isFrozen(g.hemispherical().solar.absorptanceFront)).toBe(true);
  });
});
