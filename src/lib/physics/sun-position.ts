/**
 * Solar position for a site, wrapping suncalc v2 (`getPosition`), a low-precision model after
 * J. Meeus, Astronomical Algorithms: ch. 25 (apparent solar coordinates, with ΔT), eq. 12.4
 * (mean sidereal time) and eq. 16.4 (Sæmundsson refraction), as cited in suncalc's source.
 *
 * Conventions
 * - Altitude is APPARENT: corrected for a standard atmosphere's refraction (no pressure or
 *   temperature input; ≈0.48° at the horizon, ≈0.02° at 40°). Below the horizon suncalc keeps
 *   the horizon value of the correction, so negative altitudes are shifted by ≈0.48°; treat
 *   altitude ≤ 0 as "no beam".
 * - Azimuth is measured clockwise from north (N 0, E 90, S 180, W 270), in [0, 360°) / [0, 2π).
 * - Geocentric: no topocentric parallax (≤ 0.0025° for the Sun) and no observer height.
 * - Input instants are UTC milliseconds since 1970-01-01T00:00Z; no local time is involved.
 *
 * Accuracy
 * - suncalc README (v2.0.2): typical error about 0.08° in position.
 * - NREL SPA worked example (Reda & Andreas, NREL/TP-560-34302): suncalc v2 gives zenith
 *   50.10748° and azimuth 194.33906° against 50.111622° and 194.340241° (differences 0.004°
 *   and 0.001°, of the size of what suncalc leaves out here: SPA refracts for 820 mbar /
 *   11 °C, ≈0.004° less than a standard atmosphere, and adds parallax, ≈0.002°).
 * - Against astronomy-engine 2.1.19 (topocentric, 'normal' refraction), every hour of 2026
 *   with the Sun above 10°, at Lisbon, Sydney, Singapore and Reykjavik, the largest
 *   differences measured were 0.0129° in altitude, 0.0113° in azimuth × cos(altitude) and
 *   0.0135° in angle between the two sun directions (tests/reference/sun-position.test.ts).
 *
 * Use: sun positions depend on the site and instant only, not on a surface. Compute one
 * {@link SunTrack} per site and timeline, and share it between all façades and glazing options.
 *
 * @see suncalc 2.0.2, https://github.com/mourner/suncalc (README and index.js)
 */
import { getPosition } from "suncalc";
import { RAD_PER_DEG } from "./units";

const HALF_PI = Math.PI / 2;
const TWO_PI = 2 * Math.PI;

/** Sun position at one instant, in degrees (for display and edge use). */
export interface SunPositionDeg {
  /** Apparent (refraction-corrected) altitude above the horizon [deg]. */
  altitudeDeg: number;
  /** Azimuth, clockwise from north, in [0, 360) [deg]. */
  azimuthDeg: number;
}

/**
 * Checks a site's coordinates.
 * @throws RangeError naming latitudeDeg or longitudeDeg when not finite or out of range
 */
function checkSite(latitudeDeg: number, longitudeDeg: number): void {
  if (typeof latitudeDeg !== "number" || !Number.isFinite(latitudeDeg) || latitudeDeg < -90 || latitudeDeg > 90) {
    throw new RangeError(`latitudeDeg must be a finite number in [-90, 90]; got ${latitudeDeg}`);
  }
  if (typeof longitudeDeg !== "number" || !Number.isFinite(longitudeDeg) || longitudeDeg < -180 || longitudeDeg > 180) {
    throw new RangeError(`longitudeDeg must be a finite number in [-180, 180]; got ${longitudeDeg}`);
  }
}

/** Wraps an azimuth into [0, 360). suncalc already returns that range; this guards the bound. */
const wrap360 = (a: number): number => {
  const w = a % 360;
  return w < 0 ? w + 360 : w >= 360 ? 0 : w;
};

