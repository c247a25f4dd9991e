/** The engine's values of the quantities a layer-stack case names (src/lib/physics/layer-stack.ts). */
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import { combineLayers, glazingOpticsAt, type LayerOptics, type PolarizedLayerSource, type StackOptics } from "@/lib/physics/layer-stack";
import type { Radians } from "@/lib/physics/units";
import type { LayerStackCaseInput, StackLayer } from "@/lib/reference-cases/layer-stack";
import type { Evaluation } from "../types";
import { deg, paneFromMm } from "./angles";

/** A case layer as the engine's per-polarisation layer source. */
export const layerSourceOf = (layer: StackLayer): PolarizedLayerSource => {
  if (layer.kind === "given") return () => ({ s: layer, p: layer });
  const pane = paneFromMm(layer.pane);
  return (theta) => {
    const o = absorbingPaneOptics(pane, theta);
    return { s: { T: o.s.T, Rf: o.s.R, Rb: o.s.R }, p: { T: o.p.T, Rf: o.p.R, Rb: o.p.R } };
  };
};

/** A case layer averaged over s and p at one angle (the route of combineLayers with unpolarised layers). */
export const unpolarizedLayerOf = (layer: StackLayer, theta: Radians): LayerOptics => {
  const l = layerSourceOf(layer)(theta);
  return { T: 0.5 * (l.s.T + l.p.T), Rf: 0.5 * (l.s.Rf + l.p.Rf), Rb: 0.5 * (l.s.Rb + l.p.Rb) };
};

export const stackQuantities = (r: StackOptics): Record<string, number> => ({
  T: r.T,
  Rf: r.Rf,
  Rb: r.Rb,
  ...Object.fromEntries(r.absorptanceFront.map((a, i) => [`A${i + 1}`, a])),
});

/** The case's route: one polarisation through combineLayers, or the stack solver with the case's polarisation. */
export function layerStackValues(input: LayerStackCaseInput): Record<string, number> {
  const theta = deg(input.thetaDeg);
  const sources = input.layers.map(layerSourceOf);
  if (input.route === "s" || input.route === "p") {
    const route = input.route;
    return stackQuantities(combineLayers(sources.map((src) => src(theta)[route])));
  }
  return stackQuantities(glazingOpticsAt(sources, theta, { polarization: input.route }));
}

export const evaluateLayerStack = (c: { readonly input: LayerStackCaseInput }): Evaluation => ({ values: layerStackValues(c.input) });
