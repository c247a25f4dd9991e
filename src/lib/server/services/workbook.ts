/**
 * The schedule workbook of a project: an issued revision (or the current draft) as an .xlsx, written with
 * exceljs' streaming writer so that memory stays flat however many hourly rows it holds, and each of its
 * tables as CSV.
 *
 * Sheets: a cover (project, site, revision, period, sky, methods, cautions), the glazing schedule, one
 * hourly sheet per façade × approved option (live SUM/MAX formulas over the columns, their values cached)
 * and one angular-properties sheet per make-up. The hourly rows are those of POST /api/v1/calc/schedule
 * for the same inputs: the request is built by `yearRequestInput` (results.ts) and computed by the same
 * "schedule" task in the calculation pool, one façade at a time, a few ahead of the sheet being written.
 *
 * `writeWorkbook` streams into any writable (the download route); `workbookFile` builds the whole file in
 * memory for an e-mail attachment, with its SHA-256. Access is checked by the caller.
 */
import { createHash } from "node:crypto";
import { PassThrough, type Writable } from "node:stream";
import { setImmediate as yieldToLoop } from "node:timers/promises";
import ExcelJS from "exceljs";
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, makeupRevision, project } from "@/lib/server/db/schema";
import { NotFoundError } from "@/lib/server/errors";
import { runCalc, sharedCalcPool, type CalcPool } from "@/lib/server/calc-pool";
import { GlazingRequest, type GlazingResponse } from "@/lib/contracts/glazing";
import { ScheduleRequest, type ScheduleResponse } from "@/lib/contracts/schedule";
import type { RevisionSnapshot } from "@/lib/contracts/results";
import { SCHEDULE_METHODS } from "@/lib/calc/schedule-response";
import {
  angularTable,
  csvLine,
  HOURLY_COLUMNS,
  hourlyCells,
  hourlySummary,
  safeText,
  scheduleTable,
  SheetNames,
  WORKBOOK_ANGLES_DEG,
  type CellValue,
  type ColumnSpec,
  type ScheduleEntry,
  type HourlyRow,
} from "@/lib/calc/workbook-tables";
import { projectResults, resultYear, shadingOf, yearRequestInput } from "./results";
import { weatherForResults, type ResultsWeather } from "./uploads";
import type { IrradianceSource } from "@/lib/contracts/uploads";
import { revisionOf } from "./revisions";
import { writeWorkbookInThread } from "@/lib/server/workbook-thread";

export { safeText };

export interface WorkbookRequest {
  projectId: string;
  /** An issued revision's letter; null = the current draft (owners and consultants only, checked by the caller). */
  revision: string | null;
  /** The draft's calendar year (default the current year); an issued revision keeps its own. */
  year?: number;
}

export interface WorkbookFile {
  fileName: string;
  bytes: Buffer;
  sha256: string;
}

export interface WorkbookOptions {
  /** The worker pool to compute in; default the process's shared pool (null: on this thread). */
  pool?: CalcPool | null;
}

export const XLSX_CONTENT_TYPE = "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";

/** The standing caution, as in the app. */
export const WORKBOOK_CAUTION =
  "Paneray's figures are engineering estimates for comparing options, not certified or declared product values. Overheating, glare, thermal breakage of absorbing glass and safety glazing are decided under local codes by licensed professionals, using manufacturers' declared data.";

const DRAFT_MARK = "DRAFT — not an issued schedule; options and figures may still change";

/** "Cordage-Works-refurbishment_rev-A.xlsx": letters, digits and dashes only. */
export function workbookFileName(projectName: string, revision: string | null): string {
  const base =
    projectName
      .normalize("NFKD")
      .replace(/[^\w-]+/g, "-")
      .replace(/-+/g, "-")
      .replace(/^-|-$/g, "") || "project";
  return `${base}_${revision ? `rev-${revision}` : "DRAFT"}.xlsx`;
}

// ---- what a workbook is made of ---------------------------------------------------------------------------

type ProjectRow = typeof project.$inferSelect;
type FacadeRow = typeof facade.$inferSelect;

