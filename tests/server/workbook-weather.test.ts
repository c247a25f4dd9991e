// A project's weather file reaches its workbook: the draft's hourly sheets come from the file's irradiance and
// equal POST /calc/schedule with the same weather; a revision issued with the file keeps its weather, so its
// workbook is unchanged after the file is removed, and its cover names the file and its SHA-256. The weather
// year is invented (scripts/weather-year.ts, the same generator as the upload tests and the bench).
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createHash } from "node:crypto";
import { eq } from "drizzle-orm";
import ExcelJS from "exceljs";
import { db, pool } from "@/lib/server/db/client";
import { facade, scheduleRevision } from "@/lib/server/db/schema";
import { createProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { RevisionResponse, RevisionSnapshot } from "@/lib/contracts/results";
import type { ScheduleResponse } from "@/lib/contracts/schedule";
import { planRequest, workbookFile, workbookPlan } from "@/lib/server/services/workbook";
import { POST as postWeather, DELETE as deleteWeather } from "@/pages/api/v1/projects/[id]/weather/index";
import { POST as issueRoute } from "@/pages/api/v1/projects/[id]/revisions/index";
import { GET as revisionRoute } from "@/pages/api/v1/projects/[id]/revisions/[rev]";
import { POST as scheduleRoute } from "@/pages/api/v1/calc/schedule";
import { callRoute, newOwner, type RouteCaller } from "./helpers";
import { clear, double, insertMakeup, insertOption } from "./workspace-fixtures";
import { weatherCsv } from "@scripts/weather-year";

afterAll(() => pool.end());
// Exports run on their thread, compiled from the sources in tests: generous on a busy machine.
vi.setConfig({ testTimeout: 60_000, hookTimeout: 60_000 });

const YEAR = 2025;
/** A site of this run's own, so that cached results of an earlier run on the same database are never met. */
const LONGITUDE = -8.61 + Math.round(Math.random() * 1e6) / 1e9;
const sha = (b: string | Uint8Array) => createHash("sha256").update(b).digest("hex");
const csv = weatherCsv({ year: YEAR, latitudeDeg: 41.15, longitudeDeg: LONGITUDE, times: "utc" });

let owner: RouteCaller;
let projectId: string;
let layers: unknown[];

function uploadRequest(path: string, content: string, fileName: string): Request {
  const form = new FormData();
  form.set("file", new Blob([content], { type: "text/csv" }), fileName);
  return new Request(`http://127.0.0.1${path}`, { method: "POST", body: form });
}
const send = async (route: unknown, request: Request) =>
  (await (route as (c: unknown) => Promise<Response>)({
    request,
    url: new URL(request.url),
    params: { id: projectId },
    locals: { user: owner },
  })) as Response;

/** Every sheet's cell values, row by row (formulas by their cached results). */
async function cells(bytes: Buffer): Promise<Map<string, unknown[][]>> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as never);
  const out = new Map<string, unknown[][]>();
  wb.eachSheet((ws) => {
    const rows: unknown[][] = [];
    ws.eachRow({ includeEmpty: true }, (row) =>
      rows.push((row.values as unknown[]).map((v) => (v && typeof v === "object" && "result" in v ? (v as { result: unknown }).result : v))),
    );
    out.set(ws.name, rows);
  });
  return out;
}

beforeAll(async () => {
  const o = await newOwner("workbook-weather");
  owner = { id: o.userId, name: "Test weather workbook", email: o.email };
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Weather workbook block",
      siteName: "Invented quay",
      latitudeDeg: 41.15,
      longitudeDeg: LONGITUDE,
      timeZone: "Europe/Lisbon",
      facades: [{ name: "South", azimuthDeg: 180, glazedAreaM2: 40 }],
    }),
    o.userId,
  );
  projectId = p.id;
  const south = (await db.select().from(facade).where(eq(facade.projectId, p.id)))[0]!.id;
  layers = double(clear(6), clear(4));
  const mk = await insertMakeup(o.organizationId, "Clear double", layers);
  await insertOption(p.id, south, mk, "S clear", "approved");
  const up = await send(postWeather, uploadRequest(`/api/v1/projects/${projectId}/weather`, csv, "quay-2025.csv"));
  expect(up.status).toBe(201);
});

