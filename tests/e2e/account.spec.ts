// Sign-up founds an organisation; password reset by e-mail; a new project through the form.
import { expect, test } from "@playwright/test";
import { confirmEmail, signIn, uniqueEmail, waitForMail } from "./helpers";

test("sign-up creates an organisation with the new user as owner, who creates a project", async ({ page }) => {
  const email = uniqueEmail("founder");
  await page.goto("/signup");
  await page.getByLabel("Your name").fill("Oona Brask");
  await page.getByLabel("Work e-mail").fill(email);
  await page.getByLabel("Password").fill("short");
  await page.getByLabel("Your firm").fill("Brask Envelope Studio");
  await page.getByRole("button", { name: "Create account" }).click();
  await expect(page.locator('[data-field="password"]')).toContainText("at least 8");
  await page.getByLabel("Password").fill("a proper password");
  await page.getByRole("button", { name: "Create account" }).click();
  // The account is usable once the address is confirmed by the mailed link (which signs in).
  await expect(page.getByRole("status")).toContainText("Check your inbox");
  await confirmEmail(page, email);
  await expect(page).toHaveURL(/\/dashboard$/);
  await expect(page.getByRole("heading", { name: "Brask Envelope Studio" })).toBeVisible();
  await expect(page.getByTestId("role-badge")).toHaveText("Owner");
  await expect(page.getByTestId("no-projects")).toBeVisible();

  await page.getByRole("link", { name: "New project" }).click();
  await page.getByLabel("Project name").fill("Harbour pavilion");
  await page.getByLabel("Site name").fill("Pier 3");
  await page.getByLabel("Latitude (°, north +)").fill("-41.29");
  await page.getByLabel("Longitude (°, east +)").fill("174.78");
  await page.getByLabel("Time zone").fill("Pacific/Auckland");
  // A bad azimuth is caught before anything is sent.
  await page.locator("#facades\\.1\\.azimuthDeg").fill("400");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.locator('[data-field="facades.1.azimuthDeg"]')).toContainText("between 0 and 360");
  await page.locator("#facades\\.1\\.azimuthDeg").fill("100");
  await page.getByRole("button", { name: "Create project" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Harbour pavilion" })).toBeVisible();
  await expect(page.getByTestId("facade-table").locator("tbody tr")).toHaveCount(4);
  await expect(page.getByTestId("facade-table")).toContainText("100°");
  await expect(page.getByText("41.2900° S")).toBeVisible();

  // Edit: drop a façade, rename the project.
  await page.getByRole("link", { name: "Edit project" }).click();
  await page.getByRole("button", { name: "Remove façade 4" }).click();
  await page.getByLabel("Project name").fill("Harbour pavilion (stage 2)");
  await page.getByRole("button", { name: "Save changes" }).click();
  await expect(page.getByRole("heading", { level: 1, name: "Harbour pavilion (stage 2)" })).toBeVisible();
  await expect(page.getByTestId("facade-table").locator("tbody tr")).toHaveCount(3);
});

test("password reset by e-mail", async ({ page, request }) => {
  const email = uniqueEmail("forgetful");
  expect(
    (
      await request.post("/api/v1/signup", { data: { name: "Pim Forde", email, password: "old password 1", organizationName: "Forde Glass" } })
    ).status(),
  ).toBe(201);
  await confirmEmail(request, email);

  await page.goto("/signin");
  await page.getByRole("link", { name: "Forgot your password?" }).click();
  await page.getByLabel("E-mail").fill(email);
  await page.getByRole("button", { name: "Send me a reset link" }).click();
  await expect(page.getByRole("status")).toContainText("If an account exists");

  const { mail, link } = await waitForMail(email, { subject: /reset/i });
  expect(mail.subject).toMatch(/reset/i);
  await page.goto(link);
  await expect(page).toHaveURL(/\/reset-password\?token=/);
  await page.getByLabel("New password", { exact: true }).fill("new password 2");
  await page.getByLabel("Repeat the new password").fill("new password 2");
  await page.getByRole("button", { name: "Set new password" }).click();
  await expect(page.getByRole("status")).toContainText("Your password has been changed");

  await signIn(page, email, "new password 2");
  // The link works once only.
  await page.goto(link);
  await expect(page.getByRole("alert")).toContainText(/invalid or has expired/);
});
