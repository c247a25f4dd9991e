/**
 * The job worker: takes delivery jobs from the queue one at a time and runs `attemptDelivery` on each. It runs
 * inside the web server by default (scripts/server.mjs starts it from `dist/server/jobs.mjs` unless WORKER=off)
 * or as a process of its own (`npm run worker`, scripts/worker.ts); any number of either can share one database.
 *
 * While the database is away the worker keeps trying to start (every few seconds, logged, never ending the
 * process); once started, pg-boss's own polling survives an outage the same way (its errors are logged).
 */
import type PgBoss from "pg-boss";
import { DELIVERY_QUEUE, queue, stopQueue } from "./queue";
import { attemptDelivery, failAbandonedDeliveries } from "@/lib/server/services/deliveries";

const RESTART_DELAY_MS = 5_000;
/** How often the worker looks for deliveries whose job failed for good while the delivery still said "on its way". */
const SWEEP_EVERY_MS = 60_000;
let sweepTimer: ReturnType<typeof setInterval> | undefined;

function sweep(): void {
  failAbandonedDeliveries().then(
    (n) => n && console.log(`[jobs] ${n} deliveries whose last attempt was cut short marked failed`),
    (err: Error) => console.error(`[jobs] the sweep of cut-short deliveries failed (${err.message}); trying again later`),
  );
}

let running = false;
let retryTimer: ReturnType<typeof setTimeout> | undefined;

async function startOnce(): Promise<void> {
  const boss = await queue({ supervise: true });
  await boss.work<{ deliveryId?: unknown }>(
    DELIVERY_QUEUE,
    { batchSize: 1, includeMetadata: true },
    async (jobs: PgBoss.JobWithMetadata<{ deliveryId?: unknown }>[]) => {
      for (const job of jobs) {
        const id = job.data?.deliveryId;
        if (typeof id !== "string") continue; // not one of ours: nothing to do
        const outcome = await attemptDelivery(id, { retryCount: job.retryCount, retryLimit: job.retryLimit });
        console.log(`[jobs] delivery ${id}: ${outcome} (attempt ${job.retryCount + 1})`);
      }
    },
  );
  console.log(`[jobs] worker started on queue ${DELIVERY_QUEUE}`);
  sweep();
  sweepTimer ??= setInterval(sweep, SWEEP_EVERY_MS);
  sweepTimer.unref();
}

/** Starts the worker; resolves at once and keeps retrying in the background while the database is away. */
export function startWorker(): void {
  if (running) return;
  running = true;
  const attempt = () => {
    retryTimer = undefined;
    startOnce().catch((err: Error) => {
      if (!running) return;
      console.error(`[jobs] the worker could not start (${err.message}); trying again in ${RESTART_DELAY_MS / 1000} s`);
      retryTimer = setTimeout(attempt, RESTART_DELAY_MS);
      retryTimer.unref();
    });
  };
  attempt();
}

/** Stops taking jobs; the one in hand finishes (up to `timeoutMs`). */
export async function stopWorker(timeoutMs = 10_000): Promise<void> {
  running = false;
  if (retryTimer) clearTimeout(retryTimer);
  if (sweepTimer) clearInterval(sweepTimer);
  sweepTimer = undefined;
  await stopQueue(timeoutMs);
}
