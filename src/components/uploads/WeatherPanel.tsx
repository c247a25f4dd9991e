/**
 * The project page's weather file: which irradiance the results use (the clear-sky model, or the file with its
 * period and SHA-256), the upload form for those who may edit the project, and the way back to clear sky.
 */
import { useState } from "react";
import UploadForm from "./UploadForm";
import type { WeatherSummary } from "@/lib/contracts/uploads";
import { api, ApiError } from "@/lib/client/api";

interface Props {
  projectId: string;
  timeZone: string;
  initial: WeatherSummary | null;
  canEdit: boolean;
  canDownload: boolean;
}

export default function WeatherPanel({ projectId, timeZone, initial, canEdit, canDownload }: Props) {
  const [weather, setWeather] = useState(initial);
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function remove() {
    setBusy(true);
    try {
      await api("DELETE", `/api/v1/projects/${projectId}/weather`);
      setWeather(null);
      setMessage("The weather file was removed; the results use the clear-sky model again.");
    } catch (e) {
      setMessage(e instanceof ApiError ? e.message : "The weather file could not be removed.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-3" data-testid="weather-panel">
      <p className="text-sm" data-testid="weather-status">
        {weather ? (
          <>
            Results use the weather file <strong>“{weather.upload.fileName}”</strong>: {weather.hours} hours, {weather.fromDate} to {weather.toDate} (
            {timeZone}), uploaded by {weather.upload.createdBy} on {weather.upload.createdAt.slice(0, 10)}. SHA-256{" "}
            <code className="break-all text-xs">{weather.sha256}</code>
          </>
        ) : (
          <>Results use the clear-sky model (Ineichen–Perez 2002) with the site's turbidity, for the year chosen on the results page.</>
        )}
      </p>
      {weather && (
        <p className="flex flex-wrap gap-2">
          {canDownload && (
            <a className="btn-quiet" href={`/api/v1/projects/${projectId}/weather/file`} download>
              Download the file as uploaded
            </a>
          )}
          {canEdit && (
            <button type="button" className="btn-danger" disabled={busy} onClick={remove}>
              Remove and use clear sky
            </button>
          )}
        </p>
      )}
      {message && (
        <p className="text-sm" role="status">
          {message}
        </p>
      )}
      {canEdit && (
        <details className="rounded border border-line p-3" open={!weather}>
          <summary className="cursor-pointer font-bold">{weather ? "Replace the weather file" : "Upload a weather file"}</summary>
          <div className="pt-3">
            <UploadForm<{ weather: WeatherSummary }>
              testId="weather-upload"
              action={`/api/v1/projects/${projectId}/weather`}
              noun="weather file"
              templateHref="/templates/paneray-weather-template.csv"
              help={
                <p>
                  One row an hour, in time order with none missing: <code>time</code> (the start of the hour, e.g. 2025-06-01T10:00+02:00, or a local
                  time in {timeZone} such as 2025-06-01 10:00; the hour repeated when the clocks go back must carry its offset), <code>ghi_wm2</code>,{" "}
                  <code>dni_wm2</code>, <code>dhi_wm2</code> in W/m² and, if known, <code>air_temperature_c</code>. Up to a year and a day; the
                  results then cover the file's period.
                </p>
              }
              onSaved={(b) => {
                setWeather(b.weather);
                setMessage(null);
              }}
              renderSaved={(b) => (
                <p className="text-sm">
                  {b.weather.hours} hours from {b.weather.fromDate} to {b.weather.toDate}. The results now use this file.
                </p>
              )}
            />
          </div>
        </details>
      )}
    </div>
  );
}
