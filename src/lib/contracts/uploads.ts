/**
 * Uploads: measured panes into the library and an hourly weather series for a project. CSV files sent as
 * multipart/form-data in the field `file`. The columns, limits and answers shared by the endpoints, the
 * upload forms and the tests.
 */

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
export interface UploadInfo {
  id: string;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  rowCount: number;
  createdAt: string;
  createdBy: string;
}

/** A project's weather series as the API describes it (without the hourly values). */
export interface WeatherSummary {
  /** First and last hour of the file (instants, the start of each hour). */
  from: string;
  to: string;
  /** The local dates in the project's time zone that the results cover. */
  fromDate: string;
  toDate: string;
  hours: number;
  stepMinutes: number;
  /** Hours with an air temperature. */
  airTemperatureHours: number;
  sha256: string;
  upload: UploadInfo;
}

/** Which irradiance the figures were computed from. */
export type IrradianceSource =
  | { source: "clear sky" }
  | { source: "weather series"; fileName: string; sha256: string; from: string; to: string; fromDate: string; toDate: string; hours: number };
