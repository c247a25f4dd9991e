/** The engine's window-averaged diffuse view factors of a shading case (src/lib/physics/shading, prepared shading). */
import { prepareShading } from "@/lib/physics/shading";
import type { ShadingDiffuseInput } from "@/lib/reference-cases/shading-diffuse";
import type { Evaluation } from "../types";
import { deg } from "./angles";

export function shadingDiffuseValues(i: ShadingDiffuseInput): Record<string, number> {
  const d = prepareShading({
    windowWidthM: i.windowWidthM,
    windowHeightM: i.windowHeightM,
    surfaceTiltRad: deg(i.surfaceTiltDeg),
    ...(i.overhang ? { overhang: { ...i.overhang } } : {}),
    ...(i.fins ? { fins: { ...i.fins } } : {}),
  }).diffuse;
  return { skyIsotropic: d.skyIsotropic, ground: d.ground, horizonBand: d.horizonBand };
}

export const evaluateShadingDiffuse = (c: { readonly input: ShadingDiffuseInput }): Evaluation => ({ values: shadingDiffuseValues(c.input) });
