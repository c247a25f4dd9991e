/**
 * Entry of a calculation worker thread: says { ready: true } once loaded, then receives { id, task, input }, answers { id, ok: true, bytes }
 * with the response body as UTF-8 (its buffer transferred, not copied) or { id, ok: false, error }
 * with the error's name, message and whether it is a RangeError. The build bundles this file into dist/server/calc-worker.mjs.
 */
import { constants, setPriority } from "node:os";
import { parentPort } from "node:worker_threads";
import { isCalcTaskName, runCalcTask } from "./tasks";
import type { WorkerReply, WorkerRequest } from "./protocol";

const port = parentPort;
if (!port) throw new Error("calc worker: must run in a worker thread");
const encoder = new TextEncoder();

// Lower this thread's scheduling priority (on Linux the nice value is per thread, so the main thread
// keeps its own): when the cores are busy, health checks and page requests go before long calculations.
try {
  setPriority(constants.priority.PRIORITY_BELOW_NORMAL);
} catch {
  // not permitted here: run at the normal priority
}

port.on("message", (msg: WorkerRequest) => {
  let reply: WorkerReply;
  try {
    if (!isCalcTaskName(msg.task)) throw new Error(`unknown calculation "${String(msg.task)}"`);
    const bytes = encoder.encode(runCalcTask(msg.task, msg.input as never));
    reply = { id: msg.id, ok: true, bytes };
    port.postMessage(reply, [bytes.buffer as ArrayBuffer]);
    return;
  } catch (err) {
    const e = err instanceof Error ? err : new Error(String(err));
    reply = { id: msg.id, ok: false, error: { name: e.name, message: e.message, range: e instanceof RangeError, stack: e.stack } };
  }
  port.postMessage(reply);
});

// Loaded and listening: the pool replaces this worker if it dies from now on.
port.postMessage({ ready: true } satisfies WorkerReply);
