// Reads the reference-case modules in the sun-and-sky tests: finds an expected value by quantity and
// compares with it at the case's own tolerance.
import { expect } from "vitest";
import type { ExpectedValue, ReferenceCase } from "@/lib/reference-cases/types";

/** The expected value of `quantity` in a case (throws if the case does not list it). */
export function expectedOf(c: ReferenceCase, quantity: string): ExpectedValue {
  const e = c.expected.find((x) => x.quantity === quantity);
  if (!e) throw new Error(`case ${c.id} has no expected ${quantity}`);
  return e;
}

/**
 * |actual − expected| ≤ tolerance, with a relative 1e-9 allowance for the float64 representation of the
 * bound: the rule for values printed to a number of decimals (half a unit in the last printed digit).
 */
export function expectPrinted(actual: number, e: ExpectedValue): void {
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value}, got ${actual}`).toBeLessThanOrEqual(e.tolerance.abs * (1 + 1e-9));
}

/** |actual − expected| < tolerance (strict), for tolerances that are an error budget rather than a printed digit. */
export function expectBelow(actual: number, e: ExpectedValue): void {
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value}, got ${actual}`).toBeLessThan(e.tolerance.abs);
}

/** The cases of a domain whose expected values come from a committed script. */
export const computedCases = <I>(cases: readonly ReferenceCase<I>[]): ReferenceCase<I>[] => cases.filter((c) => c.source.kind === "computed");

/** |actual − expected| ≤ tolerance exactly, for a bound stated as "half a unit" of a recorded value. */
export function expectAtMost(actual: number, e: ExpectedValue): void {
  expect(Math.abs(actual - e.value), `${e.quantity}: expected ${e.value}, got ${actual}`).toBeLessThanOrEqual(e.tolerance.abs);
}
