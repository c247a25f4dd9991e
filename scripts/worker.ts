/**
 * npm run worker: the job worker (e-mail deliveries) as a process of its own, for web servers started with
 * WORKER=off, or to add workers beside them; all share the queue in DATABASE_URL's PostgreSQL.
 * SIGTERM / SIGINT: the job in hand finishes (up to 10 s), then the process ends.
 */
import { shutdownWorker, startWorker } from "@/lib/server/jobs/main";

startWorker();
let stopping = false;
const stop = (signal: string) => {
  if (stopping) return;
  stopping = true;
  console.log(`[jobs] ${signal}: stopping the worker…`);
  shutdownWorker(10_000)
    .catch((err: Error) => console.error(`[jobs] ${err.message}`))
    .finally(() => process.exit(0));
};
process.once("SIGTERM", () => stop("SIGTERM"));
process.once("SIGINT", () => stop("SIGINT"));
