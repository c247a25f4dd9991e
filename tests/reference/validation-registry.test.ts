// The validation registry (src/lib/validation/domains.ts) against the case modules and the report: every
// case a case module exports is in the registry, ids are unique, the report has a row for every expected
// value of every case of every domain, and every value passes within its case's tolerance.
import { readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { VALIDATION_DOMAINS } from "@/lib/validation/domains";
import { buildValidationReport, csvField, reportCsv, sourceText, type ValidationReport } from "@/lib/validation/report";
import Papa from "papaparse";

const CASE_DIR = join(import.meta.dirname, "../../src/lib/reference-cases");
/** Files of the case folder that hold shapes and helpers, not cases. */
const NOT_CASES = new Set(["types.ts", "read.ts", "build.ts", "panes.ts"]);

const isCase = (x: unknown): x is ReferenceCase =>
  typeof x === "object" && x !== null && "id" in x && "label" in x && "input" in x && "expected" in x && "source" in x;

/** Every case a module exports: single cases, arrays of cases and domains' case lists. */
function exportedCases(mod: Record<string, unknown>): ReferenceCase[] {
  const found: ReferenceCase[] = [];
  for (const value of Object.values(mod)) {
    if (isCase(value)) found.push(value);
    else if (Array.isArray(value)) found.push(...value.filter(isCase));
    else if (typeof value === "object" && value !== null && "cases" in value && Array.isArray(value.cases)) found.push(...value.cases.filter(isCase));
  }
  return found;
}

const registered = VALIDATION_DOMAINS.flatMap((d) => d.cases);
const report: ValidationReport = buildValidationReport(VALIDATION_DOMAINS, {
  versions: { paneray: { version: null, commit: null }, libraries: [] },
  now: () => new Date(),
  clock: () => performance.now(),
});

describe("registry", () => {
  const files = readdirSync(CASE_DIR).filter((f) => f.endsWith(".ts") && !NOT_CASES.has(f));

  it("lists the domains of every case module", () => expect(VALIDATION_DOMAINS.length).toBe(files.length));

  it.each(files)("%s: every case it exports is in the registry", async (file) => {
    const cases = exportedCases((await import(/* @vite-ignore */ join(CASE_DIR, file))) as Record<string, unknown>);
    expect(cases.length, `${file} exports no case`).toBeGreaterThan(0);
    const ids = new Set(registered.map((c) => c.id));
    const missing = cases.filter((c) => !ids.has(c.id) || !registered.includes(c)).map((c) => c.id);
    expect(missing, `cases of ${file} not in the registry`).toEqual([]);
  });

  it("case ids are unique across all domains", () => {
    const seen = new Map<string, number>();
    for (const c of registered) seen.set(c.id, (seen.get(c.id) ?? 0) + 1);
    expect([...seen].filter(([, n]) => n > 1).map(([id]) => id)).toEqual([]);
  });

  it("domain keys are unique and every domain has cases", () => {
    expect(new Set(VALIDATION_DOMAINS.map((d) => d.domain)).size).toBe(VALIDATION_DOMAINS.length);
    for (const d of VALIDATION_DOMAINS) expect(d.cases.length, d.domain).toBeGreaterThan(0);
  });
});

describe("report", () => {
  it("has every domain, in the registry's order", () => {
    expect(report.domains.map((d) => d.domain)).toEqual(VALIDATION_DOMAINS.map((d) => d.domain));
  });

  it("has a row for every expected value of every case, and nothing else", () => {
    for (const d of VALIDATION_DOMAINS) {
      for (const c of d.cases) {
        const rows = report.rows.filter((r) => r.domain === d.domain && r.caseId === c.id);
        const texts = Object.keys(d.expectedTexts?.(c) ?? {});
        expect(
          rows.map((r) => r.quantity),
          c.id,
        ).toEqual([...c.expected.map((e) => e.quantity), ...texts]);
      }
    }
    const expectedCount = VALIDATION_DOMAINS.reduce(
      (n, d) => n + d.cases.reduce((m, c) => m + c.expected.length + Object.keys(d.expectedTexts?.(c) ?? {}).length, 0),
      0,
    );
    expect(report.rows).toHaveLength(expectedCount);
    expect(report.totals.values).toBe(expectedCount);
    expect(report.totals.cases).toBe(registered.length);
  });

  it("every value passes within its case's tolerance", () => {
    const failing = report.rows
      .filter((r) => !r.pass)
      .map((r) => `${r.caseId} ${r.quantity}: expected ${r.expected}, computed ${r.computed} (${r.note ?? ""})`);
    expect(failing).toEqual([]);
    expect(report.totals.failing).toBe(0);
    for (const d of report.domains) expect(d.passing, d.domain).toBe(d.values);
  });

  it("names the source of every row in words", () => {
    for (const r of report.rows) expect(r.source.length, r.caseId).toBeGreaterThan(10);
    const computed = report.rows.find((r) => r.caseId === "fresnel/air-glass-1.5/30deg")!;
    expect(computed.source).toMatch(/^Computed independently from Fresnel equations .* by `scripts\/reference\/fresnel\.ts`$/);
    expect(computed.source).toMatch(/from memory/);
    expect(sourceText({ kind: "common-practice", note: "rows at interval midpoints" })).toBe(
      "Common practice, no source: rows at interval midpoints",
    );
    expect(sourceText({ kind: "published", citation: "EN 673:2011 clause 6", fromMemory: true })).toBe(
      "Published: EN 673:2011 clause 6 (from memory)",
    );
  });

  it("computes deviations, relative deviations and tolerance ratios from the expected and computed values", () => {
    for (const r of report.rows) {
      if (r.kind !== "number" || typeof r.computed !== "number" || typeof r.expected !== "number") continue;
      expect(r.deviation).toBe(r.computed - r.expected);
      expect(r.absDeviation).toBe(Math.abs(r.computed - r.expected));
      expect(r.relativeDeviation).toBe(r.expected === 0 ? null : (r.computed - r.expected) / Math.abs(r.expected));
      if (r.tolerance > 0) expect(r.toleranceRatio).toBe(r.absDeviation! / r.tolerance);
    }
  });

  it("summarises each domain: largest relative deviation and |deviation|/tolerance", () => {
    for (const d of report.domains) {
      const rows = report.rows.filter((r) => r.domain === d.domain);
      const rel = Math.max(...rows.map((r) => Math.abs(r.relativeDeviation ?? 0)));
      const ratio = Math.max(...rows.map((r) => (r.kind === "number" ? (r.toleranceRatio ?? 0) : 0)));
      expect(d.largestRelativeDeviation?.value ?? 0, d.domain).toBe(rel);
      expect(d.largestToleranceRatio?.value ?? 0, d.domain).toBe(ratio);
      expect(ratio, d.domain).toBeLessThanOrEqual(1 + 1e-9);
    }
  });

  it("a failing value fails the report (an evaluator off by twice the tolerance, and one that throws)", () => {
    const [fresnel] = VALIDATION_DOMAINS;
    const c = fresnel!.cases[0]!;
    const off = buildValidationReport(
      [
        {
          ...fresnel!,
          cases: [c],
          evaluate: (x) => ({ values: Object.fromEntries(x.expected.map((e) => [e.quantity, e.value + 2 * e.tolerance.abs + 1e-12])) }),
        },
      ],
      { versions: report.versions, now: () => new Date(0), clock: () => 0 },
    );
    expect(off.totals.failing).toBe(c.expected.length);
    const threw = buildValidationReport(
      [
        {
          ...fresnel!,
          cases: [c],
          evaluate: () => {
            throw new RangeError("angle of incidence out of range");
          },
        },
      ],
      { versions: report.versions, now: () => new Date(0), clock: () => 0 },
    );
    expect(threw.rows.every((r) => !r.pass && r.computed === null && /angle of incidence/.test(r.note ?? ""))).toBe(true);
  });
});

describe("CSV form", () => {
  it("quotes fields as RFC 4180 says", () => {
    expect(csvField("plain")).toBe("plain");
    expect(csvField('a "b", c')).toBe('"a ""b"", c"');
    expect(csvField("two\nlines")).toBe('"two\nlines"');
    expect(csvField(null)).toBe("");
    expect(csvField(-0.5)).toBe("-0.5");
  });

  it("parses back with papaparse: a header and one row per expected value, numbers in full precision", () => {
    const text = reportCsv(report);
    expect(text.endsWith("\r\n")).toBe(true);
    const parsed = Papa.parse<Record<string, string>>(text.trimEnd(), { header: true, newline: "\r\n" });
    expect(parsed.errors).toEqual([]);
    expect(parsed.data).toHaveLength(report.rows.length);
    parsed.data.forEach((row, i) => {
      const r = report.rows[i]!;
      expect(row.case_id).toBe(r.caseId);
      expect(row.label).toBe(r.label);
      expect(row.pass).toBe("pass");
      if (r.kind === "number") expect(Number(row.computed)).toBe(r.computed);
    });
  });
});
