// The validation report of the server process (src/lib/server/validation-report.ts): computed once in the
// calculation pool and kept; the versions read from package.json, git and the reference libraries' packages.
import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { appRoot, reportVersions, validationReport } from "@/lib/server/validation-report";
import { REFERENCE_LIBRARIES } from "@/lib/validation/domains";

const root = join(import.meta.dirname, "../..");
const versionOf = (file: string) => (JSON.parse(readFileSync(file, "utf8")) as { version: string }).version;

describe("validation report on the server", () => {
  it("finds the app's folder and reads the versions", () => {
    expect(appRoot()).toBe(root);
    const v = reportVersions();
    expect(v.paneray.version).toBe(versionOf(join(root, "package.json")));
    expect(v.paneray.commit === null || /^[0-9a-f]{40}$/.test(v.paneray.commit)).toBe(true);
    expect(v.libraries.map((l) => l.name)).toEqual([...REFERENCE_LIBRARIES]);
    for (const l of v.libraries) expect(l.version, l.name).toBe(versionOf(join(root, "node_modules", l.name, "package.json")));
  });

  it("computes the report once and keeps it; every value passes", async () => {
    const first = await validationReport();
    const again = await validationReport();
    expect(again).toBe(first);
    expect(first.versions).toEqual(reportVersions());
    expect(first.totals.failing).toBe(0);
    expect(first.totals.values).toBe(first.rows.length);
    expect(first.durationMs).toBeGreaterThan(0);
    expect(Date.parse(first.computedAt)).toBeLessThanOrEqual(Date.now());
  }, 60_000);
});
