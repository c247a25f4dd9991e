/**
 * Local-time timeline: the rows (time steps) of an hour-by-hour (or finer) calculation for a
 * site, laid out on the site's civil clock but stored as UTC instants.
 *
 * Pure: uses only `Intl.DateTimeFormat` (the IANA time zone database shipped with the
 * JavaScript runtime). It reads no clock, environment or file.
 *
 * Definitions
 * - A local date's day is the absolute-time interval [start of the date, start of the next
 *   date). The start of a date is the first instant whose local wall-clock time is at or after
 *   00:00 of that date. Usually that is local midnight. Where midnight does not exist (a zone
 *   that springs forward at 00:00, e.g. America/Santiago, America/Havana), the day starts at
 *   the transition instant (01:00 local). Where midnight occurs twice (a fall-back at 00:00),
 *   the day starts at the first occurrence. Days therefore tile absolute time without gap or
 *   overlap: a 23-hour daylight-saving day has 23 hourly rows, a 25-hour day 25.
 * - Each day is cut into intervals of exactly `stepMinutes` of absolute time, starting at the
 *   day's start. A day's length must be a whole number of steps; otherwise a RangeError is
 *   thrown (this happens only in zones whose shifts are not whole hours, e.g.
 *   Australia/Lord_Howe's 30-minute daylight saving with a 60-minute step, or historical
 *   local-mean-time changes). So consecutive interval starts are exactly `stepMinutes` apart
 *   across the whole range and every row stands for the same duration.
 * - A row is evaluated at the MIDPOINT of its interval (`epochMs`), which is the usual choice
 *   for hourly sums of a quantity that varies within the hour [common practice (no source)].
 *
 * Method (speed): the zone's UTC offset is read through `Intl` once per day, at instants 24 h
 * of absolute time apart that bracket each local midnight of the range. Where two
 * consecutive samples differ, the transition instant is located by bisection to the second
 * (time-zone transitions fall on whole seconds). This gives the offset as a piecewise-constant
 * function of UTC time; the day starts, row offsets and local clock times then follow by
 * arithmetic, with no `Intl` call per row. A year costs about 370 `Intl` calls plus about 17
 * per transition. Limitation: two transitions less than 24 h apart that restore the previous
 * offset would not be seen.
 *
 * Dates are proleptic Gregorian; day numbers use the civil-from-days algorithm of
 * H. Hinnant, "chrono-Compatible Low-Level Date Algorithms" (howardhinnant.github.io,
 * cited from memory).
 */

/** Request for a timeline. */
export interface TimelineSpec {
  /** IANA time zone name, e.g. "Europe/Lisbon" (as accepted by `Intl.DateTimeFormat`). */
  timeZone: string;
  /** First local date, YYYY-MM-DD (inclusive). */
  from: string;
  /** Last local date, YYYY-MM-DD (inclusive). */
  to: string;
  /** Row length [min]; must divide 1440 (1, 2, 3, 4, 5, 6, 8, 10, 12, 15, 20, 30, 60, … 1440). */
  stepMinutes: number;
}

/** One local date of a timeline and the rows that belong to it. */
export interface TimelineDay {
  /** Local date, YYYY-MM-DD. */
  date: string;
  year: number;
  /** 1–12. */
  month: number;
  /** 1–366 (1 = 1 January). */
  dayOfYear: number;
  /** Index of the day's first row. */
  firstRow: number;
  /** Number of rows in the day (24 for a normal day at 60 min; 23 or 25 on daylight-saving days). */
  rowCount: number;
}

