/** The engine's values of the quantities a g-value case names (src/lib/physics/g-value.ts, EN 410). */
import { gValue, secondaryHeatTransfer, secondaryHeatTransferFactorsEn410 } from "@/lib/physics/g-value";
import type { GlazingThermalInput } from "@/lib/physics/u-value";
import type { GValueCaseInput } from "@/lib/reference-cases/g-value";
import type { Evaluation } from "../types";

/** The case's make-up (mm) as the engine takes it (m). */
export const gValueUnit = (unit: GValueCaseInput["unit"]): GlazingThermalInput => ({
  panes: unit.panes.map((p) => ({ thicknessM: p.thicknessMm * 1e-3, emissivityFront: p.emissivityFront, emissivityBack: p.emissivityBack })),
  gaps: unit.gaps.map((g) => ({ widthM: g.widthMm * 1e-3, gas: g.gas })),
});

const indexed = (name: string, values: readonly number[]) => Object.fromEntries(values.map((v, i) => [`${name}[${i}]`, v]));

/**
 * `factors` cases: the EN 410 network (N_k, Λ, each gap's h_s); `g` cases: q_i and g from the case's printed
 * optics and the unit's N_k.
 */
export function gValueValues(input: GValueCaseInput): Record<string, number> {
  const r = secondaryHeatTransferFactorsEn410(gValueUnit(input.unit), input.glassConduction ? { glassConduction: input.glassConduction } : {});
  if (input.kind === "factors") {
    return {
      ...indexed("factors", r.factors),
      ...indexed("conductancesBetweenPanesWPerM2K", r.conductancesBetweenPanesWPerM2K),
      ...Object.fromEntries(r.thermal.gaps.map((g, i) => [`gaps[${i}].conductanceWPerM2K`, g.conductanceWPerM2K])),
    };
  }
  if (!input.optics) throw new Error("a g case needs its optical input");
  const o = input.optics;
  return {
    secondaryHeatTransfer: secondaryHeatTransfer(o.absorptances, r.factors),
    gValue: gValue(o.solarTransmittance, o.absorptances, r.factors),
  };
}

export const evaluateGValue = (c: { readonly input: GValueCaseInput }): Evaluation => ({ values: gValueValues(c.input) });
