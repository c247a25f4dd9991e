// A delivery through a stopped SMTP server: the built server (its worker inside) answers 202, the job's
// attempts fail and are recorded (attempts > 1, the connection error as lastError) while the SMTP fake is down,
// and once the fake is back the queue's next retry delivers the message, which the fake stores. Own PostgreSQL,
// own ports, loopback only; every phase is bounded.
import { afterAll, beforeAll, expect, it } from "vitest";
import { spawn, type ChildProcess } from "node:child_process";
import { readdirSync } from "node:fs";
import net from "node:net";
import { join } from "node:path";
import { DEMO_PROJECTS } from "@/lib/demo-scenario";
import { freePort, signInCookie, sleep, startStack, waitFor, type Stack } from "./stack";

let stack: Stack | null = null;
let base = "";
let cookie = "";
let smtpPort = 0;
let fake: ChildProcess | null = null;

const mailDir = () => join(stack!.dir, "mail");

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
  smtpPort = await freePort();
  stack = await startStack(
    "paneray_mail",
    {
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      // Fast retries for the test: 1 s, then about 2, 4, 8 … s (with jitter); enough of them to outlast the outage.
      DELIVERY_RETRY_DELAY_SECONDS: "1",
      DELIVERY_RETRY_LIMIT: "8",
      JOB_POLL_SECONDS: "0.5",
    },
    "dist/server/jobs.mjs",
  );
  base = stack.base;
  cookie = await signInCookie(base, "consultant");
}, 120_000);

afterAll(async () => {
  await stopFake();
  await stack?.stop();
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
  expect(stack!.exited(), stack!.log().slice(-2000)).toBeNull();

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
