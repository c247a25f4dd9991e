/**
 * Light transmittance of a unit at normal incidence when some panes are known only by their light
 * transmittance τv (data sheets often give no light reflectance): the bounds that the unknown
 * reflectances allow.
 *
 * Model: the adding (net-radiation) method for incoherent layers at normal incidence, as in
 * ISO 9050:2003 §5 and EN 410:2011 §5 for two and three panes, applied pane by pane:
 *
 *   T₁₂  = T₁·T₂ / (1 − R₁b·R₂f)
 *   R₁₂b = R₂b + T₂²·R₁b / (1 − R₁b·R₂f)
 *
 * with f the face towards outdoors and b the face towards the room. Every reflectance inside the
 * unit adds light that comes through after inter-reflection, so the unit's T rises with each of them:
 * the lowest T sets every unknown face reflectance to 0, the highest to 1 − τv (a face cannot reflect
 * more than the pane lets through leaves, absorptance ≥ 0). A single pane, or panes whose inner faces
 * are all known, gives equal bounds. The outer faces of the unit (#1 and the last) do not enter T.
 *
 * Units: fractions [-]. Pure.
 */

/** One pane's light values at normal incidence [-]; a reflectance not known is undefined. */
export interface LightPane {
  readonly T: number;
  readonly Rf?: number;
  readonly Rb?: number;
}

export interface LightTransmittanceBounds {
  /** lowest unit light transmittance the unknown reflectances allow [-] */
  readonly low: number;
  /** highest [-] */
  readonly high: number;
  /** whether every face reflectance that enters T is known (then low = high) */
  readonly exact: boolean;
}

function stackTransmittance(panes: readonly LightPane[], unknownAs: "none" | "most"): number {
  const reflect = (T: number, R: number | undefined) => R ?? (unknownAs === "none" ? 0 : 1 - T);
  let T = panes[0]!.T;
  let Rb = reflect(panes[0]!.T, panes[0]!.Rb);
  for (let k = 1; k < panes.length; k++) {
    const p = panes[k]!;
    const Rf = reflect(p.T, p.Rf);
    const denom = 1 - Rb * Rf;
    const nextT = (T * p.T) / denom;
    Rb = reflect(p.T, p.Rb) + (p.T * p.T * Rb) / denom;
    T = nextT;
  }
  return T;
}

/** Bounds of the unit's light transmittance at normal incidence, outdoor pane first. */
export function lightTransmittanceBounds(panes: readonly LightPane[]): LightTransmittanceBounds {
  if (panes.length === 0) throw new RangeError("lightTransmittanceBounds: no panes");
  for (const p of panes) {
    for (const v of [p.T, p.Rf, p.Rb]) {
      if (v !== undefined && !(v >= 0 && v <= 1)) throw new RangeError(`lightTransmittanceBounds: ${v} is not a fraction`);
    }
  }
  const inner = panes.flatMap((p, k) => [k > 0 ? p.Rf : 0, k < panes.length - 1 ? p.Rb : 0]);
  const exact = inner.every((r) => r !== undefined);
  const low = stackTransmittance(panes, "none");
  const high = exact ? low : stackTransmittance(panes, "most");
  return { low, high, exact };
}
