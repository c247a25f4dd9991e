// The built server against a PostgreSQL that is stopped (fast, then immediate) and restarted while
// concurrent writers create projects. The process must stay up, answer 503 problem+json with
// Retry-After within 2 s while the database is gone, keep every write it acknowledged, and serve
// again once the database is back, without a restart. Loopback only; every phase is bounded.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { DEMO_PASSWORD, demoUser } from "@/lib/demo-scenario";
import { signInCookie, sleep, startStack, waitFor, type Stack } from "./stack";

const WRITERS = 6;
const OUTAGE_MS = 3_000;
const ANSWER_BUDGET_MS = 2_000;
const RECOVERY_BUDGET_MS = 20_000;

interface Call {
  start: number;
  end: number;
  status: number; // 0: no HTTP answer at all (connection refused or reset, or timed out)
  retryAfter: string | null;
  contentType: string | null;
  name: string;
}

let stack: Stack | null = null;
let base = "";
let cookie = "";
let organizationId = "";
const calls: Call[] = [];
let writing = false;
let writers: Promise<void>[] = [];

async function request(path: string, init: RequestInit = {}): Promise<Response | null> {
  try {
    return await fetch(base + path, {
      ...init,
      redirect: "manual",
      headers: { origin: base, cookie, ...(init.headers as Record<string, string>) },
      signal: AbortSignal.timeout(8_000),
    });
  } catch {
    return null;
  }
}

async function writer(w: number) {
  for (let i = 0; writing; i++) {
    const name = `outage-w${w}-${i}`;
    const start = Date.now();
    const res = await request("/api/v1/projects", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({
        organizationId,
        name,
        siteName: "Loopback Yard",
        latitudeDeg: 52,
        longitudeDeg: 4,
        timeZone: "Europe/Amsterdam",
        facades: [{ name: "South", azimuthDeg: 180 }],
      }),
    });
    await res?.arrayBuffer().catch(() => {});
    calls.push({
      start,
      end: Date.now(),
      status: res?.status ?? 0,
      retryAfter: res?.headers.get("retry-after") ?? null,
      contentType: res?.headers.get("content-type") ?? null,
      name,
    });
    await sleep(res && res.status < 300 ? 10 : 100);
  }
}

beforeAll(async () => {
  stack = await startStack("paneray_fault");
  base = stack.base;
  cookie = await signInCookie(base, "consultant");
  const list = (await (await request("/api/v1/projects"))!.json()) as { organizations: { organizationId: string; role: string }[] };
  organizationId = list.organizations.find((o) => o.role === "consultant")!.organizationId;

  writing = true;
  writers = Array.from({ length: WRITERS }, (_, w) => writer(w));
}, 120_000);

afterAll(async () => {
  writing = false;
  await Promise.race([Promise.all(writers), sleep(10_000)]);
  await stack?.stop();
}, 30_000);

const alive = () => {
  const exited = stack!.exited();
  if (exited) throw new Error(`the server process exited (${JSON.stringify(exited)}); its last output:\n${stack!.log().slice(-3000)}`);
};

