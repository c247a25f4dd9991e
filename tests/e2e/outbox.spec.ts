// The outbox in the browser: a consultant sends revision A of the demo project to its client and a typed address,
// sees the delivery reach "Sent", and the message arrives in the SMTP fake's store with the workbook the outbox
// offers for download. The page stays within 390 px.
import { expect, test } from "@playwright/test";
import { createHash } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser, signIn, uniqueEmail } from "./helpers";

async function mailTo(address: string, timeoutMs = 20_000): Promise<ParsedMail> {
  const dir = process.env.MAIL_DIR;
  if (!dir) throw new Error("MAIL_DIR is not set: run the tests through npm test (or start scripts/smtp-fake.mjs and set it)");
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    for (const f of readdirSync(dir).filter((x) => x.endsWith(".eml"))) {
      const mail = await simpleParser(readFileSync(join(dir, f)));
      const to = [mail.to]
        .flat()
        .flatMap((a) => a?.value ?? [])
        .map((v) => v.address?.toLowerCase());
      if (to.includes(address.toLowerCase())) return mail;
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${address} within ${timeoutMs} ms`);
}

test("a consultant sends revision A from the outbox and sees it sent", async ({ page }) => {
  test.setTimeout(60_000);
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, demoUser("consultant").email, DEMO_PASSWORD);
  const list = await (await page.request.get("/api/v1/projects")).json();
  const projectId: string = list.organizations[0].projects.find((p: { name: string }) => p.name === DEMO_PROJECTS[0].name).id;

  await page.goto(`/projects/${projectId}`);
  await page.getByRole("link", { name: "Outbox" }).click();
  await expect(page).toHaveURL(new RegExp(`/projects/${projectId}/outbox$`));
  await expect(page.getByRole("heading", { name: "Send a workbook" })).toBeVisible();

  // The form checks with the endpoint's schema before anything is sent.
  await page.getByRole("button", { name: "Send workbook" }).click();
  await expect(page.getByText("Name at least one recipient")).toBeVisible();
  await page.getByLabel("Other addresses").fill("not-an-address");
  await page.getByRole("button", { name: "Send workbook" }).click();
  await expect(page.getByText(/Address 1: .*not a valid e-mail address/)).toBeVisible();

  const typed = uniqueEmail("outbox-design-lead");
  await page.getByLabel("Revision").selectOption("A");
  await page.getByRole("checkbox", { name: /Jonah Pell/ }).check();
  await page.getByLabel("Other addresses").fill(typed);
  await page.getByLabel("Message (optional)").fill("Revision A of the glazing schedule, as discussed on site.");
  await page.getByRole("button", { name: "Send workbook" }).click();
  await expect(page.getByText(/Revision A is queued for 2 recipient/)).toBeVisible();

  const row = page.locator("tr[data-delivery]", { hasText: typed }).first();
  await expect(row).toBeVisible();
  await expect(row.getByText("Sent", { exact: true })).toBeVisible({ timeout: 30_000 });
  await expect(row).toContainText(demoUser("client").email);
  expect(await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)).toBe(0);

  // The message arrived with the very file the outbox offers.
  const mail = await mailTo(typed);
  expect(mail.text).toContain("as discussed on site");
  expect(mail.attachments).toHaveLength(1);
  const link = row.getByRole("link", { name: /\.xlsx$/ });
  const href = await link.getAttribute("href");
  const download = await page.request.get(href!);
  expect(download.status()).toBe(200);
  const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");
  expect(sha(await download.body())).toBe(sha(mail.attachments[0]!.content));
});
