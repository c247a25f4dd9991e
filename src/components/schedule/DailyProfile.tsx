import { LineChart } from "@/components/charts/LineChart";
import type { ScheduleRow } from "@/lib/contracts/schedule";

export const PROFILE_SERIES = [
  { key: "beamIncidentWm2", label: "beam on glass", color: "#e8a33d", dashed: false },
  { key: "diffuseIncidentWm2", label: "diffuse on glass", color: "#e8a33d", dashed: true },
  { key: "transmittedWm2", label: "transmitted", color: "#0f4c5c", dashed: false },
  { key: "solarGainWm2", label: "solar gain (g-weighted)", color: "#14212b", dashed: true },
] as const;

const HOURS = [0, 3, 6, 9, 12, 15, 18, 21, 24];

/** One day's irradiance on and through the glass against local time, drawn at its real width. */
export default function DailyProfile({ rows, localHours, title }: { rows: ScheduleRow[]; localHours: number[]; title: string }) {
  const series = PROFILE_SERIES.map((s) => ({ ...s, points: rows.map((r, i) => ({ x: localHours[i]!, y: r[s.key] })) }));
  const yMax = Math.max(50, ...series.flatMap((s) => s.points.map((p) => p.y)));
  return (
    <LineChart
      title={title}
      series={series}
      xDomain={[0, 24]}
      xTicks={HOURS}
      xFormat={(t) => `${String(t).padStart(2, "0")}:00`}
      xLabel="local time"
      yLabel="W/m²"
      yTop={yMax}
      testId="daily-profile"
    />
  );
}
