/**
 * The OpenAPI 3.1 document of /api/v1, built from the route table (who may call, success status), the
 * operation registry (./operations.ts: words, schemas, examples) and the zod contracts, whose JSON Schema
 * (draft 2020-12) zod writes: requests as their input, responses as their output.
 *
 * Pure (no I/O): the route /api/v1/openapi.json and the page /docs/api build it once and keep it.
 */
import { z } from "@/lib/contracts/zod";
import { keyScope, ROUTES, routeKey, type KeyScope, type RouteAuth, type RouteEntry } from "@/lib/auth/route-table";
import { permissionFor, PERMISSION_PHRASES, ROLE_LABELS, ROLE_NAMES, roleCan, type PermissionKey } from "@/lib/auth/roles";
import { ProblemSchema } from "@/lib/contracts/problem";
import { documentedAs } from "@/lib/contracts/wire";
import { MAX_PAGE_LIMIT, DEFAULT_PAGE_LIMIT } from "@/lib/contracts/pagination";
import { MAX_UPLOAD_BYTES, UPLOAD_FIELD } from "@/lib/contracts/uploads";
import { OPERATIONS, TAGS, operationKey, pathParams, type Operation } from "./operations";
import { API_DOCUMENT_VERSION } from "./version";

export type JsonSchema = Record<string, unknown>;
type Doc = Record<string, unknown> & {
  paths: Record<string, Record<string, OpenApiOperation>>;
  components: { schemas: Record<string, JsonSchema>; securitySchemes: Record<string, unknown> };
};

export interface OpenApiOperation {
  operationId: string;
  summary: string;
  description: string;
  tags: string[];
  security: Record<string, string[]>[];
  parameters?: unknown[];
  requestBody?: unknown;
  responses: Record<string, unknown>;
  "x-paneray-access": string;
  /** The narrowest API-key scope that may call the operation, or "session-only" (keys never may). */
  "x-paneray-key-scope"?: KeyScope | "session-only";
  "x-paneray-example": Operation["example"];
}

export const DIALECT = "https://json-schema.org/draft/2020-12/schema";
export const PROBLEM_REF = "#/components/schemas/Problem";

/** Words for the permissions whose refusals never name them (the endpoints give their own action). */
const EXTRA_PHRASES: Partial<Record<PermissionKey, string>> = { "export:receive": "receive schedule workbooks" };
const phraseOf = (p: PermissionKey) => PERMISSION_PHRASES[p] ?? EXTRA_PHRASES[p] ?? p;

const rolesWith = (p: PermissionKey) => ROLE_NAMES.filter((r) => roleCan(r, permissionFor(p))).map((r) => ROLE_LABELS[r].toLowerCase() + "s");
const list = (xs: string[]) => (xs.length <= 1 ? xs.join("") : `${xs.slice(0, -1).join(", ")} and ${xs.at(-1)}`);

/** Who may call a route, in words, from its auth rule and the role table. */
export function accessText(auth: RouteAuth): string {
  if (auth === "anonymous") return "Anyone, signed in or not.";
  if (auth === "user") return "Any signed-in user, or any organisation API key.";
  if (auth === "better-auth") return "Answered by the sign-in service.";
  const permission = auth.permission;
  const allowed = permission ? `${list(rolesWith(permission))} (${phraseOf(permission)})` : null;
  if ("project" in auth || "option" in auth || "delivery" in auth) {
    const what = "project" in auth ? "the project" : "option" in auth ? "the option's project" : "the delivery's project";
    const sees = `Members who see ${what} (owners, consultants and architects of its organisation; clients when it is shared with them)`;
    return allowed ? `${sees} whose role allows it: ${allowed}. Others who see it get 403; anyone else 404.` : `${sees}; anyone else gets 404.`;
  }
  const whose = "org" in auth ? "the organisation" : "makeup" in auth ? "the make-up's organisation" : "the pane's organisation";
  return `Members of ${whose} whose role allows it: ${allowed}. Other members get 403; anyone else 404.`;
}

