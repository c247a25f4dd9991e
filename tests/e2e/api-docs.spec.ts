// The API reference page /docs/api: public, every operation of the document (GET /api/v1/openapi.json) with its
// curl and fetch examples (the key in `Authorization: Bearer $PANERAY_KEY`), a working copy button, linked from
// the footer, and no horizontal overflow at 1440 and 390 px (code blocks scroll inside).
import { expect, test } from "@playwright/test";
import { ANONYMOUS, call } from "./api-actors";
import { overflow } from "./helpers";

type Doc = { paths: Record<string, Record<string, { operationId: string; security: Record<string, unknown>[] }>> };

test("every operation of the document is on the page with its curl and fetch examples", async ({ page }) => {
  const doc = (await call(ANONYMOUS, "GET", "/api/v1/openapi.json")).body as Doc;
  const ops = Object.entries(doc.paths).flatMap(([path, item]) =>
    Object.entries(item).map(([method, op]) => ({ path, method: method.toUpperCase(), ...op })),
  );
  expect(ops.length).toBeGreaterThan(50);
  const consoleErrors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error") consoleErrors.push(m.text());
  });
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.goto("/docs/api");
  await expect(page.getByRole("heading", { name: "Paneray API reference" })).toBeVisible();
  await expect(page.locator("[data-operation]")).toHaveCount(ops.length);
  for (const op of ops) {
    const card = page.locator(`[data-operation="${op.operationId}"]`);
    await expect(card.locator("h3"), op.operationId).toContainText(op.method);
    const curl = (await card.locator('[data-snippet="curl"]').textContent())!;
    const fetchCode = (await card.locator('[data-snippet="fetch"]').textContent())!;
    const base = op.path.split("{")[0]!;
    expect(curl, op.operationId).toContain(base);
    expect(fetchCode, op.operationId).toContain(`await fetch("`);
    if (op.security.some((s) => "bearerAuth" in s)) {
      expect(curl, op.operationId).toContain('-H "Authorization: Bearer $PANERAY_KEY"');
      expect(fetchCode, op.operationId).toContain("Authorization: `Bearer ${process.env.PANERAY_KEY}`");
    } else {
      // Anonymous routes need nothing; session-only ones the session cookie, never a key.
      expect(curl, op.operationId).not.toContain("Authorization");
      if (op.security.length) {
        expect(curl, op.operationId).toContain("PANERAY_SESSION_COOKIES");
        expect(fetchCode, op.operationId).toContain("API keys cannot call this");
      }
    }
  }
  // The field table of a request body, nested fields included.
  const glazing = page.locator('[data-operation="postCalcGlazing"]');
  await expect(glazing.getByRole("cell", { name: "layers", exact: true })).toBeVisible();
  await expect(glazing.getByRole("cell", { name: "hemispherical", exact: true })).toBeVisible();
  expect(await overflow(page)).toBeLessThanOrEqual(0);
  // The copy buttons hydrate under the Content-Security-Policy (no inline scripts or styles refused).
  const scheduleCopy = page.locator('[data-operation="postCalcSchedule"]').getByRole("button", { name: /Copy the curl example/ });
  await scheduleCopy.scrollIntoViewIfNeeded(); // islands hydrate when they come into view
  await expect(scheduleCopy).toBeEnabled();
  expect(consoleErrors).toEqual([]);
  await page.screenshot({ path: test.info().outputPath("api-1440.png") });
  await glazing.screenshot({ path: test.info().outputPath("api-1440-glazing.png") });
});

test("the page is linked from the footer, copies a snippet and does not overflow at 390 px", async ({ page, context }) => {
  await context.grantPermissions(["clipboard-read", "clipboard-write"]);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto("/");
  await page.getByRole("contentinfo").getByRole("link", { name: "API reference" }).click();
  await expect(page).toHaveURL(/\/docs\/api$/);
  expect(await overflow(page)).toBeLessThanOrEqual(0);
  const card = page.locator('[data-operation="getProjectsByIdWorkbook"]');
  await card.scrollIntoViewIfNeeded();
  const copy = card.getByRole("button", { name: /Copy the curl example/ });
  await expect(copy).toBeEnabled(); // the island has hydrated
  await copy.click();
  await expect(copy).toHaveText("Copied");
  expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(await card.locator('[data-snippet="curl"]').textContent());
  expect(await overflow(page)).toBeLessThanOrEqual(0);
  await page.screenshot({ path: test.info().outputPath("api-390.png") });
  await card.screenshot({ path: test.info().outputPath("api-390-workbook.png") });
});
