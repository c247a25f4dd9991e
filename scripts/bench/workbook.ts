// The schedule workbook export (npm run bench workbook): 24 façades × a full year hourly (210,240 rows) through
// the calculation pool and exceljs' streaming writer, each trial in a fresh process so that its peak RSS
// (process.resourceUsage().maxRSS, the worker threads included) is the export's alone. The export script
// (scripts/bench/workbook/export.ts) and the calculation worker are bundled with esbuild as the build bundles
// the server and its worker, and run with plain node (as the server runs; tsx in the process would add its
// own memory). Prints the median time and the highest peak RSS beside the targets. WORKBOOK_TRIALS (default 3).
import { execFileSync } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "esbuild";
import { SERVER_NODE_FLAGS } from "../server-flags.mjs";

const TRIALS = Number(process.env.WORKBOOK_TRIALS ?? 3);
const TARGETS = { ms: 10_000, rssMB: 300 };
const here = dirname(fileURLToPath(import.meta.url));
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;

export async function run(): Promise<void> {
  // Inside the clone, so that the bundle's external packages resolve from its node_modules.
  const cache = join(here, "..", "..", "node_modules", ".cache");
  mkdirSync(cache, { recursive: true });
  const dir = mkdtempSync(join(cache, "paneray-bench-workbook-"));
  const common = {
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    tsconfig: join(here, "..", "..", "tsconfig.json"),
    logLevel: "warning",
  } as const;
  // exceljs and the rest of node_modules stay external (resolved from the clone), as in the server build.
  await build({ ...common, entryPoints: [join(here, "workbook", "export.ts")], outfile: join(dir, "export.mjs"), packages: "external" });
  await build({
    ...common,
    entryPoints: [join(here, "..", "..", "src", "lib", "server", "calc-pool", "worker.ts")],
    outfile: join(dir, "calc-worker.mjs"),
  });
  // The export thread, as the build bundles it next to the server.
  await build({
    ...common,
    entryPoints: [join(here, "..", "..", "src", "lib", "server", "workbook-thread", "thread.ts")],
    outfile: join(dir, "workbook-thread.mjs"),
    packages: "external",
  });
  const results: { ms: number; bytes: number; rows: number; maxRssMB: number }[] = [];
  for (let t = 0; t < TRIALS; t++) {
    // With the server's own node flags: the export stands in for the server process.
    const out = execFileSync(process.execPath, [...SERVER_NODE_FLAGS, join(dir, "export.mjs")], {
      cwd: join(here, "..", ".."),
      env: { ...process.env, DATABASE_URL: process.env.DATABASE_URL ?? "postgres://bench@127.0.0.1:1/none" },
      encoding: "utf8",
      maxBuffer: 1 << 20,
    });
    results.push(JSON.parse(out.trim().split("\n").pop()!) as (typeof results)[number]);
  }
  rmSync(dir, { recursive: true, force: true });
  const ms = median(results.map((r) => r.ms));
  const rss = Math.max(...results.map((r) => r.maxRssMB));
  const r0 = results[0]!;
  console.log(`workbook export: ${r0.rows.toLocaleString("en")} hourly rows in 24 sheets, ${(r0.bytes / 1e6).toFixed(1)} MB .xlsx, ${TRIALS} trials`);
  console.log(`  median time   ${(ms / 1000).toFixed(2)} s   (target ≤ ${TARGETS.ms / 1000} s)   ${ms <= TARGETS.ms ? "PASS" : "MISS"}`);
  console.log(
    `  peak RSS      ${rss.toFixed(0)} MB   (target ≤ ${TARGETS.rssMB} MB, highest of the trials)   ${rss <= TARGETS.rssMB ? "PASS" : "MISS"}`,
  );
  console.log(`  trials        ${results.map((r) => `${(r.ms / 1000).toFixed(2)} s / ${r.maxRssMB.toFixed(0)} MB`).join(", ")}`);
}
