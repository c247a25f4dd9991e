/** The engine's values of the quantities a U-value case names (src/lib/physics/u-value.ts, EN 673). */
import {
  convectionConstantsEn673,
  convectionOnsetWidthEn673,
  internalHeatTransferCoefficientEn673,
  nusseltNumberEn673,
  radiativeConductanceEn673,
  uValueEn673,
  type GapThermalResult,
  type GlazingThermalInput,
  type UValueOptions,
} from "@/lib/physics/u-value";
import type { UValueCaseInput } from "@/lib/reference-cases/u-value";
import type { ComputedValues, Evaluation } from "../types";

type UnitInput = Extract<UValueCaseInput, { kind: "unit" }>;

/** The case's unit (mm) as the engine takes it (m), like the app converts at the edge. */
export const uValueUnit = (input: UnitInput): GlazingThermalInput => ({
  panes: input.panes.map((p) => ({ thicknessM: p.thicknessMm * 1e-3, emissivityFront: p.emissivityFront, emissivityBack: p.emissivityBack })),
  gaps: input.gaps.map((g) => ({ widthM: g.widthMm * 1e-3, gas: g.gas })),
});
export const uValueOptions = (input: UnitInput): UValueOptions => ({
  ...(input.externalCoefficientWPerM2K === undefined ? {} : { externalCoefficientWPerM2K: input.externalCoefficientWPerM2K }),
  ...(input.tiltDeg === undefined ? {} : { tiltDeg: input.tiltDeg }),
});

const GAP_KEYS = [
  "temperatureDifferenceK",
  "grashof",
  "prandtl",
  "grashofPrandtl",
  "nusselt",
  "radiativeConductanceWPerM2K",
  "gasConductanceWPerM2K",
  "conductanceWPerM2K",
] as const satisfies readonly (keyof GapThermalResult)[];

/** U declared to one decimal (EN 673:2011 clause 9, from memory). */
export const roundToTenth = (x: number): number => Math.round(x * 10) / 10;

/** Quantities named `gap.X` hold X of every gap of the unit. */
export function uValueValues(input: UValueCaseInput): ComputedValues {
  switch (input.kind) {
    case "unit": {
      const r = uValueEn673(uValueUnit(input), uValueOptions(input));
      return {
        uValueWPerM2K: r.uValueWPerM2K,
        uValueRoundedToTenth: roundToTenth(r.uValueWPerM2K),
        ...Object.fromEntries(GAP_KEYS.map((k) => [`gap.${k}`, r.gaps.map((g) => g[k])])),
      };
    }
    case "radiative-conductance":
      return { radiativeConductanceWPerM2K: radiativeConductanceEn673(input.emissivity1, input.emissivity2) };
    case "internal-coefficient":
      return { internalCoefficientWPerM2K: internalHeatTransferCoefficientEn673(input.roomSideEmissivity) };
    case "convection-onset":
      return { convectionOnsetWidthMm: convectionOnsetWidthEn673(input.gas) * 1e3 };
    case "nusselt":
      return { nusselt: nusseltNumberEn673(input.grashofPrandtl, input.tiltDeg) };
    case "convection-constants": {
      const k = convectionConstantsEn673(input.tiltDeg);
      return { tabulatedTiltDeg: k.tabulatedTiltDeg, a: k.a, n: k.n };
    }
  }
}

export const evaluateUValue = (c: { readonly input: UValueCaseInput }): Evaluation => ({ values: uValueValues(c.input) });
