/**
 * Checks an option's values against the brief's limits: one flag per limit that is set, pass / fail /
 * unknown with its margin (limit − value for maxima, value − limit for minima; ≥ 0 passes). A value the
 * make-up does not give (light transmittance without measured light values) is "unknown", never a pass;
 * a τv known only as a range passes or fails when the whole range does (its margin from the nearer end).
 * Pure: the results service and the browser use the same function.
 */
import { REQUIREMENT_KEYS, type Limits, type RequirementFlag, type RequirementKey } from "@/lib/contracts/requirements";

/** The quantities the requirements are checked against; null = not known for this option. */
export interface FlagInputs {
  /** Normal-incidence g-value (EN 410), −. */
  gValue: number | null;
  /** Normal-incidence light transmittance τv, −. */
  lightTransmittance: number | null;
  /**
   * When τv is not known exactly but bounded (panes giving τv alone, their light reflectance unknown):
   * the range. A minimum passes when the lower end meets it, fails when the upper end misses it, and is
   * unknown in between.
   */
  lightTransmittanceRange?: { low: number; high: number } | null;
  /** Centre-of-glass U-value, W/(m²K). */
  uValue: number | null;
  /** Highest hourly transmitted solar irradiance of the year, W/m². */
  peakTransmittedWm2: number | null;
  /** Annual solar gain (beam × g(θ) + diffuse × g_hem), kWh/m². */
  annualSolarGainKWhm2: number | null;
}

const SOURCE: Record<RequirementKey, { input: keyof FlagInputs; kind: "max" | "min" }> = {
  maxGValue: { input: "gValue", kind: "max" },
  minLightTransmittance: { input: "lightTransmittance", kind: "min" },
  maxUValue: { input: "uValue", kind: "max" },
  maxPeakTransmittedWm2: { input: "peakTransmittedWm2", kind: "max" },
  maxAnnualSolarGainKWhm2: { input: "annualSolarGainKWhm2", kind: "max" },
};

/** Margins are compared after rounding to 1e-9 so that a value equal to its limit passes despite float noise. */
const round9 = (x: number) => Math.round(x * 1e9) / 1e9 + 0; // + 0 turns −0 into 0

/** A façade's limits: the project's, replaced key by key by the façade's overrides. */
export function effectiveLimits(project: Limits | undefined, facade: Limits | undefined): Limits {
  const out: Limits = {};
  for (const k of REQUIREMENT_KEYS) {
    const v = facade?.[k] ?? project?.[k];
    if (v !== undefined) out[k] = v;
  }
  return out;
}

/** One flag per limit that is set, in the order of REQUIREMENT_KEYS. */
export function requirementFlags(limits: Limits, inputs: FlagInputs): RequirementFlag[] {
  const flags: RequirementFlag[] = [];
  for (const requirement of REQUIREMENT_KEYS) {
    const limit = limits[requirement];
    if (limit === undefined) continue;
    const { input, kind } = SOURCE[requirement];
    const value = inputs[input] as number | null;
    const range = input === "lightTransmittance" && value === null ? inputs.lightTransmittanceRange : null;
    if (range && kind === "min") {
      const low = round9(range.low - limit);
      const high = round9(range.high - limit);
      if (low >= 0) flags.push({ requirement, limit, value: range.low, status: "pass", margin: low });
      else if (high < 0) flags.push({ requirement, limit, value: range.high, status: "fail", margin: high });
      else flags.push({ requirement, limit, value: null, status: "unknown", margin: null });
      continue;
    }
    if (value === null || !Number.isFinite(value)) {
      flags.push({ requirement, limit, value: null, status: "unknown", margin: null });
      continue;
    }
    const margin = round9(kind === "max" ? limit - value : value - limit);
    flags.push({ requirement, limit, value, status: margin >= 0 ? "pass" : "fail", margin });
  }
  return flags;
}

/** The worst status of a list of flags: fail over unknown over pass; "none" without flags. */
export function overallStatus(flags: readonly RequirementFlag[]): "pass" | "fail" | "unknown" | "none" {
  if (flags.length === 0) return "none";
  if (flags.some((f) => f.status === "fail")) return "fail";
  if (flags.some((f) => f.status === "unknown")) return "unknown";
  return "pass";
}
