// The pool survives connections that PostgreSQL terminates: idle ones, and checked-out ones between two
// statements (a client with no query in flight emits "error"; without a listener that ends the process).
import { afterAll, afterEach, beforeEach, describe, expect, it } from "vitest";
import pg from "pg";
import { pool, survivingLostConnections } from "@/lib/server/db/client";

const admin = new pg.Client({ connectionString: process.env.DATABASE_URL });
await admin.connect();
afterAll(() => admin.end());

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const terminate = (pid: number) => admin.query("select pg_terminate_backend($1)", [pid]);
const backendPid = (c: pg.PoolClient) => (c as unknown as { processID: number }).processID;

/** Errors that nothing handled (in a server process, each of these ends it). */
let uncaught: unknown[] = [];
const onUncaught = (err: unknown) => uncaught.push(err);
beforeEach(() => {
  uncaught = [];
  process.on("uncaughtException", onUncaught);
});
afterEach(() => {
  process.off("uncaughtException", onUncaught);
});

describe("database pool and lost connections", () => {
  it("a checked-out client whose connection is terminated between statements fails its next statement, not the process", async () => {
    const client = await pool.connect();
    await client.query("begin");
    await terminate(backendPid(client));
    await sleep(300); // the termination notice and the socket close arrive while no query is in flight
    expect(uncaught).toEqual([]);
    await expect(client.query("select 1")).rejects.toThrow();
    client.release();
    // The broken client is not handed out again: the next statement gets a fresh connection.
    expect((await pool.query("select 1 as one")).rows[0]).toEqual({ one: 1 });
  });

  it("an idle client whose connection is terminated is dropped from the pool", async () => {
    const client = await pool.connect();
    const pid = backendPid(client);
    client.release();
    await terminate(pid);
    await sleep(300);
    expect(uncaught).toEqual([]);
    const { rows } = await pool.query<{ pid: number }>("select pg_backend_pid() as pid");
    expect(rows[0]!.pid).not.toBe(pid);
  });

  it("an unhandled rejection that is a lost connection is logged, any other is rethrown", () => {
    expect(process.listeners("unhandledRejection")).toContain(survivingLostConnections);
    const lost = Object.assign(new Error("terminating connection due to administrator command"), { code: "57P01" });
    expect(() => survivingLostConnections(lost)).not.toThrow();
    const bug = new TypeError("cannot read properties of undefined");
    expect(() => survivingLostConnections(bug)).toThrow(bug);
  });
});
