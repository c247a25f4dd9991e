// The validation report in the browser: readable signed out, the same counts as its JSON download, every
// domain, case and value with a pass; the CSV download parses with one row per expected value; the footer and
// the results and revision pages link to it; it fits 390 px with chart labels of 10 px or more. Screenshots of
// 1440 and 390 px go to test-results/.
import { expect, test } from "@playwright/test";
import Papa from "papaparse";
import type { ValidationReport } from "@/lib/validation/report";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn, overflow, smallestChartLabel } from "./helpers";

let report: ValidationReport;

test.beforeAll(async ({ request }) => {
  const res = await request.get("/validation.json");
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toMatch(/^application\/json/);
  expect(res.headers()["content-disposition"]).toMatch(/^attachment; filename="paneray-validation\.json"$/);
  report = (await res.json()) as ValidationReport;
});

test("signed out, /validation shows the summary, every domain, case and value, all passing", async ({ page }) => {
  const res = await page.goto("/validation");
  expect(res!.status()).toBe(200);
  await expect(page.getByRole("heading", { level: 1, name: "Validation of the engines" })).toBeVisible();
  await expect(page.getByRole("link", { name: "Sign in" })).toBeVisible(); // signed out, in the app's layout

  expect(report.totals.failing).toBe(0);
  expect(report.totals.values).toBe(report.rows.length);
  await expect(page.getByTestId("validation-case-count")).toHaveText(String(report.totals.cases));
  await expect(page.getByTestId("validation-value-count")).toHaveText(String(report.totals.values));
  await expect(page.getByTestId("validation-verdict")).toHaveText("all passing");

  const domains = await page.getByTestId("validation-domain").evaluateAll((els) => els.map((e) => e.getAttribute("data-domain")));
  expect(domains).toEqual(report.domains.map((d) => d.domain));
  const caseIds = await page.getByTestId("validation-case").evaluateAll((els) => els.map((e) => e.getAttribute("data-case-id")));
  expect(caseIds).toEqual([...new Set(report.rows.map((r) => r.caseId))]);
  expect(caseIds).toHaveLength(report.totals.cases);
  const passes = await page.getByTestId("validation-row").evaluateAll((els) => els.map((e) => e.getAttribute("data-pass")));
  expect(passes).toHaveLength(report.totals.values);
  expect(passes.every((p) => p === "pass")).toBe(true);

  // versions and sources are on the page
  await expect(page.getByTestId("validation-versions")).toContainText(`Paneray`);
  for (const lib of report.versions.libraries) await expect(page.getByTestId("validation-versions")).toContainText(`${lib.name} ${lib.version}`);
  await expect(page.locator('[data-case-id="fresnel/air-glass-1.5/30deg"]')).toContainText("scripts/reference/fresnel.ts");
  await expect(page.locator('[data-case-id="sun-position/spa-example"]')).toContainText("NREL/TP-560-34302");

  // the summary table links to each domain's anchor
  await page.getByTestId("validation-domain-table").getByRole("link", { name: report.domains[5]!.title }).click();
  await expect(page).toHaveURL(new RegExp(`#${report.domains[5]!.domain}$`));
});

test("the CSV download parses with one row per expected value, the same as the JSON", async ({ request }) => {
  const res = await request.get("/validation.csv");
  expect(res.status()).toBe(200);
  expect(res.headers()["content-type"]).toBe("text/csv; charset=utf-8");
  expect(res.headers()["content-disposition"]).toBe('attachment; filename="paneray-validation.csv"');
  const parsed = Papa.parse<Record<string, string>>((await res.text()).trimEnd(), { header: true });
  expect(parsed.errors).toEqual([]);
  expect(parsed.data).toHaveLength(report.totals.values);
  expect(parsed.meta.fields).toEqual(
    expect.arrayContaining(["domain", "case_id", "quantity", "expected", "computed", "deviation", "tolerance", "pass", "source"]),
  );
  expect(parsed.data.every((r) => r.pass === "pass")).toBe(true);
  expect(parsed.data.map((r) => `${r.case_id} ${r.quantity}`)).toEqual(report.rows.map((r) => `${r.caseId} ${r.quantity}`));
});

test("the footer, the results page and an issued revision link to the report", async ({ page }) => {
  await page.goto("/signin");
  await page.getByTestId("footer-validation").click();
  await expect(page).toHaveURL(/\/validation$/);

  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const list = await (await page.request.get("/api/v1/projects")).json();
  const projectId: string = list.organizations[0].projects.find((p: { name: string }) => p.name === DEMO_PROJECTS[0].name).id;
  await page.goto(`/projects/${projectId}/results`);
  await page.getByTestId("results-validation").click();
  await expect(page).toHaveURL(/\/validation$/);
  await expect(page.getByTestId("validation-verdict")).toHaveText("all passing");
  await expect(page.getByTestId("signed-in-as")).toBeVisible(); // signed in, the same page

  await page.goto(`/projects/${projectId}/revisions/A`);
  await page.getByTestId("revision-validation").click();
  await expect(page).toHaveURL(/\/validation$/);
});

for (const width of [1440, 390]) {
  test(`at ${width} px: no horizontal overflow, chart labels of 10 px or more (screenshot)`, async ({ browser }) => {
    const ctx = await browser.newContext({ viewport: { width, height: 900 } });
    const page = await ctx.newPage();
    await page.goto("/validation");
    await expect(page.getByTestId("validation-chart")).toBeVisible();
    expect(await overflow(page)).toBe(0);
    expect(await smallestChartLabel(page)).toBeGreaterThanOrEqual(10);
    await page.screenshot({ path: `test-results/validation-${width}.png`, fullPage: false });
    await page.getByTestId("validation-chart").screenshot({ path: `test-results/validation-chart-${width}.png` });
    await page.locator("#u-value").screenshot({ path: `test-results/validation-u-value-${width}.png` });
    await ctx.close();
  });
}
