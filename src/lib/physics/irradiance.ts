/**
 * Solar irradiance for a site and its transposition onto a tilted or vertical surface.
 *
 * - Extraterrestrial normal irradiance E0 (Spencer 1971 series; the simple cosine form).
 * - Relative optical air mass (Kasten & Young 1989), absolute air mass, site pressure from
 *   elevation (standard-atmosphere barometric formula).
 * - Clear-sky irradiance: Ineichen & Perez (2002) with Linke turbidity; ASHRAE "tau" model.
 * - Transposition: beam, ground-reflected, and sky diffuse by the isotropic (Liu & Jordan 1960),
 *   Hay & Davies (1980) and Perez et al. (1990) models.
 *
 * Units: irradiance in W/m² throughout (names end in WPerM2, or the unit is stated in the
 * type); angles in radians except where a published formula is written in degrees (air mass),
 * which is said in the function name (…Deg).
 *
 * Hot path. The hourly schedule evaluates many surfaces for each site-hour, so each
 * transposition model is split in two:
 *  1. per site-hour (once per hour, any trig/exp allowed): {@link haydaviesSkyCoefficients},
 *     {@link perezSkyCoefficients} → a few W/m² coefficients;
 *  2. per surface (once): {@link prepareTranspositionSurface} → view factors and sin β;
 *  3. per surface-hour: {@link skyDiffuseFromCoefficients}, {@link beamOnSurface},
 *     {@link groundReflectedOnSurface}: multiplications, additions and a max, nothing else.
 * For every model the sky diffuse on the surface has the same shape:
 *   I_sky = isotropic·(1 + cos β)/2 + circumsolarPerCos·max(cos θ, 0) + horizon·sin β,
 * clamped at ≥ 0 (only Perez can go negative, through F2 < 0), which is what lets one
 * per-surface-hour function serve all three models and lets shading factors be applied per
 * component (isotropic, circumsolar, horizon band).
 */
import type { Radians } from "./units";

// ---------------------------------------------------------------------------------------------
// Small checks (construction-time validation; RangeError naming the quantity)

function checkRange(x: number, quantity: string, min: number, max: number, unit = ""): void {
  if (!Number.isFinite(x) || x < min || x > max) {
    throw new RangeError(`${quantity} must be a finite number in [${min}, ${max}]${unit}; got ${x}`);
  }
}

function checkNonNegative(x: number, quantity: string, unit = ""): void {
  if (!Number.isFinite(x) || x < 0) throw new RangeError(`${quantity} must be a finite number ≥ 0${unit}; got ${x}`);
}

function checkPositive(x: number, quantity: string, unit = ""): void {
  if (!Number.isFinite(x) || x <= 0) throw new RangeError(`${quantity} must be a finite number > 0${unit}; got ${x}`);
}

const DEG = Math.PI / 180;

// ---------------------------------------------------------------------------------------------
// Extraterrestrial irradiance

/** Solar constant used by pvlib's `get_extra_radiation` by default [W/m²]. */
export const SOLAR_CONSTANT_W_PER_M2 = 1366.1;

function checkDayOfYear(dayOfYear: number): void {
  checkRange(dayOfYear, "day of year", 1, 366.999999);
}

/**
 * Earth–Sun distance factor (R_av/R)² by Spencer's Fourier series, with B = 2π(doy − 1)/365:
 *   E0/Esc = 1.00011 + 0.034221 cos B + 0.00128 sin B + 0.000719 cos 2B + 0.000077 sin 2B
 * @param dayOfYear day of the year, 1 = 1 January, real values allowed, [1, 367)
 * @returns the factor [-] (≈ 0.967 … 1.035)
 * @throws RangeError naming "day of year"
 * @see J. W. Spencer, "Fourier series representation of the position of the sun", Search 2(5):172,
 *   1971 (from memory); pvlib-python `irradiance.get_extra_radiation(method='spencer')`
 */
export function extraterrestrialFactorSpencer1971(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  const b = (2 * Math.PI * (dayOfYear - 1)) / 365;
  return (
    1.00011 + 0.034221 * Math.cos(b) + 0.00128 * Math.sin(b) + 0.000719 * Math.cos(2 * b) + 0.000077 * Math.sin(2 * b)
  );
}

/**
 * Extraterrestrial normal irradiance E0 = Esc · (Spencer factor) [W/m²].
 * @param dayOfYear day of the year, [1, 367)
 * @param solarConstantWPerM2 Esc [W/m²], default 1366.1 (pvlib's default; 1361 per
 *   Kopp & Lean, GRL 38 L01706, 2011, from memory; 1367 in older work)
 * @throws RangeError naming "day of year" or "solar constant"
 */
