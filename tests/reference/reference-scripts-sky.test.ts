// Every computed-kind case of the sun-and-sky case modules is reproduced by its committed script
// (scripts/reference/<domain>.ts, an independent implementation of the published formula) within the
// case's own tolerance, so a value in a case module cannot drift from its formula.
import { describe, expect, it } from "vitest";
import { incidenceReport } from "@scripts/reference/incidence";
import { irradianceReport } from "@scripts/reference/irradiance";
import { shadingReport } from "@scripts/reference/shading";
import type { ReportRow } from "@scripts/reference/report";

const reports: [string, () => ReportRow[]][] = [
  ["incidence", incidenceReport],
  ["irradiance", irradianceReport],
  ["shading", shadingReport],
];

describe.each(reports)("%s: the script reproduces every computed case", (_domain, report) => {
  const rows = report();
  it("covers at least one value", () => expect(rows.length).toBeGreaterThan(0));
  it.each(rows.map((r) => [`${r.caseId} ${r.quantity}`, r] as const))("%s", (_name, r) => {
    expect(Math.abs(r.recomputed - r.printed), `recomputed ${r.recomputed}`).toBeLessThanOrEqual(r.tolerance * (1 + 1e-9));
  });
});
