/**
 * The geometry of the validation chart: per domain, each value's |deviation|/tolerance on a logarithmic axis,
 * with the pass line at 1. Pure: the page draws it as SVG.
 */
import type { ReportRow, ValidationReport } from "./report";

/** The axis runs from 10^MIN_DECADE to 10^MAX_DECADE; smaller ratios (exact matches too) sit at the left edge. */
export const MIN_DECADE = -6;
export const MAX_DECADE = 1;

export interface ChartPoint {
  /** Position along the axis, 0 (left edge) … 1 (right edge). */
  readonly x: number;
  readonly pass: boolean;
  /** Shown as the point's title: case, quantity and ratio. */
  readonly title: string;
}

export interface ChartRow {
  readonly domain: string;
  readonly label: string;
  readonly points: readonly ChartPoint[];
  /** Values with a tolerance of zero met exactly, and texts: drawn at the left edge, counted here. */
  readonly exact: number;
}

/** Where a ratio sits on the axis, 0 … 1 (clamped). */
export function axisPosition(ratio: number): number {
  if (!(ratio > 0)) return 0;
  const d = Math.log10(ratio);
  return Math.min(1, Math.max(0, (d - MIN_DECADE) / (MAX_DECADE - MIN_DECADE)));
}

/** The ticks of the axis: one per decade, with its label. */
export const chartTicks = (): { x: number; label: string }[] =>
  Array.from({ length: MAX_DECADE - MIN_DECADE + 1 }, (_, k) => {
    const decade = MIN_DECADE + k;
    return { x: axisPosition(10 ** decade), label: decade === 0 ? "1" : decade === 1 ? "10" : `${decade === MIN_DECADE ? "≤ " : ""}1e${decade}` };
  });

const pointOf = (r: ReportRow): ChartPoint => {
  // a failing value without a finite ratio (nothing computed, or off at tolerance 0) sits at the right edge
  const x = r.toleranceRatio === null ? (r.pass ? 0 : 1) : axisPosition(r.toleranceRatio);
  const ratio = r.toleranceRatio === null ? (r.pass ? "exact" : "no ratio") : r.toleranceRatio.toPrecision(2);
  return { x, pass: r.pass, title: `${r.caseId} · ${r.quantity}: |deviation|/tolerance ${ratio}` };
};

/** One row per domain of the report, with a point per numeric value. */
export function chartRows(report: ValidationReport): ChartRow[] {
  return report.domains.map((d) => {
    const rows = report.rows.filter((r) => r.domain === d.domain);
    const numeric = rows.filter((r) => r.kind === "number");
    return {
      domain: d.domain,
      label: d.label,
      points: numeric.map(pointOf),
      exact: rows.filter((r) => r.pass && (r.kind === "text" || r.absDeviation === 0)).length,
    };
  });
}