/** One hourly sheet: a façade with its approved option, as the schedule engine takes it. */
interface HourlyEntry {
  facadeId: string;
  facadeName: string;
  optionName: string;
  glazedAreaM2: number | null;
  /** The surface of the schedule request (name, orientation, layers, shading, glazed area). */
  surface: Record<string, unknown>;
  makeupKey: string;
  /** Set when the stored layers no longer validate: the sheet says so instead of rows. */
  problem?: string;
}

interface MakeupEntry {
  key: string;
  name: string;
  revision: number;
  layers: unknown[];
}

/** Everything a workbook is written from, loaded and checked before the first byte is sent. */
export interface WorkbookPlan {
  project: ProjectRow;
  fileName: string;
  draft: boolean;
  revision: { letter: string; issuedAt: string; issuedBy: string; note: string | null } | null;
  year: number;
  site: RevisionSnapshot["site"];
  schedule: (ScheduleEntry & { facadeId: string })[];
  hourly: HourlyEntry[];
  makeups: MakeupEntry[];
  /** The schedule request of a list of surfaces (the project's period, site and sky). */
  /**
   * What the schedule requests are built from (`planRequest`): plain data, so that a plan can be handed to the
   * export thread.
   */
  requestBase: { project: ProjectRow; year: number; weather: ResultsWeather | null };
  /** Where the hourly irradiance comes from: the clear-sky model or the project's weather file. */
  irradiance: IrradianceSource;
}

/** The project row with the site and sky an issued revision was computed for. */
function projectAsIssued(p: ProjectRow, site: RevisionSnapshot["site"]): ProjectRow {
  return {
    ...p,
    latitudeDeg: site.latitudeDeg,
    longitudeDeg: site.longitudeDeg,
    timeZone: site.timeZone,
    elevationM: site.elevationM,
    groundAlbedo: site.groundAlbedo,
    skyModel: site.skyModel as ProjectRow["skyModel"],
    linkeTurbidity: site.linkeTurbidity,
  };
}

function surfaceOf(name: string, f: { azimuthDeg: number; tiltDeg: number }, layers: unknown[], shading: unknown, glazedAreaM2: number | null) {
  return {
    name: name.slice(0, 120),
    azimuthDeg: f.azimuthDeg,
    tiltDeg: f.tiltDeg,
    layers,
    ...(shading ? { shading } : {}),
    ...(glazedAreaM2 ? { glazedAreaM2 } : {}),
  };
}

function problemOf(request: unknown): string | undefined {
  const check = ScheduleRequest.safeParse(request);
  if (check.success) return undefined;
  const issue = check.error.issues[0]!;
  return `The stored make-up or façade cannot be computed: ${issue.path.slice(2).join(".")}: ${issue.message}`;
}

/**
 * Loads what the workbook of an issued revision (or of the current draft) is written from. NotFoundError
 * for an unknown project or revision letter.
 */
