// Reference tests for overhang/fin shading of a window (src/lib/physics/shading/).
//
// Beam checks: src/lib/reference-cases/shading.ts (worked example and table), computed by
// scripts/reference/shading.ts from the standard overhang/fin geometry [ASHRAE Handbook—Fundamentals,
// fenestration chapter, from memory]:
//   γ = az_sun − az_façade, tan Ω = tan α / cos γ, h_s = clamp(P tan Ω − G, 0, H),
//   w_s = clamp(F |tan γ| − E, 0, W), f = (W − w_s)(H − h_s)/(W H).
// Finite devices: closed forms of elementary plane geometry (parallelogram minus triangle),
// stated beside each check. Diffuse checks: Hottel's crossed-string rule for 2-D (infinitely long)
// configurations [H. C. Hottel & A. F. Sarofim, Radiative Transfer, 1967, from memory;
// also Incropera & DeWitt, Fundamentals of Heat and Mass Transfer, ch. 13] and the closed form for
// perpendicular rectangles with a common edge [Incropera & DeWitt, Table 13.2, from memory],
// with view-factor algebra for offsets.
// Tolerance for printed values: half a unit in the last printed digit, as stated in each case.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  finShadedWidthM,
  horizontalShadowAngleRad,
  overhangShadedHeightM,
  prepareShading,
  profileAngleRad,
  sunlitFractionAt,
  type ShadingSpec,
} from "@/lib/physics/shading";
import { surfaceOrientationDeg } from "@/lib/physics/surface-geometry";
import { shading as shadingCases, type ShadingInput } from "@/lib/reference-cases/shading";
import { shadingDiffuse } from "@/lib/reference-cases/shading-diffuse";
import { shadingDiffuseValues } from "@/lib/validation/engines/shading-diffuse";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { shadingValues } from "@/lib/validation/engines/shading";
import { deg, expectBelow, expectCase, expectedOf, expectValue } from "./fixtures";

const RAD = 180 / Math.PI;
const southVertical = surfaceOrientationDeg(180, 90);
const caseById = (id: string): ReferenceCase<ShadingInput> => {
  const c = shadingCases.cases.find((x) => x.id === id);
  if (!c) throw new Error(`no case ${id}`);
  return c;
};
const specOfCase = (i: ShadingInput): ShadingSpec => ({
  windowWidthM: i.windowWidthM,
  windowHeightM: i.windowHeightM,
  surfaceTiltRad: deg(i.surfaceTiltDeg),
  overhang: { ...i.overhang },
  fins: { ...i.fins },
});
// Worked-example geometry: W = 1.5, H = 1.2, P = 0.6, G = 0.3, F = 0.4, E = 0.
const exampleInput = caseById("shading/example/angles").input;
const W = exampleInput.windowWidthM;
const H = exampleInput.windowHeightM;
const example: ShadingSpec = specOfCase(exampleInput);

