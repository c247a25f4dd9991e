// A lost or refused database connection is an outage (503 with Retry-After), not a bug (500).
import { describe, expect, it } from "vitest";
import type { APIContext } from "astro";
import { withProblems } from "@/lib/server/http";
import { isDatabaseUnavailable } from "@/lib/server/db/unavailable";

const withCode = (message: string, code: string) => Object.assign(new Error(message), { code });

/** The shapes node-postgres, pg-pool, Node's sockets and Drizzle's wrapper give such failures. */
const outages: [string, unknown][] = [
  ["admin shutdown (57P01)", withCode("terminating connection due to administrator command", "57P01")],
  ["cannot connect now (57P03)", withCode("the database system is shutting down", "57P03")],
  ["connection exception class 08", withCode("connection failure", "08006")],
  ["refused socket", withCode("connect ECONNREFUSED 127.0.0.1:5999", "ECONNREFUSED")],
  ["refused on every address", Object.assign(new AggregateError([withCode("connect ECONNREFUSED ::1:5999", "ECONNREFUSED")], ""), {})],
  ["lost mid-query", new Error("Connection terminated unexpectedly")],
  ["pool connect timeout", new Error("timeout exceeded when trying to connect")],
  ["wrapped by the query builder", new Error("Failed query: insert into project …", { cause: withCode("terminating connection", "57P01") })],
];

const ctx = {
  request: new Request("http://127.0.0.1/api/v1/projects", { method: "POST" }),
  url: new URL("http://127.0.0.1/api/v1/projects"),
} as APIContext;
const failingWith = (err: unknown) =>
  withProblems(() => {
    throw err;
  })(ctx) as Promise<Response>;

describe("database outages at the HTTP edge", () => {
  it.each(outages)("%s is recognised", (_, err) => {
    expect(isDatabaseUnavailable(err)).toBe(true);
  });

  it.each(outages)("%s is answered 503 problem+json with Retry-After", async (_, err) => {
    const res = await failingWith(err);
    expect(res.status).toBe(503);
    expect(res.headers.get("content-type")).toMatch(/^application\/problem\+json/);
    expect(Number(res.headers.get("retry-after"))).toBeGreaterThan(0);
    const body = (await res.json()) as { status: number; detail: string };
    expect(body.status).toBe(503);
    expect(body.detail).not.toMatch(/127\.0\.0\.1|5999|ECONNREFUSED/);
  });

  it.each([
    ["a unique violation", withCode('duplicate key value violates unique constraint "project_pkey"', "23505")],
    ["a syntax error", withCode("syntax error at or near", "42601")],
    ["a plain bug", new TypeError("cannot read properties of undefined")],
    ["a non-error", "just a string"],
  ])("%s stays a 500", async (_, err) => {
    expect(isDatabaseUnavailable(err)).toBe(false);
    const res = await failingWith(err);
    expect(res.status).toBe(500);
    expect(res.headers.get("retry-after")).toBeNull();
  });
});
