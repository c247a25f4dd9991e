/**
 * The job queue: pg-boss on the product's own PostgreSQL (its tables live in the schema `pgboss`, which pg-boss
 * creates and migrates itself when it starts). Every process that sends or works jobs starts one instance here;
 * they share the queue through the database, so several web servers and workers can run side by side.
 *
 * pg-boss runs its SQL through our pool (`db/client.ts`), so a lost database behaves as everywhere else: a
 * statement fails within about a second, nothing ends the process, and the next one succeeds once it is back.
 */
import PgBoss from "pg-boss";
import type pg from "pg";
import { pool } from "@/lib/server/db/client";
import { serverEnv } from "@/lib/server/env";

/** The queue of e-mail deliveries; a job's data is `{ deliveryId }`. */
export const DELIVERY_QUEUE = "delivery-mail";

/** A started delivery job that sends nothing for this long is expired by the queue and retried. */
export const DELIVERY_JOB_EXPIRE_SECONDS = 300;

/** Lets pg-boss run its statements on a client of ours (a transaction's, or the pool). */
export const sqlOn = (c: Pick<pg.Pool | pg.PoolClient, "query">): PgBoss.Db => ({
  executeSql: async (text: string, values: unknown[]) => c.query(text, values),
});

/** Retry settings of a delivery job: retryLimit retries after the first attempt, with exponential backoff. */
export function deliveryRetry(): Required<PgBoss.RetryOptions> {
  const env = serverEnv();
  return { retryLimit: env.DELIVERY_RETRY_LIMIT, retryDelay: env.DELIVERY_RETRY_DELAY_SECONDS, retryBackoff: true };
}

export interface QueueRole {
  /** Runs the queue's upkeep (expiring stalled jobs, archiving finished ones): only processes that work jobs. */
  supervise: boolean;
}

let started: Promise<PgBoss> | undefined;
let instance: PgBoss | undefined;

/**
 * The process's started queue. A failed start (the database away) is forgotten, so the next call tries again;
 * the caller decides whether that is a 503 (a request) or a later retry (a worker).
 */
export function queue(role: QueueRole = { supervise: false }): Promise<PgBoss> {
  if (!started) {
    const boss = new PgBoss({
      db: sqlOn(pool),
      supervise: role.supervise,
      schedule: false,
      migrate: true,
      pollingIntervalSeconds: serverEnv().JOB_POLL_SECONDS,
    });
    boss.on("error", (err) => console.error("[jobs] queue error:", err.message));
    started = boss
      .start()
      .then(async (b) => {
        await b.createQueue(DELIVERY_QUEUE, { name: DELIVERY_QUEUE, ...deliveryRetry(), expireInSeconds: DELIVERY_JOB_EXPIRE_SECONDS });
        instance = b;
        return b;
      })
      .catch(async (err: unknown) => {
        started = undefined;
        await boss.stop({ graceful: false, close: false }).catch(() => {});
        throw err;
      });
  }
  return started;
}

/** Stops this process's queue: workers finish the job in hand (up to `timeoutMs`), then nothing more is fetched. */
export async function stopQueue(timeoutMs = 10_000): Promise<void> {
  const b = instance;
  started = undefined;
  instance = undefined;
  if (b) await b.stop({ graceful: true, close: false, wait: true, timeout: timeoutMs });
}
