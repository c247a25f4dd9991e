/**
 * The HTTP edge: one error body for every endpoint (RFC 9457 problem+json), the request-reading
 * helpers that turn bad input into a 4xx answer instead of an exception, and `endpoint(…)`, the one
 * way to write an endpoint (auth, params, body, size limit and error mapping declared up front).
 */
import type { APIContext, APIRoute } from "astro";
import { z, type ZodType } from "zod";
import type { FieldError, Problem } from "@/lib/contracts/problem";
import { permissionFor, PERMISSION_PHRASES, type PermissionKey } from "@/lib/auth/roles";
import { ConflictError, DomainError, ForbiddenError, InvalidError, NotFoundError, RateLimitedError } from "@/lib/server/errors";
import { isDatabaseUnavailable, RETRY_AFTER_SECONDS } from "@/lib/server/db/unavailable";
import type { Caller, Membership, ProjectRow } from "@/lib/server/services/access";
import type { ApiKeyPrincipal } from "@/lib/server/services/api-keys";
import { keyScope, routeOfPattern, scopeAllows } from "@/lib/auth/route-table";
import type { FacadeOption } from "@/lib/server/db/workspace-schema";

/** The access rules, loaded on first use so that this module (and its tests) need no database. */
const access = () => import("@/lib/server/services/access");

export type { FieldError };

