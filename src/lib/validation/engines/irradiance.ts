/** The engine's values of the quantities an irradiance case names (src/lib/physics/irradiance, surface-geometry). */
import {
  absoluteAirMass,
  beamOnSurface,
  beamRatioHayDavies1980,
  clearSkyAshraeTau2009,
  clearSkyIneichenPerez2002,
  extraterrestrialFactorSimple,
  extraterrestrialFactorSpencer1971,
  extraterrestrialIrradianceAshrae2009,
  extraterrestrialIrradianceSpencer1971,
  groundReflected,
  PEREZ_1990_ALL_SITES_COMPOSITE,
  pressureFromElevation,
  relativeAirMassKastenYoung1989,
  skyCoefficientsHayDavies1980,
  skyCoefficientsPerez1990,
  skyDiffuseHayDavies1980,
  skyDiffuseIsotropicLiuJordan1960,
  skyDiffusePerez1990,
  tiltedSurfaceIrradiance,
} from "@/lib/physics/irradiance";
import { angleOfIncidenceDeg } from "@/lib/physics/surface-geometry";
import type { IrradianceInput, TranspositionInput } from "@/lib/reference-cases/irradiance";
import type { Evaluation } from "../types";
import { deg } from "./angles";

const cosd = (d: number): number => Math.cos((d * Math.PI) / 180);

/** One clear-sky hour on a surface: the sky, the incidence, each sky model and the totals. */
export function transpositionValues(ex: TranspositionInput): Record<string, number> {
  const e0 = extraterrestrialIrradianceSpencer1971(ex.dayOfYear, ex.solarConstantWPerM2);
  const am = relativeAirMassKastenYoung1989(ex.zenithDeg);
  const sky = clearSkyIneichenPerez2002({
    cosZenith: cosd(ex.zenithDeg),
    airMassAbsolute: absoluteAirMass(am, ex.pressurePa),
    linkeTurbidity: ex.linkeTurbidity,
    elevationM: ex.elevationM,
    extraterrestrialWPerM2: e0,
  });
  const thetaDeg = angleOfIncidenceDeg(90 - ex.zenithDeg, ex.sunAzimuthDeg, ex.surfaceAzimuthDeg, ex.surfaceTiltDeg);
  const cosTheta = cosd(thetaDeg);
  const hour = { dhiWPerM2: sky.dhi, dniWPerM2: sky.dni, extraterrestrialWPerM2: e0, zenithRad: deg(ex.zenithDeg) };
  const tilt = deg(ex.surfaceTiltDeg);
  const perez = skyCoefficientsPerez1990(hour, am);
  const total = (model: "isotropic" | "hay-davies" | "perez") =>
    tiltedSurfaceIrradiance({ ...hour, ghiWPerM2: sky.ghi, relativeAirMass: am, tiltRad: tilt, cosTheta, albedo: ex.albedo, model }).totalWPerM2;
  return {
    extraterrestrialWPerM2: e0,
    relativeAirMass: am,
    ghi: sky.ghi,
    dni: sky.dni,
    dhi: sky.dhi,
    thetaDeg,
    cosTheta,
    beam: beamOnSurface(sky.dni, cosTheta),
    ground: groundReflected(sky.ghi, tilt, ex.albedo),
    skyIsotropic: skyDiffuseIsotropicLiuJordan1960(sky.dhi, tilt),
    anisotropyIndex: skyCoefficientsHayDavies1980(hour).anisotropyIndex,
    beamRatio: beamRatioHayDavies1980(cosTheta, deg(ex.zenithDeg)),
    skyHayDavies: skyDiffuseHayDavies1980(hour, tilt, cosTheta),
    epsilon: perez.epsilon,
    bin: perez.bin,
    delta: perez.delta,
    ...(ex.printedExtraterrestrialWPerM2 === undefined
      ? {}
      : { deltaWithPrintedE0: skyCoefficientsPerez1990({ ...hour, extraterrestrialWPerM2: ex.printedExtraterrestrialWPerM2 }, am).delta }),
    f1: perez.f1,
    f2: perez.f2,
    skyPerez: skyDiffusePerez1990(hour, am, tilt, cosTheta),
    "total-isotropic": total("isotropic"),
    "total-hay-davies": total("hay-davies"),
    "total-perez": total("perez"),
  };
}

export function irradianceValues(i: IrradianceInput): Record<string, number> {
  switch (i.kind) {
    case "extraterrestrial":
      return i.model === "spencer-1971"
        ? {
            factor: extraterrestrialFactorSpencer1971(i.dayOfYear),
            extraterrestrialWPerM2: extraterrestrialIrradianceSpencer1971(i.dayOfYear, i.solarConstantWPerM2),
          }
        : { factor: extraterrestrialFactorSimple(i.dayOfYear) };
    case "air-mass":
      return { relativeAirMass: relativeAirMassKastenYoung1989(i.apparentZenithDeg), secantZenith: 1 / cosd(i.apparentZenithDeg) };
    case "pressure":
      return { pressurePa: pressureFromElevation(i.elevationM) };
    case "ineichen-perez": {
      const base = {
        cosZenith: cosd(i.zenithDeg),
        linkeTurbidity: i.linkeTurbidity,
        elevationM: i.elevationM,
        extraterrestrialWPerM2: i.extraterrestrialWPerM2,
      };
      const am = relativeAirMassKastenYoung1989(i.zenithDeg);
      // AM_abs from the pressure, or from the scale height where the case gives one
      const amAbs =
        i.airMassScaleHeightM === undefined ? absoluteAirMass(am, i.pressurePa ?? 101325) : am * Math.exp(-i.elevationM / i.airMassScaleHeightM);
      const r = clearSkyIneichenPerez2002({ ...base, airMassAbsolute: amAbs });
      const out: Record<string, number> = { airMassAbsolute: amAbs, ghi: r.ghi, dni: r.dni, dhi: r.dhi };
      if (i.printedAirMassAbsolute !== undefined) {
        const given = clearSkyIneichenPerez2002({ ...base, airMassAbsolute: i.printedAirMassAbsolute });
        out.ghiFromPrintedAirMass = given.ghi;
        out.dniFromPrintedAirMass = given.dni;
      }
      return out;
    }
    case "ashrae-tau": {
      const e0 = extraterrestrialIrradianceAshrae2009(i.dayOfYear);
      // m = 1/[sin β + 0.50572 (6.07995 + β)^−1.6364] = Kasten–Young at z = 90° − β
      const airMass = i.solarAltitudeDeg === undefined ? 1 : relativeAirMassKastenYoung1989(90 - i.solarAltitudeDeg);
      const r = clearSkyAshraeTau2009({ airMass, extraterrestrialWPerM2: e0, tauBeam: i.tauBeam, tauDiffuse: i.tauDiffuse });
      return {
        extraterrestrialWPerM2: e0,
        ab: r.ab,
        ad: r.ad,
        ...(i.solarAltitudeDeg === undefined ? {} : { dni: r.dniWPerM2, dhi: r.dhiWPerM2 }),
      };
    }
    case "transposition":
      return transpositionValues(i);
    case "perez-table": {
      const row = PEREZ_1990_ALL_SITES_COMPOSITE[i.bin - 1];
      if (!row) return {};
      return Object.fromEntries(["f11", "f12", "f13", "f21", "f22", "f23"].map((k, j) => [k, row[j]!]));
    }
  }
}

export const evaluateIrradiance = (c: { readonly input: IrradianceInput }): Evaluation => ({ values: irradianceValues(c.input) });
