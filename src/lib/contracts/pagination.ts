/**
 * Cursor pagination of the list endpoints: `?limit=` (1–100, default 50) and `?cursor=` (the
 * `nextCursor` of the previous page, opaque to clients). A cursor holds the sort key and the id of
 * the last row sent, base64url-encoded; the next page starts after that row, so rows added
 * meanwhile never shift a page.
 */
import { z } from "./zod";

export const DEFAULT_PAGE_LIMIT = 50;
export const MAX_PAGE_LIMIT = 100;

/** Where a page starts: after the row with this sort key and id. */
export interface Cursor {
  key: string;
  id: string;
}

const BASE64URL = /^[A-Za-z0-9_-]{1,400}$/;
const ID = /^[A-Za-z0-9_-]{1,64}$/;

function toBase64Url(text: string): string {
  const bytes = new TextEncoder().encode(text);
  let binary = "";
  for (const b of bytes) binary += String.fromCharCode(b);
  return btoa(binary).replace(/\+/g, "-").replace(/\//g, "_").replace(/=+$/, "");
}

function fromBase64Url(s: string): string | null {
  try {
    const binary = atob(s.replace(/-/g, "+").replace(/_/g, "/"));
    return new TextDecoder("utf-8", { fatal: true }).decode(Uint8Array.from(binary, (c) => c.charCodeAt(0)));
  } catch {
    return null;
  }
}

export function encodeCursor(c: Cursor): string {
  return toBase64Url(JSON.stringify([c.key, c.id]));
}

/** The cursor a string encodes, or null when it is not one of ours. */
export function decodeCursor(s: string): Cursor | null {
  if (!BASE64URL.test(s)) return null;
  const json = fromBase64Url(s);
  if (json === null) return null;
  let v: unknown;
  try {
    v = JSON.parse(json);
  } catch {
    return null;
  }
  if (!Array.isArray(v) || v.length !== 2 || typeof v[0] !== "string" || typeof v[1] !== "string") return null;
  if (v[0].length > 256 || !ID.test(v[1])) return null;
  return { key: v[0], id: v[1] };
}

/** A UTC instant with microseconds, as the database writes sort keys of timestamps (2026-12-02T07:15:41.123456Z). */
const INSTANT = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2})\.\d{6}Z$/;
export function isCursorInstant(s: string): boolean {
  if (!INSTANT.test(s)) return false;
  const d = new Date(s.slice(0, 23) + "Z");
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 19) === s.slice(0, 19);
}

const NOT_A_CURSOR = "cursor is not a valid page cursor (use the nextCursor of the previous page)";

/** Cursor whose sort key is a timestamp (creation or change time). */
export const instantCursor = z.string({ error: "cursor must be text" }).transform((s, ctx) => {
  const c = decodeCursor(s);
  if (!c || !isCursorInstant(c.key)) {
    ctx.addIssue({ code: "custom", message: NOT_A_CURSOR });
    return z.NEVER;
  }
  return c;
});

/** Cursor whose sort key is text (e.g. a person's name). */
export const textCursor = z.string({ error: "cursor must be text" }).transform((s, ctx) => {
  const c = decodeCursor(s);
  if (!c) {
    ctx.addIssue({ code: "custom", message: NOT_A_CURSOR });
    return z.NEVER;
  }
  return c;
});

/** `limit` as a query parameter: a whole number from 1 to 100. */
export const limit = z
  .string({ error: "limit must be a whole number" })
  .regex(/^\d{1,4}$/, `limit must be a whole number from 1 to ${MAX_PAGE_LIMIT}`)
  .transform(Number)
  .pipe(
    z
      .number()
      .int()
      .min(1, `limit must be a whole number from 1 to ${MAX_PAGE_LIMIT}`)
      .max(MAX_PAGE_LIMIT, `limit must be at most ${MAX_PAGE_LIMIT}`),
  )
  .optional()
  .default(DEFAULT_PAGE_LIMIT);

/** The query of a list endpoint whose rows sort by a timestamp. */
export const InstantPageQuery = z.object({ limit, cursor: instantCursor.optional() });
/** The query of a list endpoint whose rows sort by a name. */
export const TextPageQuery = z.object({ limit, cursor: textCursor.optional() });
export type PageQuery = { limit: number; cursor?: Cursor };

/** The query parameters of a URL as an object (the last value of a repeated name wins). */
export const queryOf = (url: URL): Record<string, string> => Object.fromEntries(url.searchParams);

/** One page of a list: the rows, and the cursor of the next page (null on the last). */
export interface Page<T> {
  items: T[];
  nextCursor: string | null;
}

/** Cuts a `limit + 1` fetch to a page; `keyOf` gives the sort key and id of a row. */
export function pageOf<T>(rows: T[], limitN: number, keyOf: (row: T) => Cursor): Page<T> {
  const items = rows.slice(0, limitN);
  const last = items[items.length - 1];
  return { items, nextCursor: rows.length > limitN && last ? encodeCursor(keyOf(last)) : null };
}
