// The project results through the built server (npm run bench results): a project of 24 façades × 3 options,
// GET /api/v1/projects/:id/results for a year with nothing cached (cold) and again (warm), then the results
// page in Chromium until its table is on screen. Prints medians beside the targets.
//
// Starts its own throwaway PostgreSQL and the built server (as the load bench does); with BENCH_URL and
// DATABASE_URL it uses a running Paneray instead. RESULTS_TRIALS sets the cold and page trials (default 5).
import { performance } from "node:perf_hooks";
import { eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import { chromium } from "playwright";
import { facade, project } from "@/lib/server/db/app-schema";
import { facadeOption, resultCache } from "@/lib/server/db/workspace-schema";
import { makeup, makeupRevision } from "@/lib/server/db/library-schema";
import { calculateGlazing } from "@/lib/calc/glazing";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { signUpOwner, startStack, type Stack } from "./load";
import { MAKEUPS } from "./data/makeups";

const TRIALS = Number(process.env.RESULTS_TRIALS ?? 5);
const WARM_CALLS = 20;
const TARGETS = { coldMs: 1500, warmMs: 100, pageMs: 2000 };
const YEAR = 2026;
const FACADES = 24;

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
};
const verdict = (ok: boolean) => (ok ? "PASS" : "MISS");
const ms = (x: number) => `${x.toFixed(0)} ms`;

/** 24 façades round the compass, every other one with a window under an overhang, 3 options each. */
async function seedProject(databaseUrl: string, organizationId: string, userId: string): Promise<string> {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 2 });
  try {
    const db = drizzle(pool);
    const [p] = await db
      .insert(project)
      .values({
        organizationId,
        name: "Results bench tower",
        siteName: "Bench site",
        latitudeDeg: 51.5,
        longitudeDeg: -0.12,
        timeZone: "Europe/London",
        elevationM: 20,
        createdById: userId,
      })
      .returning();
    const fs = await db
      .insert(facade)
      .values(
        Array.from({ length: FACADES }, (_, k) => ({
          projectId: p!.id,
          name: `Bay ${k + 1}`,
          azimuthDeg: k * 15,
          tiltDeg: 90,
          position: k,
          glazedAreaM2: 40,
          ...(k % 2 ? { windowWidthM: 1.5, windowHeightM: 2.2, shading: { overhang: { depthM: 0.3 + 0.05 * k, gapAboveM: 0.2 } } } : {}),
        })),
      )
      .returning();
    const revisions: (typeof makeupRevision.$inferSelect)[] = [];
    for (const m of MAKEUPS) {
      const g = calculateGlazing(GlazingRequest.parse({ layers: m.layers, anglesDeg: [0] }));
      const { angleDeg: _a, ...normal } = g.angles[0]!;
      void _a;
      const [row] = await db.insert(makeup).values({ organizationId, name: m.name }).returning();
      const [rev] = await db
        .insert(makeupRevision)
        .values({
          makeupId: row!.id,
          revision: 1,
          name: m.name,
          description: m.name,
          layers: m.layers,
          values: { normal, hemispherical: g.hemispherical, uValue: g.uValue, warnings: g.warnings },
        })
        .returning();
      revisions.push(rev!);
    }
    await db.insert(facadeOption).values(
      fs.flatMap((f) =>
        revisions.map((r, i) => ({
          projectId: p!.id,
          facadeId: f.id,
          makeupId: r.makeupId,
          makeupRevisionId: r.id,
          name: MAKEUPS[i]!.name,
          position: i,
        })),
      ),
    );
    return p!.id;
  } finally {
    await pool.end();
  }
}

async function clearCache(databaseUrl: string, projectId: string) {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    await drizzle(client).delete(resultCache).where(eq(resultCache.projectId, projectId));
  } finally {
    await client.end();
  }
}

