// Uploads against PostgreSQL: measured panes into the library and a project's weather series, through the
// route handlers with real multipart bodies. Every problem at once with line and column, nothing saved on a
// refusal, the file kept with its SHA-256 (checked with node:crypto), the role rules, a 10 MB file refused
// without being read, and results that follow the weather and equal POST /api/v1/calc/schedule with it.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import { and, eq } from "drizzle-orm";
import type { APIRoute } from "astro";
import { db, pool } from "@/lib/server/db/client";
import { facade, libraryPane, projectEvent, upload, weatherSeries } from "@/lib/server/db/schema";
import { createProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { ResultsResponse } from "@/lib/contracts/results";
import type { ScheduleResponse } from "@/lib/contracts/schedule";
import { POST as importRoute } from "@/pages/api/v1/orgs/[orgId]/panes/import";
import { GET as getWeather, POST as postWeather, DELETE as deleteWeatherRoute } from "@/pages/api/v1/projects/[id]/weather/index";
import { GET as weatherFile } from "@/pages/api/v1/projects/[id]/weather/file";
import { GET as resultsRoute } from "@/pages/api/v1/projects/[id]/results";
import { GET as compareRoute } from "@/pages/api/v1/projects/[id]/compare";
import { POST as scheduleRoute } from "@/pages/api/v1/calc/schedule";
import { callRoute, invitedMember, newOwner, type RouteCaller } from "./helpers";
import { clear, double, insertMakeup, insertOption, tinted } from "./workspace-fixtures";
import { weatherCsv } from "@scripts/weather-year";

afterAll(() => pool.end());

const fixture = (name: string) => readFileSync(new URL(`../fixtures/uploads/${name}`, import.meta.url));
const sha = (b: Uint8Array | string) => createHash("sha256").update(b).digest("hex");
/** A site of this run's own, so that the results cache of an earlier run on the same database is never met. */
const LONGITUDE = -8.61 + Math.round(Math.random() * 1e6) / 1e9;

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- each test reads its own answer's shape
type Answer = { status: number; body: any };

async function send(route: APIRoute, caller: RouteCaller, _path: string, params: Record<string, string>, request: Request): Promise<Answer> {
  const res = (await route({ request, url: new URL(request.url), params, locals: { user: caller } } as never)) as Response;
  return { status: res.status, body: res.status === 204 ? null : await res.json() };
}

/** A multipart POST with the file in the field `file`, as a browser's FormData sends it. */
function uploadRequest(path: string, content: Uint8Array | string, fileName = "upload.csv"): Request {
  const form = new FormData();
  form.set("file", new Blob([content as BlobPart], { type: "text/csv" }), fileName);
  return new Request(`http://127.0.0.1${path}`, { method: "POST", body: form });
}

let o: Awaited<ReturnType<typeof newOwner>>;
let owner: RouteCaller;
let consultant: RouteCaller;
let architect: RouteCaller;
let client: RouteCaller;
let outsider: RouteCaller;
let projectId: string;
let optionIds: string[];

beforeAll(async () => {
  o = await newOwner("uploads");
  owner = { id: o.userId, name: "Test uploads", email: o.email };
  consultant = await invitedMember(o, "consultant");
  architect = await invitedMember(o, "architect");
  client = await invitedMember(o, "client");
  const other = await newOwner("uploads-outsider");
  outsider = { id: other.userId, name: "Outsider", email: other.email };
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Upload test block",
      siteName: "Invented quay",
      latitudeDeg: 41.15,
      longitudeDeg: LONGITUDE,
      timeZone: "Europe/Lisbon",
      facades: [{ name: "South", azimuthDeg: 180 }],
    }),
    o.userId,
  );
  projectId = p.id;
  const south = (await db.select().from(facade).where(eq(facade.projectId, p.id)))[0]!.id;
  const a = await insertMakeup(o.organizationId, "Clear double", double(clear(6), clear(4)));
  const b = await insertMakeup(o.organizationId, "Tinted double", double(tinted(6), clear(4)));
  optionIds = [(await insertOption(p.id, south, a, "S clear")).id, (await insertOption(p.id, south, b, "S tinted")).id];
});

const panesOf = async (orgId: string) => (await db.select().from(libraryPane).where(eq(libraryPane.organizationId, orgId))).length;
const uploadsOf = async (orgId: string) => (await db.select({ id: upload.id }).from(upload).where(eq(upload.organizationId, orgId))).length;

