/** How the results screens write numbers: fractions to three decimals, energies and powers to whole units. */
import { REQUIREMENT_LABELS, type RequirementFlag, type RequirementKey } from "@/lib/contracts/requirements";

export const fraction = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(3));
export const whole = (v: number | null | undefined) =>
  v === null || v === undefined || !Number.isFinite(v) ? "—" : Math.round(v).toLocaleString("en");
export const oneDecimal = (v: number | null | undefined) => (v === null || v === undefined || !Number.isFinite(v) ? "—" : v.toFixed(1));

/** The short names of the requirements in table headers and chips. */
export const REQUIREMENT_SHORT: Record<RequirementKey, string> = {
  maxGValue: "g ≤",
  minLightTransmittance: "τv ≥",
  maxUValue: "U ≤",
  maxPeakTransmittedWm2: "peak ≤",
  maxAnnualSolarGainKWhm2: "annual gain ≤",
};

const unitOf = (k: RequirementKey) =>
  k === "maxUValue" ? " W/m²K" : k === "maxPeakTransmittedWm2" ? " W/m²" : k === "maxAnnualSolarGainKWhm2" ? " kWh/m²" : "";
const numberOf = (k: RequirementKey, v: number) =>
  k === "maxGValue" || k === "minLightTransmittance" ? v.toFixed(3) : k === "maxUValue" ? v.toFixed(2) : Math.round(v).toString();

/** "g ≤ 0.400: fails by 0.031" in words for a flag. */
export function flagText(f: RequirementFlag): string {
  const head = `${REQUIREMENT_SHORT[f.requirement]} ${numberOf(f.requirement, f.limit)}${unitOf(f.requirement)}`;
  if (f.status === "unknown" || f.margin === null) return `${head}: unknown (value not given)`;
  const by = numberOf(f.requirement, Math.abs(f.margin));
  return `${head}: ${f.status === "pass" ? "passes with" : "fails by"} ${by}${unitOf(f.requirement)}`;
}

export const flagTitle = (f: RequirementFlag) => `${REQUIREMENT_LABELS[f.requirement]} — ${flagText(f)}`;

/** Colours of the comparison's series (our palette; distinguishable, with dashes for the second half). */
export const SERIES_COLORS = ["#0f4c5c", "#e8a33d", "#7a3e9d", "#2e7d32", "#b3261e", "#4a5a66"];
