// The options board of a project page at phone width (390 px): the consultant points an option at another
// make-up of the library and the board shows that make-up's description and values; an approved option asks
// in the page before its approval is withdrawn; a stale option offers a reload; the requirements editor keeps its
// saved message after the save, and a stale save still offers a reload. Runs on a throwaway project of the demo
// organisation with its own make-ups, all removed afterwards.
import { expect, test, type Browser, type Page } from "@playwright/test";
import type { OptionEntry } from "@/lib/contracts/options";
import { call, signInDemo, type Caller } from "./api-actors";
import { DEMO_PASSWORD, demoUser, signIn, overflow } from "./helpers";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow, tintedPane } from "./workspace-rows";

const stamp = Date.now().toString(36);
const CLEAR = `Board clear double ${stamp}`;
const TINTED = `Board tinted double ${stamp}`;
let consultant: Caller;
let projectId = "";
const makeups: string[] = [];
const ids: Record<"proposed" | "approved" | "stale", string> = { proposed: "", approved: "", stale: "" };

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  consultant = await signInDemo("consultant");
  const me = (await call(consultant, "GET", "/api/v1/me")).body as { memberships: { organizationId: string }[] };
  const orgId = me.memberships[0]!.organizationId;
  const res = await call(consultant, "POST", "/api/v1/projects", {
    organizationId: orgId,
    name: `Board re-pointing ${stamp}`,
    siteName: "Board quay",
    latitudeDeg: 41.15,
    longitudeDeg: -8.61,
    timeZone: "Europe/Lisbon",
    facades: [
      { name: "South", azimuthDeg: 180 },
      { name: "West", azimuthDeg: 270 },
    ],
  });
  expect(res.status, res.text).toBe(201);
  projectId = (res.body as { project: { id: string } }).project.id;
  const clear = await insertMakeupRow(orgId, CLEAR, doubleUnit(clearPane(6), clearPane(6)));
  const tinted = await insertMakeupRow(orgId, TINTED, doubleUnit(tintedPane(6), clearPane(6)));
  makeups.push(clear.id, tinted.id);
  const facades = (await call(consultant, "GET", `/api/v1/projects/${projectId}`)).body as { facades?: { id: string; name: string }[] };
  const facadeIds = facades.facades?.map((f) => f.id) ?? [];
  expect(facadeIds).toHaveLength(2);
  ids.proposed = await insertOptionRow(projectId, facadeIds[0]!, clear, "A: clear");
  ids.stale = await insertOptionRow(projectId, facadeIds[0]!, clear, "C: clear");
  ids.approved = await insertOptionRow(projectId, facadeIds[1]!, clear, "B: clear", "approved");
});

test.afterAll(async () => {
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  await deleteMakeupRows(makeups);
  await closeWorkspaceRows();
});

async function phone(browser: Browser): Promise<Page> {
  const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await ctx.newPage();
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await page.goto(`/projects/${projectId}`);
  await expect(page.getByTestId("facade-options")).toHaveCount(2);
  return page;
}

const optionsNow = async () => ((await call(consultant, "GET", `/api/v1/projects/${projectId}/options`)).body as { options: OptionEntry[] }).options;
const card = (page: Page, facade: string) => page.locator(`[data-testid="facade-options"][data-facade="${facade}"]`);

/** The row shows the make-up's name, description, revision and the stored values the API gives. */
async function expectRowShows(page: Page, facade: string, o: OptionEntry) {
  const row = card(page, facade).locator(`tr[data-option="${o.name}"]`);
  await expect(row).toContainText(o.makeupName);
  await expect(row).toContainText(`${o.description} · rev. ${o.makeupRevision}`);
  await expect(row.locator('[data-value="gValue"]')).toHaveText(o.values.normal.gValue.toFixed(2));
  await expect(row.locator('[data-value="uValue"]')).toHaveText(o.values.uValue.toFixed(2));
  await expect(row.locator('[data-value="solarTransmittance"]')).toHaveText(o.values.normal.solarTransmittance.toFixed(2));
  await expect(row.locator('[data-value="visibleTransmittance"]')).toHaveText(lightText(makeupLight(o.values)));
}

