import { expect, test } from "@playwright/test";
import { confirmEmail, uniqueEmail } from "./helpers";

test("the dashboard shows 50 projects per organisation and a link to the next ones; a NUL name is refused", async ({ page, baseURL }) => {
  test.setTimeout(90_000);
  const headers = { origin: baseURL!, "content-type": "application/json" };
  const email = uniqueEmail("paging");
  const signup = await page.request.post("/api/v1/signup", {
    headers,
    data: { name: "Paging Owner", email, password: "long password", organizationName: "Paging Studio" },
  });
  expect(signup.status()).toBe(201);
  await confirmEmail(page, email); // the confirmation link signs the new owner in
  const { memberships } = (await (await page.request.get("/api/v1/me")).json()) as { memberships: { organizationId: string }[] };
  const { organizationId } = memberships[0]!;
  const project = (name: string) => ({
    organizationId,
    name,
    siteName: "Quay 2",
    latitudeDeg: 59.33,
    longitudeDeg: 18.07,
    timeZone: "Europe/Stockholm",
  });
  for (let i = 0; i < 53; i++) {
    const res = await page.request.post("/api/v1/projects", { headers, data: project(`Paged block ${i}`) });
    expect(res.status()).toBe(201);
  }

  const nul = await page.request.post("/api/v1/projects", { headers, data: project("Block\u0000") });
  expect(nul.status()).toBe(400);
  expect(((await nul.json()) as { errors: { field: string }[] }).errors.map((e) => e.field)).toEqual(["name"]);

  await page.goto("/dashboard");
  const org = page.getByTestId("organization").filter({ hasText: "Paging Studio" });
  await expect(org.getByTestId("project-card")).toHaveCount(50);
  await expect(org.getByTestId("project-card").first()).toContainText("Paged block 52");
  await org.getByTestId("more-projects").click();
  await expect(page).toHaveURL(/\/dashboard\?org=.+&cursor=.+/);
  await expect(org.getByTestId("project-card")).toHaveCount(3);
  await expect(org.getByTestId("project-card").last()).toContainText("Paged block 0");
  await expect(org.getByTestId("more-projects")).toHaveCount(0);
  await org.getByRole("link", { name: "Back to the latest projects" }).click();
  await expect(org.getByTestId("project-card")).toHaveCount(50);
});
