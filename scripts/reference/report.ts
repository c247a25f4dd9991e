// Shared by the reference scripts: prints case, quantity, value in the case module, recomputed value, difference.
import type { ReferenceCase } from "@/lib/reference-cases/types";

/** Recomputed value of each quantity of a case (only the quantities the script computes). */
export type Recomputed = Readonly<Record<string, number>>;

export interface ReportRow {
  readonly caseId: string;
  readonly quantity: string;
  readonly printed: number;
  readonly recomputed: number;
  readonly difference: number;
  readonly tolerance: number;
  readonly within: boolean;
}

/** Compares every computed-kind case with what `compute` gives for it. */
export function compareCases<I>(cases: readonly ReferenceCase<I>[], compute: (c: ReferenceCase<I>) => Recomputed): ReportRow[] {
  const rows: ReportRow[] = [];
  for (const c of cases) {
    if (c.source.kind !== "computed") continue;
    const got = compute(c);
    for (const e of c.expected) {
      const r = got[e.quantity];
      if (r === undefined) throw new Error(`${c.id}: the script does not compute ${e.quantity}`);
      const difference = r - e.value;
      rows.push({
        caseId: c.id,
        quantity: e.quantity,
        printed: e.value,
        recomputed: r,
        difference,
        tolerance: e.tolerance.abs,
        within: Math.abs(difference) <= e.tolerance.abs * (1 + 1e-9),
      });
    }
  }
  return rows;
}

/** Prints the rows as a table; returns false if any row is outside its tolerance. */
export function printReport(title: string, rows: readonly ReportRow[]): boolean {
  console.log(`\n${title}`);
  console.log(["case", "quantity", "case module", "recomputed", "difference", "tolerance", ""].join("\t"));
  for (const r of rows) {
    console.log(
      [r.caseId, r.quantity, String(r.printed), r.recomputed.toPrecision(12), r.difference.toExponential(2), r.tolerance.toExponential(1), r.within ? "ok" : "OUTSIDE"].join("\t"),
    );
  }
  const bad = rows.filter((r) => !r.within).length;
  console.log(bad ? `${bad} of ${rows.length} values outside tolerance` : `all ${rows.length} values within tolerance`);
  return bad === 0;
}

/** True when the module at `metaUrl` is the script being run (`npx tsx scripts/reference/<domain>.ts`). */
export function isMain(metaUrl: string): boolean {
  const arg = process.argv[1];
  if (!arg) return false;
  const norm = (p: string) => p.replace(/\.ts$/, "");
  return norm(new URL(metaUrl).pathname) === norm(arg.startsWith("/") ? arg : `${process.cwd()}/${arg}`);
}
