/**
 * A make-up drawn in section, to scale: outdoors on the left, panes as glass of their thickness, gaps with
 * their width and gas, low-emissivity coatings as a sun-coloured line on their face, faces numbered from
 * outdoors (#1 the outer face of the outer pane). With `onSelect` each pane and gap is a button: the
 * composer edits the selected layer beside the drawing. Without it, a static picture (project pages,
 * issued revisions).
 */
import { LOW_E_BELOW } from "@/lib/calc/makeup-description";

interface PaneLike {
  kind: "pane";
  thicknessMm?: number;
  emissivityFront?: number;
  emissivityBack?: number;
  measured?: unknown;
}
interface GapLike {
  kind: "gap";
  widthMm?: number;
  gas?: unknown;
}
type Layer = PaneLike | GapLike | { kind?: unknown };

interface Props {
  layers: readonly unknown[];
  /** Index of the selected layer (composer). */
  selected?: number | null;
  /** Indices of layers whose values need a correction (outlined in red). */
  invalid?: readonly number[];
  onSelect?: (index: number) => void;
  /** Drawing height in px; the width follows the make-up's total thickness. */
  height?: number;
  /** Width available in px: the make-up is drawn as large as fits (within limits); without it, a fixed scale. */
  fitWidth?: number;
  /** Face numbers and gap labels (off for small pictures). */
  labels?: boolean;
  title?: string;
}

const GAS_SHORT: Record<string, string> = { air: "air", argon: "Ar", krypton: "Kr" };

function gasLabel(gas: unknown): string {
  if (typeof gas === "string") return GAS_SHORT[gas] ?? gas;
  if (gas && typeof gas === "object") {
    const parts = Object.entries(gas as Record<string, number>)
      .filter(([g, f]) => g !== "air" && f > 0)
      .sort((a, b) => b[1] - a[1]);
    if (!parts.length) return "air";
    return parts.map(([g, f]) => `${GAS_SHORT[g] ?? g} ${Math.round(f * 100)}%`).join("+");
  }
  return "";
}

const num = (v: unknown, fallback: number) => (typeof v === "number" && Number.isFinite(v) && v > 0 ? v : fallback);