describe("the workbook with a weather file", () => {
  let issuedBytes: Buffer;

  it("the draft's hourly sheet is computed from the file, as POST /calc/schedule computes it with the same weather", async () => {
    const plan = await workbookPlan({ projectId, revision: null });
    expect(plan.irradiance).toMatchObject({ source: "weather series", fileName: "quay-2025.csv", sha256: sha(csv), hours: 8760 });
    const request = planRequest(plan, [plan.hourly[0]!.surface]);
    expect(request.weather).toHaveLength(8760);
    const engine = await callRoute(scheduleRoute as never, owner, "/api/v1/calc/schedule", {}, { method: "POST", body: request });
    expect(engine.status).toBe(200);
    const rows = (engine.body as ScheduleResponse).surfaces[0]!.rows;
    const book = await cells((await workbookFile({ projectId, revision: null })).bytes);
    const cover = book.get([...book.keys()][0]!)!;
    expect(cover.flat().join(" ")).toContain(`weather file quay-2025.csv: 8760 hours from 2025-01-01 to 2025-12-31 (SHA-256 ${sha(csv)})`);
    const hourlyName = [...book.keys()].find((n) => n.includes("South"))!;
    const sheet = book.get(hourlyName)!;
    const headerAt = sheet.findIndex((r) => r.some((v) => typeof v === "string" && v.startsWith("Transmitted solar irradiance")));
    const col = sheet[headerAt]!.findIndex((v) => typeof v === "string" && v.startsWith("Transmitted solar irradiance"));
    const data = sheet.slice(headerAt + 1).filter((r) => typeof r[col] === "number");
    expect(data).toHaveLength(8760);
    // The sheet rounds each value to 0.01 W/m² at most (its number format keeps the full value; compare to 1e-9).
    data.forEach((r, i) => expect(Math.abs((r[col] as number) - rows[i]!.transmittedWm2)).toBeLessThan(1e-9));
  });

  it("a revision issued with the file keeps its weather: its workbook is the same after the file is removed", async () => {
    const issued = await callRoute(
      issueRoute as never,
      owner,
      `/api/v1/projects/${projectId}/revisions`,
      { id: projectId },
      { method: "POST", body: { note: "with measured weather", year: YEAR } },
    );
    expect(issued.status, JSON.stringify(issued.body).slice(0, 300)).toBe(201);
    const stored = (await db.select().from(scheduleRevision).where(eq(scheduleRevision.projectId, projectId)))[0]!.snapshot as RevisionSnapshot;
    expect(stored.irradiance).toMatchObject({ source: "weather series", sha256: sha(csv) });
    expect(stored.weather).toHaveLength(8760);
    // The API says where the irradiance came from but leaves the year of rows on the server.
    const answer = await callRoute(revisionRoute as never, owner, `/api/v1/projects/${projectId}/revisions/A`, { id: projectId, rev: "A" });
    expect((answer.body as RevisionResponse).snapshot.irradiance).toMatchObject({ source: "weather series", sha256: sha(csv) });
    expect("weather" in (answer.body as RevisionResponse).snapshot).toBe(false);

    issuedBytes = (await workbookFile({ projectId, revision: "A" })).bytes;
    const removed = await send(deleteWeather, new Request(`http://127.0.0.1/api/v1/projects/${projectId}/weather`, { method: "DELETE" }));
    expect(removed.status).toBe(204);
    const again = await workbookFile({ projectId, revision: "A" });
    const before = await cells(issuedBytes);
    const after = await cells(again.bytes);
    expect([...after.keys()]).toEqual([...before.keys()]);
    for (const name of before.keys()) if (name !== [...before.keys()][0]) expect(after.get(name), name).toEqual(before.get(name));
    // The draft, meanwhile, is back on the clear sky.
    const draft = await workbookPlan({ projectId, revision: null });
    expect(draft.irradiance).toEqual({ source: "clear sky" });
  });
});
