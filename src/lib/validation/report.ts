/**
 * The validation report: every expected value of every reference case in the registry, with the value the
 * running engine computes now, its deviation and the tolerance, grouped by domain; a summary per domain and in
 * total; CSV and JSON forms. Pure: the caller passes the versions and the clock.
 */
import type { CaseSource, ExpectedValue, ReferenceCase } from "@/lib/reference-cases/types";
import type { Evaluation, ValidationDomain } from "./types";

/** One expected value of one case, as computed now. */
export interface ReportRow {
  readonly domain: string;
  readonly caseId: string;
  readonly label: string;
  readonly quantity: string;
  readonly unit: string;
  /** "number": a value with a tolerance; "text": an expected text (a row's local time), compared for equality. */
  readonly kind: "number" | "text";
  readonly expected: number | string;
  /** null when the engine gave no value (or threw). */
  readonly computed: number | string | null;
  /** computed − expected. */
  readonly deviation: number | null;
  readonly absDeviation: number | null;
  /** (computed − expected)/|expected|, where the expected value is not zero. */
  readonly relativeDeviation: number | null;
  /** Largest allowed |deviation| (0 for texts: equal or not). */
  readonly tolerance: number;
  readonly toleranceReason: string;
  /** |deviation| / tolerance; 0 for an exact match at tolerance 0, null for a mismatch at tolerance 0. */
  readonly toleranceRatio: number | null;
  readonly pass: boolean;
  /** The source in words. */
  readonly source: string;
  readonly sourceKind: CaseSource["kind"];
  /** Anything a reader needs besides the numbers (the worst of several gaps; the engine's error). */
  readonly note: string | null;
}

/** A maximum over a domain's values, with where it occurs. */
export interface Extreme {
  readonly value: number;
  readonly caseId: string;
  readonly quantity: string;
}

export interface DomainSummary {
  readonly domain: string;
  readonly title: string;
  readonly label: string;
  readonly cases: number;
  readonly values: number;
  readonly passing: number;
  readonly failing: number;
  /** Largest |relative deviation| over the values with a non-zero expected value. */
  readonly largestRelativeDeviation: Extreme | null;
  /** Largest |deviation|/tolerance over the values with a tolerance. */
  readonly largestToleranceRatio: Extreme | null;
}

export interface LibraryVersion {
  readonly name: string;
  /** null when the installed package could not be read. */
  readonly version: string | null;
}

export interface ReportVersions {
  readonly paneray: { readonly version: string | null; readonly commit: string | null };
  readonly libraries: readonly LibraryVersion[];
}

export interface ValidationReport {
  readonly versions: ReportVersions;
  /** When the computation started (ISO 8601, UTC). */
  readonly computedAt: string;
  /** How long it took [ms]. */
  readonly durationMs: number;
  readonly totals: { readonly domains: number; readonly cases: number; readonly values: number; readonly passing: number; readonly failing: number };
  readonly domains: readonly DomainSummary[];
  readonly rows: readonly ReportRow[];
}

/** The pass rule of the reference tests: |deviation| ≤ tolerance, with a relative slack of 1e-9 on the tolerance
 *  for the binary representation of tolerances such as 5e-7. */
export const withinTolerance = (absDeviation: number, tolerance: number): boolean => absDeviation <= tolerance * (1 + 1e-9);

const fromMemory = (text: string, flagged: boolean | undefined): string => (flagged && !/from memory/i.test(text) ? `${text} (from memory)` : text);

/** Where an expected value comes from, in words. */
export function sourceText(s: CaseSource): string {
  switch (s.kind) {
    case "published":
      return fromMemory(`Published: ${s.citation}`, s.fromMemory);
    case "computed":
      return fromMemory(`Computed independently from ${s.formula} by \`${s.script}\``, s.fromMemory);
    case "library":
      return `Reference library ${s.library}${s.note ? `: ${s.note}` : ""}`;
    case "closed-form":
      return `Closed form: ${s.formula}${s.citation ? ` (${s.citation})` : ""}`;
    case "common-practice":
      return `Common practice, no source: ${s.note}`;
  }
}

const finite = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x);

function numberRow(
  base: Omit<
    ReportRow,
    | "kind"
    | "expected"
    | "computed"
    | "deviation"
    | "absDeviation"
    | "relativeDeviation"
    | "tolerance"
    | "toleranceReason"
    | "toleranceRatio"
    | "pass"
    | "note"
  >,
  e: ExpectedValue,
  computed: number | readonly number[] | undefined,
  error: string | null,
): ReportRow {
  const parts = computed === undefined ? [] : typeof computed === "number" ? [computed] : computed;
  // of several parts (every gap of a unit), the one farthest from the expected value decides
  let value: number | null = null;
  for (const v of parts) if (value === null || !finite(v) || Math.abs(v - e.value) > Math.abs(value - e.value)) value = v;
  const ok = value !== null && finite(value);
  const deviation = ok ? value! - e.value : null;
  const abs = deviation === null ? null : Math.abs(deviation);
  const note = error
    ? `the engine threw: ${error}`
    : parts.length === 0
      ? "the engine gave no value for this quantity"
      : !ok
        ? "the engine's value is not a finite number"
        : parts.length > 1
          ? `the farthest of ${parts.length} values (one per gap)`
          : null;
  return {
    ...base,
    kind: "number",
    expected: e.value,
    computed: ok ? value : null,
    deviation,
    absDeviation: abs,
    relativeDeviation: deviation === null || e.value === 0 ? null : deviation / Math.abs(e.value),
    tolerance: e.tolerance.abs,
    toleranceReason: e.tolerance.reason,
    toleranceRatio: abs === null ? null : e.tolerance.abs > 0 ? abs / e.tolerance.abs : abs === 0 ? 0 : null,
    pass: abs !== null && withinTolerance(abs, e.tolerance.abs),
    note,
  };
}

