/**
 * A make-up's light transmittance at normal incidence as the screens and the requirement checks read it:
 * the stored summary when there is one, else the normal-incidence value (values saved before the summary
 * was kept). Pure; server and browser share it.
 */
import type { LightSummary } from "@/lib/contracts/glazing";

interface ValuesLike {
  /** Stored values are read defensively: a row written by hand or by an older version may lack them. */
  normal?: { visibleTransmittance?: number | null } | null;
  light?: LightSummary;
}

export function makeupLight(values: ValuesLike): LightSummary {
  if (values.light) return values.light;
  const t = values.normal?.visibleTransmittance;
  return t === null || t === undefined || !Number.isFinite(t)
    ? { basis: "not given", transmittance: null, range: null, reflectanceFront: null, reflectanceBack: null }
    : { basis: "measured", transmittance: t, range: { low: t, high: t }, reflectanceFront: null, reflectanceBack: null };
}

/** "0.62", "0.60–0.66" (range: some light reflectances unknown) or "unknown". */
export function lightText(light: LightSummary, digits = 2): string {
  if (light.transmittance !== null) return light.transmittance.toFixed(digits);
  if (light.range) return `${light.range.low.toFixed(digits)}–${light.range.high.toFixed(digits)}`;
  return "unknown";
}

/** A sortable number: the value, the lower end of a range, or −1 when unknown. */
export function lightSortKey(light: LightSummary): number {
  return light.transmittance ?? light.range?.low ?? -1;
}
