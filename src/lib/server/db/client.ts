import pg from "pg";
import { drizzle } from "drizzle-orm/node-postgres";
import { serverEnv } from "@/lib/server/env";
import { isDatabaseUnavailable } from "./unavailable";
import * as schema from "./schema";

/**
 * One pool per process; connections open lazily on first query. While the database is away, a
 * request fails within about a second (connect timeout, also the longest wait for a free client)
 * and is answered 503; the pool opens fresh connections once the database is back.
 */
export const pool = new pg.Pool({
  connectionString: serverEnv().DATABASE_URL,
  max: 10,
  connectionTimeoutMillis: 1_000,
  idleTimeoutMillis: 30_000,
  // A dead peer is noticed by TCP keepalive; a query that gets no answer at all fails after 15 s.
  keepAlive: true,
  query_timeout: 15_000,
});

// An idle client losing its server must not take the process down (the pool drops it).
pool.on("error", (err) => console.error("[db] idle client error:", err.message));
// Nor a checked-out one: between two statements of a transaction a client has no query to hand the
// error to, and a client emitting "error" with no listener ends the process. The statement in
// progress or the next one fails instead, and the pool discards the broken client on release.
pool.on("connect", (client) => {
  client.on("error", (err) => console.error("[db] connection lost:", err.message));
});

/**
 * Last line of defence: a promise rejected by a lost connection that nobody awaits (a background
 * write of a library, say) is logged instead of ending the process. Any other unhandled rejection
 * is rethrown, which keeps Node's default of ending the process for real bugs.
 */
export function survivingLostConnections(reason: unknown): void {
  if (!isDatabaseUnavailable(reason)) throw reason;
  console.error("[db] unhandled rejection while the database is unavailable:", (reason as Error).message);
}
const GUARD = Symbol.for("paneray.db.unhandledRejectionGuard");
const registry = globalThis as { [GUARD]?: true };
if (!registry[GUARD]) {
  registry[GUARD] = true;
  process.on("unhandledRejection", survivingLostConnections);
}

export const db = drizzle(pool, { schema });
export type Db = typeof db;