/** The error statuses a route can answer, each with when. */
export function errorStatuses(route: RouteEntry, op: Operation): Record<number, string> {
  const out: Record<number, string> = {};
  const auth = route.auth;
  if (op.body?.kind === "json" || op.query)
    out[400] = op.body ? "The body (or the query) is invalid; `errors` names each field" : "The query is invalid; `errors` names each field";
  if (op.body?.kind === "multipart") out[400] = "The file is invalid";
  const scope = keyScope(route);
  out[401] =
    auth === "anonymous"
      ? "An API key was sent and it is unknown or revoked (the route itself needs none)"
      : "Not signed in, or the API key is unknown or revoked (or its maker is no longer an owner there)";
  const refusals: string[] = [];
  if (typeof auth === "object" && auth.permission) refusals.push("the caller's role does not allow this");
  if (scope === "session-only") refusals.push("an API key was sent: this route needs a signed-in session");
  else if (scope !== "read") refusals.push(`an API key whose scope is narrower than ${scope}`);
  if (refusals.length) out[403] = refusals.join("; or ").replace(/^./, (c) => c.toUpperCase());
  if (typeof auth === "object") out[404] = "Not found, or not visible to the caller";
  else if (op.params) out[404] = "Not found";
  if (op.body) {
    out[413] =
      op.body.kind === "multipart" ? `The file is larger than ${MAX_UPLOAD_BYTES / 1024 / 1024} MB` : "The body is larger than the route's limit";
    out[415] = op.body.kind === "multipart" ? `The body is not multipart/form-data with a field "${UPLOAD_FIELD}"` : "The body is not JSON";
  }
  const limits = [
    ...(op.rateLimited ? [op.rateLimited] : []),
    ...(auth !== "anonymous" && scope !== "session-only" ? ["an API key's requests per minute"] : []),
  ];
  if (limits.length) out[429] = `Too many requests (${limits.join("; or ")}); \`Retry-After\` says when to try again`;
  for (const [s, why] of Object.entries(op.errors ?? {})) out[Number(s)] = out[Number(s)] ? `${out[Number(s)]}; or: ${why}` : why!;
  out[503] = "The database or the calculation workers are unavailable for a moment; nothing was changed. `Retry-After` says when to try again";
  return out;
}

/** JSON Schema of a zod schema, without its own `$schema` (the document's dialect applies). */
export function jsonSchemaOf(schema: z.ZodType, io: "input" | "output"): JsonSchema {
  const { $schema: _dialect, ...rest } = z.toJSONSchema(schema, {
    io,
    target: "draft-2020-12",
    unrepresentable: "any",
    // Checks made in code: the shape they accept, with the schema's own limits (e.g. minItems) kept.
    override: ({ zodSchema, jsonSchema }) => {
      const shape = documentedAs.get(zodSchema as unknown as z.ZodType);
      if (shape) Object.assign(jsonSchema, { ...jsonSchemaOf(shape, io), ...pick(jsonSchema, ["minItems", "maxItems"]) });
    },
  }) as JsonSchema;
  void _dialect;
  return rest;
}

const pick = (o: JsonSchema, keys: string[]) => Object.fromEntries(keys.filter((k) => k in o).map((k) => [k, o[k]]));

const ref = (name: string) => ({ $ref: `#/components/schemas/${name}` });

function parameters(op: Operation, schemas: Record<string, JsonSchema>): unknown[] {
  const out: unknown[] = pathParams(op.path).map((name) => ({
    name,
    in: "path",
    required: true,
    description: op.params?.[name] ?? name,
    schema: name === "rev" ? { type: "string", pattern: "^[A-Z]{1,4}$" } : { type: "string", pattern: "^[A-Za-z0-9_-]{1,64}$" },
    example: op.example.params?.[name],
  }));
  if (op.query) {
    const s = (schemas[op.query.name] ??= jsonSchemaOf(op.query.schema, "input")) as { properties?: Record<string, JsonSchema>; required?: string[] };
    for (const [name, schema] of Object.entries(s.properties ?? {})) {
      out.push({
        name,
        in: "query",
        required: (s.required ?? []).includes(name) && !("default" in schema),
        description: queryWords[name] ?? (schema.description as string | undefined) ?? name,
        schema,
        ...(op.example.query?.[name] !== undefined ? { example: op.example.query[name] } : {}),
      });
    }
  }
  return out;
}

const queryWords: Record<string, string> = {
  limit: `Rows per page, 1 to ${MAX_PAGE_LIMIT} (default ${DEFAULT_PAGE_LIMIT})`,
  cursor: "The `nextCursor` of the previous page",
  year: "The results year (default the current year)",
  revision: "An issued revision's letter; left out: the current draft",
  organizationId: "Only this organisation's projects",
  options: "Two to six option ids, comma-separated",
  table: "cover, schedule, hourly or angles",
  facadeId: "The façade (for the hourly and angles tables)",
};

function requestBody(op: Operation, schemas: Record<string, JsonSchema>): unknown {
  const b = op.body;
  if (!b) return undefined;
  if (b.kind === "json") {
    schemas[b.name] ??= jsonSchemaOf(b.schema, "input");
    return { required: true, description: b.description, content: { "application/json": { schema: ref(b.name), example: op.example.body } } };
  }
  const columns = b.columns.map((c) => (b.required.includes(c) ? `${c} (required)` : c)).join(", ");
  return {
    required: true,
    description: `A CSV file (UTF-8, comma-separated, header row first) in the field \`${UPLOAD_FIELD}\`, at most ${MAX_UPLOAD_BYTES / 1024 / 1024} MB and ${b.maxRows.toLocaleString("en")} rows. Columns: ${columns}. ${b.description}`,
    content: {
      "multipart/form-data": {
        schema: {
          type: "object",
          required: [UPLOAD_FIELD],
          properties: { [UPLOAD_FIELD]: { type: "string", contentMediaType: "text/csv", description: `Columns: ${columns}` } },
        },
        encoding: { [UPLOAD_FIELD]: { contentType: "text/csv" } },
        "x-paneray-columns": { all: b.columns, required: b.required },
      },
    },
  };
}

