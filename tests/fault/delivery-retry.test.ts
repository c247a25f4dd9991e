// A delivery through a stopped SMTP server: the built server (its worker inside) answers 202, the job's
// attempts fail and are recorded (attempts > 1, the connection error as lastError) while the SMTP fake is down,
// and once the fake is back the queue's next retry delivers the message, which the fake stores. Own PostgreSQL,
// own ports, loopback only; every phase is bounded.
import { afterAll, beforeAll, expect, it } from "vitest";
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { randomBytes } from "node:crypto";
import { DEMO_PASSWORD, DEMO_PROJECTS, demoUser } from "@/lib/demo-scenario";
import { SERVER_NODE_FLAGS } from "@scripts/server-flags.mjs";

const run = promisify(execFile);
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

async function waitFor<T>(check: () => Promise<T | null | undefined | false>, budgetMs: number, what: string): Promise<T> {
  const until = Date.now() + budgetMs;
  while (Date.now() < until) {
    const v = await check();
    if (v) return v;
    await sleep(200);
  }
  throw new Error(`${what}: not within ${budgetMs} ms`);
}

let dir = "";
let base = "";
let cookie = "";
let smtpPort = 0;
let server: ChildProcess | null = null;
let fake: ChildProcess | null = null;
let log = "";

const mailDir = () => join(dir, "mail");

async function startFake() {
  fake = spawn("node", ["scripts/smtp-fake.mjs"], { env: { ...process.env, MAIL_DIR: mailDir(), SMTP_PORT: String(smtpPort) }, stdio: "ignore" });
  await waitFor(
    () =>
      new Promise<boolean>((resolve) => {
        const c = net.connect(smtpPort, "127.0.0.1");
        c.once("connect", () => (c.end(), resolve(true)));
        c.once("error", () => resolve(false));
      }),
    10_000,
    "the SMTP fake listening",
  );
}

async function stopFake() {
  if (!fake) return;
  const f = fake;
  fake = null;
  f.kill("SIGTERM");
  await Promise.race([new Promise((r) => f.once("exit", r)), sleep(5_000)]);
}

const api = async (path: string, init: RequestInit = {}) =>
  fetch(base + path, {
    ...init,
    headers: { origin: base, cookie, "content-type": "application/json", ...(init.headers as Record<string, string>) },
    signal: AbortSignal.timeout(8_000),
  });

beforeAll(async () => {
  if (!existsSync("dist/server/jobs.mjs")) throw new Error("the fault suite runs the built server: run `npx astro build` first");
  dir = mkdtempSync(join(tmpdir(), "paneray-fault-mail-"));
  chmodSync(dir, 0o755);
  const pgPort = await freePort();
  const { stdout } = await run("bash", ["scripts/pg.sh", "up", join(dir, "pg"), String(pgPort)], { env: { ...process.env, PG_FSYNC: "off" } });
  await run(join(stdout.trim(), "createdb"), ["-h", "127.0.0.1", "-p", String(pgPort), "-U", "postgres", "paneray_mail"]);
  const webPort = await freePort();
  smtpPort = await freePort();
  base = `http://127.0.0.1:${webPort}`;
  const env: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    DATABASE_URL: `postgres://postgres@127.0.0.1:${pgPort}/paneray_mail`,
    BETTER_AUTH_URL: base,
    BETTER_AUTH_SECRET: randomBytes(32).toString("hex"),
    AUTH_RATE_LIMIT: "off",
    ASTRO_TELEMETRY_DISABLED: "1",
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    // Fast retries for the test: 1 s, then about 2, 4, 8 … s (with jitter); enough of them to outlast the outage.
    DELIVERY_RETRY_DELAY_SECONDS: "1",
    DELIVERY_RETRY_LIMIT: "8",
    JOB_POLL_SECONDS: "0.5",
  };
  await run("node", ["scripts/migrate.mjs"], { env });
  await run("npx", ["tsx", "scripts/seed.ts"], { env });
  server = spawn("node", [...SERVER_NODE_FLAGS, "scripts/server.mjs"], {
    env: { ...env, HOST: "127.0.0.1", PORT: String(webPort), NODE_ENV: "production" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  server.stdout!.on("data", (d: Buffer) => (log += d.toString()));
  server.stderr!.on("data", (d: Buffer) => (log += d.toString()));
  await waitFor(async () => (await fetch(`${base}/api/health`).catch(() => null))?.status === 200, 30_000, "the server's health");
  const signIn = await api("/api/auth/sign-in/email", {
    method: "POST",
    body: JSON.stringify({ email: demoUser("consultant").email, password: DEMO_PASSWORD }),
  });
  expect(signIn.status).toBe(200);
  cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}, 120_000);

afterAll(async () => {
  await stopFake();
  if (server && server.exitCode === null) {
    server.kill("SIGTERM");
    await Promise.race([new Promise((r) => server!.once("exit", r)), sleep(8_000)]);
  }
  if (dir) {
    await run("bash", ["scripts/pg.sh", "down", join(dir, "pg"), "fast"]).catch(() => {});
    rmSync(dir, { recursive: true, force: true });
  }
}, 30_000);

it("retries while the SMTP server is stopped, records each failure, and delivers once it is back", async () => {
  // The fake runs, then stops: the server's mail transport meets a closed port.
  await startFake();
  await stopFake();
  const list = (await (await api("/api/v1/projects")).json()) as { organizations: { projects: { id: string; name: string }[] }[] };
  const projectId = list.organizations[0]!.projects.find((p) => p.name === DEMO_PROJECTS[0].name)!.id;
  const t0 = Date.now();
  const res = await api(`/api/v1/projects/${projectId}/deliveries`, {
    method: "POST",
    body: JSON.stringify({ revision: "A", to: ["outage.reader@fault.example"], message: "Sent while the mail server was down." }),
  });
  expect(res.status).toBe(202);
  expect(Date.now() - t0, "202 comes at once, not after the SMTP attempt").toBeLessThan(2_000);
  const { id } = (await res.json()) as { id: string };
  const status = async () =>
    (
      (await (await api(`/api/v1/deliveries/${id}`)).json()) as {
        delivery: { status: string; attempts: number; lastError: string | null; attachment: { sha256: string } | null };
      }
    ).delivery;

  const failing = await waitFor(
    async () => {
      const d = await status();
      return d.attempts >= 2 && d.status !== "sending" ? d : null;
    },
    30_000,
    "two failed attempts",
  );
  expect(failing.status).toBe("queued"); // waiting for the next retry, not given up
  expect(failing.lastError).toMatch(/ECONNREFUSED/);
  expect(failing.attachment?.sha256).toMatch(/^[0-9a-f]{64}$/);
  const sha = failing.attachment!.sha256;
  expect(server!.exitCode, log.slice(-2000)).toBeNull();

  await startFake();
  const sent = await waitFor(
    async () => {
      const d = await status();
      return d.status === "sent" ? d : null;
    },
    45_000,
    "the delivery sent after the SMTP server came back",
  );
  expect(sent.attempts).toBeGreaterThan(2);
  expect(sent.lastError).toBeNull();
  expect(sent.attachment!.sha256).toBe(sha); // the same file on every attempt
  expect(readdirSync(mailDir()).filter((f) => f.endsWith(".eml")).length).toBeGreaterThanOrEqual(1);
}, 120_000);
