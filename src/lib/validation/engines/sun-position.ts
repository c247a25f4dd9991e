/**
 * The engine's values of the quantities a sun-position case names (src/lib/physics/sun-position.ts, suncalc v2
 * wrapped), with astronomy-engine as the full-precision reference for the year comparisons and the transits.
 */
import { Body, Equator, Horizon, Observer, SearchHourAngle } from "astronomy-engine";
import { sunPositionSuncalc, sunTrack } from "@/lib/physics/sun-position";
import type { SunPositionInput, SunYearInput } from "@/lib/reference-cases/sun-position";
import type { Evaluation } from "../types";

const RAD = 180 / Math.PI;
const HOUR_MS = 3_600_000;

/** Unit vector (east, north, up) of a direction given as altitude/azimuth in degrees. */
function enu(altDeg: number, azDeg: number): [number, number, number] {
  const h = altDeg / RAD;
  const a = azDeg / RAD;
  return [Math.cos(h) * Math.sin(a), Math.cos(h) * Math.cos(a), Math.sin(h)];
}

/** Angle between two unit vectors [deg], atan2(|u×v|, u·v) (accurate for small angles). */
function separationDeg(u: readonly [number, number, number], v: readonly [number, number, number]): number {
  const cx = u[1] * v[2] - u[2] * v[1];
  const cy = u[2] * v[0] - u[0] * v[2];
  const cz = u[0] * v[1] - u[1] * v[0];
  return Math.atan2(Math.hypot(cx, cy, cz), u[0] * v[0] + u[1] * v[1] + u[2] * v[2]) * RAD;
}

/**
 * The midpoints of the hours of a UTC year (8,760 of them) compared with astronomy-engine's topocentric apparent
 * position (`Equator(Body.Sun, date, observer, true, true)` into `Horizon(…, "normal")`), where the reference sun
 * is above the case's minimum altitude: the largest altitude difference, azimuth arc (|ΔA|·cos h) and separation.
 */
export function sunYearComparison(input: SunYearInput) {
  const { latitudeDeg: lat, longitudeDeg: lon, year, minReferenceAltitudeDeg } = input;
  const hours = new Float64Array(8760);
  for (let i = 0; i < hours.length; i++) hours[i] = Date.UTC(year, 0, 1, 0, 30) + i * HOUR_MS;
  const track = sunTrack(hours, lat, lon);
  const observer = new Observer(lat, lon, 0);
  let compared = 0;
  let maxAlt = 0;
  let maxAzCos = 0;
  let maxSep = 0;
  for (let i = 0; i < hours.length; i++) {
    const date = new Date(hours[i]!);
    const eq = Equator(Body.Sun, date, observer, true, true);
    const ref = Horizon(date, observer, eq.ra, eq.dec, "normal");
    if (ref.altitude <= minReferenceAltitudeDeg) continue;
    compared++;
    const altDeg = track.altitudeRad[i]! * RAD;
    const azDeg = track.azimuthRad[i]! * RAD;
    const dAz = Math.abs(((azDeg - ref.azimuth + 540) % 360) - 180);
    maxAlt = Math.max(maxAlt, Math.abs(altDeg - ref.altitude));
    maxAzCos = Math.max(maxAzCos, dAz * Math.cos(ref.altitude / RAD));
    maxSep = Math.max(maxSep, separationDeg([track.east[i]!, track.north[i]!, track.up[i]!], enu(ref.altitude, ref.azimuth)));
  }
  return { comparedHours: compared, maxAltitudeDifferenceDeg: maxAlt, maxAzimuthArcDeg: maxAzCos, maxSeparationDeg: maxSep };
}

/**
 * Quantities: `zenithDeg`, `azimuthDeg` at an instant; the year maxima (and `comparedHours`); at a transit the
 * azimuth in [−90°, 270°), so that due north (0°) and due south (180°) both lie away from the wrap, with
 * `transitHoursAfterStart` and the altitude there.
 */
export function sunPositionValues(input: SunPositionInput): Record<string, number> {
  switch (input.kind) {
    case "instant": {
      const p = sunPositionSuncalc(Date.parse(input.instantUtc), input.latitudeDeg, input.longitudeDeg);
      return { zenithDeg: 90 - p.altitudeDeg, azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg };
    }
    case "year":
      return sunYearComparison(input);
    case "transit": {
      const start = Date.parse(input.searchFromUtc);
      const noon = SearchHourAngle(Body.Sun, new Observer(input.latitudeDeg, input.longitudeDeg, 0), 0, new Date(start)).time.date.getTime();
      const p = sunPositionSuncalc(noon, input.latitudeDeg, input.longitudeDeg);
      return {
        azimuthDeg: p.azimuthDeg >= 270 ? p.azimuthDeg - 360 : p.azimuthDeg,
        altitudeDeg: p.altitudeDeg,
        transitHoursAfterStart: (noon - start) / HOUR_MS,
      };
    }
  }
}

export const evaluateSunPosition = (c: { readonly input: SunPositionInput }): Evaluation => ({ values: sunPositionValues(c.input) });
