import type { APIRoute } from "astro";
import { pool } from "@/lib/server/db/client";
import { RETRY_AFTER_SECONDS } from "@/lib/server/db/unavailable";
import { json } from "@/lib/server/http";

/**
 * 200 when the database answers within 2 s, 503 with Retry-After otherwise. Not written with
 * `endpoint(…)`: it takes no input, needs no session, and its 503 body is a status report rather than
 * a problem. The body never carries the driver's message: that names the database's host and port.
 */
export const GET: APIRoute = async () => {
  const started = performance.now();
  let timer: ReturnType<typeof setTimeout> | undefined;
  try {
    await Promise.race([
      pool.query("select 1"),
      new Promise((_, reject) => (timer = setTimeout(() => reject(new Error("timed out after 2 s")), 2000))),
    ]);
    return json({ status: "ok", database: "up", databaseLatencyMs: Math.round((performance.now() - started) * 10) / 10 });
  } catch (err) {
    console.error("[health] database check failed:", (err as Error).message);
    return json({ status: "unavailable", database: "down", retryAfterSeconds: RETRY_AFTER_SECONDS }, 503, {
      "retry-after": String(RETRY_AFTER_SECONDS),
    });
  } finally {
    clearTimeout(timer);
  }
};
