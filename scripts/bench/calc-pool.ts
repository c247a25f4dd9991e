// The largest schedules under load against the built server: 10 clients post six surfaces × a whole
// leap year (52,704 rows, ~15 MB of JSON) back to back for ~15 s while /api/health is polled every
// 50 ms. Prints health p50/p99, schedules per second, refusals and errors, and the server's peak
// RSS, first with the calculations on the main thread (CALC_WORKERS=0), then in the worker pool.
//
// Starts `node scripts/server.mjs` (the built server) itself on a free loopback port (build first: npx astro build)
// against DATABASE_URL (a migrated, seeded database, e.g. the one `npm start` runs); or set BENCH_URL
// to measure a server that is already running (one configuration, RSS not measured). Stops by itself.
import { spawn, type ChildProcess } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync } from "node:fs";
import { createServer } from "node:net";
import { Worker } from "node:worker_threads";
import { DEMO_PASSWORD, demoUser } from "@/lib/demo-scenario";
import { SERVER_NODE_FLAGS } from "../server-flags.mjs";

const CLIENTS = 10;
const DURATION_MS = 15_000;
const HEALTH_EVERY_MS = 50;
const DRAIN_MS = 60_000;

const pane = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const largest = {
  site: { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" },
  from: "2028-01-01",
  to: "2028-12-31",
  surfaces: Array.from({ length: 6 }, (_, k) => ({
    name: `Facade ${k + 1}`,
    azimuthDeg: k * 60,
    tiltDeg: 90,
    layers: [pane, { kind: "gap", widthMm: 16, gas: "argon" }, pane],
    shading: { window: { widthM: 1.5, heightM: 2 }, overhang: { depthM: 0.8, gapAboveM: 0.3 } },
  })),
};

// The load runs in a thread of its own so that receiving 150 MB of answers does not delay the health timer.
const LOAD = `
const { parentPort, workerData: w } = require("node:worker_threads");
try { require("node:os").setPriority(10); } catch {} // this thread only (Linux): the poller's timer goes first
const stopAt = Date.now() + w.durationMs;
const statuses = {};
let done = 0, bytes = 0;
async function client() {
  while (Date.now() < stopAt) {
    try {
      const res = await fetch(w.base + "/api/v1/calc/schedule", { method: "POST", headers: { "content-type": "application/json", cookie: w.cookie, origin: w.base }, body: w.body, signal: AbortSignal.timeout(w.drainMs) });
      const buf = await res.arrayBuffer();
      statuses[res.status] = (statuses[res.status] || 0) + 1;
      if (res.status === 200) { done++; bytes += buf.byteLength; }
      else if (res.status === 503) await new Promise((r) => setTimeout(r, 1000 * Number(res.headers.get("retry-after") || 1)));
    } catch (e) { statuses[e.name || "error"] = (statuses[e.name || "error"] || 0) + 1; }
  }
}
const t0 = Date.now();
Promise.all(Array.from({ length: w.clients }, client)).then(() => parentPort.postMessage({ done, bytes, statuses, elapsedMs: Date.now() - t0 }));
`;

interface LoadResult {
  done: number;
  bytes: number;
  statuses: Record<string, number>;
  elapsedMs: number;
}

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const { port } = s.address() as { port: number };
      s.close(() => resolve(port));
    });
  });

const rssMb = (pid: number): number => {
  try {
    const kb = /VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, "utf8"))?.[1];
    return kb ? Number(kb) / 1024 : NaN;
  } catch {
    return NaN;
  }
};

const quantile = (xs: number[], q: number) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.floor(q * s.length))]! : NaN;
};

async function startServer(workers: string | undefined): Promise<{ base: string; child: ChildProcess }> {
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const env: Record<string, string | undefined> = {
    ...process.env,
    HOST: "127.0.0.1",
    PORT: String(port),
    BETTER_AUTH_URL: base,
    BETTER_AUTH_SECRET: process.env.BETTER_AUTH_SECRET ?? randomBytes(32).toString("hex"),
    AUTH_RATE_LIMIT: "off",
    NODE_ENV: "production",
    CALC_WORKERS: workers,
  };
  if (workers === undefined) delete env.CALC_WORKERS;
  const child = spawn(process.execPath, [...SERVER_NODE_FLAGS, "scripts/server.mjs"], { env, stdio: ["ignore", "ignore", "inherit"] });
  for (let i = 0; i < 150; i++) {
    await new Promise((r) => setTimeout(r, 200));
    if (child.exitCode !== null) throw new Error(`the server exited with code ${child.exitCode}`);
    try {
      if ((await fetch(`${base}/api/health`)).ok) return { base, child };
    } catch {
      // not listening yet
    }
  }
  child.kill();
  throw new Error("the server did not answer /api/health within 30 s");
}

