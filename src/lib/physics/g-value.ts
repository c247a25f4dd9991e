/**
 * Total solar energy transmittance (g value, solar factor) of a glazing unit, EN 410:2011.
 *
 *   g = τ_e + q_i ,  q_i = Σ_k N_k α_e,k
 *
 * τ_e and α_e,k (in-unit absorptance of pane k) come from the optics; N_k (secondary internal
 * heat transfer factor of pane k) comes from the thermal network built here with the EN 673
 * gap conductances. Everything below works on plain numbers so the optics can feed it.
 *
 * Pure module: no I/O. SI units: W/(m²K), m²K/W; optical quantities are fractions 0–1.
 */

import { internalHeatTransferCoefficientEn673, uValueEn673, type GlazingThermalInput, type UValueOptions, type UValueResult } from "./u-value";

/** Edition of EN 410 that this module follows; included in results. */
export const EN410_EDITION = "EN 410:2011";

/** Allowed excess of τ_e + Σ α_e,k over 1 (rounding of optical inputs) [-]. */
const ENERGY_BALANCE_TOLERANCE = 1e-9;

function requireFraction(name: string, value: unknown): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value < 0 || value > 1) {
    throw new RangeError(`${name} must be a finite number in [0, 1], got ${String(value)}`);
  }
  return value;
}