export async function workbookPlan(req: WorkbookRequest): Promise<WorkbookPlan> {
  const p = (await db.select().from(project).where(eq(project.id, req.projectId)))[0];
  if (!p) throw new NotFoundError("No such project, or it is not shared with you");
  const facades = await db
    .select()
    .from(facade)
    .where(eq(facade.projectId, p.id))
    .orderBy(asc(facade.position), asc(facade.createdAt), asc(facade.id));
  const facadeById = new Map<string, FacadeRow>(facades.map((f) => [f.id, f]));
  const makeups = new Map<string, MakeupEntry>();
  const schedule: WorkbookPlan["schedule"] = [];
  const hourly: HourlyEntry[] = [];

  if (req.revision !== null) {
    const rev = await revisionOf(p.id, req.revision);
    const snap = rev.snapshot;
    const asIssued = projectAsIssued(p, snap.site);
    // The weather the revision was computed from travels with it; without one, the clear sky.
    const irradiance = snap.irradiance ?? { source: "clear sky" as const };
    const weather = irradiance.source === "weather series" && snap.weather ? { irradiance, rows: snap.weather } : null;
    const requestBase = { project: asIssued, year: snap.year, weather };
    const request = (surfaces: unknown[]) => yearRequestInput(asIssued, snap.year, surfaces, weather);
    for (const s of snap.facades) {
      const now = facadeById.get(s.facadeId);
      // Revisions issued before the snapshot kept the glazed area and shading: the façade's current ones.
      const glazedAreaM2 = s.glazedAreaM2 !== undefined ? s.glazedAreaM2 : (now?.glazedAreaM2 ?? null);
      const shading = s.shading !== undefined ? s.shading : now ? shadingOf(now) : undefined;
      const key = `${s.makeupId}#${s.makeupRevision}`;
      if (!makeups.has(key)) makeups.set(key, { key, name: s.makeupName, revision: s.makeupRevision, layers: s.layers });
      schedule.push({
        facadeId: s.facadeId,
        facadeName: s.facadeName,
        azimuthDeg: s.azimuthDeg,
        tiltDeg: s.tiltDeg,
        glazedAreaM2,
        option: {
          name: s.optionName,
          makeupName: s.makeupName,
          makeupRevision: s.makeupRevision,
          description: s.description,
          values: s.values,
          annual: s.annual,
          peak: s.peak,
          flags: s.flags,
        },
      });
      const surface = surfaceOf(`${s.facadeName} · ${s.optionName}`, s, s.layers, shading, glazedAreaM2);
      hourly.push({
        facadeId: s.facadeId,
        facadeName: s.facadeName,
        optionName: s.optionName,
        glazedAreaM2,
        surface,
        makeupKey: key,
        problem: problemOf(request([surface])),
      });
    }
    for (const u of snap.unapproved ?? []) {
      const f = facadeById.get(u.facadeId);
      schedule.push({
        facadeId: u.facadeId,
        facadeName: u.name,
        azimuthDeg: f?.azimuthDeg ?? NaN,
        tiltDeg: f?.tiltDeg ?? NaN,
        glazedAreaM2: f?.glazedAreaM2 ?? null,
        option: null,
      });
    }
    return {
      project: p,
      fileName: workbookFileName(p.name, rev.revision),
      draft: false,
      revision: { letter: rev.revision, issuedAt: rev.issuedAt, issuedBy: rev.issuedBy, note: rev.note },
      year: snap.year,
      site: snap.site,
      irradiance,
      schedule,
      hourly,
      makeups: [...makeups.values()],
      requestBase,
    };
  }

  // The current draft: every façade with its approved option, if any, and today's results for the year.
  const weather = await weatherForResults(p.id);
  const year = resultYear(req.year ?? new Date().getFullYear(), weather);
  const irradiance: IrradianceSource = weather?.irradiance ?? { source: "clear sky" };
  const requestBase = { project: p, year, weather };
  const request = (surfaces: unknown[]) => yearRequestInput(p, year, surfaces, weather);
  const approved = await db
    .select({ option: facadeOption, revision: makeupRevision })
    .from(facadeOption)
    .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId))
    .where(and(eq(facadeOption.projectId, p.id), eq(facadeOption.status, "approved")));
  const results = approved.length ? await projectResults(p.id, year, { optionIds: approved.map((a) => a.option.id) }) : null;
  const approvedById = new Map(approved.map((a) => [a.option.id, a]));
  for (const f of facades) {
    const fr = results?.facades.find((r) => r.facadeId === f.id);
    const o = fr?.options.find((x) => x.status === "approved");
    const a = o ? approvedById.get(o.optionId) : undefined;
    if (!o || !a) {
      schedule.push({ facadeId: f.id, facadeName: f.name, azimuthDeg: f.azimuthDeg, tiltDeg: f.tiltDeg, glazedAreaM2: f.glazedAreaM2, option: null });
      continue;
    }
    const key = `${a.option.makeupId}#${a.revision.revision}`;
    const layers = a.revision.layers as unknown[];
    if (!makeups.has(key)) makeups.set(key, { key, name: o.makeupName, revision: a.revision.revision, layers });
    schedule.push({
      facadeId: f.id,
      facadeName: f.name,
      azimuthDeg: f.azimuthDeg,
      tiltDeg: f.tiltDeg,
      glazedAreaM2: f.glazedAreaM2,
      option: {
        name: o.name,
        makeupName: o.makeupName,
        makeupRevision: o.makeupRevision,
        description: o.description,
        values: o.values,
        annual: o.annual,
        peak: o.peak,
        flags: o.flags,
        problem: o.problem,
      },
    });
    const surface = surfaceOf(`${f.name} · ${o.name}`, f, layers, shadingOf(f), f.glazedAreaM2);
    hourly.push({
      facadeId: f.id,
      facadeName: f.name,
      optionName: o.name,
      glazedAreaM2: f.glazedAreaM2,
      surface,
      makeupKey: key,
      problem: problemOf(request([surface])),
    });
  }
  return {
    project: p,
    fileName: workbookFileName(p.name, null),
    draft: true,
    revision: null,
    year,
    irradiance,
    site: {
      name: p.siteName,
      latitudeDeg: p.latitudeDeg,
      longitudeDeg: p.longitudeDeg,
      timeZone: p.timeZone,
      elevationM: p.elevationM,
      groundAlbedo: p.groundAlbedo,
      skyModel: p.skyModel,
      linkeTurbidity: p.linkeTurbidity ?? null,
    },
    schedule,
    hourly,
    makeups: [...makeups.values()],
    requestBase,
  };
}

