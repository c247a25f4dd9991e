/**
 * The tables of the schedule workbook, independent of the file format: the glazing schedule, a façade ×
 * option's hourly table with its period sums and peaks, a make-up's angular values, sheet names, CSV text
 * and the neutralising of user text that a spreadsheet would read as a formula. Pure (no I/O): the
 * workbook service writes these tables with exceljs and as CSV; the unit tests read them directly.
 */
import type { GlazingAngleRow, GlazingValues, LightSummary } from "@/lib/contracts/glazing";
import type { MakeupValues } from "@/lib/contracts/results";
import { REQUIREMENT_KEYS, REQUIREMENT_LABELS, type RequirementFlag, type RequirementKey } from "@/lib/contracts/requirements";
import type { ScheduleRow } from "@/lib/contracts/schedule";
import { lightText, makeupLight } from "./makeup-light";

/** A cell: text, a number, a date (local clock time, written as its UTC fields), a live formula with its computed value, or empty. */
export type CellValue = string | number | Date | { formula: string; result: number } | null;

/** One column of a table: its header (quantity and unit) and its spreadsheet number format. */
export interface ColumnSpec {
  header: string;
  /** Excel number format; "@" text, undefined General. */
  numFmt?: string;
  width: number;
}

/**
 * Text a spreadsheet would read as a formula or a command (it starts with =, +, -, @, tab or carriage
 * return) gets a leading apostrophe, so it is shown as typed and never evaluated.
 */
