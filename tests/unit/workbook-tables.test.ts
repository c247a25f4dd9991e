// The workbook's pure tables: formula neutralising, sheet names spreadsheets accept, CSV quoting, live sums.
// Check values: the formula starters = + - @ tab CR (common practice, no source); the sheet-name rules
// (31 characters, none of [ ] : * ? / \, unique without regard to case) as spreadsheet programs enforce them
// (common practice, no source); CSV quoting per RFC 4180.
import { describe, expect, it } from "vitest";
import { csvField, hourlySummary, SheetNames, safeText, compassPoint, columnLetter } from "@/lib/calc/workbook-tables";
import type { ScheduleRow } from "@/lib/contracts/schedule";

describe("safeText", () => {
  it("neutralises text a spreadsheet would evaluate, and only that", () => {
    for (const s of ["=1+1", "+A1", "-2+3", "@SUM(A1)", "\tx", "\rx", '=HYPERLINK("http://x","y")']) expect(safeText(s)).toBe(`'${s}`);
    for (const s of ["North", "1 = 1", "a-b", "Ø 6 mm", "'quoted"]) expect(safeText(s)).toBe(s);
    expect(safeText(null)).toBe("");
    expect(safeText(safeText("=x"))).toBe("'=x");
  });
  it("applies to CSV fields, which are quoted where RFC 4180 needs it", () => {
    expect(csvField("=cmd|' /C calc'!A0")).toBe("'=cmd|' /C calc'!A0");
    expect(csvField('a "b", c')).toBe('"a ""b"", c"');
    expect(csvField("-0.5 note")).toBe("'-0.5 note");
    expect(csvField(-0.5)).toBe("-0.5");
    expect(csvField(null)).toBe("");
    expect(csvField({ formula: "SUM(A1:A2)", result: 3 })).toBe("3");
  });
});

describe("SheetNames", () => {
  it("gives names of at most 31 characters without [ ] : * ? / \\, unique without regard to case", () => {
    const n = new SheetNames();
    const names = [
      n.name("Quay front: south-east [A] / B?"),
      n.name("quay front- south-east -A- - B-"),
      n.name("x".repeat(40)),
      n.name("X".repeat(40)),
      n.name("'quoted'"),
      n.name(""),
    ];
    for (const s of names) {
      expect([...s].length).toBeLessThanOrEqual(31);
      expect(s).not.toMatch(/[[\]:*?/\\]/);
      expect(s).not.toMatch(/^'|'$/);
    }
    expect(new Set(names.map((s) => s.toLowerCase())).size).toBe(names.length);
    expect(names[3]).toBe(`${"X".repeat(27)} (2)`);
    expect(names[4]).toBe("quoted");
    expect(names[5]).toBe("Sheet");
  });
});

describe("hourlySummary", () => {
  const row = (t: number, g: number, w: number | null): ScheduleRow => ({
    time: "2026-06-21T12:30:00+01:00",
    sunAltitudeDeg: 60,
    sunAzimuthDeg: 180,
    incidenceDeg: 30,
    beamTransmittance: 0.5,
    sunlitFraction: 1,
    beamIncidentWm2: 400,
    diffuseIncidentWm2: 100,
    transmittedWm2: t,
    solarGainWm2: g,
    transmittedW: w,
    solarGainW: w,
  });
  it("sums to kWh with the step and takes the peak, as formulas over the data rows with their values", () => {
    const s = hourlySummary([row(100, 150, 1000), row(300, 350, 3000)], 30, 6, 7);
    expect(s.energy[9]).toEqual({ formula: "SUM(J6:J7)*30/60/1000", result: 0.2 });
    expect(s.peak[9]).toEqual({ formula: "MAX(J6:J7)", result: 300 });
    expect(s.energy[11]).toEqual({ formula: "SUM(L6:L7)*30/60/1000", result: 2 });
    expect(s.energy[2]).toBeNull();
  });
  it("leaves the W columns without formulas when there is no glazed area", () => {
    const s = hourlySummary([row(100, 150, null)], 60, 6, 6);
    expect(s.energy[11]).toBeNull();
    expect(s.peak[12]).toBeNull();
  });
});

it("names compass points and spreadsheet columns", () => {
  expect([0, 44, 135, 225, 359].map(compassPoint)).toEqual(["N", "NE", "SE", "SW", "N"]);
  expect([0, 12, 25, 26, 701].map(columnLetter)).toEqual(["A", "M", "Z", "AA", "ZZ"]);
});