// ---- computing ---------------------------------------------------------------------------------------------

/** The schedule request of a list of surfaces (the plan's period, site, sky and weather). */
export function planRequest(plan: Pick<WorkbookPlan, "requestBase">, surfaces: unknown[]) {
  const { project: p, year, weather } = plan.requestBase;
  return yearRequestInput(p, year, surfaces, weather);
}

/** The hourly schedule of one façade × option, exactly as POST /calc/schedule answers for its surface. */
/** A schedule answer whose rows hold only the sheet's fields (the calc task "scheduleSheet"). */
type SheetSchedule = Omit<ScheduleResponse, "surfaces"> & {
  surfaces: (Omit<ScheduleResponse["surfaces"][number], "rows"> & { rows: HourlyRow[] })[];
};

async function hourlyOf(plan: WorkbookPlan, e: HourlyEntry, pool: CalcPool | null): Promise<SheetSchedule> {
  return runCalc<"scheduleSheet", SheetSchedule>(pool, "scheduleSheet", ScheduleRequest.parse(planRequest(plan, [e.surface])));
}

type Angular = { ok: true; res: GlazingResponse } | { ok: false; problem: string };

async function angularOf(m: MakeupEntry, pool: CalcPool | null): Promise<Angular> {
  const req = GlazingRequest.safeParse({ layers: m.layers, anglesDeg: WORKBOOK_ANGLES_DEG });
  if (!req.success) return { ok: false, problem: `The stored layers cannot be computed: ${req.error.issues[0]!.message}` };
  return { ok: true, res: await runCalc<"glazing", GlazingResponse>(pool, "glazing", req.data) };
}

/** Rows with the W columns only where the façade has a glazed area (the engine would otherwise use the window's). */
function rowsFor(e: HourlyEntry, res: SheetSchedule): HourlyRow[] {
  const rows = res.surfaces[0]!.rows;
  if (e.glazedAreaM2) return rows;
  return rows.map((r) => ({ ...r, transmittedW: null, solarGainW: null }));
}

/** Hourly schedules computed ahead of the sheet being written: enough to keep the writer fed, few enough to keep memory flat. */
const LOOKAHEAD = 1;

/**
 * Computes the hourly schedules a few at a time ahead of the sheet being written (so that the workers
 * keep busy while exceljs writes, and memory holds only those few).
 */
class Lookahead<T> {
  private readonly started: Promise<T>[] = [];
  constructor(
    private readonly count: number,
    private readonly ahead: number,
    private readonly start: (i: number) => Promise<T>,
  ) {}
  get(i: number): Promise<T> {
    for (let k = this.started.length; k < Math.min(this.count, i + this.ahead + 1); k++) {
      const p = this.start(k);
      p.catch(() => {}); // awaited in turn; a failure ahead must not be an unhandled rejection meanwhile
      this.started.push(p);
    }
    const p = this.started[i]!;
    delete this.started[i]; // let a written sheet's rows go
    return p;
  }
}

