// The fault suite's own stack: a throwaway PostgreSQL on a free port (fsync off), migrated and seeded, and the built
// server (scripts/server.mjs) in front of it, loopback only. Each fault test starts one, breaks a part of it, and
// stops it in afterAll.
import { execFile, spawn, type ChildProcess } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, rmSync } from "node:fs";
import net from "node:net";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { randomBytes } from "node:crypto";
import { DEMO_PASSWORD, demoUser } from "@/lib/demo-scenario";
import { SERVER_NODE_FLAGS } from "@scripts/server-flags.mjs";

export const run = promisify(execFile);
export const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

/** Polls `check` every `everyMs` until it gives a truthy value (returned) or `budgetMs` has passed (throws, naming `what`). */
export async function waitFor<T>(check: () => Promise<T | null | undefined | false>, budgetMs: number, what: string, everyMs = 100): Promise<T> {
  const until = Date.now() + budgetMs;
  while (Date.now() < until) {
    const v = await check();
    if (v) return v;
    await sleep(everyMs);
  }
  throw new Error(`${what}: not within ${budgetMs} ms`);
}

export interface Stack {
  /** The temporary folder: PostgreSQL's data in `pg/`, anything else the test wants beside it. */
  readonly dir: string;
  readonly pgPort: number;
  readonly databaseUrl: string;
  /** The server's origin, e.g. http://127.0.0.1:40123. */
  readonly base: string;
  readonly server: ChildProcess;
  /** What the server printed so far. */
  log(): string;
  /** How the server process ended, or null while it runs. */
  exited(): { code: number | null; signal: string | null } | null;
  pgUp(): Promise<unknown>;
  pgDown(mode: "fast" | "immediate"): Promise<unknown>;
  /** Stops the server and PostgreSQL and removes the folder. */
  stop(): Promise<void>;
}

/**
 * Starts PostgreSQL (database `dbName`), migrates and seeds it, and starts the built server with `env` added to the
 * environment; resolves once /api/health answers 200. `needs` names a file of the build the test relies on.
 */
export async function startStack(dbName: string, env: NodeJS.ProcessEnv = {}, needs = "dist/server/entry.mjs"): Promise<Stack> {
  if (!existsSync(needs)) throw new Error("the fault suite runs the built server: run `npx astro build` first");
  const dir = mkdtempSync(join(tmpdir(), `paneray-${dbName}-`));
  chmodSync(dir, 0o755); // the postgres user must be able to enter
  const pgPort = await freePort();
  const pgUp = () => run("bash", ["scripts/pg.sh", "up", join(dir, "pg"), String(pgPort)], { env: { ...process.env, PG_FSYNC: "off" } });
  const pgDown = (mode: "fast" | "immediate") => run("bash", ["scripts/pg.sh", "down", join(dir, "pg"), mode]);
  const { stdout } = await pgUp();
  await run(join(stdout.trim(), "createdb"), ["-h", "127.0.0.1", "-p", String(pgPort), "-U", "postgres", dbName]);
  const databaseUrl = `postgres://postgres@127.0.0.1:${pgPort}/${dbName}`;
  const webPort = await freePort();
  const base = `http://127.0.0.1:${webPort}`;
  const fullEnv: NodeJS.ProcessEnv = {
    PATH: process.env.PATH,
    HOME: process.env.HOME,
    DATABASE_URL: databaseUrl,
    BETTER_AUTH_URL: base,
    BETTER_AUTH_SECRET: randomBytes(32).toString("hex"),
    AUTH_RATE_LIMIT: "off",
    ASTRO_TELEMETRY_DISABLED: "1",
    ...env,
  };
  await run("node", ["scripts/migrate.mjs"], { env: fullEnv });
  await run("npx", ["tsx", "scripts/seed.ts"], { env: fullEnv });

  let log = "";
  let exited: { code: number | null; signal: string | null } | null = null;
  const server = spawn("node", [...SERVER_NODE_FLAGS, "scripts/server.mjs"], {
    env: { ...fullEnv, HOST: "127.0.0.1", PORT: String(webPort), NODE_ENV: "production" },
    stdio: ["ignore", "pipe", "pipe"],
  });
  server.stdout!.on("data", (d: Buffer) => (log += d.toString()));
  server.stderr!.on("data", (d: Buffer) => (log += d.toString()));
  server.on("exit", (code, signal) => (exited = { code, signal }));
  const stop = async () => {
    if (!exited) {
      server.kill("SIGTERM");
      await Promise.race([new Promise((r) => server.once("exit", r)), sleep(8_000)]);
    }
    await pgDown("fast").catch(() => {});
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    await waitFor(async () => (await fetch(`${base}/api/health`).catch(() => null))?.status === 200, 30_000, "the server's health", 200);
  } catch (err) {
    await stop();
    throw new Error(`${(err as Error).message}; the server printed:\n${log.slice(-3000)}`);
  }
  return { dir, pgPort, databaseUrl, base, server, log: () => log, exited: () => exited, pgUp, pgDown, stop };
}

/** Signs a demo user in and gives the session cookie header. */
export async function signInCookie(base: string, role: Parameters<typeof demoUser>[0]): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { origin: base, "content-type": "application/json" },
    body: JSON.stringify({ email: demoUser(role).email, password: DEMO_PASSWORD }),
    signal: AbortSignal.timeout(8_000),
  });
  if (res.status !== 200) throw new Error(`sign-in as the demo ${role} answered ${res.status}: ${await res.text()}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}
