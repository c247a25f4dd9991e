/**
 * Workbook exports on a thread of their own, with a bounded heap: a full-year export of 24 façades allocates
 * a great deal as it goes, and on the main thread V8 would let the heap grow towards its limit for the whole
 * machine before collecting, taking the process's memory with it. On its own thread with
 * `resourceLimits.maxOldGenerationSizeMb` the export collects as it goes (the process stays near 230 MB at its
 * peak, `npm run bench -- workbook`), the main thread's heap is untouched (page requests keep their speed),
 * and an export that ran out of its heap fails alone, never the process. At most EXPORT_THREADS at once;
 * further exports wait their turn.
 */
import { existsSync } from "node:fs";
import type { Writable } from "node:stream";
import { Worker } from "node:worker_threads";
import type { ThreadMessage } from "./protocol";

/** The old-space limit of an export thread (MB): a full-year export of 24 façades lives in about 100 MB. */
export const EXPORT_HEAP_MB = 256;
/** Exports running at once; the next waits for one to finish. */
export const EXPORT_THREADS = 2;
/** File name of the bundled thread in the build (next to entry.mjs in dist/server). */
export const BUILT_THREAD_FILE = "workbook-thread.mjs";

/**
 * The thread's entry: the bundled file when running from the build (this module then sits somewhere below
 * dist/server, as deep as the page that imports it), else the TypeScript sources through tsx.
 */
export function workbookThreadFile(): URL {
  let dir = new URL(".", import.meta.url);
  for (let up = 0; up < 10; up++) {
    const candidate = new URL(BUILT_THREAD_FILE, dir);
    if (existsSync(candidate)) return candidate;
    dir = new URL("..", dir);
  }
  return new URL("./thread.dev.mjs", import.meta.url);
}

let running = 0;
const waiting: (() => void)[] = [];
async function turn(): Promise<() => void> {
  if (running >= EXPORT_THREADS) await new Promise<void>((resolve) => waiting.push(resolve));
  running++;
  return () => {
    running--;
    waiting.shift()?.();
  };
}

/**
 * Writes the plan's workbook into `out` from an export thread, and ends `out`; rejects if the thread fails.
 * `plan` is a `WorkbookPlan` of lib/server/services/workbook (plain data; typed there, which calls this).
 */
export async function writeWorkbookInThread(plan: object, out: Writable, opts: { heapMb?: number } = {}): Promise<void> {
  const release = await turn();
  try {
    await new Promise<void>((resolve, reject) => {
      const worker = new Worker(workbookThreadFile(), {
        name: "paneray-workbook",
        workerData: { plan },
        resourceLimits: { maxOldGenerationSizeMb: opts.heapMb ?? EXPORT_HEAP_MB },
      });
      let settled = false;
      const settle = (err?: Error) => {
        if (settled) return;
        settled = true;
        if (err) reject(err);
        else resolve();
      };
      worker.on("message", (m: ThreadMessage) => {
        if ("chunk" in m) {
          const more = out.write(Buffer.from(m.chunk.buffer, m.chunk.byteOffset, m.chunk.byteLength));
          if (more) worker.postMessage("taken");
          else out.once("drain", () => worker.postMessage("taken"));
        } else if ("end" in m) {
          out.end();
          settle();
        } else settle(Object.assign(new Error(m.error.message), { name: m.error.name }));
      });
      worker.on("error", (err) => settle(err));
      worker.on("exit", (code) => settle(new Error(`the workbook thread stopped before the end (exit code ${code})`)));
      // A download given up by the client: stop the work.
      out.once("close", () => {
        if (!settled) void worker.terminate();
      });
    });
  } finally {
    release();
  }
}
