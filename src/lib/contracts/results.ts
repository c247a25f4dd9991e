/** Wire types of GET /api/v1/projects/:id/results and /compare, and of issued revisions and their snapshots. */
import { z } from "./zod";
import { GlazingAngleRow, GlazingValues, LayerShape, LightSummary } from "./glazing";
import { Shading } from "./schedule";
import { IrradianceSource } from "./uploads";
import { Limits, RequirementFlag } from "./requirements";
import { docShape, id, instant } from "./wire";

/** What a saved make-up revision stores as its values (computed when it is saved). */
export const MakeupValues = z.object({
  normal: GlazingValues.describe("At normal incidence"),
  hemispherical: GlazingValues.describe("Averaged over the hemisphere (diffuse radiation)"),
  uValue: z.number().describe("Centre-of-glass U-value (EN 673), W/(m²K)"),
  warnings: z.array(z.string()),
  light: LightSummary.optional().describe("Light transmittance at normal incidence with its basis (absent in values stored before it was kept)"),
});
export type MakeupValues = z.output<typeof MakeupValues>;

const optionStatus = z.enum(["proposed", "approved", "rejected"]);
const annual = z.object({ transmittedKWhm2: z.number(), solarGainKWhm2: z.number() }).describe("Yearly sums, kWh/m²");
const peak = z.object({ transmittedWm2: z.number(), at: z.string().nullable().describe("The hour of the peak, local time with offset") });
const monthly = z
  .object({ transmittedKWhm2: z.array(z.number()), solarGainKWhm2: z.array(z.number()) })
  .describe("Twelve monthly sums, January first, kWh/m²");
/** A façade's window with its shading devices as the engine took them; null = unshaded. */
const shading = docShape(z.unknown(), Shading.nullable())
  .optional()
  .describe("The façade's typical window and shading devices as the engine took them (null or absent = unshaded)");

export const OptionResult = z.object({
  optionId: id,
  name: z.string(),
  status: optionStatus,
  makeupId: id,
  makeupRevision: z.number().int(),
  makeupName: z.string(),
  description: z.string(),
  values: MakeupValues,
  annual,
  peak,
  monthly,
  flags: z.array(RequirementFlag),
  problem: z.string().optional().describe("Set when the stored make-up cannot be computed; the figures are then zero"),
  inputsKey: z.string().optional().describe("SHA-256 of this option's inputs (make-up layers, façade, site, year, engine)"),
});
export type OptionResult = z.output<typeof OptionResult>;

export const FacadeResult = z.object({
  facadeId: id,
  name: z.string(),
  azimuthDeg: z.number(),
  tiltDeg: z.number(),
  glazedAreaM2: z.number().nullable(),
  limits: Limits.describe("The limits that apply to this façade (project limits with its overrides)"),
  options: z.array(OptionResult),
  shading,
});
export type FacadeResult = z.output<typeof FacadeResult>;

export const SiteSnapshot = z.object({
  name: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  timeZone: z.string(),
  elevationM: z.number(),
  groundAlbedo: z.number(),
  skyModel: z.string(),
  linkeTurbidity: z.array(z.number()).nullable(),
});

export const ResultsResponse = z.object({
  projectId: id,
  year: z.number().int(),
  inputsKey: z.string().describe("SHA-256 of everything the results were computed from; equal inputs give equal keys"),
  computedAt: instant,
  facades: z.array(FacadeResult),
  site: SiteSnapshot.optional(),
  cache: z
    .object({ hits: z.number().int(), misses: z.number().int() })
    .optional()
    .describe("Façade × option results from the cache and computed now"),
  irradiance: IrradianceSource.optional(),
});
export type ResultsResponse = z.output<typeof ResultsResponse>;

/** One approved option in an issued revision, frozen at issue time. */
export const RevisionFacadeSnapshot = z.object({
  facadeId: id,
  facadeName: z.string(),
  azimuthDeg: z.number(),
  tiltDeg: z.number(),
  optionId: id,
  optionName: z.string(),
  makeupId: id,
  makeupRevision: z.number().int(),
  makeupName: z.string(),
  description: z.string(),
  layers: docShape(z.array(z.unknown()), z.array(LayerShape).describe("The make-up's layers as POST /calc/glazing takes them")),
  values: MakeupValues,
  annual,
  peak,
  monthly,
  flags: z.array(RequirementFlag),
  glazedAreaM2: z.number().nullable().optional(),
  shading,
});
export type RevisionFacadeSnapshot = z.output<typeof RevisionFacadeSnapshot>;

const unapproved = z.array(z.object({ facadeId: id, name: z.string() })).describe("Façades without an approved option, left out of the revision");

export const RevisionSnapshot = z.object({
  year: z.number().int(),
  site: SiteSnapshot,
  facades: z.array(RevisionFacadeSnapshot),
  irradiance: IrradianceSource.optional(),
  /** The weather rows the results were computed from; stored with the revision, never in the API's answers. */
  weather: z.array(z.object({ time: z.string(), ghi: z.number(), dni: z.number(), dhi: z.number() })).optional(),
  unapproved: unapproved.optional(),
});
export type RevisionSnapshot = z.output<typeof RevisionSnapshot>;

export const RevisionResponse = z.object({
  revision: z.string().describe("The revision's letter: A, B, … Z, AA, …"),
  sequence: z.number().int(),
  note: z.string().nullable(),
  issuedAt: instant,
  issuedBy: z.string(),
  facades: z.array(RevisionFacadeSnapshot),
  snapshot: RevisionSnapshot,
  unapproved: unapproved.optional(),
});
export type RevisionResponse = z.output<typeof RevisionResponse>;

export const RevisionListResponse = z.object({ revisions: z.array(RevisionResponse).describe("Newest first") });

export const CompareOption = OptionResult.extend({
  facadeId: id,
  facadeName: z.string(),
  angles: z.array(GlazingAngleRow).describe("Angular values of the stored layers, 0° to 90° by 5°"),
  surface: z
    .object({ name: z.string(), azimuthDeg: z.number(), tiltDeg: z.number(), layers: docShape(z.array(z.unknown()), z.array(LayerShape)), shading })
    .describe("The surface as POST /calc/schedule takes it"),
});
export type CompareOption = z.output<typeof CompareOption>;

export const CompareResponse = z.object({
  projectId: id,
  year: z.number().int(),
  inputsKey: z.string(),
  site: SiteSnapshot,
  irradiance: IrradianceSource.optional(),
  options: z.array(CompareOption),
});
export type CompareResponse = z.output<typeof CompareResponse>;
