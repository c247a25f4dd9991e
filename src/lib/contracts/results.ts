/** Wire types of GET /api/v1/projects/:id/results and of issued revisions' snapshots. */
import type { GlazingAngleRow, GlazingValues, LightSummary } from "./glazing";
import type { IrradianceSource } from "./uploads";
import type { Limits, RequirementFlag } from "./requirements";

/** What a saved make-up revision stores as its values (computed when it is saved). */
export interface MakeupValues {
  normal: GlazingValues;
  hemispherical: GlazingValues;
  /** Centre-of-glass U-value, W/(m²K). */
  uValue: number;
  warnings: string[];
  /** Light transmittance at normal incidence with its basis (absent in values stored before it was kept). */
  light?: LightSummary;
}

export interface OptionResult {
  optionId: string;
  name: string;
  status: "proposed" | "approved" | "rejected";
  makeupId: string;
  makeupRevision: number;
  makeupName: string;
  description: string;
  values: MakeupValues;
  annual: { transmittedKWhm2: number; solarGainKWhm2: number };
  peak: { transmittedWm2: number; at: string | null };
  /** Twelve monthly sums, January first, kWh/m². */
  monthly: { transmittedKWhm2: number[]; solarGainKWhm2: number[] };
  flags: RequirementFlag[];
  /** Set when the stored make-up cannot be computed (its layers no longer validate); the figures are then zero. */
  problem?: string;
  /** SHA-256 of this option's inputs (make-up layers, façade, site, year, engine); its cache key. */
  inputsKey?: string;
}

export interface FacadeResult {
  facadeId: string;
  name: string;
  azimuthDeg: number;
  tiltDeg: number;
  glazedAreaM2: number | null;
  /** The limits that apply to this façade (project limits with its overrides). */
  limits: Limits;
  options: OptionResult[];
  /** The façade's typical window and shading devices as the engine took them (null = unshaded). */
  shading?: unknown;
}

export interface ResultsResponse {
  projectId: string;
  year: number;
  /** SHA-256 of everything the results were computed from; equal inputs give equal keys. */
  inputsKey: string;
  computedAt: string;
  facades: FacadeResult[];
  /** The site and sky the results were computed for, shown beside them. */
  site?: RevisionSnapshot["site"];
  /** How many façade × option results came from the cache and how many were computed for this answer. */
  cache?: { hits: number; misses: number };
  /** The irradiance the figures come from: the clear-sky model, or the project's weather file and its period. */
  irradiance?: IrradianceSource;
}

/** One approved option in an issued revision, frozen at issue time. */
export interface RevisionFacadeSnapshot {
  facadeId: string;
  facadeName: string;
  azimuthDeg: number;
  tiltDeg: number;
  optionId: string;
  optionName: string;
  makeupId: string;
  makeupRevision: number;
  makeupName: string;
  description: string;
  layers: unknown[];
  values: MakeupValues;
  annual: OptionResult["annual"];
  peak: OptionResult["peak"];
  monthly: OptionResult["monthly"];
  flags: RequirementFlag[];
  /** The façade's glazed area (m²) and window with shading devices as the engine took them when issued (absent in revisions issued before they were kept). */
  glazedAreaM2?: number | null;
  shading?: unknown;
}

export interface RevisionSnapshot {
  year: number;
  site: {
    name: string;
    latitudeDeg: number;
    longitudeDeg: number;
    timeZone: string;
    elevationM: number;
    groundAlbedo: number;
    skyModel: string;
    linkeTurbidity: number[] | null;
  };
  facades: RevisionFacadeSnapshot[];
  /** Where the irradiance came from when issued (absent in revisions issued before it was kept: clear sky). */
  irradiance?: IrradianceSource;
  /**
   * The weather rows the results were computed from, kept with the revision so that its workbook's hourly
   * sheets can be computed again after the project's weather file is replaced. Stored only; the API leaves it out.
   */
  weather?: { time: string; ghi: number; dni: number; dhi: number }[];
  /** Façades without an approved option when the revision was issued. */
  unapproved?: { facadeId: string; name: string }[];
}

export interface RevisionResponse {
  revision: string;
  sequence: number;
  note: string | null;
  issuedAt: string;
  issuedBy: string;
  facades: RevisionFacadeSnapshot[];
  snapshot: RevisionSnapshot;
  /** Façades without an approved option, left out of this revision. */
  unapproved?: { facadeId: string; name: string }[];
}

/** One option of GET /projects/:id/compare: its results, angular curves and what a day's profile needs. */
export interface CompareOption extends OptionResult {
  facadeId: string;
  facadeName: string;
  /** Angular values of the stored layers (as POST /calc/glazing gives them), 0° to 90° by 5°. */
  angles: GlazingAngleRow[];
  /** The surface as POST /calc/schedule takes it, for the hourly profile of a chosen day. */
  surface: { name: string; azimuthDeg: number; tiltDeg: number; layers: unknown[]; shading?: unknown };
}

export interface CompareResponse {
  projectId: string;
  year: number;
  inputsKey: string;
  site: RevisionSnapshot["site"];
  irradiance?: IrradianceSource;
  options: CompareOption[];
}
