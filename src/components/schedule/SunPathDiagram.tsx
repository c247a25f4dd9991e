import { useMemo } from "react";
import { line, scaleLinear } from "d3";
import { sunPositionSuncalc } from "@/lib/physics/sun-position";
import { localTimeline } from "@/lib/time/local-timeline";
import { compassPoint } from "@/lib/format";
import { useWidth } from "@/components/charts/useWidth";

interface Props {
  latitudeDeg: number;
  longitudeDeg: number;
  timeZone: string;
  year: number;
  facades: { name: string; azimuthDeg: number; tiltDeg: number }[];
}

const R = 150;
const VIEW_W = 2 * R + 80;
/** The smallest label on screen, px (half a pixel above 10 for the rounding of the measured width). */
const MIN_LABEL_PX = 10.5;
const FACADE_COLORS = ["#0f4c5c", "#7a3e9d", "#c2410c", "#4d7c0f", "#9f1239", "#1d4ed8", "#0e7490", "#a16207"];
const DAYS = [
  { md: "06-21", label: "21 Jun", color: "#c2410c" },
  { md: "03-20", label: "20 Mar / 23 Sep", color: "#a16207" },
  { md: "12-21", label: "21 Dec", color: "#1d4ed8" },
];

/**
 * Polar sun-path diagram (north up, azimuth clockwise, altitude 90° at the centre) for the site's
 * solstices and equinox, with local clock hours marked and each façade's outward normal drawn.
 */
export default function SunPathDiagram({ latitudeDeg, longitudeDeg, timeZone, year, facades }: Props) {
  const r = scaleLinear().domain([90, 0]).range([0, R]);
  // The drawing scales with its box; labels are sized so that none is drawn smaller than 10 px.
  const [box, boxWidth] = useWidth<HTMLElement>(VIEW_W);
  const k = VIEW_W / Math.min(448, boxWidth);
  const font = (px: number) => Math.max(px, MIN_LABEL_PX * k);
  const xy = (altDeg: number, azDeg: number) => {
    const rad = (azDeg * Math.PI) / 180;
    const rr = r(Math.max(0, altDeg));
    return [rr * Math.sin(rad), -rr * Math.cos(rad)] as const;
  };
  const paths = useMemo(
    () =>
      DAYS.map((d) => {
        const tl = localTimeline({ timeZone, from: `${year}-${d.md}`, to: `${year}-${d.md}`, stepMinutes: 5 });
        const pts: (readonly [number, number])[][] = [[]];
        const hours: { x: number; y: number; h: number }[] = [];
        for (let i = 0; i < tl.length; i++) {
          const t = tl.intervalStartMs[i]!;
          const p = sunPositionSuncalc(t, latitudeDeg, longitudeDeg);
          if (p.altitudeDeg > 0) pts[pts.length - 1]!.push(xy(p.altitudeDeg, p.azimuthDeg));
          else if (pts[pts.length - 1]!.length) pts.push([]);
          const localMin = Math.round((tl.localHour[i]! - 5 / 120) * 60);
          if (p.altitudeDeg > 0 && localMin % 60 === 0) {
            const [x, y] = xy(p.altitudeDeg, p.azimuthDeg);
            hours.push({ x, y, h: localMin / 60 });
          }
        }
        return { ...d, pts: pts.filter((s) => s.length > 1), hours };
      }),
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [latitudeDeg, longitudeDeg, timeZone, year],
  );
  const lineGen = line<readonly [number, number]>()
    .x((p) => p[0])
    .y((p) => p[1]);
  return (
    <figure className="space-y-2" ref={box}>
      <svg
        viewBox={`${-R - 40} ${-R - 30} ${2 * R + 80} ${2 * R + 60}`}
        className="w-full max-w-md"
        role="img"
        aria-label="Sun-path diagram with façade orientations"
        data-testid="sun-path"
      >
        {[0, 30, 60].map((a) => (
          <g key={a}>
            <circle r={r(a)} fill={a === 0 ? "#fff" : "none"} stroke="#ddd8cc" />
            <text x={4} y={-r(a) + 12} fontSize={font(10)} fill="#4a5a66">
              {a}°
            </text>
          </g>
        ))}
        {[0, 45, 90, 135, 180, 225, 270, 315].map((az) => {
          const [x, y] = xy(0, az);
          const [lx, ly] = [((R + 16) * x) / R, ((R + 16) * y) / R];
          return (
            <g key={az}>
              <line x1={0} y1={0} x2={x} y2={y} stroke="#ddd8cc" strokeDasharray="2 3" />
              <text x={lx} y={ly + 4} textAnchor="middle" fontSize={font(11)} fontWeight={az % 90 === 0 ? 700 : 400} fill="#4a5a66">
                {compassPoint(az)}
              </text>
            </g>
          );
        })}
        {facades.map((f, k) => {
          const [x, y] = xy(0, f.azimuthDeg);
          const color = FACADE_COLORS[k % FACADE_COLORS.length]!;
          return (
            <g key={`${f.name}-${k}`} data-facade={f.name}>
              <title>{`${f.name}: faces ${f.azimuthDeg}° (${compassPoint(f.azimuthDeg)}), tilt ${f.tiltDeg}°`}</title>
              <line x1={0} y1={0} x2={x * 1.08} y2={y * 1.08} stroke={color} strokeWidth={3} strokeLinecap="round" opacity={0.85} />
              <circle cx={x * 1.08} cy={y * 1.08} r={5} fill={color} />
            </g>
          );
        })}
        {paths.map((p) => (
          <g key={p.md}>
            {p.pts.map((seg, i) => (
              <path key={i} d={lineGen(seg) ?? ""} fill="none" stroke={p.color} strokeWidth={2.5} />
            ))}
            {p.hours.map((h) => (
              <g key={h.h}>
                <circle cx={h.x} cy={h.y} r={2.5} fill={p.color} />
                {p.md === "06-21" && (
                  <text x={h.x} y={h.y - 6} textAnchor="middle" fontSize={font(10)} fill="#4a5a66">
                    {h.h}
                  </text>
                )}
              </g>
            ))}
          </g>
        ))}
      </svg>
      <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs">
        {DAYS.map((d) => (
          <li key={d.md} className="flex items-center gap-1.5">
            <svg className="h-1 w-5" viewBox="0 0 20 4" aria-hidden="true">
              <rect width="20" height="4" fill={d.color} />
            </svg>
            {d.label}
          </li>
        ))}
        {facades.map((f, k) => (
          <li key={`${f.name}-${k}`} className="flex items-center gap-1.5">
            <svg className="h-2 w-2" viewBox="0 0 8 8" aria-hidden="true">
              <circle cx="4" cy="4" r="4" fill={FACADE_COLORS[k % FACADE_COLORS.length]} />
            </svg>
            {f.name}
          </li>
        ))}
      </ul>
      <figcaption className="text-xs text-slate">
        Altitude rings every 30°, azimuth clockwise from north; dots mark local clock hours (labelled on 21 June). Façade lines point along each
        outward normal.
      </figcaption>
    </figure>
  );
}
