/**
 * Number fields of every request: finite (NaN, Infinity and strings refused) and in range, with
 * messages that name the field.
 */
import { z } from "./zod";

const finiteNumber = (label: string) => z.number({ error: `${label} must be a number` }).refine(Number.isFinite, `${label} must be a finite number`);

/** A finite number within [min, max]: "… must be between min and max". */
export const finite = (label: string, min: number, max: number) =>
  finiteNumber(label)
    .refine((v) => v >= min && v <= max, `${label} must be between ${min} and ${max}`)
    // The range for the JSON Schema of the API document (the refinement above makes the check).
    .meta({ minimum: min, maximum: max });

/**
 * A finite number with a lower and an upper bound stated separately: "… must be at least min and
 * at most max", or "greater than min" when the lower bound is excluded.
 */
export const bounded = (label: string, min: number, max: number, opts: { minExclusive?: boolean } = {}) =>
  finiteNumber(label)
    .refine(
      (v) => (opts.minExclusive ? v > min : v >= min) && v <= max,
      `${label} must be ${opts.minExclusive ? "greater than" : "at least"} ${min} and at most ${max}`,
    )
    .meta(opts.minExclusive ? { exclusiveMinimum: min, maximum: max } : { minimum: min, maximum: max });

/** A finite number in (0, max]: "… must be greater than 0 and at most max". */
export const positive = (label: string, max: number) => bounded(label, 0, max, { minExclusive: true });

/** A fraction in [0, 1]. */
export const fraction = (label: string) => bounded(label, 0, 1);
