/**
 * The calculation endpoints' way to compute: `calcResponse("schedule", body)` runs the calculation
 * in the shared worker pool (CALC_WORKERS threads, CALC_QUEUE_LIMIT waiting calls) and answers with
 * the same bytes and headers as `json(…)` would on the main thread; a full queue is answered 503
 * with Retry-After. CALC_WORKERS=0 computes on the main thread, as before the pool existed.
 */
import { existsSync } from "node:fs";
import { availableParallelism } from "node:os";
import { calcEnv } from "@/lib/server/env";
import { problem } from "@/lib/server/http";
import { CalcPool, QueueFullError } from "./pool";
import { runCalcTask, type CalcTaskName, type CalcTasks } from "./tasks";

export { CalcPool, QueueFullError };

/** The headers of `json(…)`: a pooled answer is indistinguishable from one computed in process. */
const JSON_HEADERS = { "content-type": "application/json; charset=utf-8", "cache-control": "no-store" } as const;

/** File name of the bundled worker in the build (next to entry.mjs in dist/server). */
export const BUILT_WORKER_FILE = "calc-worker.mjs";

/**
 * The worker's entry: the bundled file when running from the build (this module then sits in
 * dist/server/chunks or below, the worker in dist/server), else the TypeScript sources through tsx.
 */
export function calcWorkerFile(): URL {
  const here = import.meta.url;
  let dir = new URL(".", here);
  for (let up = 0; up < 5; up++) {
    const candidate = new URL(BUILT_WORKER_FILE, dir);
    if (existsSync(candidate)) return candidate;
    dir = new URL("..", dir);
  }
  const dev = "./worker.dev.mjs";
  return new URL(dev, here);
}

/** Pool size when CALC_WORKERS is not set: one thread per core but one, at least one. */
export const defaultCalcWorkers = () => Math.max(1, availableParallelism() - 1);

let shared: CalcPool | null | undefined;

/** The process's pool, started on first use; null when CALC_WORKERS=0 (compute on the main thread). */
export function sharedCalcPool(): CalcPool | null {
  if (shared === undefined) {
    const env = calcEnv();
    const workers = env.CALC_WORKERS ?? defaultCalcWorkers();
    shared = workers === 0 ? null : new CalcPool({ workers, queueLimit: env.CALC_QUEUE_LIMIT, workerFile: calcWorkerFile() });
  }
  return shared;
}

/** Runs a validated calculation in `pool` (null: on this thread) and parses its JSON answer; a full queue throws QueueFullError. */
export async function runCalc<K extends CalcTaskName, R>(pool: CalcPool | null, task: K, input: CalcTasks[K]): Promise<R> {
  const text = pool ? new TextDecoder().decode(await pool.run(task, input)) : runCalcTask(task, input);
  return JSON.parse(text) as R;
}

/** Answers a validated calculation request through `pool` (null: on the main thread). */
export async function calcResponseWith<K extends CalcTaskName>(pool: CalcPool | null, task: K, input: CalcTasks[K]): Promise<Response> {
  if (!pool) return new Response(runCalcTask(task, input), { status: 200, headers: JSON_HEADERS });
  let bytes: Uint8Array;
  try {
    bytes = await pool.run(task, input);
  } catch (err) {
    if (!(err instanceof QueueFullError)) throw err;
    const res = problem(503, `Every calculation worker is busy and ${pool.queued} requests are waiting; try again in ${err.retryAfterS} s.`);
    res.headers.set("retry-after", String(err.retryAfterS));
    return res;
  }
  return new Response(bytes as Uint8Array<ArrayBuffer>, { status: 200, headers: JSON_HEADERS });
}

/** Answers a validated calculation request through the shared pool. */
export const calcResponse = <K extends CalcTaskName>(task: K, input: CalcTasks[K]): Promise<Response> =>
  calcResponseWith(sharedCalcPool(), task, input);
