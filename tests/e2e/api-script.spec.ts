// A script written from /docs/api alone: the owner makes a calculate key on the owners' page's route, then the
// TypeScript `fetch` snippets of two operations, copied from the reference page as a reader would copy them, run in
// a separate Node process with the key in PANERAY_KEY: the glazing calculation of the documented make-up, and the
// workbook of issued revision A of the demo project (the reader puts in their project's id, which the project
// list gives). The script's answers must be the engine's values and a workbook that opens.
import { expect, test } from "@playwright/test";
import ExcelJS from "exceljs";
import { execFile } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { EXAMPLE_IDS } from "@/lib/api-docs/examples";
import { DEMO_PROJECTS } from "@/lib/demo-scenario";
import { call, signInDemo } from "./api-actors";

const run = promisify(execFile);

test("a Node script built from the reference page's snippets computes a make-up and downloads a revision's workbook with a key", async ({ page }) => {
  test.setTimeout(120_000);
  const owner = await signInDemo("owner");
  const projects = (await call(owner, "GET", "/api/v1/projects")).body as {
    organizations: { organizationId: string; role: string; projects: { id: string; name: string }[] }[];
  };
  const org = projects.organizations.find((o) => o.role === "owner")!;
  const projectId = org.projects.find((p) => p.name === DEMO_PROJECTS[0].name)!.id;
  const made = await call(owner, "POST", `/api/v1/orgs/${org.organizationId}/api-keys`, { name: "Snippet script", scope: "calculate" });
  expect(made.status).toBe(201);
  const { key, apiKey } = made.body as { key: string; apiKey: { id: string } };

  await page.goto("/docs/api");
  const snippet = (id: string) => page.locator(`[data-operation="${id}"] [data-snippet="fetch"]`).textContent();
  const glazing = (await snippet("postCalcGlazing"))!;
  const workbook = (await snippet("getProjectsByIdWorkbook"))!.replace(EXAMPLE_IDS.projectId, projectId);
  expect(workbook).toContain(projectId);

  const dir = mkdtempSync(join(tmpdir(), "paneray-script-"));
  try {
    // Each snippet in a block of its own (both declare `res`), then what the script does with the answers.
    const script = [
      `import { writeFileSync } from "node:fs";`,
      `const out = {};`,
      `{`,
      glazing,
      `out.glazing = data;`,
      `}`,
      `{`,
      workbook,
      `writeFileSync(${JSON.stringify(join(dir, "schedule.xlsx"))}, bytes);`,
      `out.workbookBytes = bytes.length;`,
      `}`,
      `console.log(JSON.stringify(out));`,
    ].join("\n");
    writeFileSync(join(dir, "script.mjs"), script);
    const { stdout } = await run("node", [join(dir, "script.mjs")], {
      env: { PATH: process.env.PATH, PANERAY_KEY: key },
      timeout: 60_000,
    });
    const out = JSON.parse(stdout.trim().split("\n").at(-1)!) as {
      glazing: { hemispherical: unknown; gValue: unknown; angles: unknown[] };
      workbookBytes: number;
    };
    // The same request through the test's own client must give the same values: the snippet sent the documented body.
    const direct = await call({ actor: "owner", cookie: null, bearer: key }, "POST", "/api/v1/calc/glazing", JSON.parse(bodyOf(glazing)));
    expect(direct.status).toBe(200);
    expect(out.glazing).toEqual(direct.body);
    expect(out.glazing.angles.length).toBeGreaterThan(0);

    expect(out.workbookBytes).toBeGreaterThan(10_000);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(readFileSync(join(dir, "schedule.xlsx")) as unknown as ArrayBuffer);
    expect(wb.worksheets.length).toBeGreaterThan(1);
    expect(wb.worksheets.map((w) => w.name).join(" ")).toMatch(/schedule/i);
  } finally {
    rmSync(dir, { recursive: true, force: true });
    await call(owner, "DELETE", `/api/v1/orgs/${org.organizationId}/api-keys/${apiKey.id}`);
  }
});

/** The JSON body a fetch snippet sends (`body: JSON.stringify({...})`). */
function bodyOf(snippet: string): string {
  const start = snippet.indexOf("JSON.stringify(") + "JSON.stringify(".length;
  let depth = 0;
  for (let i = start; i < snippet.length; i++) {
    if (snippet[i] === "{" || snippet[i] === "[") depth++;
    if (snippet[i] === "}" || snippet[i] === "]") depth--;
    if (depth === 0) return snippet.slice(start, i + 1);
  }
  throw new Error("no body in the snippet");
}
