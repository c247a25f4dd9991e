/**
 * The heavy calculations the API runs, by name: each takes a request already validated by its
 * contract and returns the response body as JSON text. The same functions run in the worker
 * threads of the pool and, with the pool switched off, on the main thread.
 */
import type { GlazingRequest } from "@/lib/contracts/glazing";
import type { ScheduleRequest } from "@/lib/contracts/schedule";
import { calculateGlazing } from "@/lib/calc/glazing";
import { scheduleResponse } from "@/lib/calc/schedule-response";
import { surfaceYearSummaries } from "@/lib/calc/surface-year";
import { hourlyRowOf } from "@/lib/calc/workbook-tables";
import { VALIDATION_DOMAINS } from "@/lib/validation/domains";
import { buildValidationReport, type ReportVersions } from "@/lib/validation/report";

export interface CalcTasks {
  glazing: GlazingRequest;
  schedule: ScheduleRequest;
  /** The project results: yearly summaries of up to 24 surfaces (no rows). */
  surfaceYear: ScheduleRequest;
  /** A workbook's hourly sheet: the schedule with its rows cut to the columns the sheet shows. */
  scheduleSheet: ScheduleRequest;
  /** The validation report: every reference case through its evaluator, with the versions it names. */
  validationReport: ReportVersions;
}
export type CalcTaskName = keyof CalcTasks;

const TASKS: { [K in CalcTaskName]: (input: CalcTasks[K]) => unknown } = {
  glazing: calculateGlazing,
  schedule: (req) => scheduleResponse(req),
  surfaceYear: surfaceYearSummaries,
  scheduleSheet: (req) => {
    const res = scheduleResponse(req);
    return { ...res, surfaces: res.surfaces.map((s) => ({ ...s, rows: s.rows.map(hourlyRowOf) })) };
  },
  validationReport: (versions) => buildValidationReport(VALIDATION_DOMAINS, { versions, now: () => new Date(), clock: () => performance.now() }),
};

export const isCalcTaskName = (name: unknown): name is CalcTaskName => typeof name === "string" && Object.hasOwn(TASKS, name);

/** Runs one calculation and serialises its result (the exact text `json(…)` would send). */
export function runCalcTask<K extends CalcTaskName>(name: K, input: CalcTasks[K]): string {
  return JSON.stringify(TASKS[name](input));
}
