/**
 * Centre-of-glass thermal transmittance (U value) of a glazing unit, EN 673.
 *
 * Edition implemented: EN 673:2011 (same formulae as EN 673:1997 + A1:2000 + A2:2002), with
 * its declared-value boundary conditions (clause 8): vertical glazing, ΔT = 15 K across the
 * glazing, T_m = 283 K, glass λ = 1.0 W/(m·K), h_e = 23 W/(m²K),
 * h_i = 3.6 + 4.4 ε_i / 0.837 W/(m²K). Equations, constants and clause numbers are from memory
 * (the standard's section structure is confirmed: 5 basic formulae, 6 material properties,
 * 7 external and internal heat transfer coefficients, 8 declared values, 9 expression of the
 * results). Not implemented: EN 673:2024, whose clause 7.2 (per the draft amendment
 * prEN 673:2024/prA1:2025) evaluates the internal radiative part from a surface temperature
 * instead of the fixed 4.4 W/(m²K) term.
 *
 * The result is unrounded; EN 673 clause 9 declares U rounded to 0.1 W/(m²K) — round only
 * for display.
 *
 * Pure module: no I/O. SI units: metres, kelvin, W/(m²K).
 */

import { gasPropertiesEn673, type GasFill, type GasProperties } from "./gas-properties";

/** Edition of EN 673 that this module implements; included in every result. */
export const EN673_EDITION = "EN 673:2011";

/** Stefan–Boltzmann constant as used in EN 673 [W/(m²K⁴)] (value 5.67e-8, from memory). */
export const STEFAN_BOLTZMANN_EN673_W_PER_M2K4 = 5.67e-8;

/** Gravitational acceleration as used in the EN 673 Grashof number [m/s²] (from memory). */
export const GRAVITY_EN673_M_PER_S2 = 9.81;

/** Corrected emissivity of uncoated soda-lime glass (EN 673 / EN 12898) [-]. */
export const UNCOATED_GLASS_EMISSIVITY = 0.837;

/** EN 673 declared-value boundary conditions (clause 8; values from memory). */
export const EN673_DECLARED_CONDITIONS = Object.freeze({
  /** External heat transfer coefficient h_e [W/(m²K)]. */
  externalCoefficientWPerM2K: 23,
  /** Temperature difference across the glazing (outer to inner glass surface) ΔT [K]. */
  temperatureDifferenceK: 15,
  /** Mean temperature of every gas space T_m [K]. */
  meanTemperatureK: 283,
  /** Thermal conductivity of glass λ [W/(m·K)]. */
  glassConductivityWPerMK: 1.0,
  /** Tilt of the glazing from horizontal [deg]; 90 = vertical. */
  tiltDeg: 90,
});

/** One pane (or sheet) of the unit, numbered from outdoors. */
export interface PaneThermalInput {
  /** Thickness d [m], > 0. */
  readonly thicknessM: number;
  /** Thermal conductivity λ [W/(m·K)], > 0; default {@link UValueOptions.glassConductivityWPerMK}. */
  readonly conductivityWPerMK?: number;
  /** Corrected emissivity of the outdoor-facing surface [-], in (0, 1]; default 0.837. */
  readonly emissivityFront?: number;
  /** Corrected emissivity of the indoor-facing surface [-], in (0, 1]; default 0.837. */
  readonly emissivityBack?: number;
}

/** One gas space between two panes, numbered from outdoors. */
export interface GapThermalInput {
  /** Width s [m], > 0. */
  readonly widthM: number;
  /** Fill: gas name or volume fractions (see gas-properties.ts). */
  readonly gas: GasFill;
}

/** A glazing unit: N ≥ 1 panes, outdoor first, and N − 1 gaps; gap k lies between panes k and k+1. */
export interface GlazingThermalInput {
  readonly panes: readonly PaneThermalInput[];
  readonly gaps: readonly GapThermalInput[];
}

