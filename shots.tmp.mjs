import { chromium } from "@playwright/test";
const base = "http://127.0.0.1:4321";
const browser = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--no-sandbox","--disable-gpu","--disable-background-networking","--disable-component-update","--no-first-run","--disable-quic","--disable-sync"] });
const [email, password, shots] = [process.argv[2], process.argv[3], process.argv.slice(4)];
for (const width of [1440, 390]) {
  const ctx = await browser.newContext({ viewport: { width, height: width === 390 ? 844 : 900 } });
  const page = await ctx.newPage();
  if (email) {
    await page.goto(base + "/signin");
    await page.getByLabel("E-mail").fill(email);
    await page.getByLabel("Password").fill(password);
    await page.getByRole("button", { name: /sign in/i }).click();
    await page.waitForURL(/dashboard/);
  }
  for (const s of shots) {
    const r = await page.goto(base + s);
    await page.waitForTimeout(800);
    const name = `/tmp/shot-${(email||"anon").split("@")[0]}-${s.replace(/\W+/g,"_")}-${width}.png`;
    await page.screenshot({ path: name, fullPage: true });
    console.log(r.status(), r.statusText(), name);
  }
  await ctx.close();
}
await browser.close();
