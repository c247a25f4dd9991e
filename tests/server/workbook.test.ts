// The schedule workbook against PostgreSQL: an issued revision exported through the route, read back with
// exceljs (a general-purpose reference reader, Workbook.xlsx.load), every number of the glazing schedule
// compared with GET /projects/:id/results and the hourly sheets' rows, sums and peaks with POST
// /calc/schedule for the same inputs; live SUM/MAX formulas; DRAFT on every sheet of a draft; user text
// that a spreadsheet would run as a formula neutralised (xlsx and CSV); who may download what.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";
import ExcelJS from "exceljs";
import { db, pool } from "@/lib/server/db/client";
import { facade, project, projectRequirements } from "@/lib/server/db/schema";
import { createProject, projectsForUser, shareProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { ResultsResponse } from "@/lib/contracts/results";
import type { ScheduleResponse } from "@/lib/contracts/schedule";
import { HOURLY_COLUMNS } from "@/lib/calc/workbook-tables";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";
import { workbookFile } from "@/lib/server/services/workbook";
import { GET as workbookRoute } from "@/pages/api/v1/projects/[id]/workbook";
import { GET as csvRoute } from "@/pages/api/v1/projects/[id]/workbook.csv";
import { GET as resultsRoute } from "@/pages/api/v1/projects/[id]/results";
import { POST as issueRoute } from "@/pages/api/v1/projects/[id]/revisions/index";
import { POST as scheduleRoute } from "@/pages/api/v1/calc/schedule";
import { invitedMember, newOwner } from "./helpers";
import { clear, double, insertMakeup, insertOption, measuredClear, tinted } from "./workspace-fixtures";

afterAll(() => pool.end());
// Exports run on their thread, compiled from the sources in tests: generous on a busy machine.
vi.setConfig({ testTimeout: 60_000, hookTimeout: 60_000 });

const YEAR = 2025;
/** A site of this run's own, so that cached results of an earlier run on the same database are not met. */
const LONGITUDE = -8.61 + Math.round(Math.random() * 1e6) / 1e9;
const TURBIDITY = [3, 3.2, 3.5, 3.8, 4, 4.1, 4.2, 4.1, 3.9, 3.6, 3.2, 3];
/** User text that a spreadsheet would evaluate (common practice: the CSV/formula-injection starters = + - @ tab CR). */
const HOSTILE_FACADE = '=HYPERLINK("http://attacker.example","West")';
const HOSTILE_OPTION = "+SUM(1,1) measured";
const HOSTILE_NOTE = "@cmd issued";

type Caller = { id: string; name: string; email: string };
type Route = typeof workbookRoute;

async function get(route: Route, caller: Caller, path: string, id: string): Promise<Response> {
  const request = new Request(`http://127.0.0.1${path}`);
  return (await route({ request, url: new URL(request.url), params: { id }, locals: { user: caller } } as never)) as Response;
}
async function post(route: Route, caller: Caller, path: string, params: Record<string, string>, body: unknown): Promise<Response> {
  const request = new Request(`http://127.0.0.1${path}`, {
    method: "POST",
    body: JSON.stringify(body),
    headers: { "content-type": "application/json" },
  });
  return (await route({ request, url: new URL(request.url), params, locals: { user: caller } } as never)) as Response;
}
async function load(res: Response): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(Buffer.from(await res.arrayBuffer()) as never);
  return wb;
}

let owner: Caller;
let consultant: Caller;
let architect: Caller;
let client: Caller;
let projectId: string;
let unsharedId: string;
let westId: string;
let results: ResultsResponse;
let issued: ExcelJS.Workbook;

const westLayers = double(measuredClear(6), measuredClear(4));
const northLayers = double(tinted(6), clear(4));
const westShading = { window: { widthM: 1.5, heightM: 2 }, overhang: { depthM: 0.6, gapAboveM: 0.2 } };

