// The results page and an issued revision in the browser: the numbers on screen are the API's, the table
// filters and sorts, two options compare side by side, the consultant issues a revision through the dialog,
// the client reads it but not the working results; no horizontal overflow at 390 px.
import { expect, test, type Page } from "@playwright/test";
import type { ResultsResponse, RevisionResponse } from "@/lib/contracts/results";
import { DEMO_PASSWORD, demoUser, signIn } from "./helpers";
import { call, signInDemo, throwawayProject } from "./api-actors";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow, tintedPane } from "./workspace-rows";

const YEAR = new Date().getFullYear();
let projectId = "";
const makeups: string[] = [];
const options: Record<string, string> = {};

test.beforeAll(async () => {
  const { consultant, orgId, id } = await throwawayProject({
    name: "Results page test block",
    siteName: "Test quay",
    latitudeDeg: 38.7,
    longitudeDeg: -9.14,
    timeZone: "Europe/Lisbon",
    facades: [
      { name: "East bay", azimuthDeg: 90 },
      { name: "West bay", azimuthDeg: 270 },
    ],
  });
  projectId = id;
  const facades = ((await call(consultant, "GET", `/api/v1/projects/${projectId}`)).body as { facades: { id: string; name: string }[] }).facades;
  const members = (await call(consultant, "GET", `/api/v1/projects/${projectId}/shares`)).body as { shares: { memberId: string; email: string }[] };
  const client = members.shares.find((m) => m.email === demoUser("client").email)!;
  expect((await call(consultant, "POST", `/api/v1/projects/${projectId}/shares`, { memberId: client.memberId })).status).toBe(201);
  const clear = await insertMakeupRow(orgId, "Page test clear", doubleUnit(clearPane(6), clearPane(4)));
  const tinted = await insertMakeupRow(orgId, "Page test tinted", doubleUnit(tintedPane(6), clearPane(4)));
  makeups.push(clear.id, tinted.id);
  const [east, west] = facades;
  options.eastClear = await insertOptionRow(projectId, east!.id, clear, "East clear", "approved");
  options.eastTinted = await insertOptionRow(projectId, east!.id, tinted, "East tinted");
  options.westTinted = await insertOptionRow(projectId, west!.id, tinted, "West tinted");
});

test.afterAll(async () => {
  const consultant = await signInDemo("consultant");
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  await deleteMakeupRows(makeups);
  await closeWorkspaceRows();
});

const noOverflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

test("the table shows the API's figures, filters, sorts and compares; the consultant issues revision A", async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const api = (await (await page.request.get(`/api/v1/projects/${projectId}/results?year=${YEAR}`)).json()) as ResultsResponse;
  await page.goto(`/projects/${projectId}/results`);
  const table = page.getByTestId("results-table");
  await expect(table.locator("tbody tr")).toHaveCount(3);
  await expect(page.getByTestId("inputs-year")).toContainText(String(YEAR));

  for (const f of api.facades)
    for (const o of f.options) {
      const row = table.locator(`tr[data-option="${o.optionId}"]`);
      await expect(row.locator('[data-col="g"]')).toHaveText(o.values.normal.gValue.toFixed(3));
      await expect(row.locator('[data-col="tau"]')).toHaveText(o.values.normal.solarTransmittance.toFixed(3));
      await expect(row.locator('[data-col="annualG"]')).toHaveText(Math.round(o.annual.solarGainKWhm2).toLocaleString("en"));
      await expect(row.locator('[data-col="tauV"]')).toHaveText("unknown");
    }

  await page.getByLabel("Façade", { exact: true }).selectOption("West bay");
  await expect(table.locator("tbody tr")).toHaveCount(1);
  await page.getByLabel("Façade", { exact: true }).selectOption("");
  await page.getByLabel("Status").selectOption("approved");
  await expect(table.locator("tbody tr")).toHaveCount(1);
  await page.getByLabel("Status").selectOption("");

  // Sorting by g: the column's values follow the direction the header announces, and a second click reverses it.
  const gValues = async () => (await table.locator('[data-col="g"]').allTextContents()).map(Number);
  const gHeader = table.locator("th").filter({ has: page.getByRole("button", { name: /^g/ }) });
  for (const direction of ["descending", "ascending"]) {
    await gHeader.getByRole("button").click();
    await expect(gHeader).toHaveAttribute("aria-sort", direction);
    const values = await gValues();
    const sorted = [...values].sort((a, b) => (direction === "ascending" ? a - b : b - a));
    expect(values).toEqual(sorted);
    expect(values[0]).not.toBe(values[2]);
  }

  await page.getByLabel("Compare East bay · East clear").check();
  await page.getByLabel("Compare East bay · East tinted").check();
  await expect(page.getByTestId("compare-angular").locator("path[data-series]")).toHaveCount(4);
  await expect(page.getByTestId("monthly-bars").locator("rect")).toHaveCount(24);
  await expect(page.getByTestId("compare-day").locator("path[data-series]")).toHaveCount(2, { timeout: 15_000 });

  await page.getByTestId("issue-open").click();
  await expect(page.getByRole("dialog")).toContainText("West bay");
  await page.getByLabel("Note (optional)").fill("Issued by the browser test");
  await page.getByTestId("issue-submit").click();
  await page.getByRole("link", { name: "Open revision A" }).click();
  await expect(page.getByTestId("revision-title")).toHaveText("Revision A");
  const rev = (await (await page.request.get(`/api/v1/projects/${projectId}/revisions/A`)).json()) as RevisionResponse;
  expect(rev.facades.map((f) => f.optionId)).toEqual([options.eastClear]);
  expect(rev.unapproved!.map((u) => u.name)).toEqual(["West bay"]);
  await expect(page.getByTestId("revision-table").locator('[data-col="g"]')).toHaveText(rev.facades[0]!.values.normal.gValue.toFixed(3));
  await expect(page.getByTestId("revision-unapproved")).toContainText("West bay");
  await expect(page.getByTestId("revision-note")).toHaveText("Issued by the browser test");
});

test("the client reads the issued revision but not the working results", async ({ page }) => {
  await signIn(page, demoUser("client").email, DEMO_PASSWORD);
  const res = await page.goto(`/projects/${projectId}/revisions/A`);
  expect(res!.status()).toBe(200);
  await expect(page.getByTestId("revision-title")).toHaveText("Revision A");
  await expect(page.getByRole("link", { name: "Working results" })).toHaveCount(0);
  expect((await page.goto(`/projects/${projectId}/results`))!.status()).toBe(403);
  expect((await page.goto(`/projects/${projectId}/revisions/Q`))!.status()).toBe(404);
});

test("no horizontal overflow at 390 px on the results and revision pages", async ({ page }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto(`/projects/${projectId}/results`);
  await expect(page.getByTestId("results-table")).toBeVisible();
  await page.getByLabel("Compare East bay · East clear").check();
  await page.getByLabel("Compare West bay · West tinted").check();
  await expect(page.getByTestId("compare-day")).toBeVisible({ timeout: 15_000 });
  expect(await noOverflow(page)).toBe(0);
  // Chart labels are drawn at their pixel size: at least 10 px on a phone.
  const smallest = await page.evaluate(() =>
    Math.min(...[...document.querySelectorAll('[data-testid="compare-panel"] svg text')].map((t) => Number(t.getAttribute("font-size")))),
  );
  expect(smallest).toBeGreaterThanOrEqual(10);
  await page.goto(`/projects/${projectId}/revisions/A`);
  expect(await noOverflow(page)).toBe(0);
});
