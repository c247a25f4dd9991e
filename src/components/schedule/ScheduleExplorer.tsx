import { ScheduleRequest } from "@/lib/contracts/schedule";
import { useMemo, useRef, useState } from "react";
import type { ScheduleResponse, ScheduleSurfaceResult } from "@/lib/contracts/schedule";
import { PRESETS } from "@/lib/glazing-presets";
import { api, ApiError } from "@/lib/client/api";
import { compassPoint } from "@/lib/format";
import { FormMessage } from "@/components/forms/Field";
import ScheduleHeatmap, { type HeatCell } from "./ScheduleHeatmap";
import DailyProfile from "./DailyProfile";
import { useHydrated } from "@/components/forms/useHydrated";

interface Facade {
  id: string;
  name: string;
  azimuthDeg: number;
  tiltDeg: number;
}
interface Site {
  latitudeDeg: number;
  longitudeDeg: number;
  timeZone: string;
  elevationM: number;
}

type Measure = "fraction" | "transmitted" | "gain";
const MEASURES: Record<Measure, { label: string; unit: string }> = {
  fraction: { label: "Share of the incident sun transmitted", unit: "–" },
  transmitted: { label: "Transmitted solar irradiance", unit: "W/m²" },
  gain: { label: "Solar gain (g-weighted)", unit: "W/m²" },
};
const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** What a schedule on screen was computed from. */
interface ResultInputs {
  facadeId: string;
  facadeName: string;
  presetId: string;
  presetLabel: string;
  year: number;
  sky: "perez" | "hay-davies" | "isotropic";
  linke: number | "";
  albedo: number;
  overhang: { depthM: number; gapAboveM: number; widthM: number; heightM: number } | null;
}

const SKY_NAMES = { perez: "Perez sky", "hay-davies": "Hay–Davies sky", isotropic: "isotropic sky" } as const;

/** "South, Clear double, 2026, Perez sky, Linke monthly defaults, albedo 0.2, overhang 0.6 m" */
function describeInputs(i: ResultInputs): string {
  return [
    i.facadeName,
    i.presetLabel,
    String(i.year),
    SKY_NAMES[i.sky],
    i.linke === "" ? "Linke turbidity monthly defaults" : `Linke turbidity ${i.linke}`,
    `albedo ${i.albedo}`,
    i.overhang ? `overhang ${i.overhang.depthM} m over a ${i.overhang.widthM} × ${i.overhang.heightM} m window` : "no shading",
  ].join(", ");
}

const localHourOf = (iso: string) => Number(iso.slice(11, 13)) + Number(iso.slice(14, 16)) / 60 + Number(iso.slice(17, 19)) / 3600;
const f = (v: number | null | undefined, d = 1) => (v == null ? "—" : v.toFixed(d));

/** The schema's field names as the form labels them. */
const FIELD_WORDS: [RegExp, string][] = [
  [/^linkeTurbidity/, "Linke turbidity"],
  [/^albedo/, "Ground albedo"],
  [/^widthM/, "Window width"],
  [/^heightM/, "Window height"],
  [/^depthM/, "Overhang depth"],
  [/^gapAboveM/, "Gap above the window"],
  [/^(from|to) /, "Year "],
];
const inWords = (message: string) => FIELD_WORDS.reduce((m, [re, words]) => m.replace(re, words), message);

/** One schema issue as a sentence: a union's first alternative speaks for it (a single Linke value, not twelve). */
function issueInWords(issue: { message: string; code?: string; errors?: { message: string }[][] }): string {
  const inner = issue.code === "invalid_union" ? issue.errors?.[0]?.[0]?.message : undefined;
  return inWords(inner ?? issue.message);
}