// ---- writing -------------------------------------------------------------------------------------------------

type Sheet = ExcelJS.Worksheet;

/** Style objects shared by every cell of a column: exceljs recognises a style it has seen by identity. */
const styleFor = (c: ColumnSpec): Partial<ExcelJS.Style> => (c.numFmt ? { numFmt: c.numFmt } : {});
const BOLD: Partial<ExcelJS.Style> = { font: { bold: true } };
const HEADER: Partial<ExcelJS.Style> = { font: { bold: true }, alignment: { wrapText: true, vertical: "top" } };
const TITLE: Partial<ExcelJS.Style> = { font: { bold: true, size: 13 } };
const DRAFT_STYLE: Partial<ExcelJS.Style> = { font: { bold: true, color: { argb: "FFB42318" } } };

function addRow(ws: Sheet, cells: CellValue[], styles?: readonly Partial<ExcelJS.Style>[] | Partial<ExcelJS.Style>): void {
  const row = ws.addRow(cells as ExcelJS.CellValue[]);
  if (styles) {
    for (let k = 0; k < cells.length; k++) {
      const s = Array.isArray(styles) ? styles[k] : styles;
      if (s) row.getCell(k + 1).style = s as ExcelJS.Style;
    }
  }
  row.commit();
}

/** The first row of every sheet: what it is, and DRAFT on a draft. */
function markRow(ws: Sheet, plan: WorkbookPlan, title: string): void {
  const mark = plan.draft ? DRAFT_MARK : `Revision ${plan.revision!.letter} · issued ${plan.revision!.issuedAt.slice(0, 10)}`;
  addRow(ws, [`${safeText(plan.project.name)} — ${title}`, null, null, mark], [TITLE, {}, {}, plan.draft ? DRAFT_STYLE : BOLD]);
}

function tableSheet(wb: ExcelJS.stream.xlsx.WorkbookWriter, name: string, columns: readonly ColumnSpec[], headerRow: number): Sheet {
  const ws = wb.addWorksheet(name, { views: [{ state: "frozen", xSplit: 1, ySplit: headerRow }] });
  ws.columns = columns.map((c) => ({ width: c.width }));
  return ws;
}

/** Resolves once the zip has taken the sheet's whole XML (so that one sheet at a time sits in memory). */
function sheetZipped(wb: ExcelJS.stream.xlsx.WorkbookWriter, ws: Sheet): Promise<void> {
  const zip = (wb as unknown as { zip?: NodeJS.EventEmitter }).zip;
  if (!zip || typeof zip.on !== "function") return Promise.resolve();
  const name = `xl/worksheets/sheet${ws.id}.xml`;
  return new Promise((resolve, reject) => {
    const onEntry = (entry: { name?: string }) => {
      if (entry?.name !== name) return;
      zip.off("entry", onEntry);
      zip.off("error", onError);
      resolve();
    };
    const onError = (err: Error) => {
      zip.off("entry", onEntry);
      reject(err);
    };
    zip.on("entry", onEntry);
    zip.once("error", onError);
  });
}

/** The schedule methods in words for the plan's sky model (as POST /calc/schedule states them). */
function defaultMethods(plan: WorkbookPlan): Record<string, string> {
  const sky = SCHEDULE_METHODS.sky[plan.site.skyModel as keyof typeof SCHEDULE_METHODS.sky] ?? plan.site.skyModel;
  return { ...SCHEDULE_METHODS, sky };
}

/** The irradiance in words for the cover: the clear-sky model, or the weather file with its period and SHA-256. */
export function irradianceText(i: IrradianceSource): string {
  if (i.source === "clear sky") return "clear sky (modelled, no measured weather): the sky model and Linke turbidity below";
  return `weather file ${safeText(i.fileName)}: ${i.hours} hours from ${i.fromDate} to ${i.toDate} (SHA-256 ${i.sha256})`;
}