/** Rows of a local timeline, as a structure of arrays (one entry per row). */
export interface Timeline {
  /** Number of rows. */
  readonly length: number;
  /** Row length [min]. */
  readonly stepMinutes: number;
  /** IANA time zone, as given in the request. */
  readonly timeZone: string;
  /** Evaluation instant of each row = midpoint of its interval [ms since 1970-01-01T00:00Z]. */
  readonly epochMs: Float64Array;
  /** Start of each row's interval [ms since 1970-01-01T00:00Z]. */
  readonly intervalStartMs: Float64Array;
  /** Local UTC offset at the evaluation instant [min], e.g. +60; fractional only for historical offsets with seconds. */
  readonly offsetMinutes: Float64Array;
  /**
   * Local clock time of the evaluation instant [h after 00:00 of the row's date]. Repeats
   * during a fall-back hour (1.5 twice), jumps over a spring-forward hour.
   */
  readonly localHour: Float64Array;
  /** Row → index in `days`. */
  readonly dayIndex: Uint32Array;
  readonly days: readonly TimelineDay[];
  /**
   * Evaluation instant of row i as ISO 8601 local time with offset, e.g.
   * "2026-03-29T01:30:00+01:00" ("+00:00" for a zero offset, never "Z"). Seconds are always
   * present, milliseconds only when nonzero; a historical offset with seconds prints as
   * ±HH:MM:SS (the form RFC 9557 / Temporal use).
   */
  iso(i: number): string;
}

const MS_PER_SECOND = 1000;
const MS_PER_MINUTE = 60_000;
const MS_PER_HOUR = 3_600_000;
const MS_PER_DAY = 86_400_000;
const MINUTES_PER_DAY = 1440;

/**
 * Longest accepted range [days]: three calendar years contain at most 1096 days (at most one
 * 29 February). The limit protects memory (1-minute rows over 1096 days are ~1.6 M rows).
 */
export const MAX_TIMELINE_DAYS = 1096;

/**
 * Largest |UTC offset| the day-start search allows for [ms]. tzdb offsets stay within about
 * −15:57 and +15:14 (historical local mean times; from memory); 16 h covers them.
 */
const MAX_ABS_OFFSET_MS = 16 * MS_PER_HOUR;

/** Days since 1970-01-01 of a proleptic Gregorian date (Hinnant, days_from_civil). */
function daysFromCivil(year: number, month: number, day: number): number {
  const y = month <= 2 ? year - 1 : year;
  const era = Math.floor(y / 400);
  const yoe = y - era * 400; // [0, 399]
  const doy = Math.floor((153 * (month + (month > 2 ? -3 : 9)) + 2) / 5) + day - 1; // [0, 365]
  const doe = yoe * 365 + Math.floor(yoe / 4) - Math.floor(yoe / 100) + doy; // [0, 146096]
  return era * 146_097 + doe - 719_468;
}

/** Proleptic Gregorian date of a day number (Hinnant, civil_from_days); writes [y, m, d] into out. */
function civilFromDays(days: number, out: Int32Array): void {
  const z = days + 719_468;
  const era = Math.floor(z / 146_097);
  const doe = z - era * 146_097; // [0, 146096]
  const yoe = Math.floor((doe - Math.floor(doe / 1460) + Math.floor(doe / 36_524) - Math.floor(doe / 146_096)) / 365);
  const doy = doe - (365 * yoe + Math.floor(yoe / 4) - Math.floor(yoe / 100)); // [0, 365]
  const mp = Math.floor((5 * doy + 2) / 153); // [0, 11], March = 0
  const d = doy - Math.floor((153 * mp + 2) / 5) + 1;
  const m = mp < 10 ? mp + 3 : mp - 9;
  out[0] = m <= 2 ? yoe + era * 400 + 1 : yoe + era * 400;
  out[1] = m;
  out[2] = d;
}

const isLeapYear = (y: number): boolean => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;
const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Parses a local date YYYY-MM-DD (years 0001–9999, real calendar dates only).
 * @returns day number since 1970-01-01
 * @throws RangeError naming the field
 */
function parseLocalDate(value: unknown, field: string): number {
  const m = typeof value === "string" ? DATE_RE.exec(value) : null;
  if (!m) throw new RangeError(`${field} must be a local date YYYY-MM-DD; got ${JSON.stringify(value)}`);
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  const monthDays = month === 2 && isLeapYear(year) ? 29 : (DAYS_IN_MONTH[month - 1] ?? 0);
  if (year < 1 || month < 1 || month > 12 || day < 1 || day > monthDays) {
    throw new RangeError(`${field} is not a calendar date: ${value}`);
  }
  return daysFromCivil(year, month, day);
}

