// A façade's shading devices in the project form: the consultant gives a façade a typical window and an
// overhang, saves, sees the values again on the edit page and lower results for that façade; a bad depth is
// named in words before anything is sent; removing a device sends it as absent; removing a façade that has
// options asks first, in the page, naming how many go with it. The form fits 390 px and shows keyboard focus.
import { expect, test, type Page } from "@playwright/test";
import type { ResultsResponse } from "@/lib/contracts/results";
import { DEMO_PASSWORD, demoUser, signIn } from "./helpers";
import { call, signInDemo, throwawayProject } from "./api-actors";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow } from "./workspace-rows";

const YEAR = new Date().getFullYear();
let projectId = "";
const makeups: string[] = [];
let facadeIds: { south: string; east: string } = { south: "", east: "" };

interface ApiFacade {
  id: string;
  name: string;
  windowWidthM: number | null;
  windowHeightM: number | null;
  shading: Record<string, unknown> | null;
}

test.describe.configure({ mode: "serial" });

test.beforeAll(async () => {
  const { consultant, orgId, id } = await throwawayProject({
    name: "Shading form test block",
    siteName: "Test terrace",
    latitudeDeg: 38.7,
    longitudeDeg: -9.14,
    timeZone: "Europe/Lisbon",
    facades: [
      { name: "South bay", azimuthDeg: 180 },
      { name: "East bay", azimuthDeg: 90 },
    ],
  });
  projectId = id;
  const facades = ((await call(consultant, "GET", `/api/v1/projects/${projectId}`)).body as { facades: ApiFacade[] }).facades;
  facadeIds = { south: facades.find((f) => f.name === "South bay")!.id, east: facades.find((f) => f.name === "East bay")!.id };
  const clear = await insertMakeupRow(orgId, "Shading test clear", doubleUnit(clearPane(6), clearPane(4)));
  makeups.push(clear.id);
  await insertOptionRow(projectId, facadeIds.south, clear, "South clear");
  await insertOptionRow(projectId, facadeIds.east, clear, "East clear A");
  await insertOptionRow(projectId, facadeIds.east, clear, "East clear B");
});

test.afterAll(async () => {
  const consultant = await signInDemo("consultant");
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  await deleteMakeupRows(makeups);
  await closeWorkspaceRows();
});

const southAnnual = async (page: Page) => {
  const r = (await (await page.request.get(`/api/v1/projects/${projectId}/results?year=${YEAR}`)).json()) as ResultsResponse;
  return r.facades.find((f) => f.facadeId === facadeIds.south)!.options[0]!.annual.transmittedKWhm2;
};
const apiFacades = async (page: Page) =>
  ((await (await page.request.get(`/api/v1/projects/${projectId}`)).json()) as { facades: ApiFacade[] }).facades;

async function openEdit(page: Page) {
  await page.goto(`/projects/${projectId}/edit`);
  await expect(page.getByRole("button", { name: "Save changes" })).toBeEnabled();
  await page.waitForLoadState("networkidle");
}

test("a typical window and an overhang are saved, shown again and lower that façade's results", async ({ page }) => {
  test.setTimeout(90_000);
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const before = await southAnnual(page);
  await openEdit(page);
  const south = page.getByTestId("facade-row").first();
  const devices = south.getByTestId("shading-devices");
  // Without a typical window the devices do not count, and the form says so instead of offering them.
  await expect(devices.getByTestId("shading-needs-window")).toContainText("count only once the façade has a typical window (width and height)");
  await expect(devices.getByLabel("Overhang above")).toHaveCount(0);
  await south.getByLabel("Window width m").fill("1.5");
  await south.getByLabel("Window height m").fill("2");
  await devices.getByLabel("Overhang above").check();

  // A depth out of range is named in words, with the façade, before anything is sent.
  let patched = 0;
  page.on("request", (r) => {
    if (r.method() === "PATCH" && r.url().endsWith(`/api/v1/projects/${projectId}`)) patched++;
  });
  await devices.getByLabel("Overhang depth m").fill("80");
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(devices.getByText("Façade 1: overhang depth (m) must be between 0 and 50")).toBeVisible();
  expect(patched).toBe(0);

  await devices.getByLabel("Overhang depth m").fill("0.8");
  await devices.getByLabel("Gap above window m").fill("0.3");
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}$`));
  const saved = (await apiFacades(page)).find((f) => f.id === facadeIds.south)!;
  expect(saved).toMatchObject({ windowWidthM: 1.5, windowHeightM: 2, shading: { overhang: { depthM: 0.8, gapAboveM: 0.3 } } });
  // Left empty, the runs past each side are absent: an overhang that runs far past the window.
  expect(Object.keys((saved.shading as { overhang: object }).overhang).sort()).toEqual(["depthM", "gapAboveM"]);

  await openEdit(page);
  const again = page.getByTestId("facade-row").first().getByTestId("shading-devices");
  await expect(again.getByLabel("Overhang above")).toBeChecked();
  await expect(again.getByLabel("Overhang depth m")).toHaveValue("0.8");
  await expect(again.getByLabel("Gap above window m")).toHaveValue("0.3");
  await expect(again.getByLabel("Runs past left m")).toHaveValue("");
  await expect(again.getByLabel("Side fins")).not.toBeChecked();

  // The south façade's beam sun is partly shaded now (engine figures; estimates, not certified values).
  const after = await southAnnual(page);
  expect(after).toBeLessThan(before);
});

test("the form's messages name the fields in words, façade fields with their row", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await openEdit(page);
  await page.getByLabel("Latitude (°, north +)").fill("95");
  await page.getByTestId("facade-row").nth(1).getByLabel("Name").fill("");
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page.locator('[data-field="latitudeDeg"]')).toHaveText("Latitude (°) must be between -90 and 90");
  await expect(page.locator('[data-field="facades.1.name"]')).toHaveText("Façade 2: name is required");
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/edit$`));
});

