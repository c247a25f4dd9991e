// Unknown addresses and refused pages answer with Paneray's own not-found and forbidden pages,
// the right status and its reason phrase, and a way back.
import { expect, test } from "@playwright/test";
import { confirmEmail, DEMO_PASSWORD, demoUser, signIn, uniqueEmail } from "./helpers";

test("an unknown address answers 404 Not Found with the branded page and a link home", async ({ page }) => {
  const res = await page.goto("/no-such-page/anywhere");
  expect(res!.status()).toBe(404);
  expect(res!.statusText()).toBe("Not Found");
  await expect(page.getByTestId("not-found")).toBeVisible();
  await expect(page.getByRole("link", { name: "Paneray home" })).toBeVisible();
  const back = page.getByTestId("back-link");
  await expect(back).toHaveAttribute("href", "/");
  await back.click();
  await expect(page).toHaveURL(/\/$/);
});

test("signed in, the not-found page links back to the dashboard", async ({ page }) => {
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const res = await page.goto("/definitely/not/here");
  expect(res!.status()).toBe(404);
  expect(res!.statusText()).toBe("Not Found");
  await expect(page.getByTestId("back-link")).toHaveAttribute("href", "/dashboard");
  await expect(page.getByTestId("signed-in-as")).toBeVisible();
});

test("a client opening the new-project page gets 403 Forbidden naming the role", async ({ page }) => {
  await signIn(page, demoUser("client").email, DEMO_PASSWORD);
  const res = await page.goto("/projects/new");
  expect(res!.status()).toBe(403);
  expect(res!.statusText()).toBe("Forbidden");
  await expect(page.getByTestId("forbidden")).toBeVisible();
  await expect(page.getByTestId("refusal-reason")).toContainText("client");
  await expect(page.getByTestId("back-link")).toHaveAttribute("href", "/dashboard");
});

test("a project of another organisation answers 404 Not Found with the branded page", async ({ page, playwright }) => {
  const baseURL = test.info().project.use.baseURL!;
  const stranger = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { origin: new URL(baseURL).origin } });
  const strangerEmail = uniqueEmail("stranger");
  const signup = await stranger.post("/api/v1/signup", {
    data: { name: "Rui Stranger", email: strangerEmail, password: "stranger password", organizationName: "Elsewhere Glass" },
  });
  expect(signup.status()).toBe(201);
  await confirmEmail(stranger, strangerEmail);
  const { memberships } = (await (await stranger.get("/api/v1/me")).json()) as { memberships: { organizationId: string }[] };
  const { organizationId } = memberships[0]!;
  const created = await stranger.post("/api/v1/projects", {
    data: { organizationId, name: "Private tower", siteName: "Plot 1", latitudeDeg: 38.7, longitudeDeg: -9.1, timeZone: "Europe/Lisbon" },
  });
  expect(created.status()).toBe(201);
  const { project } = await created.json();
  await stranger.dispose();

  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  for (const path of [`/projects/${project.id}`, `/projects/${project.id}/edit`, `/projects/${project.id}/sun`]) {
    const res = await page.goto(path);
    expect(res!.status(), path).toBe(404);
    expect(res!.statusText(), path).toBe("Not Found");
    await expect(page.getByTestId("not-found")).toBeVisible();
    await expect(page.getByText("Private tower")).toHaveCount(0);
  }
});

test("an architect opening the members page gets 403 Forbidden; an unknown organisation 404", async ({ page }) => {
  await signIn(page, demoUser("architect").email, DEMO_PASSWORD);
  const res = await page.goto("/orgs/halden-facade-partners/members");
  expect(res!.status()).toBe(403);
  expect(res!.statusText()).toBe("Forbidden");
  await expect(page.getByTestId("forbidden")).toBeVisible();
  const missing = await page.goto("/orgs/no-such-organisation/members");
  expect(missing!.status()).toBe(404);
  expect(missing!.statusText()).toBe("Not Found");
  await expect(page.getByTestId("not-found")).toBeVisible();
});