function coverRows(plan: WorkbookPlan, methods: Record<string, string>, glazingMethods: Record<string, string> | null, irradiance: string) {
  const s = plan.site;
  const req = planRequest(plan, []);
  const rows: [string, CellValue][] = [
    ["Project", safeText(plan.project.name)],
    ["Status", plan.draft ? DRAFT_MARK : `Issued revision ${plan.revision!.letter}`],
    ...(plan.revision
      ? ([
          ["Revision", plan.revision.letter],
          ["Issued (date and time, UTC)", plan.revision.issuedAt],
          ["Issued by", safeText(plan.revision.issuedBy)],
          ["Note", safeText(plan.revision.note ?? "")],
        ] as [string, CellValue][])
      : ([["Written (date and time, UTC)", new Date().toISOString()]] as [string, CellValue][])),
    ["Site", safeText(s.name)],
    ["Latitude (°, north positive)", s.latitudeDeg],
    ["Longitude (°, east positive)", s.longitudeDeg],
    ["Time zone (IANA)", safeText(s.timeZone)],
    ["Elevation (m above sea level)", s.elevationM],
    ["Period: first day", String(req.from)],
    ["Period: last day", String(req.to)],
    ["Time step (minutes)", Number(req.stepMinutes ?? 60)],
    ["Irradiance", irradiance],
    ["Sky model", s.skyModel],
    ["Ground albedo (−)", s.groundAlbedo],
    [
      "Linke turbidity (January … December)",
      s.linkeTurbidity ? s.linkeTurbidity.join(", ") : "the engine's generic monthly values (no site values given)",
    ],
    ["Façades in the schedule", plan.schedule.length],
    ["Façades without an approved option", plan.schedule.filter((e) => e.option === null).length],
  ];
  const method: [string, string][] = [
    ...Object.entries(methods).map(([k, v]) => [`Method: ${k}`, v] as [string, string]),
    ...Object.entries(glazingMethods ?? {}).map(([k, v]) => [`Method (glazing): ${k}`, v] as [string, string]),
  ];
  return { rows, method };
}

