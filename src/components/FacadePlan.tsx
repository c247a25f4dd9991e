/**
 * The building's façades in plan, north up, drawn as the form is edited: each façade's outward normal as
 * an arrow with its number, so that a wrong azimuth shows at once (a sloped pane's normal leans towards
 * the zenith and is drawn shorter).
 */
import { compassPoint } from "@/lib/format";

interface Props {
  facades: { name?: string; azimuthDeg?: number; tiltDeg?: number }[];
}

const R = 80;
const rad = (d: number) => (d * Math.PI) / 180;

export default function FacadePlan({ facades }: Props) {
  const shown = facades
    .map((f, i) => ({ ...f, n: i + 1 }))
    .filter((f) => typeof f.azimuthDeg === "number" && Number.isFinite(f.azimuthDeg) && f.azimuthDeg >= 0 && f.azimuthDeg <= 360);
  return (
    <figure className="space-y-1" data-testid="facade-plan">
      <svg viewBox="-135 -135 270 270" className="mx-auto w-full max-w-[16rem]" role="img" aria-label="The façades in plan, north up">
        <circle r={R} fill="#fff" stroke="#ddd8cc" />
        {[0, 90, 180, 270].map((a) => (
          <text
            key={a}
            x={(R + 34) * Math.sin(rad(a))}
            y={-(R + 34) * Math.cos(rad(a)) + 4}
            textAnchor="middle"
            fontSize={12}
            fontWeight={700}
            fill="#4a5a66"
          >
            {compassPoint(a)}
          </text>
        ))}
        <rect x={-16} y={-16} width={32} height={32} fill="#d8e9ec" stroke="#0f4c5c" />
        {shown.map((f) => {
          const tilt = typeof f.tiltDeg === "number" && Number.isFinite(f.tiltDeg) ? f.tiltDeg : 90;
          const len = R * Math.max(0.3, Math.sin(rad(Math.min(tilt, 180 - tilt))));
          const x = len * Math.sin(rad(f.azimuthDeg!));
          const y = -len * Math.cos(rad(f.azimuthDeg!));
          const lx = (len + 12) * Math.sin(rad(f.azimuthDeg!));
          const ly = -(len + 12) * Math.cos(rad(f.azimuthDeg!));
          return (
            <g key={f.n} data-facade={f.n}>
              <title>{`Façade ${f.n}${f.name ? ` (${f.name})` : ""}: ${f.azimuthDeg}° ${compassPoint(f.azimuthDeg!)}, tilt ${tilt}°`}</title>
              <line x1={0} y1={0} x2={x} y2={y} stroke="#e8a33d" strokeWidth={3} strokeLinecap="round" />
              <circle cx={x} cy={y} r={4} fill="#0f4c5c" />
              <text x={lx} y={ly + 4} textAnchor="middle" fontSize={11} fontWeight={700} fill="#14212b">
                {f.n}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="text-center text-xs text-slate">Plan, north up: each number is a façade, the arrow its outward normal.</figcaption>
    </figure>
  );
}