describe("beam, infinite devices: worked example (south façade, sun alt 50°, az 210°)", () => {
  const gamma = horizontalShadowAngleRad(deg(exampleInput.sunAzimuthDeg), deg(exampleInput.surfaceAzimuthDeg));
  const omega = profileAngleRad(deg(exampleInput.sunAltitudeDeg), gamma);
  const P = exampleInput.overhang.depthM;

  const angles = caseById("shading/example/angles");
  it(angles.label, () => {
    expectCase(shadingValues(angles.input), angles);
    expectBelow(gamma * RAD, expectedOf(angles, "horizontalShadowAngleDeg"));
    expectValue(Math.tan(omega), expectedOf(angles, "tanProfileAngle"));
    expectValue(omega * RAD, expectedOf(angles, "profileAngleDeg"));
    expectValue(P * Math.tan(omega), expectedOf(angles, "shadowDropM"));
  });

  const band = caseById("shading/example/shaded-band-and-strip");
  it(band.label, () => {
    expectCase(shadingValues(band.input), band);
    const i = band.input;
    expectValue(
      overhangShadedHeightM(i.overhang.depthM, i.overhang.gapAboveHeadM, i.windowHeightM, omega),
      expectedOf(band, "overhangShadedHeightM"),
    );
    expectValue(finShadedWidthM(i.fins.depthM, i.fins.gapFromJambM, i.windowWidthM, gamma), expectedOf(band, "finShadedWidthM"));
  });

  const fractions = caseById("shading/example/sunlit-fractions");
  it(`${fractions.label}, on the hot path`, () => {
    expectCase(shadingValues(fractions.input), fractions);
    const i = fractions.input;
    const at = (spec: ShadingSpec) => sunlitFractionAt(prepareShading(spec), southVertical, deg(i.sunAltitudeDeg), deg(i.sunAzimuthDeg));
    expectValue(at(example), expectedOf(fractions, "sunlitFraction"));
    const { fins: _f, ...overhangOnly } = example;
    expectValue(at(overhangOnly), expectedOf(fractions, "sunlitFractionOverhangOnly"));
    const { overhang: _o, ...finsOnly } = example;
    expectValue(at(finsOnly), expectedOf(fractions, "sunlitFractionFinsOnly"));
  });

  const rows = shadingCases.cases.filter((c) => c.id.startsWith("shading/example-window/"));
  it.each(rows)("$label", (c) => {
    expectCase(shadingValues(c.input), c); // the evaluator the validation report runs
    const i = c.input;
    const g = horizontalShadowAngleRad(deg(i.sunAzimuthDeg), deg(i.surfaceAzimuthDeg));
    const o = profileAngleRad(deg(i.sunAltitudeDeg), g);
    expectValue(o * RAD, expectedOf(c, "profileAngleDeg"));
    expectValue(overhangShadedHeightM(i.overhang.depthM, i.overhang.gapAboveHeadM, i.windowHeightM, o), expectedOf(c, "overhangShadedHeightM"));
    expectValue(finShadedWidthM(i.fins.depthM, i.fins.gapFromJambM, i.windowWidthM, g), expectedOf(c, "finShadedWidthM"));
    expectValue(
      sunlitFractionAt(prepareShading(specOfCase(i)), southVertical, deg(i.sunAltitudeDeg), deg(i.sunAzimuthDeg)),
      expectedOf(c, "sunlitFraction"),
    );
  });

  it("the hot path equals the rectangle product of the overhang/fin formulas (property, random geometry and sun)", () => {
    fc.assert(
      fc.property(
        fc.record({
          w: fc.double({ min: 0.2, max: 4, noNaN: true }),
          h: fc.double({ min: 0.2, max: 4, noNaN: true }),
          p: fc.double({ min: 0, max: 3, noNaN: true }),
          g: fc.double({ min: 0, max: 1, noNaN: true }),
          f: fc.double({ min: 0, max: 3, noNaN: true }),
          e: fc.double({ min: 0, max: 1, noNaN: true }),
          alt: fc.double({ min: 0.5, max: 89.5, noNaN: true }),
          gam: fc.double({ min: -89.5, max: 89.5, noNaN: true }),
        }),
        (c) => {
          const shading = prepareShading({
            windowWidthM: c.w,
            windowHeightM: c.h,
            surfaceTiltRad: deg(90),
            overhang: { depthM: c.p, gapAboveHeadM: c.g },
            fins: { depthM: c.f, gapFromJambM: c.e },
          });
          const g = deg(c.gam);
          const o = profileAngleRad(deg(c.alt), g);
          const hs = overhangShadedHeightM(c.p, c.g, c.h, o);
          const ws = finShadedWidthM(c.f, c.e, c.w, g);
          const expected = ((c.w - ws) * (c.h - hs)) / (c.w * c.h);
          const got = sunlitFractionAt(shading, southVertical, deg(c.alt), deg(180 + c.gam));
          expect(Math.abs(got - expected)).toBeLessThan(1e-9);
        },
      ),
    );
  });
});

