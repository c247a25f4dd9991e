/**
 * Shapes of the validation layer: what an evaluator computes for a reference case, and a domain as the
 * registry lists it (its cases and the evaluator that turns a case's input into the engine's values).
 */
import type { ReferenceCase } from "@/lib/reference-cases/types";

/**
 * The engine's values for one case, by quantity name. A quantity that applies to several parts of the input
 * (every gap of a unit) gives one value per part; the report shows the part farthest from the expected value.
 */
export type ComputedValues = Readonly<Record<string, number | readonly number[]>>;

/** What an evaluator returns: numbers, and texts for cases that list expected texts (local times of rows). */
export interface Evaluation {
  readonly values: ComputedValues;
  readonly texts?: Readonly<Record<string, string>>;
}

/** A domain of the validation report: its cases, in order, and the one evaluator the tests use as well. */
export interface ValidationDomain<C extends ReferenceCase = ReferenceCase> {
  /** Anchor and key, e.g. "fresnel". */
  readonly domain: string;
  readonly title: string;
  /** A short name for the chart and the summary table, e.g. "Fresnel". */
  readonly label: string;
  readonly cases: readonly C[];
  readonly evaluate: (c: C) => Evaluation;
  /** Expected texts of a case (quantity → text), compared for equality. */
  readonly expectedTexts?: (c: C) => Readonly<Record<string, string>>;
}

/** A domain with its case type erased, as the registry holds it. */
export function defineDomain<C extends ReferenceCase>(d: ValidationDomain<C>): ValidationDomain {
  // evaluate and expectedTexts are only ever called with the domain's own cases
  return d as unknown as ValidationDomain;
}
