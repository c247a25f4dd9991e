// Response headers and cross-origin writes, against the built server (scripts/server.mjs).
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { DEMO_ORGANIZATION, DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn } from "./helpers";

const origin = () => new URL(test.info().project.use.baseURL!).origin;

async function apiSignIn(request: APIRequestContext) {
  const res = await request.post("/api/auth/sign-in/email", {
    data: { email: demoUser("owner").email, password: DEMO_PASSWORD },
    headers: { origin: origin() },
  });
  expect(res.status()).toBe(200);
}

/** Collects Content-Security-Policy violations: the DOM event and the console messages chromium prints for them. */
async function watchCsp(page: Page): Promise<string[]> {
  const seen: string[] = [];
  await page.exposeFunction("__reportCspViolation", (text: string) => seen.push(text));
  await page.addInitScript(() => {
    document.addEventListener("securitypolicyviolation", (e) => {
      (window as unknown as { __reportCspViolation: (t: string) => void }).__reportCspViolation(
        `${e.violatedDirective} blocked ${e.blockedURI || "inline"} in ${e.sourceFile || e.documentURI}:${e.lineNumber}`,
      );
    });
  });
  page.on("console", (m) => {
    if (/content security policy/i.test(m.text())) seen.push(`console: ${m.text()}`);
  });
  return seen;
}

/** Brings every island into view (client:visible) and waits until none is left unhydrated. */
async function expectIslandsHydrated(page: Page) {
  const islands = page.locator("astro-island");
  const n = await islands.count();
  for (let i = 0; i < n; i++) await islands.nth(i).scrollIntoViewIfNeeded();
  await expect(page.locator("astro-island[ssr]")).toHaveCount(0);
  return n;
}

test("every main page renders under its Content-Security-Policy: no violations, islands hydrate", async ({ page }) => {
  const violations = await watchCsp(page);

  const visit = async (path: string) => {
    const res = await page.goto(path);
    expect(res!.status(), path).toBe(200);
    const csp = res!.headers()["content-security-policy"] ?? "";
    for (const directive of ["default-src 'self'", "object-src 'none'", "base-uri 'self'", "form-action 'self'", "frame-ancestors 'none'"]) {
      expect(csp, `${path}: ${directive}`).toContain(directive);
    }
    expect(csp, path).toMatch(/script-src 'self'( 'sha256-[A-Za-z0-9+/=]+')*;/);
    expect(csp, path).not.toContain("unsafe-inline");
    await page.waitForLoadState("load");
    const islands = await expectIslandsHydrated(page);
    expect(violations, `policy violations on ${path}`).toEqual([]);
    return islands;
  };

  await visit("/");
  expect(await visit("/signin")).toBeGreaterThan(0);
  expect(await visit("/signup")).toBeGreaterThan(0);
  await visit("/validation");

  await signIn(page, demoUser("owner").email, DEMO_PASSWORD);
  const list = await (await page.request.get("/api/v1/projects")).json();
  const projectId: string = list.organizations[0].projects.find((p: { name: string }) => p.name === DEMO_PROJECTS[0].name).id;
  for (const path of [
    "/dashboard",
    "/glazing",
    `/projects/${projectId}`,
    `/projects/${projectId}/sun`,
    `/projects/${projectId}/outbox`,
    `/orgs/${DEMO_ORGANIZATION.slug}/members`,
    `/orgs/${DEMO_ORGANIZATION.slug}/api-keys`,
  ]) {
    expect(await visit(path), path).toBeGreaterThan(0);
  }
  // The sun page: its chart with the coloured legend, and a year's heat map drawn by the island.
  await page.goto(`/projects/${projectId}/sun`);
  await expectIslandsHydrated(page);
  await expect(page.locator("figure ul li svg [fill]").first()).toBeVisible();
  await page.getByRole("button", { name: "Calculate the year" }).click();
  await expect(page.getByTestId("heatmap").first()).toBeVisible({ timeout: 20_000 });

  expect(violations).toEqual([]);
});

test("every kind of response carries nosniff and the other base headers", async ({ request }) => {
  const html = await (await request.get("/signin")).text();
  const script = /component-url="(\/_astro\/[^"]+\.js)"/.exec(html)?.[1];
  const stylesheet = /<link[^>]+href="(\/_astro\/[^"]+\.css)"/.exec(html)?.[1];
  expect(script, "a built script on /signin").toBeTruthy();
  expect(stylesheet, "a built stylesheet on /signin").toBeTruthy();
  const css = await (await request.get(stylesheet!)).text();
  const font = /url\((\/_astro\/[^)]+\.woff2)\)/.exec(css)?.[1];
  expect(font, "a font in the stylesheet").toBeTruthy();

  const cases: [string, string, number][] = [
    ["page", "/signin", 200],
    ["redirect", "/dashboard", 303],
    ["404 page", "/no-such-page", 404],
    ["API", "/api/v1/me", 401],
    ["API 404", "/api/v1/no-such-endpoint", 401],
    ["auth route", "/api/auth/get-session", 200],
    ["health", "/api/health", 200],
    ["static script", script!, 200],
    ["static stylesheet", stylesheet!, 200],
    ["static font", font!, 200],
    ["favicon", "/favicon.svg", 200],
    ["missing static file", "/_astro/no-such-file.js", 404],
  ];
  for (const [kind, path, status] of cases) {
    const res = await request.get(path, { maxRedirects: 0 });
    expect(res.status(), `${kind} ${path}`).toBe(status);
    const h = res.headers();
    expect(h["x-content-type-options"], `${kind} ${path}`).toBe("nosniff");
    expect(h["referrer-policy"], `${kind} ${path}`).toBe("same-origin");
    expect(h["cross-origin-opener-policy"], `${kind} ${path}`).toBe("same-origin");
    expect(h["permissions-policy"], `${kind} ${path}`).toContain("camera=()");
  }
});

