// Load on the built app over loopback (npm run bench:load): 2,000 projects in a throwaway organisation, then
// 50 clients listing projects, then 10 clients asking for year schedules while the health check is polled.
// Prints req/s, p50, p99 and errors of each, with the server's peak RSS in each phase, beside the targets.
//
// By default it starts its own throwaway PostgreSQL and the built server (dist/, built when stale) on free
// ports and removes them afterwards. With BENCH_URL and DATABASE_URL (and optionally BENCH_PID, the server's
// process id, for RSS) it uses a running Paneray instead. LOAD_SECONDS sets each phase's length (default 30),
// LOAD_PROJECTS the number of projects (default 2000). SERVER_NODE_ARGS passes flags to the server's node
// (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof" to profile it).
//
// Besides latency, each phase prints the server's CPU time per request (user + system, all its threads, from
// /proc): a figure that a busy shared machine disturbs much less than p99, for comparing two versions.
import autocannon from "autocannon";
import { execFileSync, spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { mkdtempSync, readFileSync, rmSync, chmodSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { project } from "@/lib/server/db/app-schema";
import { SERVER_NODE_FLAGS } from "../server-flags.mjs";

const SECONDS = Number(process.env.LOAD_SECONDS ?? 30);
const PROJECTS = Number(process.env.LOAD_PROJECTS ?? 2000);
const TARGETS = { listP99Ms: 300, healthP99Ms: 100 };

const lib = (fn: string) => execFileSync("bash", ["-c", `source scripts/lib.sh && ${fn}`], { encoding: "utf8" }).trim();

export interface Stack {
  base: string;
  databaseUrl: string;
  pid: number | null;
  stop: () => Promise<void>;
}

async function waitHealthy(base: string, ms: number) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      if ((await fetch(`${base}/api/health`)).status === 200) return;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > until) throw new Error(`the server at ${base} did not become healthy within ${ms / 1000} s`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

/** A throwaway PostgreSQL and the built server on free loopback ports (also used by the results bench). */
export async function startStack(): Promise<Stack> {
  const dir = mkdtempSync(join(tmpdir(), "paneray-load."));
  chmodSync(dir, 0o755);
  const pgPort = lib("free_port");
  const bin = execFileSync("bash", ["scripts/pg.sh", "up", join(dir, "pg"), pgPort], {
    encoding: "utf8",
    env: { ...process.env, PG_FSYNC: "off" },
  }).trim();
  let server: ChildProcess | null = null;
  const stop = async () => {
    if (server && server.exitCode === null) {
      server.kill("SIGTERM");
      await new Promise((r) => server!.once("exit", r));
    }
    execFileSync("bash", ["scripts/pg.sh", "down", join(dir, "pg")]);
    rmSync(dir, { recursive: true, force: true });
  };
  try {
    execFileSync(join(bin, "createdb"), ["-h", "127.0.0.1", "-p", pgPort, "-U", "postgres", "paneray_load"]);
    const databaseUrl = `postgres://postgres@127.0.0.1:${pgPort}/paneray_load`;
    execFileSync("node", ["scripts/migrate.mjs"], { env: { ...process.env, DATABASE_URL: databaseUrl }, stdio: ["ignore", "ignore", "inherit"] });
    execFileSync("bash", ["-c", "source scripts/lib.sh && build_if_stale"], { stdio: ["ignore", "ignore", "inherit"] });
    const port = lib("free_port");
    const base = `http://127.0.0.1:${port}`;
    server = spawn("node", [...(process.env.SERVER_NODE_ARGS?.split(/\s+/).filter(Boolean) ?? SERVER_NODE_FLAGS), "scripts/server.mjs"], {
      env: {
        ...process.env,
        HOST: "127.0.0.1",
        PORT: port,
        NODE_ENV: "production",
        DATABASE_URL: databaseUrl,
        BETTER_AUTH_URL: base,
        BETTER_AUTH_SECRET: randomBytes(32).toString("hex"),
        AUTH_RATE_LIMIT: "off",
        SMTP_URL: "",
      },
      stdio: ["ignore", "ignore", "inherit"],
    });
    await waitHealthy(base, 60_000);
    return { base, databaseUrl, pid: server.pid ?? null, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}

/** Samples the server's resident set size; `peak()` is the largest since the last `reset()`. */
function rssSampler(pid: number | null) {
  let peakKb = 0;
  const sample = () => {
    if (!pid) return;
    try {
      const kb = Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1] ?? 0);
      peakKb = Math.max(peakKb, kb);
    } catch {
      /* the process is gone or not ours to read */
    }
  };
  const timer = setInterval(sample, 100);
  return {
    reset: () => {
      peakKb = 0;
      sample();
    },
    peak: () => (pid ? `${(peakKb / 1024).toFixed(0)} MB` : "n/a (set BENCH_PID)"),
    stop: () => clearInterval(timer),
  };
}

export async function signUpOwner(base: string, databaseUrl: string): Promise<{ cookie: string; userId: string; organizationId: string }> {
  const email = `load-${Date.now().toString(36)}@bench.example`;
  const password = "load-bench-2026";
  const headers = { "content-type": "application/json", origin: base };
  const res = await fetch(`${base}/api/v1/signup`, {
    method: "POST",
    headers,
    body: JSON.stringify({ name: "Load Bench", email, password, organizationName: `Load bench ${email}` }),
  });
  if (res.status !== 201) throw new Error(`sign-up answered ${res.status}: ${(await res.text()).slice(0, 200)}`);
  // The bench has no mailbox: confirm the address in the database instead of following the mailed link.
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await client.query(`update "user" set email_verified = true where email = $1`, [email]);
  } finally {
    await client.end();
  }
  const signIn = await fetch(`${base}/api/auth/sign-in/email`, { method: "POST", headers, body: JSON.stringify({ email, password }) });
  if (signIn.status !== 200) throw new Error(`sign-in answered ${signIn.status}: ${(await signIn.text()).slice(0, 200)}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const me = (await (await fetch(`${base}/api/v1/me`, { headers: { cookie } })).json()) as {
    user: { id: string };
    memberships: { organizationId: string }[];
  };
  return { cookie, userId: me.user.id, organizationId: me.memberships[0]!.organizationId };
}

async function seedProjects(databaseUrl: string, organizationId: string, userId: string, n: number) {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  try {
    const db = drizzle(pool);
    for (let start = 0; start < n; start += 500) {
      const rows = Array.from({ length: Math.min(500, n - start) }, (_, k) => ({
        organizationId,
        name: `Load project ${start + k + 1}`,
        reference: `LB-${String(start + k + 1).padStart(4, "0")}`,
        buildingName: "Bench block",
        siteName: "Bench site",
        latitudeDeg: -60 + ((start + k) % 120),
        longitudeDeg: -170 + ((start + k) % 340),
        timeZone: "UTC",
        elevationM: 10,
        description: "Seeded by the load bench",
        createdById: userId,
      }));
      await db.insert(project).values(rows);
    }
  } finally {
    await pool.end();
  }
}

/** CPU seconds (user + system, every thread) the process has used so far, or null. */
function cpuSeconds(pid: number | null): number | null {
  if (!pid) return null;
  try {
    // Fields after the command name (which may hold spaces): utime and stime are the 12th and 13th, in clock ticks (100 Hz).
    const fields = readFileSync(`/proc/${pid}/stat`, "utf8").split(") ")[1]!.split(" ");
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return null;
  }
}

/** Server CPU per request over a phase, e.g. "2.9 ms CPU/request". */
function cpuPerRequest(before: number | null, after: number | null, requests: number): string {
  if (before === null || after === null || requests === 0) return "CPU n/a";
  return `${(((after - before) * 1000) / requests).toFixed(2)} ms CPU/request`;
}

const loadAverage = () => readFileSync("/proc/loadavg", "utf8").split(" ").slice(0, 3).join(" ");

type Result = autocannon.Result;

function report(label: string, r: Result, rss: string, target: string, cpu = "") {
  const errors = r.errors + r.timeouts + r.non2xx;
  console.log(
    `${label}: ${r.requests.average.toFixed(1)} req/s, p50 ${r.latency.p50} ms, p99 ${r.latency.p99} ms, ` +
      `errors ${errors} (connection ${r.errors}, timeouts ${r.timeouts}, non-2xx ${r.non2xx}) of ${r.requests.total}, server peak RSS ${rss}` +
      `${cpu ? `, ${cpu}` : ""}, load average ${loadAverage()}   ${target}`,
  );
}

const verdict = (ok: boolean) => (ok ? "PASS" : "MISS");

export async function run(): Promise<void> {
  const requested = process.argv.slice(2).includes("load");
  if (!requested && !process.env.BENCH_URL) {
    console.log("skipped: npm run bench:load runs this one (it starts its own database and server, or set BENCH_URL)");
    return;
  }
  let stack: Stack;
  if (process.env.BENCH_URL) {
    if (!process.env.DATABASE_URL) throw new Error("with BENCH_URL, set DATABASE_URL to the same server's database (projects are seeded directly)");
    stack = {
      base: process.env.BENCH_URL,
      databaseUrl: process.env.DATABASE_URL,
      pid: process.env.BENCH_PID ? Number(process.env.BENCH_PID) : null,
      stop: async () => {},
    };
  } else {
    stack = await startStack();
  }
  const rss = rssSampler(stack.pid);
  try {
    const { base } = stack;
    const owner = await signUpOwner(base, stack.databaseUrl);
    await seedProjects(stack.databaseUrl, owner.organizationId, owner.userId, PROJECTS);
    const headers = { cookie: owner.cookie, origin: base };
    const list = (await (await fetch(`${base}/api/v1/projects`, { headers })).json()) as { organizations: { projects: unknown[] }[] };
    const listed = list.organizations.reduce((s, o) => s + o.projects.length, 0);
    console.log(`seeded ${PROJECTS} projects in a throwaway organisation; GET /api/v1/projects returns ${listed} of them; ${SECONDS} s per phase`);

    rss.reset();
    const listCpu = cpuSeconds(stack.pid);
    const listing = await autocannon({ url: `${base}/api/v1/projects`, connections: 50, duration: SECONDS, headers });
    const listCpuUsed = cpuPerRequest(listCpu, cpuSeconds(stack.pid), listing.requests.total);
    report(
      "GET /api/v1/projects, 50 clients",
      listing,
      rss.peak(),
      `target: 0 errors, p99 ≤ ${TARGETS.listP99Ms} ms: ${verdict(listing.errors + listing.timeouts + listing.non2xx === 0 && listing.latency.p99 <= TARGETS.listP99Ms)}`,
      listCpuUsed,
    );

    const pane = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
    const year = new Date().getFullYear();
    const schedule = JSON.stringify({
      site: { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" },
      from: `${year}-01-01`,
      to: `${year}-12-31`,
      surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: [pane, { kind: "gap", widthMm: 16, gas: "air" }, pane] }],
    });
    rss.reset();
    const [schedules, health] = await Promise.all([
      autocannon({
        url: `${base}/api/v1/calc/schedule`,
        method: "POST",
        connections: 10,
        duration: SECONDS,
        timeout: 60,
        headers: { ...headers, "content-type": "application/json" },
        body: schedule,
      }),
      autocannon({ url: `${base}/api/health`, connections: 2, duration: SECONDS, timeout: 30 }),
    ]);
    const peak = rss.peak();
    report("POST /api/v1/calc/schedule (one surface × a year), 10 clients", schedules, peak, "target: 0 errors");
    report(
      "GET /api/health, 2 clients polling during the schedules",
      health,
      peak,
      `target: 0 errors, p99 ≤ ${TARGETS.healthP99Ms} ms: ${verdict(health.errors + health.timeouts + health.non2xx === 0 && health.latency.p99 <= TARGETS.healthP99Ms)}`,
    );
    if (schedules.errors + schedules.timeouts + schedules.non2xx > 0) console.log(`schedules target 0 errors: MISS`);
  } finally {
    rss.stop();
    await stack.stop();
  }
}
