// The consultant's whole job in the browser, from scratch: two make-ups saved to the library from the
// composer, a new project with two façades, two options on each, the brief's requirements; the architect
// comments on and approves one option per façade; the consultant issues revision A; the client sees the
// issued schedule and none of the drafts. Figures on screen are checked against the API's; the main pages
// have no horizontal overflow at 390 px.
import { expect, test, type Browser, type Page } from "@playwright/test";
import type { OptionEntry } from "@/lib/contracts/options";
import { DEMO_PASSWORD, demoUser, signIn, overflow, smallestChartLabel } from "./helpers";

const stamp = Date.now().toString(36);
const CLEAR = `Browser clear double ${stamp}`;
const LOWE = `Browser low-e double ${stamp}`;
const PROJECT = `Browser workspace ${stamp}`;
let projectId = "";

async function as(browser: Browser, role: "consultant" | "architect" | "client", width = 1440): Promise<Page> {
  const ctx = await browser.newContext({ viewport: { width, height: 900 } });
  const page = await ctx.newPage();
  await signIn(page, demoUser(role).email, DEMO_PASSWORD);
  return page;
}

test.describe.configure({ mode: "serial" });

test.afterAll(async ({ browser }) => {
  const page = await as(browser, "consultant");
  if (projectId) await page.request.delete(`/api/v1/projects/${projectId}`);
  const lib = (await (await page.request.get(`/api/v1/orgs/${await orgId(page)}/makeups?limit=100`)).json()) as {
    items: { id: string; name: string }[];
  };
  for (const m of lib.items.filter((x) => x.name.endsWith(stamp))) await page.request.delete(`/api/v1/makeups/${m.id}`);
});

async function orgId(page: Page): Promise<string> {
  const me = (await (await page.request.get("/api/v1/me")).json()) as { memberships: { organizationId: string }[] };
  return me.memberships[0]!.organizationId;
}

test("the consultant saves two make-ups to the library from the composer", async ({ browser }) => {
  const page = await as(browser, "consultant");
  await page.goto("/glazing");
  // Typing into the form before its island is live would be lost when it hydrates.
  await expect(page.getByRole("button", { name: "Save to library" })).toBeEnabled();
  for (const [preset, name] of [
    ["Double clear 4 | 16 air | 4", CLEAR],
    ["Double 4 | 16 argon 90 % | 4 coated (face 3)", LOWE],
  ] as const) {
    await page.getByLabel("Start from").selectOption({ label: preset });
    await page.getByLabel("Name", { exact: true }).fill(name);
    await page.getByRole("button", { name: "Save to library" }).click();
    await expect(page.getByRole("status").filter({ hasText: `Saved “${name}” to the library (revision 1)` })).toBeVisible();
    await expect(page.getByTestId("open-makeup")).toContainText(name);
  }
  // The draft survives a reload, still tied to the saved make-up.
  await page.reload();
  await expect(page.getByTestId("open-makeup")).toContainText(LOWE);
  await expect(page.getByRole("button", { name: "Save as revision 2" })).toBeVisible();
  await page.goto("/library");
  await expect(page.getByTestId("library-table")).toContainText(CLEAR);
  await expect(page.getByTestId("library-table")).toContainText(LOWE);
});

test("the consultant builds a project with two façades, two options each and the brief's requirements", async ({ browser }) => {
  const page = await as(browser, "consultant");
  await page.goto("/projects/new");
  await page.getByLabel("Project name").fill(PROJECT);
  await page.getByLabel("Site name").fill("Browser quay");
  await page.getByLabel("Latitude (°, north +)").fill("41.15");
  await page.getByLabel("Longitude (°, east +)").fill("-8.61");
  await page.getByLabel("Time zone").fill("Europe/Lisbon");
  await page.getByRole("button", { name: "Remove façade 4" }).click();
  await page.getByRole("button", { name: "Remove façade 3" }).click();
  // The plan follows the form: two façades, the second turned to face south-east.
  const plan = page.getByTestId("facade-plan");
  await expect(plan.locator("g[data-facade]")).toHaveCount(2);
  await page.locator("#facades\\.1\\.azimuthDeg").fill("135");
  await expect(plan.locator('g[data-facade="2"] title')).toHaveText(/135° SE/);
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { level: 1, name: PROJECT })).toBeVisible();
  projectId = page.url().split("/projects/")[1]!.split(/[/?#]/)[0]!;
  const cards = page.getByTestId("facade-options");
  await expect(cards).toHaveCount(2);
  for (const card of await cards.all()) {
    for (const makeup of [CLEAR, LOWE]) {
      const select = card.getByLabel("Make-up from the library");
      await select.selectOption((await select.locator("option", { hasText: makeup }).getAttribute("value"))!);
      await card.getByLabel("Option name").fill(makeup === CLEAR ? "A: clear" : "B: low-e");
      await card.getByRole("button", { name: "Add option" }).click();
      await expect(card.locator(`tr[data-option="${makeup === CLEAR ? "A: clear" : "B: low-e"}"]`)).toBeVisible();
    }
  }
  // The figures on screen are the stored revision's, as the API gives them.
  const api = (await (await page.request.get(`/api/v1/projects/${projectId}/options`)).json()) as { options: OptionEntry[] };
  expect(api.options).toHaveLength(4);
  const first = api.options[0]!;
  const row = cards.first().locator(`tr[data-option="${first.name}"]`);
  await expect(row.locator('[data-value="gValue"]')).toHaveText(first.values.normal.gValue.toFixed(2));
  await expect(row.locator('[data-value="uValue"]')).toHaveText(first.values.uValue.toFixed(2));

  // Requirements: a bad value is named in words, a good one is saved.
  await page.getByLabel("Whole project: Maximum g-value").fill("1.4");
  await page.getByRole("button", { name: "Save the requirements" }).click();
  await expect(page.getByText(/Whole project: Maximum g-value —/)).toBeVisible();
  await page.getByLabel("Whole project: Maximum g-value").fill("0.7");
  await page.getByRole("button", { name: "Save the requirements" }).click();
  await expect(page.getByRole("status").filter({ hasText: "Requirements saved" })).toBeVisible();
  await expect
    .poll(async () => ((await (await page.request.get(`/api/v1/projects/${projectId}/requirements`)).json()) as { version: number }).version)
    .toBe(1);
  await page.reload();
  await expect(page.getByLabel("Whole project: Maximum g-value")).toHaveValue("0.7");

  // Share with the demo client (who will see only what is issued).
  const shares = (await (await page.request.get(`/api/v1/projects/${projectId}/shares`)).json()) as { shares: { memberId: string; email: string }[] };
  const client = shares.shares.find((s) => s.email === demoUser("client").email)!;
  expect((await page.request.post(`/api/v1/projects/${projectId}/shares`, { data: { memberId: client.memberId } })).status()).toBe(201);
});