test("the consultant points an option at another make-up and the board shows its description and values", async ({ browser }) => {
  const page = await phone(browser);
  const south = card(page, "South");
  await expect(south.locator('tr[data-option="A: clear"]')).toContainText(CLEAR);
  // Opened from the keyboard, the chooser takes the focus.
  await south.getByRole("button", { name: "Choose another make-up for A: clear" }).focus();
  await page.keyboard.press("Enter");
  const chooser = south.getByTestId("change-makeup");
  await expect(chooser.getByLabel("Replacement make-up")).toBeFocused();
  // Sending nothing is refused in words, before anything is sent.
  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  await expect(chooser.getByRole("alert")).toHaveText("Make-up: choose one from the library.");
  // The current make-up is not offered; the chosen one is previewed.
  await expect(chooser.getByLabel("Replacement make-up").locator("option", { hasText: CLEAR })).toHaveCount(0);
  const select = chooser.getByLabel("Replacement make-up");
  await select.selectOption((await select.locator("option", { hasText: TINTED }).getAttribute("value"))!);
  await expect(chooser.getByTestId("change-makeup-preview")).toContainText(`${TINTED} (test) · rev. 1`);
  expect(await overflow(page)).toBe(0);
  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  await expect(south.getByRole("status")).toHaveText(`“A: clear” now uses ${TINTED}, revision 1.`);
  await expect(chooser).toHaveCount(0);
  await expect(south.getByRole("button", { name: "Choose another make-up for A: clear" })).toBeFocused();

  const after = (await optionsNow()).find((o) => o.id === ids.proposed)!;
  expect(after.makeupName).toBe(TINTED);
  expect(after.status).toBe("proposed");
  await expectRowShows(page, "South", after);
  // The tinted outer pane lets less solar energy through than the clear one it replaced.
  const before = (await optionsNow()).find((o) => o.id === ids.stale)!;
  expect(after.values.normal.solarTransmittance).toBeLessThan(before.values.normal.solarTransmittance);
  // Escape closes the chooser without changing anything.
  await south.getByRole("button", { name: "Choose another make-up for C: clear" }).click();
  await page.keyboard.press("Escape");
  await expect(south.getByTestId("change-makeup")).toHaveCount(0);
  expect((await optionsNow()).find((o) => o.id === ids.stale)!.makeupName).toBe(CLEAR);
});

test("an approved option asks in the page, then loses its approval when re-pointed", async ({ browser }) => {
  const page = await phone(browser);
  const west = card(page, "West");
  const row = west.locator('tr[data-option="B: clear"]');
  await expect(row).toContainText("Approved");
  await west.getByRole("button", { name: "Choose another make-up for B: clear" }).click();
  const chooser = west.getByTestId("change-makeup");
  await expect(chooser).toContainText("changing its make-up withdraws the approval");
  const select = chooser.getByLabel("Replacement make-up");
  await select.selectOption((await select.locator("option", { hasText: TINTED }).getAttribute("value"))!);
  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  const confirm = chooser.getByRole("alertdialog");
  await expect(confirm).toContainText(`Pointing it at ${TINTED} withdraws the approval`);
  await expect(confirm.getByRole("button", { name: "Withdraw the approval and change" })).toBeFocused();
  // Nothing is sent before the confirmation; keeping the approval keeps everything.
  await confirm.getByRole("button", { name: "Keep the approval" }).click();
  await expect(chooser.getByRole("alertdialog")).toHaveCount(0);
  let o = (await optionsNow()).find((x) => x.id === ids.approved)!;
  expect([o.status, o.makeupName]).toEqual(["approved", CLEAR]);

  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  expect(await overflow(page)).toBe(0);
  await chooser.getByRole("alertdialog").getByRole("button", { name: "Withdraw the approval and change" }).click();
  await expect(west.getByRole("status")).toContainText("Its approval was withdrawn: it is under review again.");
  await expect(row).toContainText("Under review");
  o = (await optionsNow()).find((x) => x.id === ids.approved)!;
  expect([o.status, o.makeupName]).toEqual(["proposed", TINTED]);
  await expectRowShows(page, "West", o);
  const history = (await call(consultant, "GET", `/api/v1/projects/${projectId}/history`)).body as { items: { summary: string }[] };
  expect(history.items.map((e) => e.summary)).toContain(
    `Pointed “B: clear” at ${TINTED}, revision 1; its approval was withdrawn (the make-up changed)`,
  );
});