/** Overridable boundary conditions; the defaults are the EN 673 declared conditions. */
export interface UValueOptions {
  /** h_e [W/(m²K)], > 0; default 23. */
  readonly externalCoefficientWPerM2K?: number;
  /** h_i [W/(m²K)], > 0; default 3.6 + 4.4 ε_i/0.837 with ε_i the room-side emissivity. */
  readonly internalCoefficientWPerM2K?: number;
  /** ΔT across the glazing [K], ≥ 0; default 15. */
  readonly temperatureDifferenceK?: number;
  /**
   * T_m [K], > 0; default 283. Used in h_r and Gr only: the gas table stays at 283 K, so any
   * other value is a sensitivity study, not an EN 673 result.
   */
  readonly meanTemperatureK?: number;
  /** Glass λ [W/(m·K)] for panes that give none, > 0; default 1.0. */
  readonly glassConductivityWPerMK?: number;
  /** Tilt from horizontal [deg], in [0, 90]; default 90 (vertical). See {@link convectionConstantsEn673}. */
  readonly tiltDeg?: number;
}

/** Constants of the gap Nusselt correlation Nu = A (Gr·Pr)^n for one tabulated tilt. */
export interface ConvectionConstants {
  /** Tabulated tilt that was chosen [deg]: 90, 45 or 0. */
  readonly tabulatedTiltDeg: 90 | 45 | 0;
  /** A [-]. */
  readonly a: number;
  /** n [-]. */
  readonly n: number;
}

/** Per-gap intermediate values of the EN 673 calculation. */
export interface GapThermalResult {
  /** Width s [m]. */
  readonly widthM: number;
  /** Gas properties used (at 283 K) */
  readonly gas: GasProperties;
  /** Temperature difference across this gap ΔT_k [K]. */
  readonly temperatureDifferenceK: number;
  /** Emissivities of the two facing surfaces [-]: outer pane's back, inner pane's front. */
  readonly emissivities: readonly [number, number];
  /** Grashof number Gr [-]. */
  readonly grashof: number;
  /** Prandtl number Pr [-]. */
  readonly prandtl: number;
  /** Gr·Pr [-] (Rayleigh number). */
  readonly grashofPrandtl: number;
  /** Nusselt number Nu [-], ≥ 1. */
  readonly nusselt: number;
  /** True when A (Gr·Pr)^n exceeds 1, i.e. the gas convects; false: conduction only (Nu = 1). */
  readonly convective: boolean;
  /** Radiative conductance h_r [W/(m²K)]. */
  readonly radiativeConductanceWPerM2K: number;
  /** Gas conductance h_g [W/(m²K)]. */
  readonly gasConductanceWPerM2K: number;
  /** Gap conductance h_s = h_r + h_g [W/(m²K)]. */
  readonly conductanceWPerM2K: number;
}

/** Result of {@link uValueEn673}. */
export interface UValueResult {
  /** Centre-of-glass U [W/(m²K)], unrounded. */
  readonly uValueWPerM2K: number;
  /** Edition implemented, e.g. "EN 673:2011". */
  readonly standard: string;
  /** True when every boundary condition is the EN 673 declared one (a "declared value" calculation). */
  readonly declaredConditions: boolean;
  /** Human-readable label, e.g. "EN 673:2011, declared conditions". */
  readonly label: string;
  /** h_e used [W/(m²K)]. */
  readonly externalCoefficientWPerM2K: number;
  /** h_i used [W/(m²K)]. */
  readonly internalCoefficientWPerM2K: number;
  /** Emissivity of the innermost (room-side) surface ε_i [-]. */
  readonly roomSideEmissivity: number;
  /** ΔT across the whole glazing [K]. */
  readonly temperatureDifferenceK: number;
  /** T_m in every gap [K]. */
  readonly meanTemperatureK: number;
  /** Convection constants used for every gap. */
  readonly convection: ConvectionConstants;
  /** d_j / λ_j of every pane, outdoor first [m²K/W]. */
  readonly paneResistancesM2KPerW: readonly number[];
  /** Per gap, outdoor first. */
  readonly gaps: readonly GapThermalResult[];
  /** 1/U = 1/h_e + Σ d_j/λ_j + Σ 1/h_s,k + 1/h_i [m²K/W]. */
  readonly totalResistanceM2KPerW: number;
  /** Iterations of the ΔT split (1 for a single gap, 0 for single glazing). */
  readonly iterations: number;
}

function requireFinite(name: string, value: unknown): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  }
  return value;
}

