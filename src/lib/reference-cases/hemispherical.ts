/**
 * Reference cases: hemispherical (diffuse) values of glazing, X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ, with X(θ) taken
 * per polarisation through the whole stack.
 *
 * Every expected value is computed independently, in float64, by scripts/reference/hemispherical.ts with its own
 * 400-node Gauss–Legendre rule (or with the node count a quadrature case names). Each tolerance is half a unit in
 * the last printed digit.
 */
import { ev, half } from "./build";
import { LOW_IRON_4MM, PANE_6MM, type PaneMm } from "./panes";
import type { CaseSource, ReferenceCase, ReferenceDomain } from "./types";

/**
 * Uncoated panes from outdoors inwards. `nodes`: a quadrature-accuracy case, the integral evaluated with that many
 * Gauss–Legendre nodes; without it, the converged integral. Quantities: T, Rf and the front absorptances A1, A2, …
 */
export interface HemisphericalCaseInput {
  readonly panes: readonly PaneMm[];
  readonly nodes?: number;
}

export const HEMISPHERICAL_SCRIPT = "scripts/reference/hemispherical.ts";

const computed: CaseSource = {
  kind: "computed",
  formula:
    "hemispherical (diffuse) average X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ, ISO 15099:2003, optical section, and J. A. " +
    "Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley 2013, ch. 5 (both from memory); " +
    "400-node Gauss–Legendre quadrature (M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions, 1964, " +
    "§25.4.29, from memory); X(θ) from the slab series and net-radiation method per polarisation",
  script: HEMISPHERICAL_SCRIPT,
  fromMemory: true,
};

export const single6mmCase: ReferenceCase<HemisphericalCaseInput> = {
  id: "hemispherical/6mm",
  label: "6 mm pane (n = 1.52, α = 0.02 /mm): hemispherical T, R, A",
  input: { panes: [PANE_6MM] },
  expected: [ev("T", 0.736431), ev("Rf", 0.138241), ev("A1", 0.125328)],
  source: computed,
};

export const lowIron4mmCase: ReferenceCase<HemisphericalCaseInput> = {
  id: "hemispherical/low-iron-4mm",
  label: "4 mm low-iron pane (n = 1.52, α = 0.002 /mm): hemispherical T, R, A",
  input: { panes: [LOW_IRON_4MM] },
  expected: [ev("T", 0.83855), ev("Rf", 0.15238), ev("A1", 0.00906953, half(8))],
  source: computed,
};

export const double6mmCase: ReferenceCase<HemisphericalCaseInput> = {
  id: "hemispherical/double-6-6",
  label: "double glazing 6 mm + 6 mm, per polarisation: hemispherical T, R, A1, A2",
  input: { panes: [PANE_6MM, PANE_6MM] },
  expected: [ev("T", 0.577379), ev("Rf", 0.191431), ev("A1", 0.136229), ev("A2", 0.0949614, half(7))],
  source: computed,
};

export const quadratureCases: readonly ReferenceCase<HemisphericalCaseInput>[] = [
  {
    id: "hemispherical/6mm/gauss-legendre-10",
    label: "quadrature accuracy: 6 mm pane hemispherical T with 10 Gauss–Legendre nodes",
    input: { panes: [PANE_6MM], nodes: 10 },
    expected: [ev("T", 0.736434)],
    source: computed,
  },
  {
    id: "hemispherical/6mm/gauss-legendre-20",
    label: "quadrature accuracy: 6 mm pane hemispherical T with 20 Gauss–Legendre nodes",
    input: { panes: [PANE_6MM], nodes: 20 },
    expected: [ev("T", 0.7364312, half(7))],
    source: computed,
  },
];

export const hemisphericalDomain: ReferenceDomain<HemisphericalCaseInput> = {
  domain: "hemispherical",
  title: "Hemispherical (diffuse) values of glazing",
  cases: [single6mmCase, lowIron4mmCase, double6mmCase, ...quadratureCases],
};
