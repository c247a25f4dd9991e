/** The engine's values of the quantities a gas-properties case names (src/lib/physics/gas-properties.ts, EN 673). */
import { gasPropertiesEn673 } from "@/lib/physics/gas-properties";
import type { GasPropertiesCaseInput } from "@/lib/reference-cases/gas-properties";
import type { Evaluation } from "../types";

export function gasPropertiesValues(input: GasPropertiesCaseInput): Record<string, number> {
  const g = gasPropertiesEn673(input.gas);
  return {
    densityKgPerM3: g.densityKgPerM3,
    dynamicViscosityPaS: g.dynamicViscosityPaS,
    conductivityWPerMK: g.conductivityWPerMK,
    specificHeatJPerKgK: g.specificHeatJPerKgK,
    // Pr = μc/λ of the (mixed) properties
    prandtl: (g.dynamicViscosityPaS * g.specificHeatJPerKgK) / g.conductivityWPerMK,
  };
}

export const evaluateGasProperties = (c: { readonly input: GasPropertiesCaseInput }): Evaluation => ({ values: gasPropertiesValues(c.input) });
