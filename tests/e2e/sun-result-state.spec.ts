// The sun page never shows figures under inputs they were not computed from: changing the façade, the
// glazing or the year marks the figures stale (greyed, with the inputs they belong to) until recalculated.
import { expect, test } from "@playwright/test";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn } from "./helpers";

test("changed inputs mark the year's figures stale until they are recalculated", async ({ page }) => {
  test.setTimeout(60_000);
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const projects = await (await page.request.get("/api/v1/projects")).json();
  const demo = projects.organizations
    .flatMap((o: { projects: { id: string; name: string }[] }) => o.projects)
    .find((p: { name: string }) => p.name === DEMO_PROJECTS[0]!.name);
  await page.goto(`/projects/${demo.id}/sun`);
  const results = page.getByTestId("schedule-results");
  const total = page.getByTestId("transmitted-total");

  await page.getByRole("button", { name: "Calculate the year" }).click();
  await expect(results).toHaveAttribute("data-stale", "false", { timeout: 20_000 });
  const first = await total.textContent();
  const year = Number(await page.getByLabel("Year", { exact: true }).inputValue());
  await expect(page.getByTestId("schedule-inputs")).toContainText(String(year));

  // Another year: the figures are still last year's, so they are marked and name the year they are for.
  await page.getByLabel("Year", { exact: true }).fill(String(year - 3));
  await expect(results).toHaveAttribute("data-stale", "true");
  await expect(page.getByTestId("schedule-stale")).toContainText(String(year));
  await expect(page.getByTestId("period-totals")).toContainText(`kWh/m² in ${year}`);

  // Back to the year computed: the figures belong to the form again.
  await page.getByLabel("Year", { exact: true }).fill(String(year));
  await expect(results).toHaveAttribute("data-stale", "false");

  // Another façade: stale; recalculating gives that façade's figures (a different orientation, different total).
  const facade = page.getByLabel("Façade", { exact: true });
  const options = await facade.locator("option").allTextContents();
  await facade.selectOption({ index: 2 });
  await expect(results).toHaveAttribute("data-stale", "true");
  await expect(page.getByTestId("schedule-stale")).toContainText(options[0]!.split(" — ")[0]!);
  await page.getByTestId("schedule-stale").getByRole("button", { name: "Calculate again" }).click();
  await expect(results).toHaveAttribute("data-stale", "false", { timeout: 20_000 });
  await expect(page.getByTestId("schedule-inputs")).toContainText(options[2]!.split(" — ")[0]!);
  expect(await total.textContent()).not.toBe(first);

  // Another glazing option: stale again.
  const glazing = page.getByLabel("Glazing option");
  await glazing.selectOption({ index: 0 });
  await expect(results).toHaveAttribute("data-stale", "true");
});

test("the year form is checked with the endpoint's schema, and its messages name the field in words", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const projects = await (await page.request.get("/api/v1/projects")).json();
  const demo = projects.organizations
    .flatMap((o: { projects: { id: string; name: string }[] }) => o.projects)
    .find((p: { name: string }) => p.name === DEMO_PROJECTS[0]!.name);
  await page.goto(`/projects/${demo.id}/sun`);
  let posted = 0;
  page.on("request", (r) => {
    if (r.url().endsWith("/api/v1/calc/schedule")) posted++;
  });
  // The form is an island: type once it has hydrated (its button is enabled then).
  await expect(page.getByRole("button", { name: "Calculate the year" })).toBeEnabled();
  await page.waitForLoadState("networkidle");
  await page.getByLabel("Linke turbidity").fill("15");
  await expect(page.getByLabel("Linke turbidity")).toHaveValue("15");
  await page.getByRole("button", { name: "Calculate the year" }).click();
  await expect(page.getByText(/Linke turbidity must be/)).toBeVisible();
  expect(posted).toBe(0);
});
