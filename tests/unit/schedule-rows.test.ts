// The row count behind the schedule work limit: exact near the limit (daylight-saving days have 23 or
// 25 hourly rows), so that the limit means what README says.
import { describe, expect, it } from "vitest";
import { ScheduleRequest } from "@/lib/contracts/schedule";
import { scheduleRowCount } from "@/lib/calc/schedule-rows";
import { scheduleResponse } from "@/lib/calc/schedule-response";

const surface = (k: number) => ({
  name: `S${k}`,
  azimuthDeg: 180,
  tiltDeg: 90,
  layers: [{ kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 }],
});
const req = (timeZone: string, from: string, to: string, n: number, stepMinutes = 60) =>
  ScheduleRequest.parse({
    site: { latitudeDeg: 38.7, longitudeDeg: -9.17, timeZone },
    from,
    to,
    stepMinutes,
    surfaces: Array.from({ length: n }, (_, k) => surface(k)),
  });

describe("scheduleRowCount", () => {
  it("counts a whole leap year as 8,784 hourly rows per surface, with or without daylight saving", () => {
    expect(scheduleRowCount(req("Europe/Lisbon", "2028-01-01", "2028-12-31", 6), 6 * 8784)).toBe(6 * 8784);
    expect(scheduleRowCount(req("UTC", "2028-01-01", "2028-12-31", 6), 6 * 8784)).toBe(6 * 8784);
    expect(scheduleRowCount(req("Europe/Lisbon", "2028-01-01", "2028-12-31", 7), 6 * 8784)).toBe(7 * 8784);
  });

  it("counts the rows a response really has on daylight-saving days when the limit is close", () => {
    const fallBack = req("Europe/Lisbon", "2026-10-25", "2026-10-25", 1, 30);
    const springForward = req("Europe/Lisbon", "2026-03-29", "2026-03-29", 2, 15);
    expect(scheduleRowCount(fallBack, 50)).toBe(50);
    expect(scheduleRowCount(fallBack, 50)).toBe(scheduleResponse(fallBack).rowsPerSurface);
    expect(scheduleRowCount(springForward, 2 * 96)).toBe(2 * 92);
  });

  it("answers the nominal count far from the limit without building the timeline", () => {
    expect(scheduleRowCount(req("Europe/Lisbon", "2026-01-01", "2026-12-31", 24, 1), 6 * 8784)).toBe(24 * 365 * 1440);
    expect(scheduleRowCount(req("Europe/Lisbon", "2026-06-01", "2026-06-07", 2), 6 * 8784)).toBe(2 * 7 * 24);
  });
});
