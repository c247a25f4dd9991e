// Shared by the reference tests: reading a reference case (by id, by quantity), comparing with its expected
// values at the case's own tolerance, and the model panes of the optics cases.
import { expect } from "vitest";
import { asDegrees, toRadians, type Radians } from "@/lib/physics/units";
import type { PaneSpec } from "@/lib/physics/optics";
import type { ExpectedValue, ReferenceCase } from "@/lib/reference-cases/types";
import type { ComputedValues, Evaluation } from "@/lib/validation/types";

export { caseById, expectedOf } from "@/lib/reference-cases/read";

export const deg = (d: number): Radians => toRadians(asDegrees(d));

/**
 * |actual − expected| ≤ the expected value's tolerance, the rule for values printed to a number of decimals
 * (half a unit in the last printed digit). The relative slack of 1e-9 on the tolerance only absorbs the binary
 * representation of tolerances such as 5e-7.
 */
export function expectValue(actual: number | undefined, e: ExpectedValue, where = ""): void {
  const what = `${where}${where ? " " : ""}${e.quantity}`;
  expect(actual, `${what}: no value computed`).toBeTypeOf("number");
  expect(Math.abs(actual! - e.value), `${what}: expected ${e.value} ± ${e.tolerance.abs}, got ${actual}`).toBeLessThanOrEqual(
    e.tolerance.abs * (1 + 1e-9),
  );
}

/** |actual − expected| ≤ tolerance exactly, for a bound stated as "half a unit" of a recorded value. */
export function expectAtMost(actual: number, e: ExpectedValue): void {
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value}, got ${actual}`).toBeLessThanOrEqual(e.tolerance.abs);
}

/** |actual − expected| < tolerance (strict), for tolerances that are an error budget rather than a printed digit. */
export function expectBelow(actual: number, e: ExpectedValue): void {
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value}, got ${actual}`).toBeLessThan(e.tolerance.abs);
}

/** Checks every expected value of a case against the computed quantities, by quantity name. */
export function expectCase(actual: Readonly<Record<string, number>>, c: ReferenceCase): void {
  expect(c.expected.length, `${c.id}: a case without expected values checks nothing`).toBeGreaterThan(0);
  for (const e of c.expected) expectValue(actual[e.quantity], e, c.id);
}

/**
 * Checks every expected value of a case against an evaluator's values (src/lib/validation/engines); a quantity
 * with one value per part (every gap of a unit) must hold in every part. Expected texts are compared for equality.
 */
export function expectEvaluation(evaluation: Evaluation, c: ReferenceCase, expectedTexts: Readonly<Record<string, string>> = {}): void {
  expect(c.expected.length, `${c.id}: a case without expected values checks nothing`).toBeGreaterThan(0);
  const values: ComputedValues = evaluation.values;
  for (const e of c.expected) {
    const v = values[e.quantity];
    if (typeof v === "number" || v === undefined) expectValue(v, e, c.id);
    else {
      expect(v.length, `${c.id} ${e.quantity}: no part computed`).toBeGreaterThan(0);
      v.forEach((x, i) => expectValue(x, e, `${c.id} part ${i + 1}`));
    }
  }
  for (const [quantity, text] of Object.entries(expectedTexts)) expect(evaluation.texts?.[quantity], `${c.id} ${quantity}`).toBe(text);
}

/** The model pane of the optics reference cases: 6 mm, n = 1.52, α = 0.02 /mm (one broadband α: a test fixture, not a real glass). */
export const pane6mm = { thicknessM: 0.006, refractiveIndex: 1.52, absorptionPerM: 20 };
/** Low-iron model pane: 4 mm, n = 1.52, α = 0.002 /mm. */
export const lowIron4mm = { thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 2 };

/** A hypothetical coated 6 mm pane given by measured values (not a product): Rf ≠ Rb. */
export const coated6mmSpec = {
  kind: "measured",
  thicknessM: 0.006,
  solar: { T: 0.45, Rf: 0.3, Rb: 0.2 },
  visible: { T: 0.7, Rf: 0.1, Rb: 0.06 },
} as const satisfies PaneSpec;
/** The 6 mm model pane as a glazing layer. */
export const clear6mmSpec: PaneSpec = { kind: "physical", ...pane6mm };

/** A pane as the reference cases give it (millimetres, as printed), in the engine's SI units. */
export const paneFromMm = (p: { readonly thicknessMm: number; readonly refractiveIndex: number; readonly absorptionPerMm: number }) => ({
  thicknessM: p.thicknessMm / 1000,
  refractiveIndex: p.refractiveIndex,
  absorptionPerM: p.absorptionPerMm * 1000,
});
