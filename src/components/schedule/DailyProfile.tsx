import { line, scaleLinear } from "d3";
import ChartLegend from "@/components/ChartLegend";
import type { ScheduleRow } from "@/lib/contracts/schedule";

const W = 520;
const H = 260;
const M = { top: 10, right: 12, bottom: 34, left: 48 };

export const PROFILE_SERIES = [
  { key: "beamIncidentWm2", label: "beam on glass", color: "#e8a33d", dashed: false },
  { key: "diffuseIncidentWm2", label: "diffuse on glass", color: "#e8a33d", dashed: true },
  { key: "transmittedWm2", label: "transmitted", color: "#0f4c5c", dashed: false },
  { key: "solarGainWm2", label: "solar gain (g-weighted)", color: "#14212b", dashed: true },
] as const;

/** One day's irradiance on and through the glass against local time (d3 scales, SVG). */
export default function DailyProfile({ rows, localHours, title }: { rows: ScheduleRow[]; localHours: number[]; title: string }) {
  const yMax = Math.max(50, ...rows.flatMap((r) => PROFILE_SERIES.map((s) => r[s.key])));
  const x = scaleLinear()
    .domain([0, 24])
    .range([M.left, W - M.right]);
  const y = scaleLinear()
    .domain([0, yMax])
    .range([H - M.bottom, M.top])
    .nice();
  const path = (key: (typeof PROFILE_SERIES)[number]["key"]) =>
    line<number>()
      .x((_, i) => x(localHours[i]!))
      .y((_, i) => y(rows[i]![key]))(rows.map((_, i) => i)) ?? "";
  return (
    <figure className="space-y-2">
      <figcaption className="text-sm font-bold">{title}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={title} data-testid="daily-profile">
        {y.ticks(5).map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke="#ddd8cc" />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize="11" fill="#4a5a66">
              {t}
            </text>
          </g>
        ))}
        {[0, 3, 6, 9, 12, 15, 18, 21, 24].map((t) => (
          <text key={t} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize="11" fill="#4a5a66">
            {String(t).padStart(2, "0")}:00
          </text>
        ))}
        <text transform={`translate(12 ${(H - M.bottom + M.top) / 2}) rotate(-90)`} textAnchor="middle" fontSize="11" fill="#4a5a66">
          W/m²
        </text>
        {PROFILE_SERIES.map((s) => (
          <path key={s.key} d={path(s.key)} fill="none" stroke={s.color} strokeWidth={2} strokeDasharray={s.dashed ? "5 4" : undefined} />
        ))}
      </svg>
      <ChartLegend items={PROFILE_SERIES} />
    </figure>
  );
}
