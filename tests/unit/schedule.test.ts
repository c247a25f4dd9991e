// The hourly schedule engine. Check values: the reference cases of src/lib/reference-cases/irradiance.ts
// ("transposition/example/…") and src/lib/reference-cases/shading.ts ("shading/example/…"), computed from the
// published formulas (Duffie & Beckman ch. 1 incidence; overhang/fin geometry, ASHRAE Handbook—Fundamentals,
// fenestration chapter; Ineichen & Perez 2002, Spencer 1971, Kasten & Young 1989, Liu & Jordan 1960,
// Hay & Davies 1980, Perez et al. 1990 transposition) by scripts/reference/irradiance.ts and
// scripts/reference/shading.ts; the glazing's hemispherical value is the check value of
// tests/reference/hemispherical.test.ts. Internal consistency checks are labelled as such.
import { describe, expect, it } from "vitest";
import { ScheduleRequest, type ScheduleRequestInput } from "@/lib/contracts/schedule";
import { GlazingRequest } from "@/lib/contracts/glazing";
import { allocateColumns, computeSurfaceSeries, prepareGlazingTables, prepareSurface, type SiteSeries } from "@/lib/calc/schedule";
import { scheduleResponse } from "@/lib/calc/schedule-response";
import { calculateGlazing } from "@/lib/calc/glazing";
import {
  emptyPerez1990SkyCoefficients,
  emptyHayDavies1980SkyCoefficients,
  skyCoefficientsPerez1990,
  skyCoefficientsHayDavies1980,
} from "@/lib/physics/irradiance";

const RAD = Math.PI / 180;
const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 } as const;
const double6 = [pane6, { kind: "gap", widthMm: 16, gas: "air" }, pane6] as const;

/** A one-row site with the sun and sky of the transposition worked example (irradiance reference cases). */
function exampleSite(model: "isotropic" | "hay-davies" | "perez", zenithDeg = 40, azimuthDeg = 160): SiteSeries {
  // case "transposition/example/clear-sky" (scripts/reference/irradiance.ts): doy 172 → E0 = 1321.62
  // (Spencer, 1366.1); z = 40°, TL = 3, sea level: GHI 755.302, DNI 864.288, DHI 93.2191 (AM = 1.304224)
  const ghi = 755.302,
    dni = 864.288,
    dhi = 93.2191,
    e0 = 1321.62,
    am = 1.304224;
  const z = zenithDeg * RAD,
    a = azimuthDeg * RAD,
    alt = Math.PI / 2 - z;
  const hour = { dhiWPerM2: dhi, dniWPerM2: dni, extraterrestrialWPerM2: e0, zenithRad: z };
  const c =
    model === "isotropic"
      ? { isotropicWPerM2: dhi, circumsolarPerCos: 0, horizonWPerM2: 0 }
      : model === "perez"
        ? skyCoefficientsPerez1990(hour, am, emptyPerez1990SkyCoefficients())
        : skyCoefficientsHayDavies1980(hour, emptyHayDavies1980SkyCoefficients());
  const f = (x: number) => Float64Array.of(x);
  return {
    timeline: { length: 1 } as never,
    sun: {
      length: 1,
      altitudeRad: f(alt),
      azimuthRad: f(a),
      zenithRad: f(z),
      east: f(Math.cos(alt) * Math.sin(a)),
      north: f(Math.cos(alt) * Math.cos(a)),
      up: f(Math.sin(alt)),
    },
    ghi: f(ghi),
    dni: f(dni),
    dhi: f(dhi),
    skyIso: f(c.isotropicWPerM2),
    skyCirc: f(c.circumsolarPerCos),
    skyHor: f(c.horizonWPerM2),
    albedo: 0.2,
    model,
    source: "clear-sky",
    warnings: [],
  };
}

const glazing = prepareGlazingTables(GlazingRequest.parse({ layers: double6 }));

