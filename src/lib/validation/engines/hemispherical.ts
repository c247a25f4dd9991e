/** The engine's hemispherical values of the quantities a case names (src/lib/physics/hemispherical.ts, optics.ts). */
import { absorbingPaneOptics } from "@/lib/physics/absorbing-pane";
import { hemisphericalAverage } from "@/lib/physics/hemispherical";
import { prepareGlazing, type PaneSpec } from "@/lib/physics/optics";
import { asRadians } from "@/lib/physics/units";
import type { HemisphericalCaseInput } from "@/lib/reference-cases/hemispherical";
import type { Evaluation } from "../types";
import { paneFromMm } from "./angles";

export function hemisphericalValues(input: HemisphericalCaseInput): Record<string, number> {
  if (input.nodes !== undefined) {
    // quadrature-accuracy case: one pane's T with the given node count
    if (input.panes.length !== 1) throw new Error("a quadrature case names one pane");
    const pane = paneFromMm(input.panes[0]!);
    return { T: hemisphericalAverage((t) => absorbingPaneOptics(pane, asRadians(t)).T, input.nodes) };
  }
  const specs: PaneSpec[] = input.panes.map((p) => ({ kind: "physical", ...paneFromMm(p) }));
  const h = prepareGlazing(specs).hemispherical().solar;
  return { T: h.T, Rf: h.Rf, Rb: h.Rb, ...Object.fromEntries(h.absorptanceFront.map((a, i) => [`A${i + 1}`, a])) };
}

export const evaluateHemispherical = (c: { readonly input: HemisphericalCaseInput }): Evaluation => ({ values: hemisphericalValues(c.input) });
