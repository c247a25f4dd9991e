/**
 * Builders shared by the case modules: the tolerance of a printed value and the expected-value records.
 * Pure data helpers; they import nothing but the shapes.
 */
import type { ExpectedValue, Tolerance } from "./types";

const ordinal = (n: number): string => {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  return `${n}${["th", "st", "nd", "rd"][n % 10] ?? "th"}`;
};

/** Half a unit in the last printed decimal of a value printed to `decimals` decimals (5e-7 for 6 decimals). */
export function half(decimals: number): Tolerance {
  return {
    abs: Number(`5e-${decimals + 1}`),
    reason: decimals === 0 ? "printed as an integer: half a unit" : `half a unit in the ${ordinal(decimals)} printed decimal`,
  };
}

/** An expected value; by default a fraction ("-") printed to 6 decimals. */
export function ev(quantity: string, value: number, tolerance: Tolerance = half(6), unit = "-"): ExpectedValue {
  return { quantity, unit, value, tolerance };
}

/** An expected value as printed: its tolerance is half a unit in the last decimal the printed string shows. */
export function printed(quantity: string, unit: string, value: string): ExpectedValue {
  return ev(quantity, Number(value), half(value.includes(".") ? value.split(".")[1]!.length : 0), unit);
}
