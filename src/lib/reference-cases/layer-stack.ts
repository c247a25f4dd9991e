/**
 * Reference cases: multi-layer glazing by the adding / net-radiation method (multiple-glazing formulas of
 * EN 410 and ISO 9050), with uncoated slab layers taken per polarisation.
 *
 * Every expected value is computed independently, in float64, by scripts/reference/layer-stack.ts. Values are
 * printed to 6 decimals; each tolerance is half a unit in the 6th decimal.
 */
import { ev } from "./build";
import { PANE_6MM, type PaneMm } from "./panes";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

/** A layer: an uncoated pane (slab per polarisation), or a layer given by its own (T, Rf, Rb), the same for s and p. */
export type StackLayer =
  { readonly kind: "pane"; readonly pane: PaneMm } | { readonly kind: "given"; readonly T: number; readonly Rf: number; readonly Rb: number };

/**
 * Layers from outdoors (1) inwards, the angle of incidence in degrees, and the route:
 * "per-polarization" = the whole stack for s and for p, then averaged; "averaged" = each layer averaged over s and p
 * first; "s" / "p" = one polarisation only. Quantities: T, Rf, Rb and the front absorptances A1, A2, …
 */
export interface LayerStackCaseInput {
  readonly layers: readonly StackLayer[];
  readonly thetaDeg: number;
  readonly route: "per-polarization" | "averaged" | "s" | "p";
}

export const LAYER_STACK_SCRIPT = "scripts/reference/layer-stack.ts";

const computed: CaseSource = {
  kind: "computed",
  formula:
    "net-radiation (adding) method for specular layers, the multiple-glazing formulas of EN 410:2011 §5 and " +
    "ISO 9050:2003 §4 (clause numbers from memory), τ = τ1τ2/(1 − ρ1′ρ2), ρ = ρ1 + τ1²ρ2/(1 − ρ1′ρ2); slab layers " +
    "per polarisation (J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., ch. 5, from " +
    "memory; M. Rubin, Int. J. Energy Research 6:123–133, 1982)",
  script: LAYER_STACK_SCRIPT,
  fromMemory: true,
};

/** The 6 mm model pane: n = 1.52, α = 0.02 /mm. */
const pane6: StackLayer = { kind: "pane", pane: PANE_6MM };

export const double0Case: ReferenceCase<LayerStackCaseInput> = {
  id: "layer-stack/double-6-6/0deg",
  label: "double glazing, two 6 mm panes, at 0°: T, R, A1, A2",
  input: { layers: [pane6, pane6], thetaDeg: 0, route: "per-polarization" },
  expected: [ev("T", 0.666439), ev("Rf", 0.122195), ev("A1", 0.119267), ev("A2", 0.092099)],
  source: computed,
};

/** Route, T, R, A1, A2 of two 6 mm panes at 60°. */
const rows60: readonly [LayerStackCaseInput["route"], string, number, number, number, number][] = [
  ["per-polarization", "per polarisation, then averaged", 0.560292, 0.193315, 0.145683, 0.10071],
  ["s", "s only", 0.378386, 0.381989, 0.155224, 0.084401],
  ["p", "p only", 0.742198, 0.004641, 0.136142, 0.117019],
  ["averaged", "each pane averaged over s and p first", 0.538, 0.21516, 0.147701, 0.099139],
];

export const double60Cases: readonly ReferenceCase<LayerStackCaseInput>[] = rows60.map(([route, words, T, R, A1, A2]) => ({
  id: `layer-stack/double-6-6/60deg/${route}`,
  label: `double glazing, two 6 mm panes, at 60°, ${words}: T, R, A1, A2`,
  input: { layers: [pane6, pane6], thetaDeg: 60, route },
  expected: [ev("T", T), ev("Rf", R), ev("A1", A1), ev("A2", A2)],
  source: computed,
}));

export const triple0Case: ReferenceCase<LayerStackCaseInput> = {
  id: "layer-stack/triple-6-6-6/0deg",
  label: "triple glazing, three 6 mm panes, at 0°: T, R, A1, A2, A3",
  input: { layers: [pane6, pane6, pane6], thetaDeg: 0, route: "per-polarization" },
  expected: [ev("T", 0.547493), ev("Rf", 0.155056), ev("A1", 0.123808), ev("A2", 0.09798), ev("A3", 0.075661)],
  source: computed,
};

export const asymmetricCase: ReferenceCase<LayerStackCaseInput> = {
  id: "layer-stack/asymmetric/0deg",
  label: "hypothetical outer layer (T, Rf, Rb) = (0.60, 0.10, 0.25) with a 6 mm pane behind it, at 0°: T, Rf, Rb, A1, A2",
  input: { layers: [{ kind: "given", T: 0.6, Rf: 0.1, Rb: 0.25 }, pane6], thetaDeg: 0, route: "per-polarization" },
  expected: [ev("T", 0.497618), ev("Rf", 0.126891), ev("Rb", 0.242135), ev("A1", 0.306723), ev("A2", 0.068769)],
  source: computed,
};

export const layerStackDomain: ReferenceDomain<LayerStackCaseInput> = {
  domain: "layer-stack",
  title: "Multi-layer glazing (net-radiation method, per polarisation)",
  cases: [double0Case, ...double60Cases, triple0Case, asymmetricCase],
};