test("removing a device sends it as absent", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await openEdit(page);
  const devices = page.getByTestId("facade-row").first().getByTestId("shading-devices");
  await devices.getByLabel("Side fins").check();
  await devices.getByLabel("Fin depth m").fill("0.4");
  await devices.getByLabel("Overhang above").uncheck();
  await expect(devices.getByLabel("Overhang depth m")).toHaveCount(0);
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}$`));
  const saved = (await apiFacades(page)).find((f) => f.id === facadeIds.south)!;
  expect(saved.shading).toEqual({ fins: { depthM: 0.4, gapM: 0 } });
});

test("removing a façade with options asks in the page, naming how many go with it", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await openEdit(page);
  page.on("dialog", () => {
    throw new Error("no browser pop-up is expected");
  });
  const rows = page.getByTestId("facade-row");
  await page.getByRole("button", { name: "Remove façade 2" }).click();
  const confirmation = page.getByTestId("remove-facade-confirmation");
  await expect(confirmation).toContainText("Remove façade 2 (East bay)? Its 2 glazing options go with it");
  // The safe answer has the focus; keeping the façade closes the question and changes nothing.
  await expect(confirmation.getByRole("button", { name: "Keep the façade" })).toBeFocused();
  await page.keyboard.press("Escape");
  await expect(confirmation).toHaveCount(0);
  await expect(rows).toHaveCount(2);
  await expect(page.getByRole("button", { name: "Remove façade 2" })).toBeFocused();

  await page.getByRole("button", { name: "Remove façade 2" }).click();
  await page.getByRole("button", { name: "Remove façade and its 2 options" }).click();
  await expect(rows).toHaveCount(1);
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}$`));
  const options = ((await (await page.request.get(`/api/v1/projects/${projectId}/options`)).json()) as { options: { facadeId: string }[] }).options;
  expect(options.map((o) => o.facadeId)).toEqual([facadeIds.south]);
  const history = (await (await page.request.get(`/api/v1/projects/${projectId}/history`)).json()) as { items: { summary: string }[] };
  expect(history.items.map((e) => e.summary)).toContain("Removed façade East bay with its 2 options");
});

test("the shading part fits 390 px and shows keyboard focus", async ({ browser }) => {
  const ctx = await browser.newContext({ viewport: { width: 390, height: 900 } });
  const page = await ctx.newPage();
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  await openEdit(page);
  const devices = page.getByTestId("facade-row").first().getByTestId("shading-devices");
  await devices.getByLabel("Overhang above").check();
  await devices.getByLabel("Horizon obstruction").check();
  await expect(devices.getByLabel("Runs past right m")).toBeVisible();
  await page.mouse.wheel(0, 4000);
  await page.waitForTimeout(300);
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBe(0);
  // Tab from the fin depth reaches the fin gap; the focused field draws its ring.
  await devices.getByLabel("Fin depth m").focus();
  await page.keyboard.press("Tab");
  const gap = devices.getByLabel("Gap from window edge m");
  await expect(gap).toBeFocused();
  const ring = await gap.evaluate((el) => getComputedStyle(el).boxShadow + " " + getComputedStyle(el).outlineStyle);
  expect(ring).not.toBe("none none");
  await ctx.close();
});