export function extraterrestrialIrradianceSpencer1971(
  dayOfYear: number,
  solarConstantWPerM2: number = SOLAR_CONSTANT_W_PER_M2,
): number {
  checkRange(solarConstantWPerM2, "solar constant", 1000, 2000, " W/m²");
  return solarConstantWPerM2 * extraterrestrialFactorSpencer1971(dayOfYear);
}

/**
 * Simple Earth–Sun distance factor: E0/Esc = 1 + 0.033 cos(2π·doy/365).
 * @param dayOfYear [1, 367) @returns factor [-]
 * @see Duffie & Beckman, Solar Engineering of Thermal Processes, 4th ed., eq. 1.4.1a (from memory)
 */
export function extraterrestrialFactorSimple(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  return 1 + 0.033 * Math.cos((2 * Math.PI * dayOfYear) / 365);
}

// ---------------------------------------------------------------------------------------------
// Air mass and pressure

/** Standard sea-level pressure [Pa]. */
export const STANDARD_PRESSURE_PA = 101325;

/**
 * Relative optical air mass, Kasten & Young (1989), valid up to the horizon:
 *   AM = 1 / [cos z + 0.50572 (96.07995 − z)^(−1.6364)],  z = apparent zenith in DEGREES
 * (the formula's constants are in degrees, hence the degree argument). Note AM(0) = 0.999712,
 * not 1; AM(90°) = 37.92 (sec z would be infinite).
 * @param apparentZenithDeg refraction-corrected zenith angle [deg], in [0, 90]
 * @returns AM [-]
 * @throws RangeError naming "apparent zenith" (sun below the horizon: the model is not defined)
 * @see F. Kasten & A. T. Young, "Revised optical air mass tables and approximation formula",
 *   Applied Optics 28(22):4735–4738, 1989; pvlib-python `atmosphere.get_relative_airmass`
 *   (default model 'kastenyoung1989')
 */
export function relativeAirMassKastenYoung1989(apparentZenithDeg: number): number {
  checkRange(apparentZenithDeg, "apparent zenith", 0, 90, "°");
  return 1 / (Math.cos(apparentZenithDeg * DEG) + 0.50572 * Math.pow(96.07995 - apparentZenithDeg, -1.6364));
}

/**
 * Absolute (pressure-corrected) air mass: AM_abs = AM · p / 101325 Pa.
 * @param relativeAirMass AM [-], > 0
 * @param pressurePa site pressure [Pa], > 0
 * @throws RangeError naming "relative air mass" or "pressure"
 * @see pvlib-python `atmosphere.get_absolute_airmass`
 */
export function absoluteAirMass(relativeAirMass: number, pressurePa: number = STANDARD_PRESSURE_PA): number {
  checkPositive(relativeAirMass, "relative air mass");
  checkPositive(pressurePa, "pressure", " Pa");
  return (relativeAirMass * pressurePa) / STANDARD_PRESSURE_PA;
}

/**
 * Site pressure from elevation by the barometric formula of the standard troposphere
 * (base 101325 Pa, 288.15 K at sea level, lapse rate 6.5 K/km, g = 9.80665 m/s², dry air):
 *   p = 100 · ((44331.514 − h) / 11880.516)^(1/0.1902632)  [Pa],  h in m
 * (gives 101325.0 Pa at h = 0 and 89874.8 Pa at 1000 m).
 * @param elevationM site elevation above sea level [m], in [−500, 11000] (troposphere)
 * @returns pressure [Pa]
 * @throws RangeError naming "elevation"
 * @see pvlib-python `atmosphere.alt2pres` (formula and assumptions as documented there, citing
 *   "A Quick Derivation relating altitude to air pressure", Portland State Aerospace Society,
 *   v1.03, 2004)
 */
export function pressureFromElevation(elevationM: number): number {
  checkRange(elevationM, "elevation", -500, 11000, " m");
  return 100 * Math.pow((44331.514 - elevationM) / 11880.516, 1 / 0.1902632);
}

// ---------------------------------------------------------------------------------------------
// Clear sky

/** Global, direct normal and diffuse horizontal irradiance, all in W/m². */
export interface HorizontalIrradiance {
  /** Global horizontal irradiance [W/m²]. */
  readonly ghi: number;
  /** Direct normal irradiance [W/m²]. */
  readonly dni: number;
  /** Diffuse horizontal irradiance [W/m²]. */
  readonly dhi: number;
}

/** Inputs of the Ineichen–Perez clear-sky model. */
export interface IneichenPerezInput {
  /** cos of the apparent solar zenith [-]; ≤ 0 (sun at or below the horizon) gives zero irradiance. */
  readonly cosZenith: number;
  /** Absolute (pressure-corrected) air mass [-]; ignored (may be NaN) when cosZenith ≤ 0. */
  readonly airMassAbsolute: number;
  /** Linke turbidity TL [-] (air mass 2 convention), typically 2…7. */
  readonly linkeTurbidity: number;
  /** Site elevation h [m]. */
  readonly elevationM: number;
  /** Extraterrestrial normal irradiance I0 [W/m²]. */
  readonly extraterrestrialWPerM2: number;
  /** Multiply GHI by exp(0.01·AM_abs^1.8) (default false, as pvlib: it misbehaves at high air mass). */
  readonly perezEnhancement?: boolean;
}