beforeAll(async () => {
  const o = await newOwner("workbook");
  owner = { id: o.userId, name: "Test workbook", email: o.email };
  consultant = await invitedMember(o, "consultant");
  architect = await invitedMember(o, "architect");
  client = await invitedMember(o, "client");
  const make = (name: string) =>
    createProject(
      ProjectCreateRequest.parse({
        organizationId: o.organizationId,
        name,
        siteName: "Test quay",
        latitudeDeg: 41.15,
        longitudeDeg: LONGITUDE,
        timeZone: "Europe/Lisbon",
        elevationM: 30,
        facades: [
          { name: HOSTILE_FACADE, azimuthDeg: 270 },
          { name: "North", azimuthDeg: 0 },
          { name: "East", azimuthDeg: 90 },
        ],
      }),
      o.userId,
    );
  const p = await make("Workbook test block");
  projectId = p.id;
  unsharedId = (await make("Workbook unshared block")).id;
  const fs = await db.select().from(facade).where(eq(facade.projectId, p.id));
  westId = fs.find((f) => f.azimuthDeg === 270)!.id;
  const northId = fs.find((f) => f.name === "North")!.id;
  await db
    .update(facade)
    .set({ windowWidthM: 1.5, windowHeightM: 2, glazedAreaM2: 120, shading: { overhang: westShading.overhang } })
    .where(eq(facade.id, westId));
  await db.update(project).set({ groundAlbedo: 0.25, skyModel: "isotropic", linkeTurbidity: TURBIDITY }).where(eq(project.id, p.id));
  await db
    .insert(projectRequirements)
    .values({ projectId: p.id, limits: { project: { maxGValue: 0.6, minLightTransmittance: 0.7, maxPeakTransmittedWm2: 400 }, facades: {} } });
  const west = await insertMakeup(o.organizationId, "Measured double", westLayers);
  const north = await insertMakeup(o.organizationId, "Tinted double", northLayers);
  await insertOption(p.id, westId, west, HOSTILE_OPTION, "approved");
  await insertOption(p.id, northId, north, "N tinted", "approved");
  await insertOption(p.id, northId, west, "N measured");
  const cm = (await projectsForUser(client.id))[0]!.membership;
  await shareProject(p, cm.memberId, o.userId);
  const res = await post(issueRoute as Route, consultant, `/api/v1/projects/${p.id}/revisions`, { id: p.id }, { note: HOSTILE_NOTE, year: YEAR });
  expect(res.status, await res.clone().text()).toBe(201);
  const r = await get(resultsRoute as Route, consultant, `/api/v1/projects/${p.id}/results?year=${YEAR}`, p.id);
  results = (await r.json()) as ResultsResponse;
  const wbRes = await get(workbookRoute, client, `/api/v1/projects/${p.id}/workbook?revision=A`, p.id);
  expect(wbRes.status).toBe(200);
  issued = await load(wbRes);
}, 120_000);

/** The schedule sheet's rows as header → value. */
function scheduleRows(wb: ExcelJS.Workbook): Record<string, ExcelJS.CellValue>[] {
  const ws = wb.getWorksheet("Glazing schedule")!;
  const headers = (ws.getRow(3).values as ExcelJS.CellValue[]).slice(1).map(String);
  const out: Record<string, ExcelJS.CellValue>[] = [];
  for (let r = 4; r <= ws.rowCount; r++) {
    const v = (ws.getRow(r).values as ExcelJS.CellValue[]).slice(1);
    if (v.length < 5) continue;
    out.push(Object.fromEntries(headers.map((h, k) => [h, v[k] ?? null])));
  }
  return out;
}

/** The hourly sheet whose title (A1) names the option. */
const hourlySheet = (wb: ExcelJS.Workbook, option: string) =>
  wb.worksheets.find((w) => String(w.getCell("A1").value).includes(`hourly schedule of`) && String(w.getCell("A1").value).includes(option))!;

/** The fields of one CSV line (RFC 4180 quoting). */
function csvFields(line: string): string[] {
  const out: string[] = [];
  let i = 0;
  while (i <= line.length) {
    if (line[i] === '"') {
      let v = "";
      i++;
      while (i < line.length) {
        if (line[i] === '"' && line[i + 1] === '"') {
          v += '"';
          i += 2;
        } else if (line[i] === '"') break;
        else v += line[i++];
      }
      out.push(v);
      i += 2;
    } else {
      const end = line.indexOf(",", i);
      out.push(line.slice(i, end < 0 ? line.length : end));
      i = end < 0 ? line.length + 1 : end + 1;
    }
  }
  return out;
}