const pad2 = (n: number): string => (n < 10 ? "0" : "") + n;
const pad3 = (n: number): string => (n < 10 ? "00" : n < 100 ? "0" : "") + n;
const pad4 = (n: number): string => (n < 10 ? "000" : n < 100 ? "00" : n < 1000 ? "0" : "") + n;

/**
 * UTC-offset reader for one zone, built on Intl. `format()` is used (≈3× faster than
 * `formatToParts()`); the order of its six numeric fields is learned once from
 * `formatToParts()`, so the parse does not depend on the locale's punctuation.
 */
function makeOffsetReader(timeZone: unknown): (utcMs: number) => number {
  if (typeof timeZone !== "string" || timeZone.length === 0) {
    throw new RangeError(`timeZone must be an IANA time zone name; got ${JSON.stringify(timeZone)}`);
  }
  let dtf: Intl.DateTimeFormat;
  try {
    dtf = new Intl.DateTimeFormat("en-US-u-ca-gregory-nu-latn", {
      timeZone,
      year: "numeric",
      month: "numeric",
      day: "numeric",
      hour: "numeric",
      minute: "numeric",
      second: "numeric",
      hourCycle: "h23",
    });
  } catch {
    throw new RangeError(`timeZone is not a known IANA time zone: ${JSON.stringify(timeZone)}`);
  }
  const order: number[] = []; // position in [y, mo, d, h, mi, s] of each numeric field, in print order
  const slot: Record<string, number> = { year: 0, month: 1, day: 2, hour: 3, minute: 4, second: 5 };
  for (const part of dtf.formatToParts(0)) {
    const k = slot[part.type];
    if (k !== undefined) order.push(k);
  }
  if (order.length !== 6) throw new Error(`unexpected Intl date layout for ${timeZone}`);
  const f = new Float64Array(6);
  return (utcMs: number): number => {
    const t = Math.floor(utcMs / MS_PER_SECOND) * MS_PER_SECOND; // Intl shows whole seconds
    const s = dtf.format(t);
    let field = 0;
    let acc = -1;
    for (let i = 0; i <= s.length; i++) {
      const c = i < s.length ? s.charCodeAt(i) - 48 : -1;
      if (c >= 0 && c <= 9) {
        acc = acc < 0 ? c : acc * 10 + c;
      } else if (acc >= 0) {
        const k = order[field++];
        if (k !== undefined) f[k] = acc;
        acc = -1;
      }
    }
    const hour = f[3]! === 24 ? 0 : f[3]!; // guard: some engines once printed midnight as 24 with hour12:false
    const wallMs = daysFromCivil(f[0]!, f[1]!, f[2]!) * MS_PER_DAY + hour * MS_PER_HOUR + f[4]! * MS_PER_MINUTE + f[5]! * MS_PER_SECOND;
    return wallMs - t;
  };
}

/**
 * First instant of (lo, hi] at which the offset is no longer `offLo`, by bisection on the
 * whole-second grid. Requires offsetAt(lo) = offLo ≠ offsetAt(hi) and lo, hi multiples of 1 s.
 */
function bisectTransition(offsetAt: (t: number) => number, lo: number, hi: number, offLo: number): number {
  while (hi - lo > MS_PER_SECOND) {
    const mid = lo + Math.floor((hi - lo) / (2 * MS_PER_SECOND)) * MS_PER_SECOND;
    if (offsetAt(mid) === offLo) lo = mid;
    else hi = mid;
  }
  return hi;
}

class LocalTimeline implements Timeline {
  constructor(
    readonly timeZone: string,
    readonly stepMinutes: number,
    readonly epochMs: Float64Array,
    readonly intervalStartMs: Float64Array,
    readonly offsetMinutes: Float64Array,
    readonly localHour: Float64Array,
    readonly dayIndex: Uint32Array,
    readonly days: readonly TimelineDay[],
  ) {}

