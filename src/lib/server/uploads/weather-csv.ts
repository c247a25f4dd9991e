/**
 * A CSV file of hourly weather for a project: global horizontal, direct normal and diffuse horizontal
 * irradiance (W/m²) and, optionally, air temperature (°C), one row an hour.
 *
 * Time: each row's `time` is the START of the hour its values stand for (the engine is given the hour's
 * midpoint). Either an instant with its UTC offset (2025-06-01T10:00+02:00, …Z) or a local time in the
 * project's time zone (2025-06-01 10:00). A local time the clocks skip (spring forward) is an error; a local
 * time the clocks repeat (autumn) is refused as ambiguous unless it carries its offset, so that no hour is
 * placed by guesswork. Rows must be hourly, in time order, on the hour in the project's zone, with no repeated
 * and no missing hours; the period is the file's first to last hour (at most 366 local days, the engine's
 * limit).
 *
 * Physical checks, each row (bounds and their sources):
 * - GHI, DNI, DHI ≥ 0 W/m²: irradiance cannot be negative (common practice (no source); small negative night
 *   readings of thermopile sensors must be set to 0 before upload).
 * - GHI ≤ 1500 W/m², DHI ≤ 1000 W/m²: the ranges the schedule engine accepts (contracts/schedule.ts WeatherRow).
 * - DNI ≤ the extraterrestrial normal irradiance of the day (solar constant 1361 W/m² × Spencer 1971's
 *   eccentricity factor): the beam cannot exceed what reaches the top of the atmosphere; the BSRN
 *   "physically possible" limit for direct normal irradiance (Long & Dutton 2002, BSRN recommended QC tests,
 *   from memory).
 * - DHI ≤ 1.05 × GHI + 10 W/m²: the diffuse part cannot exceed the global; the factor 1.05 is the BSRN
 *   comparison test's diffuse ratio limit (Long & Dutton 2002, from memory); the 10 W/m² allowance for low
 *   light and sensor offsets is common practice (no source).
 * - Air temperature −90 … 60 °C: just beyond the lowest and highest air temperatures recorded on Earth
 *   (−89.2 °C, Vostok 1983; 56.7 °C, Death Valley 1913; WMO archive of weather extremes, from memory).
 */
import { MAX_WEATHER_ROWS, WEATHER_COLUMNS, WEATHER_REQUIRED_COLUMNS, type UploadError } from "@/lib/contracts/uploads";
import { MAX_SPAN_DAYS } from "@/lib/contracts/schedule";
import { extraterrestrialIrradianceSpencer1971 } from "@/lib/physics/irradiance";
import { zoneClock, type WallTime } from "@/lib/time/local-instant";
import { cell, decodeText, ErrorList, numberCell, readCsv } from "./csv";

const HOUR_MS = 3_600_000;
export const GHI_MAX_WM2 = 1500;
export const DHI_MAX_WM2 = 1000;
export const DIFFUSE_RATIO_MAX = 1.05;
export const DIFFUSE_ALLOWANCE_WM2 = 10;
export const AIR_TEMPERATURE_RANGE_C = [-90, 60] as const;

/** A project's series as stored (weather_series.series): parallel arrays, one entry an hour. */
export interface StoredSeries {
  /** The start of each hour, ISO-8601 UTC instants. */
  time: string[];
  ghiWm2: number[];
  dniWm2: number[];
  dhiWm2: number[];
  airTemperatureC: (number | null)[];
}

export interface WeatherCsvSeries {
  series: StoredSeries;
  fromMs: number;
  toMs: number;
  fromDate: string;
  toDate: string;
  hours: number;
}

export type WeatherCsvResult = { ok: true; weather: WeatherCsvSeries; rowCount: number } | { ok: false; errors: UploadError[] };

const TIME = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?\s*(Z|[+-]\d{2}(?::?\d{2})?)?$/i;

const pad = (n: number, w = 2) => String(n).padStart(w, "0");
const wallText = (w: WallTime) => `${w.year}-${pad(w.month)}-${pad(w.day)} ${pad(w.hour)}:${pad(w.minute)}`;
const dateOf = (w: WallTime) => `${w.year}-${pad(w.month)}-${pad(w.day)}`;
const isoMinute = (t: number) => new Date(t).toISOString().slice(0, 16) + "Z";

function dayOfYearUtc(t: number): number {
  const d = new Date(t);
  return Math.floor((t - Date.UTC(d.getUTCFullYear(), 0, 1)) / 86_400_000) + 1;
}

