/**
 * Check values for the angle of incidence of the sun's beam on a tilted, oriented surface.
 *
 * Inputs in degrees: sun altitude (or zenith) and azimuth clockwise from north; surface azimuth of the outward
 * normal's horizontal projection (south = 180) and tilt from horizontal (0 = facing up, 90 = vertical façade).
 */
import { half } from "./build";
import type { CaseSource, ReferenceCase, ReferenceDomain, Tolerance } from "./types";

export interface IncidenceInput {
  /** Sun altitude [deg]; either this or `sunZenithDeg` (altitude = 90° − zenith). */
  readonly sunAltitudeDeg?: number;
  /** Sun zenith [deg], as printed by a source that gives the zenith. */
  readonly sunZenithDeg?: number;
  /** Sun azimuth, clockwise from north [deg]. */
  readonly sunAzimuthDeg: number;
  readonly surfaceAzimuthDeg: number;
  readonly surfaceTiltDeg: number;
}

const script = "scripts/reference/incidence.ts";
const incidenceFormula: CaseSource = {
  kind: "computed",
  formula:
    "angle of incidence on a tilted surface, cos θ = cos z cos β + sin z sin β cos(γs − γ): J. A. Duffie & W. A. Beckman, " +
    "Solar Engineering of Thermal Processes, 4th ed., Wiley, 2013, ch. 1 (equation number from memory)",
  script,
  fromMemory: true,
};
const spaReport =
  "I. Reda & A. Andreas, Solar Position Algorithm for Solar Radiation Applications, NREL/TP-560-34302, 2004 (rev. 2008), " +
  "worked example: incidence on a surface of slope 30°, azimuth rotation −10° (table number not checked)";

const half6 = half(6);
const half4 = half(4);
const yesNo: Tolerance = { abs: 0, reason: "yes (1) or no (0): exact" };

const cos = (value: number, tolerance: Tolerance = half6) => ({ quantity: "cosTheta", unit: "-", value, tolerance });
const theta = (value: number, tolerance: Tolerance = half4) => ({ quantity: "thetaDeg", unit: "deg", value, tolerance });
const beam = (reaches: boolean) => ({ quantity: "beamReachesSurface", unit: "-", value: reaches ? 1 : 0, tolerance: yesNo });

const southFacade = { surfaceAzimuthDeg: 180, surfaceTiltDeg: 90 } as const;

const cases: readonly ReferenceCase<IncidenceInput>[] = [
  {
    id: "incidence/south-facade/alt30-az180",
    label: "vertical south façade, sun altitude 30°, azimuth 180°: cos θ 0.866025, θ 30.0000°",
    input: { sunAltitudeDeg: 30, sunAzimuthDeg: 180, ...southFacade },
    expected: [cos(0.866025), theta(30.0), beam(true)],
    source: incidenceFormula,
  },
  {
    id: "incidence/south-facade/alt30-az225",
    label: "vertical south façade, sun altitude 30°, azimuth 225°: cos θ 0.612372, θ 52.2388°",
    input: { sunAltitudeDeg: 30, sunAzimuthDeg: 225, ...southFacade },
    expected: [cos(0.612372), theta(52.2388), beam(true)],
    source: incidenceFormula,
  },
  {
    id: "incidence/south-facade/alt60-az200",
    label: "vertical south façade, sun altitude 60°, azimuth 200°: cos θ 0.469846, θ 61.9757°",
    input: { sunAltitudeDeg: 60, sunAzimuthDeg: 200, ...southFacade },
    expected: [cos(0.469846), theta(61.9757), beam(true)],
    source: incidenceFormula,
  },
  {
    id: "incidence/south-facade/alt45-az135",
    label: "vertical south façade, sun altitude 45°, azimuth 135°: cos θ 0.500000, θ 60.0000°",
    input: { sunAltitudeDeg: 45, sunAzimuthDeg: 135, ...southFacade },
    expected: [cos(0.5), theta(60.0), beam(true)],
    source: incidenceFormula,
  },
  {
    id: "incidence/south-facade/grazing-east",
    label: "vertical south façade, sun altitude 10° due east: grazing, cos θ = 0, θ = 90°, no beam",
    input: { sunAltitudeDeg: 10, sunAzimuthDeg: 90, ...southFacade },
    expected: [
      cos(0, { abs: 1e-15, reason: "exact 0 in closed form; float64 leaves ~1e-17" }),
      theta(90, { abs: 1e-12, reason: "exact 90° in closed form; float64 rounding of acos near 0" }),
      beam(false),
    ],
    source: { kind: "closed-form", formula: "cos θ = cos(alt) · cos(90° − 180°) = 0 on a vertical surface" },
  },
  {
    id: "incidence/south-facade/sun-behind",
    label: "vertical south façade, sun altitude 40° due north (behind): cos θ −0.766044, θ 140°, no beam",
    input: { sunAltitudeDeg: 40, sunAzimuthDeg: 0, ...southFacade },
    expected: [cos(-0.766044), theta(140, { abs: 1e-10, reason: "exactly 90° + 50° from the formula; float64 rounding of acos" }), beam(false)],
    source: incidenceFormula,
  },
  {
    id: "incidence/east-facade/alt30-az120",
    label: "vertical east façade (azimuth 90°), sun altitude 30°, azimuth 120°: θ 41.4096°",
    input: { sunAltitudeDeg: 30, sunAzimuthDeg: 120, surfaceAzimuthDeg: 90, surfaceTiltDeg: 90 },
    expected: [theta(41.4096)],
    source: incidenceFormula,
  },
  {
    id: "incidence/roof-30/alt50-az160",
    label: "roof tilted 30° facing south, sun altitude 50°, azimuth 160°: θ 15.1104°",
    input: { sunAltitudeDeg: 50, sunAzimuthDeg: 160, surfaceAzimuthDeg: 180, surfaceTiltDeg: 30 },
    expected: [theta(15.1104)],
    source: incidenceFormula,
  },
  {
    id: "incidence/spa-example/refracted-zenith",
    label: "NREL SPA example surface (slope 30°, azimuth 170°), published zenith 50.11162° and azimuth 194.34024°: θ 25.186998°",
    input: { sunZenithDeg: 50.11162, sunAzimuthDeg: 194.34024, surfaceAzimuthDeg: 170, surfaceTiltDeg: 30 },
    expected: [theta(25.186998, half6)],
    source: incidenceFormula,
  },
  {
    id: "incidence/spa-example/published",
    label: "NREL SPA example surface: published incidence 25.187000°",
    input: { sunZenithDeg: 50.11162, sunAzimuthDeg: 194.34024, surfaceAzimuthDeg: 170, surfaceTiltDeg: 30 },
    expected: [
      theta(25.187, {
        abs: 1e-5,
        reason: "the inputs are the published zenith and azimuth rounded to 5 decimals (±5e-6°) and |∂θ/∂z| + |∂θ/∂az| < 2 here",
      }),
    ],
    source: { kind: "published", citation: spaReport },
  },
  {
    id: "incidence/spa-example/unrefracted-zenith",
    label: "NREL SPA example surface with the zenith without refraction (50.127954°): θ 25.201291° (SPA uses the refracted zenith)",
    input: { sunZenithDeg: 50.127954, sunAzimuthDeg: 194.34024, surfaceAzimuthDeg: 170, surfaceTiltDeg: 30 },
    expected: [theta(25.201291, half6)],
    source: incidenceFormula,
  },
];

export const incidence: ReferenceDomain<IncidenceInput> = {
  domain: "incidence",
  title: "Angle of incidence on tilted and vertical surfaces",
  cases,
};