export default function ScheduleExplorer({ site, facades }: { site: Site; facades: Facade[] }) {
  const hydrated = useHydrated();
  const [facadeId, setFacadeId] = useState(facades[0]?.id ?? "");
  const [presetId, setPresetId] = useState(PRESETS[1]!.id);
  const [year, setYear] = useState(new Date().getFullYear());
  const [sky, setSky] = useState<"perez" | "hay-davies" | "isotropic">("perez");
  const [linke, setLinke] = useState<number | "">("");
  const [albedo, setAlbedo] = useState(0.2);
  const [overhang, setOverhang] = useState({ on: false, depthM: 0.6, gapAboveM: 0.2, widthM: 1.5, heightM: 1.5 });
  const [result, setResult] = useState<{
    surface: ScheduleSurfaceResult;
    warnings: string[];
    stepHours: number;
    /** The inputs these figures were computed from (their labels come from here, never from the form). */
    inputs: ResultInputs;
    inputsKey: string;
  } | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [measure, setMeasure] = useState<Measure>("fraction");
  const [day, setDay] = useState<number | null>(null);

  const facade = facades.find((x) => x.id === facadeId);
  const preset = PRESETS.find((p) => p.id === presetId)!;
  // Everything that enters the figures; a result whose key differs from the form's is stale.
  const inputs: ResultInputs = {
    facadeId,
    facadeName: facade?.name ?? "",
    presetId,
    presetLabel: preset.label,
    year,
    sky,
    linke,
    albedo,
    overhang: overhang.on ? overhang : null,
  };
  const inputsKey = JSON.stringify(inputs);
  const stale = result !== null && result.inputsKey !== inputsKey;
  /** Only the latest calculation may show its answer (an older one finishing late is dropped). */
  const latestRun = useRef(0);

  const run = async () => {
    if (!facade) return;
    const runId = ++latestRun.current;
    const runInputs = inputs;
    const runKey = inputsKey;
    setBusy(true);
    setFailure(null);
    const body = {
      site,
      from: `${year}-01-01`,
      to: `${year}-12-31`,
      stepMinutes: 60,
      sky: { model: sky, albedo, ...(linke === "" ? {} : { linkeTurbidity: linke }) },
      surfaces: [
        {
          name: facade.name,
          azimuthDeg: facade.azimuthDeg,
          tiltDeg: facade.tiltDeg,
          layers: preset.request.layers,
          ...(overhang.on
            ? {
                shading: {
                  window: { widthM: overhang.widthM, heightM: overhang.heightM },
                  overhang: { depthM: overhang.depthM, gapAboveM: overhang.gapAboveM },
                },
              }
            : {}),
        },
      ],
    };
    // The endpoint's own schema checks the form first; its messages are shown with the fields named in words.
    const check = ScheduleRequest.safeParse(body);
    if (!check.success) {
      setBusy(false);
      setFailure(check.error.issues.map((i) => issueInWords(i as never)).join(" · "));
      return;
    }
    try {
      const res = await api<ScheduleResponse>("POST", "/api/v1/calc/schedule", body);
      if (runId !== latestRun.current) return;
      const surface = res.surfaces[0]!;
      setResult({ surface, warnings: res.warnings, stepHours: 1, inputs: runInputs, inputsKey: runKey });
      const summer = surface.totals.daily.findIndex((d) => d.date.endsWith(site.latitudeDeg >= 0 ? "-06-21" : "-12-21"));
      setDay(summer >= 0 ? summer : 0);
    } catch (e) {
      if (runId === latestRun.current) setFailure(e instanceof ApiError ? e.message : String(e));
    } finally {
      if (runId === latestRun.current) setBusy(false);
    }
  };

  const view = useMemo(() => {
    if (!result) return null;
    const rows = result.surface.rows;
    const dates = result.surface.totals.daily.map((d) => d.date);
    const dayOf = new Map(dates.map((d, i) => [d, i]));
    const cells: HeatCell[] = [];
    let max = 0;
    for (const r of rows) {
      const dIdx = dayOf.get(r.time.slice(0, 10));
      if (dIdx === undefined) continue;
      const incident = r.beamIncidentWm2 + r.diffuseIncidentWm2;
      const value =
        measure === "fraction" ? (incident > 1 ? r.transmittedWm2 / incident : 0) : measure === "transmitted" ? r.transmittedWm2 : r.solarGainWm2;
      if (value > max) max = value;
      cells.push({ day: dIdx, hour: localHourOf(r.time), value });
    }
    const dayLabels = dates.flatMap((d, i) => (d.endsWith("-01") ? [{ day: i, label: MONTH_NAMES[Number(d.slice(5, 7)) - 1]! }] : []));
    return { cells, max: measure === "fraction" ? Math.min(1, Math.max(max, 0.01)) : max, dates, dayLabels };
  }, [result, measure]);

  const dayRows = useMemo(() => {
    if (!result || !view || day === null) return [];
    const date = view.dates[day];
    return result.surface.rows.filter((r) => r.time.startsWith(date!));
  }, [result, view, day]);

  const period = result?.surface.totals.period;

  return (
    <div className="space-y-5">
      <form
        method="post"
        noValidate
        className="card grid items-end gap-4 md:grid-cols-3 xl:grid-cols-6"
        onSubmit={(e) => {
          e.preventDefault();
          void run();
        }}
      >
        <div className="xl:col-span-2">
          <label htmlFor="facade">Façade</label>
          <select id="facade" value={facadeId} onChange={(e) => setFacadeId(e.target.value)}>
            {facades.map((x) => (
              <option key={x.id} value={x.id}>{`${x.name} — ${x.azimuthDeg}° ${compassPoint(x.azimuthDeg)}, tilt ${x.tiltDeg}°`}</option>
            ))}
          </select>
        </div>
        <div className="xl:col-span-2">
          <label htmlFor="glazing">Glazing option</label>
          <select id="glazing" value={presetId} onChange={(e) => setPresetId(e.target.value)}>
            {PRESETS.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="year">Year</label>
          <input id="year" type="number" min={1950} max={2100} value={year} onChange={(e) => setYear(e.target.valueAsNumber || year)} />
        </div>
        <div>
          <label htmlFor="sky">Sky model</label>
          <select id="sky" value={sky} onChange={(e) => setSky(e.target.value as typeof sky)}>
            <option value="perez">Perez 1990 (anisotropic)</option>
            <option value="hay-davies">Hay–Davies (anisotropic)</option>
            <option value="isotropic">isotropic</option>
          </select>
        </div>
        <div>
          <label htmlFor="linke">Linke turbidity</label>
          <input
            id="linke"
            type="number"
            step="0.1"
            min={1}
            max={10}
            placeholder="monthly defaults"
            value={linke}
            onChange={(e) => setLinke(Number.isNaN(e.target.valueAsNumber) ? "" : e.target.valueAsNumber)}
          />
        </div>
        <div>
          <label htmlFor="albedo">Ground albedo</label>
          <input
            id="albedo"
            type="number"
            step="0.05"
            min={0}
            max={1}
            value={albedo}
            onChange={(e) => setAlbedo(Number.isNaN(e.target.valueAsNumber) ? 0.2 : e.target.valueAsNumber)}
          />
        </div>
        <fieldset className="md:col-span-3 xl:col-span-4">
          <label className="flex items-center gap-2 font-bold">
            <input
              type="checkbox"
              className="mt-0 w-auto"
              checked={overhang.on}
              onChange={(e) => setOverhang({ ...overhang, on: e.target.checked })}
            />
            Overhang over a window
          </label>
          {overhang.on && (
            <div className="mt-2 grid grid-cols-2 gap-3 md:grid-cols-4">
              {(
                [
                  ["widthM", "Window width (m)"],
                  ["heightM", "Window height (m)"],
                  ["depthM", "Overhang depth (m)"],
                  ["gapAboveM", "Gap above window head (m)"],
                ] as const
              ).map(([k, label]) => (
                <div key={k}>
                  <label htmlFor={`oh-${k}`}>{label}</label>
                  <input
                    id={`oh-${k}`}
                    type="number"
                    step="any"
                    min={0}
                    value={overhang[k]}
                    onChange={(e) => setOverhang({ ...overhang, [k]: e.target.valueAsNumber })}
                  />
                </div>
              ))}
            </div>
          )}
        </fieldset>
        <button type="submit" className="btn justify-center" disabled={!hydrated || busy || !facade}>
          {busy ? "Calculating…" : "Calculate the year"}
        </button>
      </form>

      {failure && <FormMessage kind="error">{failure}</FormMessage>}

      {result && view && period && (
        <div className="space-y-5" data-testid="schedule-results" data-stale={stale ? "true" : "false"}>
          {stale ? (
            <div className="notice flex flex-wrap items-center gap-3" role="status" data-testid="schedule-stale">
              <span>
                The inputs have changed since this calculation: the figures below are for {describeInputs(result.inputs)}, not for the form above.
              </span>
              <button type="button" className="btn-quiet" disabled={busy || !facade} onClick={() => void run()}>
                {busy ? "Calculating…" : "Calculate again"}
              </button>
            </div>
          ) : (
            <p className="text-sm text-slate" data-testid="schedule-inputs">
              Results for {describeInputs(result.inputs)}.
            </p>
          )}
          <div className={stale ? "pointer-events-none select-none space-y-5 opacity-30 grayscale" : "space-y-5"} aria-hidden={stale || undefined}>
            <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4" data-testid="period-totals">
              <div className="card">
                <p className="text-xs font-bold uppercase text-slate">Sun on the glass</p>
                <p className="text-2xl font-black tabular-nums">{f(period.incidentKWhPerM2, 0)}</p>
                <p className="text-xs text-slate">kWh/m² in {result.inputs.year}</p>
              </div>
              <div className="card">
                <p className="text-xs font-bold uppercase text-slate">Transmitted</p>
                <p className="text-2xl font-black tabular-nums" data-testid="transmitted-total">
                  {f(period.transmittedKWhPerM2, 0)}
                </p>
                <p className="text-xs text-slate">
                  kWh/m² · {period.incidentKWhPerM2 > 0 ? f((100 * period.transmittedKWhPerM2) / period.incidentKWhPerM2, 0) : "—"} % of the incident
                  sun
                </p>
              </div>
              <div className="card">
                <p className="text-xs font-bold uppercase text-slate">Solar gain</p>
                <p className="text-2xl font-black tabular-nums">{f(period.solarGainKWhPerM2, 0)}</p>
                <p className="text-xs text-slate">kWh/m² (g-weighted)</p>
              </div>
              <div className="card">
                <p className="text-xs font-bold uppercase text-slate">Peak solar gain</p>
                <p className="text-2xl font-black tabular-nums">{f(period.peak?.solarGainWm2, 0)}</p>
                <p className="text-xs text-slate">W/m² · {period.peak ? period.peak.time.slice(0, 16).replace("T", " ") : "—"}</p>
              </div>
            </div>
            <div className="card space-y-3">
              <div className="flex flex-wrap items-center gap-3">
                <label htmlFor="measure" className="mb-0">
                  Show
                </label>
                <select id="measure" className="mt-0 w-auto" value={measure} onChange={(e) => setMeasure(e.target.value as Measure)}>
                  {(Object.keys(MEASURES) as Measure[]).map((m) => (
                    <option key={m} value={m}>
                      {MEASURES[m].label}
                    </option>
                  ))}
                </select>
                <span className="text-xs text-slate">diffuse transmittance of this glazing: {f(result.surface.diffuseTransmittance, 3)}</span>
              </div>
              <ScheduleHeatmap
                cells={view.cells}
                dayCount={view.dates.length}
                dayLabels={view.dayLabels}
                max={view.max}
                stepHours={result.stepHours}
                unit={MEASURES[measure].unit}
                title={`${MEASURES[measure].label} — ${result.inputs.facadeName}, ${result.inputs.presetLabel}`}
                selectedDay={day}
                onSelectDay={setDay}
              />
            </div>
            {day !== null && (
              <div className="grid gap-5 xl:grid-cols-[1fr_1.2fr]">
                <div className="card space-y-3">
                  <div className="flex items-center gap-3">
                    <label htmlFor="day" className="mb-0">
                      Day
                    </label>
                    <input
                      id="day"
                      type="date"
                      className="mt-0 w-auto"
                      value={view.dates[day]}
                      min={view.dates[0]}
                      max={view.dates[view.dates.length - 1]}
                      onChange={(e) => {
                        const i = view.dates.indexOf(e.target.value);
                        if (i >= 0) setDay(i);
                      }}
                    />
                  </div>
                  <DailyProfile rows={dayRows} localHours={dayRows.map((r) => localHourOf(r.time))} title={`Daily profile, ${view.dates[day]}`} />
                </div>
                <div className="card overflow-x-auto">
                  <table className="w-full text-xs tabular-nums" data-testid="day-table">
                    <thead className="text-left text-slate">
                      <tr>
                        <th>Time</th>
                        <th className="text-right">Sun alt.</th>
                        <th className="text-right">Sun az.</th>
                        <th className="text-right">Incidence</th>
                        <th className="text-right">τ beam</th>
                        <th className="text-right">Sunlit</th>
                        <th className="text-right">Beam</th>
                        <th className="text-right">Diffuse</th>
                        <th className="text-right">Transm.</th>
                        <th className="text-right">Gain</th>
                      </tr>
                    </thead>
                    <tbody>
                      {dayRows
                        .filter((r) => r.sunAltitudeDeg > -6)
                        .map((r) => (
                          <tr key={r.time} className="border-t border-line">
                            <td>{r.time.slice(11, 16)}</td>
                            <td className="text-right">{f(r.sunAltitudeDeg)}°</td>
                            <td className="text-right">{f(r.sunAzimuthDeg)}°</td>
                            <td className="text-right">{f(r.incidenceDeg)}°</td>
                            <td className="text-right">{f(r.beamTransmittance, 3)}</td>
                            <td className="text-right">{f(r.sunlitFraction, 2)}</td>
                            <td className="text-right">{f(r.beamIncidentWm2, 0)}</td>
                            <td className="text-right">{f(r.diffuseIncidentWm2, 0)}</td>
                            <td className="text-right">{f(r.transmittedWm2, 0)}</td>
                            <td className="text-right">{f(r.solarGainWm2, 0)}</td>
                          </tr>
                        ))}
                    </tbody>
                  </table>
                  <p className="mt-2 text-xs text-slate">W/m² on the glass; times are interval midpoints, local clock time.</p>
                </div>
              </div>
            )}
            <div className="card overflow-x-auto">
              <h2 className="mb-2">Monthly totals</h2>
              <table className="w-full text-sm tabular-nums" data-testid="monthly-table">
                <thead className="text-left text-slate">
                  <tr>
                    <th>Month</th>
                    <th className="text-right">Incident kWh/m²</th>
                    <th className="text-right">Transmitted kWh/m²</th>
                    <th className="text-right">Solar gain kWh/m²</th>
                    <th className="text-right">Peak gain W/m²</th>
                    <th className="text-right">at</th>
                  </tr>
                </thead>
                <tbody>
                  {result.surface.totals.monthly.map((m) => (
                    <tr key={m.month} className="border-t border-line">
                      <td>
                        {MONTH_NAMES[Number(m.month.slice(5, 7)) - 1]} {m.month.slice(0, 4)}
                      </td>
                      <td className="text-right">{f(m.incidentKWhPerM2)}</td>
                      <td className="text-right">{f(m.transmittedKWhPerM2)}</td>
                      <td className="text-right">{f(m.solarGainKWhPerM2)}</td>
                      <td className="text-right">{f(m.peak?.solarGainWm2, 0)}</td>
                      <td className="text-right">{m.peak?.time.slice(5, 16).replace("T", " ") ?? "—"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {result.warnings.length > 0 && (
              <ul className="notice list-disc space-y-1 pl-8">
                {result.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            )}
          </div>
        </div>
      )}
    </div>
  );
}
