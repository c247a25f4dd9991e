/** The engine's values of the quantities a shading case names (src/lib/physics/shading). */
import {
  finShadedWidthM,
  horizontalShadowAngleRad,
  overhangShadedHeightM,
  prepareShading,
  profileAngleRad,
  sunlitFractionAt,
  type ShadingSpec,
} from "@/lib/physics/shading";
import { surfaceOrientationDeg } from "@/lib/physics/surface-geometry";
import type { ShadingInput } from "@/lib/reference-cases/shading";
import type { Evaluation } from "../types";
import { deg } from "./angles";

const RAD = 180 / Math.PI;

/** The case's window and devices as the engine's shading spec. */
export const shadingSpecOf = (i: ShadingInput): ShadingSpec => ({
  windowWidthM: i.windowWidthM,
  windowHeightM: i.windowHeightM,
  surfaceTiltRad: deg(i.surfaceTiltDeg),
  overhang: { ...i.overhang },
  fins: { ...i.fins },
});

export function shadingValues(i: ShadingInput): Record<string, number> {
  const gamma = horizontalShadowAngleRad(deg(i.sunAzimuthDeg), deg(i.surfaceAzimuthDeg));
  const omega = profileAngleRad(deg(i.sunAltitudeDeg), gamma);
  const surface = surfaceOrientationDeg(i.surfaceAzimuthDeg, i.surfaceTiltDeg);
  const at = (spec: ShadingSpec) => sunlitFractionAt(prepareShading(spec), surface, deg(i.sunAltitudeDeg), deg(i.sunAzimuthDeg));
  const spec = shadingSpecOf(i);
  const { fins: _fins, ...overhangOnly } = spec;
  const { overhang: _overhang, ...finsOnly } = spec;
  return {
    horizontalShadowAngleDeg: gamma * RAD,
    tanProfileAngle: Math.tan(omega),
    profileAngleDeg: omega * RAD,
    shadowDropM: i.overhang.depthM * Math.tan(omega),
    overhangShadedHeightM: overhangShadedHeightM(i.overhang.depthM, i.overhang.gapAboveHeadM, i.windowHeightM, omega),
    finShadedWidthM: finShadedWidthM(i.fins.depthM, i.fins.gapFromJambM, i.windowWidthM, gamma),
    sunlitFraction: at(spec),
    sunlitFractionOverhangOnly: at(overhangOnly),
    sunlitFractionFinsOnly: at(finsOnly),
  };
}

export const evaluateShading = (c: { readonly input: ShadingInput }): Evaluation => ({ values: shadingValues(c.input) });
