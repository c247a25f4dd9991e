/**
 * Turns a schedule computation (typed arrays) into the JSON body of POST /api/v1/calc/schedule.
 * Rounding at output only: angles to 0.001°, fractions to 1e-6, W/m² to 0.01, W to 0.1.
 */
import type { ScheduleRequest, ScheduleResponse, ScheduleRow } from "@/lib/contracts/schedule";
import { computeSchedule, type ScheduleComputation } from "./schedule";
import { scheduleTotals } from "./schedule-totals";
import { DEG_PER_RAD } from "@/lib/physics/units";

const r3 = (x: number) => Math.round(x * 1e3) / 1e3;
const r6 = (x: number) => Math.round(x * 1e6) / 1e6;
const r2 = (x: number) => Math.round(x * 100) / 100;
const r1 = (x: number) => Math.round(x * 10) / 10;

export const SCHEDULE_METHODS = {
  time: "each row stands for an interval of stepMinutes starting at local midnight; the sun is evaluated at the interval's midpoint, which is the row's time (local clock time with its UTC offset, daylight saving included)",
  sunPosition: "suncalc v2: apparent (refraction-corrected) altitude, azimuth clockwise from north",
  clearSky:
    "Ineichen & Perez (2002) clear sky with monthly Linke turbidity; extraterrestrial irradiance by Spencer (1971); relative air mass by Kasten & Young (1989), scaled by the site's pressure",
  sky: {
    perez: "Perez et al. (1990) anisotropic sky, all-sites composite coefficients",
    "hay-davies": "Hay & Davies (1980) anisotropic sky",
    isotropic: "Liu & Jordan (1960) isotropic sky",
  },
  ground: "isotropic ground reflection, GHI × albedo × (1 − cos tilt)/2",
  glazing:
    "beam: the unit's transmittance τ(θ) and g(θ) at the angle of incidence (angular tables of the Fresnel stack); diffuse: hemispherical τ and g",
  shading:
    "beam: exact sunlit fraction of the window under the overhang and fins; circumsolar sky like the beam; isotropic sky, horizon band and ground reduced by the devices' view factors",
} as const;

function rowsOf(c: ScheduleComputation, k: number, isoTimes: string[]): ScheduleRow[] {
  const { sun } = c.site;
  const s = c.surfaces[k]!;
  const col = s.columns;
  const area = s.areaM2;
  const rows: ScheduleRow[] = new Array(isoTimes.length);
  for (let i = 0; i < isoTimes.length; i++) {
    const cos = col.cosIncidence[i]!;
    const row: ScheduleRow = {
      time: isoTimes[i]!,
      sunAltitudeDeg: r3(sun.altitudeRad[i]! * DEG_PER_RAD),
      sunAzimuthDeg: r3(sun.azimuthRad[i]! * DEG_PER_RAD),
      incidenceDeg: r3(Math.acos(cos > 1 ? 1 : cos < -1 ? -1 : cos) * DEG_PER_RAD),
      beamTransmittance: r6(col.beamTransmittance[i]!),
      sunlitFraction: r6(col.sunlitFraction[i]!),
      beamIncidentWm2: r2(col.beamIncidentWm2[i]!),
      diffuseIncidentWm2: r2(col.diffuseIncidentWm2[i]!),
      transmittedWm2: r2(col.transmittedWm2[i]!),
      solarGainWm2: r2(col.solarGainWm2[i]!),
    };
    if (area !== null) {
      row.transmittedW = r1(col.transmittedWm2[i]! * area);
      row.solarGainW = r1(col.solarGainWm2[i]! * area);
    }
    rows[i] = row;
  }
  return rows;
}

export function scheduleResponse(req: ScheduleRequest, c: ScheduleComputation = computeSchedule(req)): ScheduleResponse {
  const tl = c.site.timeline;
  const isoTimes = Array.from({ length: tl.length }, (_, i) => tl.iso(i));
  const iso = (i: number) => isoTimes[i]!;
  return {
    site: { ...req.site },
    from: req.from,
    to: req.to,
    stepMinutes: req.stepMinutes,
    timeZone: tl.timeZone,
    rowsPerSurface: tl.length,
    irradiance: c.site.source === "weather" ? "weather series" : "clear sky",
    sky: { model: req.sky.model, albedo: req.sky.albedo },
    methods: { ...SCHEDULE_METHODS, sky: SCHEDULE_METHODS.sky[req.sky.model] },
    surfaces: c.surfaces.map((s, k) => {
      const incident = new Float64Array(tl.length);
      for (let i = 0; i < tl.length; i++) incident[i] = s.columns.beamIncidentWm2[i]! + s.columns.diffuseIncidentWm2[i]!;
      return {
        name: s.name,
        azimuthDeg: s.input.azimuthDeg,
        tiltDeg: s.input.tiltDeg,
        glazedAreaM2: s.areaM2,
        normalTransmittance: s.glazing.tauNormal,
        diffuseTransmittance: s.glazing.tauHem,
        normalGValue: s.glazing.gNormal,
        diffuseGValue: s.glazing.gHem,
        uValue: s.glazing.uValue,
        rows: rowsOf(c, k, isoTimes),
        totals: scheduleTotals({
          incidentWm2: incident,
          transmittedWm2: s.columns.transmittedWm2,
          solarGainWm2: s.columns.solarGainWm2,
          stepMinutes: tl.stepMinutes,
          areaM2: s.areaM2,
          days: tl.days,
          iso,
        }),
      };
    }),
    warnings: c.warnings,
  };
}
