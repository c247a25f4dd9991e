/**
 * Independent recomputation of the computed U-value reference cases (`src/lib/reference-cases/u-value.ts`):
 * a small, separate implementation of the EN 673 centre-of-glass calculation.
 *
 * Source: EN 673:2011, Glass in building — Determination of thermal transmittance (U value) — Calculation
 * method; clause titles confirmed ("5 Basic formulae", "6 Basic material properties", "7 External and internal
 * heat transfer coefficients", "8 Declared values: standardized boundary conditions", "9 Expression of the
 * results"); the equations and constants below are from memory:
 *   1/U  = 1/h_e + Σ d_j/λ_glass + Σ 1/h_s,k + 1/h_i          λ_glass = 1.0 W/(mK)
 *   h_s  = h_r + h_g
 *   h_r  = 4σ (1/ε1 + 1/ε2 − 1)⁻¹ T_m³                       σ = 5.67e-8 W/(m²K⁴)
 *   h_g  = Nu λ/s,  Nu = A (Gr·Pr)^n, set to 1 if below 1      vertical A 0.035 n 0.38; 45° 0.10, 0.31; horizontal 0.16, 0.28
 *   Gr   = 9.81 s³ ΔT ρ² / (T_m μ²),  Pr = μc/λ
 *   h_e  = 23, h_i = 3.6 + 4.4 ε_i/0.837 W/(m²K); ΔT = 15 K across the unit, T_m = 283 K in every gap
 *   several gaps: start at ΔT_k = ΔT/N, then ΔT_k ∝ 1/h_s,k until converged
 *   gas mixtures: every property linear in volume fraction; U declared to one decimal.
 * Gas data: the EN 673:2011 clause 6 table at 10 °C (from memory), via scripts/reference/gas-properties.ts.
 * Uses nothing from the product's physics code.
 *
 * Run: npx tsx scripts/reference/u-value.ts
 */
import { uValueDomain, type UValueCase, type UValueGapData, type UValuePaneData } from "@/lib/reference-cases/u-value";
import { gasProperties, prandtl } from "./gas-properties";
import { compareDomain, EXACT_BOUND, runWhenMain, type ComparisonRow, type Recomputed } from "./compare";

const SCRIPT = "scripts/reference/u-value.ts";

export const SIGMA = 5.67e-8;
export const GRAVITY = 9.81;
export const MEAN_TEMPERATURE_K = 283;
export const TEMPERATURE_DIFFERENCE_K = 15;
export const EXTERNAL_COEFFICIENT = 23;
export const GLASS_CONDUCTIVITY = 1.0;

/** A and n of Nu = A (Gr·Pr)^n at the three tabulated tilts (degrees from horizontal). */
export const CONVECTION_CONSTANTS: Readonly<Record<number, { a: number; n: number }>> = {
  90: { a: 0.035, n: 0.38 },
  45: { a: 0.1, n: 0.31 },
  0: { a: 0.16, n: 0.28 },
};

function constantsAt(tiltDeg: number): { a: number; n: number } {
  const k = CONVECTION_CONSTANTS[tiltDeg];
  if (!k) throw new Error(`this script knows the constants only at the tabulated tilts 90, 45 and 0, not ${tiltDeg}`);
  return k;
}

export const radiativeConductance = (e1: number, e2: number, tm = MEAN_TEMPERATURE_K) => (4 * SIGMA * tm ** 3) / (1 / e1 + 1 / e2 - 1);
export const internalCoefficient = (roomSideEmissivity: number) => 3.6 + (4.4 * roomSideEmissivity) / 0.837;
export const nusselt = (grashofPrandtl: number, tiltDeg = 90) => {
  const { a, n } = constantsAt(tiltDeg);
  return Math.max(1, a * grashofPrandtl ** n);
};

export interface GapResult {
  readonly radiativeConductanceWPerM2K: number;
  readonly grashof: number;
  readonly prandtl: number;
  readonly grashofPrandtl: number;
  readonly nusselt: number;
  readonly gasConductanceWPerM2K: number;
  readonly conductanceWPerM2K: number;
  readonly temperatureDifferenceK: number;
}

function gap(g: UValueGapData, e1: number, e2: number, dT: number, tiltDeg: number): GapResult {
  const s = g.widthMm / 1000;
  const p = gasProperties(g.gas);
  const hr = radiativeConductance(e1, e2);
  const gr = (GRAVITY * s ** 3 * dT * p.densityKgPerM3 ** 2) / (MEAN_TEMPERATURE_K * p.dynamicViscosityPaS ** 2);
  const pr = prandtl(p);
  const nu = nusselt(gr * pr, tiltDeg);
  const hg = (nu * p.conductivityWPerMK) / s;
  return {
    radiativeConductanceWPerM2K: hr,
    grashof: gr,
    prandtl: pr,
    grashofPrandtl: gr * pr,
    nusselt: nu,
    gasConductanceWPerM2K: hg,
    conductanceWPerM2K: hr + hg,
    temperatureDifferenceK: dT,
  };
}