describe("irradiance on a vertical south façade (transposition worked example)", () => {
  it.each([
    ["isotropic", 644.189],
    ["hay-davies", 661.776],
    ["perez", 675.989],
  ] as const)("%s sky: beam + sky + ground = %f W/m²", (model, total) => {
    const site = exampleSite(model);
    const out = allocateColumns(1);
    computeSurfaceSeries(site, prepareSurface({ azimuthDeg: 180, tiltDeg: 90 }, 0.2), glazing, out);
    // θ = 52.8415° (cos θ = 0.604023), case "transposition/example/incidence"; beam term 522.049, ground term
    // 75.5302, case "transposition/example/isotropic"; totals, cases "transposition/example/total-…"
    expect(Math.acos(out.cosIncidence[0]!) / RAD).toBeCloseTo(52.8415, 3);
    expect(out.beamIncidentWm2[0]!).toBeCloseTo(522.049, 1);
    // tolerance 0.02 W/m²: the cases print the inputs (GHI, DNI, DHI) to 6 significant digits
    expect(Math.abs(out.beamIncidentWm2[0]! + out.diffuseIncidentWm2[0]! - total)).toBeLessThan(0.02);
  });

  it("transmits the beam with τ(θ) of the unit and the diffuse light with its hemispherical τ", () => {
    const site = exampleSite("perez");
    const out = allocateColumns(1);
    computeSurfaceSeries(site, prepareSurface({ azimuthDeg: 180, tiltDeg: 90 }, 0.2), glazing, out);
    const theta = Math.acos(out.cosIncidence[0]!) / RAD;
    const direct = calculateGlazing(GlazingRequest.parse({ layers: double6, anglesDeg: [theta] })).angles[0]!;
    // table interpolation error ≤ 1e-5 (angular-table tests)
    expect(Math.abs(out.beamTransmittance[0]! - direct.solarTransmittance)).toBeLessThan(1e-5);
    expect(glazing.tauHem).toBeCloseTo(0.577379, 6); // double 6|16|6 hemispherical T, check value of tests/reference/hemispherical.test.ts
    const expected = out.beamIncidentWm2[0]! * direct.solarTransmittance + out.diffuseIncidentWm2[0]! * 0.577379;
    expect(Math.abs(out.transmittedWm2[0]! - expected)).toBeLessThan(0.01);
    const expectedGain = out.beamIncidentWm2[0]! * direct.gValue + out.diffuseIncidentWm2[0]! * glazing.gHem;
    expect(Math.abs(out.solarGainWm2[0]! - expectedGain)).toBeLessThan(0.01);
  });
});

describe('external shading in the schedule (overhang/fin worked example, case "shading/example/sunlit-fractions")', () => {
  // W 1.5, H 1.2, overhang P 0.6 with G 0.3, fins F 0.4 flush; south façade; sun alt 50°, az 210° → f_sunlit 0.475424
  const shading = { window: { widthM: 1.5, heightM: 1.2 }, overhang: { depthM: 0.6, gapAboveM: 0.3 }, fins: { depthM: 0.4, gapM: 0 } };
  it("sunlit fraction 0.475424 and the beam reduced by it", () => {
    const site = exampleSite("isotropic", 40, 210); // altitude 50°
    const open = allocateColumns(1);
    const shaded = allocateColumns(1);
    computeSurfaceSeries(site, prepareSurface({ azimuthDeg: 180, tiltDeg: 90 }, 0.2), glazing, open);
    computeSurfaceSeries(site, prepareSurface({ azimuthDeg: 180, tiltDeg: 90, shading }, 0.2), glazing, shaded);
    expect(shaded.sunlitFraction[0]!).toBeCloseTo(0.475424, 6);
    expect(shaded.beamIncidentWm2[0]!).toBeCloseTo(open.beamIncidentWm2[0]! * 0.475424, 2);
    // the devices also hide part of the sky (view factors): less diffuse, never more
    expect(shaded.diffuseIncidentWm2[0]!).toBeLessThan(open.diffuseIncidentWm2[0]!);
  });
  it("no beam when the sun is behind the façade or below the horizon obstruction", () => {
    const behind = allocateColumns(1);
    computeSurfaceSeries(exampleSite("perez", 40, 20), prepareSurface({ azimuthDeg: 180, tiltDeg: 90 }, 0.2), glazing, behind);
    expect(behind.cosIncidence[0]!).toBeLessThan(0);
    expect(behind.beamIncidentWm2[0]).toBe(0);
    expect(behind.beamTransmittance[0]).toBe(0);
    expect(behind.diffuseIncidentWm2[0]!).toBeGreaterThan(0);
    const low = allocateColumns(1);
    computeSurfaceSeries(
      exampleSite("perez", 80, 180),
      prepareSurface({ azimuthDeg: 180, tiltDeg: 90, shading: { window: { widthM: 1, heightM: 1 }, horizonDeg: 15 } }, 0.2),
      glazing,
      low,
    );
    expect(low.sunlitFraction[0]).toBe(0);
  });
});

const lisbon = { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon", elevationM: 12 };
const schedule = (over: Partial<ScheduleRequestInput>) =>
  scheduleResponse(
    ScheduleRequest.parse({
      site: lisbon,
      from: "2026-06-21",
      to: "2026-06-21",
      surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: double6 }],
      ...over,
    }),
  );