describe("POST /api/v1/orgs/:orgId/panes/import", () => {
  const path = () => `/api/v1/orgs/${o.organizationId}/panes/import`;
  const params = () => ({ orgId: o.organizationId });

  it("saves every pane of a valid file and keeps the file with its SHA-256", async () => {
    const file = fixture("panes-valid.csv");
    const res = await send(importRoute, consultant, path(), params(), uploadRequest(path(), file, "bench-samples.csv"));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.sha256).toBe(sha(file));
    expect(res.body.panes.map((p: { name: string }) => p.name)).toEqual(["Brightwater clear 6", "Brightwater solar grey 8", "Kestrel low-e 6"]);
    expect(res.body.panes[1].layer.measured).toEqual({
      solarTransmittance: 0.41,
      solarReflectanceFront: 0.061,
      solarReflectanceBack: 0.089,
      visibleTransmittance: 0.46,
    });
    const kept = (await db.select().from(upload).where(eq(upload.id, res.body.upload.id)))[0]!;
    expect(kept).toMatchObject({
      kind: "panes",
      fileName: "bench-samples.csv",
      sha256: sha(file),
      sizeBytes: file.length,
      rowCount: 3,
      projectId: null,
    });
    expect(Buffer.compare(kept.content, file)).toBe(0);
    expect(sha(kept.content)).toBe(kept.sha256);
    expect((kept.summary as { paneIds: string[] }).paneIds).toEqual(res.body.panes.map((p: { id: string }) => p.id));
  });

  it("lists every problem with line and column and saves nothing", async () => {
    const before = [await panesOf(o.organizationId), await uploadsOf(o.organizationId)];
    const res = await send(importRoute, owner, path(), params(), uploadRequest(path(), fixture("panes-broken.csv")));
    expect(res.status).toBe(400);
    expect(res.body.errors.map((e: { line: number; column: string }) => [e.line, e.column])).toEqual([
      [2, "thickness_mm"],
      [3, "solar_rf"],
      [4, "light_rb"],
      [5, "solar_t"],
      [6, "emissivity_back"],
    ]);
    expect(res.body.detail).toContain("5 problems");
    const wrong = await send(importRoute, owner, path(), params(), uploadRequest(path(), fixture("panes-wrong-columns.csv")));
    expect(wrong.status).toBe(400);
    expect(wrong.body.errors.every((e: { line: number }) => e.line === 1)).toBe(true);
    expect([await panesOf(o.organizationId), await uploadsOf(o.organizationId)]).toEqual(before);
  });

  it("follows the role table: owners and consultants import, architects and clients 403, other organisations 404", async () => {
    const file = fixture("panes-valid.csv");
    const status = async (who: RouteCaller) => (await send(importRoute, who, path(), params(), uploadRequest(path(), file))).status;
    expect(await status(owner)).toBe(201);
    expect(await status(architect)).toBe(403);
    expect(await status(client)).toBe(403);
    expect(await status(outsider)).toBe(404);
  });

  it("refuses a body that is not multipart, a form without the file field and an empty file", async () => {
    const json = await send(
      importRoute,
      owner,
      path(),
      params(),
      new Request(`http://127.0.0.1${path()}`, { method: "POST", body: "{}", headers: { "content-type": "application/json" } }),
    );
    expect(json.status).toBe(415);
    const form = new FormData();
    form.set("other", "x");
    const noFile = await send(importRoute, owner, path(), params(), new Request(`http://127.0.0.1${path()}`, { method: "POST", body: form }));
    expect(noFile.status).toBe(400);
    expect(noFile.body.errors[0].field).toBe("file");
    const empty = await send(importRoute, owner, path(), params(), uploadRequest(path(), ""));
    expect(empty.status).toBe(400);
    expect(empty.body.detail).toContain("empty");
  });

  it("refuses a 10 MB file (413) after reading little more than the 5 MB limit", async () => {
    const boundary = "----paneray-test-boundary";
    const head = new TextEncoder().encode(
      `--${boundary}\r\ncontent-disposition: form-data; name="file"; filename="big.csv"\r\ncontent-type: text/csv\r\n\r\nname,thickness_mm,solar_t,solar_rf,solar_rb\r\n`,
    );
    const row = new TextEncoder().encode("Brightwater clear 6,6,0.79,0.072,0.072\r\n".repeat(1600)); // 64,000 bytes
    const total = 10 * 1024 * 1024;
    let pulled = 0;
    const body = new ReadableStream<Uint8Array>({
      pull(ctrl) {
        const chunk = pulled === 0 ? head : row;
        pulled += chunk.byteLength;
        ctrl.enqueue(chunk);
        if (pulled >= total) ctrl.close();
      },
    });
    const before = await uploadsOf(o.organizationId);
    const request = new Request(`http://127.0.0.1${path()}`, {
      method: "POST",
      body,
      headers: { "content-type": `multipart/form-data; boundary=${boundary}` },
      duplex: "half",
    } as RequestInit);
    const res = await send(importRoute, owner, path(), params(), request);
    expect(res.status).toBe(413);
    expect(res.body.detail).toContain("5 MB");
    expect(pulled).toBeLessThan(6 * 1024 * 1024);
    expect(await uploadsOf(o.organizationId)).toBe(before);
    // A declared length over the limit is refused before anything is read.
    const declared = new Request(`http://127.0.0.1${path()}`, {
      method: "POST",
      body: "x",
      headers: { "content-type": `multipart/form-data; boundary=${boundary}`, "content-length": String(total) },
    });
    expect((await send(importRoute, owner, path(), params(), declared)).status).toBe(413);
  });
});

