import { line, scaleLinear } from "d3";
import ChartLegend from "@/components/ChartLegend";

export interface Series {
  key: string;
  label: string;
  color: string;
  dashed?: boolean;
  points: { x: number; y: number }[];
}

interface Props {
  title: string;
  series: Series[];
  yLabel?: string;
  height?: number;
}

const W = 520;
const M = { top: 12, right: 16, bottom: 40, left: 48 };

/** Line chart of quantities against the angle of incidence (0–90°), drawn with d3 scales as SVG. */
export default function AngularChart({ title, series, yLabel = "fraction", height = 280 }: Props) {
  const H = height;
  const yMax = Math.max(1e-9, ...series.flatMap((s) => s.points.map((p) => p.y)));
  const yTop = yMax > 0.5 ? 1 : Math.ceil(yMax * 10 + 0.5) / 10;
  const x = scaleLinear()
    .domain([0, 90])
    .range([M.left, W - M.right]);
  const y = scaleLinear()
    .domain([0, yTop])
    .range([H - M.bottom, M.top])
    .nice();
  const path = line<{ x: number; y: number }>()
    .x((d) => x(d.x))
    .y((d) => y(d.y));
  return (
    <figure className="space-y-2">
      <figcaption className="text-sm font-bold">{title}</figcaption>
      <svg viewBox={`0 0 ${W} ${H}`} className="w-full" role="img" aria-label={title}>
        {y.ticks(5).map((t) => (
          <g key={`y${t}`}>
            <line x1={M.left} x2={W - M.right} y1={y(t)} y2={y(t)} stroke="#ddd8cc" />
            <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize="11" fill="#4a5a66">
              {t.toFixed(yTop < 0.5 ? 2 : 1)}
            </text>
          </g>
        ))}
        {[0, 15, 30, 45, 60, 75, 90].map((t) => (
          <g key={`x${t}`}>
            <line x1={x(t)} x2={x(t)} y1={H - M.bottom} y2={H - M.bottom + 4} stroke="#4a5a66" />
            <text x={x(t)} y={H - M.bottom + 16} textAnchor="middle" fontSize="11" fill="#4a5a66">
              {t}°
            </text>
          </g>
        ))}
        <text x={(M.left + W - M.right) / 2} y={H - 6} textAnchor="middle" fontSize="11" fill="#4a5a66">
          angle of incidence
        </text>
        <text transform={`translate(12 ${(H - M.bottom + M.top) / 2}) rotate(-90)`} textAnchor="middle" fontSize="11" fill="#4a5a66">
          {yLabel}
        </text>
        {series.map((s) => (
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
      <ChartLegend items={series} />
    </figure>
  );
}
