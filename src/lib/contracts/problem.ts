/**
 * The error body every endpoint answers with (RFC 9457 problem+json), shared by the server that
 * writes it and the islands that read it.
 */

import { z } from "./zod";

/** One refused input: `field` is the path in the request ("layers[2].thicknessMm", "(body)"). */
export const FieldError = z.object({
  field: z.string().describe('Path of the refused input in the request, e.g. "layers[2].thicknessMm", or "(body)"'),
  message: z.string().describe("What is wrong, in words"),
});
export type FieldError = z.output<typeof FieldError>;

export interface Problem {
  type: string;
  title: string;
  status: number;
  detail: string;
  errors?: FieldError[];
  [extra: string]: unknown;
}

/** One problem of an uploaded CSV file: its line as a spreadsheet numbers it (header = 1), the column's header name. */
export const UploadLineError = z.object({ line: z.number().int(), column: z.string(), message: z.string() });

/** The problem+json body as the API document describes it (extra members are allowed, e.g. `retryAfterSeconds`). */
export const ProblemSchema = z.looseObject({
  type: z.string().describe('Always "about:blank"'),
  title: z.string().describe("The status in words"),
  status: z.number().int().min(400).max(599),
  detail: z.string().describe("What went wrong and what to do, in words"),
  errors: z
    .array(z.union([FieldError, UploadLineError]))
    .optional()
    .describe("The refused fields (JSON bodies), or the lines and columns of an uploaded file"),
  retryAfterSeconds: z.number().int().optional().describe("With 429 and 503: seconds to wait (also in `Retry-After`)"),
});