describe("POST /api/v1/projects/:id/weather and the results", () => {
  const path = () => `/api/v1/projects/${projectId}/weather`;
  const params = () => ({ id: projectId });
  const year = 2025;
  const text = () => weatherCsv({ year, latitudeDeg: 41.15, longitudeDeg: LONGITUDE, times: "utc" });
  const results = async (): Promise<ResultsResponse> => {
    const r = await callRoute(resultsRoute, consultant, `/api/v1/projects/${projectId}/results?year=${year}`, { id: projectId });
    expect(r.status).toBe(200);
    return r.body as ResultsResponse;
  };
  let clearSky: ResultsResponse;

  it("follows the role table: architects 403, clients (project not shared with them) and other organisations 404", async () => {
    const file = fixture("weather-autumn-ambiguous.csv");
    const status = async (who: RouteCaller) => (await send(postWeather, who, path(), params(), uploadRequest(path(), file))).status;
    expect(await status(architect)).toBe(403);
    expect(await status(outsider)).toBe(404);
    expect(await status(client)).toBe(404);
    expect((await send(getWeather, architect, path(), params(), new Request(`http://127.0.0.1${path()}`))).body).toEqual({ weather: null });
  });

  it("saves 8,760 hours, keeps the file with its SHA-256, records it in the history, and the results use it", async () => {
    clearSky = await results();
    expect(clearSky.irradiance).toEqual({ source: "clear sky" });
    const csv = text();
    const res = await send(postWeather, consultant, path(), params(), uploadRequest(path(), csv, "quay-2025.csv"));
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(201);
    expect(res.body).toMatchObject({ from: "2025-01-01T00:00:00.000Z", to: "2025-12-31T23:00:00.000Z", hours: 8760, sha256: sha(csv) });
    const stored = (await db.select().from(weatherSeries).where(eq(weatherSeries.projectId, projectId)))[0]!;
    expect(stored.hours).toBe(8760);
    const kept = (await db.select().from(upload).where(eq(upload.id, stored.uploadId)))[0]!;
    expect(sha(kept.content)).toBe(sha(csv));
    const events = await db
      .select()
      .from(projectEvent)
      .where(and(eq(projectEvent.projectId, projectId), eq(projectEvent.kind, "weather.uploaded")));
    expect(events).toHaveLength(1);
    expect(events[0]!.summary).toContain("quay-2025.csv");

    const file = (await weatherFile({
      request: new Request("http://127.0.0.1/"),
      params: params(),
      locals: { user: architect },
    } as never)) as Response;
    expect(file.status).toBe(200);
    expect(sha(new Uint8Array(await file.arrayBuffer()))).toBe(sha(csv));
    expect(file.headers.get("content-disposition")).toContain("quay-2025.csv");

    const withWeather = await results();
    expect(withWeather.irradiance).toMatchObject({
      source: "weather series",
      fileName: "quay-2025.csv",
      sha256: sha(csv),
      fromDate: "2025-01-01",
      toDate: "2025-12-31",
      hours: 8760,
    });
    expect(withWeather.inputsKey).not.toBe(clearSky.inputsKey);
    expect(withWeather.cache).toEqual({ hits: 0, misses: 2 });
    const a = withWeather.facades[0]!.options[0]!;
    expect(a.annual.transmittedKWhm2).not.toBeCloseTo(clearSky.facades[0]!.options[0]!.annual.transmittedKWhm2, 1);

    // The same surface and the same weather through POST /calc/schedule: each row's values at the hour's midpoint,
    // read from the CSV text here (the file's times mark the start of each hour).
    const weather = csv
      .trim()
      .split("\r\n")
      .slice(1)
      .map((l) => l.split(","))
      .map(([t, g, b, d]) => ({ time: new Date(Date.parse(t!) + 30 * 60_000).toISOString(), ghi: +g!, dni: +b!, dhi: +d! }));
    const sched = await callRoute(
      scheduleRoute,
      consultant,
      "/api/v1/calc/schedule",
      {},
      {
        method: "POST",
        body: {
          site: { latitudeDeg: 41.15, longitudeDeg: LONGITUDE, timeZone: "Europe/Lisbon", elevationM: 0 },
          from: "2025-01-01",
          to: "2025-12-31",
          surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: double(clear(6), clear(4)) }],
          weather,
        },
      },
    );
    expect(sched.status).toBe(200);
    const s = (sched.body as ScheduleResponse).surfaces[0]!;
    expect((sched.body as ScheduleResponse).irradiance).toBe("weather series");
    expect(a.annual.transmittedKWhm2).toBeCloseTo(s.totals.period.transmittedKWhPerM2, 9);
    expect(a.annual.solarGainKWhm2).toBeCloseTo(s.totals.period.solarGainKWhPerM2, 9);
    a.monthly.transmittedKWhm2.forEach((v, m) => expect(v).toBeCloseTo(s.totals.monthly[m]!.transmittedKWhPerM2, 9));
    expect(a.peak.transmittedWm2).toBe(s.rows.reduce((x, y) => (y.transmittedWm2 > x.transmittedWm2 ? y : x)).transmittedWm2);
    // Bound from outside: transmitted irradiance never exceeds the solar constant, 1361 W/m² (Kopp & Lean 2011).
    expect(a.peak.transmittedWm2).toBeLessThan(1361);

    // The comparison says the same, and a second call hits the cache.
    const cmp = await callRoute(compareRoute, consultant, `/api/v1/projects/${projectId}/compare?options=${optionIds.join(",")}&year=${year}`, {
      id: projectId,
    });
    expect(cmp.status).toBe(200);
    expect((cmp.body as { irradiance: { source: string } }).irradiance.source).toBe("weather series");
    expect((await results()).cache).toEqual({ hits: 2, misses: 0 });
  });

  it("lists every problem of a broken file and keeps the series saved before", async () => {
    const before = (await db.select({ id: weatherSeries.uploadId }).from(weatherSeries).where(eq(weatherSeries.projectId, projectId)))[0]!.id;
    const res = await send(postWeather, owner, path(), params(), uploadRequest(path(), fixture("weather-broken.csv")));
    expect(res.status).toBe(400);
    expect(new Set(res.body.errors.map((e: { line: number; column: string }) => `${e.line} ${e.column}`))).toEqual(
      new Set(["3 time", "6 time", "7 time", "8 ghi_wm2", "9 dni_wm2", "10 dhi_wm2", "11 ghi_wm2", "12 air_temperature_c"]),
    );
    const after = (await db.select({ id: weatherSeries.uploadId }).from(weatherSeries).where(eq(weatherSeries.projectId, projectId)))[0]!.id;
    expect(after).toBe(before);
  });

  it("DELETE returns the results to the clear sky", async () => {
    expect((await send(deleteWeatherRoute, architect, path(), params(), new Request(`http://127.0.0.1${path()}`, { method: "DELETE" }))).status).toBe(
      403,
    );
    expect(
      (await send(deleteWeatherRoute, consultant, path(), params(), new Request(`http://127.0.0.1${path()}`, { method: "DELETE" }))).status,
    ).toBe(204);
    expect(
      (
        await db
          .select()
          .from(upload)
          .where(and(eq(upload.projectId, projectId), eq(upload.kind, "weather")))
      ).length,
    ).toBe(0);
    const back = await results();
    expect(back.irradiance).toEqual({ source: "clear sky" });
    expect(back.inputsKey).toBe(clearSky.inputsKey);
    expect(back.facades[0]!.options[0]!.annual).toEqual(clearSky.facades[0]!.options[0]!.annual);
    expect(
      (await send(deleteWeatherRoute, consultant, path(), params(), new Request(`http://127.0.0.1${path()}`, { method: "DELETE" }))).status,
    ).toBe(404);
  });
});
