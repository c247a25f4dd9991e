import { expect, type APIRequestContext, type Page } from "@playwright/test";
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { simpleParser, type ParsedMail } from "mailparser";

export { DEMO_PASSWORD, demoUser, DEMO_PROJECTS, DEMO_ORGANIZATION } from "@/lib/demo-scenario";

export async function signIn(page: Page, email: string, password: string) {
  await page.goto("/signin");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/dashboard$/);
}

let n = 0;
export const uniqueEmail = (tag: string) => `${tag}-${Date.now().toString(36)}-${++n}@e2e.example`;

/**
 * Waits for a message to `to` (and, if given, with a subject matching `subject`) in the SMTP fake's folder
 * (MAIL_DIR) and returns the newest such message parsed, with the first link of its text part.
 */
export async function waitForMail(
  to: string,
  options: number | { subject?: RegExp; timeoutMs?: number } = {},
): Promise<{ mail: ParsedMail; link: string }> {
  const { subject, timeoutMs = 10_000 } = typeof options === "number" ? { timeoutMs: options } : options;
  const dir = process.env.MAIL_DIR;
  if (!dir) throw new Error("MAIL_DIR is not set: run the tests through npm test");
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    for (const f of readdirSync(dir)
      .filter((x) => x.endsWith(".eml"))
      .sort()
      .reverse()) {
      const mail = await simpleParser(readFileSync(join(dir, f)));
      const rcpt = [mail.to]
        .flat()
        .flatMap((a) => a?.value ?? [])
        .map((v) => v.address?.toLowerCase());
      if (rcpt.includes(to.toLowerCase()) && (!subject || subject.test(mail.subject ?? ""))) {
        const link = /https?:\/\/\S+/.exec(mail.text ?? "")?.[0];
        if (!link) throw new Error(`mail to ${to} has no link`);
        return { mail, link };
      }
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

export const CONFIRMATION_SUBJECT = /Confirm your e-mail address/;

/**
 * Follows the link of the sign-up confirmation mail to `email`: in a page (which ends signed in on the
 * dashboard) or through an API request context (whose cookies then carry the session).
 */
export async function confirmEmail(via: Page | APIRequestContext, email: string) {
  const { link } = await waitForMail(email, { subject: CONFIRMATION_SUBJECT });
  if ("goto" in via) await via.goto(link);
  else expect((await via.get(link)).ok()).toBe(true);
}

/** How far the page is wider than the window, px (0: no horizontal overflow). */
export const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);

/** The on-screen size of the smallest visible chart label of the page (SVG text scaled by its drawing), px. */
export const smallestChartLabel = (page: Page) =>
  page.evaluate(() => {
    let smallest = Infinity;
    for (const t of document.querySelectorAll<SVGTextElement>("main svg text")) {
      const m = t.getScreenCTM();
      if (!m || !t.textContent?.trim() || t.getBoundingClientRect().width === 0) continue;
      smallest = Math.min(smallest, Number.parseFloat(getComputedStyle(t).fontSize) * Math.hypot(m.a, m.b));
    }
    return smallest;
  });