function requirePositive(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v <= 0) throw new RangeError(`${name} must be > 0, got ${v}`);
  return v;
}

function requireNonNegative(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v < 0) throw new RangeError(`${name} must be ≥ 0, got ${v}`);
  return v;
}

function requireEmissivity(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (!(v > 0 && v <= 1)) throw new RangeError(`${name} must be in (0, 1], got ${v}`);
  return v;
}

function requireTilt(name: string, value: unknown): number {
  const v = requireFinite(name, value);
  if (v < 0 || v > 90) throw new RangeError(`${name} must be in [0, 90] degrees, got ${v}`);
  return v;
}

/**
 * Internal surface heat transfer coefficient for vertical glazing, EN 673:2011 clause 7
 * (and EN 410:2011, same expression; clause numbers from memory):
 *   h_i = h_c + h_r = 3.6 + 4.4 ε_i / 0.837   [W/(m²K)]
 * giving 8.0 for uncoated glass (ε_i = 0.837).
 * @param roomSideEmissivity corrected emissivity ε_i of the room-side surface [-], in (0, 1]
 * @returns h_i [W/(m²K)]
 */
export function internalHeatTransferCoefficientEn673(roomSideEmissivity: number): number {
  const e = requireEmissivity("roomSideEmissivity", roomSideEmissivity);
  return 3.6 + (4.4 * e) / UNCOATED_GLASS_EMISSIVITY;
}

/**
 * Radiative conductance of a gas space, EN 673:2011 clause 5 (from memory):
 *   h_r = 4 σ (1/ε1 + 1/ε2 − 1)⁻¹ T_m³   [W/(m²K)],  σ = 5.67e-8 W/(m²K⁴)
 * @param emissivity1 corrected emissivity of one facing surface [-], in (0, 1]
 * @param emissivity2 corrected emissivity of the other facing surface [-], in (0, 1]
 * @param meanTemperatureK T_m [K], > 0; default 283
 */
export function radiativeConductanceEn673(emissivity1: number, emissivity2: number, meanTemperatureK = 283): number {
  const e1 = requireEmissivity("emissivity1", emissivity1);
  const e2 = requireEmissivity("emissivity2", emissivity2);
  const t = requirePositive("meanTemperatureK", meanTemperatureK);
  return (4 * STEFAN_BOLTZMANN_EN673_W_PER_M2K4 * t ** 3) / (1 / e1 + 1 / e2 - 1);
}

/**
 * Grashof number of a gas space, EN 673:2011 clause 5 (from memory):
 *   Gr = g s³ ΔT ρ² / (T_m μ²),  g = 9.81 m/s²
 * @param widthM s [m], > 0
 * @param temperatureDifferenceK ΔT across the gap [K], ≥ 0
 * @param meanTemperatureK T_m [K], > 0
 * @param gas properties (ρ [kg/m³], μ [Pa·s])
 */
export function grashofNumberEn673(widthM: number, temperatureDifferenceK: number, meanTemperatureK: number, gas: GasProperties): number {
  const s = requirePositive("widthM", widthM);
  const dt = requireNonNegative("temperatureDifferenceK", temperatureDifferenceK);
  const t = requirePositive("meanTemperatureK", meanTemperatureK);
  return (GRAVITY_EN673_M_PER_S2 * s ** 3 * dt * gas.densityKgPerM3 ** 2) / (t * gas.dynamicViscosityPaS ** 2);
}

/**
 * Prandtl number Pr = μ c / λ [-] (EN 673:2011 clause 5, from memory).
 * @param gas properties (μ [Pa·s], c [J/(kg·K)], λ [W/(m·K)])
 */
export function prandtlNumber(gas: GasProperties): number {
  return (gas.dynamicViscosityPaS * gas.specificHeatJPerKgK) / gas.conductivityWPerMK;
}

const CONVECTION_TABLE: readonly ConvectionConstants[] = [
  { tabulatedTiltDeg: 90, a: 0.035, n: 0.38 },
  { tabulatedTiltDeg: 45, a: 0.1, n: 0.31 },
  { tabulatedTiltDeg: 0, a: 0.16, n: 0.28 },
];

