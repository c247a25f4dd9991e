/**
 * Independent recomputation of the g-value reference cases (`src/lib/reference-cases/g-value.ts`): the
 * EN 410 secondary heat transfer and g, and the printed optical inputs of the cases from the panes they name.
 *
 * Formulas and sources:
 *   EN 410:2011, Glass in building — Determination of luminous and solar characteristics of glazing
 *   (secondary heat transfer factor clause; clause numbers and formulae from memory):
 *     g = τ_e + q_i,  q_i = Σ N_k α_e,k,  h_e = 23, h_i = 3.6 + 4.4 ε_i/0.837 W/(m²K)
 *     single glazing N = h_i/(h_e + h_i);
 *     double glazing q_i = [(α_e1 + α_e2)/h_e + α_e2/Λ] / [1/h_e + 1/h_i + 1/Λ]
 *     general form used here: N_k = (1/h_e + Σ_{j<k} 1/Λ_j) / (1/h_e + Σ_j 1/Λ_j + 1/h_i)
 *     (the resistance from pane k to outside over the total; equal to the double-glazing formula)
 *     1/Λ between panes: the gap's 1/h_s (EN 673:2011, scripts/reference/u-value.ts) plus the glass:
 *     the whole outermost and innermost pane, half of every middle pane (from memory).
 *   The optical inputs, for uncoated panes in air, per polarisation s and p, then averaged, from the optics
 *   scripts: Fresnel faces and absorbing slab (scripts/reference/absorbing-pane.ts: E. Hecht, Optics, 4th ed.,
 *   2002, §4.6, from memory; J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., 2013,
 *   ch. 5, from memory; M. Rubin, Int. J. Energy Research 6:123–133, 1982), panes combined by the adding
 *   (net-radiation) method (scripts/reference/layer-stack.ts: EN 410:2011 / ISO 9050:2003 multiple-glazing
 *   formulae, clause numbers from memory), hemispherical X_hem = ∫_0^{π/2} X(θ) sin 2θ dθ by 400-node
 *   Gauss–Legendre quadrature (scripts/reference/hemispherical.ts: ISO 15099:2003, optical section, and
 *   Duffie & Beckman ch. 5, from memory; M. Abramowitz & I. A. Stegun, Handbook of Mathematical Functions,
 *   1964, §25.4.29, from memory).
 * The g cases check the EN 410 formula on the printed optical inputs; this script also recomputes those
 * inputs from the panes and g from the unrounded optics. Uses nothing from the product's code.
 *
 * Run: npx tsx scripts/reference/g-value.ts
 */
import { gValueDomain, type GValueCase, type GValueCaseInput, type GValueOptics } from "@/lib/reference-cases/g-value";
import type { PaneMm } from "@/lib/reference-cases/panes";
import type { ReferenceCase } from "@/lib/reference-cases/types";
import { compareCases, compareDomain, EXACT_BOUND, runWhenMain, type ComparisonRow, type Recomputed } from "./compare";
import { hemispherical } from "./hemispherical";
import { stackAt, type StackResult } from "./layer-stack";
import { EXTERNAL_COEFFICIENT, GLASS_CONDUCTIVITY, internalCoefficient, uValueUnit } from "./u-value";

// ---------------------------------------------------------------------------------------------------------
// Optics of uncoated panes: the layer-stack and hemispherical scripts

export interface StackOptics {
  readonly solarTransmittance: number;
  readonly solarReflectanceFront: number;
  readonly absorptances: readonly number[];
}

const asLayers = (panes: readonly PaneMm[]) => panes.map((pane) => ({ kind: "pane" as const, pane }));
const asOptics = (r: StackResult): StackOptics => ({ solarTransmittance: r.T, solarReflectanceFront: r.Rf, absorptances: r.A });

/**
 * T, R and A_k of uncoated panes in air at angle θ. `polarization: 'per-stack'` solves the whole stack for s
 * and for p and averages the results; 'averaged' averages each pane's s and p first.
 */
export function stackOptics(panes: readonly PaneMm[], thetaRad: number, polarization: "per-stack" | "averaged" = "per-stack"): StackOptics {
  return asOptics(stackAt(asLayers(panes), thetaRad, polarization === "averaged" ? "averaged" : "per-polarization"));
}

/** Hemispherical (cosine-weighted) average ∫_0^{π/2} X(θ) sin 2θ dθ by 400-node Gauss–Legendre, per polarisation. */
export function hemisphericalOptics(panes: readonly PaneMm[]): StackOptics {
  const layers = asLayers(panes);
  const h = hemispherical((theta) => {
    const r = stackAt(layers, theta, "per-polarization");
    return [r.T, r.Rf, ...r.A];
  }, 400);
  return { solarTransmittance: h[0]!, solarReflectanceFront: h[1]!, absorptances: h.slice(2) };
}

/** The optics of a case's panes at its incidence, recomputed. */
export function recomputeOptics(o: GValueOptics): StackOptics {
  return o.incidence === "hemispherical" ? hemisphericalOptics(o.panes) : stackOptics(o.panes, (o.incidence.thetaDeg * Math.PI) / 180);
}