describe("schedule rows and totals", () => {
  it("daylight-saving days have 23 and 25 hourly rows, no instant missing or repeated (IANA tz rules for Europe/Lisbon)", () => {
    const spring = schedule({ from: "2026-03-29", to: "2026-03-29" }).surfaces[0]!.rows;
    const autumn = schedule({ from: "2026-10-25", to: "2026-10-25" }).surfaces[0]!.rows;
    expect(spring).toHaveLength(23);
    expect(autumn).toHaveLength(25);
    for (const rows of [spring, autumn]) {
      const t = rows.map((r) => Date.parse(r.time));
      for (let i = 1; i < t.length; i++) expect(t[i]! - t[i - 1]!).toBe(3_600_000);
    }
    expect(spring[1]!.time).toBe("2026-03-29T02:30:00+01:00"); // 00:30 +00:00, then the clock jumps 01:00 → 02:00
    expect(autumn.slice(1, 3).map((r) => r.time)).toEqual(["2026-10-25T01:30:00+01:00", "2026-10-25T01:30:00+00:00"]);
  });

  it("rows carry every column; night rows are zero", () => {
    const s = schedule({}).surfaces[0]!;
    expect(s.rows).toHaveLength(24);
    const night = s.rows[0]!;
    expect(night.sunAltitudeDeg).toBeLessThan(0);
    expect(night.beamIncidentWm2 + night.transmittedWm2 + night.solarGainWm2).toBe(0);
    const noon = s.rows.find((r) => r.time.startsWith("2026-06-21T13:30"))!;
    // at the June solstice the sun culminates at 90 − 38.7 + 23.4 ≈ 74.7° (closed form; refraction negligible)
    expect(noon.sunAltitudeDeg).toBeGreaterThan(73);
    expect(noon.incidenceDeg).toBeGreaterThan(70); // high summer sun: steep on a south wall
    expect(noon.beamTransmittance).toBeGreaterThan(0);
    expect(noon.transmittedWm2).toBeLessThan(noon.beamIncidentWm2 + noon.diffuseIncidentWm2);
    expect(noon.solarGainWm2).toBeGreaterThan(noon.transmittedWm2); // g > τ: absorbed heat flows in too
  });

  it("daily, monthly and period totals add up, with the peak hour (internal consistency)", () => {
    const s = schedule({ from: "2026-06-29", to: "2026-07-02" }).surfaces[0]!;
    const sumRows = s.rows.reduce((a, r) => a + r.transmittedWm2, 0) / 1000;
    expect(s.totals.period.transmittedKWhPerM2).toBeCloseTo(sumRows, 3);
    expect(s.totals.daily).toHaveLength(4);
    expect(s.totals.monthly.map((m) => m.month)).toEqual(["2026-06", "2026-07"]);
    const monthsSum = s.totals.monthly.reduce((a, m) => a + m.solarGainKWhPerM2, 0);
    expect(monthsSum).toBeCloseTo(s.totals.period.solarGainKWhPerM2, 9);
    const peak = Math.max(...s.rows.map((r) => r.solarGainWm2));
    expect(s.totals.period.peak!.solarGainWm2).toBeCloseTo(peak, 1);
    expect(s.totals.period.transmittedKWh).toBeNull(); // no area given
  });

  it("gives W and kWh for the glazed area", () => {
    const s = schedule({ surfaces: [{ name: "S", azimuthDeg: 180, tiltDeg: 90, layers: double6, glazedAreaM2: 2.5 }] }).surfaces[0]!;
    const r = s.rows.find((x) => x.transmittedWm2 > 100)!;
    expect(r.transmittedW).toBeCloseTo(r.transmittedWm2 * 2.5, 0);
    expect(s.totals.period.transmittedKWh).toBeCloseTo(s.totals.period.transmittedKWhPerM2 * 2.5, 9);
  });

  it("a full year of hours in a daylight-saving zone has 8,760 rows", () => {
    const s = schedule({ from: "2026-01-01", to: "2026-12-31" }).surfaces[0]!;
    expect(s.rows).toHaveLength(8760);
    expect(s.totals.monthly).toHaveLength(12);
    // A south façade at 38.7° N gets more sun in winter than in summer (high summer sun): a sanity check
    // of orientation conventions (Duffie & Beckman ch. 1, from memory).
    expect(s.totals.monthly[0]!.incidentKWhPerM2).toBeGreaterThan(s.totals.monthly[5]!.incidentKWhPerM2);
  });

  it("uses a weather series in place of the clear sky", () => {
    const weather = [
      { time: "2026-06-21T12:30:00+01:00", ghi: 500, dni: 300, dhi: 250 },
      { time: "2030-01-01T00:30:00Z", ghi: 1, dni: 1, dhi: 1 },
    ];
    const res = schedule({ weather });
    const s = res.surfaces[0]!;
    expect(res.irradiance).toBe("weather series");
    const lit = s.rows.filter((r) => r.beamIncidentWm2 + r.diffuseIncidentWm2 > 0);
    expect(lit.map((r) => r.time)).toEqual(["2026-06-21T12:30:00+01:00"]);
    expect(res.warnings.join(" ")).toMatch(/1 weather rows fall outside/);
    expect(res.warnings.join(" ")).toMatch(/daylight rows have no weather values/);
  });
});
