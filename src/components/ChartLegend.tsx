/** Legend of line charts: a short stroke sample (solid or dashed) and the label of each series. */
export default function ChartLegend({ items }: { items: readonly { key: string; label: string; color: string; dashed?: boolean }[] }) {
  return (
    <ul className="flex flex-wrap gap-x-4 gap-y-1 text-xs">
      {items.map((s) => (
        <li key={s.key} className="flex items-center gap-1.5">
          <svg width="22" height="8" aria-hidden="true">
            <line x1="0" x2="22" y1="4" y2="4" stroke={s.color} strokeWidth="2" strokeDasharray={s.dashed ? "5 4" : undefined} />
          </svg>
          {s.label}
        </li>
      ))}
    </ul>
  );
}
