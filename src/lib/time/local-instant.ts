/**
 * Wall-clock times in an IANA zone turned into instants, and instants into the zone's wall clock. A wall time
 * can name no instant (the hour skipped when clocks go forward), one, or two (the hour repeated when clocks go
 * back); callers decide what to do with the last two.
 *
 * Pure: `Intl.DateTimeFormat` only (the zone database shipped with the runtime).
 */

export interface WallTime {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

export interface ZoneClock {
  /** The zone's offset from UTC at an instant, in minutes (east positive). */
  offsetMinutesAt(utcMs: number): number;
  /** The wall clock of an instant in the zone. */
  wallTimeAt(utcMs: number): WallTime;
  /** Every instant whose wall clock in the zone reads `w`: none (a skipped time), one, or two (a repeated time). */
  instantsOf(w: WallTime): number[];
}

const MS_PER_MINUTE = 60_000;
const clocks = new Map<string, ZoneClock>();

/** The clock of a zone (cached); throws RangeError for a name Intl does not know. */
export function zoneClock(timeZone: string): ZoneClock {
  const known = clocks.get(timeZone);
  if (known) return known;
  const dtf = new Intl.DateTimeFormat("en-US-u-ca-gregory-nu-latn", {
    timeZone,
    hourCycle: "h23",
    year: "numeric",
    month: "2-digit",
    day: "2-digit",
    hour: "2-digit",
    minute: "2-digit",
    second: "2-digit",
  });
  const wallTimeAt = (utcMs: number): WallTime => {
    const parts: Record<string, number> = {};
    for (const p of dtf.formatToParts(new Date(Math.floor(utcMs / 1000) * 1000))) if (p.type !== "literal") parts[p.type] = Number(p.value);
    return { year: parts.year!, month: parts.month!, day: parts.day!, hour: parts.hour! % 24, minute: parts.minute!, second: parts.second! };
  };
  const asUtc = (w: WallTime) => Date.UTC(w.year, w.month - 1, w.day, w.hour, w.minute, w.second);
  const offsetMinutesAt = (utcMs: number) => Math.round((asUtc(wallTimeAt(utcMs)) - Math.floor(utcMs / 1000) * 1000) / MS_PER_MINUTE);
  const clock: ZoneClock = {
    offsetMinutesAt,
    wallTimeAt,
    instantsOf(w) {
      const wall = asUtc(w);
      // Offsets in force a day either side cover any transition near this wall time.
      const offsets = new Set([offsetMinutesAt(wall - 86_400_000), offsetMinutesAt(wall), offsetMinutesAt(wall + 86_400_000)]);
      const found = new Set<number>();
      for (const o of offsets) {
        const t = wall - o * MS_PER_MINUTE;
        if (offsetMinutesAt(t) === o) found.add(t);
      }
      return [...found].sort((a, b) => a - b);
    },
  };
  clocks.set(timeZone, clock);
  return clock;
}
