// The workbook export thread: the workbook it writes is the one written on the main thread (every cell of every
// sheet, read back with exceljs), and an export that runs out of its bounded heap fails alone — the process
// and the next export carry on.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { PassThrough } from "node:stream";
import { eq } from "drizzle-orm";
import ExcelJS from "exceljs";
import { db, pool } from "@/lib/server/db/client";
import { facade } from "@/lib/server/db/schema";
import { createProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { workbookPlan, writeWorkbookPlan, type WorkbookPlan } from "@/lib/server/services/workbook";
import { writeWorkbookInThread } from "@/lib/server/workbook-thread";
import { newOwner } from "./helpers";
import { clear, double, insertMakeup, insertOption, tinted } from "./workspace-fixtures";

afterAll(() => pool.end());
// Exports run on their thread, compiled from the sources in tests: generous on a busy machine.
vi.setConfig({ testTimeout: 60_000, hookTimeout: 60_000 });

/** A site of this run's own (the results cache is shared by equal inputs). */
const LONGITUDE = -8.61 + Math.round(Math.random() * 1e6) / 1e9;
let plan: WorkbookPlan;

async function bytesOf(write: (out: PassThrough) => Promise<void>): Promise<Buffer> {
  const out = new PassThrough();
  const chunks: Buffer[] = [];
  out.on("data", (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve, reject) => out.on("end", resolve).on("error", reject));
  await write(out);
  await ended;
  return Buffer.concat(chunks);
}

async function cellsOf(bytes: Buffer): Promise<unknown[]> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as never);
  const out: unknown[] = [];
  // "Written (date and time, UTC)" of a draft differs between two writings: compared without it.
  wb.eachSheet((ws) =>
    ws.eachRow((row) => out.push(ws.name, JSON.stringify(row.values).replace(/\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z/g, "<now>"))),
  );
  return out;
}

beforeAll(async () => {
  const o = await newOwner("workbook-thread");
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Thread workbook block",
      siteName: "Invented yard",
      latitudeDeg: 41.15,
      longitudeDeg: LONGITUDE,
      timeZone: "Europe/Lisbon",
      facades: [
        { name: "South", azimuthDeg: 180, glazedAreaM2: 30 },
        { name: "West", azimuthDeg: 270 },
      ],
    }),
    o.userId,
  );
  const fs = await db.select().from(facade).where(eq(facade.projectId, p.id));
  const a = await insertMakeup(o.organizationId, "Clear double", double(clear(6), clear(4)));
  const b = await insertMakeup(o.organizationId, "Tinted double", double(tinted(6), clear(4)));
  await insertOption(p.id, fs.find((f) => f.name === "South")!.id, a, "S clear", "approved");
  await insertOption(p.id, fs.find((f) => f.name === "West")!.id, b, "W tinted", "approved");
  plan = await workbookPlan({ projectId: p.id, revision: null, year: 2025 });
});

describe("the workbook export thread", () => {
  it("writes the same workbook as the main thread, cell for cell", async () => {
    const threaded = await bytesOf((out) => writeWorkbookInThread(plan, out));
    const here = await bytesOf((out) => writeWorkbookPlan(plan, out, { pool: null }));
    const [a, b] = [await cellsOf(threaded), await cellsOf(here)];
    expect(a.length).toBeGreaterThan(2 * 8760);
    expect(a).toEqual(b);
  });

  it("an export that runs out of its heap fails alone; the next one succeeds", async () => {
    const out = new PassThrough();
    out.resume();
    await expect(writeWorkbookInThread(plan, out, { heapMb: 4 })).rejects.toThrow(/memory/i);
    const bytes = await bytesOf((o) => writeWorkbookInThread(plan, o));
    expect((await cellsOf(bytes)).length).toBeGreaterThan(2 * 8760);
  });
});