/**
 * Ineichen–Perez clear-sky model:
 *   fh1 = exp(−h/8000), fh2 = exp(−h/1250), cg1 = 5.09e-5 h + 0.868, cg2 = 3.92e-5 h + 0.0387
 *   GHI = cg1 I0 cos z exp(−cg2 AM (fh1 + fh2 (TL − 1)))  [· exp(0.01 AM^1.8) if enhanced]
 *   DNI = min( I0 (0.664 + 0.163/fh1) exp(−0.09 AM (TL − 1)),
 *              GHI (1 − (0.1 − 0.2 e^(−TL)) / (0.1 + 0.882/fh1)) / cos z )
 *   DHI = GHI − DNI cos z,                 AM = absolute air mass, all irradiances W/m².
 * The optional enhancement factor exp(0.01 AM^1.8) appears in the 2002 paper; it is off by
 * default, as in pvlib, because it makes GHI grow again at very high air mass (pvlib issue 435).
 * Negative intermediate factors are clamped at 0 as in pvlib.
 * @returns { ghi, dni, dhi } [W/m²]; all 0 when cosZenith ≤ 0
 * @throws RangeError naming the offending input
 * @see P. Ineichen & R. Perez, "A new airmass independent formulation for the Linke turbidity
 *   coefficient", Solar Energy 73(3):151–157, 2002; R. Perez et al., Solar Energy 73(5):307–317,
 *   2002; pvlib-python `clearsky.ineichen`
 */
export function clearSkyIneichenPerez2002(input: IneichenPerezInput): HorizontalIrradiance {
  const { cosZenith, airMassAbsolute, linkeTurbidity: tl, elevationM: h, extraterrestrialWPerM2: i0 } = input;
  checkRange(cosZenith, "cos zenith", -1, 1);
  checkRange(tl, "Linke turbidity", 1, 15);
  checkRange(h, "elevation", -500, 9000, " m");
  checkRange(i0, "extraterrestrial irradiance", 1000, 2000, " W/m²");
  if (cosZenith <= 0) return { ghi: 0, dni: 0, dhi: 0 };
  checkPositive(airMassAbsolute, "absolute air mass");
  const am = airMassAbsolute;
  const fh1 = Math.exp(-h / 8000);
  const fh2 = Math.exp(-h / 1250);
  const cg1 = 5.09e-5 * h + 0.868;
  const cg2 = 3.92e-5 * h + 0.0387;
  let g = Math.exp(-cg2 * am * (fh1 + fh2 * (tl - 1)));
  if (input.perezEnhancement === true) g *= Math.exp(0.01 * Math.pow(am, 1.8));
  const ghi = cg1 * i0 * cosZenith * Math.max(g, 0);
  const b = 0.664 + 0.163 / fh1;
  const bnci = i0 * Math.max(b * Math.exp(-0.09 * am * (tl - 1)), 0);
  const bnci2 = ghi * Math.max((1 - (0.1 - 0.2 * Math.exp(-tl)) / (0.1 + 0.882 / fh1)) / cosZenith, 0);
  const dni = Math.min(bnci, bnci2);
  return { ghi, dni, dhi: ghi - dni * cosZenith };
}

/**
 * Default monthly Linke turbidity TL (January … December) for a generic mid-latitude site:
 * clearer in winter, hazier in summer. These are common practice, no source: a placeholder
 * that the user should replace with site values. The proper source per site is the monthly
 * climatology of J. Remund, L. Wald, M. Lefèvre, T. Ranchin & J. Page, "Worldwide Linke
 * turbidity information", Proc. ISES Solar World Congress, Göteborg, 2003 (from memory).
 */
export const DEFAULT_MONTHLY_LINKE_TURBIDITY: readonly number[] = Object.freeze([
  3.0, 3.2, 3.5, 3.8, 4.0, 4.2, 4.2, 4.1, 3.8, 3.4, 3.1, 3.0,
]);

/**
 * Extraterrestrial normal irradiance as used with the ASHRAE clear-sky model:
 *   E0 = 1367 [1 + 0.033 cos(2π (n − 3)/365)]  [W/m²]
 * @param dayOfYear n, [1, 367)
 * @see ASHRAE Handbook—Fundamentals (2009 and later), ch. 14 "Climatic design information",
 *   clear-sky model (formula from memory; verify)
 */