describe("beam, limits and properties", () => {
  const shading = prepareShading(example);

  it("sun behind the surface → 0; sun straight on → 1 with or without devices; grazing or horizon sun → 0", () => {
    expect(shading.sunlitFraction(-0.2, 0.3, 0.5)).toBe(0);
    expect(shading.sunlitFraction(0, 0.6, 0.8)).toBe(0);
    expect(shading.sunlitFraction(Number.NaN, 0, 0)).toBe(0);
    // A surface tilted 60° faces a sun 30° high straight on: s = n. Shadows fall back onto the
    // devices' roots (zero offset), so nothing on the window is shaded.
    const tilted = { windowWidthM: 1.5, windowHeightM: 1.2, surfaceTiltRad: deg(60) };
    expect(prepareShading(tilted).sunlitFraction(1, 0, 0)).toBe(1);
    expect(prepareShading({ ...tilted, overhang: example.overhang, fins: example.fins }).sunlitFraction(1, 0, 0)).toBe(1);
    expect(sunlitFractionAt(prepareShading(tilted), surfaceOrientationDeg(180, 60), deg(30), deg(180))).toBe(1);
    // On a vertical façade the sun along the normal is ON the horizon (altitude 0): no beam (the beam
    // needs the sun above the horizon).
    expect(prepareShading({ ...tilted, surfaceTiltRad: deg(90) }).sunlitFraction(1, 0, 0)).toBe(0);
  });

  it("sun below the horizon obstruction → 0; above it → the unobstructed value", () => {
    const withHorizon = prepareShading({ ...example, horizonAngleRad: deg(15) });
    expect(sunlitFractionAt(withHorizon, southVertical, deg(10), deg(200))).toBe(0);
    expect(sunlitFractionAt(withHorizon, southVertical, deg(20), deg(200))).toBe(sunlitFractionAt(shading, southVertical, deg(20), deg(200)));
  });

  it("tilted surface: the horizon test uses the true sun altitude sin α = s_n cos β + s_v sin β", () => {
    // A surface tilted 120° (facing 30° below the horizon): a sun 5° below the horizon can be in
    // front of it (s_n > 0) but must give 0; 5° above gives a beam.
    const surf = surfaceOrientationDeg(180, 120);
    const bare = prepareShading({ windowWidthM: 1, windowHeightM: 1, surfaceTiltRad: deg(120) });
    expect(sunlitFractionAt(bare, surf, deg(-5), deg(180))).toBe(0);
    expect(sunlitFractionAt(bare, surf, deg(5), deg(180))).toBe(1);
  });

  interface Case {
    w: number;
    h: number;
    p: number;
    g: number;
    el: number | undefined;
    er: number | undefined;
    f: number;
    e: number;
    above: number | undefined;
    below: number | undefined;
    tilt: number;
    sn: number;
    su: number;
    sv: number;
  }
  const anyCase: fc.Arbitrary<Case> = fc.record({
    w: fc.double({ min: 0.2, max: 4, noNaN: true }),
    h: fc.double({ min: 0.2, max: 4, noNaN: true }),
    p: fc.double({ min: 0, max: 3, noNaN: true }),
    g: fc.double({ min: 0, max: 1, noNaN: true }),
    el: fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: undefined }),
    er: fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: undefined }),
    f: fc.double({ min: 0, max: 3, noNaN: true }),
    e: fc.double({ min: 0, max: 1, noNaN: true }),
    above: fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: undefined }),
    below: fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: undefined }),
    tilt: fc.double({ min: 0, max: 180, noNaN: true }),
    sn: fc.double({ min: -0.2, max: 1, noNaN: true }),
    su: fc.double({ min: -1, max: 1, noNaN: true }),
    sv: fc.double({ min: -1, max: 1, noNaN: true }),
  });
  const specOf = (c: Case, depthScale = 1): ShadingSpec => ({
    windowWidthM: c.w,
    windowHeightM: c.h,
    surfaceTiltRad: deg(c.tilt),
    overhang: { depthM: c.p * depthScale, gapAboveHeadM: c.g, extendLeftM: c.el, extendRightM: c.er },
    fins: { depthM: c.f, gapFromJambM: c.e, extendAboveM: c.above, extendBelowM: c.below },
  });
  const unit = (c: Case): [number, number, number] => {
    const n = Math.hypot(c.sn, c.su, c.sv) || 1;
    return [c.sn / n, c.su / n, c.sv / n];
  };

  it("fraction always in [0, 1] (property, finite and infinite devices, any tilt)", () => {
    fc.assert(
      fc.property(anyCase, (c) => {
        const f = prepareShading(specOf(c)).sunlitFraction(...unit(c));
        expect(f).toBeGreaterThanOrEqual(0);
        expect(f).toBeLessThanOrEqual(1);
      }),
    );
  });

  it("monotone: a deeper overhang never lets in more sun (property)", () => {
    fc.assert(
      fc.property(anyCase, fc.double({ min: 1, max: 3, noNaN: true }), (c, k) => {
        const s = unit(c);
        expect(prepareShading(specOf(c, k)).sunlitFraction(...s)).toBeLessThanOrEqual(prepareShading(specOf(c)).sunlitFraction(...s) + 1e-12);
      }),
    );
  });

  it("finite devices shade no more than infinite ones (property)", () => {
    fc.assert(
      fc.property(anyCase, (c) => {
        const s = unit(c);
        const inf = { ...c, el: undefined, er: undefined, above: undefined, below: undefined };
        expect(prepareShading(specOf(c)).sunlitFraction(...s)).toBeGreaterThanOrEqual(prepareShading(specOf(inf)).sunlitFraction(...s) - 1e-12);
      }),
    );
  });

  it("very long finite devices give the infinite result (exact finite path vs the closed-form product)", () => {
    // With s_n ≥ 0.05 the shadow offsets are ≤ depth/0.05 = 60 m, so 1e4 m extensions act as
    // infinite; 1e-9 allows for rounding of lengths ~1e5 m in the slab coordinates.
    fc.assert(
      fc.property(anyCase, (c0) => {
        const c = { ...c0, sn: Math.max(c0.sn, 0.05) };
        const s = unit(c);
        if (s[0] < 0.05) return;
        const inf = { ...c, el: undefined, er: undefined, above: undefined, below: undefined };
        const long = { ...c, el: 1e4, er: 1e4, above: 1e4, below: 1e4 };
        expect(Math.abs(prepareShading(specOf(long)).sunlitFraction(...s) - prepareShading(specOf(inf)).sunlitFraction(...s))).toBeLessThan(1e-9);
      }),
    );
  });

  it("mirror symmetry: sun at γ and −γ give the same fraction for symmetric devices (closed form)", () => {
    fc.assert(
      fc.property(anyCase, (c) => {
        const [sn, su, sv] = unit(c);
        // Sun within 1e-6 of grazing: the beam on the window is ∝ s_n, so the fraction no longer matters,
        // and subnormal components make the rounding of the clipped areas unbounded.
        if (sn < 1e-6) return;
        const sym = { ...c, er: c.el, below: c.above };
        const sh = prepareShading(specOf(sym));
        // mirror u → W − u swaps left/right; a window symmetric about its centre line gives the same area.
        // 1e-9: the clipped areas are sums of terms up to ~1e3 times the window area when the sun grazes
        // the surface (s_n → 0), so rounding reaches ~1e-12 and a little beyond.
        expect(Math.abs(sh.sunlitFraction(sn, su, sv) - sh.sunlitFraction(sn, -su, sv))).toBeLessThan(1e-9);
      }),
    );
  });
});

