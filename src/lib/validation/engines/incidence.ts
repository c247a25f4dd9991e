/** The engine's values of the quantities an incidence case names (src/lib/physics/surface-geometry.ts). */
import {
  angleOfIncidenceDeg,
  beamReachesSurface,
  cosIncidence,
  sunVectorEnu,
  surfaceFrame,
  surfaceOrientationDeg,
} from "@/lib/physics/surface-geometry";
import type { IncidenceInput } from "@/lib/reference-cases/incidence";
import type { Evaluation } from "../types";
import { deg } from "./angles";

export const sunAltitudeOf = (i: IncidenceInput): number => i.sunAltitudeDeg ?? 90 - i.sunZenithDeg!;

export function incidenceValues(input: IncidenceInput): Record<string, number> {
  const alt = sunAltitudeOf(input);
  const normal = surfaceFrame(surfaceOrientationDeg(input.surfaceAzimuthDeg, input.surfaceTiltDeg)).normal;
  const s = sunVectorEnu(deg(alt), deg(input.sunAzimuthDeg));
  const cosTheta = cosIncidence(normal, s.east, s.north, s.up);
  return {
    cosTheta,
    thetaDeg: angleOfIncidenceDeg(alt, input.sunAzimuthDeg, input.surfaceAzimuthDeg, input.surfaceTiltDeg),
    beamReachesSurface: beamReachesSurface(s.up, cosTheta) ? 1 : 0,
  };
}

export const evaluateIncidence = (c: { readonly input: IncidenceInput }): Evaluation => ({ values: incidenceValues(c.input) });
