import { useEffect, useMemo, useRef } from "react";
import { interpolateYlOrRd, scaleSequential } from "d3";
import { useWidth } from "@/components/charts/useWidth";

export interface HeatCell {
  /** index of the day in the period (x) */
  day: number;
  /** local clock hour of the row's midpoint, 0–24 (y) */
  hour: number;
  value: number;
}

interface Props {
  cells: HeatCell[];
  dayCount: number;
  dayLabels: { day: number; label: string }[];
  max: number;
  stepHours: number;
  unit: string;
  title: string;
  selectedDay: number | null;
  onSelectDay: (day: number) => void;
}

const MAX_W = 760;
const H = 300;
/** Day labels closer than this are thinned out (px). */
const LABEL_GAP = 44;
const M = { top: 8, right: 64, bottom: 28, left: 40 };

/** Day of period (x) × local hour (y) heat map on a canvas, with a colour key. Click picks a day. */
export default function ScheduleHeatmap({ cells, dayCount, dayLabels, max, stepHours, unit, title, selectedDay, onSelectDay }: Props) {
  const ref = useRef<HTMLCanvasElement>(null);
  // Drawn at its real width so that its 11 px labels stay 11 px on a phone.
  const [box, boxWidth] = useWidth<HTMLElement>(MAX_W);
  const W = Math.min(MAX_W, boxWidth);
  const color = useMemo(() => scaleSequential(interpolateYlOrRd).domain([0, max > 0 ? max : 1]), [max]);
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;

  useEffect(() => {
    const c = ref.current;
    if (!c) return;
    const dpr = window.devicePixelRatio || 1;
    c.width = W * dpr;
    c.height = H * dpr;
    const g = c.getContext("2d");
    if (!g) return;
    g.scale(dpr, dpr);
    g.clearRect(0, 0, W, H);
    g.fillStyle = "#1d2a33";
    g.fillRect(M.left, M.top, pw, ph);
    const cw = pw / Math.max(1, dayCount);
    const ch = (ph / 24) * stepHours;
    for (const cell of cells) {
      if (cell.value <= 0) continue;
      g.fillStyle = color(cell.value);
      g.fillRect(M.left + cell.day * cw, M.top + ((cell.hour - stepHours / 2) / 24) * ph, Math.ceil(cw), Math.ceil(ch));
    }
    if (selectedDay !== null) {
      g.strokeStyle = "#0f4c5c";
      g.lineWidth = 2;
      g.strokeRect(M.left + selectedDay * cw - 1, M.top, cw + 2, ph);
    }
    g.fillStyle = "#4a5a66";
    g.font = "11px Lato, sans-serif";
    g.textAlign = "right";
    for (let h = 0; h <= 24; h += 6) g.fillText(`${String(h).padStart(2, "0")}:00`, M.left - 4, M.top + (h / 24) * ph + 4);
    g.textAlign = "center";
    let lastX = -Infinity;
    for (const l of dayLabels) {
      const x = M.left + (l.day + 0.5) * cw;
      if (x - lastX < LABEL_GAP) continue;
      g.fillText(l.label, x, H - 10);
      lastX = x;
    }
    // colour key
    const kx = W - M.right + 16;
    for (let i = 0; i < ph; i++) {
      g.fillStyle = color(max * (1 - i / ph));
      g.fillRect(kx, M.top + i, 12, 1);
    }
    g.textAlign = "left";
    g.fillStyle = "#4a5a66";
    g.fillText(max.toFixed(max < 2 ? 2 : 0), kx + 14, M.top + 8);
    g.fillText("0", kx + 14, M.top + ph);
    g.fillText(unit, kx - 2, H - 10);
  }, [W, cells, color, dayCount, dayLabels, max, ph, pw, selectedDay, stepHours, unit]);

  return (
    <figure className="min-w-0 space-y-1" ref={box}>
      <figcaption className="text-sm font-bold">{title}</figcaption>
      <canvas
        ref={ref}
        style={{ width: W, height: H }}
        role="img"
        aria-label={`${title}: days across, local time of day down`}
        data-testid="heatmap"
        onClick={(e) => {
          const r = e.currentTarget.getBoundingClientRect();
          const x = ((e.clientX - r.left) / r.width) * W - M.left;
          const day = Math.floor((x / pw) * dayCount);
          if (day >= 0 && day < dayCount) onSelectDay(day);
        }}
      />
      <p className="text-xs text-slate">Days across, local clock time down (midpoint of each interval). Click a day for its profile.</p>
    </figure>
  );
}
