/**
 * Entry of the workbook export thread: receives a workbook plan (plain data) as `workerData`, writes the
 * workbook with exceljs' streaming writer on this thread (its hourly schedules computed here too), and
 * passes the bytes to the main thread chunk by chunk, each after the previous one was taken (backpressure).
 * The build bundles this file into dist/server/workbook-thread.mjs.
 */
import { Writable } from "node:stream";
import { parentPort, workerData } from "node:worker_threads";
import { writeWorkbookPlan, type WorkbookPlan } from "@/lib/server/services/workbook";
import type { ThreadMessage } from "./protocol";

const port = parentPort;
if (!port) throw new Error("workbook thread: must run in a worker thread");

let taken: (() => void) | null = null;
port.on("message", (m: unknown) => {
  if (m === "taken" && taken) {
    const next = taken;
    taken = null;
    next();
  }
});
const post = (m: ThreadMessage, transfer: ArrayBuffer[] = []) => port.postMessage(m, transfer);

const sink = new Writable({
  write(chunk: Buffer, _encoding, done) {
    const bytes = new Uint8Array(chunk); // a copy: a Buffer may share its memory with others
    taken = () => done();
    post({ chunk: bytes }, [bytes.buffer as ArrayBuffer]);
  },
  final(done) {
    post({ end: true });
    done();
  },
});

writeWorkbookPlan(workerData.plan as WorkbookPlan, sink, { pool: null }).then(
  () => port.close(),
  (err: unknown) => {
    const e = err instanceof Error ? err : new Error(String(err));
    post({ error: { name: e.name, message: e.message } });
    port.close();
  },
);
