/**
 * ASHRAE clear-sky ("tau") model: beam normal and diffuse horizontal irradiance from the
 * site-month pseudo-optical depths τb and τd. Irradiance in W/m².
 * The matching extraterrestrial irradiance is extraterrestrialIrradianceAshrae2009 (extraterrestrial.ts).
 */
import { checkPositive, checkRange } from "../units";

/** Inputs of the ASHRAE "tau" clear-sky model. */
export interface AshraeTauInput {
  /** Relative air mass m [-]; ASHRAE Handbook—Fundamentals uses Kasten–Young (= relativeAirMassKastenYoung1989(90° − β)). */
  readonly airMass: number;
  /** Extraterrestrial normal irradiance E0 [W/m²]. */
  readonly extraterrestrialWPerM2: number;
  /** Site-month beam pseudo-optical depth τb [-] (ASHRAE Handbook—Fundamentals climatic tables). */
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
