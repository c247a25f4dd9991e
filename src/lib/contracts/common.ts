import { z } from "./zod";

/**
 * Characters no text field accepts: C0 controls (NUL included), DEL and C1 controls. Multi-line fields
 * (descriptions) allow tab and line feed; a CR LF pair is read as a line feed.
 */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL_SINGLE_LINE = /[\u0000-\u001f\u007f-\u009f]/;
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const CONTROL_MULTI_LINE = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/;
/** Bidirectional embedding, override and isolate controls: they make a name display as something else. */
const BIDI_CONTROL = /[\u202a-\u202e\u2066-\u2069]/;
/** A UTF-16 surrogate not part of a pair (not a Unicode character; cannot be stored as UTF-8). */
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

export interface TextOptions {
  /** Allow tab and line feed (descriptions); names allow neither. */
  multiline?: boolean;
  /** Refuse bidirectional control characters (default: for single-line text). */
  noBidi?: boolean;
}

/** The reason a string is not acceptable text, or null. */
export function textProblem(value: string, opts: TextOptions = {}): string | null {
  if ((opts.multiline ? CONTROL_MULTI_LINE : CONTROL_SINGLE_LINE).test(value))
    return opts.multiline ? "must not contain control characters (only tab and line breaks are allowed)" : "must not contain control characters";
  if (LONE_SURROGATE.test(value)) return "must be valid Unicode text (it holds an unpaired surrogate)";
  if ((opts.noBidi ?? !opts.multiline) && BIDI_CONTROL.test(value)) return "must not contain bidirectional override characters";
  return null;
}

/** Any string field: text without control characters or broken Unicode (single-line unless told). */
export const plainString = (label: string, opts: TextOptions = {}) =>
  z
    .string({ error: `${label} must be text` })
    .transform((v) => (opts.multiline ? v.replace(/\r\n/g, "\n") : v))
    .superRefine((v, ctx) => {
      const problem = textProblem(v, opts);
      if (problem) ctx.addIssue({ code: "custom", message: `${label} ${problem}` });
    });

/** Trimmed, non-empty text with a length limit (single-line unless `multiline`). */
export const text = (label: string, max: number, opts: TextOptions = {}) =>
  plainString(label, opts).pipe(z.string().trim().min(1, `${label} is required`).max(max, `${label} must be at most ${max} characters`));

/** A name: one line of text, no control or bidirectional override characters. */
export const name = (label: string, max: number) => text(label, max);

/** Optional free text: empty strings become null. */
export const optionalText = (label: string, max: number, opts: TextOptions = {}) =>
  plainString(label, opts)
    .pipe(z.string().trim().max(max, `${label} must be at most ${max} characters`))
    .nullish()
    .transform((v) => (v ? v : null));

export const email = plainString("email").pipe(
  z
    .string()
    .trim()
    .toLowerCase()
    .max(254, "email is too long")
    .pipe(z.email({ error: "email is not a valid e-mail address" })),
);

/** A password as typed: not trimmed; control characters and broken Unicode refused like any text. */
export const password = plainString("password").pipe(
  z.string().min(8, "password must be at least 8 characters").max(128, "password must be at most 128 characters"),
);

/** Opaque row identifiers (uuid or better-auth ids): letters, digits, - and _. */
export const rowId = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, "not a valid id");

export function isIanaTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat("en", { timeZone: tz });
    return tz.includes("/") || tz === "UTC";
  } catch {
    return false;
  }
}

export const timeZone = plainString("timeZone").pipe(
  z.string().trim().refine(isIanaTimeZone, "timeZone must be an IANA time-zone name such as Europe/Lisbon"),
);
