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

/**
 * Schemas whose checks run in code the JSON Schema cannot carry (e.g. layers parsed one by one in a transform,
 * so that messages name the layer), with the shape the API document shows for them instead.
 */
export const documentedAs = new WeakMap<z.ZodType, z.ZodType>();

/** `schema`, shown in the API document with the JSON Schema of `shape`. */
export function docShape<T extends z.ZodType>(schema: T, shape: z.ZodType): T {
  documentedAs.set(schema, shape);
  return schema;
}
