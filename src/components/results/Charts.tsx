import { scaleBand, scaleLinear } from "d3";
import ChartLegend from "@/components/ChartLegend";
import { useWidth } from "@/components/charts/useWidth";
import { AXIS, FONT, GRID } from "@/components/charts/LineChart";

export { LineChart, type LineSeries } from "@/components/charts/LineChart";

const MONTHS = ["J", "F", "M", "A", "M", "J", "J", "A", "S", "O", "N", "D"];
const MONTH_NAMES = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/**
 * Grouped monthly bars, one bar per series and month (kWh/m²). `startMonth` (1–12, default January) is the
 * month of the first value, for periods that do not start in January (a weather file's).
 */
export function MonthlyBars(props: {
  title: string;
  series: { key: string; label: string; color: string; values: number[] }[];
  yLabel: string;
  startMonth?: number;
}) {
  const [ref, W] = useWidth<HTMLDivElement>();
  const first = (props.startMonth ?? 1) - 1;
  const count = props.startMonth ? Math.max(1, ...props.series.map((s) => s.values.length)) : MONTHS.length;
  const slots = Array.from({ length: count }, (_, m) => (first + m) % 12);
  const H = 240;
  const M = { top: 12, right: 10, bottom: 28, left: 48 };
  const yMax = Math.max(1e-9, ...props.series.flatMap((s) => s.values));
  const x = scaleBand<number>()
    .domain(slots.map((_, i) => i))
    .range([M.left, W - M.right])
    .paddingInner(0.2);
  const inner = scaleBand<string>()
    .domain(props.series.map((s) => s.key))
    .range([0, x.bandwidth()])
    .paddingInner(0.08);
  const y = scaleLinear()
    .domain([0, yMax * 1.05])
    .range([H - M.bottom, M.top])
    .nice();
  const names = W < 520 ? MONTHS : MONTH_NAMES;
  return (
    <figure className="min-w-0 space-y-2" ref={ref}>
      <figcaption className="text-sm font-bold">{props.title}</figcaption>
      <svg width={W} height={H} role="img" aria-label={props.title} data-testid="monthly-bars">
        {y.ticks(5).map((t) => (
          <g key={t}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={GRID} />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize={FONT} fill={AXIS}>
              {t}
            </text>
          </g>
        ))}
        {slots.map((month, m) => (
          <g key={m}>
            {props.series.map((s) => (
              <rect
                key={s.key}
                x={x(m)! + inner(s.key)!}
                width={inner.bandwidth()}
                y={y(s.values[m] ?? 0)}
                height={y(0) - y(s.values[m] ?? 0)}
                fill={s.color}
              >
                <title>{`${s.label}, ${MONTH_NAMES[month]}: ${(s.values[m] ?? 0).toFixed(1)} ${props.yLabel}`}</title>
              </rect>
            ))}
            <text x={x(m)! + x.bandwidth() / 2} y={H - M.bottom + 16} textAnchor="middle" fontSize={FONT} fill={AXIS}>
              {names[month]}
            </text>
          </g>
        ))}
        <text transform={`translate(13 ${(H - M.bottom + M.top) / 2}) rotate(-90)`} textAnchor="middle" fontSize={FONT} fill={AXIS}>
          {props.yLabel}
        </text>
      </svg>
      <ChartLegend items={props.series} />
    </figure>
  );
}
