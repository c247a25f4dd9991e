import type { GlazingValues } from "@/lib/contracts/glazing";

/** Colours of the panes' absorbed shares, outdoor pane first (also the absorptance chart's series). */
export const PANE_COLORS = ["#7a3e9d", "#c2410c", "#0e7490", "#4d7c0f", "#9f1239", "#1d4ed8"];

interface Share {
  key: string;
  label: string;
  value: number;
  color: string;
}

/**
 * Where the sun striking the outer pane goes, at one angle of incidence: transmitted (τe), reflected
 * back outdoors (ρe) and absorbed in each pane (α1 … αn). The shares add up to 1 (energy is conserved),
 * so the bar is full width; the figures under it are the same fractions.
 */
export default function SunBudget({ values, caption }: { values: GlazingValues; caption: string }) {
  const shares: Share[] = [
    { key: "T", label: "transmitted τe", value: values.solarTransmittance, color: "#0f4c5c" },
    { key: "R", label: "reflected ρe", value: values.solarReflectanceFront, color: "#e8a33d" },
    ...values.layerAbsorptance.map((a, k) => ({
      key: `A${k + 1}`,
      label: `absorbed, pane ${k + 1}`,
      value: a,
      color: PANE_COLORS[k % PANE_COLORS.length]!,
    })),
  ];
  const total = shares.reduce((s, x) => s + Math.max(0, x.value), 0) || 1;
  return (
    <figure className="space-y-2" data-testid="sun-budget">
      <figcaption className="text-sm font-bold">{caption}</figcaption>
      <div
        className="flex h-7 w-full overflow-hidden rounded border border-line"
        role="img"
        aria-label={shares.map((s) => `${s.label} ${s.value.toFixed(3)}`).join(", ")}
      >
        {shares.map((s) => (
          <div
            key={s.key}
            style={{ width: `${(Math.max(0, s.value) / total) * 100}%`, background: s.color }}
            data-share={s.key}
            title={`${s.label}: ${s.value.toFixed(3)}`}
          />
        ))}
      </div>
      <ul className="grid grid-cols-2 gap-x-4 gap-y-1 text-xs tabular-nums sm:grid-cols-3">
        {shares.map((s) => (
          <li key={s.key} className="flex items-center gap-1.5">
            <span className="inline-block h-2.5 w-2.5 shrink-0 rounded-sm" style={{ background: s.color }} aria-hidden="true" />
            <span>{s.label}</span>
            <span className="ml-auto font-bold">{s.value.toFixed(3)}</span>
          </li>
        ))}
      </ul>
    </figure>
  );
}
