// The worker pool of the heavy calculations: the same bytes as on the main thread, the same error
// mapping (the engine's RangeError → 400 naming the field, anything else → 500), a bounded queue
// (503 with Retry-After when full) and a worker that runs from the TypeScript sources under Vitest.
import { afterAll, describe, expect, it } from "vitest";
import { GlazingRequest, type GlazingRequestInput } from "@/lib/contracts/glazing";
import { ScheduleRequest, type ScheduleRequestInput } from "@/lib/contracts/schedule";
import { calculateGlazing } from "@/lib/calc/glazing";
import { scheduleResponse } from "@/lib/calc/schedule-response";
import { CalcPool, calcResponseWith, calcWorkerFile } from "@/lib/server/calc-pool";
import { json, withProblems } from "@/lib/server/http";

const clear = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const coated = {
  kind: "pane",
  thicknessMm: 6,
  emissivityBack: 0.03,
  measured: {
    solarTransmittance: 0.55,
    solarReflectanceFront: 0.22,
    solarReflectanceBack: 0.27,
    visibleTransmittance: 0.8,
    visibleReflectanceFront: 0.05,
    visibleReflectanceBack: 0.05,
  },
} as const;
const gap = { kind: "gap", widthMm: 16, gas: "argon" } as const;
const lisbon = { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" };

const glazings: GlazingRequestInput[] = [
  { layers: [clear, gap, clear] },
  { layers: [coated, gap, clear, { ...gap, gas: "krypton" }, clear], anglesDeg: [0, 15, 30, 45, 60, 75, 89.5] },
];
const schedules: ScheduleRequestInput[] = [
  {
    site: lisbon,
    from: "2026-03-27",
    to: "2026-03-30", // a spring-forward day inside
    surfaces: [
      {
        name: "South",
        azimuthDeg: 180,
        tiltDeg: 90,
        layers: [clear, gap, clear],
        shading: { window: { widthM: 1.2, heightM: 1.5 }, overhang: { depthM: 0.6, gapAboveM: 0.2 } },
      },
      { name: "Roof", azimuthDeg: 0, tiltDeg: 10, layers: [coated, gap, clear], glazedAreaM2: 3 },
    ],
    sky: { model: "hay-davies", albedo: 0.3 },
  },
  {
    site: { ...lisbon, elevationM: 80 },
    from: "2026-07-01",
    to: "2026-07-01",
    stepMinutes: 30,
    surfaces: [{ name: "West", azimuthDeg: 270, tiltDeg: 90, layers: [clear] }],
    weather: Array.from({ length: 24 }, (_, h) => ({
      time: `2026-07-01T${String(h).padStart(2, "0")}:30:00+01:00`,
      ghi: 40 * h,
      dni: 30 * h,
      dhi: 10 * h,
    })),
  },
];

const pool = new CalcPool({ workers: 1, queueLimit: 4, workerFile: calcWorkerFile() });
afterAll(() => pool.close());

const bytesOf = async (res: Response) => new Uint8Array(await res.arrayBuffer());
const headersOf = (res: Response) => Object.fromEntries(res.headers.entries());

describe("calculation pool", () => {
  it("runs the worker from the sources here (the build ships its own bundled file)", () => {
    expect(calcWorkerFile().pathname).toMatch(/src\/lib\/server\/calc-pool\/worker\.dev\.mjs$/);
  });

  it("answers glazing requests with the very bytes and headers json(…) sends from the main thread", async () => {
    for (const input of glazings) {
      const req = GlazingRequest.parse(input);
      const reference = json(calculateGlazing(req));
      const pooled = await calcResponseWith(pool, "glazing", req);
      expect(pooled.status).toBe(200);
      expect(headersOf(pooled)).toEqual(headersOf(reference));
      expect(await bytesOf(pooled)).toEqual(await bytesOf(reference));
      expect(await bytesOf(await calcResponseWith(null, "glazing", req))).toEqual(await bytesOf(json(calculateGlazing(req))));
    }
  });

  it("answers schedule requests (shading, daylight saving, weather, areas) with the same bytes as on the main thread", async () => {
    for (const input of schedules) {
      const req = ScheduleRequest.parse(input);
      const reference = json(scheduleResponse(req));
      const pooled = await calcResponseWith(pool, "schedule", req);
      expect(pooled.status).toBe(200);
      expect(headersOf(pooled)).toEqual(headersOf(reference));
      const a = await bytesOf(pooled);
      expect(a.byteLength).toBeGreaterThan(1000);
      expect(a).toEqual(await bytesOf(reference));
    }
  });

  it("keeps the engine's RangeError a RangeError: 400 naming the field, same body as on the main thread", async () => {
    // Lord Howe Island moves its clocks by 30 min: that day is not a whole number of hourly steps.
    const req = ScheduleRequest.parse({
      site: { latitudeDeg: -31.55, longitudeDeg: 159.08, timeZone: "Australia/Lord_Howe" },
      from: "2026-10-04",
      to: "2026-10-04",
      surfaces: [{ name: "N", azimuthDeg: 0, tiltDeg: 90, layers: [clear] }],
    });
    expect(() => scheduleResponse(req)).toThrow(RangeError);
    const route = (p: CalcPool | null) => withProblems(() => calcResponseWith(p, "schedule", req), "(body)");
    const ctx = {
      request: new Request("http://127.0.0.1/api/v1/calc/schedule", { method: "POST" }),
      url: new URL("http://127.0.0.1/api/v1/calc/schedule"),
    } as never;
    const pooled = await route(pool)(ctx);
    const inProcess = await route(null)(ctx);
    expect(pooled.status).toBe(400);
    const body = await pooled.json();
    expect(body.errors[0].field).toBe("(body)");
    expect(body.errors[0].message).toMatch(/step/);
    expect(body).toEqual(await inProcess.json());
  });

  it("answers 500 without internals for any other failure in the worker, and the worker keeps serving", async () => {
    const broken = { layers: null } as unknown as GlazingRequest; // never passes validation; makes the engine throw a TypeError
    await expect(pool.run("glazing", broken)).rejects.not.toBeInstanceOf(RangeError);
    const err = console.error;
    console.error = () => {};
    try {
      const res = await withProblems(
        () => calcResponseWith(pool, "glazing", broken),
        "layers",
      )({
        request: new Request("http://127.0.0.1/api/v1/calc/glazing", { method: "POST" }),
        url: new URL("http://127.0.0.1/api/v1/calc/glazing"),
      } as never);
      expect(res.status).toBe(500);
      expect(JSON.stringify(await res.json())).not.toMatch(/filter|TypeError/);
    } finally {
      console.error = err;
    }
    expect((await calcResponseWith(pool, "glazing", GlazingRequest.parse(glazings[0]))).status).toBe(200);
  });

  it("refuses with 503 problem+json and Retry-After when every worker is busy and the queue is full, and serves the rest", async () => {
    const small = new CalcPool({ workers: 1, queueLimit: 2, workerFile: calcWorkerFile() });
    try {
      const req = ScheduleRequest.parse({ ...schedules[0], from: "2026-01-01", to: "2026-03-31" });
      const answers = await Promise.all(Array.from({ length: 5 }, () => calcResponseWith(small, "schedule", req)));
      expect(answers.map((r) => r.status)).toEqual([200, 200, 200, 503, 503]);
      const refused = answers[3]!;
      expect(refused.headers.get("content-type")).toContain("application/problem+json");
      expect(Number(refused.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
      expect((await refused.json()).status).toBe(503);
      expect(small.queued).toBe(0);
      expect((await calcResponseWith(small, "schedule", req)).status).toBe(200);
    } finally {
      await small.close();
    }
  });

  it("replaces a worker that dies and fails only the call it was running", async () => {
    const own = new CalcPool({ workers: 1, queueLimit: 2, workerFile: new URL("./fixtures/exiting-worker.mjs", import.meta.url) });
    try {
      await expect(own.run("glazing", GlazingRequest.parse(glazings[0]))).rejects.toThrow(/exit code 3/);
      await expect(own.run("glazing", GlazingRequest.parse(glazings[0]))).rejects.toThrow(/exit code 3/);
      expect(own.size).toBe(1);
      expect(own.running).toBe(0);
    } finally {
      await own.close();
    }
  });

  it("fails calls with a 500-type error, without restarting endlessly, when the worker file cannot start", async () => {
    const err = console.error;
    console.error = () => {};
    const none = new CalcPool({ workers: 2, queueLimit: 2, workerFile: new URL("./fixtures/no-such-worker.mjs", import.meta.url) });
    try {
      const req = GlazingRequest.parse(glazings[0]);
      const first = await Promise.allSettled([none.run("glazing", req), none.run("glazing", req), none.run("glazing", req)]);
      expect(first.map((r) => r.status)).toEqual(["rejected", "rejected", "rejected"]);
      for (const r of first) expect((r as PromiseRejectedResult).reason).not.toBeInstanceOf(RangeError);
      expect(none.size).toBe(0);
      await expect(none.run("glazing", req)).rejects.toThrow(/no calculation worker could start/);
    } finally {
      console.error = err;
      await none.close();
    }
  });
});
