/** How the validation page prints numbers and times (pure; the downloads keep full precision). */

/** A value as the case prints it, or the engine's value to 10 significant digits. */
export function formatValue(v: number | string | null): string {
  if (v === null) return "—";
  if (typeof v === "string") return v;
  if (Number.isInteger(v) && Math.abs(v) < 1e15) return String(v);
  return String(Number(v.toPrecision(10)));
}

/** A deviation or a ratio: 0, or three significant digits in exponent form. */
export function formatSmall(v: number | null): string {
  if (v === null) return "—";
  if (v === 0) return "0";
  return v.toExponential(2);
}

/** An instant as "2026-12-03 09:58:12 UTC". */
export const formatUtc = (iso: string): string => `${iso.slice(0, 10)} ${iso.slice(11, 19)} UTC`;

/** A text with `code` spans as segments: even indexes plain, odd indexes code. */
export const codeSegments = (text: string): string[] => text.split("`");
