/**
 * Pieces the response schemas share: instants, page cursors, nullable texts. Responses are described in zod
 * like requests, so that the API document (lib/api-docs) and the handlers' types come from one place.
 */
import { z } from "./zod";

/** An instant as JSON carries it: ISO-8601 with `Z` or an offset. */
export const instant = z.iso.datetime({ offset: true }).describe("ISO-8601 instant (UTC `Z` or with an offset)");

/** The cursor of the next page, or null on the last page. */
export const nextCursor = z.string().nullable().describe("Pass as `?cursor=` to get the next page; null on the last page");

/** An id of a stored row, as the API answers it. */
export const id = z.string().describe("Id");

/** Text that may be absent (stored as null). */
export const nullableText = z.string().nullable();