/**
 * Constants A, n of the gap correlation Nu = A (Gr·Pr)^n, EN 673:2011 clause 5 (values from
 * memory): vertical 0.035 / 0.38, 45° 0.10 / 0.31, horizontal 0.16 / 0.28, heat flow upwards
 * for the inclined cases.
 *
 * Choice of constants (ours; EN 673 tabulates only these three tilts and prescribes no
 * interpolation): the tabulated tilt nearest to `tiltDeg` is used. At an exact tie (22.5° or
 * 67.5°) the more horizontal row is used, which convects more and so gives the higher
 * (conservative) U. Only 0–90° (heat flow upwards or horizontal) is covered; glazing that
 * faces downwards is out of scope. The tilt does not change h_i (EN 673's 3.6 W/(m²K)
 * convective part is for vertical glazing); override h_i for other tilts.
 * @param tiltDeg tilt of the glazing from horizontal [deg], in [0, 90]; 90 = vertical
 */
export function convectionConstantsEn673(tiltDeg = 90): ConvectionConstants {
  const tilt = requireTilt("tiltDeg", tiltDeg);
  let best = CONVECTION_TABLE[0]!;
  for (const row of CONVECTION_TABLE) {
    const d = Math.abs(row.tabulatedTiltDeg - tilt);
    const dBest = Math.abs(best.tabulatedTiltDeg - tilt);
    if (d < dBest || (d === dBest && row.tabulatedTiltDeg < best.tabulatedTiltDeg)) best = row;
  }
  return best;
}

/**
 * Nusselt number of a gas space, EN 673:2011 clause 5 (from memory):
 *   Nu = A (Gr·Pr)^n ;  Nu := 1 when that is below 1 (pure conduction)
 * @param grashofPrandtl Gr·Pr [-], ≥ 0
 * @param tiltDeg tilt from horizontal [deg], in [0, 90]; selects A, n (see {@link convectionConstantsEn673})
 */
export function nusseltNumberEn673(grashofPrandtl: number, tiltDeg = 90): number {
  const x = requireNonNegative("grashofPrandtl", grashofPrandtl);
  const { a, n } = convectionConstantsEn673(tiltDeg);
  return Math.max(1, a * x ** n);
}

/**
 * Gap width at which convection sets in (A (Gr·Pr)^n = 1) for the given gas and ΔT. Since
 * Gr·Pr ∝ s³, the closed form is
 *   s* = [ A^(−1/n) T_m μ² / (g ΔT ρ² Pr) ]^(1/3)   [m].
 * Narrower gaps only conduct (Nu = 1). Derived from the EN 673 correlation above.
 * @param gas fill
 * @param options ΔT [K] (> 0, default 15), T_m [K] (default 283), tilt [deg] (default 90)
 */
export function convectionOnsetWidthEn673(
  gas: GasFill,
  options: Pick<UValueOptions, "temperatureDifferenceK" | "meanTemperatureK" | "tiltDeg"> = {},
): number {
  const props = gasPropertiesEn673(gas);
  const dt = requirePositive("temperatureDifferenceK", options.temperatureDifferenceK ?? EN673_DECLARED_CONDITIONS.temperatureDifferenceK);
  const t = requirePositive("meanTemperatureK", options.meanTemperatureK ?? EN673_DECLARED_CONDITIONS.meanTemperatureK);
  const { a, n } = convectionConstantsEn673(options.tiltDeg ?? EN673_DECLARED_CONDITIONS.tiltDeg);
  const onsetGrashofPrandtl = a ** (-1 / n);
  const grashofPrandtlPerM3 = grashofNumberEn673(1, dt, t, props) * prandtlNumber(props);
  return Math.cbrt(onsetGrashofPrandtl / grashofPrandtlPerM3);
}

/**
 * Conductance of one gas space, EN 673:2011 clause 5 (from memory):
 *   h_s = h_r + h_g ,  h_g = Nu λ / s ,  Nu = max(1, A (Gr·Pr)^n)
 * @param widthM s [m], > 0
 * @param gas properties at 283 K (see gasPropertiesEn673)
 * @param emissivity1 corrected emissivity of the outer facing surface [-]
 * @param emissivity2 corrected emissivity of the inner facing surface [-]
 * @param temperatureDifferenceK ΔT across this gap [K], ≥ 0
 * @param meanTemperatureK T_m [K]
 * @param tiltDeg tilt from horizontal [deg]
 */