test("API writes from another site are refused and change nothing; same-origin and header-less writes work", async ({ request }) => {
  await apiSignIn(request);
  const me = await (await request.get("/api/v1/me")).json();
  const organizationId: string = me.memberships[0].organizationId;
  const tag = Date.now().toString(36);
  const body = (name: string) => ({ organizationId, name, siteName: "Test site", latitudeDeg: 51.5, longitudeDeg: -0.1, timeZone: "Europe/London" });
  const names = async () =>
    ((await (await request.get("/api/v1/projects")).json()).organizations as { projects: { id: string; name: string }[] }[]).flatMap(
      (o) => o.projects,
    );

  const refused: [string, Record<string, string>][] = [
    ["foreign Origin", { origin: "http://evil.example" }],
    ["opaque Origin", { origin: "null" }],
    ["cross-site fetch", { "sec-fetch-site": "cross-site" }],
    ["same-site fetch", { "sec-fetch-site": "same-site", origin: origin() }],
    ["foreign Origin with same-origin claim", { "sec-fetch-site": "same-origin", origin: "http://evil.example" }],
  ];
  for (const [kind, headers] of refused) {
    const res = await request.post("/api/v1/projects", { data: body(`Cross ${kind} ${tag}`), headers });
    expect(res.status(), kind).toBe(403);
    expect(res.headers()["content-type"]).toContain("application/problem+json");
    expect((await res.json()).detail, kind).toMatch(/cross-site request refused/i);
  }
  expect((await names()).filter((p) => p.name.endsWith(tag))).toEqual([]);

  const same = await request.post("/api/v1/projects", {
    data: body(`Same origin ${tag}`),
    headers: { origin: origin(), "sec-fetch-site": "same-origin" },
  });
  expect(same.status()).toBe(201);
  const created = (await same.json()).project as { id: string };

  const rename = await request.patch(`/api/v1/projects/${created.id}`, {
    data: { name: "Renamed from elsewhere" },
    headers: { origin: "http://evil.example" },
  });
  expect(rename.status()).toBe(403);
  const del = await request.delete(`/api/v1/projects/${created.id}`, { headers: { "sec-fetch-site": "cross-site" } });
  expect(del.status()).toBe(403);
  expect((await names()).find((p) => p.id === created.id)?.name).toBe(`Same origin ${tag}`);

  // No Origin and no Sec-Fetch-Site: a script or curl, not a browser page; the session decides.
  const plain = await request.patch(`/api/v1/projects/${created.id}`, { data: { name: `Renamed ${tag}` } });
  expect(plain.status()).toBe(200);
  expect((await request.delete(`/api/v1/projects/${created.id}`, { headers: { origin: origin() } })).status()).toBeLessThan(300);
});

test("text answers are compressed as the client accepts; workbooks go out as they are", async ({ request }) => {
  for (const encoding of ["br", "gzip"]) {
    const res = await fetch(`${origin()}/docs/api`, { headers: { "accept-encoding": encoding } });
    expect(res.headers.get("content-encoding"), encoding).toBe(encoding);
    expect(res.headers.get("vary")).toMatch(/accept-encoding/i);
    expect(res.headers.get("content-security-policy")).toContain("frame-ancestors 'none'");
    expect(await res.text()).toContain("Paneray API reference");
  }
  const plain = await fetch(`${origin()}/api/v1/openapi.json`, { headers: { "accept-encoding": "identity" } });
  expect(plain.headers.get("content-encoding")).toBeNull();
  expect((await plain.json()).openapi).toBe("3.1.0");

  await apiSignIn(request);
  const projects = (await (await request.get("/api/v1/projects")).json()) as { organizations: { projects: { id: string; name: string }[] }[] };
  const id = projects.organizations[0]!.projects.find((p) => p.name === DEMO_PROJECTS[0].name)!.id;
  const book = await request.get(`/api/v1/projects/${id}/workbook?revision=A`, { headers: { "accept-encoding": "br, gzip" } });
  expect(book.status()).toBe(200);
  expect(book.headers()["content-encoding"]).toBeUndefined();
  expect((await book.body()).subarray(0, 2).toString()).toBe("PK"); // a zip file, as sent
});
