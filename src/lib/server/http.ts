/**
 * One error body for every endpoint (RFC 9457 problem+json) and the request-reading helpers
 * that turn bad input into a 4xx answer instead of an exception.
 */
import type { APIContext, APIRoute } from "astro";
import { z, type ZodType } from "zod";

export interface FieldError {
  field: string;
  message: string;
}

export function problem(status: number, detail: string, extra: { errors?: FieldError[]; [k: string]: unknown } = {}): Response {
  const titles: Record<number, string> = {
    400: "Bad request",
    401: "Not signed in",
    403: "Forbidden",
    404: "Not found",
    405: "Method not allowed",
    409: "Conflict",
    413: "Request body too large",
    415: "Unsupported media type",
    422: "Unprocessable request",
    429: "Too many requests",
    500: "Internal error",
    503: "Service unavailable",
  };
  return new Response(JSON.stringify({ type: "about:blank", title: titles[status] ?? "Error", status, detail, ...extra }), {
    status,
    headers: { "content-type": "application/problem+json; charset=utf-8", "cache-control": "no-store" },
  });
}

/** Thrown inside a handler to answer with a problem response. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: { errors?: FieldError[]; [k: string]: unknown } = {},
  ) {
    super(message);
  }
  toResponse(): Response {
    return problem(this.status, this.message, this.extra);
  }
}

export const fieldPath = (path: readonly PropertyKey[]) =>
  path.length === 0 ? "(body)" : path.map((p) => (typeof p === "number" ? `[${p}]` : String(p))).join(".").replace(/\.\[/g, "[");

export function zodFieldErrors(error: z.ZodError): FieldError[] {
  return error.issues.map((i) => ({ field: fieldPath(i.path), message: i.message }));
}

export function validationError(error: z.ZodError): HttpError {
  const errors = zodFieldErrors(error);
  const first = errors[0]!;
  const more = errors.length > 1 ? ` (and ${errors.length - 1} more)` : "";
  return new HttpError(400, `Invalid field "${first.field}": ${first.message}${more}`, { errors });
}

/** Default cap on JSON request bodies. */
export const MAX_JSON_BYTES = 256 * 1024;

/** Reads and validates a JSON body: 413 past maxBytes, 415 for non-JSON, 400 naming the field. */
export async function readJson<T>(request: Request, schema: ZodType<T>, maxBytes = MAX_JSON_BYTES): Promise<T> {
  const type = request.headers.get("content-type") ?? "";
  if (type && !/^application\/(.+\+)?json\b/i.test(type)) {
    throw new HttpError(415, `Expected a JSON body (content-type application/json), got "${type}"`);
  }
  const declared = Number(request.headers.get("content-length") ?? "NaN");
  if (Number.isFinite(declared) && declared > maxBytes) {
    throw new HttpError(413, `The request body is ${declared} bytes; the limit is ${maxBytes}`);
  }
  const text = await readTextCapped(request, maxBytes);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new HttpError(400, "The request body is not valid JSON", { errors: [{ field: "(body)", message: "not valid JSON" }] });
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw validationError(parsed.error);
  return parsed.data;
}

async function readTextCapped(request: Request, maxBytes: number): Promise<string> {
  if (!request.body) return "";
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => {});
      throw new HttpError(413, `The request body exceeds the limit of ${maxBytes} bytes`);
    }
    chunks.push(value);
  }
  return new TextDecoder().decode(Buffer.concat(chunks));
}

/** Validates route parameters (e.g. ids) with the same error shape as bodies. */
export function parseParams<T>(params: unknown, schema: ZodType<T>): T {
  const parsed = schema.safeParse(params);
  if (!parsed.success) {
    const err = validationError(parsed.error);
    throw new HttpError(404, err.message, err.extra);
  }
  return parsed.data;
}

export function json(data: unknown, status = 200, headers: HeadersInit = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store", ...headers },
  });
}

/** The signed-in user, or a 401. */
export function requireUser(locals: App.Locals): NonNullable<App.Locals["user"]> {
  if (!locals.user) throw new HttpError(401, "Sign in to use this endpoint");
  return locals.user;
}

/** Errors raised by better-auth's server API carry a status and a message. */
function fromAuthError(err: unknown): HttpError | null {
  if (err && typeof err === "object" && "statusCode" in err && typeof (err as { statusCode: unknown }).statusCode === "number") {
    const e = err as { statusCode: number; body?: { message?: string }; message?: string };
    const status = e.statusCode >= 400 && e.statusCode < 500 ? e.statusCode : 500;
    return new HttpError(status, e.body?.message ?? e.message ?? "Request refused");
  }
  return null;
}

/**
 * Wraps an endpoint so that every failure becomes a problem response:
 * HttpError as given, better-auth errors with their status, anything else a logged 500.
 */
export function endpoint(fn: (ctx: APIContext) => Promise<Response> | Response): APIRoute {
  return async (ctx) => {
    try {
      return await fn(ctx);
    } catch (err) {
      if (err instanceof HttpError) return err.toResponse();
      if (err instanceof z.ZodError) return validationError(err).toResponse();
      const authErr = fromAuthError(err);
      if (authErr && authErr.status < 500) return authErr.toResponse();
      console.error(`[api] ${ctx.request.method} ${ctx.url.pathname} failed:`, err);
      return problem(500, "Something went wrong on our side; nothing was changed by the failed step.");
    }
  };
}
