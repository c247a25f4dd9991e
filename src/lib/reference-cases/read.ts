/**
 * Reading the reference-case modules: a case by its id, an expected value by its quantity. Both throw when the
 * case or the quantity is missing, so a reader that names a case that has gone fails loudly.
 */
import type { ExpectedValue, ReferenceCase } from "./types";

/** The case with the given id. */
export function caseById<I>(cases: readonly ReferenceCase<I>[], id: string): ReferenceCase<I> {
  const c = cases.find((x) => x.id === id);
  if (!c) throw new Error(`no reference case ${id}`);
  return c;
}

/** The expected value of `quantity` in a case. */
export function expectedOf(c: ReferenceCase, quantity: string): ExpectedValue {
  const e = c.expected.find((x) => x.quantity === quantity);
  if (!e) throw new Error(`case ${c.id} has no expected ${quantity}`);
  return e;
}