export function extraterrestrialIrradianceAshrae2009(dayOfYear: number): number {
  checkDayOfYear(dayOfYear);
  return 1367 * (1 + 0.033 * Math.cos((2 * Math.PI * (dayOfYear - 3)) / 365));
}

/** Inputs of the ASHRAE "tau" clear-sky model. */
export interface AshraeTauInput {
  /** Relative air mass m [-]; the Handbook uses Kasten–Young (= relativeAirMassKastenYoung1989(90° − β)). */
  readonly airMass: number;
  /** Extraterrestrial normal irradiance E0 [W/m²]. */
  readonly extraterrestrialWPerM2: number;
  /** Site-month beam pseudo-optical depth τb [-] (Handbook climatic tables). */
  readonly tauBeam: number;
  /** Site-month diffuse pseudo-optical depth τd [-]. */
  readonly tauDiffuse: number;
}

/**
 * ASHRAE clear-sky ("tau") model:
 *   Eb = E0 exp(−τb m^ab),  Ed = E0 exp(−τd m^ad)
 *   ab = 1.454 − 0.406 τb − 0.268 τd + 0.021 τb τd
 *   ad = 0.507 + 0.205 τb − 0.080 τd − 0.190 τb τd
 * Eb is the beam normal (DNI), Ed the diffuse horizontal (DHI) irradiance [W/m²].
 * @returns { dniWPerM2: Eb, dhiWPerM2: Ed, ab, ad }
 * @throws RangeError naming the offending input
 * @see ASHRAE Handbook—Fundamentals (2009 and later), ch. 14 (formula from memory; verify)
 */
export function clearSkyAshraeTau2009(input: AshraeTauInput): {
  readonly dniWPerM2: number;
  readonly dhiWPerM2: number;
  readonly ab: number;
  readonly ad: number;
} {
  const { airMass: m, extraterrestrialWPerM2: e0, tauBeam: tb, tauDiffuse: td } = input;
  checkPositive(m, "air mass");
  checkRange(e0, "extraterrestrial irradiance", 1000, 2000, " W/m²");
  checkRange(tb, "beam optical depth τb", 0.1, 2);
  checkRange(td, "diffuse optical depth τd", 0.5, 5);
  const ab = 1.454 - 0.406 * tb - 0.268 * td + 0.021 * tb * td;
  const ad = 0.507 + 0.205 * tb - 0.08 * td - 0.19 * tb * td;
  return {
    dniWPerM2: e0 * Math.exp(-tb * Math.pow(m, ab)),
    dhiWPerM2: e0 * Math.exp(-td * Math.pow(m, ad)),
    ab,
    ad,
  };
}

// ---------------------------------------------------------------------------------------------
// Transposition: per-surface constants

/** Default ground albedo ρ_g [-] (common practice for grass/soil/concrete mix; no source). */
export const DEFAULT_GROUND_ALBEDO = 0.2;

/** Per-surface constants for transposition (compute once per surface). */
export interface TranspositionSurface {
  /** Tilt β [rad]. */
  readonly tiltRad: Radians;
  /** View factor of the surface to the sky dome, (1 + cos β)/2 [-]. */
  readonly skyViewFactor: number;
  /** View factor to the ground, (1 − cos β)/2 [-]. */
  readonly groundViewFactor: number;
  /** sin β [-] (weight of the Perez horizon band). */
  readonly sinTilt: number;
  /** Ground albedo ρ_g [-]. */
  readonly albedo: number;
  /** ρ_g (1 − cos β)/2 [-]: multiply by GHI to get the ground-reflected irradiance. */
  readonly groundFactor: number;
}

/**
 * Per-surface transposition constants: (1 + cos β)/2, (1 − cos β)/2, sin β, ρ_g (1 − cos β)/2.
 * cos β and sin β within 1e-15 of 0 or 1 are snapped (so β = 90° gives exactly 1/2 and 1).
 * @param tiltRad β [rad], in [0, π]
 * @param albedo ground albedo ρ_g [-], in [0, 1], default 0.2
 * @throws RangeError naming "surface tilt" or "ground albedo"
 * @see B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960 (isotropic view factors)
 */
export function prepareTranspositionSurface(tiltRad: number, albedo: number = DEFAULT_GROUND_ALBEDO): TranspositionSurface {
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  checkRange(albedo, "ground albedo", 0, 1);
  let cb = Math.cos(tiltRad);
  let sb = Math.sin(tiltRad);
  if (Math.abs(cb) < 1e-15) cb = 0;
  if (Math.abs(sb) < 1e-15) sb = 0;
  if (Math.abs(1 - sb) < 1e-15) sb = 1;
  return Object.freeze({
    tiltRad: tiltRad as Radians,
    skyViewFactor: (1 + cb) / 2,
    groundViewFactor: (1 - cb) / 2,
    sinTilt: sb,
    albedo,
    groundFactor: (albedo * (1 - cb)) / 2,
  });
}

