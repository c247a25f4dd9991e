import { LineChart, type LineSeries } from "@/components/charts/LineChart";

export type Series = LineSeries;

interface Props {
  title: string;
  series: Series[];
  yLabel?: string;
  /** An angle to mark with a vertical line (the angle the readout shows). */
  marker?: number;
}

const ANGLE_TICKS = [0, 15, 30, 45, 60, 75, 90];

/** Quantities against the angle of incidence, 0–90°: fractions up to 1, or a closer axis for small ones (absorptance). */
export default function AngularChart({ title, series, yLabel = "fraction", marker }: Props) {
  const yMax = Math.max(1e-9, ...series.flatMap((s) => s.points.map((p) => p.y)));
  const yTop = yMax > 0.5 ? 1 : Math.ceil(yMax * 10 + 0.5) / 10;
  return (
    <LineChart
      title={title}
      series={series}
      xDomain={[0, 90]}
      xTicks={ANGLE_TICKS}
      xFormat={(t) => `${t}°`}
      xLabel="angle of incidence"
      yLabel={yLabel}
      yTop={yTop}
      yDigits={yTop < 0.5 ? 2 : 1}
      marker={marker}
    />
  );
}
