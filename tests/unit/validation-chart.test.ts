// The validation page's chart geometry and number formats (src/lib/validation/chart.ts, format.ts).
import { describe, expect, it } from "vitest";
import { axisPosition, chartRows, chartTicks, MAX_DECADE, MIN_DECADE } from "@/lib/validation/chart";
import { codeSegments, formatSmall, formatUtc, formatValue } from "@/lib/validation/format";
import { buildValidationReport, type ReportRow } from "@/lib/validation/report";
import type { ValidationDomain } from "@/lib/validation/types";

describe("axis", () => {
  it("is logarithmic from 1e-6 to 10 with the pass line at 6/7 of the way", () => {
    expect(axisPosition(10 ** MIN_DECADE)).toBe(0);
    expect(axisPosition(10 ** MAX_DECADE)).toBe(1);
    expect(axisPosition(1)).toBeCloseTo(6 / 7, 12);
    expect(axisPosition(0.1)).toBeCloseTo(5 / 7, 12);
  });
  it("puts exact matches and tiny ratios at the left edge, huge ones at the right", () => {
    expect(axisPosition(0)).toBe(0);
    expect(axisPosition(1e-12)).toBe(0);
    expect(axisPosition(1e6)).toBe(1);
    expect(axisPosition(Number.NaN)).toBe(0);
  });
  it("has a tick per decade", () => {
    expect(chartTicks().map((t) => t.label)).toEqual(["≤ 1e-6", "1e-5", "1e-4", "1e-3", "1e-2", "1e-1", "1", "10"]);
  });
});

describe("rows of the chart", () => {
  const domain: ValidationDomain = {
    domain: "d",
    title: "A domain",
    label: "D",
    cases: [
      {
        id: "d/one",
        label: "one",
        input: null,
        expected: [
          { quantity: "a", unit: "-", value: 1, tolerance: { abs: 0.1, reason: "r" } },
          { quantity: "b", unit: "-", value: 2, tolerance: { abs: 0, reason: "exact" } },
          { quantity: "c", unit: "-", value: 3, tolerance: { abs: 0.1, reason: "r" } },
        ],
        source: { kind: "closed-form", formula: "x" },
      },
    ],
    evaluate: () => ({ values: { a: 1.01, b: 2, c: 4 } }),
  };
  const report = buildValidationReport([domain], {
    versions: { paneray: { version: "0", commit: null }, libraries: [] },
    now: () => new Date(0),
    clock: () => 0,
  });
  it("has one point per value: passing inside, failing to the right of the pass line", () => {
    const [row] = chartRows(report);
    expect(row!.points.map((p) => p.pass)).toEqual([true, true, false]);
    expect(row!.points[0]!.x).toBeCloseTo(axisPosition(0.1), 6); // |0.01| / 0.1
    expect(row!.points[1]!.x).toBe(0); // exact at tolerance 0
    expect(row!.points[2]!.x).toBe(1); // 1 / 0.1 = 10
    expect(row!.exact).toBe(1);
    expect(report.totals).toEqual({ domains: 1, cases: 1, values: 3, passing: 2, failing: 1 });
    expect(report.domains[0]!.largestToleranceRatio).toEqual({ value: expect.closeTo(10, 9), caseId: "d/one", quantity: "c" });
    expect((report.rows as ReportRow[])[2]!.relativeDeviation).toBeCloseTo(1 / 3, 12);
  });
});

describe("formats", () => {
  it("prints values, small numbers, instants and code spans", () => {
    expect(formatValue(0.04)).toBe("0.04");
    expect(formatValue(5.797832114862)).toBe("5.797832115");
    expect(formatValue(101325)).toBe("101325");
    expect(formatValue(null)).toBe("—");
    expect(formatValue("2026-03-29T02:30:00+01:00")).toBe("2026-03-29T02:30:00+01:00");
    expect(formatSmall(0)).toBe("0");
    expect(formatSmall(-2.37e-7)).toBe("-2.37e-7");
    expect(formatUtc("2026-12-03T09:59:53.995Z")).toBe("2026-12-03 09:59:53 UTC");
    expect(codeSegments("by `scripts/reference/fresnel.ts`")).toEqual(["by ", "scripts/reference/fresnel.ts", ""]);
  });
});