// ---------------------------------------------------------------------------------------------
// Transposition: per-surface-hour (hot path, no checks)

/**
 * Beam irradiance on the surface: DNI · max(cos θ, 0) [W/m²]. Hot path, no checks. The caller
 * passes DNI = 0 when the sun is below the horizon.
 * @param dniWPerM2 direct normal irradiance [W/m²]; @param cosTheta cos of the angle of incidence [-]
 */
export function beamOnSurface(dniWPerM2: number, cosTheta: number): number {
  return cosTheta > 0 ? dniWPerM2 * cosTheta : 0;
}

/**
 * Ground-reflected irradiance on the surface, isotropic ground: GHI · ρ_g (1 − cos β)/2 [W/m²].
 * Hot path, no checks.
 * @see Liu & Jordan 1960; pvlib-python `irradiance.get_ground_diffuse`
 */
export function groundReflectedOnSurface(ghiWPerM2: number, surface: TranspositionSurface): number {
  return ghiWPerM2 * surface.groundFactor;
}

/**
 * Per-site-hour coefficients of a sky-diffuse model, all in W/m², such that
 *   I_sky = max(0, isotropicWPerM2·(1 + cos β)/2 + circumsolarPerCos·max(cos θ, 0) + horizonWPerM2·sin β).
 */
export interface SkyDiffuseCoefficients {
  /** Weight of the isotropic dome [W/m²]. */
  isotropicWPerM2: number;
  /** Circumsolar irradiance per unit max(cos θ, 0) [W/m²]. */
  circumsolarPerCos: number;
  /** Horizon band irradiance per unit sin β [W/m²] (Perez only; 0 otherwise). */
  horizonWPerM2: number;
}

/** A mutable, zeroed coefficients record (reuse it as `out` to avoid one allocation per hour). */
export function emptySkyCoefficients(): SkyDiffuseCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0 };
}

/**
 * Sky diffuse irradiance on the surface from per-hour coefficients and per-surface constants:
 *   I_sky = max(0, iso·(1 + cos β)/2 + cs·max(cos θ, 0) + hz·sin β)  [W/m²]
 * Hot path: 3 multiplications, 2 additions, 2 comparisons; no checks, no allocation.
 * @param c per-site-hour coefficients; @param surface per-surface constants
 * @param cosTheta cos θ for this surface and hour [-]
 */
export function skyDiffuseFromCoefficients(c: SkyDiffuseCoefficients, surface: TranspositionSurface, cosTheta: number): number {
  const a = cosTheta > 0 ? cosTheta : 0;
  const sky = c.isotropicWPerM2 * surface.skyViewFactor + c.circumsolarPerCos * a + c.horizonWPerM2 * surface.sinTilt;
  return sky > 0 ? sky : 0;
}

// ---------------------------------------------------------------------------------------------
// Sky-diffuse models: scalar forms and per-site-hour coefficients

/**
 * Isotropic sky (Liu & Jordan): I_sky = DHI (1 + cos β)/2 [W/m²].
 * @param dhiWPerM2 DHI [W/m²], ≥ 0; @param tiltRad β [rad], [0, π]
 * @throws RangeError naming "DHI" or "surface tilt"
 * @see B. Y. H. Liu & R. C. Jordan, Solar Energy 4:1–19, 1960; pvlib-python `irradiance.isotropic`
 */
export function isotropicSkyDiffuse(dhiWPerM2: number, tiltRad: number): number {
  checkNonNegative(dhiWPerM2, "DHI", " W/m²");
  return dhiWPerM2 * prepareTranspositionSurface(tiltRad).skyViewFactor;
}

/**
 * Ground-reflected irradiance (isotropic ground): GHI ρ_g (1 − cos β)/2 [W/m²].
 * @param ghiWPerM2 GHI [W/m²], ≥ 0; @param tiltRad β [rad]; @param albedo ρ_g [-], default 0.2
 * @throws RangeError naming "GHI", "surface tilt" or "ground albedo"
 * @see pvlib-python `irradiance.get_ground_diffuse`
 */
export function groundReflected(ghiWPerM2: number, tiltRad: number, albedo: number = DEFAULT_GROUND_ALBEDO): number {
  checkNonNegative(ghiWPerM2, "GHI", " W/m²");
  return groundReflectedOnSurface(ghiWPerM2, prepareTranspositionSurface(tiltRad, albedo));
}

/** Per-site-hour sky and sun quantities shared by the anisotropic models. */
export interface SkyHourInput {
  /** Diffuse horizontal irradiance [W/m²], ≥ 0. */
  readonly dhiWPerM2: number;
  /** Direct normal irradiance [W/m²], ≥ 0. */
  readonly dniWPerM2: number;
  /** Extraterrestrial normal irradiance E0 [W/m²]. */
  readonly extraterrestrialWPerM2: number;
  /** Solar zenith z [rad] (apparent), in [0, π]. */
  readonly zenithRad: number;
}

