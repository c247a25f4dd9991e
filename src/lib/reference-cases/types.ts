/**
 * Shapes shared by the reference-case modules: the check values the tests run and the validation report shows.
 *
 * A case module (`src/lib/reference-cases/<domain>.ts`) is pure data: inputs, expected values, tolerances and the
 * origin of every expected value. It imports nothing outside this folder (these types, the builders of build.ts,
 * the model panes of panes.ts), so tests, scripts and pages can all read it; read.ts finds a case and a value.
 */

/** Where an expected value comes from. Every case names one; a reader of the repository can open or look it up. */
export type CaseSource =
  /** Printed in a published source: name, edition, and table, equation, clause or page. */
  | { readonly kind: "published"; readonly citation: string; readonly fromMemory?: boolean }
  /**
   * Computed independently from a published formula by a committed script that does not use the product's code.
   * `formula` names the formula and its published source; `script` is the repository path of the script.
   */
  | { readonly kind: "computed"; readonly formula: string; readonly script: string; readonly fromMemory?: boolean }
  /** Checked against a general-purpose reference library from npm, named with its version. */
  | { readonly kind: "library"; readonly library: string; readonly note?: string }
  /** Exact closed-form value, e.g. R = ((n − 1)/(n + 1))² at normal incidence. */
  | { readonly kind: "closed-form"; readonly formula: string; readonly citation?: string }
  /** Common practice (no source), or a value given from memory, said so plainly. */
  | { readonly kind: "common-practice"; readonly note: string };

/** How close the engine must come, and why that close. */
export interface Tolerance {
  /** Largest allowed |computed − expected|, in the unit of the quantity. */
  readonly abs: number;
  /** Why this tolerance, e.g. "half a unit in the 6th printed decimal". */
  readonly reason: string;
}

/** One expected value of one quantity. */
export interface ExpectedValue {
  /** Quantity name as the engine reports it, e.g. "Rs", "tauHemispherical", "uValue". */
  readonly quantity: string;
  /** Unit, "-" for fractions. */
  readonly unit: string;
  readonly value: number;
  readonly tolerance: Tolerance;
}

/**
 * One reference case: a named input with its expected values. `Input` is the domain's own input shape
 * (degrees and millimetres as printed in the source; tests convert at the edge like the app does).
 */
export interface ReferenceCase<Input = unknown> {
  /** Stable id, unique within its domain, e.g. "fresnel/air-glass-1.52/30deg". */
  readonly id: string;
  /** One line a reader understands without the code. */
  readonly label: string;
  readonly input: Input;
  readonly expected: readonly ExpectedValue[];
  readonly source: CaseSource;
}

/** A domain's cases with a title, as the validation report groups them. */
export interface ReferenceDomain<Input = unknown> {
  /** e.g. "fresnel", "u-value". */
  readonly domain: string;
  readonly title: string;
  readonly cases: readonly ReferenceCase<Input>[];
}