  get length(): number {
    return this.epochMs.length;
  }

  iso(i: number): string {
    const t = this.epochMs[i];
    const offMin = this.offsetMinutes[i];
    if (!Number.isInteger(i) || t === undefined || offMin === undefined) {
      throw new RangeError(`row index must be an integer in [0, ${this.length}); got ${i}`);
    }
    const offMs = Math.round(offMin * MS_PER_MINUTE);
    const wall = t + offMs;
    const dayNo = Math.floor(wall / MS_PER_DAY);
    let ms = wall - dayNo * MS_PER_DAY;
    const ymd = new Int32Array(3);
    civilFromDays(dayNo, ymd);
    const hh = Math.floor(ms / MS_PER_HOUR);
    ms -= hh * MS_PER_HOUR;
    const mi = Math.floor(ms / MS_PER_MINUTE);
    ms -= mi * MS_PER_MINUTE;
    const ss = Math.floor(ms / MS_PER_SECOND);
    ms -= ss * MS_PER_SECOND;
    const absOff = Math.abs(offMs);
    const oh = Math.floor(absOff / MS_PER_HOUR);
    const om = Math.floor((absOff % MS_PER_HOUR) / MS_PER_MINUTE);
    const os = Math.floor((absOff % MS_PER_MINUTE) / MS_PER_SECOND);
    return (
      `${pad4(ymd[0]!)}-${pad2(ymd[1]!)}-${pad2(ymd[2]!)}T${pad2(hh)}:${pad2(mi)}:${pad2(ss)}` +
      (ms !== 0 ? `.${pad3(ms)}` : "") +
      `${offMs < 0 ? "-" : "+"}${pad2(oh)}:${pad2(om)}` +
      (os !== 0 ? `:${pad2(os)}` : "")
    );
  }
}

/**
 * Builds the rows of a local-time calculation over whole local dates (see the module comment
 * for the definitions and the method).
 * @param spec time zone, first and last local date (inclusive), row length [min]
 * @returns the timeline (typed arrays, one entry per row)
 * @throws RangeError naming the field: unknown timeZone; from/to not a real YYYY-MM-DD date;
 *   from after to; more than 1096 days; stepMinutes not an integer dividing 1440; a day whose
 *   length is not a whole number of steps (stepMinutes)
 */