function checkSkyHour(h: SkyHourInput): void {
  checkNonNegative(h.dhiWPerM2, "DHI", " W/m²");
  checkNonNegative(h.dniWPerM2, "DNI", " W/m²");
  checkRange(h.extraterrestrialWPerM2, "extraterrestrial irradiance", 1000, 2000, " W/m²");
  checkRange(h.zenithRad, "solar zenith", 0, Math.PI, " rad");
}

/** Lower bound of cos z in the Hay–Davies beam ratio Rb (= cos 88.9997°; value as in pvlib). */
export const HAYDAVIES_MIN_COS_ZENITH = 0.01745;

/** Hay & Davies coefficients of one site-hour, with the anisotropy index. */
export interface HaydaviesCoefficients extends SkyDiffuseCoefficients {
  /** Anisotropy index Ai = DNI/E0 [-]. */
  anisotropyIndex: number;
}

/** A mutable, zeroed Hay & Davies record (reuse it as `out`). */
export function emptyHaydaviesCoefficients(): HaydaviesCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0, anisotropyIndex: 0 };
}

/**
 * Hay & Davies per-site-hour coefficients. With anisotropy index Ai = DNI/E0 and
 * Rb = max(cos θ, 0)/max(cos z, 0.01745):
 *   I_sky = DHI [Ai Rb + (1 − Ai)(1 + cos β)/2]
 * so isotropic = DHI (1 − Ai), circumsolarPerCos = DHI Ai / max(cos z, 0.01745), horizon = 0.
 * @param out optional record to fill (no allocation then)
 * @returns the coefficients and Ai [-]
 * @throws RangeError naming the offending input
 * @see J. E. Hay & J. A. Davies, "Calculation of the solar radiation incident on an inclined
 *   surface", Proc. First Canadian Solar Radiation Data Workshop, 1980, p. 59;
 *   pvlib-python `irradiance.haydavies`
 */
export function haydaviesSkyCoefficients(
  hour: SkyHourInput,
  out: HaydaviesCoefficients = emptyHaydaviesCoefficients(),
): HaydaviesCoefficients {
  checkSkyHour(hour);
  const ai = hour.dniWPerM2 / hour.extraterrestrialWPerM2;
  const cz = Math.max(Math.cos(hour.zenithRad), HAYDAVIES_MIN_COS_ZENITH);
  out.isotropicWPerM2 = hour.dhiWPerM2 * (1 - ai);
  out.circumsolarPerCos = (hour.dhiWPerM2 * ai) / cz;
  out.horizonWPerM2 = 0;
  out.anisotropyIndex = ai;
  return out;
}

/**
 * Hay & Davies beam ratio Rb = max(cos θ, 0) / max(cos z, 0.01745) [-].
 * @see pvlib-python `irradiance.haydavies`
 */
export function haydaviesBeamRatio(cosTheta: number, zenithRad: number): number {
  return Math.max(cosTheta, 0) / Math.max(Math.cos(zenithRad), HAYDAVIES_MIN_COS_ZENITH);
}

/**
 * Hay & Davies sky diffuse on a surface (scalar form) [W/m²]:
 *   I_sky = DHI [Ai Rb + (1 − Ai)(1 + cos β)/2],  Ai = DNI/E0, Rb = max(cos θ,0)/max(cos z, 0.01745)
 * @param cosTheta cos of the angle of incidence on the surface [-]
 * @throws RangeError naming the offending input
 * @see Hay & Davies 1980; pvlib-python `irradiance.haydavies`
 */
export function haydaviesSkyDiffuse(hour: SkyHourInput, tiltRad: number, cosTheta: number): number {
  checkSkyHour(hour);
  checkRange(cosTheta, "cos incidence", -1, 1);
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  const ai = hour.dniWPerM2 / hour.extraterrestrialWPerM2;
  const rb = haydaviesBeamRatio(cosTheta, hour.zenithRad);
  return Math.max(0, hour.dhiWPerM2 * (ai * rb + ((1 - ai) * (1 + Math.cos(tiltRad))) / 2));
}

/** Upper edges of Perez sky-clearness bins 1…7 (bin 8: ε ≥ 6.2). */
export const PEREZ_EPSILON_BIN_EDGES: readonly number[] = Object.freeze([1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2]);

/**
 * Perez et al. (1990) "all sites composite" coefficients, one row per clearness bin 1…8:
 * [f11, f12, f13, f21, f22, f23]. Copied from the published table as reproduced in pvlib's
 * `_get_perez_coefficients('allsitescomposite1990')`.
 * @see R. Perez, P. Ineichen, R. Seals, J. Michalsky & R. Stewart, "Modeling daylight
 *   availability and irradiance components from direct and global irradiance", Solar Energy
 *   44(5):271–289, 1990, table of coefficients
 */
