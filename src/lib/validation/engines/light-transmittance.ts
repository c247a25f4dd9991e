/** The engine's values of the quantities a light-transmittance case names (src/lib/physics/light-transmittance-bounds.ts). */
import { lightTransmittanceBounds } from "@/lib/physics/light-transmittance-bounds";
import type { LightTransmittanceInput } from "@/lib/reference-cases/light-transmittance";
import type { Evaluation } from "../types";

export function lightTransmittanceValues(input: LightTransmittanceInput): Record<string, number> {
  const b = lightTransmittanceBounds(input.panes);
  return { low: b.low, high: b.high, exact: b.exact ? 1 : 0 };
}

export const evaluateLightTransmittance = (c: { readonly input: LightTransmittanceInput }): Evaluation => ({
  values: lightTransmittanceValues(c.input),
});
