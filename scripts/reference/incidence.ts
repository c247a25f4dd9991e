// Independent computation of the angle-of-incidence check values (src/lib/reference-cases/incidence.ts).
//
// Formula: angle of incidence of the beam on a surface of tilt β and azimuth γ (both azimuths clockwise from north),
//   cos θ = cos z cos β + sin z sin β cos(γs − γ),   z = 90° − altitude,
// J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley, 2013, ch. 1 (angle of
// incidence; equation number from memory). The beam reaches the surface only when the sun is above the horizon
// and cos θ > 0 (common practice, no source).
//
// Run: npx tsx scripts/reference/incidence.ts
import { incidence, type IncidenceInput } from "@/lib/reference-cases/incidence";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const SCRIPT = "scripts/reference/incidence.ts";
const D2R = Math.PI / 180;

/** cos θ of the beam on a surface, from the formula above (all angles in degrees). */
export function cosIncidence(altitudeDeg: number, sunAzimuthDeg: number, surfaceAzimuthDeg: number, tiltDeg: number): number {
  const z = (90 - altitudeDeg) * D2R;
  const b = tiltDeg * D2R;
  return Math.cos(z) * Math.cos(b) + Math.sin(z) * Math.sin(b) * Math.cos((sunAzimuthDeg - surfaceAzimuthDeg) * D2R);
}

/** Recomputes cos θ, θ [deg] and whether the beam reaches the surface (1/0) for a case. */
export function computeIncidence(c: ReferenceCase<IncidenceInput>): Recomputed {
  const i = c.input;
  const alt = i.sunAltitudeDeg ?? 90 - (i.sunZenithDeg ?? Number.NaN);
  const ct = cosIncidence(alt, i.sunAzimuthDeg, i.surfaceAzimuthDeg, i.surfaceTiltDeg);
  return {
    cosTheta: ct,
    thetaDeg: Math.acos(Math.min(1, Math.max(-1, ct))) / D2R,
    beamReachesSurface: alt > 0 && ct > 0 ? 1 : 0,
  };
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const incidenceComparison = () => compareDomain(incidence, SCRIPT, computeIncidence, { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[incidence.title, incidenceComparison]]);
