import pg from "pg";
import { drizzle } from "drizzle-orm/node-postgres";
import { serverEnv } from "@/lib/server/env";
import * as schema from "./schema";

/** One pool per process; connections open lazily on first query. */
export const pool = new pg.Pool({
  connectionString: serverEnv().DATABASE_URL,
  max: 10,
  connectionTimeoutMillis: 5_000,
  idleTimeoutMillis: 30_000,
});
// An idle client losing its server must not take the process down.
pool.on("error", (err) => console.error("[db] idle client error:", err.message));

export const db = drizzle(pool, { schema });
export type Db = typeof db;
