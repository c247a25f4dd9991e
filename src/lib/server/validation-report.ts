/**
 * The validation report of this process: computed once, on the first request that needs it, in the
 * calculation pool (a worker thread, so the main thread keeps serving other requests while it runs), and
 * kept for the life of the process. The page and the two downloads read the same report.
 *
 * The versions it names are read once: Paneray's from its package.json and the git commit of the checkout
 * (null without git), each reference library's from its installed package.json.
 */
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { REFERENCE_LIBRARIES } from "@/lib/validation/domains";
import type { ReportVersions, ValidationReport } from "@/lib/validation/report";
import { runCalc, sharedCalcPool } from "./calc-pool";

const readJson = (file: string): Record<string, unknown> | null => {
  try {
    return JSON.parse(readFileSync(file, "utf8")) as Record<string, unknown>;
  } catch {
    return null;
  }
};

/** The folder of Paneray's package.json: up from this module (sources or dist/server/…), else the working directory. */
export function appRoot(start = dirname(fileURLToPath(import.meta.url))): string {
  for (let dir = start; ; dir = dirname(dir)) {
    if (readJson(join(dir, "package.json"))?.name === "paneray") return dir;
    if (dirname(dir) === dir) return process.cwd();
  }
}

/** The commit checked out at `root`, or null (no git, not a checkout). */
function gitCommit(root: string): string | null {
  if (!existsSync(join(root, ".git"))) return null;
  try {
    const out = execFileSync("git", ["rev-parse", "HEAD"], { cwd: root, timeout: 2000, stdio: ["ignore", "pipe", "ignore"] })
      .toString()
      .trim();
    return /^[0-9a-f]{40}$/.test(out) ? out : null;
  } catch {
    return null;
  }
}

/** A string field of a package.json, or null. */
const versionIn = (file: string): string | null => {
  const v = readJson(file)?.version;
  return typeof v === "string" ? v : null;
};

let versions: ReportVersions | undefined;

/** Paneray's version and commit, and the installed version of each reference library (read once). */
export function reportVersions(): ReportVersions {
  if (versions) return versions;
  const root = appRoot();
  versions = {
    paneray: { version: versionIn(join(root, "package.json")), commit: gitCommit(root) },
    libraries: REFERENCE_LIBRARIES.map((name) => ({ name, version: versionIn(join(root, "node_modules", name, "package.json")) })),
  };
  return versions;
}

let pending: Promise<ValidationReport> | null = null;

/** The process's validation report; the first call starts the computation, later calls share it. */
export function validationReport(): Promise<ValidationReport> {
  pending ??= (async () => {
    const t0 = performance.now();
    const report = await runCalc<"validationReport", ValidationReport>(sharedCalcPool(), "validationReport", reportVersions());
    console.info(
      `[validation] ${report.totals.values} values of ${report.totals.cases} cases, ${report.totals.failing} failing; ` +
        `computed in ${report.durationMs.toFixed(0)} ms (${(performance.now() - t0).toFixed(0)} ms with the worker round trip)`,
    );
    return report;
  })().catch((err: unknown) => {
    pending = null; // a later request tries again
    throw err;
  });
  return pending;
}