describe("the workbook of an issued revision", () => {
  it("is an .xlsx with a cover, the schedule, an hourly sheet per approved option and angular sheets per make-up", async () => {
    const res = await get(workbookRoute, consultant, `/api/v1/projects/${projectId}/workbook?revision=A`, projectId);
    expect(res.headers.get("content-type")).toBe("application/vnd.openxmlformats-officedocument.spreadsheetml.sheet");
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="Workbook-test-block_rev-A.xlsx"');
    expect(res.body).toBeInstanceOf(ReadableStream);
    await res.arrayBuffer();
    const names = issued.worksheets.map((w) => w.name);
    expect(names.slice(0, 2)).toEqual(["Cover", "Glazing schedule"]);
    expect(names).toHaveLength(2 + 2 + 2);
    for (const n of names) {
      expect(n.length).toBeLessThanOrEqual(31);
      expect(n).not.toMatch(/[[\]:*?/\\]/);
    }
    expect(new Set(names.map((n) => n.toLowerCase())).size).toBe(names.length);
    const cover = issued.getWorksheet("Cover")!;
    const text = JSON.stringify(cover.getSheetValues());
    for (const want of [
      "41.15",
      "Europe/Lisbon",
      "isotropic",
      "0.25",
      "3.2, 3.5",
      "Revision",
      "Test consultant",
      "Perez",
      "EN 673",
      "not certified",
      "licensed professionals",
    ])
      expect(text).toContain(want);
    expect(text).not.toContain("DRAFT");
  });

  it("gives every number of the glazing schedule as GET /projects/:id/results does", () => {
    const rows = scheduleRows(issued);
    expect(rows.map((r) => r["Façade"])).toEqual([`'${HOSTILE_FACADE}`, "North", "East"]);
    const options = results.facades.flatMap((f) => f.options.filter((o) => o.status === "approved").map((o) => ({ f, o })));
    expect(options).toHaveLength(2);
    let compared = 0;
    for (const { f, o } of options) {
      const row = rows.find((r) => r["Façade"] === (f.name.startsWith("=") ? `'${f.name}` : f.name))!;
      const eq = (header: string, want: number | null) => {
        expect(row[header], header).toBe(want);
        compared++;
      };
      eq("Orientation: azimuth of the outward normal (°, clockwise from north)", f.azimuthDeg);
      eq("Tilt from horizontal (°)", f.tiltDeg);
      eq("Glazed area (m²)", f.glazedAreaM2);
      eq("Solar transmittance τe at normal incidence (−)", o.values.normal.solarTransmittance);
      eq("Solar reflectance ρe, outdoor side (−)", o.values.normal.solarReflectanceFront);
      eq("Solar reflectance ρe, indoor side (−)", o.values.normal.solarReflectanceBack);
      o.values.normal.layerAbsorptance.forEach((a, k) => eq(`Solar absorptance α of pane ${k + 1} (outdoors first) (−)`, a));
      eq("Total solar energy transmittance g, EN 410 (−)", o.values.normal.gValue);
      eq("Centre-of-glass U-value, EN 673 (W/(m²·K))", o.values.uValue);
      const light = makeupLight(o.values);
      expect(row["Light transmittance τv (−; a range where some light reflectances are unknown)"]).toBe(light.transmittance ?? lightText(light, 3));
      eq("Hemispherical solar transmittance τe,hem (diffuse light) (−)", o.values.hemispherical.solarTransmittance);
      eq("Hemispherical g-value g,hem (−)", o.values.hemispherical.gValue);
      eq("Transmitted solar energy over the period (kWh/m²)", o.annual.transmittedKWhm2);
      eq("Solar gain over the period (kWh/m²)", o.annual.solarGainKWhm2);
      eq("Peak transmitted solar irradiance (W/m²)", o.peak.transmittedWm2);
      expect(row["Peak at (ISO 8601 with UTC offset)"]).toBe(o.peak.at);
      expect(o.flags.length).toBe(3);
      for (const flag of o.flags) {
        const label = {
          maxGValue: "Maximum g-value",
          minLightTransmittance: "Minimum light transmittance τv",
          maxPeakTransmittedWm2: "Maximum peak transmitted (W/m²)",
        }[flag.requirement as string]!;
        eq(`${label}: limit`, flag.limit);
        eq(`${label}: margin (≥ 0 meets it)`, flag.margin);
        expect(row[`${label}: result`]).toBe({ pass: "meets", fail: "does not meet", unknown: "unknown" }[flag.status]);
      }
    }
    expect(compared).toBeGreaterThan(40);
    expect(rows.find((r) => r["Façade"] === "East")!["Option"]).toBe("(no approved option)");
  });

  it("has hourly rows, sums and peaks equal to POST /calc/schedule for the same inputs, as live SUM/MAX formulas", async () => {
    const west = results.facades.find((f) => f.facadeId === westId)!;
    const o = west.options.find((x) => x.status === "approved")!;
    const body = {
      site: { latitudeDeg: 41.15, longitudeDeg: LONGITUDE, timeZone: "Europe/Lisbon", elevationM: 30 },
      from: `${YEAR}-01-01`,
      to: `${YEAR}-12-31`,
      sky: { model: "isotropic", albedo: 0.25, linkeTurbidity: TURBIDITY },
      surfaces: [{ name: "West", azimuthDeg: 270, tiltDeg: 90, layers: westLayers, shading: westShading, glazedAreaM2: 120 }],
    };
    const sched = (await (await post(scheduleRoute as Route, consultant, "/api/v1/calc/schedule", {}, body)).json()) as ScheduleResponse;
    const s = sched.surfaces[0]!;
    const ws = hourlySheet(issued, HOSTILE_OPTION);
    expect(ws.views[0]).toMatchObject({ state: "frozen", ySplit: 5 });
    expect((ws.getRow(5).values as ExcelJS.CellValue[]).slice(1)).toEqual(HOURLY_COLUMNS.map((c) => c.header));
    expect(ws.rowCount).toBe(5 + 8760);
    expect(ws.getCell("J6").numFmt).toBe("0.00");
    // Every row as the schedule endpoint gives it.
    for (let i = 0; i < s.rows.length; i++) {
      const r = s.rows[i]!;
      const v = (ws.getRow(6 + i).values as ExcelJS.CellValue[]).slice(1);
      expect(v[1]).toBe(r.time);
      expect((v[0] as Date).toISOString().slice(0, 16)).toBe(r.time.slice(0, 16));
      expect(v.slice(2, 13)).toEqual([
        r.sunAltitudeDeg,
        r.sunAzimuthDeg,
        r.incidenceDeg,
        r.beamTransmittance,
        r.sunlitFraction,
        r.beamIncidentWm2,
        r.diffuseIncidentWm2,
        r.transmittedWm2,
        r.solarGainWm2,
        r.transmittedW,
        r.solarGainW,
      ]);
    }
    const energy = (col: string) => ws.getCell(`${col}2`).value as ExcelJS.CellFormulaValue;
    const peak = (col: string) => ws.getCell(`${col}3`).value as ExcelJS.CellFormulaValue;
    expect(energy("J").formula).toBe("SUM(J6:J8765)*60/60/1000");
    expect(peak("J").formula).toBe("MAX(J6:J8765)");
    // Sums of rows rounded to 0.01 W/m²: within 8,760 × 0.005 Wh/m² of the unrounded totals (a bound, not a fit).
    expect(Math.abs((energy("J").result as number) - s.totals.period.transmittedKWhPerM2)).toBeLessThan(0.0438);
    expect(Math.abs((energy("K").result as number) - s.totals.period.solarGainKWhPerM2)).toBeLessThan(0.0438);
    expect(Math.abs((energy("J").result as number) - o.annual.transmittedKWhm2)).toBeLessThan(0.0438);
    expect(Math.abs((energy("L").result as number) - s.totals.period.transmittedKWh!)).toBeLessThan(8760 * 0.05e-3);
    expect(peak("J").result).toBe(Math.max(...s.rows.map((r) => r.transmittedWm2)));
    expect(peak("J").result).toBe(o.peak.transmittedWm2);
    expect(peak("K").result).toBe(Math.max(...s.rows.map((r) => r.solarGainWm2)));
    expect(peak("M").result).toBe(Math.max(...s.rows.map((r) => r.solarGainW!)));
    // The cached result of each formula is the formula evaluated on the cells themselves.
    for (const col of ["H", "I", "J", "K", "L", "M"]) {
      let sum = 0;
      let max = -Infinity;
      for (let i = 6; i <= 8765; i++) {
        const v = ws.getCell(`${col}${i}`).value as number;
        sum += v;
        max = Math.max(max, v);
      }
      expect(energy(col).result as number).toBeCloseTo(sum / 1000, 9);
      expect(peak(col).result).toBe(max);
    }
    // The North façade has no glazed area: its W columns are empty, and have no formulas.
    const north = issued.worksheets.find((w) => w.name.startsWith("North"))!;
    expect(north.getCell("L6").value).toBeNull();
    expect(north.getCell("L2").value).toBeNull();
  });

  it("has the angular values of each make-up from 0° to 90° by 5° with the hemispherical values", () => {
    const ws = issued.worksheets.find((w) => w.name.startsWith("Angles Measured"))!;
    const angles = [];
    for (let r = 4; r <= ws.rowCount; r++) angles.push(ws.getCell(`A${r}`).value);
    expect(angles).toEqual([...Array.from({ length: 19 }, (_, i) => i * 5), "hemispherical"]);
    const west = results.facades.find((f) => f.facadeId === westId)!.options.find((x) => x.status === "approved")!;
    expect(ws.getCell("B4").value).toBeCloseTo(west.values.normal.solarTransmittance, 12);
    expect(ws.getCell(`B${ws.rowCount}`).value).toBeCloseTo(west.values.hemispherical.solarTransmittance, 12);
    expect(ws.getCell("B22").value).toBe(0); // τe(90°) = 0: grazing incidence reflects everything (Fresnel, closed form)
  });

  it("neutralises user text that a spreadsheet would run as a formula, in the xlsx and in CSV", async () => {
    const formulas: string[] = [];
    const texts: string[] = [];
    for (const ws of issued.worksheets)
      ws.eachRow((row) =>
        row.eachCell((cell) => {
          if (cell.type === ExcelJS.ValueType.Formula) formulas.push(cell.formula);
          if (typeof cell.value === "string") texts.push(cell.value);
        }),
      );
    expect(formulas.every((f) => /^(SUM|MAX)\([A-Z]+\d+:[A-Z]+\d+\)(\*60\/60\/1000)?$/.test(f))).toBe(true);
    expect(formulas.length).toBe(6 * 2 + 4 * 2);
    expect(texts).toContain(`'${HOSTILE_FACADE}`);
    expect(texts).toContain(`'${HOSTILE_OPTION}`);
    expect(texts).toContain(`'${HOSTILE_NOTE}`);
    expect(texts.filter((t) => /^[=+\-@\t\r]/.test(t))).toEqual([]);
    const csv = await get(csvRoute as Route, client, `/api/v1/projects/${projectId}/workbook.csv?revision=A&table=schedule`, projectId);
    expect(csv.status).toBe(200);
    expect(csv.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    const lines = (await csv.text()).replace(/^\uFEFF/, "").split("\r\n");
    expect(lines[1]!.startsWith(`"'=HYPERLINK(""http://attacker.example"",""West"")"`)).toBe(true);
    const fields = lines.flatMap(csvFields);
    expect(fields).toContain(`'${HOSTILE_OPTION}`);
    // Negative numbers are numbers; any other field starting with a formula character would be run.
    expect(fields.filter((f) => /^[=+\-@\t\r]/.test(f) && !/^-\d/.test(f))).toEqual([]);
  });

  it("gives the hourly table of one façade as CSV with the same rows", async () => {
    const res = await get(
      csvRoute as Route,
      owner,
      `/api/v1/projects/${projectId}/workbook.csv?revision=A&table=hourly&facadeId=${westId}`,
      projectId,
    );
    expect(res.status).toBe(200);
    const lines = (await res.text())
      .replace(/^\uFEFF/, "")
      .trimEnd()
      .split("\r\n");
    expect(lines).toHaveLength(1 + 8760);
    const ws = hourlySheet(issued, HOSTILE_OPTION);
    for (let i = 1; i < lines.length; i++) {
      const f = csvFields(lines[i]!);
      const row = ws.getRow(5 + i);
      expect(f[1]).toBe(row.getCell(2).value);
      for (let c = 3; c <= 13; c++) expect(Number(f[c - 1]), `${f[1]} column ${c}`).toBe(row.getCell(c).value);
    }
    const missing = await get(csvRoute as Route, owner, `/api/v1/projects/${projectId}/workbook.csv?revision=A&table=hourly`, projectId);
    expect(missing.status).toBe(400);
    expect(((await missing.json()) as { errors: { field: string }[] }).errors[0]!.field).toBe("facadeId");
  });

  it("gives the e-mail attachment the same sheets, with its SHA-256", async () => {
    const f = await workbookFile({ projectId, revision: "A" });
    expect(f.fileName).toBe("Workbook-test-block_rev-A.xlsx");
    expect(f.sha256).toMatch(/^[0-9a-f]{64}$/);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(f.bytes as never);
    expect(wb.worksheets.map((w) => w.name)).toEqual(issued.worksheets.map((w) => w.name));
  });
});

describe("the draft workbook", () => {
  it("is for owners and consultants, from the current approved options, with DRAFT on every sheet", async () => {
    const res = await get(workbookRoute, owner, `/api/v1/projects/${projectId}/workbook?year=${YEAR}`, projectId);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toBe('attachment; filename="Workbook-test-block_DRAFT.xlsx"');
    const wb = await load(res);
    expect(wb.worksheets.length).toBe(6);
    for (const ws of wb.worksheets) expect(String(ws.getCell("D1").value), ws.name).toMatch(/^DRAFT/);
    const rows = scheduleRows(wb);
    const issuedRows = scheduleRows(issued);
    expect(rows.map((r) => r["Total solar energy transmittance g, EN 410 (−)"])).toEqual(
      issuedRows.map((r) => r["Total solar energy transmittance g, EN 410 (−)"]),
    );
  });

  it("is refused to architects and clients (403), who may download issued revisions", async () => {
    for (const who of [architect, client]) {
      const res = await get(workbookRoute, who, `/api/v1/projects/${projectId}/workbook`, projectId);
      expect(res.status).toBe(403);
      expect(((await res.json()) as { detail: string }).detail).toMatch(/draft/);
      const csv = await get(csvRoute as Route, who, `/api/v1/projects/${projectId}/workbook.csv?table=schedule`, projectId);
      expect(csv.status).toBe(403);
    }
    const ok = await get(workbookRoute, architect, `/api/v1/projects/${projectId}/workbook?revision=A`, projectId);
    expect(ok.status).toBe(200);
    await ok.arrayBuffer();
  });
});

describe("refusals", () => {
  it("answers 400 naming revision for a bad letter, 404 for an unknown one or an unshared project", async () => {
    for (const bad of ["a", "A1", "ABCDE", "%3D1"]) {
      const res = await get(workbookRoute, consultant, `/api/v1/projects/${projectId}/workbook?revision=${bad}`, projectId);
      expect(res.status, bad).toBe(400);
      const body = (await res.json()) as { errors: { field: string }[] };
      expect(body.errors[0]!.field).toBe("revision");
    }
    const unknown = await get(workbookRoute, consultant, `/api/v1/projects/${projectId}/workbook?revision=Z`, projectId);
    expect(unknown.status).toBe(404);
    const none = await get(workbookRoute, consultant, `/api/v1/projects/${unsharedId}/workbook?revision=A`, unsharedId);
    expect(none.status).toBe(404);
    const unshared = await get(workbookRoute, client, `/api/v1/projects/${unsharedId}/workbook?revision=A`, unsharedId);
    expect(unshared.status).toBe(404);
    const table = await get(csvRoute as Route, consultant, `/api/v1/projects/${projectId}/workbook.csv?revision=A&table=pivot`, projectId);
    expect(table.status).toBe(400);
    expect(((await table.json()) as { errors: { field: string }[] }).errors[0]!.field).toBe("table");
    const facadeUnknown = await get(
      csvRoute as Route,
      consultant,
      `/api/v1/projects/${projectId}/workbook.csv?revision=A&table=hourly&facadeId=nope`,
      projectId,
    );
    expect(facadeUnknown.status).toBe(404);
  });
});
