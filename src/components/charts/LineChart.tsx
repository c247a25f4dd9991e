import { line, scaleLinear } from "d3";
import ChartLegend from "@/components/ChartLegend";
import { useWidth } from "./useWidth";

export const FONT = 12;
export const AXIS = "#4a5a66";
export const GRID = "#ddd8cc";

export interface LineSeries {
  key: string;
  label: string;
  color: string;
  dashed?: boolean;
  points: { x: number; y: number }[];
}

/** A line chart drawn at its real pixel width (labels stay 12 px at any screen size). */
export function LineChart(props: {
  title: string;
  series: LineSeries[];
  xDomain: [number, number];
  xTicks: number[];
  xFormat: (v: number) => string;
  xLabel: string;
  yLabel: string;
  testId?: string;
  /** Top of the y axis; by default 5 % above the highest point. */
  yTop?: number;
  /** Decimals of the y tick labels; by default 1 below 2, none above. */
  yDigits?: number;
  /** An x value to mark with a vertical line (the value a readout beside the chart shows). */
  marker?: number;
}) {
  const [ref, W] = useWidth<HTMLDivElement>();
  const H = 260;
  const M = { top: 12, right: 24, bottom: 40, left: 52 };
  const yMax = Math.max(1e-9, ...props.series.flatMap((s) => s.points.map((p) => p.y)));
  const x = scaleLinear()
    .domain(props.xDomain)
    .range([M.left, W - M.right]);
  const y = scaleLinear()
    .domain([0, props.yTop ?? yMax * 1.05])
    .range([H - M.bottom, M.top])
    .nice();
  const path = line<{ x: number; y: number }>()
    .x((d) => x(d.x))
    .y((d) => y(d.y));
  const ticks = W < 420 ? props.xTicks.filter((_, i) => i % 2 === 0) : props.xTicks;
  return (
    <figure className="min-w-0 space-y-2" ref={ref}>
      <figcaption className="text-sm font-bold">{props.title}</figcaption>
      <svg width={W} height={H} role="img" aria-label={props.title} data-testid={props.testId}>
        {y.ticks(5).map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke={GRID} />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize={FONT} fill={AXIS}>
              {props.yDigits !== undefined ? t.toFixed(props.yDigits) : yMax < 2 ? t.toFixed(1) : t}
            </text>
          </g>
        ))}
        {ticks.map((t) => (
          <text key={`x${t}`} x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize={FONT} fill={AXIS}>
            {props.xFormat(t)}
          </text>
        ))}
        <text x={(M.left + W - M.right) / 2} y={H - 4} textAnchor="middle" fontSize={FONT} fill={AXIS}>
          {props.xLabel}
        </text>
        <text transform={`translate(13 ${(H - M.bottom + M.top) / 2}) rotate(-90)`} textAnchor="middle" fontSize={FONT} fill={AXIS}>
          {props.yLabel}
        </text>
        {props.marker !== undefined && (
          <line x1={x(props.marker)} x2={x(props.marker)} y1={M.top} y2={H - M.bottom} stroke="#e8a33d" strokeWidth={2} data-marker={props.marker} />
        )}
        {props.series.map((s) => (
          <path
            key={s.key}
            d={path(s.points) ?? ""}
            fill="none"
            stroke={s.color}
            strokeWidth={2}
            strokeDasharray={s.dashed ? "5 4" : undefined}
            data-series={s.key}
          />
        ))}
      </svg>
      <ChartLegend items={props.series} />
    </figure>
  );
}