export function localTimeline(spec: TimelineSpec): Timeline {
  const { timeZone, stepMinutes } = spec;
  const offsetAt = makeOffsetReader(timeZone);
  const firstDay = parseLocalDate(spec.from, "from");
  const lastDay = parseLocalDate(spec.to, "to");
  if (
    typeof stepMinutes !== "number" ||
    !Number.isInteger(stepMinutes) ||
    stepMinutes < 1 ||
    stepMinutes > MINUTES_PER_DAY ||
    MINUTES_PER_DAY % stepMinutes !== 0
  ) {
    throw new RangeError(`stepMinutes must be an integer that divides 1440 (e.g. 5, 10, 15, 30, 60); got ${stepMinutes}`);
  }
  if (lastDay < firstDay) throw new RangeError(`from (${spec.from}) must not be after to (${spec.to})`);
  const dayCount = lastDay - firstDay + 1;
  if (dayCount > MAX_TIMELINE_DAYS) {
    throw new RangeError(`to: the range ${spec.from}..${spec.to} has ${dayCount} days; at most ${MAX_TIMELINE_DAYS} (3 years)`);
  }
  const stepMs = stepMinutes * MS_PER_MINUTE;

  // 1. Offset as a piecewise-constant function of UTC time: segment j covers
  //    [segStart[j], segStart[j+1]) with offset segOff[j] (wall = utc + offset).
  const wallFirst = firstDay * MS_PER_DAY; // wall-clock 00:00 of `from`, as if UTC
  const wallEnd = (lastDay + 1) * MS_PER_DAY; // wall-clock 00:00 after `to`
  const segStart: number[] = [-Infinity];
  const segOff: number[] = [];
  let sPrev = wallFirst - MAX_ABS_OFFSET_MS;
  let offPrev = offsetAt(sPrev);
  segOff.push(offPrev);
  for (let s = sPrev + MS_PER_DAY; sPrev < wallEnd + MAX_ABS_OFFSET_MS; s += MS_PER_DAY) {
    const off = offsetAt(s);
    // several transitions inside one sample interval are found one after another
    let lo = sPrev;
    while (off !== offPrev) {
      const tr = bisectTransition(offsetAt, lo, s, offPrev);
      const offTr = offsetAt(tr);
      if (offTr === offPrev || tr <= lo) throw new Error(`inconsistent UTC offsets from Intl for ${timeZone}`);
      offPrev = offTr;
      segStart.push(tr);
      segOff.push(offPrev);
      lo = tr;
    }
    sPrev = s;
  }
  segStart.push(Infinity);

  // 2. Start of each day k = 0..dayCount (the last one closes the range): the first instant t
  //    with t + offset(t) ≥ wall midnight. Within segment j the wall clock runs over
  //    [segStart[j] + segOff[j], segStart[j+1] + segOff[j]).
  const dayStart = new Float64Array(dayCount + 1);
  let j = 0;
  for (let k = 0; k <= dayCount; k++) {
    const wallMidnight = wallFirst + k * MS_PER_DAY;
    while ((segStart[j + 1] as number) + (segOff[j] as number) <= wallMidnight) j++;
    dayStart[k] = Math.max(segStart[j] as number, wallMidnight - (segOff[j] as number));
  }

  // 3. Days and row counts.
  const days: TimelineDay[] = [];
  const ymd = new Int32Array(3);
  let rowTotal = 0;
  for (let k = 0; k < dayCount; k++) {
    const lengthMs = (dayStart[k + 1] as number) - (dayStart[k] as number);
    civilFromDays(firstDay + k, ymd);
    const year = ymd[0]!;
    const month = ymd[1]!;
    const dom = ymd[2]!;
    const date = `${pad4(year)}-${pad2(month)}-${pad2(dom)}`;
    if (lengthMs % stepMs !== 0) {
      throw new RangeError(
        `stepMinutes: ${date} in ${timeZone} lasts ${lengthMs / MS_PER_MINUTE} min, not a whole number of ${stepMinutes}-minute steps`,
      );
    }
    const rowCount = lengthMs / stepMs;
    days.push(
      Object.freeze({
        date,
        year,
        month,
        dayOfYear: firstDay + k - daysFromCivil(year, 1, 1) + 1,
        firstRow: rowTotal,
        rowCount,
      }),
    );
    rowTotal += rowCount;
  }

  // 4. Rows: absolute-time arithmetic only.
  const epochMs = new Float64Array(rowTotal);
  const intervalStartMs = new Float64Array(rowTotal);
  const offsetMinutes = new Float64Array(rowTotal);
  const localHour = new Float64Array(rowTotal);
  const dayIndex = new Uint32Array(rowTotal);
  const halfStepMs = stepMs / 2;
  j = 0;
  let i = 0;
  for (let k = 0; k < dayCount; k++) {
    const start = dayStart[k] as number;
    const wallMidnight = wallFirst + k * MS_PER_DAY;
    const n = (days[k] as TimelineDay).rowCount;
    for (let r = 0; r < n; r++, i++) {
      const t0 = start + r * stepMs;
      const mid = t0 + halfStepMs;
      while ((segStart[j + 1] as number) <= mid) j++;
      const off = segOff[j] as number;
      intervalStartMs[i] = t0;
      epochMs[i] = mid;
      offsetMinutes[i] = off / MS_PER_MINUTE;
      localHour[i] = (mid + off - wallMidnight) / MS_PER_HOUR;
      dayIndex[i] = k;
    }
  }
  return new LocalTimeline(timeZone, stepMinutes, epochMs, intervalStartMs, offsetMinutes, localHour, dayIndex, Object.freeze(days));
}