export const PEREZ_1990_ALL_SITES_COMPOSITE: readonly (readonly number[])[] = Object.freeze([
  Object.freeze([-0.008, 0.588, -0.062, -0.06, 0.072, -0.022]),
  Object.freeze([0.13, 0.683, -0.151, -0.019, 0.066, -0.029]),
  Object.freeze([0.33, 0.487, -0.221, 0.055, -0.064, -0.026]),
  Object.freeze([0.568, 0.187, -0.295, 0.109, -0.152, -0.014]),
  Object.freeze([0.873, -0.392, -0.362, 0.226, -0.462, 0.001]),
  Object.freeze([1.132, -1.237, -0.412, 0.288, -0.823, 0.056]),
  Object.freeze([1.06, -1.6, -0.359, 0.264, -1.127, 0.131]),
  Object.freeze([0.678, -0.327, -0.25, 0.156, -1.377, 0.251]),
]);

/** Perez κ for the zenith in radians. */
export const PEREZ_KAPPA = 1.041;

/** Perez coefficients of one site-hour, with the model's intermediate quantities. */
export interface PerezCoefficients extends SkyDiffuseCoefficients {
  /** Sky clearness ε [-] (NaN when DHI = 0). */
  epsilon: number;
  /** Clearness bin 1…8 (0 when DHI = 0: the model is not evaluated). */
  bin: number;
  /** Sky brightness Δ = DHI·AM/E0 [-] (AM relative). */
  delta: number;
  /** Circumsolar brightening coefficient F1 ≥ 0 [-]. */
  f1: number;
  /** Horizon brightening coefficient F2 [-] (may be negative). */
  f2: number;
  /** b = max(cos 85°, cos z) [-]. */
  b: number;
}

/** A mutable, zeroed Perez record (reuse it as `out`). */
export function emptyPerezCoefficients(): PerezCoefficients {
  return { isotropicWPerM2: 0, circumsolarPerCos: 0, horizonWPerM2: 0, epsilon: 0, bin: 0, delta: 0, f1: 0, f2: 0, b: 0 };
}

const COS_85 = Math.cos(85 * DEG);

/**
 * Perez 1990 per-site-hour coefficients (all-sites-composite table):
 *   ε = [(DHI + DNI)/DHI + κ z³]/(1 + κ z³),  κ = 1.041, z in radians
 *   Δ = DHI · AM / E0  (AM = relative air mass)
 *   bin by ε at 1.065, 1.23, 1.5, 1.95, 2.8, 4.5, 6.2 → 1…8 (edge values go to the upper bin)
 *   F1 = max(0, f11 + f12 Δ + f13 z),  F2 = f21 + f22 Δ + f23 z
 *   I_sky = DHI [(1 − F1)(1 + cos β)/2 + F1 a/b + F2 sin β],  a = max(0, cos θ), b = max(cos 85°, cos z)
 * so isotropic = DHI (1 − F1), circumsolarPerCos = DHI F1 / b, horizon = DHI F2.
 * DHI = 0 gives all coefficients 0 (ε undefined). The model is defined for the sun above the
 * horizon; for z ≥ 90° (twilight with DHI > 0) pass AM = AM(90°) = 37.92, as pvlib's continuous
 * Perez variant does.
 * @param hour DHI, DNI, E0, z; @param relativeAirMass AM [-], > 0 (Kasten–Young, as in the model's development)
 * @param out optional record to fill (no allocation then)
 * @returns the coefficients and the intermediate values ε, bin, Δ, F1, F2, b
 * @throws RangeError naming the offending input
 * @see Perez et al., Solar Energy 44(5):271–289, 1990; pvlib-python `irradiance.perez`
 */
export function perezSkyCoefficients(
  hour: SkyHourInput,
  relativeAirMass: number,
  out: PerezCoefficients = emptyPerezCoefficients(),
): PerezCoefficients {
  checkSkyHour(hour);
  checkPositive(relativeAirMass, "relative air mass");
  const { dhiWPerM2: dhi, dniWPerM2: dni, extraterrestrialWPerM2: e0, zenithRad: z } = hour;
  const b = Math.max(COS_85, Math.cos(z));
  out.b = b;
  if (dhi === 0) {
    out.isotropicWPerM2 = 0;
    out.circumsolarPerCos = 0;
    out.horizonWPerM2 = 0;
    out.epsilon = Number.NaN;
    out.bin = 0;
    out.delta = 0;
    out.f1 = 0;
    out.f2 = 0;
    return out;
  }
  const kz3 = PEREZ_KAPPA * z * z * z;
  const epsilon = ((dhi + dni) / dhi + kz3) / (1 + kz3);
  let bin = 1;
  for (const edge of PEREZ_EPSILON_BIN_EDGES) if (epsilon >= edge) bin++;
  const row = PEREZ_1990_ALL_SITES_COMPOSITE[bin - 1]!;
  const delta = (dhi * relativeAirMass) / e0;
  const f1 = Math.max(0, row[0]! + row[1]! * delta + row[2]! * z);
  const f2 = row[3]! + row[4]! * delta + row[5]! * z;
  out.isotropicWPerM2 = dhi * (1 - f1);
  out.circumsolarPerCos = (dhi * f1) / b;
  out.horizonWPerM2 = dhi * f2;
  out.epsilon = epsilon;
  out.bin = bin;
  out.delta = delta;
  out.f1 = f1;
  out.f2 = f2;
  return out;
}