export function gapConductanceEn673(
  widthM: number,
  gas: GasProperties,
  emissivity1: number,
  emissivity2: number,
  temperatureDifferenceK: number,
  meanTemperatureK = 283,
  tiltDeg = 90,
): GapThermalResult {
  const grashof = grashofNumberEn673(widthM, temperatureDifferenceK, meanTemperatureK, gas);
  const prandtl = prandtlNumber(gas);
  const grashofPrandtl = grashof * prandtl;
  const { a, n } = convectionConstantsEn673(tiltDeg);
  const raw = a * grashofPrandtl ** n;
  const nusselt = Math.max(1, raw);
  const radiative = radiativeConductanceEn673(emissivity1, emissivity2, meanTemperatureK);
  const gasConductance = (nusselt * gas.conductivityWPerMK) / widthM;
  return {
    widthM,
    gas,
    temperatureDifferenceK,
    emissivities: [emissivity1, emissivity2],
    grashof,
    prandtl,
    grashofPrandtl,
    nusselt,
    convective: raw > 1,
    radiativeConductanceWPerM2K: radiative,
    gasConductanceWPerM2K: gasConductance,
    conductanceWPerM2K: radiative + gasConductance,
  };
}

const SPLIT_TOLERANCE_K = 1e-11;
const SPLIT_MAX_ITERATIONS = 200;

/**
 * Centre-of-glass U value, EN 673:2011 clause 5 (formulae from memory):
 *   1/U = 1/h_e + Σ_j d_j/λ_j + Σ_k 1/h_s,k + 1/h_i      [m²K/W]
 * with h_s,k from {@link gapConductanceEn673}; h_r,k uses the emissivities of the two surfaces
 * facing gap k; h_i uses the emissivity of the room-side surface (last pane, back).
 *
 * Multiple gaps: ΔT (15 K) is shared between the gaps. Start with ΔT_k = ΔT/N_gaps, then
 * repeat ΔT_k = ΔT · (1/h_s,k) / Σ_j (1/h_s,j) until no ΔT_k changes by more than 1e-11 K;
 * T_m = 283 K in every gap (EN 673 clause 5/8 procedure, from memory). The glass resistance
 * takes no share of ΔT. The map is a contraction (h_s grows at most as ΔT^0.38), so it
 * converges in a few tens of iterations.
 *
 * Single glazing (no gaps): 1/U = 1/h_e + d/λ + 1/h_i (≈ 5.8 W/(m²K) for 4 mm).
 *
 * @param unit panes (outdoor first) and gaps; thicknesses and widths in metres
 * @param options boundary conditions; defaults are the EN 673 declared conditions
 * @returns U [W/(m²K)] unrounded, with every intermediate value and the edition label
 * @throws RangeError naming the offending quantity for non-finite or out-of-range input
 */