export default function MakeupSection({ layers, selected = null, invalid = [], onSelect, height = 150, fitWidth, labels = true, title }: Props) {
  const items = (layers as Layer[]).map((l) => {
    const isGap = (l as { kind?: unknown }).kind === "gap";
    return { layer: l, isGap, mm: isGap ? num((l as GapLike).widthMm, 12) : num((l as PaneLike).thicknessMm, 4) };
  });
  const totalMm = items.reduce((s, i) => s + i.mm, 0) || 1;
  const margin = labels ? 54 : 6;
  const top = labels ? 22 : 4;
  const glassH = height - top - (labels ? 22 : 4);
  // Thin make-ups are drawn larger; a thick triple still fits a phone's width.
  const scale = fitWidth ? Math.min(16, Math.max(3, (fitWidth - 2 * margin) / totalMm)) : Math.min(9, Math.max(3, 320 / totalMm));
  const width = margin * 2 + totalMm * scale;
  // Left edge of each layer and the pane number of each pane, worked out before drawing.
  const starts = items.map((_, i) => margin + items.slice(0, i).reduce((s, it) => s + it.mm * scale, 0));
  const paneNumbers = items.map((_, i) => items.slice(0, i).filter((it) => !it.isGap).length);
  const shapes = items.map((it, i) => {
    const x0 = starts[i]!;
    const w = it.mm * scale;
    const isSelected = selected === i;
    const isInvalid = invalid.includes(i);
    const common = {
      "data-layer": i,
      "data-invalid": isInvalid ? "1" : undefined,
      "aria-pressed": onSelect ? isSelected : undefined,
      role: onSelect ? "button" : undefined,
      tabIndex: onSelect ? 0 : undefined,
      onClick: onSelect ? () => onSelect(i) : undefined,
      onKeyDown: onSelect
        ? (e: React.KeyboardEvent) => {
            if (e.key === "Enter" || e.key === " ") {
              e.preventDefault();
              onSelect(i);
            }
          }
        : undefined,
      className: onSelect ? "cursor-pointer focus-visible:outline-3 focus-visible:outline-offset-2 focus-visible:outline-ink" : undefined,
    };
    if (it.isGap) {
      const g = it.layer as GapLike;
      return (
        <g key={i} {...common} aria-label={onSelect ? `Gap: ${mmText(it.mm)} mm ${gasLabel(g.gas)}` : undefined}>
          <rect
            x={x0}
            y={top + 6}
            width={w}
            height={glassH - 12}
            fill={isSelected ? "#fbeed6" : "#f6f4ef"}
            stroke={isInvalid ? "#b3261e" : isSelected ? "#e8a33d" : "#ddd8cc"}
            strokeWidth={isInvalid || isSelected ? 2 : 1}
            strokeDasharray="3 3"
          />
          {labels && (
            <text
              x={x0 + w / 2}
              y={top + glassH / 2}
              fontSize={11}
              textAnchor="middle"
              dominantBaseline="middle"
              fill="#4a5a66"
              transform={`rotate(-90 ${x0 + w / 2} ${top + glassH / 2})`}
            >
              {mmText(it.mm)} {gasLabel(g.gas)}
            </text>
          )}
        </g>
      );
    }
    const p = it.layer as PaneLike;
    const n = paneNumbers[i]!;
    const frontLowE = p.emissivityFront !== undefined && p.emissivityFront < LOW_E_BELOW;
    const backLowE = p.emissivityBack !== undefined && p.emissivityBack < LOW_E_BELOW;
    return (
      <g key={i} {...common} aria-label={onSelect ? `Pane ${n + 1}: ${mmText(it.mm)} mm${p.measured ? ", measured values" : ""}` : undefined}>
        <rect
          x={x0}
          y={top}
          width={w}
          height={glassH}
          fill={p.measured ? "#b9d7dd" : "#d8e9ec"}
          stroke={isInvalid ? "#b3261e" : isSelected ? "#e8a33d" : "#0f4c5c"}
          strokeWidth={isSelected || isInvalid ? 3 : 1}
        />
        {frontLowE && <line x1={x0 + 1} x2={x0 + 1} y1={top} y2={top + glassH} stroke="#e8a33d" strokeWidth={3} data-coating={2 * n + 1} />}
        {backLowE && <line x1={x0 + w - 1} x2={x0 + w - 1} y1={top} y2={top + glassH} stroke="#e8a33d" strokeWidth={3} data-coating={2 * n + 2} />}
        {labels && (
          <>
            <text x={x0} y={top - 6} fontSize={10} textAnchor="middle" fill={frontLowE ? "#9a6514" : "#4a5a66"}>
              #{2 * n + 1}
            </text>
            <text x={x0 + w} y={top - 6} fontSize={10} textAnchor="middle" fill={backLowE ? "#9a6514" : "#4a5a66"}>
              #{2 * n + 2}
            </text>
            <text x={x0 + w / 2} y={top + glassH + 15} fontSize={11} textAnchor="middle" fill="#14212b">
              {mmText(it.mm)}
            </text>
          </>
        )}
      </g>
    );
  });
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      width={width}
      height={height}
      className="max-w-full"
      role={onSelect ? "group" : "img"}
      aria-label={title ?? "The make-up in section, outdoors on the left"}
      data-testid="makeup-section"
    >
      {labels && (
        <>
          <text x={margin - 8} y={top + glassH / 2} fontSize={11} textAnchor="end" dominantBaseline="middle" fill="#4a5a66">
            outdoors
          </text>
          <text x={width - margin + 8} y={top + glassH / 2} fontSize={11} dominantBaseline="middle" fill="#4a5a66">
            indoors
          </text>
        </>
      )}
      {shapes}
    </svg>
  );
}

function mmText(mm: number): string {
  return String(Math.round(mm * 10) / 10);
}