export function safeText(value: string | null | undefined): string {
  if (!value) return "";
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

// ---- sheet names -----------------------------------------------------------------------------------------

/** Longest sheet name a spreadsheet accepts. */
export const MAX_SHEET_NAME = 31;

/**
 * Hands out sheet names that spreadsheets accept: at most 31 characters, none of [ ] : * ? / \, no leading
 * or trailing apostrophe, not empty, and unique without regard to case (" (2)", " (3)" … added when taken).
 */
export class SheetNames {
  private readonly taken = new Set<string>();

  name(wanted: string): string {
    const clean =
      wanted
        .replace(/[[\]:*?/\\]/g, "-")
        // eslint-disable-next-line no-control-regex
        .replace(/[\u0000-\u001f\u007f]/g, " ")
        .replace(/\s+/g, " ")
        .trim()
        .replace(/^'+|'+$/g, "")
        .trim() || "Sheet";
    const cut = (s: string, max: number) => [...s].slice(0, max).join("").trim();
    let candidate = cut(clean, MAX_SHEET_NAME);
    for (let n = 2; this.taken.has(candidate.toLowerCase()); n++) {
      const suffix = ` (${n})`;
      candidate = cut(clean, MAX_SHEET_NAME - suffix.length) + suffix;
    }
    this.taken.add(candidate.toLowerCase());
    return candidate;
  }
}

// ---- glazing schedule ------------------------------------------------------------------------------------

/** One row of the glazing schedule: a façade with its approved option (or without one). */
export interface ScheduleEntry {
  facadeName: string;
  azimuthDeg: number;
  tiltDeg: number;
  glazedAreaM2: number | null;
  /** Null when the façade has no approved option (the row says so). */
  option: {
    name: string;
    makeupName: string;
    makeupRevision: number;
    description: string;
    values: MakeupValues;
    annual: { transmittedKWhm2: number; solarGainKWhm2: number };
    peak: { transmittedWm2: number; at: string | null };
    flags: RequirementFlag[];
    problem?: string;
  } | null;
}

const COMPASS = ["N", "NNE", "NE", "ENE", "E", "ESE", "SE", "SSE", "S", "SSW", "SW", "WSW", "W", "WNW", "NW", "NNW"] as const;

/** The 16-point compass direction a façade faces (its outward normal's azimuth, clockwise from north). */
export function compassPoint(azimuthDeg: number): string {
  const i = Math.round((((azimuthDeg % 360) + 360) % 360) / 22.5) % 16;
  return COMPASS[i]!;
}

const FLAG_WORDS = { pass: "meets", fail: "does not meet", unknown: "unknown" } as const;

/** τv as a number when it is known exactly, else its range or "unknown" in words (lightText). */
export function lightCell(light: LightSummary): number | string {
  return light.transmittance !== null ? light.transmittance : lightText(light, 3);
}

/** The glazing schedule's columns and rows; the number of α columns is the most panes of any make-up. */
export function scheduleTable(entries: readonly ScheduleEntry[]): { columns: ColumnSpec[]; rows: CellValue[][] } {
  const panes = Math.max(1, ...entries.map((e) => e.option?.values.normal.layerAbsorptance.length ?? 0));
  const requirements = REQUIREMENT_KEYS.filter((k) => entries.some((e) => e.option?.flags.some((f) => f.requirement === k)));
  const num = (header: string, numFmt = "0.000", width = 12): ColumnSpec => ({ header, numFmt, width });
  const text = (header: string, width = 18): ColumnSpec => ({ header, numFmt: "@", width });
  const columns: ColumnSpec[] = [
    text("Façade", 20),
    num("Orientation: azimuth of the outward normal (°, clockwise from north)", "0.0"),
    text("Orientation (compass point)", 10),
    num("Tilt from horizontal (°)", "0.0"),
    num("Glazed area (m²)", "0.00"),
    text("Option", 20),
    text("Make-up", 22),
    num("Make-up revision", "0", 9),
    text("Make-up description (outdoors first)", 30),
    num("Solar transmittance τe at normal incidence (−)"),
    num("Solar reflectance ρe, outdoor side (−)"),
    num("Solar reflectance ρe, indoor side (−)"),
    ...Array.from({ length: panes }, (_, k) => num(`Solar absorptance α of pane ${k + 1} (outdoors first) (−)`)),
    num("Total solar energy transmittance g, EN 410 (−)"),
    num("Centre-of-glass U-value, EN 673 (W/(m²·K))", "0.00"),
    { header: "Light transmittance τv (−; a range where some light reflectances are unknown)", numFmt: "0.000", width: 14 },
    text("τv basis", 14),
    num("Hemispherical solar transmittance τe,hem (diffuse light) (−)"),
    num("Hemispherical g-value g,hem (−)"),
    num("Transmitted solar energy over the period (kWh/m²)", "0.0"),
    num("Solar gain over the period (kWh/m²)", "0.0"),
    num("Peak transmitted solar irradiance (W/m²)", "0.0"),
    text("Peak at (ISO 8601 with UTC offset)", 26),
    ...requirements.flatMap((k) => [
      num(`${REQUIREMENT_LABELS[k]}: limit`),
      text(`${REQUIREMENT_LABELS[k]}: result`, 14),
      num(`${REQUIREMENT_LABELS[k]}: margin (≥ 0 meets it)`),
    ]),
    text("Notes", 40),
  ];
  const rows = entries.map((e): CellValue[] => {
    const head: CellValue[] = [safeText(e.facadeName), e.azimuthDeg, compassPoint(e.azimuthDeg), e.tiltDeg, e.glazedAreaM2];
    const o = e.option;
    if (!o) {
      const blanks = columns.length - head.length - 1;
      return [
        ...head,
        "(no approved option)",
        ...Array<CellValue>(blanks - 1).fill(null),
        "No option of this façade is approved yet; an architect or owner approves one.",
      ];
    }
    const n = o.values.normal;
    const h = o.values.hemispherical;
    const light = makeupLight(o.values);
    const flags = new Map(o.flags.map((f) => [f.requirement, f] as const));
    const flagCells = requirements.flatMap((k: RequirementKey): CellValue[] => {
      const f = flags.get(k);
      return f ? [f.limit, FLAG_WORDS[f.status], f.margin] : [null, "not set", null];
    });
    return [
      ...head,
      safeText(o.name),
      safeText(o.makeupName),
      o.makeupRevision,
      safeText(o.description),
      n.solarTransmittance,
      n.solarReflectanceFront,
      n.solarReflectanceBack,
      ...Array.from({ length: panes }, (_, k) => n.layerAbsorptance[k] ?? null),
      n.gValue,
      o.values.uValue,
      lightCell(light),
      light.basis,
      h.solarTransmittance,
      h.gValue,
      o.annual.transmittedKWhm2,
      o.annual.solarGainKWhm2,
      o.peak.transmittedWm2,
      o.peak.at ?? "",
      ...flagCells,
      safeText(o.problem ?? ""),
    ];
  });
  return { columns, rows };
}

// ---- hourly table ----------------------------------------------------------------------------------------

/** Columns of the hourly table, in order; the last two only carry values when the façade has a glazed area. */
export const HOURLY_COLUMNS: readonly ColumnSpec[] = [
  { header: "Local time, site clock (interval midpoint)", numFmt: "yyyy-mm-dd hh:mm", width: 17 },
  { header: "Instant (ISO 8601 with UTC offset)", numFmt: "@", width: 26 },
  { header: "Sun altitude (°)", numFmt: "0.000", width: 10 },
  { header: "Sun azimuth (°, clockwise from north)", numFmt: "0.000", width: 12 },
  { header: "Angle of incidence on the glass (°)", numFmt: "0.000", width: 12 },
  { header: "Beam transmittance τe(θ) (−)", numFmt: "0.000000", width: 12 },
  { header: "Sunlit fraction of the window (−)", numFmt: "0.000000", width: 11 },
  { header: "Beam irradiance on the glass (W/m²)", numFmt: "0.00", width: 12 },
  { header: "Diffuse irradiance on the glass (W/m²)", numFmt: "0.00", width: 12 },
  { header: "Transmitted solar irradiance (W/m²)", numFmt: "0.00", width: 12 },
  { header: "Solar gain (W/m²)", numFmt: "0.00", width: 11 },
  { header: "Transmitted for the façade's glazed area (W)", numFmt: "0.0", width: 13 },
  { header: "Solar gain for the façade's glazed area (W)", numFmt: "0.0", width: 13 },
];

/** Spreadsheet column letters of the hourly table (A …). */
export const columnLetter = (index: number): string => {
  let n = index + 1;
  let s = "";
  while (n > 0) {
    const r = (n - 1) % 26;
    s = String.fromCharCode(65 + r) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
};

/** The wall-clock time of an ISO instant with offset ("2026-03-29T02:30:00+01:00" → 02:30 of that day), as a Date of those UTC fields. */
export function localClock(iso: string): Date {
  return new Date(`${iso.slice(0, 19)}Z`);
}

/** Keys of the hourly columns that sum to energies and have peaks (the power columns), with their column index. */
const POWER_COLUMNS = [
  { index: 7, key: "beamIncidentWm2", area: false },
  { index: 8, key: "diffuseIncidentWm2", area: false },
  { index: 9, key: "transmittedWm2", area: false },
  { index: 10, key: "solarGainWm2", area: false },
  { index: 11, key: "transmittedW", area: true },
  { index: 12, key: "solarGainW", area: true },
] as const;

/** The fields of a schedule row that the hourly sheet shows (what `hourlyCells` and `hourlySummary` read). */
export const HOURLY_ROW_KEYS = [
  "time",
  "sunAltitudeDeg",
  "sunAzimuthDeg",
  "incidenceDeg",
  "beamTransmittance",
  "sunlitFraction",
  "beamIncidentWm2",
  "diffuseIncidentWm2",
  "transmittedWm2",
  "solarGainWm2",
  "transmittedW",
  "solarGainW",
] as const satisfies readonly (keyof ScheduleRow)[];

export type HourlyRow = Pick<ScheduleRow, (typeof HOURLY_ROW_KEYS)[number]>;

/** A schedule row cut to the sheet's fields: a year of rows passes between threads at about half the size. */
export function hourlyRowOf(r: ScheduleRow): HourlyRow {
  const out: Partial<Record<(typeof HOURLY_ROW_KEYS)[number], unknown>> = {};
  for (const k of HOURLY_ROW_KEYS) out[k] = r[k];
  return out as HourlyRow;
}

/** One hourly row as cells, in HOURLY_COLUMNS order (the W columns empty without a glazed area). */
export function hourlyCells(r: HourlyRow): CellValue[] {
  return [
    localClock(r.time),
    r.time,
    r.sunAltitudeDeg,
    r.sunAzimuthDeg,
    r.incidenceDeg,
    r.beamTransmittance,
    r.sunlitFraction,
    r.beamIncidentWm2,
    r.diffuseIncidentWm2,
    r.transmittedWm2,
    r.solarGainWm2,
    r.transmittedW ?? null,
    r.solarGainW ?? null,
  ];
}

/**
 * The two summary rows above the hourly header: energy over the period (SUM of the column × step ÷ 60 ÷ 1000,
 * kWh/m² or kWh) and the peak (MAX of the column, the column's unit), as live formulas over the data rows
 * `firstRow`…`lastRow` (1-based sheet rows), each with its value computed from the same cell values so that
 * a program that does not recalculate shows the right figure.
 */
export function hourlySummary(
  rows: readonly HourlyRow[],
  stepMinutes: number,
  firstRow: number,
  lastRow: number,
): { energy: CellValue[]; peak: CellValue[] } {
  const energy: CellValue[] = Array<CellValue>(HOURLY_COLUMNS.length).fill(null);
  const peak: CellValue[] = Array<CellValue>(HOURLY_COLUMNS.length).fill(null);
  energy[0] = "Energy over the period (kWh/m²; kWh in the W columns) = SUM × step ÷ 60 ÷ 1000";
  peak[0] = "Peak (MAX of the column, in its unit)";
  const hasArea = rows.some((r) => r.transmittedW !== undefined && r.transmittedW !== null);
  for (const c of POWER_COLUMNS) {
    if (c.area && !hasArea) continue;
    let sum = 0;
    let max = rows.length ? -Infinity : 0;
    for (const r of rows) {
      const v = (r[c.key] as number | null | undefined) ?? 0;
      sum += v;
      if (v > max) max = v;
    }
    const range = `${columnLetter(c.index)}${firstRow}:${columnLetter(c.index)}${lastRow}`;
    energy[c.index] = { formula: `SUM(${range})*${stepMinutes}/60/1000`, result: (sum * stepMinutes) / 60 / 1000 };
    peak[c.index] = { formula: `MAX(${range})`, result: max };
  }
  return { energy, peak };
}

// ---- angular properties ----------------------------------------------------------------------------------

/** The angular table of a make-up: angle, τe, ρe both sides, α of each pane, g, and τv where it is known per angle. */
export function angularTable(angles: readonly GlazingAngleRow[], hemispherical: GlazingValues): { columns: ColumnSpec[]; rows: CellValue[][] } {
  const panes = Math.max(hemispherical.layerAbsorptance.length, ...angles.map((a) => a.layerAbsorptance.length));
  const withLight = angles.some((a) => a.visibleTransmittance !== null);
  const num = (header: string): ColumnSpec => ({ header, numFmt: "0.0000", width: 12 });
  const columns: ColumnSpec[] = [
    { header: "Angle of incidence (°; “hemispherical” = diffuse light)", numFmt: "0", width: 16 },
    num("Solar transmittance τe (−)"),
    num("Solar reflectance ρe, outdoor side (−)"),
    num("Solar reflectance ρe, indoor side (−)"),
    ...Array.from({ length: panes }, (_, k) => num(`Solar absorptance α of pane ${k + 1} (outdoors first) (−)`)),
    num("Total solar energy transmittance g (−)"),
    ...(withLight ? [num("Light transmittance τv (−)")] : []),
  ];
  const line = (label: number | string, v: GlazingValues): CellValue[] => [
    label,
    v.solarTransmittance,
    v.solarReflectanceFront,
    v.solarReflectanceBack,
    ...Array.from({ length: panes }, (_, k) => v.layerAbsorptance[k] ?? null),
    v.gValue,
    ...(withLight ? [v.visibleTransmittance] : []),
  ];
  return { columns, rows: [...angles.map((a) => line(a.angleDeg, a)), line("hemispherical", hemispherical)] };
}

/** Angles of the workbook's angular tables: 0° to 90° by 5°. */
export const WORKBOOK_ANGLES_DEG = Array.from({ length: 19 }, (_, i) => i * 5);

// ---- CSV -------------------------------------------------------------------------------------------------

/** One CSV field (RFC 4180 quoting); text through safeText, dates as local "YYYY-MM-DD hh:mm", formulas as their value. */
export function csvField(v: CellValue): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(v) : "";
  if (v instanceof Date) return v.toISOString().slice(0, 16).replace("T", " ");
  if (typeof v === "object") return String(v.result);
  const s = safeText(v);
  return /[",\r\n]/.test(s) || s !== s.trim() ? `"${s.replace(/"/g, '""')}"` : s;
}

/** A CSV line (CRLF-terminated) of cells. */
export const csvLine = (cells: readonly CellValue[]): string => `${cells.map(csvField).join(",")}\r\n`;
