// Uploads in the browser: measured panes from a CSV file on the library page (the problems of a broken file in
// a table with line and column, then the saved panes), and a weather file on the project page, after which the
// results page says it uses that file; both pages at 390 px without horizontal overflow.
import { expect, test, type Page } from "@playwright/test";
import { readFileSync } from "node:fs";
import { createHash } from "node:crypto";
import { DEMO_PASSWORD, demoUser, signIn } from "./helpers";
import { call, signInDemo, throwawayProject } from "./api-actors";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow } from "./workspace-rows";
import { weatherCsv } from "@scripts/weather-year";

const fixture = (name: string) => readFileSync(new URL(`../fixtures/uploads/${name}`, import.meta.url));
const noOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

let projectId = "";
const makeups: string[] = [];
const panes: string[] = [];

test.beforeAll(async () => {
  const { consultant, orgId, id } = await throwawayProject({
    name: "Upload page test block",
    siteName: "Invented wharf",
    latitudeDeg: 41.15,
    longitudeDeg: -8.61,
    timeZone: "Europe/Lisbon",
    facades: [{ name: "South bay", azimuthDeg: 180 }],
  });
  projectId = id;
  const facades = ((await call(consultant, "GET", `/api/v1/projects/${projectId}`)).body as { facades: { id: string }[] }).facades;
  const clear = await insertMakeupRow(orgId, "Upload page clear", doubleUnit(clearPane(6), clearPane(4)));
  makeups.push(clear.id);
  await insertOptionRow(projectId, facades[0]!.id, clear, "South clear");
});

test.afterAll(async () => {
  const consultant = await signInDemo("consultant");
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  for (const id of panes) await call(consultant, "DELETE", `/api/v1/panes/${id}`);
  await deleteMakeupRows(makeups);
  await closeWorkspaceRows();
});

test("a consultant imports measured panes on the library page", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 800 });
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto("/library");
  const form = page.getByTestId("panes-import");
  await expect(form.getByRole("link", { name: /template panes file/ })).toHaveAttribute("href", "/templates/paneray-panes-template.csv");

  // A broken file: every problem in the table, with line and column.
  await expect(form.getByLabel("Choose a file…")).toBeEnabled();
  await form.getByLabel("Choose a file…").setInputFiles({ name: "broken.csv", mimeType: "text/csv", buffer: fixture("panes-broken.csv") });
  const problems = form.getByTestId("upload-errors");
  await expect(problems).toContainText("5 problems; nothing was saved");
  await expect(problems.locator("tbody tr")).toHaveCount(5);
  await expect(problems.locator("tbody tr").nth(1)).toContainText("solar_t + solar_rf must not exceed 1");
  await expect(problems.locator("tbody tr").nth(1).locator("td").first()).toHaveText("3");
  expect(await noOverflow(page)).toBeLessThanOrEqual(0);

  // The valid file: the panes saved, named as in the file; the file's SHA-256 as node:crypto computes it.
  const file = fixture("panes-valid.csv");
  const answer = page.waitForResponse((r) => r.url().endsWith("/panes/import") && r.request().method() === "POST");
  await expect(form.getByLabel("Choose a file…")).toBeEnabled();
  await form.getByLabel("Choose a file…").setInputFiles({ name: "samples.csv", mimeType: "text/csv", buffer: file });
  const saved = (await (await answer).json()) as { panes: { id: string }[] };
  panes.push(...saved.panes.map((p) => p.id));
  const table = form.getByTestId("imported-panes");
  await expect(table.locator("tbody tr")).toHaveCount(3);
  await expect(table).toContainText("Brightwater solar grey 8");
  await expect(form.getByTestId("upload-saved")).toContainText(createHash("sha256").update(file).digest("hex"));
  // Reloaded, the library lists them.
  await page.reload();
  await expect(page.getByText("Kestrel low-e 6")).toBeVisible();
  expect(await noOverflow(page)).toBeLessThanOrEqual(0);
});

test("a consultant uploads a weather year on the project page and the results page says it uses it", async ({ page }) => {
  test.setTimeout(60_000);
  await page.setViewportSize({ width: 390, height: 800 });
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto(`/projects/${projectId}`);
  const panel = page.getByTestId("weather-panel");
  await expect(panel.getByTestId("weather-status")).toContainText("clear-sky model");

  // The gap hour of the spring clock change is named with its line.
  const upload = panel.getByTestId("weather-upload");
  await expect(upload.getByLabel("Choose a file…")).toBeEnabled();
  await upload.getByLabel("Choose a file…").setInputFiles({ name: "broken.csv", mimeType: "text/csv", buffer: fixture("weather-broken.csv") });
  await expect(upload.getByTestId("upload-errors")).toContainText("does not exist in Europe/Lisbon");

  const csv = weatherCsv({ year: 2025, latitudeDeg: 41.15, longitudeDeg: -8.61, times: "utc" });
  await expect(upload.getByLabel("Choose a file…")).toBeEnabled();
  await upload.getByLabel("Choose a file…").setInputFiles({ name: "wharf-2025.csv", mimeType: "text/csv", buffer: Buffer.from(csv) });
  await expect(upload.getByTestId("upload-saved")).toContainText("8760 hours from 2025-01-01 to 2025-12-31");
  await expect(panel.getByTestId("weather-status")).toContainText("wharf-2025.csv");
  await expect(panel.getByTestId("weather-status")).toContainText(createHash("sha256").update(csv).digest("hex"));
  expect(await noOverflow(page)).toBeLessThanOrEqual(0);

  await page.goto(`/projects/${projectId}/results`);
  await expect(page.getByTestId("inputs-irradiance")).toContainText("weather file “wharf-2025.csv”");
  await expect(page.getByTestId("inputs-year")).toContainText("2025-01-01 to 2025-12-31");
  expect(await noOverflow(page)).toBeLessThanOrEqual(0);

  // Back to clear sky from the project page.
  await page.goto(`/projects/${projectId}`);
  await panel.getByRole("button", { name: "Remove and use clear sky" }).click();
  await expect(panel.getByTestId("weather-status")).toContainText("clear-sky model");
});
