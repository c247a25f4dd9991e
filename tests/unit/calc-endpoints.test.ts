// The calculation endpoints as the server runs them: the work limit README states (a whole leap year of
// hours for six surfaces), and the main thread staying free while the largest schedule computes.
import { describe, expect, it } from "vitest";
import { MAX_SCHEDULE_ROWS, ScheduleRequest, type ScheduleRequestInput } from "@/lib/contracts/schedule";
import { POST as schedule } from "@/pages/api/v1/calc/schedule";
import { POST as glazing } from "@/pages/api/v1/calc/glazing";

const pane = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const unit = [pane, { kind: "gap", widthMm: 16, gas: "air" }, pane];
const surfaces = (n: number) => Array.from({ length: n }, (_, k) => ({ name: `S${k + 1}`, azimuthDeg: (k * 60) % 360, tiltDeg: 90, layers: unit }));
// 2028 is a leap year; Lisbon changes its clocks twice in it.
const leapYear = (n: number): ScheduleRequestInput => ({
  site: { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" },
  from: "2028-01-01",
  to: "2028-12-31",
  surfaces: surfaces(n),
});

const user = { id: "u1", email: "u1@test.example", name: "U One" };
const call = (route: typeof schedule, body: unknown, path: string) => {
  const request = new Request(`http://127.0.0.1${path}`, {
    method: "POST",
    body: JSON.stringify(body),
    headers: { "content-type": "application/json" },
  });
  return route({ request, url: new URL(request.url), params: {}, locals: { user } } as never) as Promise<Response>;
};

describe("schedule work limit", () => {
  it("is exactly six surfaces for a whole leap year of hours (8,784 rows each)", () => {
    expect(MAX_SCHEDULE_ROWS).toBe(6 * 8784);
    expect(ScheduleRequest.safeParse(leapYear(6)).success).toBe(true);
  });

  it("refuses one surface more with 413 naming surfaces and the exact row count", async () => {
    const res = await call(schedule, leapYear(7), "/api/v1/calc/schedule");
    expect(res.status).toBe(413);
    const body = await res.json();
    expect(body.errors[0].field).toBe("surfaces");
    expect(body.detail).toContain("61,488");
    expect(body.detail).toContain("52,704");
  });

  it("computes the six-surface leap year, and the main thread keeps running timers meanwhile", async () => {
    let ticks = 0;
    let done = false;
    const tick = () => {
      ticks++;
      if (!done) setTimeout(tick, 1);
    };
    setTimeout(tick, 1);
    const res = await call(schedule, leapYear(6), "/api/v1/calc/schedule");
    done = true;
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.rowsPerSurface).toBe(8784);
    expect(body.surfaces).toHaveLength(6);
    expect(body.surfaces.map((s: { rows: unknown[] }) => s.rows.length)).toEqual(Array(6).fill(8784));
    // Computing 52,704 rows and about 15 MB of JSON takes far longer than a few 1 ms timers; on the
    // main thread not one of them could run until it was over.
    expect(ticks).toBeGreaterThanOrEqual(20);
  });

  it("answers glazing through the same path (200, JSON)", async () => {
    const res = await call(glazing, { layers: unit }, "/api/v1/calc/glazing");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/json; charset=utf-8");
    expect((await res.json()).uValue).toBeGreaterThan(2);
  });
});