describe("beam, finite devices: exact parallelogram shadows (closed forms)", () => {
  // Sun of the worked example (alt 50°, az 210° on a south façade): shadow offset per metre of
  // depth k = (tan γ, −tan Ω) = (0.577350, −1.376119) in (u, v).
  const ku = Math.tan(deg(30));
  const kv = -Math.tan(deg(50)) / Math.cos(deg(30));

  it("overhang exactly as wide as the window, G = 0: area = W·P|k_v| − ½·P k_u·P|k_v| (parallelogram minus the triangle beyond the jamb)", () => {
    // Valid while P|k_v| ≤ H and P k_u ≤ W (0.825671 ≤ 1.2; 0.346410 ≤ 1.5).
    const P = 0.6;
    const shaded = W * P * -kv - 0.5 * (P * ku) * (P * -kv);
    const expected = 1 - shaded / (W * H);
    const sh = prepareShading({
      windowWidthM: W,
      windowHeightM: H,
      surfaceTiltRad: deg(90),
      overhang: { depthM: P, extendLeftM: 0, extendRightM: 0 },
    });
    expect(Math.abs(sunlitFractionAt(sh, southVertical, deg(50), deg(210)) - expected)).toBeLessThan(1e-12);
    expect(expected).toBeCloseTo(0.391391, 6); // numeric value of the closed form, for the reader
  });

  it("fins exactly as tall as the window, E = 0: area = F k_u·H − ½·F k_u·F|k_v| (triangle below the sill cut off)", () => {
    const F = 0.4;
    const shaded = F * ku * H - 0.5 * (F * ku) * (F * -kv);
    const sh = prepareShading({ windowWidthM: W, windowHeightM: H, surfaceTiltRad: deg(90), fins: { depthM: F, extendAboveM: 0, extendBelowM: 0 } });
    expect(Math.abs(sunlitFractionAt(sh, southVertical, deg(50), deg(210)) - (1 - shaded / (W * H)))).toBeLessThan(1e-12);
  });

  it("the shadow falls on the jamb away from the sun: extending the overhang on the sun's side matters, on the other side not", () => {
    // Sun in the south-west (az 210°) on a south façade: shadows move east (+u, right seen from
    // outside). An overhang extension past the LEFT (west) jamb reaches the window; one past the right
    // jamb does not.
    const base = { windowWidthM: W, windowHeightM: H, surfaceTiltRad: deg(90) };
    const f = (el: number, er: number) =>
      sunlitFractionAt(prepareShading({ ...base, overhang: { depthM: 0.6, extendLeftM: el, extendRightM: er } }), southVertical, deg(50), deg(210));
    expect(f(0, 0)).toBe(f(0, 1));
    expect(f(1, 0)).toBeLessThan(f(0, 0));
    // extension ≥ P k_u = 0.3464 already covers the whole band: same as infinite
    expect(Math.abs(f(0.35, 0) - (1 - (0.6 * -kv * W) / (W * H)))).toBeLessThan(1e-12);
  });

  it("union of overhang and fin shadows against brute-force ray casting (our own independent check)", () => {
    // Midpoint rule on a 600 × 600 grid of the window, each point tested by intersecting its ray to
    // the sun with each plate. Only cells cut by the shadow outline (length < 3 m inside the window)
    // can be misclassified: < 3 m / 0.002 m = 1500 cells of 5e-6 m² each, i.e. < 4e-3 of the
    // 1.8 m² window, hence the tolerance 4e-3 (observed: 1e-4).
    const spec: ShadingSpec = {
      windowWidthM: W,
      windowHeightM: H,
      surfaceTiltRad: deg(90),
      overhang: { depthM: 0.6, gapAboveHeadM: 0.1, extendLeftM: 0.1, extendRightM: 0.2 },
      fins: { depthM: 0.4, gapFromJambM: 0.05, extendAboveM: 0.05, extendBelowM: 0.1 },
    };
    const sn = Math.cos(deg(50)) * Math.cos(deg(30));
    const su = -Math.cos(deg(50)) * Math.sin(deg(30));
    const sv = Math.sin(deg(50));
    const N = 600;
    let lit = 0;
    for (let i = 0; i < N; i++) {
      const u = ((i + 0.5) / N) * W;
      for (let j = 0; j < N; j++) {
        const v = ((j + 0.5) / N) * H;
        let hit = false;
        // overhang plane v = H + G
        const t1 = (H + 0.1 - v) / sv;
        if (t1 * sn <= 0.6 && u + t1 * su >= -0.1 && u + t1 * su <= W + 0.2) hit = true;
        // left fin plane u = −E (sun has su < 0)
        const t2 = (-0.05 - u) / su;
        if (!hit && t2 > 0 && t2 * sn <= 0.4 && v + t2 * sv >= -0.1 && v + t2 * sv <= H + 0.05) hit = true;
        if (!hit) lit++;
      }
    }
    const exact = prepareShading(spec).sunlitFraction(sn, su, sv);
    expect(Math.abs(exact - lit / (N * N))).toBeLessThan(4e-3);
  });
});

