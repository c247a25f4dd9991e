/**
 * Daily, monthly and whole-period energy totals of one surface's hourly (or sub-hourly) series,
 * with the peak interval of each. Energy of a row = power × step length (the row's irradiance
 * stands for its whole interval, evaluated at the interval's midpoint).
 */
import type { PeriodTotals } from "@/lib/contracts/schedule";

export interface TotalsInput {
  /** W/m² per row */
  incidentWm2: Float64Array;
  transmittedWm2: Float64Array;
  solarGainWm2: Float64Array;
  stepMinutes: number;
  /** glazed area [m²] for kWh, or null */
  areaM2: number | null;
  days: readonly { date: string; firstRow: number; rowCount: number }[];
  /** ISO instant of row i */
  iso: (i: number) => string;
}

export interface ScheduleTotals {
  daily: (PeriodTotals & { date: string })[];
  monthly: (PeriodTotals & { month: string })[];
  period: PeriodTotals & { from: string; to: string };
}

interface Acc {
  inc: number;
  tr: number;
  gain: number;
  peakRow: number;
}

const newAcc = (): Acc => ({ inc: 0, tr: 0, gain: 0, peakRow: -1 });

export function scheduleTotals(t: TotalsInput): ScheduleTotals {
  const hours = t.stepMinutes / 60;
  const finish = (a: Acc): PeriodTotals => {
    const inc = (a.inc * hours) / 1000;
    const tr = (a.tr * hours) / 1000;
    const gain = (a.gain * hours) / 1000;
    return {
      incidentKWhPerM2: inc,
      transmittedKWhPerM2: tr,
      solarGainKWhPerM2: gain,
      transmittedKWh: t.areaM2 === null ? null : tr * t.areaM2,
      solarGainKWh: t.areaM2 === null ? null : gain * t.areaM2,
      peak:
        a.peakRow < 0 || t.solarGainWm2[a.peakRow]! <= 0
          ? null
          : { time: t.iso(a.peakRow), transmittedWm2: t.transmittedWm2[a.peakRow]!, solarGainWm2: t.solarGainWm2[a.peakRow]! },
    };
  };
  const merge = (into: Acc, a: Acc) => {
    into.inc += a.inc;
    into.tr += a.tr;
    into.gain += a.gain;
    if (a.peakRow >= 0 && (into.peakRow < 0 || t.solarGainWm2[a.peakRow]! > t.solarGainWm2[into.peakRow]!)) into.peakRow = a.peakRow;
  };

  const daily: ScheduleTotals["daily"] = [];
  const monthly: ScheduleTotals["monthly"] = [];
  const all = newAcc();
  let month = "";
  let monthAcc = newAcc();
  for (const d of t.days) {
    const acc = newAcc();
    for (let i = d.firstRow, end = d.firstRow + d.rowCount; i < end; i++) {
      acc.inc += t.incidentWm2[i]!;
      acc.tr += t.transmittedWm2[i]!;
      const g = t.solarGainWm2[i]!;
      acc.gain += g;
      if (acc.peakRow < 0 || g > t.solarGainWm2[acc.peakRow]!) acc.peakRow = i;
    }
    daily.push({ date: d.date, ...finish(acc) });
    const m = d.date.slice(0, 7);
    if (m !== month) {
      if (month) monthly.push({ month, ...finish(monthAcc) });
      month = m;
      monthAcc = newAcc();
    }
    merge(monthAcc, acc);
    merge(all, acc);
  }
  if (month) monthly.push({ month, ...finish(monthAcc) });
  return {
    daily,
    monthly,
    period: { from: t.days[0]?.date ?? "", to: t.days[t.days.length - 1]?.date ?? "", ...finish(all) },
  };
}
