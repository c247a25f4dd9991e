// Independent computation of the irradiance check values (src/lib/reference-cases/irradiance.ts).
//
// Formulas, each from its published source:
// - Extraterrestrial factor, Spencer series: E0/Esc = 1.00011 + 0.034221 cos B + 0.00128 sin B + 0.000719 cos 2B
//   + 0.000077 sin 2B, B = 2π(doy − 1)/365 — J. W. Spencer, "Fourier series representation of the position of the
//   sun", Search 2(5):172, 1971 (from memory). Simple form 1 + 0.033 cos(2π doy/365) — J. A. Duffie &
//   W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley, 2013, eq. 1.4.1a (from memory).
// - Relative air mass: AM = 1/[cos z + 0.50572 (96.07995 − z)^−1.6364] — F. Kasten & A. T. Young, "Revised optical
//   air mass tables and approximation formula", Applied Optics 28:4735–4738, 1989.
// - Station pressure: p = 100 ((44331.514 − h)/11880.516)^(1/0.1902632) Pa — "A Quick Derivation relating
//   altitude to air pressure", Portland State Aerospace Society, v1.03, 2004 (formula from memory).
// - Clear sky: P. Ineichen & R. Perez, "A new airmass independent formulation for the Linke turbidity
//   coefficient", Solar Energy 73(3):151–157, 2002 (title from memory), with R. Perez et al., Solar Energy 73(5):307–317, 2002:
//     fh1 = exp(−h/8000), fh2 = exp(−h/1250), cg1 = 5.09e-5 h + 0.868, cg2 = 3.92e-5 h + 0.0387,
//     GHI = cg1 I0 cos z exp(−cg2 AM (fh1 + fh2 (TL − 1))),
//     DNI = min(I0 (0.664 + 0.163/fh1) exp(−0.09 AM (TL − 1)), GHI (1 − (0.1 − 0.2 e^−TL)/(0.1 + 0.882/fh1))/cos z),
//     DHI = GHI − DNI cos z.
// - ASHRAE clear-sky "tau" model — ASHRAE Handbook—Fundamentals, 2009 and later, ch. 14 (formula from memory):
//     Eb = E0 exp(−τb m^ab), Ed = E0 exp(−τd m^ad), ab = 1.454 − 0.406 τb − 0.268 τd + 0.021 τb τd,
//     ad = 0.507 + 0.205 τb − 0.080 τd − 0.190 τb τd, m = 1/[sin β + 0.50572 (6.07995 + β)^−1.6364],
//     E0 = 1367 [1 + 0.033 cos(360° (n − 3)/365)].
// - Angle of incidence: cos θ = cos z cos β + sin z sin β cos(γs − γ) — Duffie & Beckman, 4th ed., ch. 1 (from memory).
// - Transposition: beam DNI max(cos θ, 0); ground GHI ρg (1 − cos β)/2; isotropic sky DHI (1 + cos β)/2 —
//   B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960. Hay–Davies sky DHI [Ai Rb + (1 − Ai)(1 + cos β)/2],
//   Ai = DNI/E0, Rb = max(cos θ, 0)/max(cos z, 0.01745) — J. E. Hay & J. A. Davies, Proc. First Canadian Solar
//   Radiation Data Workshop, 1980, p. 59. Perez sky DHI [(1 − F1)(1 + cos β)/2 + F1 a/b + F2 sin β],
//   a = max(0, cos θ), b = max(cos 85°, cos z), ε = [(DHI + DNI)/DHI + κ z³]/(1 + κ z³), κ = 1.041 (z in rad),
//   Δ = DHI·AM/E0, bins at 1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2, F1 = max(0, f11 + f12 Δ + f13 z),
//   F2 = f21 + f22 Δ + f23 z, "all sites composite" coefficients — R. Perez, P. Ineichen, R. Seals, J. Michalsky &
//   R. Stewart, Solar Energy 44(5):271–289, 1990.
//
// Run: npx tsx scripts/reference/irradiance.ts
import { irradiance, type IrradianceInput, type TranspositionInput } from "@/lib/reference-cases/irradiance";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const SCRIPT = "scripts/reference/irradiance.ts";
const D2R = Math.PI / 180;
const cosd = (d: number) => Math.cos(d * D2R);
const sind = (d: number) => Math.sin(d * D2R);