describe("diffuse: view factors with overhangs and fins", () => {
  const crossedStringsFin = (w: number, e: number, f: number): number =>
    // window of width w (A near jamb, B far jamb), infinitely tall fin of depth f at e beyond A
    // (C root, D tip): F = [(crossed AD + BC) − (uncrossed AC + BD)]/(2·AB)
    (Math.hypot(e, f) + w + e - e - Math.hypot(w + e, f)) / (2 * w);

  it("no devices: all factors 1", () => {
    const d = prepareShading({ windowWidthM: 1, windowHeightM: 1, surfaceTiltRad: deg(90) }).diffuse;
    expect(d).toEqual({ skyIsotropic: 1, horizonBand: 1, ground: 1 });
  });

  it("point view factor below an infinite overhang = ½·D/√(D² + P²) (2-D closed form, exact)", () => {
    const sh = prepareShading({ windowWidthM: 1.5, windowHeightM: 1.2, surfaceTiltRad: deg(90), overhang: { depthM: 0.6, gapAboveHeadM: 0.3 } });
    for (const v of [0.05, 0.4, 0.9, 1.19]) {
      const d = 1.5 - v;
      expect(Math.abs(sh.pointViewFactors(0.7, v).sky - (0.5 * d) / Math.hypot(d, 0.6))).toBeLessThan(1e-12);
      expect(Math.abs(sh.pointViewFactors(0.7, v).ground - 0.5)).toBeLessThan(1e-12);
    }
  });

  // The window-averaged factors against the crossed-string rule, the perpendicular-rectangle closed form and
  // view-factor algebra: the cases of src/lib/reference-cases/shading-diffuse.ts (recomputed by
  // scripts/reference/shading-diffuse.ts), through the evaluator the validation report runs.
  it.each(shadingDiffuse.cases)("$label", (c) => expectCase(shadingDiffuseValues(c.input), c));

  // Perpendicular rectangles with a common edge of length X; i is X × Y, j is X × Z:
  // F_ij = (1/(πW)) [W atan(1/W) + H atan(1/H) − √(H² + W²) atan(1/√(H² + W²))
  //        + ¼ ln{ (1+W²)(1+H²)/(1+W²+H²) · [W²(1+W²+H²)/((1+W²)(W²+H²))]^(W²) · [H²(1+H²+W²)/((1+H²)(H²+W²))]^(H²) }]
  // with H = Z/X, W = Y/X (F. P. Incropera & D. P. DeWitt, Fundamentals of Heat and Mass Transfer, Table 13.2; from memory).
  const perpendicular = (x: number, y: number, z: number): number => {
    const Hh = z / x;
    const Ww = y / x;
    const s = Hh * Hh + Ww * Ww;
    const a = ((1 + Ww * Ww) * (1 + Hh * Hh)) / (1 + s);
    const b = Math.pow((Ww * Ww * (1 + s)) / ((1 + Ww * Ww) * s), Ww * Ww);
    const c = Math.pow((Hh * Hh * (1 + s)) / ((1 + Hh * Hh) * s), Hh * Hh);
    return (
      (Ww * Math.atan(1 / Ww) + Hh * Math.atan(1 / Hh) - Math.sqrt(s) * Math.atan(1 / Math.sqrt(s)) + 0.25 * Math.log(a * b * c)) / (Math.PI * Ww)
    );
  };

  it("closed form for perpendicular rectangles tends to the crossed-string value for long edges (checks the recalled formula)", () => {
    // X → ∞: both must give F = (Y + Z − √(Y² + Z²))/(2Y) (2-D, common edge).
    expect(Math.abs(perpendicular(1e5, 1.2, 0.6) - (1.2 + 0.6 - Math.hypot(1.2, 0.6)) / 2.4)).toBeLessThan(1e-5);
  });

  it("any tilt, infinite fins: sky + ground blocked = 2·F(window→fin) (summation rule; fins are fixed in the surface frame)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 180, noNaN: true }), (tiltDeg) => {
        const d = prepareShading({
          windowWidthM: 1.5,
          windowHeightM: 1.2,
          surfaceTiltRad: deg(tiltDeg),
          fins: { depthM: 0.4, gapFromJambM: 0.1 },
        }).diffuse;
        const cb = Math.cos(deg(tiltDeg));
        const blocked = ((1 + cb) / 2) * (1 - d.skyIsotropic) + ((1 - cb) / 2) * (1 - d.ground);
        expect(Math.abs(blocked - 2 * crossedStringsFin(1.5, 0.1, 0.4))).toBeLessThan(1e-5);
      }),
      { numRuns: 40 },
    );
  });

  // Brute force (our own independent check, not an outside source): rays from a window point,
  // classified by elementary ray–plate intersection, on a midpoint grid in (sin²θ, φ), which is
  // uniform in the cosine-weighted measure, so the view factor is the plain fraction of rays.
  const combined = (tiltDeg: number): ShadingSpec => ({
    windowWidthM: 1.5,
    windowHeightM: 1.2,
    surfaceTiltRad: deg(tiltDeg),
    overhang: { depthM: 0.6, gapAboveHeadM: 0.1, extendLeftM: 0.2, extendRightM: 0.3 },
    fins: { depthM: 0.5, gapFromJambM: 0.05, extendAboveM: 0.4, extendBelowM: 0.1 },
  });
  const hitsDevice = (u: number, v: number, du: number, dv: number, dn: number): boolean => {
    // plates of `combined`: overhang v = 1.3, n ≤ 0.6, −0.2 ≤ u ≤ 1.8; fins u = −0.05 and u = 1.55, n ≤ 0.5, −0.1 ≤ v ≤ 1.6
    if (dv > 0) {
      const t = (1.3 - v) / dv;
      if (t * dn <= 0.6 && u + t * du >= -0.2 && u + t * du <= 1.8) return true;
    }
    if (du !== 0) {
      const t = ((du < 0 ? -0.05 : 1.55) - u) / du;
      if (t * dn <= 0.5 && v + t * dv >= -0.1 && v + t * dv <= 1.6) return true;
    }
    return false;
  };

  it.each([90, 30, 120])("point view factors with overhang and fins overlapping, tilt %i°: against brute-force ray casting", (tiltDeg) => {
    // 400 × 800 rays; the indicator's discretisation error is ≤ 4e-4 here (≤ 1.6e-4 with
    // 800 × 1600 rays), hence 1e-3.
    const sh = prepareShading(combined(tiltDeg));
    const cb = Math.cos(deg(tiltDeg));
    const sb = Math.sin(deg(tiltDeg));
    for (const [u, v] of [
      [0.3, 0.9],
      [1.2, 0.2],
      [0.75, 1.1],
    ] as const) {
      let sky = 0;
      let ground = 0;
      const nt = 400;
      const np = 800;
      for (let i = 0; i < nt; i++) {
        const t = (i + 0.5) / nt;
        const st = Math.sqrt(t);
        const ct = Math.sqrt(1 - t);
        for (let j = 0; j < np; j++) {
          const ph = (2 * Math.PI * (j + 0.5)) / np;
          const du = st * Math.cos(ph);
          const dv = st * Math.sin(ph);
          if (hitsDevice(u, v, du, dv, ct)) continue;
          if (sb * dv + cb * ct > 0) sky++;
          else ground++;
        }
      }
      const exact = sh.pointViewFactors(u, v);
      expect(Math.abs(exact.sky - sky / (nt * np))).toBeLessThan(1e-3);
      expect(Math.abs(exact.ground - ground / (nt * np))).toBeLessThan(1e-3);
    }
  });

  it.each([90, 60, 120])("point horizon-band visibility, tilt %i°: against brute-force ray casting", (tiltDeg) => {
    // Horizontal directions ψ (from the normal's azimuth): d = (−sin ψ, −cos β cos ψ, sin β cos ψ)
    // in (u, v, n); 20000 midpoint nodes, each jump of the indicator errs ≤ π/20000/2 ≈ 8e-5, with
    // at most 6 jumps: tolerance 5e-4.
    const sh = prepareShading(combined(tiltDeg));
    const cb = Math.cos(deg(tiltDeg));
    const sb = Math.sin(deg(tiltDeg));
    for (const [u, v] of [
      [0.3, 0.9],
      [1.2, 0.05],
      [0.75, 1.15],
    ] as const) {
      const n = 20000;
      let visible = 0;
      for (let j = 0; j < n; j++) {
        const psi = -Math.PI / 2 + (Math.PI * (j + 0.5)) / n;
        if (!hitsDevice(u, v, -Math.sin(psi), -cb * Math.cos(psi), sb * Math.cos(psi))) visible += Math.cos(psi) * (Math.PI / n);
      }
      expect(Math.abs(sh.pointHorizonBand(u, v) - visible / 2)).toBeLessThan(5e-4);
    }
  });

  it.each([90, 60, 120, 150])(
    "window averages converge: 16 and 64 Gauss points agree within 1e-6, tilt %i° (our own convergence check)",
    (tiltDeg) => {
      const a = prepareShading(combined(tiltDeg)).diffuse;
      const b = prepareShading({ ...combined(tiltDeg), diffuseQuadraturePoints: 64 }).diffuse;
      expect(Math.abs(a.skyIsotropic - b.skyIsotropic)).toBeLessThan(1e-6);
      expect(Math.abs(a.ground - b.ground)).toBeLessThan(1e-6);
      expect(Math.abs(a.horizonBand - b.horizonBand)).toBeLessThan(1e-6);
    },
  );

  it("factors lie in [0, 1] and fall with overhang depth (property, finite and infinite devices)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 180, noNaN: true }),
        fc.double({ min: 0.05, max: 2, noNaN: true }),
        fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: undefined }),
        (tiltDeg, p, ext, f, above) => {
          const spec = (depth: number): ShadingSpec => ({
            windowWidthM: 1.2,
            windowHeightM: 1.5,
            surfaceTiltRad: deg(tiltDeg),
            overhang: { depthM: depth, gapAboveHeadM: 0.1, extendLeftM: ext, extendRightM: ext },
            fins: { depthM: f, gapFromJambM: 0.05, extendAboveM: above, extendBelowM: above },
          });
          const a = prepareShading(spec(p)).diffuse;
          const b = prepareShading(spec(2 * p)).diffuse;
          for (const x of [a.skyIsotropic, a.ground, a.horizonBand]) expect(x >= 0 && x <= 1).toBe(true);
          expect(b.skyIsotropic).toBeLessThanOrEqual(a.skyIsotropic + 1e-9);
          expect(b.ground).toBeLessThanOrEqual(a.ground + 1e-9);
          expect(b.horizonBand).toBeLessThanOrEqual(a.horizonBand + 1e-9);
        },
      ),
      { numRuns: 40 },
    );
  });
});