function success(op: Operation, schemas: Record<string, JsonSchema>): unknown {
  const r = op.response;
  if (r.kind === "empty") return { description: r.description };
  if (r.kind === "file")
    return {
      description: r.description,
      headers: Object.fromEntries(Object.entries(r.headers).map(([h, d]) => [h, { description: d, schema: { type: "string" } }])),
      content: { [r.contentType]: { schema: { type: "string", contentMediaType: r.contentType.split(";")[0] } } },
    };
  schemas[r.name] ??= jsonSchemaOf(r.schema, "output");
  return { description: r.description, content: { "application/json": { schema: ref(r.name), example: op.example.response } } };
}

/** The rows of the route table the document covers. */
export const documentedRoutes = () => ROUTES.filter((r) => r.path.startsWith("/api/v1/") && r.method !== "ALL");

/** The OpenAPI 3.1 document of every route under /api/v1 that has an operation in the registry. */
export function buildOpenApi(): Doc {
  const byKey = new Map(OPERATIONS.map((o) => [operationKey(o), o]));
  const schemas: Record<string, JsonSchema> = { Problem: jsonSchemaOf(ProblemSchema, "output") };
  const paths: Doc["paths"] = {};
  for (const route of documentedRoutes()) {
    const op = byKey.get(routeKey(route));
    if (!op) continue;
    const openPath = route.path.replace(/:(\w+)/g, "{$1}");
    const responses: Record<string, unknown> = { [String(route.ok)]: success(op, schemas) };
    for (const [status, why] of Object.entries(errorStatuses(route, op)))
      responses[status] = { description: why, content: { "application/problem+json": { schema: { $ref: PROBLEM_REF } } } };
    const params = parameters(op, schemas);
    const anonymous = route.auth === "anonymous";
    const scope = keyScope(route);
    (paths[openPath] ??= {})[route.method.toLowerCase()] = {
      operationId: operationId(route),
      summary: op.summary,
      description: op.description,
      tags: [op.tag],
      security: anonymous ? [] : scope === "session-only" ? [{ sessionCookie: [] }] : [{ sessionCookie: [] }, { bearerAuth: [] }],
      ...(params.length ? { parameters: params } : {}),
      ...(op.body ? { requestBody: requestBody(op, schemas) } : {}),
      responses,
      "x-paneray-access": accessText(route.auth),
      ...(anonymous ? {} : { "x-paneray-key-scope": scope }),
      "x-paneray-example": op.example,
    };
  }
  return {
    openapi: "3.1.0",
    jsonSchemaDialect: DIALECT,
    info: {
      title: "Paneray API",
      version: API_DOCUMENT_VERSION,
      summary: "Glazing options, façade schedules and solar calculations of Paneray.",
      description:
        "Every route under /api/v1. Errors are problem+json (RFC 9457). `/api/v1` changes only by addition; removals get a new prefix and a deprecation period. Changes of this document: docs/api-changelog.md. Paneray's values are estimates for comparing options, not certified or declared values; local codes and licensed professionals decide.",
    },
    servers: [{ url: "/", description: "This Paneray server" }],
    tags: TAGS.map((t) => ({ name: t.name, description: t.description })),
    paths,
    components: {
      schemas,
      securitySchemes: {
        sessionCookie: {
          type: "apiKey",
          in: "cookie",
          name: "better-auth.session_token",
          description:
            "The session cookie set by signing in (POST /api/auth/sign-in/email); browsers send it by themselves. Writes from a browser must come from Paneray's own origin.",
        },
        bearerAuth: {
          type: "http",
          scheme: "bearer",
          description:
            "An organisation API key in `Authorization: Bearer`; its scope read/calculate/read-write limits the routes (`x-paneray-key-scope` of each operation names the narrowest scope that may call it), and the same role and organisation checks apply as for the owner's session.",
        },
      },
    },
  };
}

const operationId = (r: RouteEntry) =>
  r.method.toLowerCase() +
  r.path
    .replace(/^\/api\/v1/, "")
    .split(/[/.]/)
    .filter(Boolean)
    .map((s) => (s.startsWith(":") ? `By${s[1]!.toUpperCase()}${s.slice(2)}` : s.replace(/(^|-)(\w)/g, (_, _d, c: string) => c.toUpperCase())))
    .join("");

let cached: Doc | undefined;
/** The document, built on first use. */
export const openApiDocument = () => (cached ??= buildOpenApi());