export function uValueEn673(unit: GlazingThermalInput, options: UValueOptions = {}): UValueResult {
  const d = EN673_DECLARED_CONDITIONS;
  const he = requirePositive("externalCoefficientWPerM2K", options.externalCoefficientWPerM2K ?? d.externalCoefficientWPerM2K);
  const dt = requireNonNegative("temperatureDifferenceK", options.temperatureDifferenceK ?? d.temperatureDifferenceK);
  const tm = requirePositive("meanTemperatureK", options.meanTemperatureK ?? d.meanTemperatureK);
  const glassLambda = requirePositive("glassConductivityWPerMK", options.glassConductivityWPerMK ?? d.glassConductivityWPerMK);
  const tilt = requireTilt("tiltDeg", options.tiltDeg ?? d.tiltDeg);
  const convection = convectionConstantsEn673(tilt);

  if (!unit || !Array.isArray(unit.panes) || unit.panes.length < 1) {
    throw new RangeError("panes: at least one pane is required");
  }
  if (!Array.isArray(unit.gaps) || unit.gaps.length !== unit.panes.length - 1) {
    throw new RangeError(
      `gaps: ${unit.panes.length} pane(s) need ${unit.panes.length - 1} gap(s), got ${Array.isArray(unit.gaps) ? unit.gaps.length : "none"}`,
    );
  }

  let allGlassDeclared = true;
  const panes = unit.panes.map((p, j) => {
    const thicknessM = requirePositive(`panes[${j}].thicknessM`, p.thicknessM);
    const lambda = requirePositive(`panes[${j}].conductivityWPerMK`, p.conductivityWPerMK ?? glassLambda);
    if (lambda !== d.glassConductivityWPerMK) allGlassDeclared = false;
    return {
      resistance: thicknessM / lambda,
      emissivityFront: requireEmissivity(`panes[${j}].emissivityFront`, p.emissivityFront ?? UNCOATED_GLASS_EMISSIVITY),
      emissivityBack: requireEmissivity(`panes[${j}].emissivityBack`, p.emissivityBack ?? UNCOATED_GLASS_EMISSIVITY),
    };
  });
  const gapInputs = unit.gaps.map((g, k) => {
    const widthM = requirePositive(`gaps[${k}].widthM`, g.widthM);
    let gas: GasProperties;
    try {
      gas = gasPropertiesEn673(g.gas);
    } catch (e) {
      throw e instanceof RangeError ? new RangeError(`gaps[${k}].${e.message}`) : e;
    }
    return { widthM, gas, e1: panes[k]!.emissivityBack, e2: panes[k + 1]!.emissivityFront };
  });

  const roomSideEmissivity = panes[panes.length - 1]!.emissivityBack;
  const hi =
    options.internalCoefficientWPerM2K === undefined
      ? internalHeatTransferCoefficientEn673(roomSideEmissivity)
      : requirePositive("internalCoefficientWPerM2K", options.internalCoefficientWPerM2K);

  const evaluate = (split: readonly number[]): GapThermalResult[] =>
    gapInputs.map((g, k) => gapConductanceEn673(g.widthM, g.gas, g.e1, g.e2, split[k]!, tm, tilt));

  const nGaps = gapInputs.length;
  let split = gapInputs.map(() => dt / nGaps);
  let gaps = evaluate(split);
  let iterations = 0;
  if (nGaps === 1) {
    iterations = 1;
  } else if (nGaps > 1) {
    for (;;) {
      iterations += 1;
      const sumR = gaps.reduce((s, g) => s + 1 / g.conductanceWPerM2K, 0);
      const next = gaps.map((g) => (dt * (1 / g.conductanceWPerM2K)) / sumR);
      const change = Math.max(...next.map((v, k) => Math.abs(v - split[k]!)));
      split = next;
      gaps = evaluate(split);
      if (change <= SPLIT_TOLERANCE_K) break;
      if (iterations >= SPLIT_MAX_ITERATIONS) {
        throw new Error(`uValueEn673: temperature split did not converge in ${SPLIT_MAX_ITERATIONS} iterations`);
      }
    }
  }

  const paneResistancesM2KPerW = panes.map((p) => p.resistance);
  const totalResistanceM2KPerW =
    1 / he + paneResistancesM2KPerW.reduce((s, r) => s + r, 0) + gaps.reduce((s, g) => s + 1 / g.conductanceWPerM2K, 0) + 1 / hi;

  const declaredConditions =
    he === d.externalCoefficientWPerM2K &&
    options.internalCoefficientWPerM2K === undefined &&
    dt === d.temperatureDifferenceK &&
    tm === d.meanTemperatureK &&
    tilt === d.tiltDeg &&
    allGlassDeclared;

  return {
    uValueWPerM2K: 1 / totalResistanceM2KPerW,
    standard: EN673_EDITION,
    declaredConditions,
    label: `${EN673_EDITION} centre-of-glass U, ${declaredConditions ? "declared conditions" : "non-declared conditions"}`,
    externalCoefficientWPerM2K: he,
    internalCoefficientWPerM2K: hi,
    roomSideEmissivity,
    temperatureDifferenceK: dt,
    meanTemperatureK: tm,
    convection,
    paneResistancesM2KPerW,
    gaps,
    totalResistanceM2KPerW,
    iterations,
  };
}
