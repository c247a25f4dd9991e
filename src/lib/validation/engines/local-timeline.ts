/**
 * The engine's values of the quantities a local-timeline case names (src/lib/time/local-timeline.ts): row
 * counts, offsets, local hours and days, and the listed rows' local times and instants as texts.
 */
import { localTimeline } from "@/lib/time/local-timeline";
import type { LocalTimelineCase, LocalTimelineInput } from "@/lib/reference-cases/local-timeline";
import type { Evaluation } from "../types";

/** Day of month of the n-th (1-based) Sunday of a month, or of the last one for n = −1 (JavaScript's Date). */
export function nthSunday(year: number, month1: number, n: number): number {
  const sundays: number[] = [];
  for (let d = 1; d <= 31; d++) {
    const t = new Date(Date.UTC(year, month1 - 1, d));
    if (t.getUTCMonth() === month1 - 1 && t.getUTCDay() === 0) sundays.push(d);
  }
  return (n > 0 ? sundays[n - 1] : sundays[sundays.length - 1])!;
}
/** First Sunday on or after a given day of a month (JavaScript's Date). */
export function sundayOnOrAfter(year: number, month1: number, day: number): number {
  for (let d = day; ; d++) if (new Date(Date.UTC(year, month1 - 1, d)).getUTCDay() === 0) return d;
}

/** The rule day of a case (the change's Sunday) from the calendar, or null when the case names none. */
export function ruleDayOf(input: LocalTimelineInput): number | null {
  const r = input.ruleDay;
  if (!r) return null;
  return "nthSunday" in r ? nthSunday(r.year, r.month, r.nthSunday) : sundayOnOrAfter(r.year, r.month, r.sundayOnOrAfter);
}

/** The engine's instant of a row as ISO UTC; a row the engine did not make never reads like an expected instant. */
const utc = (ms: number | undefined): string =>
  ms === undefined || !Number.isFinite(ms) ? "(no such row in the engine's timeline)" : new Date(ms).toISOString();

/** An expected instant as ISO UTC; a case whose instant does not parse is a mistake in the case, said loudly. */
const expectedUtc = (caseId: string, t: string): string => {
  const ms = Date.parse(t);
  if (!Number.isFinite(ms)) throw new Error(`reference case ${caseId}: "${t}" is not an instant`);
  return new Date(ms).toISOString();
};

/** A case's listed rows as texts: `iso[i]` local time with offset, `intervalStartUtc[i]`, `epochUtc[i]` (ISO UTC). */
export function expectedTimelineTexts(c: LocalTimelineCase): Record<string, string> {
  return {
    ...Object.fromEntries(Object.entries(c.expectedIso ?? {}).map(([row, iso]) => [`iso[${row}]`, iso])),
    ...Object.fromEntries(Object.entries(c.expectedIntervalStartUtc ?? {}).map(([row, t]) => [`intervalStartUtc[${row}]`, expectedUtc(c.id, t)])),
    ...Object.fromEntries(Object.entries(c.expectedEpochUtc ?? {}).map(([row, t]) => [`epochUtc[${row}]`, expectedUtc(c.id, t)])),
  };
}

export function evaluateLocalTimeline(c: LocalTimelineCase): Evaluation {
  const { ruleDay: _ruleDay, ...spec } = c.input;
  const tl = localTimeline(spec);
  const values: Record<string, number> = { rows: tl.length };
  // Not an engine value: the Sunday the zone's rule names, from the calendar (JavaScript's Date), which checks that the
  // case's dates are the change day the rule gives; the engine's own values of that day are the row counts and offsets.
  const ruleDay = ruleDayOf(c.input);
  if (ruleDay !== null) values.ruleDayOfMonth = ruleDay;
  for (let i = 0; i < tl.length; i++) {
    values[`offsetMinutes[${i}]`] = tl.offsetMinutes[i]!;
    values[`localHour[${i}]`] = tl.localHour[i]!;
  }
  tl.days.forEach((d, k) => {
    values[`dayRowCount[${k}]`] = d.rowCount;
    values[`dayFirstRow[${k}]`] = d.firstRow;
  });
  const texts: Record<string, string> = {};
  const inRange = (row: number) => Number.isInteger(row) && row >= 0 && row < tl.length;
  for (const row of Object.keys(c.expectedIso ?? {}).map(Number))
    texts[`iso[${row}]`] = inRange(row) ? tl.iso(row) : "(no such row in the engine's timeline)";
  for (const row of Object.keys(c.expectedIntervalStartUtc ?? {}).map(Number))
    texts[`intervalStartUtc[${row}]`] = utc(inRange(row) ? tl.intervalStartMs[row] : undefined);
  for (const row of Object.keys(c.expectedEpochUtc ?? {}).map(Number)) texts[`epochUtc[${row}]`] = utc(inRange(row) ? tl.epochMs[row] : undefined);
  return { values, texts };
}