/**
 * Sun position (suncalc v2) at one instant.
 * @param epochMs instant [ms since 1970-01-01T00:00Z]
 * @param latitudeDeg site latitude, north positive [deg], in [−90, 90]
 * @param longitudeDeg site longitude, east positive [deg], in [−180, 180]
 * @returns apparent altitude [deg] and azimuth clockwise from north in [0, 360) [deg]
 * @throws RangeError naming the field for a non-finite instant or out-of-range coordinates
 */
export function sunPositionSuncalc(epochMs: number, latitudeDeg: number, longitudeDeg: number): SunPositionDeg {
  checkSite(latitudeDeg, longitudeDeg);
  if (typeof epochMs !== "number" || !Number.isFinite(epochMs)) {
    throw new RangeError(`epochMs must be a finite number of milliseconds; got ${epochMs}`);
  }
  const p = getPosition(new Date(epochMs), latitudeDeg, longitudeDeg);
  return { altitudeDeg: p.altitude, azimuthDeg: wrap360(p.azimuth) };
}

/**
 * Sun positions at many instants for one site, as a structure of arrays (SI: radians).
 * `east`, `north`, `up` are the components of the unit vector towards the sun in the local
 * east-north-up frame: (cos h sin A, cos h cos A, sin h), h = apparent altitude,
 * A = azimuth clockwise from north.
 */
export interface SunTrack {
  /** Number of instants. */
  readonly length: number;
  /** Apparent altitude h [rad], in [−π/2, π/2]. */
  readonly altitudeRad: Float64Array;
  /** Azimuth A, clockwise from north, in [0, 2π) [rad]. */
  readonly azimuthRad: Float64Array;
  /** Apparent zenith angle z = π/2 − h [rad]. */
  readonly zenithRad: Float64Array;
  /** East component of the unit sun vector [-]. */
  readonly east: Float64Array;
  /** North component of the unit sun vector [-]. */
  readonly north: Float64Array;
  /** Up component of the unit sun vector [-] (= sin h). */
  readonly up: Float64Array;
}

/**
 * Sun track (suncalc v2) for one site over a list of instants, e.g. a timeline's `epochMs`.
 * Cost: one suncalc call per instant (about 1 µs; a year of hours takes ≈7 ms on a 2-core VM); the
 * output arrays are allocated once and one Date object is reused.
 * @param epochMs instants [ms since 1970-01-01T00:00Z]
 * @param latitudeDeg site latitude, north positive [deg], in [−90, 90]
 * @param longitudeDeg site longitude, east positive [deg], in [−180, 180]
 * @returns the sun track, one entry per instant
 * @throws RangeError naming the field for out-of-range coordinates or a non-finite instant
 */
export function sunTrack(epochMs: Float64Array, latitudeDeg: number, longitudeDeg: number): SunTrack {
  checkSite(latitudeDeg, longitudeDeg);
  const n = epochMs.length;
  const altitudeRad = new Float64Array(n);
  const azimuthRad = new Float64Array(n);
  const zenithRad = new Float64Array(n);
  const east = new Float64Array(n);
  const north = new Float64Array(n);
  const up = new Float64Array(n);
  const date = new Date(0);
  for (let i = 0; i < n; i++) {
    const t = epochMs[i] as number;
    if (!Number.isFinite(t)) throw new RangeError(`epochMs[${i}] must be a finite number of milliseconds; got ${t}`);
    date.setTime(t);
    const p = getPosition(date, latitudeDeg, longitudeDeg);
    const h = p.altitude * RAD_PER_DEG;
    const aRaw = wrap360(p.azimuth) * RAD_PER_DEG;
    const a = aRaw < TWO_PI ? aRaw : 0; // 359.99…° can round up to 2π
    const cosH = Math.cos(h);
    altitudeRad[i] = h;
    azimuthRad[i] = a;
    zenithRad[i] = HALF_PI - h;
    east[i] = cosH * Math.sin(a);
    north[i] = cosH * Math.cos(a);
    up[i] = Math.sin(h);
  }
  return { length: n, altitudeRad, azimuthRad, zenithRad, east, north, up };
}
