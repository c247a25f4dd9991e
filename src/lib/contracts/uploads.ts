/**
 * Uploads: measured panes into the library and an hourly weather series for a project. CSV files sent as
 * multipart/form-data in the field `file`. The columns, limits and answers shared by the endpoints, the
 * upload forms and the tests.
 */

import { z } from "./zod";
import { id, instant } from "./wire";

/** Largest file accepted (bytes); a larger one is refused (413) as soon as the limit is passed. */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** The multipart field that carries the file. */
export const UPLOAD_FIELD = "file";
/** Most problems listed in one answer; a file with more says how many were left out. */
export const MAX_UPLOAD_ERRORS = 500;

export const PANE_COLUMNS = [
  "name",
  "thickness_mm",
  "solar_t",
  "solar_rf",
  "solar_rb",
  "light_t",
  "light_rf",
  "light_rb",
  "emissivity_front",
  "emissivity_back",
  "note",
] as const;
/** Columns a panes file must have; the others may be left out of the header or left empty. */
export const PANE_REQUIRED_COLUMNS = ["name", "thickness_mm", "solar_t", "solar_rf", "solar_rb"] as const;
/** Most panes in one file. */
export const MAX_PANE_ROWS = 500;

export const WEATHER_COLUMNS = ["time", "ghi_wm2", "dni_wm2", "dhi_wm2", "air_temperature_c"] as const;
export const WEATHER_REQUIRED_COLUMNS = ["time", "ghi_wm2", "dni_wm2", "dhi_wm2"] as const;
/** One year and a day of hours: the longest period the schedule engine computes (366 days). */
export const MAX_WEATHER_ROWS = 366 * 24;

/** One problem of an uploaded file: its line as a spreadsheet numbers it (header = 1), the column's header name. */
export interface UploadError {
  line: number;
  column: string;
  message: string;
}

/** The file as it was kept. */
export const UploadInfo = z.object({
  id,
  fileName: z.string(),
  sizeBytes: z.number().int(),
  sha256: z.string().describe("SHA-256 of the file's bytes, hex"),
  rowCount: z.number().int(),
  createdAt: instant,
  createdBy: z.string(),
});
export type UploadInfo = z.output<typeof UploadInfo>;

/** A project's weather series as the API describes it (without the hourly values). */
export const WeatherSummary = z.object({
  from: instant.describe("First hour of the file (the start of the hour)"),
  to: instant.describe("Last hour of the file (the start of the hour)"),
  fromDate: z.string().describe("First local date (YYYY-MM-DD) in the project's time zone that the results cover"),
  toDate: z.string().describe("Last local date (YYYY-MM-DD) that the results cover"),
  hours: z.number().int(),
  stepMinutes: z.number().int(),
  airTemperatureHours: z.number().int().describe("Hours with an air temperature"),
  sha256: z.string(),
  upload: UploadInfo,
});
export type WeatherSummary = z.output<typeof WeatherSummary>;

/** Which irradiance the figures were computed from. */
export const IrradianceSource = z.union([
  z.object({ source: z.literal("clear sky") }),
  z.object({
    source: z.literal("weather series"),
    fileName: z.string(),
    sha256: z.string(),
    from: z.string(),
    to: z.string(),
    fromDate: z.string(),
    toDate: z.string(),
    hours: z.number().int(),
  }),
]);
export type IrradianceSource = z.output<typeof IrradianceSource>;

export const WeatherResponse = z.object({ weather: WeatherSummary.nullable().describe("null while the results use the clear sky") });
export const WeatherCreatedResponse = z.object({
  from: z.string(),
  to: z.string(),
  hours: z.number().int(),
  sha256: z.string(),
  weather: WeatherSummary,
});