const TITLES: Record<number, string> = {
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

export function problem(status: number, detail: string, extra: { errors?: FieldError[]; [k: string]: unknown } = {}): Response {
  const body: Problem = { type: "about:blank", title: TITLES[status] ?? "Error", status, detail, ...extra };
  return new Response(JSON.stringify(body), {
    status,
    headers: { "content-type": "application/problem+json; charset=utf-8", "cache-control": "no-store" },
  });
}

/** 503 with Retry-After: the database (or the session store in it) cannot be reached right now. */
export function unavailable(detail = "The database is unavailable at the moment; nothing was changed. Try again in a few seconds."): Response {
  const res = problem(503, detail, { retryAfterSeconds: RETRY_AFTER_SECONDS });
  res.headers.set("retry-after", String(RETRY_AFTER_SECONDS));
  return res;
}

/** Thrown at the edge (size limits, content types) to answer with a problem response. */
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

/** The status each domain error is answered with. */
export function statusOfDomainError(err: DomainError): 400 | 403 | 404 | 409 | 429 | 500 {
  if (err instanceof NotFoundError) return 404;
  if (err instanceof ForbiddenError) return 403;
  if (err instanceof ConflictError) return 409;
  if (err instanceof InvalidError) return 400;
  if (err instanceof RateLimitedError) return 429;
  return 500;
}

export const fieldPath = (path: readonly PropertyKey[]) =>
  path.length === 0
    ? "(body)"
    : path
        .map((p) => (typeof p === "number" ? `[${p}]` : String(p)))
        .join(".")
        .replace(/\.\[/g, "[");

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

/** Validates route parameters (e.g. ids) with the same error shape as bodies; a bad id is a 404. */
export function parseParams<T>(params: unknown, schema: ZodType<T>): T {
  const parsed = schema.safeParse(params);
  if (!parsed.success) {
    const err = validationError(parsed.error);
    throw new HttpError(404, err.message, err.extra);
  }
  return parsed.data;
}

/** What JSON.stringify makes of a value's type: dates become strings (`toJSON`), the rest keeps its shape. */
export type Jsonified<T> = T extends Date
  ? string
  : T extends readonly (infer U)[]
    ? Jsonified<U>[]
    : T extends object
      ? { [K in keyof T]: Jsonified<T[K]> }
      : T;

/**
 * `json(data)` for a documented answer: what `data` becomes as JSON must have the type of the response schema in
 * the contracts (the compiler checks it; nothing is validated at run time), so a handler and the API document
 * cannot drift apart.
 */
export function jsonOf<S extends ZodType, const T>(
  _schema: S,
  data: T & (Jsonified<T> extends z.input<S> ? unknown : { "does not fit the response schema": never }),
  status = 200,
  headers: HeadersInit = {},
): Response {
  return json(data, status, headers);
}

export function json(data: unknown, status = 200, headers: HeadersInit = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { "content-type": "application/json; charset=utf-8", "cache-control": "no-store", ...headers },
  });
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
 * The problem answer for a failure, or null when the failure is unexpected (a bug or an outage).
 * `engineField`: when given, a RangeError (the calculation engine refusing a combination the
 * schema cannot see) is bad input about that field, not a failure of ours.
 */
export function problemFor(err: unknown, engineField?: string): HttpError | null {
  if (err instanceof HttpError) return err;
  if (err instanceof RateLimitedError) return new HttpError(429, err.message, { retryAfterSeconds: err.retryAfterSeconds });
  if (err instanceof DomainError) return new HttpError(statusOfDomainError(err), err.message, err.errors.length ? { errors: err.errors } : {});
  if (err instanceof z.ZodError) return validationError(err);
  if (engineField !== undefined && err instanceof RangeError) {
    return new HttpError(400, err.message, { errors: [{ field: engineField, message: err.message }] });
  }
  const authErr = fromAuthError(err);
  return authErr && authErr.status < 500 ? authErr : null;
}

/**
 * Runs a handler so that every failure becomes a problem response: known errors with their
 * status (see problemFor), a lost or refused database connection 503 with Retry-After (see
 * isDatabaseUnavailable), anything else a logged 500 without internals.
 */
export function withProblems(fn: (ctx: APIContext) => Promise<Response> | Response, engineField?: string): APIRoute {
  return async (ctx) => {
    try {
      return await fn(ctx);
    } catch (err) {
      const known = problemFor(err, engineField);
      if (known) {
        const res = known.toResponse();
        if (known.status === 429 && typeof known.extra.retryAfterSeconds === "number")
          res.headers.set("retry-after", String(known.extra.retryAfterSeconds));
        return res;
      }
      if (err instanceof Error && err.name === "QueueFullError" && typeof (err as { retryAfterS?: unknown }).retryAfterS === "number") {
        // The calculation workers are all busy and their queue is full (calc-pool): nothing was saved.
        const res = problem(503, "Every calculation worker is busy at the moment; nothing was saved. Try again in a few seconds.");
        res.headers.set("retry-after", String((err as unknown as { retryAfterS: number }).retryAfterS));
        return res;
      }
      if (isDatabaseUnavailable(err)) {
        console.error(`[api] ${ctx.request.method} ${ctx.url.pathname}: database unavailable:`, (err as Error).message);
        return unavailable();
      }
      console.error(`[api] ${ctx.request.method} ${ctx.url.pathname} failed:`, err);
      return problem(500, "Something went wrong on our side; nothing was changed by the failed step.");
    }
  };
}

type SignedInUser = NonNullable<App.Locals["user"]>;

/** A project named by a route parameter; the caller must see it and, if given, hold `permission` on it. */
export interface ProjectAuth {
  project: string;
  permission?: PermissionKey;
  /** How a refusal names the action; defaults to the permission's phrase. */
  action?: string;
}

/** An organisation named by a route parameter or a body field; the caller's role there must hold `permission`. */
export interface OrgAuth {
  org: string;
  from?: "params" | "body";
  permission: PermissionKey;
  action?: string;
}

/** A façade option named by a route parameter: its project's rule applies (as ProjectAuth). */
export interface OptionAuth {
  option: string;
  permission?: PermissionKey;
  action?: string;
}

/** An e-mail delivery named by a route parameter: its project's rule applies (as ProjectAuth). */
export interface DeliveryAuth {
  delivery: string;
  permission?: PermissionKey;
  action?: string;
}

/** A saved make-up or pane named by a route parameter: its organisation's rule applies (as OrgAuth). */
export type LibraryAuth = ({ makeup: string } | { pane: string }) & { permission: PermissionKey; action?: string };

/**
 * Who may call: "anonymous" (anyone), "user" (signed in), or a permission on a project, an option,
 * an organisation or a library item (signed in, and the role allows it; not visible → 404, not allowed → 403).
 */
export type AuthSpec = "anonymous" | "user" | ProjectAuth | OrgAuth | OptionAuth | DeliveryAuth | LibraryAuth;

type AuthContext<A extends AuthSpec> = A extends "anonymous"
  ? { user: SignedInUser | null }
  : A extends ProjectAuth
    ? { user: SignedInUser; project: ProjectRow; membership: Membership }
    : A extends OptionAuth
      ? { user: SignedInUser; project: ProjectRow; membership: Membership; option: FacadeOption }
      : A extends DeliveryAuth
        ? { user: SignedInUser; project: ProjectRow; membership: Membership; deliveryId: string }
        : A extends OrgAuth | LibraryAuth
          ? { user: SignedInUser; membership: Membership }
          : { user: SignedInUser };

export interface EndpointSpec<A extends AuthSpec, P, B> {
  auth: A;
  /** Route parameters; a value that fails is answered 404 (no such resource). */
  params?: ZodType<P>;
  /** JSON body; failures are answered 400 naming the field. Without it the body is not read. */
  body?: ZodType<B>;
  /** Body size limit in bytes (413 past it); default MAX_JSON_BYTES. */
  maxBytes?: number;
  /** Map the engine's RangeErrors to 400 about this request field. */
  engineErrorsField?: string;
}

export type EndpointInput<A extends AuthSpec, P, B> = {
  context: APIContext;
  request: Request;
  params: P;
  body: B;
  /** The API key the request came with (null for a session): its caller acts in the key's organisation only. */
  apiKey: ApiKeyPrincipal | null;
} & AuthContext<A>;

/** The caller as the access rules take it: the user, limited to the key's organisation when a key is used. */
export const callerOf = (userId: string, apiKey: ApiKeyPrincipal | null | undefined): Caller =>
  apiKey ? { userId, organizationId: apiKey.organizationId } : userId;

/**
 * Why a request made with `apiKey` may not call the route Astro matched (`pattern`), or null when its scope
 * allows it: the route table's `keyScope` decides, and a route it does not know is refused.
 */
export function apiKeyRefusal(apiKey: ApiKeyPrincipal, method: string, pattern: string | undefined): string | null {
  const route = pattern ? routeOfPattern(method, pattern) : undefined;
  if (!route) return "This route is not open to API keys";
  const needed = keyScope(route);
  if (needed === "session-only") return "This route needs a signed-in session; API keys cannot call it";
  if (!scopeAllows(apiKey.scope, needed))
    return `This API key's scope (${apiKey.scope}) does not allow this route; it needs a "${needed}" key or wider`;
  return null;
}

const phrase = (auth: ProjectAuth | OrgAuth | OptionAuth | DeliveryAuth | LibraryAuth) =>
  auth.action ?? (auth.permission && PERMISSION_PHRASES[auth.permission]) ?? "do this";

function stringAt(source: unknown, key: string): string {
  const v = source && typeof source === "object" ? (source as Record<string, unknown>)[key] : undefined;
  if (typeof v !== "string") throw new Error(`endpoint: "${key}" is not a string in the validated input`);
  return v;
}

/**
 * Declares an endpoint: who may call it, its parameter and body schemas and its size limit. The
 * handler receives validated values (and the project or membership the auth rule loaded) and
 * returns a Response; domain errors, zod errors and the engine's RangeErrors become problem+json.
 *
 *   export const PATCH = endpoint(
 *     { auth: { project: "id", permission: "project:update" }, params: z.object({ id: rowId }), body: ProjectUpdateRequest },
 *     async ({ project, body }) => json({ project: await updateProject(project.id, body) }),
 *   );
 */
export function endpoint<const A extends AuthSpec, P = Record<string, never>, B = undefined>(
  spec: EndpointSpec<A, P, B>,
  handler: (input: EndpointInput<A, P, B>) => Promise<Response> | Response,
): APIRoute {
  return withProblems(async (context) => {
    const user = context.locals.user ?? null;
    const apiKey = context.locals.apiKey ?? null;
    const auth = spec.auth as AuthSpec;
    if (apiKey) {
      const refusal = apiKeyRefusal(apiKey, context.request.method, context.routePattern);
      if (refusal) throw new HttpError(403, refusal);
    }
    if (auth !== "anonymous" && !user) throw new HttpError(401, "Sign in to use this endpoint");
    const caller = user ? callerOf(user.id, apiKey) : null;
    const params = (spec.params ? parseParams(context.params, spec.params) : {}) as P;

    let loaded: { project?: ProjectRow; membership?: Membership; option?: FacadeOption; deliveryId?: string } = {};
    const authorise = async (from: "params" | "body", source: unknown) => {
      if (typeof auth !== "object") return;
      if ("project" in auth && from === "params") {
        const permission = auth.permission ? permissionFor(auth.permission) : undefined;
        loaded = await (await access()).requireProject(caller!, stringAt(source, auth.project), permission, phrase(auth));
      } else if ("option" in auth && from === "params") {
        const permission = auth.permission ? permissionFor(auth.permission) : undefined;
        loaded = await (await access()).requireOption(caller!, stringAt(source, auth.option), permission, phrase(auth));
      } else if ("delivery" in auth && from === "params") {
        const permission = auth.permission ? permissionFor(auth.permission) : undefined;
        loaded = await (await access()).requireDelivery(caller!, stringAt(source, auth.delivery), permission, phrase(auth));
      } else if (("makeup" in auth || "pane" in auth) && from === "params") {
        const [kind, key] = "makeup" in auth ? (["makeup", auth.makeup] as const) : (["pane", auth.pane] as const);
        const r = await (await access()).requireLibraryItem(caller!, kind, stringAt(source, key), permissionFor(auth.permission), phrase(auth));
        loaded = { membership: r.membership };
      } else if ("org" in auth && (auth.from ?? "params") === from) {
        loaded = {
          membership: await (await access()).requireOrgPermission(caller!, stringAt(source, auth.org), permissionFor(auth.permission), phrase(auth)),
        };
      }
    };

    await authorise("params", params);
    const body = (spec.body ? await readJson(context.request, spec.body, spec.maxBytes ?? MAX_JSON_BYTES) : undefined) as B;
    await authorise("body", body);
    return handler({ context, request: context.request, params, body, user, apiKey, ...loaded } as unknown as EndpointInput<A, P, B>);
  }, spec.engineErrorsField);
}