async function timedResults(base: string, cookie: string, projectId: string): Promise<{ ms: number; misses: number; options: number }> {
  const t0 = performance.now();
  const res = await fetch(`${base}/api/v1/projects/${projectId}/results?year=${YEAR}`, { headers: { cookie } });
  const body = (await res.json()) as { cache?: { misses: number }; facades: { options: unknown[] }[] };
  const elapsed = performance.now() - t0;
  if (res.status !== 200) throw new Error(`results answered ${res.status}: ${JSON.stringify(body).slice(0, 200)}`);
  return { ms: elapsed, misses: body.cache?.misses ?? -1, options: body.facades.reduce((s, f) => s + f.options.length, 0) };
}

export async function run(): Promise<void> {
  let stack: Stack;
  if (process.env.BENCH_URL) {
    if (!process.env.DATABASE_URL) throw new Error("with BENCH_URL, set DATABASE_URL to the same server's database (the project is seeded directly)");
    stack = { base: process.env.BENCH_URL, databaseUrl: process.env.DATABASE_URL, pid: null, stop: async () => {} };
  } else {
    stack = await startStack();
  }
  try {
    const { base, databaseUrl } = stack;
    const owner = await signUpOwner(base, databaseUrl);
    const projectId = await seedProject(databaseUrl, owner.organizationId, owner.userId);
    console.log(`a project of ${FACADES} façades × ${MAKEUPS.length} options, hourly year ${YEAR}, through ${base}`);

    const cold: number[] = [];
    for (let t = 0; t < TRIALS; t++) {
      await clearCache(databaseUrl, projectId);
      const r = await timedResults(base, owner.cookie, projectId);
      if (r.misses !== FACADES * MAKEUPS.length || r.options !== FACADES * MAKEUPS.length)
        throw new Error(`cold trial computed ${r.misses} of ${r.options} options`);
      cold.push(r.ms);
    }
    const warm: number[] = [];
    for (let t = 0; t < WARM_CALLS; t++) {
      const r = await timedResults(base, owner.cookie, projectId);
      if (r.misses !== 0) throw new Error(`warm call recomputed ${r.misses} options`);
      warm.push(r.ms);
    }
    const mc = median(cold);
    const mw = median(warm);
    console.log(
      `GET results, cold (cache emptied), ${TRIALS} trials: median ${ms(mc)} (first ${ms(cold[0]!)}, max ${ms(Math.max(...cold))})   target ≤ ${ms(TARGETS.coldMs)}: ${verdict(mc <= TARGETS.coldMs)}`,
    );
    console.log(
      `GET results, warm (all ${FACADES * MAKEUPS.length} cached), ${WARM_CALLS} calls: median ${ms(mw)} (max ${ms(Math.max(...warm))})   target ≤ ${ms(TARGETS.warmMs)}: ${verdict(mw <= TARGETS.warmMs)}`,
    );

    const browser = await chromium.launch({ executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium", args: ["--disable-gpu"] });
    try {
      const context = await browser.newContext({ viewport: { width: 1440, height: 900 } });
      const url = new URL(base);
      await context.addCookies(
        owner.cookie.split("; ").map((c) => {
          const i = c.indexOf("=");
          return { name: c.slice(0, i), value: c.slice(i + 1), domain: url.hostname, path: "/" };
        }),
      );
      const page = await context.newPage();
      const pageTimes: number[] = [];
      for (let t = 0; t < TRIALS + 1; t++) {
        const t0 = performance.now();
        await page.goto(`${base}/projects/${projectId}/results`, { waitUntil: "commit" });
        // Interactive: the table is on screen and its controls answer (a sort click reorders it).
        await page.getByTestId("results-table").waitFor({ timeout: 30_000 });
        await page.getByRole("button", { name: /^g/ }).first().click();
        await page.locator('[data-testid="results-table"] th[aria-sort]').first().waitFor({ timeout: 5_000 });
        const elapsed = performance.now() - t0;
        if (t > 0) pageTimes.push(elapsed); // the first load warms the browser's cache of scripts
      }
      const mp = median(pageTimes);
      console.log(
        `results page (1440 px, results cached) until its table sorts on a click, ${TRIALS} loads: median ${ms(mp)}   target ≤ ${ms(TARGETS.pageMs)}: ${verdict(mp <= TARGETS.pageMs)}`,
      );
    } finally {
      await browser.close();
    }
  } finally {
    await stack.stop();
  }
}
