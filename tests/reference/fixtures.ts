// Shared by the reference tests: the handbook's test panes and its comparison rule for printed values.
import { expect } from "vitest";
import { asDegrees, toRadians, type Radians } from "@/lib/physics/units";
import type { PaneSpec } from "@/lib/physics/optics";

export const deg = (d: number): Radians => toRadians(asDegrees(d));

/**
 * Compares with a value printed to a given number of decimals: tolerance half a unit in the last
 * printed digit (the handbook's convention for its computed check values).
 */
export function printed(actual: number, value: string): void {
  const decimals = value.includes(".") ? value.split(".")[1]!.length : 0;
  const tol = 0.5 * 10 ** -decimals * (1 + 1e-9);
  expect(Math.abs(actual - Number(value)), `expected ${value}, got ${actual}`).toBeLessThanOrEqual(tol);
}

/** The reference test pane: 6 mm, n = 1.52, α = 0.02 /mm (a broadband test fixture, not a real glass). */
export const pane6mm = { thicknessM: 0.006, refractiveIndex: 1.52, absorptionPerM: 20 };
/** Low-iron pane: 4 mm, n = 1.52, α = 0.002 /mm. */
export const lowIron4mm = { thicknessM: 0.004, refractiveIndex: 1.52, absorptionPerM: 2 };

/** A hypothetical coated 6 mm pane given by measured values (not a product): Rf ≠ Rb. */
export const coated6mmSpec = {
  kind: "measured",
  thicknessM: 0.006,
  solar: { T: 0.45, Rf: 0.3, Rb: 0.2 },
  visible: { T: 0.7, Rf: 0.1, Rb: 0.06 },
} as const satisfies PaneSpec;
/** The reference 6 mm pane as a glazing layer. */
export const clear6mmSpec: PaneSpec = { kind: "physical", ...pane6mm };
