/**
 * How many rows (surfaces × time steps) a schedule request asks for, counted before any work is done,
 * for the work limit (MAX_SCHEDULE_ROWS).
 */
import type { ScheduleRequest } from "@/lib/contracts/schedule";
import { localTimeline } from "@/lib/time/local-timeline";

const MS_PER_DAY = 86_400_000;
/** Largest change of a zone's UTC offset across any span of dates [min] (tzdb: a day skipped or repeated at the date line). */
const MAX_OFFSET_CHANGE_MIN = 26 * 60;

/**
 * Rows of the response for the work limit: near `limit` the exact count, surfaces × the rows of the local
 * timeline (23 or 25 hourly rows on daylight-saving days; a whole leap year of hours is 8,784 rows
 * wherever the clocks change), found by building the timeline (about `limit` rows at most); far from it
 * the nominal count, days × steps per day, which cannot be on the other side of the limit. Throws the
 * timeline's RangeError where the calculation would.
 */
export function scheduleRowCount(req: Pick<ScheduleRequest, "site" | "from" | "to" | "stepMinutes" | "surfaces">, limit: number): number {
  const days = (Date.parse(`${req.to}T00:00:00Z`) - Date.parse(`${req.from}T00:00:00Z`)) / MS_PER_DAY + 1;
  const surfaces = req.surfaces.length;
  const nominal = days * (1440 / req.stepMinutes);
  const slack = Math.ceil(MAX_OFFSET_CHANGE_MIN / req.stepMinutes);
  if ((nominal - slack) * surfaces > limit || (nominal + slack) * surfaces <= limit) return nominal * surfaces;
  const timeline = localTimeline({ timeZone: req.site.timeZone, from: req.from, to: req.to, stepMinutes: req.stepMinutes });
  return timeline.length * surfaces;
}