export function spencerFactor(doy: number): number {
  const b = (2 * Math.PI * (doy - 1)) / 365;
  return 1.00011 + 0.034221 * Math.cos(b) + 0.00128 * Math.sin(b) + 0.000719 * Math.cos(2 * b) + 0.000077 * Math.sin(2 * b);
}
export const simpleFactor = (doy: number): number => 1 + 0.033 * Math.cos((2 * Math.PI * doy) / 365);
export const kastenYoung = (zDeg: number): number => 1 / (cosd(zDeg) + 0.50572 * (96.07995 - zDeg) ** -1.6364);
export const stationPressure = (h: number): number => 100 * ((44331.514 - h) / 11880.516) ** (1 / 0.1902632);

export function ineichenPerez(zDeg: number, amAbs: number, tl: number, h: number, i0: number): { ghi: number; dni: number; dhi: number } {
  const cz = cosd(zDeg);
  const fh1 = Math.exp(-h / 8000);
  const fh2 = Math.exp(-h / 1250);
  const cg1 = 5.09e-5 * h + 0.868;
  const cg2 = 3.92e-5 * h + 0.0387;
  const ghi = cg1 * i0 * cz * Math.exp(-cg2 * amAbs * (fh1 + fh2 * (tl - 1)));
  const b = 0.664 + 0.163 / fh1;
  const dniA = b * i0 * Math.exp(-0.09 * amAbs * (tl - 1));
  const dniB = (ghi * (1 - (0.1 - 0.2 * Math.exp(-tl)) / (0.1 + 0.882 / fh1))) / cz;
  const dni = Math.min(dniA, dniB);
  return { ghi, dni, dhi: ghi - dni * cz };
}

const PEREZ_EDGES = [1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2];
/** f11 f12 f13 f21 f22 f23 for bins 1…8, all sites composite (Perez et al. 1990). */
const PEREZ_COEFFS = [
  [-0.008, 0.588, -0.062, -0.06, 0.072, -0.022],
  [0.13, 0.683, -0.151, -0.019, 0.066, -0.029],
  [0.33, 0.487, -0.221, 0.055, -0.064, -0.026],
  [0.568, 0.187, -0.295, 0.109, -0.152, -0.014],
  [0.873, -0.392, -0.362, 0.226, -0.462, 0.001],
  [1.132, -1.237, -0.412, 0.288, -0.823, 0.056],
  [1.06, -1.6, -0.359, 0.264, -1.127, 0.131],
  [0.678, -0.327, -0.25, 0.156, -1.377, 0.251],
];

/** Every intermediate and total of one clear-sky hour transposed to a surface. */
export function transposition(i: TranspositionInput): Record<string, number> {
  const e0 = i.solarConstantWPerM2 * spencerFactor(i.dayOfYear);
  const am = kastenYoung(i.zenithDeg);
  const sky = ineichenPerez(i.zenithDeg, (am * i.pressurePa) / 101325, i.linkeTurbidity, i.elevationM, e0);
  const cz = cosd(i.zenithDeg);
  const ct = cz * cosd(i.surfaceTiltDeg) + sind(i.zenithDeg) * sind(i.surfaceTiltDeg) * cosd(i.sunAzimuthDeg - i.surfaceAzimuthDeg);
  const beam = sky.dni * Math.max(ct, 0);
  const ground = (sky.ghi * i.albedo * (1 - cosd(i.surfaceTiltDeg))) / 2;
  const viewSky = (1 + cosd(i.surfaceTiltDeg)) / 2;
  const skyIsotropic = sky.dhi * viewSky;
  const ai = sky.dni / e0;
  const rb = Math.max(ct, 0) / Math.max(cz, 0.01745);
  const skyHayDavies = sky.dhi * (ai * rb + (1 - ai) * viewSky);
  const z = i.zenithDeg * D2R;
  const kz3 = 1.041 * z ** 3;
  const epsilon = ((sky.dhi + sky.dni) / sky.dhi + kz3) / (1 + kz3);
  let bin = 1;
  for (const edge of PEREZ_EDGES) if (epsilon >= edge) bin++;
  const [f11, f12, f13, f21, f22, f23] = PEREZ_COEFFS[bin - 1]!;
  const delta = (sky.dhi * am) / e0;
  const f1 = Math.max(0, f11! + f12! * delta + f13! * z);
  const f2 = f21! + f22! * delta + f23! * z;
  const skyPerez = sky.dhi * ((1 - f1) * viewSky + (f1 * Math.max(0, ct)) / Math.max(cosd(85), cz) + f2 * sind(i.surfaceTiltDeg));
  const printedE0 = i.printedExtraterrestrialWPerM2 ?? e0;
  return {
    extraterrestrialWPerM2: e0,
    relativeAirMass: am,
    ghi: sky.ghi,
    dni: sky.dni,
    dhi: sky.dhi,
    thetaDeg: Math.acos(ct) / D2R,
    cosTheta: ct,
    beam,
    ground,
    skyIsotropic,
    anisotropyIndex: ai,
    beamRatio: rb,
    skyHayDavies,
    epsilon,
    bin,
    deltaWithPrintedE0: (sky.dhi * am) / printedE0,
    f1,
    f2,
    skyPerez,
    "total-isotropic": beam + skyIsotropic + ground,
    "total-hay-davies": beam + skyHayDavies + ground,
    "total-perez": beam + skyPerez + ground,
  };
}