/** Writes a workbook plan into `out` (the caller ends nothing: exceljs ends `out` when done). */
export async function writeWorkbookPlan(plan: WorkbookPlan, out: Writable, opts: WorkbookOptions = {}): Promise<void> {
  const pool = opts.pool === undefined ? sharedCalcPool() : opts.pool;
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: false, zip: { zlib: { level: 1 } } });
  wb.creator = "Paneray";
  wb.created = plan.revision ? new Date(plan.revision.issuedAt) : new Date();
  const names = new SheetNames();
  const ahead = LOOKAHEAD;
  const hourly = new Lookahead(plan.hourly.length, ahead, (i) => {
    const e = plan.hourly[i]!;
    return e.problem ? Promise.resolve(null) : hourlyOf(plan, e, pool);
  });
  const angular = await Promise.all(plan.makeups.map((m) => angularOf(m, pool)));
  const firstHourly = plan.hourly.length ? await hourly.get(0) : null;
  const firstGlazing = angular.flatMap((a) => (a.ok ? [a.res] : []))[0];

  // Cover.
  const cover = wb.addWorksheet(names.name("Cover"));
  cover.columns = [{ width: 38 }, { width: 100 }, { width: 4 }, { width: 40 }];
  markRow(cover, plan, "schedule workbook");
  addRow(cover, []);
  const { rows, method } = coverRows(
    plan,
    firstHourly?.methods ?? defaultMethods(plan),
    (firstGlazing?.methods as Record<string, string> | undefined) ?? null,
    irradianceText(plan.irradiance),
  );
  for (const [k, v] of rows) addRow(cover, [k, v], [BOLD, {}]);
  addRow(cover, []);
  addRow(cover, ["Methods and their published sources"], [TITLE]);
  for (const [k, v] of method) addRow(cover, [k, v], [BOLD, { alignment: { wrapText: true } }]);
  addRow(cover, []);
  addRow(cover, ["Caution"], [TITLE]);
  addRow(cover, [WORKBOOK_CAUTION], [{ alignment: { wrapText: true } }]);
  addRow(cover, ["Local codes and licensed professionals decide what is acceptable for this building."]);
  addRow(cover, []);
  addRow(cover, [
    "Sheets: the glazing schedule; one hourly sheet per façade and approved option (its sums and peaks are live formulas); one sheet of angular values per make-up.",
  ]);
  cover.commit();

  // Glazing schedule.
  const table = scheduleTable(plan.schedule);
  const sched = tableSheet(wb, names.name("Glazing schedule"), table.columns, 3);
  markRow(sched, plan, "glazing schedule");
  addRow(sched, []);
  addRow(
    sched,
    table.columns.map((c) => c.header),
    table.columns.map(() => HEADER),
  );
  const schedStyles = table.columns.map(styleFor);
  for (const r of table.rows) addRow(sched, r, schedStyles);
  addRow(sched, []);
  addRow(sched, [WORKBOOK_CAUTION]);
  sched.commit();

  // Hourly sheets: one at a time, computed ahead in the pool.
  const hourlyStyles = HOURLY_COLUMNS.map(styleFor);
  let previous: Promise<void> = Promise.resolve();
  for (let i = 0; i < plan.hourly.length; i++) {
    const e = plan.hourly[i]!;
    const res = i === 0 ? firstHourly : await hourly.get(i);
    const ws = tableSheet(wb, names.name(`${e.facadeName} · ${e.optionName}`), HOURLY_COLUMNS, 5);
    markRow(ws, plan, `hourly schedule of ${e.facadeName} · ${e.optionName}`);
    if (!res) {
      addRow(ws, [safeText(e.problem ?? "This façade's option cannot be computed.")]);
      ws.commit();
      continue;
    }
    const rows = rowsFor(e, res);
    const first = 6;
    const last = first + rows.length - 1;
    const summary = hourlySummary(rows, res.stepMinutes, first, last);
    addRow(ws, summary.energy, [BOLD, ...hourlyStyles.slice(1)]);
    addRow(ws, summary.peak, [BOLD, ...hourlyStyles.slice(1)]);
    addRow(ws, [
      `${res.from} to ${res.to}, every ${res.stepMinutes} min, ${res.timeZone}; irradiance: ${res.irradiance}; glazed area: ${e.glazedAreaM2 ? `${e.glazedAreaM2} m²` : "not given (W columns empty)"}`,
    ]);
    addRow(
      ws,
      HOURLY_COLUMNS.map((c) => c.header),
      HOURLY_COLUMNS.map(() => HEADER),
    );
    for (let k = 0; k < rows.length; k++) {
      addRow(ws, hourlyCells(rows[k]!), hourlyStyles);
      if (k % 250 === 249) await yieldToLoop(); // let the zip compress while rows are written
    }
    await previous; // at most the previous sheet still being compressed
    previous = sheetZipped(wb, ws);
    previous.catch(() => {});
    ws.commit();
  }
  await previous;

  // Angular properties per make-up.
  plan.makeups.forEach((m, k) => {
    const got = angular[k]!;
    const ws = wb.addWorksheet(names.name(`Angles ${m.name} r${m.revision}`), { views: [{ state: "frozen", ySplit: 3 }] });
    markRow(ws, plan, `angular values of ${m.name} (revision ${m.revision})`);
    if (!got.ok) {
      addRow(ws, [safeText(got.problem)]);
      ws.commit();
      return;
    }
    const a = got.res;
    const t = angularTable(a.angles, a.hemispherical);
    ws.columns = t.columns.map((c) => ({ width: c.width }));
    addRow(ws, [`Centre-of-glass U-value (W/(m²·K)): ${a.uValue.toFixed(3)}; the last row is the hemispherical (diffuse light) value.`]);
    addRow(
      ws,
      t.columns.map((c) => c.header),
      t.columns.map(() => HEADER),
    );
    const styles = t.columns.map(styleFor);
    for (const r of t.rows) addRow(ws, r, styles);
    ws.commit();
  });
  await wb.commit();
}