test("an option changed by someone else since the page read it offers a reload", async ({ browser }) => {
  const page = await phone(browser);
  const south = card(page, "South");
  await south.getByRole("button", { name: "Choose another make-up for C: clear" }).click();
  const chooser = south.getByTestId("change-makeup");
  const select = chooser.getByLabel("Replacement make-up");
  await select.selectOption((await select.locator("option", { hasText: TINTED }).getAttribute("value"))!);
  // Someone renames the option meanwhile.
  const read = (await optionsNow()).find((o) => o.id === ids.stale)!;
  expect((await call(consultant, "PATCH", `/api/v1/options/${ids.stale}`, { version: read.version, name: "C: clear" })).status).toBe(200);
  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  await expect(chooser.getByRole("alert")).toContainText("Someone changed this option");
  expect((await optionsNow()).find((o) => o.id === ids.stale)!.makeupName).toBe(CLEAR);
  await chooser.getByRole("button", { name: "Reload the options" }).click();
  await expect(chooser.getByRole("alert")).toHaveCount(0);
  await chooser.getByRole("button", { name: "Change the make-up" }).click();
  await expect(south.getByRole("status")).toHaveText(`“C: clear” now uses ${TINTED}, revision 1.`);
  expect((await optionsNow()).find((o) => o.id === ids.stale)!.makeupName).toBe(TINTED);
});

test("the requirements editor keeps its saved message after saving; a stale save still offers a reload", async ({ browser }) => {
  const page = await phone(browser);
  const gLimit = page.getByLabel("Whole project: Maximum g-value");
  await gLimit.fill("0.6");
  await page.getByRole("button", { name: "Save the requirements" }).click();
  const saved = page.getByRole("status").filter({ hasText: "Requirements saved" });
  await expect(saved).toBeVisible();
  const version = async () => ((await call(consultant, "GET", `/api/v1/projects/${projectId}/requirements`)).body as { version: number }).version;
  expect(await version()).toBe(1);
  // The form now shows version 1 and still says so; editing again clears the message.
  await page.waitForTimeout(300);
  await expect(saved).toBeVisible();
  await expect(gLimit).toHaveValue("0.6");
  await gLimit.fill("0.55");
  await expect(saved).toHaveCount(0);

  // Someone else saves meanwhile: the save is refused as stale, the reload shows their values.
  expect((await call(consultant, "PUT", `/api/v1/projects/${projectId}/requirements`, { project: { maxGValue: 0.5 }, version: 1 })).status).toBe(200);
  await page.getByRole("button", { name: "Save the requirements" }).click();
  await expect(page.getByRole("button", { name: "Reload the requirements" })).toBeVisible();
  await page.getByRole("button", { name: "Reload the requirements" }).click();
  await expect(gLimit).toHaveValue("0.5");
  await expect(page.getByRole("button", { name: "Reload the requirements" })).toHaveCount(0);
  await gLimit.fill("0.45");
  await page.getByRole("button", { name: "Save the requirements" }).click();
  await expect(saved).toBeVisible();
  expect(await version()).toBe(3);
  await page.reload();
  await expect(gLimit).toHaveValue("0.45");
});

test("removing an option asks in the page first and keeps everything until confirmed", async ({ browser }) => {
  const page = await phone(browser);
  const south = card(page, "South");
  await south.getByRole("button", { name: "Remove C: clear" }).click();
  const ask = south.getByTestId("option-confirm");
  await expect(ask).toContainText("Remove the option “C: clear” from South? Its comments and decisions go with it");
  await expect(ask.getByRole("button", { name: "Remove the option" })).toBeFocused();
  expect(await overflow(page)).toBe(0);
  await ask.getByRole("button", { name: "Keep it as it is" }).click();
  await expect(south.getByTestId("option-confirm")).toHaveCount(0);
  expect((await optionsNow()).some((o) => o.id === ids.stale)).toBe(true);
  await south.getByRole("button", { name: "Remove C: clear" }).click();
  await south.getByTestId("option-confirm").getByRole("button", { name: "Remove the option" }).click();
  await expect(south.locator('tr[data-option="C: clear"]')).toHaveCount(0);
  expect((await optionsNow()).some((o) => o.id === ids.stale)).toBe(false);
});

test("architects see the options but no way to re-point them", async ({ browser }) => {
  const ctx = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await ctx.newPage();
  await signIn(page, demoUser("architect").email, DEMO_PASSWORD);
  await page.goto(`/projects/${projectId}`);
  await expect(page.getByTestId("facade-options")).toHaveCount(2);
  await expect(page.locator('tr[data-option="B: clear"]')).toContainText(TINTED);
  await expect(page.getByRole("button", { name: /Choose another make-up/ })).toHaveCount(0);
});