/** Recomputes the expected values of one case from the formulas above. */
export function computeIrradiance(c: ReferenceCase<IrradianceInput>): Recomputed {
  const i = c.input;
  switch (i.kind) {
    case "extraterrestrial":
      return i.model === "spencer-1971"
        ? { factor: spencerFactor(i.dayOfYear), extraterrestrialWPerM2: i.solarConstantWPerM2 * spencerFactor(i.dayOfYear) }
        : { factor: simpleFactor(i.dayOfYear) };
    case "air-mass":
      return { relativeAirMass: kastenYoung(i.apparentZenithDeg), secantZenith: 1 / cosd(i.apparentZenithDeg) };
    case "pressure":
      return { pressurePa: stationPressure(i.elevationM) };
    case "ineichen-perez": {
      const am = kastenYoung(i.zenithDeg);
      const amAbs =
        i.airMassScaleHeightM !== undefined ? am * Math.exp(-i.elevationM / i.airMassScaleHeightM) : (am * (i.pressurePa ?? 101325)) / 101325;
      const r = ineichenPerez(i.zenithDeg, amAbs, i.linkeTurbidity, i.elevationM, i.extraterrestrialWPerM2);
      const given = ineichenPerez(i.zenithDeg, i.printedAirMassAbsolute ?? amAbs, i.linkeTurbidity, i.elevationM, i.extraterrestrialWPerM2);
      return { airMassAbsolute: amAbs, ...r, ghiFromPrintedAirMass: given.ghi, dniFromPrintedAirMass: given.dni };
    }
    case "ashrae-tau": {
      const e0 = 1367 * (1 + 0.033 * Math.cos((2 * Math.PI * (i.dayOfYear - 3)) / 365));
      const tb = i.tauBeam;
      const td = i.tauDiffuse;
      const ab = 1.454 - 0.406 * tb - 0.268 * td + 0.021 * tb * td;
      const ad = 0.507 + 0.205 * tb - 0.08 * td - 0.19 * tb * td;
      const out: Record<string, number> = { extraterrestrialWPerM2: e0, ab, ad };
      if (i.solarAltitudeDeg !== undefined) {
        const beta = i.solarAltitudeDeg;
        const m = 1 / (sind(beta) + 0.50572 * (6.07995 + beta) ** -1.6364);
        out.dni = e0 * Math.exp(-tb * m ** ab);
        out.dhi = e0 * Math.exp(-td * m ** ad);
      }
      return out;
    }
    case "transposition":
      return transposition(i);
    case "perez-table": {
      const row = PEREZ_COEFFS[i.bin - 1]!;
      return { f11: row[0]!, f12: row[1]!, f13: row[2]!, f21: row[3]!, f22: row[4]!, f23: row[5]! };
    }
  }
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const irradianceComparison = () => compareDomain(irradiance, SCRIPT, computeIrradiance, { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[irradiance.title, irradianceComparison]]);