export interface UnitResult {
  readonly uValueWPerM2K: number;
  readonly gaps: readonly GapResult[];
  readonly internalCoefficientWPerM2K: number;
}

/** EN 673 U of a unit (panes outdoor first, mm), declared conditions unless h_e or tilt are given. */
export function uValueUnit(unit: {
  readonly panes: readonly UValuePaneData[];
  readonly gaps: readonly UValueGapData[];
  readonly externalCoefficientWPerM2K?: number;
  readonly tiltDeg?: number;
}): UnitResult {
  const he = unit.externalCoefficientWPerM2K ?? EXTERNAL_COEFFICIENT;
  const tilt = unit.tiltDeg ?? 90;
  const n = unit.gaps.length;
  const solve = (dts: readonly number[]) =>
    unit.gaps.map((g, k) => gap(g, unit.panes[k]!.emissivityBack, unit.panes[k + 1]!.emissivityFront, dts[k]!, tilt));
  let dts: number[] = unit.gaps.map(() => TEMPERATURE_DIFFERENCE_K / n);
  let gaps = solve(dts);
  for (let i = 0; i < 500 && n > 1; i++) {
    const inv = gaps.map((g) => 1 / g.conductanceWPerM2K);
    const sum = inv.reduce((a, b) => a + b, 0);
    const next = inv.map((x) => (TEMPERATURE_DIFFERENCE_K * x) / sum);
    const change = Math.max(...next.map((x, k) => Math.abs(x - dts[k]!)));
    dts = next;
    gaps = solve(dts);
    if (change < 1e-13) break;
  }
  const hi = internalCoefficient(unit.panes[unit.panes.length - 1]!.emissivityBack);
  const resistance =
    1 / he +
    unit.panes.reduce((s, p) => s + p.thicknessMm / 1000 / GLASS_CONDUCTIVITY, 0) +
    gaps.reduce((s, g) => s + 1 / g.conductanceWPerM2K, 0) +
    1 / hi;
  return { uValueWPerM2K: 1 / resistance, gaps, internalCoefficientWPerM2K: hi };
}

/** Gap width [mm] at which Nu reaches 1: Gr·Pr(s) = A^(−1/n), vertical, ΔT 15 K, T_m 283 K. */
export function convectionOnsetWidthMm(gas: "air" | "argon" | "krypton", tiltDeg = 90): number {
  const { a, n } = constantsAt(tiltDeg);
  const threshold = a ** (-1 / n);
  const p = gasProperties(gas);
  const s3 =
    (threshold * MEAN_TEMPERATURE_K * p.dynamicViscosityPaS ** 2) / (GRAVITY * TEMPERATURE_DIFFERENCE_K * p.densityKgPerM3 ** 2 * prandtl(p));
  return Math.cbrt(s3) * 1000;
}

/** Every quantity named `gap.X` is the same in every gap of the cases; this checks that and returns it. */
function sameInEveryGap(gaps: readonly GapResult[], key: keyof GapResult): number {
  const first = gaps[0]![key];
  for (const g of gaps) if (Math.abs(g[key] - first) > 1e-9 * Math.max(1, Math.abs(first))) throw new Error(`gaps differ in ${key}`);
  return first;
}

/** The values this script computes for a case (its computed and closed-form cases). */
export function recomputeUValueCase(c: UValueCase): Recomputed {
  const input = c.input;
  switch (input.kind) {
    case "unit": {
      const r = uValueUnit(input);
      const out: Record<string, number> = {
        uValueWPerM2K: r.uValueWPerM2K,
        uValueRoundedToTenth: Math.round(r.uValueWPerM2K * 10) / 10,
        internalCoefficientWPerM2K: r.internalCoefficientWPerM2K,
      };
      if (r.gaps.length > 0) {
        for (const key of Object.keys(r.gaps[0]!) as (keyof GapResult)[]) out[`gap.${key}`] = sameInEveryGap(r.gaps, key);
      }
      return out;
    }
    case "radiative-conductance":
      return { radiativeConductanceWPerM2K: radiativeConductance(input.emissivity1, input.emissivity2) };
    case "internal-coefficient":
      return { internalCoefficientWPerM2K: internalCoefficient(input.roomSideEmissivity) };
    case "convection-onset":
      return { convectionOnsetWidthMm: convectionOnsetWidthMm(input.gas) };
    case "nusselt":
      // the unclamped correlation, to show how close the printed threshold comes to Nu = 1
      return { nusselt: constantsAt(input.tiltDeg).a * input.grashofPrandtl ** constantsAt(input.tiltDeg).n };
    case "convection-constants":
      throw new Error(`${c.id}: the convection constants are printed in the standard, not computed`);
  }
}

/** Every case of the domain this script answers for, next to its recomputation. */
export function uValueComparison(): ComparisonRow[] {
  return compareDomain(uValueDomain, SCRIPT, recomputeUValueCase, { rule: EXACT_BOUND, closedForm: true });
}

runWhenMain(import.meta.url, [["Centre-of-glass U value (EN 673:2011)", uValueComparison]]);
