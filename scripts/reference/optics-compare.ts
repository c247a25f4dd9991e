/**
 * Shared by the optics reference scripts: compare a domain's computed-kind cases with an independent
 * recomputation, and print the comparison as a table.
 */
import { pathToFileURL } from "node:url";
import type { ReferenceCase, ReferenceDomain } from "@/lib/reference-cases/types";

/** Quantities recomputed by a script for one case input, by the quantity names used in the case module. */
export type Recomputed = Readonly<Record<string, number>>;

export interface ComparisonRow {
  readonly caseId: string;
  readonly quantity: string;
  /** The value printed in the case module. */
  readonly printed: number;
  /** The script's value, or NaN if the script does not compute this quantity. */
  readonly recomputed: number;
  readonly difference: number;
  readonly tolerance: number;
  readonly within: boolean;
}

/** The cases of a domain whose expected values come from the given script. */
export function casesOfScript<I>(domain: ReferenceDomain<I>, script: string): readonly ReferenceCase<I>[] {
  return domain.cases.filter((c) => c.source.kind === "computed" && c.source.script === script);
}

/** One row per expected value of every case computed by `script`. */
export function compareDomain<I>(
  domain: ReferenceDomain<I>,
  script: string,
  recompute: (input: I) => Recomputed,
): ComparisonRow[] {
  const rows: ComparisonRow[] = [];
  for (const c of casesOfScript(domain, script)) {
    const values = recompute(c.input);
    for (const e of c.expected) {
      const recomputed = values[e.quantity] ?? Number.NaN;
      const difference = recomputed - e.value;
      rows.push({
        caseId: c.id,
        quantity: e.quantity,
        printed: e.value,
        recomputed,
        difference,
        tolerance: e.tolerance.abs,
        // the same rule as the tests: a relative slack of 1e-9 on the tolerance for its binary representation
        within: Math.abs(difference) <= e.tolerance.abs * (1 + 1e-9),
      });
    }
  }
  return rows;
}

/** Prints case, quantity, printed value, recomputed value, difference (and whether it is within tolerance). */
export function printComparison(title: string, rows: readonly ComparisonRow[]): void {
  console.log(`\n${title}`);
  const head = ["case", "quantity", "printed", "recomputed", "difference", "tolerance", "ok"];
  const body = rows.map((r) => [
    r.caseId,
    r.quantity,
    String(r.printed),
    r.recomputed.toPrecision(10),
    r.difference.toExponential(2),
    r.tolerance.toExponential(1),
    r.within ? "yes" : "NO",
  ]);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i]!.length)));
  const line = (cells: string[]) => cells.map((c, i) => c.padEnd(widths[i]!)).join("  ");
  console.log(line(head));
  console.log(widths.map((w) => "-".repeat(w)).join("  "));
  for (const b of body) console.log(line(b));
  const bad = rows.filter((r) => !r.within).length;
  console.log(bad === 0 ? `all ${rows.length} values reproduced within tolerance` : `${bad} of ${rows.length} values NOT reproduced`);
}

/** True when the module whose import.meta.url is given was started directly (npx tsx <file>). */
export function isMain(metaUrl: string): boolean {
  const entry = process.argv[1];
  return entry !== undefined && pathToFileURL(entry).href === metaUrl;
}
