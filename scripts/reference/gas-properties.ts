/**
 * Independent recomputation of the computed gas-property reference cases
 * (`src/lib/reference-cases/gas-properties.ts`).
 *
 * Formulas:
 *   Pr = μ c / λ                                  EN 673:2011 clause 5, basic formulae (equation from memory)
 *   P_mix = Σ F_i P_i, for ρ, μ, λ, c separately  EN 673:2011 clause 6, gas mixtures (from memory)
 * Data: the gas property table at 10 °C of EN 673:2011 clause 6 (values from memory), read from the
 * published cases of the case module. Uses nothing from the product's physics code.
 *
 * Run: npx tsx scripts/reference/gas-properties.ts
 */
import { gasPropertiesDomain, type GasFillData, type GasNameData, type GasPropertiesCase } from "@/lib/reference-cases/gas-properties";
import { caseById, expectedOf } from "@/lib/reference-cases/read";
import { compareDomain, EXACT_BOUND, runWhenMain, type ComparisonRow, type Recomputed } from "./compare";

const SCRIPT = "scripts/reference/gas-properties.ts";

export interface GasData {
  readonly densityKgPerM3: number;
  readonly dynamicViscosityPaS: number;
  readonly conductivityWPerMK: number;
  readonly specificHeatJPerKgK: number;
}

const GASES: readonly GasNameData[] = ["air", "argon", "krypton"];
const KEYS = ["densityKgPerM3", "dynamicViscosityPaS", "conductivityWPerMK", "specificHeatJPerKgK"] as const;

/** The EN 673 table at 10 °C, taken from the published (tabulated) cases of the case module. */
export function en673GasTable(): Readonly<Record<GasNameData, GasData>> {
  const table = {} as Record<GasNameData, GasData>;
  for (const gas of GASES) {
    const c = caseById(gasPropertiesDomain.cases, `gas-properties/${gas}/10C`);
    const get = (q: string) => expectedOf(c, q).value;
    table[gas] = {
      densityKgPerM3: get("densityKgPerM3"),
      dynamicViscosityPaS: get("dynamicViscosityPaS"),
      conductivityWPerMK: get("conductivityWPerMK"),
      specificHeatJPerKgK: get("specificHeatJPerKgK"),
    };
  }
  return table;
}

/** Properties of a fill: the pure gas, or every property mixed linearly by volume fraction. */
export function gasProperties(fill: GasFillData): GasData {
  const table = en673GasTable();
  if (typeof fill === "string") return table[fill];
  const out = { densityKgPerM3: 0, dynamicViscosityPaS: 0, conductivityWPerMK: 0, specificHeatJPerKgK: 0 };
  for (const gas of GASES) {
    const f = fill[gas] ?? 0;
    for (const k of KEYS) out[k] += f * table[gas][k];
  }
  return out;
}

/** Prandtl number μ c / λ. */
export function prandtl(g: GasData): number {
  return (g.dynamicViscosityPaS * g.specificHeatJPerKgK) / g.conductivityWPerMK;
}

/** The values this script computes for a case (the tabulated, published cases are its data, not its results). */
export function recomputeGasPropertiesCase(c: GasPropertiesCase): Recomputed {
  const g = gasProperties(c.input.gas);
  return { ...g, prandtl: prandtl(g) };
}

/** Every case of the domain this script answers for, next to its recomputation. */
export function gasPropertiesComparison(): ComparisonRow[] {
  return compareDomain(gasPropertiesDomain, SCRIPT, recomputeGasPropertiesCase, { rule: EXACT_BOUND, closedForm: true });
}

runWhenMain(import.meta.url, [["Gas properties at 10 °C (EN 673:2011)", gasPropertiesComparison]]);
