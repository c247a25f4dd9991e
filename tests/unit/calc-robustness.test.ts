// Bad or unusual input never crashes the calculations: anything the request schemas accept either computes
// finite numbers or raises a RangeError (which the endpoints answer as 400). Property-based (fast-check).
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { ScheduleRequest } from "@/lib/contracts/schedule";
import { calculateGlazing } from "@/lib/calc/glazing";
import { scheduleResponse } from "@/lib/calc/schedule-response";

const physical = fc.record({
  kind: fc.constant("pane"),
  thicknessMm: fc.double({ min: 0.5, max: 60, noNaN: true }),
  refractiveIndex: fc.double({ min: 1.0001, max: 4, noNaN: true }),
  absorptionPerMm: fc.double({ min: 0, max: 20, noNaN: true }),
  emissivityFront: fc.option(fc.double({ min: 0.01, max: 1, noNaN: true }), { nil: undefined }),
});
const measured = fc
  .record({
    t: fc.double({ min: 0.001, max: 1, noNaN: true }),
    rf: fc.double({ min: 0, max: 1, noNaN: true }),
    rb: fc.double({ min: 0, max: 1, noNaN: true }),
    d: fc.double({ min: 0.5, max: 60, noNaN: true }),
  })
  .map(({ t, rf, rb, d }) => ({
    kind: "pane",
    thicknessMm: d,
    measured: { solarTransmittance: t, solarReflectanceFront: rf * (1 - t), solarReflectanceBack: rb * (1 - t) },
  }));
const gap = fc.record({
  kind: fc.constant("gap"),
  widthMm: fc.double({ min: 1, max: 100, noNaN: true }),
  gas: fc.oneof(
    fc.constantFrom("air", "argon", "krypton"),
    fc.double({ min: 0, max: 1, noNaN: true }).map((f) => ({ argon: f, air: 1 - f })),
  ),
});
const layers = fc
  .array(fc.tuple(fc.oneof(physical, measured), gap), { minLength: 0, maxLength: 5 })
  .chain((pairs) => fc.oneof(physical, measured).map((last) => [...pairs.flat(), last]));

/** Every number in a result must be finite (NaN would silently become null in JSON). */
function firstNonFinite(x: unknown, path = "$"): string | null {
  if (typeof x === "number") return Number.isFinite(x) ? null : `${path} = ${x}`;
  if (Array.isArray(x)) {
    for (let i = 0; i < x.length; i++) {
      const bad = firstNonFinite(x[i], `${path}[${i}]`);
      if (bad) return bad;
    }
  } else if (x && typeof x === "object") {
    for (const [k, v] of Object.entries(x)) {
      const bad = firstNonFinite(v, `${path}.${k}`);
      if (bad) return bad;
    }
  }
  return null;
}

function computesOrRefuses(f: () => unknown): void {
  let out: unknown;
  try {
    out = f();
  } catch (e) {
    expect(e).toBeInstanceOf(RangeError);
    return;
  }
  expect(firstNonFinite(out)).toBeNull();
}

describe("robustness", () => {
  it("any valid make-up: finite results or a RangeError", () => {
    fc.assert(
      fc.property(layers, fc.array(fc.double({ min: 0, max: 90, noNaN: true }), { minLength: 1, maxLength: 5 }), (l, anglesDeg) => {
        const req = GlazingRequest.safeParse({ layers: l, anglesDeg });
        if (!req.success) return;
        computesOrRefuses(() => calculateGlazing(req.data));
      }),
      { numRuns: 150 },
    );
  });

  it("any valid site, surface and day: finite results or a RangeError", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }),
        fc.double({ min: -180, max: 180, noNaN: true }),
        fc.constantFrom("Europe/Lisbon", "Australia/Sydney", "Asia/Kathmandu", "America/Santiago", "UTC", "Pacific/Chatham", "America/St_Johns"),
        fc.date({ min: new Date("1950-01-01"), max: new Date("2099-12-31"), noInvalidDate: true }),
        fc.double({ min: 0, max: 360, noNaN: true }),
        fc.double({ min: 0, max: 180, noNaN: true }),
        fc.constantFrom(10, 15, 30, 60, 120),
        fc.constantFrom("perez", "hay-davies", "isotropic"),
        fc.option(fc.record({ depthM: fc.double({ min: 0, max: 5, noNaN: true }), gapAboveM: fc.double({ min: 0, max: 2, noNaN: true }) }), {
          nil: undefined,
        }),
        (lat, lon, timeZone, date, az, tilt, stepMinutes, model, overhang) => {
          const day = date.toISOString().slice(0, 10);
          const req = ScheduleRequest.safeParse({
            site: { latitudeDeg: lat, longitudeDeg: lon, timeZone, elevationM: 100 },
            from: day,
            to: day,
            stepMinutes,
            sky: { model },
            surfaces: [
              {
                name: "s",
                azimuthDeg: az,
                tiltDeg: tilt,
                layers: [{ kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 }],
                shading: overhang ? { window: { widthM: 1, heightM: 1.5 }, overhang, fins: { depthM: 0.2, gapM: 0 }, horizonDeg: 5 } : undefined,
              },
            ],
          });
          if (!req.success) return;
          computesOrRefuses(() => {
            const res = scheduleResponse(req.data);
            for (const r of res.surfaces[0]!.rows) {
              expect(r.transmittedWm2).toBeGreaterThanOrEqual(0);
              expect(r.sunlitFraction).toBeLessThanOrEqual(1);
            }
            return res;
          });
        },
      ),
      { numRuns: 120 },
    );
  });
});
