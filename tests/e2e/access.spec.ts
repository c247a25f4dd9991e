// Role checks run on the server: pages answer 403/404 and the API 401/403, whatever the UI shows.
import { expect, test, type APIRequestContext } from "@playwright/test";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn } from "./helpers";

async function apiSignIn(request: APIRequestContext, role: "owner" | "consultant" | "architect" | "client") {
  // With a session cookie already set, better-auth requires a matching Origin (as a browser sends).
  const res = await request.post("/api/auth/sign-in/email", {
    data: { email: demoUser(role).email, password: DEMO_PASSWORD },
    headers: { origin: new URL(test.info().project.use.baseURL!).origin },
  });
  expect(res.status()).toBe(200);
}

async function demoOrgId(request: APIRequestContext): Promise<string> {
  const me = await (await request.get("/api/v1/me")).json();
  return me.memberships[0].organizationId;
}

test("anonymous API calls get 401 problem+json", async ({ request }) => {
  for (const [method, path] of [
    ["GET", "/api/v1/projects"],
    ["POST", "/api/v1/projects"],
    ["GET", "/api/v1/me"],
    ["PATCH", "/api/v1/projects/abc"],
    ["GET", "/api/v1/orgs/abc/members"],
    ["POST", "/api/v1/invitations/abc/accept"],
  ] as const) {
    const res = await request.fetch(path, { method, data: method === "GET" ? undefined : {} });
    expect(res.status(), `${method} ${path}`).toBe(401);
    expect(res.headers()["content-type"]).toContain("application/problem+json");
    expect((await res.json()).detail).toMatch(/sign in/i);
  }
});

test("anonymous pages redirect to sign-in", async ({ page }) => {
  for (const path of ["/dashboard", "/projects/new", "/orgs/x/members"]) {
    await page.goto(path);
    await expect(page).toHaveURL(new RegExp(`/signin\\?next=${encodeURIComponent(path)}$`));
  }
});

test("a client gets 403 from the consultant-only page and API route", async ({ page, request }) => {
  await signIn(page, demoUser("client").email, DEMO_PASSWORD);
  const res = await page.goto("/projects/new");
  expect(res!.status()).toBe(403);
  await expect(page.getByTestId("forbidden")).toBeVisible();

  await apiSignIn(request, "client");
  const orgId = await demoOrgId(request);
  const create = await request.post("/api/v1/projects", {
    data: { organizationId: orgId, name: "Sneaky", siteName: "x", latitudeDeg: 0, longitudeDeg: 0, timeZone: "UTC" },
  });
  expect(create.status()).toBe(403);
  expect((await create.json()).detail).toMatch(/client/);

  // Members are the owner's business.
  expect((await request.get(`/api/v1/orgs/${orgId}/members`)).status()).toBe(403);
  expect((await request.post(`/api/v1/orgs/${orgId}/invitations`, { data: { email: "a@b.example", role: "owner" } })).status()).toBe(403);
});

test("a client cannot see a project that was not shared with them", async ({ request }) => {
  await apiSignIn(request, "consultant");
  const list = await (await request.get("/api/v1/projects")).json();
  const unshared = list.organizations[0].projects.find((p: { name: string }) => p.name === DEMO_PROJECTS.find((d) => !d.sharedWithClient)!.name);
  expect(unshared).toBeTruthy();

  await apiSignIn(request, "client");
  expect((await request.get(`/api/v1/projects/${unshared.id}`)).status()).toBe(404);
  expect((await request.patch(`/api/v1/projects/${unshared.id}`, { data: { name: "x" } })).status()).toBe(404);
});

test("an architect reads projects but cannot edit, delete or manage members", async ({ page, request }) => {
  await apiSignIn(request, "architect");
  const list = await (await request.get("/api/v1/projects")).json();
  const p = list.organizations[0].projects[0];
  expect((await request.get(`/api/v1/projects/${p.id}`)).status()).toBe(200);
  expect((await request.patch(`/api/v1/projects/${p.id}`, { data: { name: "Renamed" } })).status()).toBe(403);
  expect((await request.delete(`/api/v1/projects/${p.id}`)).status()).toBe(403);
  expect((await (await request.get(`/api/v1/projects/${p.id}`)).json()).project.name).toBe(p.name);

  await signIn(page, demoUser("architect").email, DEMO_PASSWORD);
  expect((await page.goto(`/projects/${p.id}/edit`))!.status()).toBe(403);
  expect((await page.goto("/orgs/halden-facade-partners/members"))!.status()).toBe(403);
});

test("bad input is answered 400/413/415 naming the field, never 500", async ({ request }) => {
  await apiSignIn(request, "consultant");
  const orgId = await demoOrgId(request);
  const good = { organizationId: orgId, name: "Probe", siteName: "x", latitudeDeg: 10, longitudeDeg: 10, timeZone: "UTC" };

  const cases: [unknown, string][] = [
    [{ ...good, latitudeDeg: 95 }, "latitudeDeg"],
    [{ ...good, latitudeDeg: "north" }, "latitudeDeg"],
    [{ ...good, timeZone: "Atlantis/Capital" }, "timeZone"],
    [{ ...good, name: "" }, "name"],
    [{ ...good, facades: [{ name: "N", azimuthDeg: -5 }] }, "facades[0].azimuthDeg"],
    [{ ...good, facades: "all of them" }, "facades"],
    [[], "(body)"],
  ];
  for (const [body, field] of cases) {
    const res = await request.post("/api/v1/projects", { data: body as object });
    expect(res.status(), JSON.stringify(body)).toBe(400);
    const problem = await res.json();
    expect(problem.errors.map((e: { field: string }) => e.field)).toContain(field);
    expect(problem.detail).toContain(field);
  }
  const malformed = await request.post("/api/v1/projects", { headers: { "content-type": "application/json" }, data: "{not json" });
  expect(malformed.status()).toBe(400);
  const huge = await request.post("/api/v1/projects", { data: { ...good, description: "x".repeat(400_000) } });
  expect(huge.status()).toBe(413);
  // (Without an Origin header Astro refuses any form post as cross-site, 403, before our handler.)
  const form = await request.post("/api/v1/projects", { form: { name: "x" }, headers: { origin: new URL(test.info().project.use.baseURL!).origin } });
  expect(form.status()).toBe(415);
  expect((await request.get("/api/v1/projects/%20%3Cscript%3E")).status()).toBe(404);

  // Nothing above was saved.
  const list = await (await request.get("/api/v1/projects")).json();
  expect(list.organizations[0].projects.some((p: { name: string }) => p.name === "Probe")).toBe(false);
});

test("health answers 200 with the database status", async ({ request }) => {
  const res = await request.get("/api/health");
  expect(res.status()).toBe(200);
  expect(await res.json()).toMatchObject({ status: "ok", database: "up" });
});
