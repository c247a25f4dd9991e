/** Degrees as printed in the cases, in the engine's radians. */
import { asDegrees, toRadians, type Radians } from "@/lib/physics/units";

export const deg = (d: number): Radians => toRadians(asDegrees(d));

/** A pane as the cases give it (millimetres, per-millimetre absorption), in the engine's SI units. */
export const paneFromMm = (p: { readonly thicknessMm: number; readonly refractiveIndex: number; readonly absorptionPerMm: number }) => ({
  thicknessM: p.thicknessMm / 1000,
  refractiveIndex: p.refractiveIndex,
  absorptionPerM: p.absorptionPerMm * 1000,
});
