// Invitation by e-mail: the owner invites, the message arrives in the SMTP fake, its link lets the invitee
// join with the invited role.
import { expect, test } from "@playwright/test";
import { confirmEmail, DEMO_ORGANIZATION, DEMO_PASSWORD, demoUser, signIn, uniqueEmail, waitForMail } from "./helpers";

test("an invited architect joins through the e-mailed link with the invited role", async ({ page, browser }) => {
  const invitee = uniqueEmail("new-architect");
  await signIn(page, demoUser("owner").email, DEMO_PASSWORD);
  await page.getByRole("link", { name: "Members" }).click();
  await page.getByLabel("E-mail").fill(invitee);
  await page.getByLabel("Role", { exact: true }).selectOption("architect");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("status")).toContainText(`Invitation sent to ${invitee}`);
  await expect(page.getByTestId("invitations")).toContainText(invitee);

  const { mail, link } = await waitForMail(invitee, { subject: /invited you/ });
  expect(mail.subject).toContain(DEMO_ORGANIZATION.name);
  expect(mail.text).toContain("as Architect");
  expect(link).toMatch(/\/invitations\/[A-Za-z0-9_-]+$/);

  // The invitee opens the link in a browser of their own.
  const ctx = await browser.newContext();
  const p2 = await ctx.newPage();
  await p2.goto(link);
  await expect(p2.getByRole("heading", { name: `Join ${DEMO_ORGANIZATION.name}` })).toBeVisible();
  await expect(p2.getByLabel("Work e-mail")).toHaveValue(invitee);
  await p2.getByLabel("Your name").fill("Noor Vale");
  await p2.getByLabel("Password").fill("a long new password");
  await p2.getByRole("button", { name: "Create account and join" }).click();
  await expect(p2).toHaveURL(/\/dashboard$/);
  await expect(p2.getByTestId("role-badge")).toHaveText("Architect");
  await expect(p2.getByTestId("project-card")).not.toHaveCount(0);

  // The link is spent.
  await p2.goto(link);
  await expect(p2.getByRole("alert")).toContainText("accepted");
  await ctx.close();

  // The owner now sees the new member, no longer as pending.
  await page.reload();
  await expect(page.getByTestId("members-table")).toContainText(invitee);
  await expect(page.getByText("Pending invitations").locator("..")).not.toContainText(invitee);
});

test("an existing user accepts an invitation after signing in", async ({ page, browser, request }) => {
  // Someone with an account of their own (their own firm)…
  const email = uniqueEmail("freelancer");
  const signup = await request.post("/api/v1/signup", {
    data: { name: "Ravi Lund", email, password: "freelance pw 1", organizationName: "Lund Daylighting" },
  });
  expect(signup.status()).toBe(201);
  await confirmEmail(request, email);

  // …is invited as a consultant.
  await signIn(page, demoUser("owner").email, DEMO_PASSWORD);
  await page.goto("/orgs/halden-facade-partners/members");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Role", { exact: true }).selectOption("consultant");
  await page.getByRole("button", { name: "Send invitation" }).click();
  await expect(page.getByRole("status")).toContainText("Invitation sent");
  const { link } = await waitForMail(email, { subject: /invited you/ });

  const ctx = await browser.newContext();
  const p2 = await ctx.newPage();
  await p2.goto(link);
  await p2.getByRole("link", { name: "Sign in to accept" }).click();
  await p2.getByLabel("E-mail").fill(email);
  await p2.getByLabel("Password").fill("freelance pw 1");
  await p2.getByRole("button", { name: "Sign in" }).click();
  await expect(p2).toHaveURL(/\/invitations\//);
  await p2.getByRole("button", { name: /Join .* as Consultant/ }).click();
  await expect(p2).toHaveURL(/\/dashboard$/);
  const badges = await p2.getByTestId("role-badge").allTextContents();
  expect(badges.sort()).toEqual(["Consultant", "Owner"]);
  await ctx.close();
});
