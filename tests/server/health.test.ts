// GET /api/health: 200 with a reachable database, 503 (never a hang or a 500) with an unreachable one.
import { afterEach, describe, expect, it, vi } from "vitest";
import net from "node:net";

const original = process.env.DATABASE_URL;
afterEach(() => {
  process.env.DATABASE_URL = original;
  vi.resetModules();
});

async function callHealth(): Promise<Response> {
  vi.resetModules();
  const mod = await import("@/pages/api/health");
  const res = await (mod.GET as (ctx: unknown) => Promise<Response>)({});
  const { pool } = await import("@/lib/server/db/client");
  await pool.end();
  return res;
}

/** A loopback port with nothing listening on it. */
async function closedPort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, "127.0.0.1", () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

describe("health endpoint", () => {
  it("answers 200 and database up", async () => {
    const res = await callHealth();
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({ status: "ok", database: "up" });
  });

  it("answers 503 within the 2-second budget when the database is unreachable", async () => {
    process.env.DATABASE_URL = `postgres://postgres@127.0.0.1:${await closedPort()}/nothing`;
    const t0 = Date.now();
    const res = await callHealth();
    expect(res.status).toBe(503);
    expect(res.headers.get("retry-after")).toMatch(/^\d+$/);
    expect(await res.json()).toMatchObject({ database: "down" });
    expect(Date.now() - t0).toBeLessThan(5000);
  });

  it("does not reveal where the database is when it is unreachable", async () => {
    const port = await closedPort();
    process.env.DATABASE_URL = `postgres://postgres@127.0.0.1:${port}/nothing`;
    const text = await (await callHealth()).text();
    expect(text).not.toContain(String(port));
    expect(text).not.toContain("127.0.0.1");
    expect(text).not.toMatch(/ECONNREFUSED|postgres:/);
  });
});