/** DNI upper bound of a day: the extraterrestrial normal irradiance (W/m²). */
export const dniLimitWm2 = (t: number) => extraterrestrialIrradianceSpencer1971(Math.min(365, dayOfYearUtc(t)));

export function validateWeatherCsv(bytes: Uint8Array, timeZone: string): WeatherCsvResult {
  const errors = new ErrorList();
  const text = decodeText(bytes, errors);
  const table = text === null ? null : readCsv(text, WEATHER_COLUMNS, WEATHER_REQUIRED_COLUMNS, MAX_WEATHER_ROWS, errors);
  if (!table) return { ok: false, errors: errors.list() };
  const clock = zoneClock(timeZone);

  const n = table.rows.length;
  const times = new Float64Array(n).fill(NaN);
  const ghi = new Float64Array(n);
  const dni = new Float64Array(n);
  const dhi = new Float64Array(n);
  const air: (number | null)[] = new Array(n).fill(null);

  table.rows.forEach(({ line, cells }, i) => {
    // Time.
    const raw = cell(table, cells, "time");
    const m = TIME.exec(raw);
    let t = NaN;
    if (!raw) errors.add(line, "time", "time is needed on every row");
    else if (!m)
      errors.add(line, "time", `“${raw.slice(0, 40)}” is not a time; write e.g. 2025-06-01T10:00+02:00, 2025-06-01T08:00Z or 2025-06-01 10:00`);
    else {
      const w: WallTime = { year: +m[1]!, month: +m[2]!, day: +m[3]!, hour: +m[4]!, minute: +m[5]!, second: m[6] ? +m[6] : 0 };
      const real = new Date(Date.UTC(w.year, w.month - 1, w.day));
      if (
        w.month < 1 ||
        w.month > 12 ||
        real.getUTCDate() !== w.day ||
        real.getUTCMonth() !== w.month - 1 ||
        w.hour > 23 ||
        w.minute > 59 ||
        w.second > 59
      )
        errors.add(line, "time", `“${raw}” is not a real date and time`);
      else if (m[7]) {
        const z = m[7].toUpperCase();
        const sign = z.startsWith("-") ? -1 : 1;
        const digits = z === "Z" ? "0000" : z.slice(1).replace(":", "").padEnd(4, "0");
        const offsetMin = z === "Z" ? 0 : sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4)));
        if (Math.abs(offsetMin) > 14 * 60) errors.add(line, "time", `the UTC offset ${z} is not a real one (at most ±14:00)`);
        else t = Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second) - offsetMin * 60_000;
      } else {
        const found = clock.instantsOf(w);
        if (found.length === 0)
          errors.add(line, "time", `${wallText(w)} does not exist in ${timeZone}: the clocks go forward at that hour; leave the row out`);
        else if (found.length > 1) {
          const offs = found.map((x) => clock.offsetMinutesAt(x));
          const fmt = (o: number) => `${o < 0 ? "-" : "+"}${pad(Math.floor(Math.abs(o) / 60))}:${pad(Math.abs(o) % 60)}`;
          errors.add(
            line,
            "time",
            `${wallText(w)} happens twice in ${timeZone} (the clocks go back); write this row with its UTC offset, ${raw.slice(0, 16).replace(" ", "T")}${fmt(offs[0]!)} for the first or ${fmt(offs[1]!)} for the second`,
          );
        } else t = found[0]!;
      }
      if (Number.isFinite(t)) {
        const local = clock.wallTimeAt(t);
        if (local.minute !== 0 || local.second !== 0) {
          errors.add(line, "time", `${raw} is ${wallText(local)} in ${timeZone}; rows must start on the hour in the project's time zone`);
          t = NaN;
        }
      }
    }
    times[i] = t;

    // Irradiance and temperature.
    const num = (column: string, needed: boolean) => {
      const v = numberCell(cell(table, cells, column), line, column, errors);
      if (v === null && needed) errors.add(line, column, `${column} is needed on every row`);
      return v;
    };
    const g = num("ghi_wm2", true);
    const b = num("dni_wm2", true);
    const d = num("dhi_wm2", true);
    const a = num("air_temperature_c", false);
    if (typeof g === "number") {
      if (g < 0) errors.add(line, "ghi_wm2", `global horizontal irradiance cannot be negative (${g} W/m²)`);
      else if (g > GHI_MAX_WM2) errors.add(line, "ghi_wm2", `${g} W/m² is more than the ${GHI_MAX_WM2} W/m² global horizontal irradiance can reach`);
      ghi[i] = g;
    }
    if (typeof b === "number") {
      const limit = Number.isFinite(t) ? dniLimitWm2(t) : 1420;
      if (b < 0) errors.add(line, "dni_wm2", `direct normal irradiance cannot be negative (${b} W/m²)`);
      else if (b > limit)
        errors.add(line, "dni_wm2", `${b} W/m² is more than the sun delivers above the atmosphere on that day (${limit.toFixed(0)} W/m²)`);
      dni[i] = b;
    }
    if (typeof d === "number") {
      if (d < 0) errors.add(line, "dhi_wm2", `diffuse horizontal irradiance cannot be negative (${d} W/m²)`);
      else if (d > DHI_MAX_WM2) errors.add(line, "dhi_wm2", `${d} W/m² is more than the ${DHI_MAX_WM2} W/m² diffuse horizontal irradiance can reach`);
      else if (typeof g === "number" && g >= 0 && d > DIFFUSE_RATIO_MAX * g + DIFFUSE_ALLOWANCE_WM2)
        errors.add(line, "dhi_wm2", `the diffuse part (${d} W/m²) cannot be more than the global horizontal irradiance (${g} W/m²)`);
      dhi[i] = d;
    }
    if (typeof a === "number") {
      const [lo, hi] = AIR_TEMPERATURE_RANGE_C;
      if (a < lo || a > hi) errors.add(line, "air_temperature_c", `${a} °C is outside the air temperatures met on Earth (${lo} to ${hi} °C)`);
      air[i] = a;
    }
  });

  // Hourly, in order, no repeated or missing hours.
  const seen = new Map<number, number>();
  let prev: { t: number; line: number } | null = null;
  let first = Infinity;
  let last = -Infinity;
  table.rows.forEach(({ line }, i) => {
    const t = times[i]!;
    if (!Number.isFinite(t)) return;
    const again = seen.get(t);
    if (again !== undefined) {
      errors.add(line, "time", `the hour ${isoMinute(t)} is already on line ${again}; each hour once`);
      return;
    }
    seen.set(t, line);
    first = Math.min(first, t);
    last = Math.max(last, t);
    if (prev) {
      const dt = t - prev.t;
      if (dt < 0) errors.add(line, "time", `this hour comes before the one on line ${prev.line}; sort the rows by time`);
      else if (dt % HOUR_MS !== 0) errors.add(line, "time", `${dt / 60_000} minutes after line ${prev.line}; rows must be one hour apart`);
      else if (dt > HOUR_MS) {
        const missing = dt / HOUR_MS - 1;
        errors.add(
          line,
          "time",
          missing === 1
            ? `the hour ${isoMinute(prev.t + HOUR_MS)} is missing between line ${prev.line} and this line`
            : `${missing} hours are missing between line ${prev.line} and this line (${isoMinute(prev.t + HOUR_MS)} to ${isoMinute(t - HOUR_MS)})`,
        );
      }
    }
    if (!prev || t > prev.t) prev = { t, line };
  });

  let fromDate = "";
  let toDate = "";
  if (Number.isFinite(first)) {
    fromDate = dateOf(clock.wallTimeAt(first));
    toDate = dateOf(clock.wallTimeAt(last));
    const days = (Date.parse(`${toDate}T00:00:00Z`) - Date.parse(`${fromDate}T00:00:00Z`)) / 86_400_000 + 1;
    if (days > MAX_SPAN_DAYS)
      errors.add(table.rows[n - 1]!.line, "time", `the file covers ${days} days (${fromDate} to ${toDate}); at most ${MAX_SPAN_DAYS} days`);
  }
  if (errors.count) return { ok: false, errors: errors.list() };

  const series: StoredSeries = { time: [], ghiWm2: [], dniWm2: [], dhiWm2: [], airTemperatureC: [] };
  for (let i = 0; i < n; i++) {
    series.time.push(new Date(times[i]!).toISOString());
    series.ghiWm2.push(ghi[i]!);
    series.dniWm2.push(dni[i]!);
    series.dhiWm2.push(dhi[i]!);
    series.airTemperatureC.push(air[i]!);
  }
  return { ok: true, weather: { series, fromMs: first, toMs: last, fromDate, toDate, hours: n }, rowCount: n };
}

/** The schedule engine's weather rows of a stored series: each hour's values at its midpoint. */
export function engineWeather(series: StoredSeries): { time: string; ghi: number; dni: number; dhi: number }[] {
  return series.time.map((t, i) => ({
    time: new Date(Date.parse(t) + HOUR_MS / 2).toISOString(),
    ghi: series.ghiWm2[i]!,
    dni: series.dniWm2[i]!,
    dhi: series.dhiWm2[i]!,
  }));
}
