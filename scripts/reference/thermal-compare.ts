/**
 * Shared by the thermal reference scripts (gas properties, EN 673 U value, EN 410 g value): compares the
 * values a script recomputes with the values printed in a case module and prints the comparison table.
 *
 * Not a formula: no physics here.
 */
import type { ReferenceCase } from '@/lib/reference-cases/types';

/** One expected value of one case, next to the value the script recomputed for it. */
export interface ComparisonRow {
  readonly caseId: string;
  readonly quantity: string;
  readonly printed: number;
  readonly recomputed: number;
  readonly difference: number;
  readonly tolerance: number;
  readonly withinTolerance: boolean;
}

/**
 * Rows for every expected value of every case that `recompute` covers (it returns undefined for a case
 * whose values the script does not compute, e.g. values printed in a standard's table).
 * A quantity the script should cover but does not return throws, so nothing is skipped silently.
 */
export function compareCases<I>(
  cases: readonly ReferenceCase<I>[],
  recompute: (c: ReferenceCase<I>) => Readonly<Record<string, number>> | undefined,
): ComparisonRow[] {
  const rows: ComparisonRow[] = [];
  for (const c of cases) {
    const values = recompute(c);
    if (values === undefined) continue;
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
        withinTolerance: Math.abs(difference) <= e.tolerance.abs,
      });
    }
  }
  return rows;
}

/** Prints the rows as a fixed-width table; returns the number of rows outside their tolerance. */
export function printComparison(title: string, rows: readonly ComparisonRow[]): number {
  const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toPrecision(10));
  const table = rows.map((r) => [r.caseId, r.quantity, fmt(r.printed), fmt(r.recomputed), r.difference.toExponential(2), r.tolerance.toExponential(1), r.withinTolerance ? 'ok' : 'OUTSIDE']);
  const head = ['case', 'quantity', 'printed', 'recomputed', 'difference', 'tolerance', ''];
  const widths = head.map((h, i) => Math.max(h.length, ...table.map((t) => t[i]!.length)));
  const line = (cells: readonly string[]) => cells.map((cell, i) => cell.padEnd(widths[i]!)).join('  ').trimEnd();
  console.log(title);
  console.log(line(head));
  console.log(line(widths.map((w) => '-'.repeat(w))));
  for (const t of table) console.log(line(t));
  const outside = rows.filter((r) => !r.withinTolerance).length;
  console.log(`${rows.length} value(s), ${outside} outside tolerance\n`);
  return outside;
}

/** True when the module at `moduleUrl` is the script being run (`npx tsx scripts/reference/….ts`). */
export function isMainModule(moduleUrl: string): boolean {
  const entry = process.argv[1];
  if (!entry) return false;
  const stripped = (s: string) => s.replace(/^file:\/\//, '').replace(/\.ts$/, '');
  return stripped(decodeURIComponent(moduleUrl)) === stripped(entry);
}
