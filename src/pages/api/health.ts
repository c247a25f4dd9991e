import type { APIRoute } from "astro";
import { pool } from "@/lib/server/db/client";
import { json } from "@/lib/server/http";

/**
 * 200 when the database answers within 2 s, 503 otherwise. Not written with `endpoint(…)`: it takes
 * no input, needs no session, and its 503 body is a status report rather than a problem.
 */
export const GET: APIRoute = async () => {
  const started = performance.now();
  try {
    await Promise.race([pool.query("select 1"), new Promise((_, reject) => setTimeout(() => reject(new Error("timed out after 2 s")), 2000))]);
    return json({ status: "ok", database: "up", databaseLatencyMs: Math.round((performance.now() - started) * 10) / 10 });
  } catch (err) {
    return json({ status: "unavailable", database: "down", detail: (err as Error).message }, 503);
  }
};