/** Streams the workbook into `out`; resolves with its file name once the last byte is written. */
/**
 * Writes the workbook of `req` into `out`: on an export thread of its own (bounded heap, see
 * lib/server/workbook-thread), or on this thread when `opts.pool` is given (the schedules then come from that
 * pool, or from this thread with null).
 */
export async function writeWorkbook(req: WorkbookRequest, out: Writable, opts: WorkbookOptions = {}): Promise<{ fileName: string }> {
  const plan = await workbookPlan(req);
  if (opts.pool === undefined) await writeWorkbookInThread(plan, out);
  else await writeWorkbookPlan(plan, out, opts);
  return { fileName: plan.fileName };
}

/** The whole workbook in memory, for an attachment. */
export async function workbookFile(req: WorkbookRequest, opts: WorkbookOptions = {}): Promise<WorkbookFile> {
  const sink = new PassThrough();
  const chunks: Buffer[] = [];
  sink.on("data", (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve, reject) => {
    sink.on("end", resolve);
    sink.on("error", reject);
  });
  const { fileName } = await writeWorkbook(req, sink, opts);
  await ended;
  const bytes = Buffer.concat(chunks);
  return { fileName, bytes, sha256: createHash("sha256").update(bytes).digest("hex") };
}

// ---- CSV -----------------------------------------------------------------------------------------------------

export type WorkbookTable = "cover" | "schedule" | "hourly" | "angles";

/** One table of the workbook as CSV text (UTF-8 with a byte-order mark, CRLF lines) and its file name. */
export async function workbookCsv(
  plan: WorkbookPlan,
  table: WorkbookTable,
  facadeId: string | undefined,
  opts: WorkbookOptions = {},
): Promise<{ fileName: string; text: string }> {
  const pool = opts.pool === undefined ? sharedCalcPool() : opts.pool;
  const base = plan.fileName.replace(/\.xlsx$/, "");
  const out: string[] = ["\uFEFF"];
  if (table === "cover") {
    const { rows, method } = coverRows(plan, defaultMethods(plan), null, irradianceText(plan.irradiance));
    for (const r of [...rows, ...method, ["Caution", WORKBOOK_CAUTION] as [string, CellValue]]) out.push(csvLine(r));
    return { fileName: `${base}_cover.csv`, text: out.join("") };
  }
  if (table === "schedule") {
    const t = scheduleTable(plan.schedule);
    out.push(csvLine(t.columns.map((c) => c.header)));
    for (const r of t.rows) out.push(csvLine(r));
    return { fileName: `${base}_schedule.csv`, text: out.join("") };
  }
  const entryIndex = plan.hourly.findIndex((e) => e.facadeId === facadeId);
  if (entryIndex < 0) {
    const known = plan.schedule.some((s) => s.facadeId === facadeId);
    throw new NotFoundError(known ? "This façade has no approved option in this schedule" : "This schedule has no such façade");
  }
  const e = plan.hourly[entryIndex]!;
  const slug = (s: string) =>
    s
      .normalize("NFKD")
      .replace(/[^\w-]+/g, "-")
      .replace(/-+/g, "-")
      .replace(/^-|-$/g, "") || "facade";
  if (table === "angles") {
    const m = plan.makeups.find((x) => x.key === e.makeupKey)!;
    const a = await angularOf(m, pool);
    if (!a.ok) throw new NotFoundError(a.problem);
    const t = angularTable(a.res.angles, a.res.hemispherical);
    out.push(csvLine(t.columns.map((c) => c.header)));
    for (const r of t.rows) out.push(csvLine(r));
    return { fileName: `${base}_angles_${slug(m.name)}.csv`, text: out.join("") };
  }
  if (e.problem) throw new NotFoundError(e.problem);
  const res = await hourlyOf(plan, e, pool);
  out.push(csvLine(HOURLY_COLUMNS.map((c) => c.header)));
  for (const r of rowsFor(e, res)) out.push(csvLine(hourlyCells(r)));
  return { fileName: `${base}_hourly_${slug(e.facadeName)}.csv`, text: out.join("") };
}
