import { useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import { withQueryClient } from "@/lib/client/query";
import type { ResultsResponse, RevisionResponse } from "@/lib/contracts/results";
import { MAX_COMPARED_OPTIONS, ResultsYear } from "@/lib/contracts/revisions";
import ResultsTable from "./ResultsTable";
import ComparePanel from "./ComparePanel";
import IssueRevision from "./IssueRevision";

interface Props {
  projectId: string;
  defaultYear: number;
  canIssue: boolean;
}

const SKY_LABEL = { perez: "Perez anisotropic sky", "hay-davies": "Hay–Davies sky", isotropic: "isotropic sky" } as Record<string, string>;

/** The project's results: inputs beside them, the façade × option table, the comparison and the issue dialog. */
function ResultsWorkbench({ projectId, defaultYear, canIssue }: Props) {
  const [yearText, setYearText] = useState(String(defaultYear));
  const [year, setYear] = useState(defaultYear);
  const [selected, setSelected] = useState<string[]>([]);
  const results = useQuery({
    queryKey: ["results", projectId, year],
    queryFn: () => api<ResultsResponse>("GET", `/api/v1/projects/${projectId}/results?year=${year}`),
    placeholderData: keepPreviousData,
  });
  const revisions = useQuery({
    queryKey: ["revisions", projectId],
    queryFn: () => api<{ revisions: RevisionResponse[] }>("GET", `/api/v1/projects/${projectId}/revisions`),
  });
  // The same schema as the endpoint's ?year=.
  const yearCheck = ResultsYear.safeParse(yearText.trim() === "" ? undefined : yearText.trim());
  const yearValid = yearCheck.success;
  const toggle = (id: string) => setSelected((s) => (s.includes(id) ? s.filter((x) => x !== id) : s.length >= MAX_COMPARED_OPTIONS ? s : [...s, id]));
  const r = results.data;
  // While another year loads, the figures on screen are the previous query's (kept as placeholder): grey them
  // and say so. (With a weather file the answer's year is the file's, whatever year was asked.)
  const stale = results.isPlaceholderData;

  return (
    <div className="space-y-6">
      <section className="card space-y-3" aria-labelledby="inputs-title">
        <div className="flex flex-wrap items-end gap-4">
          <h2 id="inputs-title" className="mr-auto">
            Inputs of these results
          </h2>
          <form
            className="flex items-end gap-2"
            onSubmit={(e) => {
              e.preventDefault();
              if (yearCheck.success) setYear(yearCheck.data);
            }}
            noValidate
          >
            <label className="flex flex-col text-sm">
              <span className="font-bold text-slate">Year</span>
              <input
                className="w-24 rounded border border-line px-2 py-1"
                inputMode="numeric"
                value={yearText}
                onChange={(e) => setYearText(e.target.value)}
                aria-invalid={!yearValid}
                aria-describedby="year-error"
                data-testid="results-year"
              />
            </label>
            <button type="submit" className="btn-quiet" disabled={!yearValid}>
              Show year
            </button>
          </form>
          {canIssue && r && !stale && <IssueRevision projectId={projectId} results={r} />}
        </div>
        {!yearValid && (
          <p id="year-error" className="field-error" role="alert">
            {yearCheck.error?.issues[0]?.message}
          </p>
        )}
        {r?.site && (
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]" data-testid="results-inputs">
            <dt className="font-bold text-slate">{r.irradiance?.source === "weather series" ? "Period" : "Year"}</dt>
            <dd data-testid="inputs-year">
              {r.irradiance?.source === "weather series" ? `${r.irradiance.fromDate} to ${r.irradiance.toDate}` : r.year} · hourly
            </dd>
            <dt className="font-bold text-slate">Irradiance</dt>
            <dd data-testid="inputs-irradiance" className="min-w-0 break-words">
              {r.irradiance?.source === "weather series" ? (
                <>
                  weather file “{r.irradiance.fileName}”, {r.irradiance.hours} hours (the year chosen above does not apply) · SHA-256{" "}
                  <code className="break-all text-xs">{r.irradiance.sha256}</code>
                </>
              ) : (
                "clear-sky model (Ineichen–Perez 2002) with the turbidity below"
              )}
            </dd>
            <dt className="font-bold text-slate">Site</dt>
            <dd>
              {r.site.name} · {r.site.latitudeDeg.toFixed(3)}°, {r.site.longitudeDeg.toFixed(3)}° · {r.site.elevationM} m · {r.site.timeZone}
            </dd>
            <dt className="font-bold text-slate">Sky</dt>
            <dd>
              {SKY_LABEL[r.site.skyModel] ?? r.site.skyModel} · Linke turbidity{" "}
              {r.site.linkeTurbidity ? r.site.linkeTurbidity.join(", ") : "monthly defaults"}
            </dd>
            <dt className="font-bold text-slate">Ground albedo</dt>
            <dd>{r.site.groundAlbedo}</dd>
          </dl>
        )}
        {revisions.data && revisions.data.revisions.length > 0 && (
          <p className="text-sm">
            Issued:{" "}
            {revisions.data.revisions.map((rv, i) => (
              <span key={rv.revision}>
                {i > 0 && ", "}
                <a href={`/projects/${projectId}/revisions/${rv.revision}`}>revision {rv.revision}</a>
              </span>
            ))}
          </p>
        )}
      </section>

      <section className="card space-y-3" aria-labelledby="table-title">
        <h2 id="table-title">Façades and options</h2>
        {results.isPending ? (
          <p className="text-sm text-slate" data-testid="results-loading">
            Computing a year of hours for every façade and option…
          </p>
        ) : results.isError && !r ? (
          <p className="field-error" role="alert">
            The results could not be loaded: {results.error.message}{" "}
            <button type="button" className="btn-quiet" onClick={() => void results.refetch()}>
              Try again
            </button>
          </p>
        ) : r && r.facades.every((f) => f.options.length === 0) ? (
          <p className="text-sm text-slate" data-testid="results-empty">
            No façade has an option yet. Give each façade one or more candidate make-ups from the glazing library to see their results here.
          </p>
        ) : (
          <div
            className={stale ? "pointer-events-none opacity-40" : undefined}
            aria-busy={stale}
            data-stale={stale ? "true" : "false"}
            data-inputs-key={r!.inputsKey}
          >
            {stale && (
              <p className="notice">
                Working out {year}… the figures below are for {r!.year} and are not for these inputs.
              </p>
            )}
            <ResultsTable results={r!} selected={selected} onToggle={toggle} timeZone={r!.site?.timeZone ?? "UTC"} />
            <p className="mt-2 text-xs text-slate">
              τe, ρe, α, g and τv at normal incidence (EN 410 quantities, ISO 9050 method); U at the centre of glass (EN 673). Yearly figures are per
              m² of glazing: hourly{" "}
              {r!.irradiance?.source === "weather series" ? "irradiance from the project's weather file" : "clear-sky irradiance"} on the façade,
              through the glass with τe(θ) and g(θ) for the beam and the hemispherical values for diffuse light, the façade's shading included. Tick
              two or more options to compare them.
            </p>
          </div>
        )}
      </section>

      {r && !stale && selected.length >= 2 && (
        <section className="card space-y-3" aria-labelledby="compare-title">
          <div className="flex flex-wrap items-center gap-2">
            <h2 id="compare-title" className="mr-auto">
              Side by side
            </h2>
            <button type="button" className="btn-quiet" onClick={() => setSelected([])}>
              Clear the choice
            </button>
          </div>
          <ComparePanel projectId={projectId} optionIds={selected} year={r.year} />
        </section>
      )}
      {r && selected.length === 1 && <p className="text-sm text-slate">Tick one more option to compare.</p>}
    </div>
  );
}

export default withQueryClient(ResultsWorkbench);