function requirePositive(name: string, value: unknown): number {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a finite number > 0, got ${String(value)}`);
  }
  return value;
}

/**
 * Internal heat transfer coefficient of the EN 410 boundary conditions (EN 410:2011 clause
 * 5.4, sub-clause number from memory; same expression as EN 673):
 *   h_i = 3.6 + 4.4 ε_i / 0.837   [W/(m²K)]  (8.0 for uncoated glass)
 * It depends on the corrected emissivity ε_i of the room-side surface, so a low-e coating on
 * the innermost face lowers h_i and with it every N_k.
 * @param roomSideEmissivity ε_i [-], in (0, 1]
 * @returns h_i [W/(m²K)]
 */
export function internalHeatTransferCoefficientEn410(roomSideEmissivity: number): number {
  return internalHeatTransferCoefficientEn673(roomSideEmissivity);
}

/** The linear thermal network of a unit: one node per pane, resistances between nodes. */
export interface ThermalNetwork {
  /** h_e [W/(m²K)], > 0. */
  readonly externalCoefficientWPerM2K: number;
  /** h_i [W/(m²K)], > 0. */
  readonly internalCoefficientWPerM2K: number;
  /** R_k = 1/Λ_k between pane nodes k and k+1, outdoor first (length = panes − 1) [m²K/W], > 0. */
  readonly resistancesBetweenPanesM2KPerW: readonly number[];
}

/**
 * Secondary internal heat transfer factors of a linear resistance network (EN 410:2011
 * clause 5.4; the general N-pane form is derived from the network, as in the double- and
 * triple-glazing formulae of the standard, from memory):
 *   N_k = (1/h_e + Σ_{j<k} R_j) / (1/h_e + Σ_j R_j + 1/h_i)     [-]
 * i.e. the resistance from node k to outdoors over the total. N_k is the fraction of the heat
 * absorbed at node k that flows to the room. Single pane: N = h_i / (h_e + h_i).
 * @param network h_e, h_i [W/(m²K)] and the node-to-node resistances [m²K/W]
 * @returns N_k for every pane, outdoor first; 0 < N_1 < … < N_n < 1
 */
export function secondaryHeatTransferFactors(network: ThermalNetwork): number[] {
  const he = requirePositive("externalCoefficientWPerM2K", network.externalCoefficientWPerM2K);
  const hi = requirePositive("internalCoefficientWPerM2K", network.internalCoefficientWPerM2K);
  if (!Array.isArray(network.resistancesBetweenPanesM2KPerW)) {
    throw new RangeError("resistancesBetweenPanesM2KPerW must be an array");
  }
  const rs = network.resistancesBetweenPanesM2KPerW.map((r, k) => requirePositive(`resistancesBetweenPanesM2KPerW[${k}]`, r));
  const total = 1 / he + rs.reduce((s, r) => s + r, 0) + 1 / hi;
  const factors: number[] = [];
  let toOutside = 1 / he;
  factors.push(toOutside / total);
  for (const r of rs) {
    toOutside += r;
    factors.push(toOutside / total);
  }
  return factors;
}

/**
 * Secondary internal heat transfer q_i = Σ_k N_k α_e,k [-] (EN 410:2011 clause 5.4).
 * @param absorptances α_e,k of each pane in the unit, outdoor first [-], each in [0, 1]
 * @param factors N_k, same length [-], each in [0, 1]
 */
export function secondaryHeatTransfer(absorptances: readonly number[], factors: readonly number[]): number {
  if (!Array.isArray(absorptances) || !Array.isArray(factors)) {
    throw new RangeError("absorptances and factors must be arrays");
  }
  if (absorptances.length !== factors.length) {
    throw new RangeError(`absorptances: ${absorptances.length} value(s) but factors: ${factors.length}; one per pane is required`);
  }
  let q = 0;
  for (let k = 0; k < absorptances.length; k++) {
    q += requireFraction(`absorptances[${k}]`, absorptances[k]) * requireFraction(`factors[${k}]`, factors[k]);
  }
  return q;
}

/**
 * Total solar energy transmittance, EN 410:2011 clause 5.4:
 *   g = τ_e + Σ_k N_k α_e,k     [-]
 * Valid at any angle of incidence θ when τ_e(θ) and α_e,k(θ) are given for that angle, with
 * N_k kept at their normal-incidence thermal values (common practice, no published source).
 * Being linear in τ_e and α_e,k, it gives the hemispherical g from hemispherical τ_e and α_e,k.
 * @param solarTransmittance τ_e [-], in [0, 1]
 * @param absorptances α_e,k per pane, outdoor first [-], each in [0, 1]; τ_e + Σ α_e,k ≤ 1
 * @param factors N_k per pane (see {@link secondaryHeatTransferFactors}) [-]
 * @returns g [-]
 */
export function gValue(solarTransmittance: number, absorptances: readonly number[], factors: readonly number[]): number {
  const t = requireFraction("solarTransmittance", solarTransmittance);
  const q = secondaryHeatTransfer(absorptances, factors);
  const sum = absorptances.reduce((s, a) => s + a, t);
  if (sum > 1 + ENERGY_BALANCE_TOLERANCE) {
    throw new RangeError(`solarTransmittance + absorptances must not exceed 1, got ${sum}`);
  }
  return t + q;
}

/**
 * How the glass conduction enters the conductance between panes:
 * - 'surfaces' (default): EN 410's Λ is the conductance between the outer surface and the
 *   innermost surface of the unit, so the whole thickness of the outer and inner panes and
 *   half of each intermediate pane are included (see {@link secondaryHeatTransferFactorsEn410}).
 * - 'none': Λ_k = h_s,k only (glass conduction ignored), for comparison.
 */
export type GlassConductionInNetwork = "surfaces" | "none";

/** Options of {@link secondaryHeatTransferFactorsEn410}: EN 673 conditions plus the Λ convention. */
export interface SecondaryHeatTransferOptions extends UValueOptions {
  /** Default 'surfaces'. */
  readonly glassConduction?: GlassConductionInNetwork;
}

/** Result of {@link secondaryHeatTransferFactorsEn410}. */
export interface SecondaryHeatTransferResult {
  /** N_k per pane, outdoor first [-]. */
  readonly factors: readonly number[];
  /** h_e used [W/(m²K)]. */
  readonly externalCoefficientWPerM2K: number;
  /** h_i used [W/(m²K)]; depends on the room-side emissivity. */
  readonly internalCoefficientWPerM2K: number;
  /** Emissivity of the room-side surface ε_i [-]. */
  readonly roomSideEmissivity: number;
  /** R_k = 1/Λ_k between pane nodes k and k+1 [m²K/W]. */
  readonly resistancesBetweenPanesM2KPerW: readonly number[];
  /** Λ_k between pane nodes k and k+1 [W/(m²K)]. */
  readonly conductancesBetweenPanesWPerM2K: readonly number[];
  /** Convention used for the glass conduction. */
  readonly glassConduction: GlassConductionInNetwork;
  /** "EN 410:2011". */
  readonly standard: string;
  /** The EN 673 calculation that supplied h_s,k. */
  readonly thermal: UValueResult;
}

/**
 * Secondary internal heat transfer factors N_k of a glazing unit under EN 410:2011 boundary
 * conditions (h_e = 23, h_i = 3.6 + 4.4 ε_i/0.837 W/(m²K)), with gap conductances h_s,k
 * from EN 673:2011 (ΔT = 15 K, T_m = 283 K; see uValueEn673).
 *
 * Network (our reading of EN 410:2011 clause 5.4, from memory; verify): EN 410 defines Λ of a
 * double glazing as the thermal conductance between the outer surface and the innermost
 * surface, and for triple glazing Λ_12 from the outer surface to the centre of the middle
 * pane and Λ_23 from that centre to the innermost surface. We generalise: the outermost pane's
 * absorbed heat enters at its outer surface, the innermost pane's at its room-side surface,
 * and any intermediate pane's at its centre, so with 'surfaces'
 *   R_k = 1/Λ_k = r_k,out + 1/h_s,k + r_k+1,in ,
 * r_1,out = d_1/λ_1, r_n,in = d_n/λ_n and d/(2λ) for the halves of intermediate panes.
 * For two or more panes the network total 1/h_e + Σ R_k + 1/h_i then equals 1/U (EN 673).
 * A single pane is one isothermal node: N = h_i/(h_e + h_i), as EN 410 gives it.
 * Including the glass moves g by about 0.0006 for 6/16/6 clear; 'none' drops it.
 *
 * @param unit panes (outdoor first) and gaps, SI (see uValueEn673)
 * @param options EN 673 condition overrides and the glass-conduction convention
 * @throws RangeError for invalid input (see uValueEn673)
 */
export function secondaryHeatTransferFactorsEn410(
  unit: GlazingThermalInput,
  options: SecondaryHeatTransferOptions = {},
): SecondaryHeatTransferResult {
  const glassConduction = options.glassConduction ?? "surfaces";
  if (glassConduction !== "surfaces" && glassConduction !== "none") {
    throw new RangeError(`glassConduction must be 'surfaces' or 'none', got ${String(glassConduction)}`);
  }
  const thermal = uValueEn673(unit, options);
  const r = thermal.paneResistancesM2KPerW;
  const n = r.length;
  const resistancesBetweenPanesM2KPerW = thermal.gaps.map((gap, k) => {
    const gapR = 1 / gap.conductanceWPerM2K;
    if (glassConduction === "none") return gapR;
    const outer = r[k]! * (k === 0 ? 1 : 0.5);
    const inner = r[k + 1]! * (k + 1 === n - 1 ? 1 : 0.5);
    return outer + gapR + inner;
  });
  const factors = secondaryHeatTransferFactors({
    externalCoefficientWPerM2K: thermal.externalCoefficientWPerM2K,
    internalCoefficientWPerM2K: thermal.internalCoefficientWPerM2K,
    resistancesBetweenPanesM2KPerW,
  });
  return {
    factors,
    externalCoefficientWPerM2K: thermal.externalCoefficientWPerM2K,
    internalCoefficientWPerM2K: thermal.internalCoefficientWPerM2K,
    roomSideEmissivity: thermal.roomSideEmissivity,
    resistancesBetweenPanesM2KPerW,
    conductancesBetweenPanesWPerM2K: resistancesBetweenPanesM2KPerW.map((x) => 1 / x),
    glassConduction,
    standard: EN410_EDITION,
    thermal,
  };
}
