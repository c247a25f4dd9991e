// A second start on the same data folder refuses and leaves the running PostgreSQL alone.
import { execFile } from "node:child_process";
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";

interface Run {
  code: number;
  stdout: string;
  stderr: string;
}

/** Runs a script with a hard time limit (the child is killed past it). */
function run(cmd: string, args: string[], env: Record<string, string | undefined> = {}, timeoutMs = 60_000): Promise<Run> {
  return new Promise((resolve) => {
    execFile(cmd, args, { env: { ...process.env, ...env }, timeout: timeoutMs, killSignal: "SIGKILL" }, (err, stdout, stderr) => {
      const code = err ? (typeof err.code === "number" ? err.code : -1) : 0;
      resolve({ code, stdout: String(stdout), stderr: String(stderr) });
    });
  });
}

async function answers(port: number): Promise<boolean> {
  const client = new pg.Client({ host: "127.0.0.1", port, user: "postgres", database: "postgres", connectionTimeoutMillis: 5000 });
  try {
    await client.connect();
    const r = await client.query("select 1 as one");
    return r.rows[0]?.one === 1;
  } catch {
    return false;
  } finally {
    await client.end().catch(() => {});
  }
}

const root = mkdtempSync(join(tmpdir(), "paneray-twice-"));
chmodSync(root, 0o755);
const pgDir = join(root, "pg");
const port = 20000 + (process.pid % 20000);

beforeAll(async () => {
  const up = await run("scripts/pg.sh", ["up", pgDir, String(port)], { PG_FSYNC: "off" });
  expect(up.code, up.stderr).toBe(0);
}, 90_000);

afterAll(async () => {
  await run("scripts/pg.sh", ["down", pgDir]);
  rmSync(root, { recursive: true, force: true });
}, 60_000);

describe("starting twice on one data folder", () => {
  it("pg.sh status reports the running server's pid and port", async () => {
    const s = await run("scripts/pg.sh", ["status", pgDir]);
    expect(s.code).toBe(0);
    expect(s.stdout.trim()).toMatch(new RegExp(`^\\d+ ${port}$`));
  });

  it("a second pg.sh up refuses, naming the running server, and the first still answers", async () => {
    const second = await run("scripts/pg.sh", ["up", pgDir, String(port + 1)]);
    expect(second.code).toBe(3);
    expect(second.stderr).toMatch(new RegExp(`already running .*pid \\d+ on port ${port}`));
    expect(await answers(port)).toBe(true);
  });

  it("a second npm start in the same folder refuses with a clear message and does not stop the first database", async () => {
    const second = await run("scripts/start.sh", [], { PANERAY_DATA: root, DATABASE_URL: "", PORT: String(port + 2) }, 120_000);
    expect(second.code).not.toBe(0);
    expect(second.stderr).toMatch(
      new RegExp(`Paneray is already running from this folder \\(PostgreSQL pid \\d+ on port ${port}\\); stop it first or set PANERAY_DATA`),
    );
    expect(await answers(port)).toBe(true);
  }, 150_000);
});
