/**
 * Clear-sky global, direct normal and diffuse horizontal irradiance by Ineichen & Perez (2002)
 * with the Linke turbidity, and a default monthly Linke turbidity set. Irradiance in W/m².
 */
import { checkPositive, checkRange } from "../units";

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
export const DEFAULT_MONTHLY_LINKE_TURBIDITY: readonly number[] = Object.freeze([3.0, 3.2, 3.5, 3.8, 4.0, 4.2, 4.2, 4.1, 3.8, 3.4, 3.1, 3.0]);
