// Each demo role signs in through the browser and sees the dashboard its role should show.
import { expect, test } from "@playwright/test";
import { DEMO_ORGANIZATION, DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn } from "./helpers";

const shared = DEMO_PROJECTS.filter((p) => p.sharedWithClient).map((p) => p.name);
const all = DEMO_PROJECTS.map((p) => p.name);

const cases = [
  { role: "owner", badge: "Owner", projects: all, members: true, create: true },
  { role: "consultant", badge: "Consultant", projects: all, members: false, create: true },
  { role: "architect", badge: "Architect", projects: all, members: false, create: false },
  { role: "client", badge: "Client", projects: shared, members: false, create: false },
] as const;

for (const c of cases) {
  test(`${c.role} signs in and sees the ${c.role} dashboard`, async ({ page }) => {
    const u = demoUser(c.role);
    await signIn(page, u.email, DEMO_PASSWORD);
    await expect(page.getByTestId("signed-in-as")).toContainText(u.name);
    const org = page.getByTestId("organization");
    await expect(org.getByRole("heading", { name: DEMO_ORGANIZATION.name })).toBeVisible();
    await expect(org.getByTestId("role-badge")).toHaveText(c.badge);
    const names = await page.getByTestId("project-card").locator("a").allTextContents();
    expect(names.sort()).toEqual([...c.projects].sort());
    await expect(page.getByRole("link", { name: "Members" })).toHaveCount(c.members ? 1 : 0);
    await expect(page.getByRole("link", { name: "New project" })).toHaveCount(c.create ? 1 : 0);

    // The project page opens for every role that sees it, with its façades.
    await page.getByRole("link", { name: c.projects[0]! }).click();
    await expect(page.getByRole("heading", { level: 1, name: c.projects[0]! })).toBeVisible();
    await expect(page.getByTestId("facade-table").locator("tbody tr")).toHaveCount(
      DEMO_PROJECTS.find((p) => p.name === c.projects[0])!.facades.length,
    );
    await expect(page.getByRole("link", { name: "Edit project" })).toHaveCount(c.create ? 1 : 0);

    await page.getByRole("button", { name: "Sign out" }).click();
    await expect(page).toHaveURL(/\/signin$/);
    await page.goto("/dashboard");
    await expect(page).toHaveURL(/\/signin\?next=%2Fdashboard$/);
  });
}

test("a wrong password is refused with a message, and the page stays usable", async ({ page }) => {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(demoUser("owner").email);
  await page.getByLabel("Password").fill("not the password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert")).toContainText("Wrong e-mail or password");
  await expect(page).toHaveURL(/\/signin$/);
});

test("sign-in returns to the page that asked for it", async ({ page }) => {
  await page.goto("/projects/new");
  await expect(page).toHaveURL(/\/signin\?next=%2Fprojects%2Fnew$/);
  await page.getByLabel("E-mail").fill(demoUser("consultant").email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/projects\/new$/);
  await expect(page.getByRole("heading", { name: "New project" })).toBeVisible();
});