/** The rows of one case: its expected values, then its expected texts. */
export function caseRows(d: ValidationDomain, c: ReferenceCase): ReportRow[] {
  let evaluation: Evaluation | null = null;
  let error: string | null = null;
  try {
    evaluation = d.evaluate(c);
  } catch (err) {
    error = err instanceof Error ? err.message : String(err);
  }
  const base = { domain: d.domain, caseId: c.id, label: c.label, source: sourceText(c.source), sourceKind: c.source.kind };
  const rows = c.expected.map((e) => numberRow({ ...base, quantity: e.quantity, unit: e.unit }, e, evaluation?.values[e.quantity], error));
  for (const [quantity, expected] of Object.entries(d.expectedTexts?.(c) ?? {})) {
    const computed = evaluation?.texts?.[quantity] ?? null;
    rows.push({
      ...base,
      quantity,
      unit: "text",
      kind: "text",
      expected,
      computed,
      deviation: null,
      absDeviation: null,
      relativeDeviation: null,
      tolerance: 0,
      toleranceReason: "the same text",
      toleranceRatio: null,
      pass: computed === expected,
      note: error ? `the engine threw: ${error}` : computed === null ? "the engine gave no text for this row" : null,
    });
  }
  return rows;
}

function largest(rows: readonly ReportRow[], pick: (r: ReportRow) => number | null): Extreme | null {
  let best: Extreme | null = null;
  for (const r of rows) {
    const v = pick(r);
    if (v === null || !Number.isFinite(v)) continue;
    if (best === null || Math.abs(v) > best.value) best = { value: Math.abs(v), caseId: r.caseId, quantity: r.quantity };
  }
  return best;
}

/** The summary of one domain's rows. */
export function summarize(d: Pick<ValidationDomain, "domain" | "title" | "label" | "cases">, rows: readonly ReportRow[]): DomainSummary {
  const passing = rows.filter((r) => r.pass).length;
  return {
    domain: d.domain,
    title: d.title,
    label: d.label,
    cases: d.cases.length,
    values: rows.length,
    passing,
    failing: rows.length - passing,
    largestRelativeDeviation: largest(rows, (r) => r.relativeDeviation),
    largestToleranceRatio: largest(rows, (r) => (r.kind === "number" ? r.toleranceRatio : null)),
  };
}

export interface BuildOptions {
  readonly versions: ReportVersions;
  /** The current time (for `computedAt`). */
  readonly now: () => Date;
  /** A monotonic clock in milliseconds (for `durationMs`), e.g. performance.now. */
  readonly clock: () => number;
}

/** Runs every case of every domain through its evaluator. */
export function buildValidationReport(domains: readonly ValidationDomain[], options: BuildOptions): ValidationReport {
  const computedAt = options.now().toISOString();
  const t0 = options.clock();
  const rows: ReportRow[] = [];
  const summaries: DomainSummary[] = [];
  for (const d of domains) {
    const domainRows = d.cases.flatMap((c) => caseRows(d, c));
    rows.push(...domainRows);
    summaries.push(summarize(d, domainRows));
  }
  const durationMs = options.clock() - t0;
  const passing = rows.filter((r) => r.pass).length;
  return {
    versions: options.versions,
    computedAt,
    durationMs,
    totals: {
      domains: summaries.length,
      cases: summaries.reduce((n, s) => n + s.cases, 0),
      values: rows.length,
      passing,
      failing: rows.length - passing,
    },
    domains: summaries,
    rows,
  };
}

/** The columns of the CSV form, in order. */
export const CSV_COLUMNS = [
  "domain",
  "case_id",
  "label",
  "quantity",
  "unit",
  "expected",
  "computed",
  "deviation",
  "abs_deviation",
  "relative_deviation",
  "tolerance",
  "tolerance_reason",
  "deviation_over_tolerance",
  "pass",
  "source",
  "note",
] as const;

/** One CSV field (RFC 4180): quoted when it holds a comma, a quote or a line break, quotes doubled. */
export function csvField(value: string | number | boolean | null): string {
  const text = value === null ? "" : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** The report as CSV: a header line, then one line per expected value; CRLF line ends (RFC 4180). */
export function reportCsv(report: ValidationReport): string {
  const lines = [CSV_COLUMNS.join(",")];
  for (const r of report.rows) {
    lines.push(
      [
        r.domain,
        r.caseId,
        r.label,
        r.quantity,
        r.unit,
        r.expected,
        r.computed,
        r.deviation,
        r.absDeviation,
        r.relativeDeviation,
        r.tolerance,
        r.toleranceReason,
        r.toleranceRatio,
        r.pass ? "pass" : "fail",
        r.source,
        r.note,
      ]
        .map(csvField)
        .join(","),
    );
  }
  return `${lines.join("\r\n")}\r\n`;
}

/** The report as JSON text (the report object itself; numbers in full float64 precision). */
export const reportJson = (report: ValidationReport): string => `${JSON.stringify(report, null, 2)}\n`;
