/**
 * Cursor pages newest first (history, deliveries, API keys): rows ordered by a timestamp column, then by id, both
 * descending. The cursor's key is the timestamp as text to the microsecond (a JavaScript Date keeps only
 * milliseconds, which would skip or repeat rows written in the same millisecond).
 */
import { and, desc, eq, lt, or, sql, type SQL } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import type { PageQuery } from "@/lib/contracts/pagination";

/** The timestamp of `at` as the cursor key: ISO UTC to the microsecond. */
export const instantKey = (at: AnyPgColumn) => sql<string>`to_char(${at} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;

/** The rows after the cursor (older, or as old with a smaller id); undefined on the first page. */
export function olderThanCursor(at: AnyPgColumn, id: AnyPgColumn, cursor: PageQuery["cursor"]): SQL | undefined {
  if (!cursor) return undefined;
  return or(lt(at, sql`${cursor.key}::timestamptz`), and(eq(at, sql`${cursor.key}::timestamptz`), lt(id, cursor.id)));
}

/** The order of such a page. */
export const newestFirst = (at: AnyPgColumn, id: AnyPgColumn) => [desc(at), desc(id)] as const;
