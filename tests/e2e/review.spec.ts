// Review in the browser: the architect comments on options and approves one per façade, the consultant replies,
// and a client of a shared project reaches neither the review nor the history, as pages or through the API.
import { expect, test } from "@playwright/test";
import pg from "pg";
import { call, signInDemo, type Caller } from "./api-actors";
import { demoUser, DEMO_PASSWORD, signIn } from "./helpers";
import { insertOption, removeMakeups } from "./review-fixtures";

let db: pg.Client;
let consultant: Caller;
let projectId: string;
const options: Record<string, string> = {};
const makeups: string[] = [];

test.beforeAll(async () => {
  db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  consultant = await signInDemo("consultant");
  const owner = await signInDemo("owner");
  const me = (await call(owner, "GET", "/api/v1/me")).body as { memberships: { organizationId: string }[] };
  const orgId = me.memberships[0]!.organizationId;
  const res = await call(consultant, "POST", "/api/v1/projects", {
    organizationId: orgId,
    name: "Review walk-through",
    siteName: "Quay plot",
    latitudeDeg: 53.35,
    longitudeDeg: -6.26,
    timeZone: "Europe/Dublin",
    facades: [
      { name: "South", azimuthDeg: 180 },
      { name: "West", azimuthDeg: 270 },
    ],
  });
  expect(res.status, res.text).toBe(201);
  projectId = (res.body as { project: { id: string } }).project.id;
  const members = (await call(owner, "GET", `/api/v1/orgs/${orgId}/members`)).body as { members: { memberId: string; role: string }[] };
  const share = await call(consultant, "POST", `/api/v1/projects/${projectId}/shares`, {
    memberId: members.members.find((m) => m.role === "client")!.memberId,
  });
  expect(share.status).toBe(201);
  const facades = (await db.query("select id, name from facade where project_id = $1 order by position", [projectId])).rows as {
    id: string;
    name: string;
  }[];
  for (const f of facades)
    for (const n of ["A", "B"]) {
      const o = await insertOption(db, projectId, `${f.name} ${n}`, f.id);
      options[`${f.name} ${n}`] = o.optionId;
      makeups.push(o.makeupId);
    }
});

test.afterAll(async () => {
  if (projectId) await call(consultant, "DELETE", `/api/v1/projects/${projectId}`);
  await removeMakeups(db, makeups);
  await db?.end();
});

const card = (page: import("@playwright/test").Page, name: string) => page.locator(`article[data-option="${options[name]}"]`);

test("the architect comments and approves one option per façade; the consultant replies", async ({ page, browser }) => {
  await signIn(page, demoUser("architect").email, DEMO_PASSWORD);
  await page.goto(`/projects/${projectId}/review`);
  const southA = card(page, "South A");
  await southA.getByLabel("New comment").fill("Is the g-value low enough for the south façade?");
  await southA.getByRole("button", { name: "Comment" }).click();
  await expect(southA.getByText("Is the g-value low enough for the south façade?")).toBeVisible();

  // An empty comment is refused in words, not by the browser.
  await southA.getByRole("button", { name: "Comment" }).click();
  await expect(southA.getByRole("alert")).toHaveText("Comment is required");

  await southA.getByRole("button", { name: "Approve" }).click();
  await expect(southA.getByTestId("option-status")).toHaveText("Approved");
  const southB = card(page, "South B");
  await southB.getByLabel("Note with the decision (optional)").fill("Better daylight");
  await southB.getByRole("button", { name: "Approve" }).click();
  await expect(southB.getByRole("status")).toContainText("“South A” is no longer approved");
  await card(page, "West A").getByRole("button", { name: "Approve" }).click();
  await expect(card(page, "West A").getByTestId("option-status")).toHaveText("Approved");
  await card(page, "West B").getByRole("button", { name: "Reject" }).click();
  await expect(card(page, "West B").getByTestId("option-status")).toHaveText("Rejected");

  const statuses = (await db.query("select name, status from facade_option where project_id = $1 order by name", [projectId])).rows;
  expect(statuses).toEqual([
    { name: "South A", status: "proposed" },
    { name: "South B", status: "approved" },
    { name: "West A", status: "approved" },
    { name: "West B", status: "rejected" },
  ]);

  const ctx = await browser.newContext();
  const cpage = await ctx.newPage();
  await signIn(cpage, demoUser("consultant").email, DEMO_PASSWORD);
  await cpage.goto(`/projects/${projectId}/review`);
  const a = card(cpage, "South A");
  await expect(a.getByRole("button", { name: "Approve" })).toHaveCount(0);
  await a.getByRole("button", { name: "Reply" }).click();
  await a.getByLabel("Reply to Mara Okafor").fill("0.38 against the brief's 0.40.");
  await a.getByRole("button", { name: "Reply" }).click();
  await expect(a.getByText("0.38 against the brief's 0.40.")).toBeVisible();
  const thread = (await call(consultant, "GET", `/api/v1/options/${options["South A"]}/comments`)).body as {
    comments: { parentId: string | null }[];
  };
  expect(thread.comments.map((c) => c.parentId === null)).toEqual([true, false]);

  await cpage.goto(`/projects/${projectId}/history`);
  await expect(cpage.getByRole("cell", { name: "Approved “South B” for South (replacing “South A”)" })).toBeVisible();
  await ctx.close();
});

test("a client of the shared project reaches no draft, as a page or through the API", async ({ page }) => {
  await signIn(page, demoUser("client").email, DEMO_PASSWORD);
  for (const path of ["review", "history"]) {
    const res = await page.goto(`/projects/${projectId}/${path}`);
    expect(res?.status(), path).toBe(403);
  }
  const client = await signInDemo("client");
  const o = options["South A"]!;
  expect((await call(client, "GET", `/api/v1/options/${o}/comments`)).status).toBe(403);
  expect((await call(client, "POST", `/api/v1/options/${o}/comments`, { body: "Hello" })).status).toBe(403);
  expect((await call(client, "POST", `/api/v1/options/${o}/decision`, { decision: "approved" })).status).toBe(403);
  expect((await call(client, "GET", `/api/v1/projects/${projectId}/history`)).status).toBe(403);
});
