/** Wire types of GET /api/v1/projects/:id/results and of issued revisions' snapshots. */
import type { GlazingValues } from "./glazing";
import type { Limits, RequirementFlag } from "./requirements";

/** What a saved make-up revision stores as its values (computed when it is saved). */
export interface MakeupValues {
  normal: GlazingValues;
  hemispherical: GlazingValues;
  /** Centre-of-glass U-value, W/(m²K). */
  uValue: number;
  warnings: string[];
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
}

export interface ResultsResponse {
  projectId: string;
  year: number;
  /** SHA-256 of everything the results were computed from; equal inputs give equal keys. */
  inputsKey: string;
  computedAt: string;
  facades: FacadeResult[];
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
}

export interface RevisionResponse {
  revision: string;
  sequence: number;
  note: string | null;
  issuedAt: string;
  issuedBy: string;
  facades: RevisionFacadeSnapshot[];
  snapshot: RevisionSnapshot;
}
