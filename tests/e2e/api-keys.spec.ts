// The owners' API keys page: a key is made, shown once, works as `Authorization: Bearer` from a script, is
// listed by its start, revoked after an in-page confirmation (refused at once), and the organisation's history
// shows both events. Other roles get the forbidden page. Both widths without horizontal overflow.
import { expect, test } from "@playwright/test";
import { DEMO_ORGANIZATION, DEMO_PASSWORD, demoUser, signIn, overflow } from "./helpers";

const PAGE = `/orgs/${DEMO_ORGANIZATION.slug}/api-keys`;
const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };

/** A request as a script makes it: the key in the Authorization header, no cookie, no Origin. */
async function asScript(key: string, method: "GET" | "POST", path: string, body?: unknown) {
  const base = test.info().project.use.baseURL!;
  const res = await fetch(base + path, {
    method,
    headers: { authorization: `Bearer ${key}`, ...(body ? { "content-type": "application/json" } : {}) },
    body: body ? JSON.stringify(body) : undefined,
    signal: AbortSignal.timeout(15_000),
  });
  return { status: res.status, body: (await res.json().catch(() => null)) as Record<string, unknown> | null };
}

test("an owner makes a key, sees it once, uses it, revokes it, and the history shows both", async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 1000 });
  await signIn(page, demoUser("owner").email, DEMO_PASSWORD);
  await page.goto(`/orgs/${DEMO_ORGANIZATION.slug}/members`);
  await page.getByTestId("org-tabs").getByRole("link", { name: "API keys" }).click();
  await expect(page).toHaveURL(new RegExp(`${PAGE}$`));
  await expect(page.locator("astro-island[ssr]")).toHaveCount(0);

  const name = `Browser key ${Date.now().toString(36)}`;
  await page.getByLabel("Name").fill(name);
  await page.getByTestId("scope-calculate").check();
  await expect(page.getByText("plus the glazing and schedule calculations")).toBeVisible();
  await page.getByRole("button", { name: "Make key" }).click();

  const shown = page.getByTestId("new-key");
  await expect(shown).toContainText("will not show it again");
  const key = (await page.getByTestId("new-key-value").textContent())!.trim();
  expect(key).toMatch(/^pnr_[A-Za-z0-9_-]{43}$/);
  await expect(shown.getByRole("button", { name: "Copy" })).toBeVisible();
  const row = page.getByTestId("api-key-row").filter({ hasText: name });
  await expect(row).toContainText(key.slice(0, 10));
  await expect(row).toContainText("Calculate");
  await expect(row).toContainText("Never used");
  await page.screenshot({ path: test.info().outputPath("api-keys-1440.png"), fullPage: true });
  expect(await overflow(page)).toBe(0);

  // The key works from a script within its scope, and nowhere else.
  const calc = await asScript(key, "POST", "/api/v1/calc/glazing", { layers: [pane6] });
  expect(calc.status).toBe(200);
  const write = await asScript(key, "POST", "/api/v1/projects", { organizationId: "x", name: "Nope" });
  expect(write.status).toBe(403);
  expect(write.body?.detail).toContain('"read-write"');

  // Shown once: after a reload only its start is left; the last use is listed.
  await page.reload();
  await expect(page.getByTestId("new-key")).toHaveCount(0);
  await expect(page.getByText(key)).toHaveCount(0);
  await expect(row).toContainText("Last used");

  // Revoking asks in the page first; keeping it changes nothing.
  await row.getByRole("button", { name: "Revoke…" }).click();
  await expect(row.getByRole("group")).toContainText(`Revoke “${name}”?`);
  await row.getByRole("button", { name: "Keep it" }).click();
  await expect(row.getByRole("group")).toHaveCount(0);
  expect((await asScript(key, "GET", "/api/v1/me")).status).toBe(200);
  await row.getByRole("button", { name: "Revoke…" }).click();
  await row.getByRole("button", { name: "Revoke key" }).click();
  await expect(row).toContainText("Revoked");
  await expect(row.getByRole("button")).toHaveCount(0);
  const refused = await asScript(key, "GET", "/api/v1/me");
  expect(refused.status).toBe(401);
  expect(refused.body?.detail).toBe("The API key is not valid or has been revoked");

  const history = page.getByTestId("org-history");
  await expect(history.getByText(`Revoked the API key “${name}” (calculate)`)).toBeVisible();
  await expect(history.getByText(`Created the API key “${name}” (calculate)`)).toBeVisible();
  await expect(history.locator("li").first()).toContainText(`Revoked the API key “${name}”`);

  await page.setViewportSize({ width: 390, height: 900 });
  await page.reload();
  await expect(page.locator("astro-island[ssr]")).toHaveCount(0);
  expect(await overflow(page)).toBe(0);
  await page.screenshot({ path: test.info().outputPath("api-keys-390.png"), fullPage: true });
});

test("other roles get the forbidden page", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const res = await page.goto(PAGE);
  expect(res!.status()).toBe(403);
  await expect(page.getByText("Only the organisation's owners manage its API keys.")).toBeVisible();
});