describe("bad input", () => {
  it("throws RangeError naming the quantity", () => {
    const ok = { windowWidthM: 1, windowHeightM: 1, surfaceTiltRad: deg(90) };
    expect(() => prepareShading({ ...ok, windowWidthM: 0 })).toThrow(/window width/);
    expect(() => prepareShading({ ...ok, windowHeightM: Number.NaN })).toThrow(/window height/);
    expect(() => prepareShading({ ...ok, surfaceTiltRad: 4 })).toThrow(/surface tilt/);
    expect(() => prepareShading({ ...ok, overhang: { depthM: -0.1 } })).toThrow(/overhang depth/);
    expect(() => prepareShading({ ...ok, overhang: { depthM: 0.5, gapAboveHeadM: -1 } })).toThrow(/overhang gap/);
    expect(() => prepareShading({ ...ok, overhang: { depthM: 0.5, extendLeftM: -1 } })).toThrow(/left jamb/);
    expect(() => prepareShading({ ...ok, fins: { depthM: Number.POSITIVE_INFINITY } })).toThrow(/fin depth/);
    expect(() => prepareShading({ ...ok, fins: { depthM: 0.3, extendBelowM: Number.NaN } })).toThrow(/below the sill/);
    expect(() => prepareShading({ ...ok, horizonAngleRad: deg(95) })).toThrow(/horizon angle/);
    expect(() => prepareShading({ ...ok, diffuseQuadraturePoints: 1 })).toThrow(/quadrature points/);
    expect(() => profileAngleRad(deg(30), deg(95))).toThrow(/profile angle/);
    expect(() => prepareShading(ok).pointViewFactors(2, 0.5)).toThrow(/window point/);
    expect(() => prepareShading(ok).pointHorizonBand(0.5, -1)).toThrow(/window point/);
    expect(() => sunlitFractionAt(prepareShading(ok), surfaceOrientationDeg(180, 30), deg(30), deg(180))).toThrow(/surface tilt/);
  });
});