/**
 * Perez 1990 sky diffuse on a surface (scalar form, the printed formula) [W/m²], clamped at ≥ 0 as in pvlib:
 *   I_sky = max(0, DHI [(1 − F1)(1 + cos β)/2 + F1 a/b + F2 sin β])
 * @param cosTheta cos of the angle of incidence [-]
 * @throws RangeError naming the offending input
 * @see Perez et al. 1990; pvlib-python `irradiance.perez`
 */
export function perezSkyDiffuse(hour: SkyHourInput, relativeAirMass: number, tiltRad: number, cosTheta: number): number {
  checkRange(cosTheta, "cos incidence", -1, 1);
  checkRange(tiltRad, "surface tilt", 0, Math.PI, " rad");
  const { f1, f2, b } = perezSkyCoefficients(hour, relativeAirMass);
  const a = Math.max(0, cosTheta);
  const term1 = ((1 - f1) * (1 + Math.cos(tiltRad))) / 2;
  return Math.max(0, hour.dhiWPerM2 * (term1 + (f1 * a) / b + f2 * Math.sin(tiltRad)));
}

// ---------------------------------------------------------------------------------------------
// Totals

/** Sky-diffuse model names. */
export type SkyDiffuseModel = "isotropic" | "haydavies" | "perez";

/** Inputs of {@link tiltedSurfaceIrradiance}. */
export interface TiltedSurfaceInput extends SkyHourInput {
  readonly ghiWPerM2: number;
  /** Relative air mass (Perez only). */
  readonly relativeAirMass?: number;
  readonly tiltRad: number;
  /** cos θ on the surface [-]. */
  readonly cosTheta: number;
  /** Ground albedo [-], default 0.2. */
  readonly albedo?: number;
  readonly model: SkyDiffuseModel;
}

/** Irradiance components on a surface [W/m²]. */
export interface TiltedSurfaceIrradiance {
  readonly beamWPerM2: number;
  readonly skyDiffuseWPerM2: number;
  readonly groundWPerM2: number;
  readonly totalWPerM2: number;
}

/**
 * Total irradiance on a tilted surface (scalar form):
 *   I = DNI·max(cos θ, 0) + I_sky(model) + GHI ρ_g (1 − cos β)/2   [W/m²]
 * @throws RangeError naming the offending input (Perez without a relative air mass included)
 * @see pvlib-python `irradiance.get_total_irradiance` (same composition)
 */
export function tiltedSurfaceIrradiance(input: TiltedSurfaceInput): TiltedSurfaceIrradiance {
  checkSkyHour(input);
  checkNonNegative(input.ghiWPerM2, "GHI", " W/m²");
  checkRange(input.cosTheta, "cos incidence", -1, 1);
  const surface = prepareTranspositionSurface(input.tiltRad, input.albedo ?? DEFAULT_GROUND_ALBEDO);
  let coefficients: SkyDiffuseCoefficients;
  if (input.model === "isotropic") {
    coefficients = { isotropicWPerM2: input.dhiWPerM2, circumsolarPerCos: 0, horizonWPerM2: 0 };
  } else if (input.model === "haydavies") {
    coefficients = haydaviesSkyCoefficients(input);
  } else if (input.model === "perez") {
    if (input.relativeAirMass === undefined) throw new RangeError("relative air mass is required by the Perez model");
    coefficients = perezSkyCoefficients(input, input.relativeAirMass);
  } else {
    throw new RangeError(`sky diffuse model must be isotropic, haydavies or perez; got ${String(input.model)}`);
  }
  const beamWPerM2 = beamOnSurface(input.dniWPerM2, input.cosTheta);
  const skyDiffuseWPerM2 = skyDiffuseFromCoefficients(coefficients, surface, input.cosTheta);
  const groundWPerM2 = groundReflectedOnSurface(input.ghiWPerM2, surface);
  return { beamWPerM2, skyDiffuseWPerM2, groundWPerM2, totalWPerM2: beamWPerM2 + skyDiffuseWPerM2 + groundWPerM2 };
}
