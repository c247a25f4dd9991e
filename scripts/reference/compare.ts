/**
 * Shared by every reference script: compares the expected values of a case module with the values the script
 * recomputes, prints the comparison as a table, and sets a non-zero exit status when the script is run directly
 * and a value lies outside its tolerance.
 *
 * Not a formula: no physics here.
 */
import { pathToFileURL } from "node:url";
import type { ReferenceCase, ReferenceDomain } from "@/lib/reference-cases/types";

/** Quantities recomputed by a script for one case, by the quantity names used in the case module. */
export type Recomputed = Readonly<Record<string, number>>;

/**
 * How |recomputed − printed| is held against a case's tolerance: at most tolerance · (1 + relativeSlack).
 * The slack only absorbs the binary representation of tolerances such as 5e-7; each domain keeps the rule its
 * tests use.
 */
export interface ToleranceRule {
  readonly relativeSlack: number;
}

/** Tolerances of printed digits, with a relative slack of 1e-9 for their binary representation. */
export const PRINTED_DIGITS: ToleranceRule = { relativeSlack: 1e-9 };
/** The tolerance itself, without slack. */
export const EXACT_BOUND: ToleranceRule = { relativeSlack: 0 };

/** One expected value of one case, next to the value the script recomputed for it. */
export interface ComparisonRow {
  readonly caseId: string;
  readonly quantity: string;
  /** The value printed in the case module. */
  readonly printed: number;
  readonly recomputed: number;
  readonly difference: number;
  readonly tolerance: number;
  readonly within: boolean;
}

/** True when |difference| is within `tolerance` by `rule`. */
export function isWithin(difference: number, tolerance: number, rule: ToleranceRule): boolean {
  return Math.abs(difference) <= tolerance * (1 + rule.relativeSlack);
}

/** Which cases of a domain a script answers for, and how its values are held against their tolerances. */
export interface ScriptScope {
  readonly rule: ToleranceRule;
  /** Whether the script also evaluates the domain's closed-form cases (not only the computed cases naming it). */
  readonly closedForm: boolean;
}

/** The cases a script answers for: every computed case of the domain naming the script, and the closed-form cases if `closedForm`. */
export function casesOfScript<I>(domain: ReferenceDomain<I>, script: string, closedForm: boolean): readonly ReferenceCase<I>[] {
  return domain.cases.filter((c) => (c.source.kind === "computed" && c.source.script === script) || (closedForm && c.source.kind === "closed-form"));
}

/**
 * One row per expected value of every given case. A quantity the script does not return throws, so nothing
 * is skipped silently.
 */
export function compareCases<I>(
  cases: readonly ReferenceCase<I>[],
  recompute: (c: ReferenceCase<I>) => Recomputed,
  rule: ToleranceRule,
): ComparisonRow[] {
  const rows: ComparisonRow[] = [];
  for (const c of cases) {
    const values = recompute(c);
    for (const e of c.expected) {
      const recomputed = values[e.quantity];
      if (recomputed === undefined) throw new Error(`${c.id}: the script computes no '${e.quantity}'`);
      const difference = recomputed - e.value;
      rows.push({
        caseId: c.id,
        quantity: e.quantity,
        printed: e.value,
        recomputed,
        difference,
        tolerance: e.tolerance.abs,
        within: isWithin(difference, e.tolerance.abs, rule),
      });
    }
  }
  return rows;
}

/** The comparison of every case of `domain` that `script` answers for. */
export function compareDomain<I>(
  domain: ReferenceDomain<I>,
  script: string,
  recompute: (c: ReferenceCase<I>) => Recomputed,
  scope: ScriptScope,
): ComparisonRow[] {
  return compareCases(casesOfScript(domain, script, scope.closedForm), recompute, scope.rule);
}

/** Prints the rows as a fixed-width table; returns the number of rows outside their tolerance. */
export function printComparison(title: string, rows: readonly ComparisonRow[]): number {
  const head = ["case", "quantity", "printed", "recomputed", "difference", "tolerance", ""];
  const body = rows.map((r) => [
    r.caseId,
    r.quantity,
    String(r.printed),
    Number.isInteger(r.recomputed) ? String(r.recomputed) : r.recomputed.toPrecision(12),
    r.difference.toExponential(2),
    r.tolerance.toExponential(1),
    r.within ? "ok" : "OUTSIDE",
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i]!.length)));
  const line = (cells: readonly string[]) =>
    cells
      .map((cell, i) => cell.padEnd(widths[i]!))
      .join("  ")
      .trimEnd();
  console.log(`\n${title}`);
  console.log(line(head));
  console.log(line(widths.map((w) => "-".repeat(w))));
  for (const b of body) console.log(line(b));
  const outside = rows.filter((r) => !r.within).length;
  console.log(`${rows.length} value(s), ${outside} outside tolerance`);
  return outside;
}

/** True when the module whose import.meta.url is given was started directly (`npx tsx scripts/reference/<x>.ts`). */
export function isMain(metaUrl: string): boolean {
  const entry = process.argv[1];
  if (!entry) return false;
  const stripped = (href: string) => href.replace(/\.ts$/, "");
  return stripped(pathToFileURL(entry).href) === stripped(metaUrl);
}

/**
 * When the calling script is run directly: prints each table and sets exit status 1 if any value of any table
 * lies outside its tolerance. A comparison that throws (a quantity not computed) ends the run with an error.
 */
export function runWhenMain(metaUrl: string, tables: readonly (readonly [title: string, rows: () => readonly ComparisonRow[]])[]): void {
  if (!isMain(metaUrl)) return;
  let outside = 0;
  for (const [title, rows] of tables) outside += printComparison(title, rows());
  if (outside > 0) process.exitCode = 1;
}
