/**
 * The error body every endpoint answers with (RFC 9457 problem+json), shared by the server that
 * writes it and the islands that read it.
 */

/** One refused input: `field` is the path in the request ("layers[2].thicknessMm", "(body)"). */
export interface FieldError {
  field: string;
  message: string;
}

export interface Problem {
  type: string;
  title: string;
  status: number;
  detail: string;
  errors?: FieldError[];
  [extra: string]: unknown;
}
