import { useState } from "react";
import { useQuery } from "@tanstack/react-query";
import { api } from "@/lib/client/api";
import type { CompareResponse } from "@/lib/contracts/results";
import type { ScheduleResponse } from "@/lib/contracts/schedule";
import { LineChart, MonthlyBars } from "./Charts";
import { SERIES_COLORS, fraction, oneDecimal, whole } from "./format";
import { lightText, makeupLight } from "@/lib/calc/makeup-light";

interface Props {
  projectId: string;
  optionIds: string[];
  year: number;
}

/** Two or more options side by side: angular curves overlaid, monthly bars and the hourly profile of a chosen day. */
export default function ComparePanel({ projectId, optionIds, year }: Props) {
  const [day, setDay] = useState(`${year}-07-21`);
  const dayInYear = day.startsWith(`${year}-`) ? day : `${year}-07-21`;
  const compare = useQuery({
    queryKey: ["compare", projectId, year, optionIds.join(",")],
    queryFn: () => api<CompareResponse>("GET", `/api/v1/projects/${projectId}/compare?options=${optionIds.join(",")}&year=${year}`),
  });
  const c = compare.data;
  const profile = useQuery({
    enabled: Boolean(c),
    queryKey: ["compare-day", c?.inputsKey, dayInYear],
    queryFn: () =>
      api<ScheduleResponse>("POST", "/api/v1/calc/schedule", {
        site: { latitudeDeg: c!.site.latitudeDeg, longitudeDeg: c!.site.longitudeDeg, timeZone: c!.site.timeZone, elevationM: c!.site.elevationM },
        sky: { model: c!.site.skyModel, albedo: c!.site.groundAlbedo, ...(c!.site.linkeTurbidity ? { linkeTurbidity: c!.site.linkeTurbidity } : {}) },
        from: dayInYear,
        to: dayInYear,
        stepMinutes: 30,
        surfaces: c!.options.map((o) => o.surface),
      }),
  });

  if (compare.isPending) return <p className="text-sm text-slate">Comparing the chosen options…</p>;
  if (compare.isError)
    return (
      <p className="field-error" role="alert">
        The comparison could not be loaded: {compare.error.message}
      </p>
    );
  const opts = c!.options;
  const colour = (i: number) => SERIES_COLORS[i % SERIES_COLORS.length]!;
  const label = (i: number) => `${opts[i]!.facadeName} · ${opts[i]!.name}`;
  const hourOf = (iso: string) => {
    const t = iso.slice(11, 16);
    return Number(t.slice(0, 2)) + Number(t.slice(3, 5)) / 60;
  };

  return (
    <div className="space-y-6" data-testid="compare-panel" data-inputs-key={c!.inputsKey}>
      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="compare-summary">
          <thead className="text-left text-slate">
            <tr>
              <th className="py-1 pr-2">Option</th>
              <th className="pr-2">g</th>
              <th className="pr-2">τe</th>
              <th className="pr-2">τv</th>
              <th className="pr-2">U</th>
              <th className="pr-2">Solar gain kWh/m²·a</th>
              <th>Peak W/m²</th>
            </tr>
          </thead>
          <tbody>
            {opts.map((o, i) => (
              <tr key={o.optionId} className="border-t border-line tabular-nums">
                <td className="py-1 pr-2">
                  <span className="mr-1 inline-block h-3 w-3 rounded-sm align-middle" style={{ background: colour(i) }} aria-hidden="true" />
                  {label(i)}
                </td>
                <td className="pr-2">{fraction(o.values.normal.gValue)}</td>
                <td className="pr-2">{fraction(o.values.normal.solarTransmittance)}</td>
                <td className="pr-2">{lightText(makeupLight(o.values), 3)}</td>
                <td className="pr-2">{o.values.uValue.toFixed(2)}</td>
                <td className="pr-2">{whole(o.annual.solarGainKWhm2)}</td>
                <td>{oneDecimal(o.peak.transmittedWm2)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div className="grid min-w-0 grid-cols-1 gap-6 xl:grid-cols-2">
        <LineChart
          title="Solar transmittance τe and g by angle of incidence"
          testId="compare-angular"
          xDomain={[0, 90]}
          xTicks={[0, 15, 30, 45, 60, 75, 90]}
          xFormat={(v) => `${v}°`}
          xLabel="angle of incidence"
          yLabel="fraction"
          series={opts.flatMap((o, i) => [
            {
              key: `${o.optionId}-tau`,
              label: `${label(i)}: τe`,
              color: colour(i),
              points: o.angles.map((a) => ({ x: a.angleDeg, y: a.solarTransmittance })),
            },
            {
              key: `${o.optionId}-g`,
              label: `${label(i)}: g`,
              color: colour(i),
              dashed: true,
              points: o.angles.map((a) => ({ x: a.angleDeg, y: a.gValue })),
            },
          ])}
        />
        <MonthlyBars
          title={`Monthly solar gain through the glass, ${c!.irradiance?.source === "weather series" ? `${c!.irradiance.fromDate} to ${c!.irradiance.toDate} (weather file)` : year}`}
          yLabel="kWh/m²"
          startMonth={c!.irradiance?.source === "weather series" ? Number(c!.irradiance.fromDate.slice(5, 7)) : undefined}
          series={opts.map((o, i) => ({ key: o.optionId, label: label(i), color: colour(i), values: o.monthly.solarGainKWhm2 }))}
        />
      </div>
      <div className="space-y-2">
        <label className="flex flex-wrap items-center gap-2 text-sm">
          <span className="font-bold text-slate">Hourly profile for</span>
          <input
            type="date"
            className="rounded border border-line px-2 py-1"
            min={`${year}-01-01`}
            max={`${year}-12-31`}
            value={dayInYear}
            onChange={(e) => e.target.value && setDay(e.target.value)}
          />
        </label>
        {profile.isPending ? (
          <p className="text-sm text-slate">Working out the day…</p>
        ) : profile.isError ? (
          <p className="field-error" role="alert">
            The day could not be computed: {profile.error.message}
          </p>
        ) : (
          <LineChart
            title={`Transmitted solar irradiance on ${dayInYear} (clear sky, ${c!.site.timeZone} clock time)`}
            testId="compare-day"
            xDomain={[0, 24]}
            xTicks={[0, 3, 6, 9, 12, 15, 18, 21, 24]}
            xFormat={(v) => `${String(v).padStart(2, "0")}:00`}
            xLabel="local time"
            yLabel="W/m²"
            series={profile.data!.surfaces.map((s, i) => ({
              key: opts[i]!.optionId,
              label: label(i),
              color: colour(i),
              points: s.rows.map((r) => ({ x: hourOf(r.time), y: r.transmittedWm2 })),
            }))}
          />
        )}
      </div>
    </div>
  );
}
