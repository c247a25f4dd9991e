/**
 * The brief's requirements: limits a project's options are checked against, entered by the consultant
 * from the brief or the code they follow. Paneray ships no code values; local codes decide.
 */
import { z } from "./zod";
import { rowId } from "./common";
import { finite } from "./numbers";

/** Each limit is optional; an absent limit is not checked. */
export const Limits = z
  .object({
    maxGValue: finite("maxGValue", 0, 1),
    minLightTransmittance: finite("minLightTransmittance", 0, 1),
    maxUValue: finite("maxUValue", 0, 10),
    maxPeakTransmittedWm2: finite("maxPeakTransmittedWm2", 0, 1500),
    maxAnnualSolarGainKWhm2: finite("maxAnnualSolarGainKWhm2", 0, 5000),
  })
  .partial()
  .strict();
export type Limits = z.infer<typeof Limits>;
export type RequirementKey = keyof Limits;

export const REQUIREMENT_KEYS = [
  "maxGValue",
  "minLightTransmittance",
  "maxUValue",
  "maxPeakTransmittedWm2",
  "maxAnnualSolarGainKWhm2",
] as const satisfies readonly RequirementKey[];

/** How each requirement is named on screen and in messages. */
export const REQUIREMENT_LABELS: Record<RequirementKey, string> = {
  maxGValue: "Maximum g-value",
  minLightTransmittance: "Minimum light transmittance τv",
  maxUValue: "Maximum U-value (W/m²K)",
  maxPeakTransmittedWm2: "Maximum peak transmitted (W/m²)",
  maxAnnualSolarGainKWhm2: "Maximum annual solar gain (kWh/m²)",
};

/** PUT /projects/:id/requirements: the project's limits and per-façade overrides (a façade's limits replace the project's key by key). */
export const RequirementsRequest = z.object({
  project: Limits.default({}),
  facades: z.record(rowId, Limits).optional().default({}),
  /** The version read; a stale one answers 409. Omitted = overwrite. */
  version: z.number({ error: "version must be a number" }).int("version must be a whole number").min(0, "version must be 0 or more").optional(),
});
export type RequirementsRequest = z.infer<typeof RequirementsRequest>;

export type FlagStatus = "pass" | "fail" | "unknown";

// ---- responses ------------------------------------------------------------------------------------------------

const requirementKey = z.enum(["maxGValue", "minLightTransmittance", "maxUValue", "maxPeakTransmittedWm2", "maxAnnualSolarGainKWhm2"]);
// A key added to Limits but not here fails to compile.
const _everyKeyListed: Exclude<RequirementKey, z.output<typeof requirementKey>> extends never ? true : never = true;
void _everyKeyListed;

/** One requirement checked for one option: margin = limit − value for maxima, value − limit for minima (≥ 0 passes); null when unknown. */
export const RequirementFlag = z.object({
  requirement: requirementKey,
  limit: z.number(),
  value: z.number().nullable(),
  status: z.enum(["pass", "fail", "unknown"]),
  margin: z.number().nullable(),
});
export type RequirementFlag = z.output<typeof RequirementFlag>;

/** GET and PUT /projects/:id/requirements: the limits, per-façade overrides (by façade id) and the version to send back. */
export const RequirementsResponse = z.object({
  project: Limits,
  facades: z.record(z.string(), Limits).describe("Overrides by façade id"),
  version: z.number().int().describe("0 while nothing has been entered"),
  updatedAt: z.string().nullable(),
});
