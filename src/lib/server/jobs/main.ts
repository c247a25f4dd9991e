/**
 * Entry of the job worker bundle (dist/server/jobs.mjs, built next to entry.mjs): scripts/server.mjs imports it
 * to run the worker inside the web server; scripts/worker.ts runs the same functions from the sources.
 */
import { serverEnv } from "@/lib/server/env";
import { pool } from "@/lib/server/db/client";
import { startWorker, stopWorker } from "./worker";

export { startWorker, stopWorker };

/** Whether this web server runs a worker itself (WORKER is not "off"). */
export const workerInServer = (): boolean => serverEnv().WORKER !== "off";

/** Stops the worker and closes its database pool. */
export async function shutdownWorker(timeoutMs = 10_000): Promise<void> {
  await stopWorker(timeoutMs);
  await pool.end().catch(() => {});
}
