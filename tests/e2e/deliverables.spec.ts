// The deliverables end to end in the browser: a consultant brings in a weather year on the project page, the
// results say they use it, the schedule is issued, the revision page's workbook download opens with exceljs
// (a general-purpose reader) and carries the API's numbers and the weather file on its cover, and the outbox
// sends it to a typed address: the message in the SMTP fake's store has the same workbook as the download.
import { expect, test } from "@playwright/test";
import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { simpleParser } from "mailparser";
import type { ResultsResponse, RevisionResponse } from "@/lib/contracts/results";
import { DEMO_PASSWORD, demoUser, signIn, uniqueEmail } from "./helpers";
import { call, signInDemo, throwawayProject } from "./api-actors";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow } from "./workspace-rows";
import { weatherCsv } from "@scripts/weather-year";

const sha = (b: Buffer | string) => createHash("sha256").update(b).digest("hex");
const csv = weatherCsv({ year: 2025, latitudeDeg: 41.15, longitudeDeg: -8.61, times: "utc" });
let projectId = "";
const makeups: string[] = [];

/** The cover's text and the schedule sheet's g of the façade "South bay", read with exceljs. */
async function open(bytes: Buffer): Promise<{ cover: string; g: number }> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as never);
  const cover: string[] = [];
  wb.worksheets[0]!.eachRow((r) => cover.push((r.values as unknown[]).filter((v) => v !== null && v !== undefined).join(" ")));
  let gColumn = -1;
  let g = Number.NaN;
  wb.worksheets[1]!.eachRow((r) => {
    const cells = Array.from(r.values as unknown[], (v) => v);
    const at = cells.findIndex((v) => typeof v === "string" && v.startsWith("Total solar energy transmittance g"));
    if (at >= 0) gColumn = at;
    else if (gColumn >= 0 && cells.includes("South bay") && Number.isNaN(g)) g = Number(cells[gColumn]);
  });
  return { cover: cover.join("\n"), g };
}

test.beforeAll(async () => {
  const { consultant, orgId, id } = await throwawayProject({
    name: "Deliverables test block",
    siteName: "Invented pier",
    latitudeDeg: 41.15,
    longitudeDeg: -8.61,
    timeZone: "Europe/Lisbon",
    facades: [{ name: "South bay", azimuthDeg: 180, glazedAreaM2: 36 }],
  });
  projectId = id;
  const facades = ((await call(consultant, "GET", `/api/v1/projects/${projectId}`)).body as { facades: { id: string }[] }).facades;
  const clear = await insertMakeupRow(orgId, "Deliverables clear", doubleUnit(clearPane(6), clearPane(4)));
  makeups.push(clear.id);
  await insertOptionRow(projectId, facades[0]!.id, clear, "South clear", "approved");
});

test.afterAll(async () => {
  const consultant = await signInDemo("consultant");
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  await deleteMakeupRows(makeups);
  await closeWorkspaceRows();
});

test("weather upload → results → issued workbook → e-mail → outbox", async ({ page }) => {
  test.setTimeout(90_000);
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);

  // Upload: the weather year on the project page.
  await page.goto(`/projects/${projectId}`);
  const upload = page.getByTestId("weather-panel").getByTestId("weather-upload");
  await expect(upload.getByLabel("Choose a file…")).toBeEnabled();
  await upload.getByLabel("Choose a file…").setInputFiles({ name: "pier-2025.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  await expect(upload.getByTestId("upload-saved")).toContainText("8760 hours from 2025-01-01 to 2025-12-31");

  // Results: computed from the file.
  await page.goto(`/projects/${projectId}/results`);
  await expect(page.getByTestId("inputs-irradiance")).toContainText("weather file “pier-2025.csv”");
  const results = (await (await page.request.get(`/api/v1/projects/${projectId}/results`)).json()) as ResultsResponse;
  expect(results.irradiance).toMatchObject({ source: "weather series", sha256: sha(csv) });

  // Issue revision A from the results page.
  await page.getByTestId("issue-open").click();
  await page.getByLabel("Note (optional)").fill("For the design team");
  await page.getByTestId("issue-submit").click();
  await page.getByRole("link", { name: "Open revision A" }).click();
  await expect(page.getByTestId("revision-title")).toHaveText("Revision A");
  const rev = (await (await page.request.get(`/api/v1/projects/${projectId}/revisions/A`)).json()) as RevisionResponse;
  await expect(page.getByTestId("revision-irradiance")).toContainText("hourly weather file pier-2025.csv, 2025-01-01 to 2025-12-31");

  // The hourly table of the façade, one of the single tables, as CSV: a header naming every column and 8,760 hours.
  const hourlyCsv = await page.request.get((await page.getByTestId("hourly-csv").first().getAttribute("href"))!);
  expect(hourlyCsv.status()).toBe(200);
  const lines = (await hourlyCsv.text()).trim().split(/\r?\n/);
  expect(lines.some((l) => l.includes("Transmitted solar irradiance (W/m²)"))).toBe(true);
  expect(lines.filter((l) => /^"?2025-/.test(l)).length).toBe(8760);

  // Export: the revision page's download, opened with exceljs.
  const [download] = await Promise.all([page.waitForEvent("download"), page.getByTestId("revision-workbook").click()]);
  expect(download.suggestedFilename()).toBe("Deliverables-test-block_rev-A.xlsx");
  const bytes = readFileSync((await download.path())!);
  const book = await open(bytes);
  expect(book.cover).toContain(`weather file pier-2025.csv: 8760 hours from 2025-01-01 to 2025-12-31 (SHA-256 ${sha(csv)})`);
  expect(book.g).toBeCloseTo(rev.facades[0]!.values.normal.gValue, 10);

  // E-mail: from the outbox to a typed address; it arrives with the very workbook of the download.
  const to = uniqueEmail("deliverables-design-lead");
  await page.goto(`/projects/${projectId}/outbox`);
  await page.getByLabel("Revision").selectOption("A");
  await page.getByLabel("Other addresses").fill(to);
  await page.getByRole("button", { name: "Send workbook" }).click();
  const row = page.locator("tr[data-delivery]", { hasText: to }).first();
  await expect(row.getByText("Sent", { exact: true })).toBeVisible({ timeout: 45_000 });
  const dir = process.env.MAIL_DIR;
  expect(dir, "MAIL_DIR (npm test starts the SMTP fake)").toBeTruthy();
  let attachment: Buffer | null = null;
  for (let i = 0; i < 100 && !attachment; i++) {
    for (const f of readdirSync(dir!).filter((x) => x.endsWith(".eml"))) {
      const mail = await simpleParser(readFileSync(join(dir!, f)));
      const addresses = [mail.to]
        .flat()
        .flatMap((a) => a?.value ?? [])
        .map((v) => v.address?.toLowerCase());
      if (addresses.includes(to.toLowerCase())) attachment = mail.attachments[0]!.content;
    }
    if (!attachment) await page.waitForTimeout(200);
  }
  expect(attachment, `a message to ${to}`).not.toBeNull();
  // The mailed workbook carries the same numbers and cover, and is the very file the outbox keeps.
  const mailed = await open(attachment!);
  expect(mailed.cover).toBe(book.cover);
  expect(mailed.g).toBe(book.g);
  const kept = await page.request.get((await row.getByRole("link", { name: /\.xlsx$/ }).getAttribute("href"))!);
  expect(sha(await kept.body())).toBe(sha(attachment!));
});
