import { z } from "./zod";

/** Trimmed, non-empty text with a length limit. */
export const text = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .min(1, `${label} is required`)
    .max(max, `${label} must be at most ${max} characters`);

/** Optional free text: empty strings become null. */
export const optionalText = (label: string, max: number) =>
  z
    .string({ error: `${label} must be text` })
    .trim()
    .max(max, `${label} must be at most ${max} characters`)
    .nullish()
    .transform((v) => (v ? v : null));

export const email = z
  .string({ error: "email must be text" })
  .trim()
  .toLowerCase()
  .max(254, "email is too long")
  .pipe(z.email({ error: "email is not a valid e-mail address" }));

export const password = z
  .string({ error: "password must be text" })
  .min(8, "password must be at least 8 characters")
  .max(128, "password must be at most 128 characters");

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

export const timeZone = z
  .string({ error: "timeZone must be text" })
  .trim()
  .refine(isIanaTimeZone, "timeZone must be an IANA time-zone name such as Europe/Lisbon");
