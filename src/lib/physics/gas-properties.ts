/**
 * Fill-gas properties for glazing cavities at the EN 673 mean temperature, and gas mixtures.
 *
 * Pure module: no I/O. SI units throughout.
 *
 * Source: EN 673:2011, "Basic material properties" (clause 6, gas property table at
 * θ_m = 10 °C). The table values below are from memory; the standard's table of contents is
 * confirmed, the numbers are not. Verify against the printed table before relying on them.
 */

/** Names of the pure gases whose properties are tabulated here. */
export const GAS_NAMES = ["air", "argon", "krypton"] as const;

/** A pure gas tabulated in EN 673. */
export type GasName = (typeof GAS_NAMES)[number];

/**
 * A cavity fill: either a pure gas name or volume fractions, e.g. `{ argon: 0.9, air: 0.1 }`.
 * Fractions are in [0, 1] and must sum to 1 within {@link GAS_FRACTION_SUM_TOLERANCE}.
 */
export type GasFill = GasName | Readonly<Partial<Record<GasName, number>>>;

/** Thermophysical properties of a gas at one temperature (SI). */
export interface GasProperties {
  /** Density ρ [kg/m³]. */
  readonly densityKgPerM3: number;
  /** Dynamic viscosity μ [kg/(m·s)] = [Pa·s]. */
  readonly dynamicViscosityPaS: number;
  /** Thermal conductivity λ [W/(m·K)]. */
  readonly conductivityWPerMK: number;
  /** Specific heat capacity at constant pressure c [J/(kg·K)]. */
  readonly specificHeatJPerKgK: number;
}

/** Temperature at which {@link GAS_PROPERTIES_EN673} applies: θ_m = 10 °C = 283 K (EN 673 rounds to 283 K). */
export const GAS_TABLE_TEMPERATURE_K = 283;

/** Allowed deviation of the sum of volume fractions from 1 [-]. */
export const GAS_FRACTION_SUM_TOLERANCE = 1e-6;

/**
 * Gas properties at 10 °C as tabulated in EN 673:2011 clause 6 (table values from memory;
 * verify). A public table of the same values at −10, 0, 10 and 20 °C agrees at 10 °C.
 * Do not mix with the temperature fits of ISO 15099 Annex B: they differ in the third digit.
 */
export const GAS_PROPERTIES_EN673: Readonly<Record<GasName, GasProperties>> = Object.freeze({
  air: Object.freeze({
    densityKgPerM3: 1.232,
    dynamicViscosityPaS: 1.761e-5,
    conductivityWPerMK: 2.496e-2,
    specificHeatJPerKgK: 1008,
  }),
  argon: Object.freeze({
    densityKgPerM3: 1.699,
    dynamicViscosityPaS: 2.164e-5,
    conductivityWPerMK: 1.684e-2,
    specificHeatJPerKgK: 519,
  }),
  krypton: Object.freeze({
    densityKgPerM3: 3.56,
    dynamicViscosityPaS: 2.4e-5,
    conductivityWPerMK: 0.9e-2,
    specificHeatJPerKgK: 245,
  }),
});

/** True when `name` is one of the tabulated gases. */
export function isGasName(name: unknown): name is GasName {
  return typeof name === "string" && (GAS_NAMES as readonly string[]).includes(name);
}

/**
 * Volume fractions of a fill, checked: every key is a tabulated gas, every fraction is finite
 * and in [0, 1], and the fractions sum to 1 within {@link GAS_FRACTION_SUM_TOLERANCE}.
 * A pure gas name gives fraction 1 for that gas. Fractions are returned as given (not rescaled).
 * @param fill gas name or record of volume fractions [-]
 * @returns a fraction [-] for every tabulated gas (0 where absent)
 * @throws RangeError naming the unknown gas, the bad fraction, or the bad sum
 */
export function gasVolumeFractions(fill: GasFill): Record<GasName, number> {
  const fractions: Record<GasName, number> = { air: 0, argon: 0, krypton: 0 };
  if (typeof fill === "string") {
    if (!isGasName(fill)) {
      throw new RangeError(`gas: unknown gas '${String(fill)}' (expected one of ${GAS_NAMES.join(", ")})`);
    }
    fractions[fill] = 1;
    return fractions;
  }
  if (fill === null || typeof fill !== "object") {
    throw new RangeError("gas: expected a gas name or a record of volume fractions");
  }
  const entries = Object.entries(fill);
  if (entries.length === 0) {
    throw new RangeError("gas fractions: the record is empty; volume fractions must sum to 1");
  }
  let sum = 0;
  for (const [name, fraction] of entries) {
    if (!isGasName(name)) {
      throw new RangeError(`gas fractions: unknown gas '${name}' (expected one of ${GAS_NAMES.join(", ")})`);
    }
    if (typeof fraction !== "number" || !Number.isFinite(fraction) || fraction < 0 || fraction > 1) {
      throw new RangeError(`gas fractions: volume fraction of ${name} must be a finite number in [0, 1], got ${String(fraction)}`);
    }
    fractions[name] = fraction;
    sum += fraction;
  }
  if (Math.abs(sum - 1) > GAS_FRACTION_SUM_TOLERANCE) {
    throw new RangeError(`gas fractions: volume fractions must sum to 1 (±${GAS_FRACTION_SUM_TOLERANCE}), got ${sum}`);
  }
  return fractions;
}

/**
 * Properties of a gas fill at the EN 673 mean temperature (283 K).
 *
 * Mixtures: every property P (ρ, μ, λ, c) is mixed linearly by volume fraction F_i,
 *   P_mix = Σ_i F_i · P_i ,
 * as EN 673:2011 clause 6 prescribes for gas mixtures (clause and wording from memory).
 * This is a convention of the standard, not a physical mixing rule: a physically mixed μ, λ
 * (e.g. Wilke's rule, used in ISO 15099) or a mass-weighted c would differ. We follow EN 673.
 *
 * @param fill gas name or record of volume fractions [-] (see {@link gasVolumeFractions})
 * @returns ρ [kg/m³], μ [Pa·s], λ [W/(m·K)], c [J/(kg·K)] at 283 K
 * @throws RangeError for an unknown gas or fractions that do not sum to 1
 */
export function gasPropertiesEn673(fill: GasFill): GasProperties {
  const fractions = gasVolumeFractions(fill);
  let densityKgPerM3 = 0;
  let dynamicViscosityPaS = 0;
  let conductivityWPerMK = 0;
  let specificHeatJPerKgK = 0;
  for (const name of GAS_NAMES) {
    const f = fractions[name];
    if (f === 0) continue;
    const p = GAS_PROPERTIES_EN673[name];
    densityKgPerM3 += f * p.densityKgPerM3;
    dynamicViscosityPaS += f * p.dynamicViscosityPaS;
    conductivityWPerMK += f * p.conductivityWPerMK;
    specificHeatJPerKgK += f * p.specificHeatJPerKgK;
  }
  return { densityKgPerM3, dynamicViscosityPaS, conductivityWPerMK, specificHeatJPerKgK };
}