test("the architect comments and approves one option per façade; the consultant issues revision A", async ({ browser }) => {
  const architect = await as(browser, "architect");
  await architect.goto(`/projects/${projectId}`);
  await expect(architect.getByTestId("facade-options")).toHaveCount(2);
  // Architects review but do not assign options.
  await expect(architect.getByRole("button", { name: "Add option" })).toHaveCount(0);
  const options = ((await (await architect.request.get(`/api/v1/projects/${projectId}/options`)).json()) as { options: OptionEntry[] }).options;
  const lowE = options.filter((o) => o.name === "B: low-e");
  expect(lowE).toHaveLength(2);
  const comment = await architect.request.post(`/api/v1/options/${lowE[0]!.id}/comments`, { data: { body: "Low-e on both façades, please." } });
  expect(comment.status()).toBe(201);
  for (const o of lowE)
    expect((await architect.request.post(`/api/v1/options/${o.id}/decision`, { data: { decision: "approved" } })).status()).toBe(200);
  await architect.reload();
  for (const card of await architect.getByTestId("facade-options").all())
    await expect(card.locator('tr[data-option="B: low-e"]')).toContainText("Approved");

  const consultant = await as(browser, "consultant");
  await consultant.goto(`/projects/${projectId}/results`);
  await consultant.getByTestId("issue-open").click();
  await consultant.getByLabel("Note (optional)").fill("Issued from the browser workspace test");
  await consultant.getByTestId("issue-submit").click();
  await consultant.getByRole("link", { name: "Open revision A" }).click();
  await expect(consultant.getByTestId("revision-title")).toHaveText("Revision A");
});

test("the client sees revision A and none of the drafts", async ({ browser }) => {
  const page = await as(browser, "client");
  await page.goto(`/projects/${projectId}`);
  await expect(page.getByTestId("issued-revisions")).toContainText("Revision A");
  await expect(page.getByTestId("facade-options")).toHaveCount(0);
  await expect(page.getByText("Requirements of the brief")).toHaveCount(0);
  expect((await page.request.get(`/api/v1/projects/${projectId}/options`)).status()).toBe(403);
  expect((await page.request.get(`/api/v1/projects/${projectId}/requirements`)).status()).toBe(403);
  expect((await page.request.get(`/api/v1/projects/${projectId}/results`)).status()).toBe(403);
  expect((await page.goto(`/projects/${projectId}/results`))!.status()).toBe(403);
  await page.goto(`/projects/${projectId}`);
  await page.getByRole("link", { name: "Revision A" }).click();
  await expect(page.getByTestId("revision-title")).toHaveText("Revision A");
});

test("the workspace pages have no horizontal overflow at 390 px", async ({ browser }) => {
  const page = await as(browser, "consultant", 390);
  for (const path of [`/projects/${projectId}`, `/projects/${projectId}/edit`, "/projects/new", "/library", "/glazing", "/dashboard"]) {
    await page.goto(path);
    await page.mouse.wheel(0, 4000);
    await page.waitForTimeout(500);
    expect(await overflow(page), path).toBe(0);
  }
});

test("chart and drawing labels are at least 10 px at 390 px wide", async ({ browser }) => {
  const page = await as(browser, "consultant", 390);
  await page.goto("/glazing");
  await expect(page.getByTestId("g-normal")).toBeVisible();
  expect(await smallestChartLabel(page), "/glazing").toBeGreaterThanOrEqual(10);
  await page.goto(`/projects/${projectId}/sun`);
  await page.getByRole("button", { name: "Calculate the year" }).click();
  await expect(page.getByTestId("daily-profile").or(page.getByTestId("heatmap")).first()).toBeVisible();
  expect(await smallestChartLabel(page), "sun page").toBeGreaterThanOrEqual(10);
  await page.goto(`/projects/${projectId}/results`);
  await page.mouse.wheel(0, 4000);
  await page.waitForTimeout(500);
  expect(await smallestChartLabel(page), "results page").toBeGreaterThanOrEqual(10);
  await page.goto(`/projects/${projectId}/edit`);
  expect(await smallestChartLabel(page), "project form plan").toBeGreaterThanOrEqual(10);
});