async function outageCycle(mode: "fast" | "immediate") {
  await sleep(1_500); // writers running against a healthy database
  alive();
  const before = calls.filter((c) => c.status === 201).length;
  expect(before).toBeGreaterThan(0);

  await stack!.pgDown(mode);
  const down = Date.now();

  // While the database is gone: the API, a page and the health report, each within the budget.
  await sleep(300);
  const t0 = Date.now();
  const list = await request("/api/v1/projects");
  const listMs = Date.now() - t0;
  const listBody = await list?.text();
  const t1 = Date.now();
  const page = await request("/dashboard");
  const pageMs = Date.now() - t1;
  const pageHtml = await page?.text();
  // An anonymous visitor (no session lookup) on a page whose loader reads the database.
  const invitation = await fetch(`${base}/invitations/00000000-0000-4000-8000-000000000000`, {
    redirect: "manual",
    signal: AbortSignal.timeout(8_000),
  }).catch(() => null);
  const invitationHtml = await invitation?.text();
  const health = await request("/api/health");
  const healthBody = await health?.text();
  const signIn = await request("/api/auth/sign-in/email", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify({ email: demoUser("consultant").email, password: DEMO_PASSWORD }),
  });
  await signIn?.arrayBuffer();
  await sleep(Math.max(0, OUTAGE_MS - (Date.now() - down)));
  const restart = Date.now();
  alive();
  const during = calls.filter((c) => c.start >= down && c.end <= restart);

  expect(list?.status).toBe(503);
  expect(list?.headers.get("content-type")).toMatch(/^application\/problem\+json/);
  expect(list?.headers.get("retry-after")).toMatch(/^\d+$/);
  expect(JSON.parse(listBody!)).toMatchObject({ status: 503 });
  expect(listMs).toBeLessThan(ANSWER_BUDGET_MS);

  expect(page?.status).toBe(503);
  expect(page?.headers.get("retry-after")).toMatch(/^\d+$/);
  expect(pageHtml).toContain('data-testid="unavailable"');
  expect(pageHtml).toContain("Paneray");
  expect(pageMs).toBeLessThan(ANSWER_BUDGET_MS);

  expect(invitation?.status).toBe(503);
  expect(invitationHtml).toContain('data-testid="unavailable"');

  expect(health?.status).toBe(503);
  expect(healthBody).not.toContain(String(stack!.pgPort));
  expect(healthBody).not.toContain("127.0.0.1");
  expect(healthBody).not.toContain("ECONNREFUSED");

  expect(signIn?.status).toBe(503);
  expect(signIn?.headers.get("retry-after")).toMatch(/^\d+$/);

  expect(during.length).toBeGreaterThan(0);
  for (const c of during) {
    expect({ name: c.name, status: c.status }).toEqual({ name: c.name, status: 503 });
    expect(c.retryAfter).toMatch(/^\d+$/);
    expect(c.contentType).toMatch(/^application\/problem\+json/);
    expect(c.end - c.start).toBeLessThan(ANSWER_BUDGET_MS);
  }

  await stack!.pgUp();
  const back = Date.now(); // pg_ctl start has returned: PostgreSQL accepts connections again
  await waitFor(async () => calls.some((c) => c.start > restart && c.status === 201), RECOVERY_BUDGET_MS, "a write acknowledged after the restart");
  alive();
  expect((await request("/api/health"))?.status).toBe(200);
  const firstAck = Math.min(...calls.filter((c) => c.start > restart && c.status === 201).map((c) => c.end));
  const slowest = Math.max(...during.map((c) => c.end - c.start));
  console.log(
    `[fault] ${mode} stop: ${during.length} writes answered 503 during the outage (slowest ${slowest} ms); ` +
      `first acknowledged write ${firstAck - restart} ms after the restart began (pg_ctl start took ${back - restart} ms)`,
  );
}

describe("database outage under write load (built server)", () => {
  it("stays up through a fast shutdown of PostgreSQL, answers 503 meanwhile and recovers", () => outageCycle("fast"), 45_000);

  it("stays up through an immediate shutdown of PostgreSQL, answers 503 meanwhile and recovers", () => outageCycle("immediate"), 45_000);

  it("answers every write with 201 or 503 and keeps every acknowledged one", async () => {
    await sleep(500);
    writing = false;
    await Promise.all(writers);
    alive();
    const statuses = new Set(calls.map((c) => c.status));
    expect([...statuses].sort()).toEqual([201, 503]);
    const acknowledged = calls.filter((c) => c.status === 201).map((c) => c.name);
    const client = new pg.Client({ connectionString: stack!.databaseUrl });
    await client.connect();
    try {
      const { rows } = await client.query<{ name: string }>("select name from project where name like 'outage-w%'");
      const stored = new Set(rows.map((r) => r.name));
      expect(acknowledged.filter((n) => !stored.has(n))).toEqual([]);
      console.log(`[fault] ${calls.length} writes in all; ${acknowledged.length} acknowledged, all of them stored (${stored.size} rows)`);
    } finally {
      await client.end();
    }
  }, 30_000);
});