async function signIn(base: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ email: demoUser("consultant").email, password: DEMO_PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`demo sign-in failed: ${res.status} (is the database seeded?)`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

interface Figures {
  label: string;
  idleP50: number;
  healthP50: number;
  healthP99: number;
  healthMax: number;
  healthFailures: number;
  perSecond: number;
  statuses: Record<string, number>;
  idleRss: number;
  peakRss: number;
}

async function measure(label: string, base: string, pid: number | undefined): Promise<Figures> {
  const cookie = await signIn(base);
  const idle: number[] = [];
  for (let i = 0; i < 40; i++) {
    const t0 = performance.now();
    await (await fetch(`${base}/api/health`)).arrayBuffer();
    idle.push(performance.now() - t0);
    await new Promise((r) => setTimeout(r, HEALTH_EVERY_MS));
  }
  const idleRss = pid ? rssMb(pid) : NaN;
  let peakRss = idleRss;
  const rssTimer = pid ? setInterval(() => (peakRss = Math.max(peakRss, rssMb(pid))), 100) : undefined;
  const load = new Worker(LOAD, {
    eval: true,
    workerData: { base, cookie, body: JSON.stringify(largest), clients: CLIENTS, durationMs: DURATION_MS, drainMs: DRAIN_MS },
  });
  const result = new Promise<LoadResult>((resolve, reject) => {
    load.once("message", resolve);
    load.once("error", reject);
  });
  let finished = false;
  void result.finally(() => (finished = true));
  const health: number[] = [];
  let healthFailures = 0;
  while (!finished) {
    const t0 = performance.now();
    try {
      const res = await fetch(`${base}/api/health`, { signal: AbortSignal.timeout(10_000) });
      await res.arrayBuffer();
      if (!res.ok) healthFailures++;
    } catch {
      healthFailures++;
    }
    const ms = performance.now() - t0;
    health.push(ms);
    await new Promise((r) => setTimeout(r, Math.max(0, HEALTH_EVERY_MS - ms)));
  }
  const r = await result;
  await load.terminate();
  if (rssTimer) clearInterval(rssTimer);
  return {
    label,
    idleP50: quantile(idle, 0.5),
    healthP50: quantile(health, 0.5),
    healthP99: quantile(health, 0.99),
    healthMax: Math.max(...health),
    healthFailures,
    perSecond: r.done / (r.elapsedMs / 1000),
    statuses: r.statuses,
    idleRss,
    peakRss,
  };
}

function print(f: Figures): void {
  const rss = Number.isNaN(f.peakRss) ? "RSS not measured" : `RSS ${f.idleRss.toFixed(0)} MB idle → peak ${f.peakRss.toFixed(0)} MB`;
  console.log(
    `${f.label}: /api/health idle p50 ${f.idleP50.toFixed(1)} ms; under load p50 ${f.healthP50.toFixed(1)} ms, p99 ${f.healthP99.toFixed(1)} ms (max ${f.healthMax.toFixed(0)} ms, ${f.healthFailures} failed) ` +
      `target p99 ≤ 100 ms: ${f.healthP99 <= 100 ? "PASS" : "MISS"}; schedules ${f.perSecond.toFixed(2)}/s; answers ${JSON.stringify(f.statuses)}; ${rss}`,
  );
}

export async function run(): Promise<void> {
  const given = process.env.BENCH_URL;
  if (given) {
    print(await measure(`${CLIENTS} clients × largest schedule against ${given}`, given, undefined));
    return;
  }
  if (!process.env.DATABASE_URL || !existsSync("dist/server/entry.mjs")) {
    console.log("skipped: needs a build (npx astro build) and DATABASE_URL of a seeded database, or BENCH_URL of a running Paneray");
    return;
  }
  const results: Figures[] = [];
  for (const [label, workers] of [
    ["main thread (CALC_WORKERS=0)", "0"],
    [`worker pool (CALC_WORKERS=${process.env.CALC_WORKERS ?? "default"})`, process.env.CALC_WORKERS],
  ] as const) {
    const { base, child } = await startServer(workers);
    try {
      const f = await measure(`${CLIENTS} clients × 6 surfaces × leap year, ${label}`, base, child.pid);
      print(f);
      results.push(f);
    } finally {
      child.kill("SIGTERM");
      await new Promise((r) => child.once("exit", r));
    }
  }
  const [before, after] = results as [Figures, Figures];
  console.log(
    `pool vs main thread: health p99 ${(after.healthP99 / before.healthP99).toFixed(3)}×, peak RSS ${(after.peakRss / before.peakRss).toFixed(2)}×, ` +
      `throughput ${(after.perSecond / before.perSecond).toFixed(2)}×`,
  );
}
