/**
 * Reference cases: light transmittance of a unit at normal incidence by the adding method, where each pane
 * gives τv and, where known, its light reflectances; with an unknown reflectance the engine gives the range
 * that every possible reflectance (0 … 1 − τv) allows.
 *
 * Pure data. The pane values are typical data-sheet values of clear float (common practice, no source) or
 * invented for the case; every expected value is a closed form evaluated in float64.
 */
import type { CaseSource, ReferenceCase, ReferenceDomain, Tolerance } from "./types";

/** One pane's light values, outdoor face first: τv and, where the case gives them, ρv of each face. */
export interface LightPaneData {
  readonly T: number;
  readonly Rf?: number;
  readonly Rb?: number;
}

export interface LightTransmittanceInput {
  /** The panes, outdoor first. */
  readonly panes: readonly LightPaneData[];
}

export type LightTransmittanceCase = ReferenceCase<LightTransmittanceInput>;

const ADDING: CaseSource = {
  kind: "closed-form",
  formula: "double glazing τ = τ1·τ2/(1 − ρ1'·ρ2); triple glazing τ = τ1·τ2·τ3/((1 − ρ1'·ρ2)(1 − ρ2'·ρ3) − τ2²·ρ1'·ρ3)",
  citation: "ISO 9050:2003 §5 and EN 410:2011 §5, multiple glazing (clause numbers from memory)",
};
const ROUNDING: Tolerance = { abs: 1e-12, reason: "float64 rounding of the closed form" };
const EXACT: Tolerance = { abs: 0, reason: "yes (1) or no (0): exact" };

const bounds = (low: number, high: number, exact: boolean, tolerance: Tolerance = ROUNDING) => [
  { quantity: "low", unit: "-", value: low, tolerance },
  { quantity: "high", unit: "-", value: high, tolerance },
  { quantity: "exact", unit: "-", value: exact ? 1 : 0, tolerance: EXACT },
];

const clear = { T: 0.9, Rf: 0.08, Rb: 0.08 } as const;

const cases: readonly LightTransmittanceCase[] = [
  {
    id: "light-transmittance/double-clear",
    label: "double clear float (τv 0.90, ρv 0.08 per face): τv = 0.81/(1 − 0.0064) = 0.815217, exact",
    input: { panes: [clear, clear] },
    expected: bounds(0.8152173913043479, 0.8152173913043479, true),
    source: ADDING,
  },
  {
    id: "light-transmittance/double-clear/listed",
    label: "double clear float: within the τv of 0.81–0.82 usually listed for 4 | 16 | 4 clear",
    input: { panes: [clear, clear] },
    expected: [{ quantity: "low", unit: "-", value: 0.815, tolerance: { abs: 0.005, reason: "listed as the range 0.81–0.82" } }],
    source: {
      kind: "common-practice",
      note: "makers' tables of 4 | 16 | 4 clear double glazing list τv ≈ 0.81–0.82 (from memory; no single source)",
    },
  },
  {
    id: "light-transmittance/triple",
    label: "triple unit with unequal faces (invented values): τv = 0.637072 by the triple-glazing closed form",
    input: {
      panes: [
        { T: 0.89, Rf: 0.08, Rb: 0.09 },
        { T: 0.8, Rf: 0.1, Rb: 0.05 },
        { T: 0.88, Rf: 0.07, Rb: 0.08 },
      ],
    },
    expected: bounds(0.6370720066456568, 0.6370720066456568, true),
    source: ADDING,
  },
  {
    id: "light-transmittance/single-tau-only",
    label: "a single pane giving τv 0.71 alone: the unit's τv is 0.71, exact (no reflectance enters)",
    input: { panes: [{ T: 0.71 }] },
    expected: bounds(0.71, 0.71, true, { abs: 0, reason: "the pane's own value: exact" }),
    source: { kind: "closed-form", formula: "one pane: τ = τ1" },
  },
  {
    id: "light-transmittance/unknown-reflectance",
    label: "clear pane, then a pane giving τv 0.70 alone: the range 0.63 (ρ = 0) to 0.63/(1 − 0.08·0.30) = 0.645492 (ρ = 1 − τv)",
    input: { panes: [clear, { T: 0.7 }] },
    expected: bounds(0.63, 0.6454918032786885, false),
    source: {
      kind: "closed-form",
      formula: "τ1·τ2/(1 − ρ1'·ρ2) is increasing in the unknown ρ2 ∈ [0, 1 − τ2]: τ1·τ2 at ρ2 = 0, τ1·τ2/(1 − ρ1'(1 − τ2)) at the top",
      citation: "ISO 9050:2003 §5 (from memory)",
    },
  },
];

export const lightTransmittanceDomain: ReferenceDomain<LightTransmittanceInput> = {
  domain: "light-transmittance",
  title: "Light transmittance at normal incidence, and its range where light reflectances are unknown",
  cases,
};
