/**
 * Independent recomputation of the absorbing-pane reference cases (src/lib/reference-cases/absorbing-pane.ts).
 *
 * Formula: the incoherent multiple-reflection series of a slab with two identical uncoated faces, taken for each
 * polarisation j separately, as in
 *   J. A. Duffie & W. A. Beckman, Solar Engineering of Thermal Processes, 4th ed., Wiley 2013, ch. 5
 *   (transmission through glazing; chapter from memory), and
 *   M. Rubin, "Solar optical properties of windows", Int. J. Energy Research 6:123–133, 1982:
 *     ρ = R_j(θ) (Fresnel, air/glass face),  τ = exp(−α d / cos θt)  (Beer–Lambert along the refracted path)
 *     T_j = (1 − ρ)² τ / (1 − ρ² τ²),  R_j = ρ + ρ (1 − ρ)² τ² / (1 − ρ² τ²),  A_j = 1 − T_j − R_j
 *     unpolarised X = (X_s + X_p)/2
 * Face reflectances from scripts/reference/fresnel.ts (Fresnel equations, E. Hecht, Optics, 4th ed., §4.6).
 * Written from these formulas alone; it does not use the product's code.
 *
 * Run: npx tsx scripts/reference/absorbing-pane.ts
 */
import { ABSORBING_PANE_SCRIPT, absorbingPaneDomain, type AbsorbingPaneCaseInput } from "@/lib/reference-cases/absorbing-pane";
import type { PaneMm } from "@/lib/reference-cases/panes";
import { interfaceAt } from "./fresnel";
import { compareDomain, PRINTED_DIGITS, runWhenMain, type Recomputed } from "./compare";

const DEG = Math.PI / 180;

export interface SlabValues {
  readonly T: number;
  readonly R: number;
  readonly A: number;
}

/** The slab series for one face reflectance ρ and internal transmittance τ. */
export function slab(rho: number, tau: number): SlabValues {
  const den = 1 - rho * rho * tau * tau;
  const T = ((1 - rho) ** 2 * tau) / den;
  const R = rho + (rho * (1 - rho) ** 2 * tau * tau) / den;
  return { T, R, A: 1 - T - R };
}

export interface PaneAtAngle {
  readonly thetaTDeg: number;
  readonly tau: number;
  readonly s: SlabValues;
  readonly p: SlabValues;
  readonly T: number;
  readonly R: number;
  readonly A: number;
}

/** One uncoated pane in air at theta (radians), per polarisation and unpolarised. */
export function paneAt(pane: PaneMm, theta: number): PaneAtAngle {
  const n = pane.refractiveIndex;
  const sinT = Math.sin(theta) / n;
  const cosT = Math.sqrt(1 - sinT * sinT);
  const tau = Math.exp((-pane.absorptionPerMm * pane.thicknessMm) / cosT); // α d in consistent units (1/mm · mm)
  const face = interfaceAt(1, n, theta);
  // at exactly grazing incidence R = 1 (cos θi = 0); keep the series finite
  const s = slab(Math.min(face.Rs, 1), tau);
  const p = slab(Math.min(face.Rp, 1), tau);
  return {
    thetaTDeg: Math.asin(sinT) / DEG,
    tau,
    s,
    p,
    T: 0.5 * (s.T + p.T),
    R: 0.5 * (s.R + p.R),
    A: 0.5 * (s.A + p.A),
  };
}

/** All quantities the absorbing-pane cases name, for one case input. */
export function recomputeAbsorbingPane(input: AbsorbingPaneCaseInput): Recomputed {
  const theta = input.thetaDeg * DEG;
  const o = paneAt(input.pane, theta);
  const face = interfaceAt(1, input.pane.refractiveIndex, theta);
  return {
    thetaTDeg: o.thetaTDeg,
    tau: o.tau,
    Ts: o.s.T,
    Rs: o.s.R,
    As: o.s.A,
    Tp: o.p.T,
    Rp: o.p.R,
    Ap: o.p.A,
    T: o.T,
    R: o.R,
    A: o.A,
    TOverT0: o.T / paneAt(input.pane, 0).T,
    TAveragedFaces: slab(0.5 * (face.Rs + face.Rp), o.tau).T,
  };
}

/** Every case of the domain this script answers for, next to its recomputation. */
export const absorbingPaneComparison = () =>
  compareDomain(absorbingPaneDomain, ABSORBING_PANE_SCRIPT, (c) => recomputeAbsorbingPane(c.input), { rule: PRINTED_DIGITS, closedForm: false });

runWhenMain(import.meta.url, [[absorbingPaneDomain.title, absorbingPaneComparison]]);