// ---------------------------------------------------------------------------------------------------------
// EN 410 thermal network

export interface Network {
  readonly gapConductances: readonly number[];
  readonly resistancesBetweenPanes: readonly number[];
  readonly factors: readonly number[];
}

export function network(unit: GValueCaseInput["unit"], glassConduction: "surfaces" | "none" = "surfaces"): Network {
  const u = uValueUnit(unit);
  const last = unit.panes.length - 1;
  const glass = (k: number) => (unit.panes[k]!.thicknessMm / 1000 / GLASS_CONDUCTIVITY) * (k === 0 || k === last ? 1 : 0.5);
  const resistances = u.gaps.map((g, k) => 1 / g.conductanceWPerM2K + (glassConduction === "surfaces" ? glass(k) + glass(k + 1) : 0));
  const re = 1 / EXTERNAL_COEFFICIENT;
  const ri = 1 / internalCoefficient(unit.panes[last]!.emissivityBack);
  const total = re + resistances.reduce((s, x) => s + x, 0) + ri;
  const factors = unit.panes.map((_, k) => (re + resistances.slice(0, k).reduce((s, x) => s + x, 0)) / total);
  return { gapConductances: u.gaps.map((g) => g.conductanceWPerM2K), resistancesBetweenPanes: resistances, factors };
}

/** q_i and g from optics and factors. */
export function gValue(t: number, absorptances: readonly number[], factors: readonly number[]): { qi: number; g: number } {
  const qi = absorptances.reduce((s, a, k) => s + a * factors[k]!, 0);
  return { qi, g: t + qi };
}

// ---------------------------------------------------------------------------------------------------------
// Comparisons

/** The values this script computes for a case (g from the printed optical inputs). */
export function recomputeGValueCase(c: GValueCase): Recomputed {
  const net = network(c.input.unit, c.input.glassConduction);
  const out: Record<string, number> = {};
  net.factors.forEach((n, k) => (out[`factors[${k}]`] = n));
  net.gapConductances.forEach((h, k) => (out[`gaps[${k}].conductanceWPerM2K`] = h));
  net.resistancesBetweenPanes.forEach((r, k) => (out[`conductancesBetweenPanesWPerM2K[${k}]`] = 1 / r));
  const o = c.input.optics;
  if (o) {
    const { qi, g } = gValue(o.solarTransmittance, o.absorptances, net.factors);
    out.secondaryHeatTransfer = qi;
    out.gValue = g;
  }
  return out;
}

const SCRIPT = "scripts/reference/g-value.ts";

/** Every case of the domain this script answers for, next to its recomputation. */
export function gValueComparison(): ComparisonRow[] {
  return compareDomain(gValueDomain, SCRIPT, recomputeGValueCase, { rule: EXACT_BOUND, closedForm: true });
}

/** Pseudo-cases: each printed optical input of a g case next to its rounding, for the comparison table. */
function opticalInputCases(): ReferenceCase<GValueOptics>[] {
  const out: ReferenceCase<GValueOptics>[] = [];
  for (const c of gValueDomain.cases) {
    const o = c.input.optics;
    if (!o) continue;
    const expected = [
      { quantity: "solarTransmittance", unit: "-", value: o.solarTransmittance, tolerance: o.printedRounding },
      ...(o.solarReflectanceFront === undefined
        ? []
        : [{ quantity: "solarReflectanceFront", unit: "-", value: o.solarReflectanceFront, tolerance: o.printedRounding }]),
      ...o.absorptances.map((a, k) => ({
        quantity: `absorptances[${k}]`,
        unit: "-",
        value: a,
        tolerance: o.absorptancesRounding?.[k] ?? o.printedRounding,
      })),
    ];
    out.push({ id: `${c.id} (optical input)`, label: c.label, input: o, expected, source: c.source });
  }
  return out;
}

/** The printed optical inputs of the g cases against the optics recomputed from the named panes. */
export function opticalInputComparison(): ComparisonRow[] {
  return compareCases(
    opticalInputCases(),
    (c) => {
      const r = recomputeOptics(c.input);
      const out: Record<string, number> = { solarTransmittance: r.solarTransmittance, solarReflectanceFront: r.solarReflectanceFront };
      r.absorptances.forEach((a, k) => (out[`absorptances[${k}]`] = a));
      return out;
    },
    EXACT_BOUND,
  );
}

/** g of the g cases from the recomputed, unrounded optics against the printed g. */
export function gFromRecomputedOpticsComparison(): ComparisonRow[] {
  return compareCases(
    gValueDomain.cases.filter((c) => c.input.optics),
    (c) => {
      const r = recomputeOptics(c.input.optics!);
      const { qi, g } = gValue(r.solarTransmittance, r.absorptances, network(c.input.unit, c.input.glassConduction).factors);
      return { secondaryHeatTransfer: qi, gValue: g };
    },
    EXACT_BOUND,
  );
}

runWhenMain(import.meta.url, [
  ["EN 410:2011 g and N_k (g from the printed optical inputs)", gValueComparison],
  ["Printed optical inputs, recomputed from the named panes", opticalInputComparison],
  ["g from the recomputed (unrounded) optics", gFromRecomputedOpticsComparison],
]);
