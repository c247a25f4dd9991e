/**
 * Yearly summaries of schedule surfaces for the project results: annual and monthly transmitted solar
 * energy and solar gain per m² and the highest hourly transmitted irradiance with its instant. The rows
 * are those of POST /api/v1/calc/schedule (the same `computeSchedule`), and the sums are its
 * `scheduleTotals`, so a result equals what the schedule endpoint gives for the same inputs.
 */
import type { ScheduleRequest } from "@/lib/contracts/schedule";
import { computeSchedule } from "./schedule";
import { scheduleTotals } from "./schedule-totals";

export interface SurfaceYearSummary {
  name: string;
  annual: { transmittedKWhm2: number; solarGainKWhm2: number };
  /** Highest row of transmitted irradiance, W/m² rounded to 0.01 as the schedule rows are; `at` is that row's time. */
  peak: { transmittedWm2: number; at: string | null };
  /** One entry per month of the period, first month first, kWh/m². */
  monthly: { transmittedKWhm2: number[]; solarGainKWhm2: number[] };
}

const r2 = (x: number) => Math.round(x * 100) / 100;

/** Computes every surface of a schedule request and keeps only its yearly summary (no rows). */
export function surfaceYearSummaries(req: ScheduleRequest): SurfaceYearSummary[] {
  const c = computeSchedule(req);
  const tl = c.site.timeline;
  return c.surfaces.map((s) => {
    const col = s.columns;
    const n = tl.length;
    const incident = new Float64Array(n);
    let peakRow = -1;
    for (let i = 0; i < n; i++) {
      incident[i] = col.beamIncidentWm2[i]! + col.diffuseIncidentWm2[i]!;
      if (col.transmittedWm2[i]! > 0 && (peakRow < 0 || col.transmittedWm2[i]! > col.transmittedWm2[peakRow]!)) peakRow = i;
    }
    const totals = scheduleTotals({
      incidentWm2: incident,
      transmittedWm2: col.transmittedWm2,
      solarGainWm2: col.solarGainWm2,
      stepMinutes: tl.stepMinutes,
      areaM2: null,
      days: tl.days,
      iso: (i) => tl.iso(i),
    });
    return {
      name: s.name,
      annual: { transmittedKWhm2: totals.period.transmittedKWhPerM2, solarGainKWhm2: totals.period.solarGainKWhPerM2 },
      peak: peakRow < 0 ? { transmittedWm2: 0, at: null } : { transmittedWm2: r2(col.transmittedWm2[peakRow]!), at: tl.iso(peakRow) },
      monthly: {
        transmittedKWhm2: totals.monthly.map((m) => m.transmittedKWhPerM2),
        solarGainKWhm2: totals.monthly.map((m) => m.solarGainKWhPerM2),
      },
    };
  });
}
