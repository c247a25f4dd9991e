/**
 * Every API route of Paneray and who may call it: one row per (file under src/pages/api, exported method).
 *
 * The rule of each row is the `auth` the endpoint declares to `endpoint(…)` (src/lib/server/http.ts), written
 * here once more so that tests can derive the expected answer for every role from `lib/auth/roles.ts`:
 * tests/unit/route-table.test.ts fails for a route file or method without a row, and the browser test
 * tests/e2e/matrix.spec.ts calls every row as each role and as a member of another organisation.
 *
 * Pure (no I/O): readable by the server, the browser and the tests.
 */
import type { PermissionKey } from "./roles";

export type RouteMethod = "GET" | "POST" | "PUT" | "PATCH" | "DELETE" | "ALL";

/**
 * Who may call a route:
 * - "anonymous": anyone, signed in or not;
 * - "user": any signed-in user (anonymous callers get 401);
 * - project: the project named by a route parameter must be visible to the caller (owners, consultants and
 *   architects see every project of their organisation, clients only those shared with them; anyone else gets
 *   404), and the caller's role must hold `permission` when given (403 otherwise);
 * - org: the caller must be a member of the organisation named by a route parameter or a body field (404
 *   otherwise) and their role must hold `permission` (403 otherwise);
 * - option: the façade option named by a route parameter; the rule of its project applies (as `project`);
 * - delivery: the e-mail delivery named by a route parameter; the rule of its project applies (as `project`);
 * - makeup / pane: the saved library item named by a route parameter; the rule of its organisation applies
 *   (as `org`: not a member of the item's organisation → 404, role without `permission` → 403);
 * - "better-auth": the request goes to better-auth, which answers for itself (an allowlist of its paths).
 */
export type RouteAuth =
  | "anonymous"
  | "user"
  | { readonly project: string; readonly permission?: PermissionKey }
  | { readonly org: string; readonly from?: "params" | "body"; readonly permission: PermissionKey }
  | { readonly option: string; readonly permission?: PermissionKey }
  | { readonly delivery: string; readonly permission?: PermissionKey }
  | { readonly makeup: string; readonly permission: PermissionKey }
  | { readonly pane: string; readonly permission: PermissionKey }
  | "better-auth";

export interface RouteEntry {
  /** The file under src/pages/api that serves the route. */
  readonly file: string;
  /** The URL pattern, parameters as `:name`. */
  readonly path: string;
  readonly method: RouteMethod;
  readonly auth: RouteAuth;
  /** The status of a successful call. */
  readonly ok: 200 | 201 | 202 | 204;
  /** Whether the route changes stored data (the fuzz tests send hostile bodies to these). */
  readonly writes: boolean;
  /** Only a signed-in session may call the route, never an API key (see keyScope). */
  readonly sessionOnly?: true;
}

export const ROUTES: readonly RouteEntry[] = [
  { file: "health.ts", path: "/api/health", method: "GET", auth: "anonymous", ok: 200, writes: false },
  { file: "auth/[...all].ts", path: "/api/auth/:path*", method: "ALL", auth: "better-auth", ok: 200, writes: true, sessionOnly: true },
  { file: "v1/me.ts", path: "/api/v1/me", method: "GET", auth: "user", ok: 200, writes: false },
  { file: "v1/signup.ts", path: "/api/v1/signup", method: "POST", auth: "anonymous", ok: 201, writes: true, sessionOnly: true },
  { file: "v1/openapi.json.ts", path: "/api/v1/openapi.json", method: "GET", auth: "anonymous", ok: 200, writes: false },
  { file: "v1/calc/glazing.ts", path: "/api/v1/calc/glazing", method: "POST", auth: "user", ok: 200, writes: false },
  { file: "v1/calc/schedule.ts", path: "/api/v1/calc/schedule", method: "POST", auth: "user", ok: 200, writes: false },
  { file: "v1/invitations/[id]/index.ts", path: "/api/v1/invitations/:id", method: "GET", auth: "anonymous", ok: 200, writes: false },
  {
    file: "v1/invitations/[id]/accept.ts",
    path: "/api/v1/invitations/:id/accept",
    method: "POST",
    auth: "user",
    ok: 200,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/members/index.ts",
    path: "/api/v1/orgs/:orgId/members",
    method: "GET",
    auth: { org: "orgId", permission: "member:update" },
    ok: 200,
    writes: false,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/members/[memberId].ts",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    method: "PATCH",
    auth: { org: "orgId", permission: "member:update" },
    ok: 200,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/members/[memberId].ts",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    method: "DELETE",
    auth: { org: "orgId", permission: "member:delete" },
    ok: 200,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/invitations/index.ts",
    path: "/api/v1/orgs/:orgId/invitations",
    method: "GET",
    auth: { org: "orgId", permission: "member:update" },
    ok: 200,
    writes: false,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/invitations/index.ts",
    path: "/api/v1/orgs/:orgId/invitations",
    method: "POST",
    auth: { org: "orgId", permission: "invitation:create" },
    ok: 201,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/invitations/[invitationId].ts",
    path: "/api/v1/orgs/:orgId/invitations/:invitationId",
    method: "DELETE",
    auth: { org: "orgId", permission: "invitation:cancel" },
    ok: 200,
    writes: true,
    sessionOnly: true,
  },
  { file: "v1/projects/index.ts", path: "/api/v1/projects", method: "GET", auth: "user", ok: 200, writes: false },
  {
    file: "v1/projects/index.ts",
    path: "/api/v1/projects",
    method: "POST",
    auth: { org: "organizationId", from: "body", permission: "project:create" },
    ok: 201,
    writes: true,
  },
  { file: "v1/projects/[id]/index.ts", path: "/api/v1/projects/:id", method: "GET", auth: { project: "id" }, ok: 200, writes: false },
  {
    file: "v1/projects/[id]/index.ts",
    path: "/api/v1/projects/:id",
    method: "PATCH",
    auth: { project: "id", permission: "project:update" },
    ok: 200,
    writes: true,
  },
  {
    file: "v1/projects/[id]/index.ts",
    path: "/api/v1/projects/:id",
    method: "DELETE",
    auth: { project: "id", permission: "project:delete" },
    ok: 204,
    writes: true,
  },
  {
    file: "v1/projects/[id]/shares/index.ts",
    path: "/api/v1/projects/:id/shares",
    method: "GET",
    auth: { project: "id", permission: "project:share" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/shares/index.ts",
    path: "/api/v1/projects/:id/shares",
    method: "POST",
    auth: { project: "id", permission: "project:share" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/projects/[id]/shares/[memberId].ts",
    path: "/api/v1/projects/:id/shares/:memberId",
    method: "DELETE",
    auth: { project: "id", permission: "project:share" },
    ok: 200,
    writes: true,
  },
  // Results, comparison and issued revisions.
  {
    file: "v1/projects/[id]/results.ts",
    path: "/api/v1/projects/:id/results",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/compare.ts",
    path: "/api/v1/projects/:id/compare",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/revisions/index.ts",
    path: "/api/v1/projects/:id/revisions",
    method: "GET",
    auth: { project: "id" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/revisions/index.ts",
    path: "/api/v1/projects/:id/revisions",
    method: "POST",
    auth: { project: "id", permission: "revision:issue" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/projects/[id]/revisions/[rev].ts",
    path: "/api/v1/projects/:id/revisions/:rev",
    method: "GET",
    auth: { project: "id" },
    ok: 200,
    writes: false,
  },
  // The schedule workbook of an issued revision (every role that sees the project) or of the draft (the
  // handler refuses roles without export:create when no revision is named), and each of its tables as CSV.
  {
    file: "v1/projects/[id]/workbook.ts",
    path: "/api/v1/projects/:id/workbook",
    method: "GET",
    auth: { project: "id", permission: "export:receive" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/workbook.csv.ts",
    path: "/api/v1/projects/:id/workbook.csv",
    method: "GET",
    auth: { project: "id", permission: "export:receive" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/orgs/[orgId]/makeups/index.ts",
    path: "/api/v1/orgs/:orgId/makeups",
    method: "GET",
    auth: { org: "orgId", permission: "glazing:read" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/orgs/[orgId]/makeups/index.ts",
    path: "/api/v1/orgs/:orgId/makeups",
    method: "POST",
    auth: { org: "orgId", permission: "glazing:create" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/makeups/[id].ts",
    path: "/api/v1/makeups/:id",
    method: "GET",
    auth: { makeup: "id", permission: "glazing:read" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/makeups/[id].ts",
    path: "/api/v1/makeups/:id",
    method: "PATCH",
    auth: { makeup: "id", permission: "glazing:update" },
    ok: 200,
    writes: true,
  },
  {
    file: "v1/makeups/[id].ts",
    path: "/api/v1/makeups/:id",
    method: "DELETE",
    auth: { makeup: "id", permission: "glazing:delete" },
    ok: 204,
    writes: true,
  },
  {
    file: "v1/orgs/[orgId]/panes/index.ts",
    path: "/api/v1/orgs/:orgId/panes",
    method: "GET",
    auth: { org: "orgId", permission: "glazing:read" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/orgs/[orgId]/panes/index.ts",
    path: "/api/v1/orgs/:orgId/panes",
    method: "POST",
    auth: { org: "orgId", permission: "glazing:create" },
    ok: 201,
    writes: true,
  },
  // Uploads (multipart/form-data, field `file`): measured panes into the library, a project's weather series.
  {
    file: "v1/orgs/[orgId]/panes/import.ts",
    path: "/api/v1/orgs/:orgId/panes/import",
    method: "POST",
    auth: { org: "orgId", permission: "glazing:create" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/projects/[id]/weather/index.ts",
    path: "/api/v1/projects/:id/weather",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/weather/index.ts",
    path: "/api/v1/projects/:id/weather",
    method: "POST",
    auth: { project: "id", permission: "project:update" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/projects/[id]/weather/index.ts",
    path: "/api/v1/projects/:id/weather",
    method: "DELETE",
    auth: { project: "id", permission: "project:update" },
    ok: 204,
    writes: true,
  },
  {
    file: "v1/projects/[id]/weather/file.ts",
    path: "/api/v1/projects/:id/weather/file",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  { file: "v1/panes/[id].ts", path: "/api/v1/panes/:id", method: "GET", auth: { pane: "id", permission: "glazing:read" }, ok: 200, writes: false },
  { file: "v1/panes/[id].ts", path: "/api/v1/panes/:id", method: "PATCH", auth: { pane: "id", permission: "glazing:update" }, ok: 200, writes: true },
  {
    file: "v1/panes/[id].ts",
    path: "/api/v1/panes/:id",
    method: "DELETE",
    auth: { pane: "id", permission: "glazing:delete" },
    ok: 204,
    writes: true,
  },
  {
    file: "v1/projects/[id]/options/index.ts",
    path: "/api/v1/projects/:id/options",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/options/index.ts",
    path: "/api/v1/projects/:id/options",
    method: "POST",
    auth: { project: "id", permission: "option:assign" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/options/[id]/index.ts",
    path: "/api/v1/options/:id",
    method: "PATCH",
    auth: { option: "id", permission: "option:assign" },
    ok: 200,
    writes: true,
  },
  {
    file: "v1/options/[id]/index.ts",
    path: "/api/v1/options/:id",
    method: "DELETE",
    auth: { option: "id", permission: "option:assign" },
    ok: 204,
    writes: true,
  },
  {
    file: "v1/projects/[id]/requirements.ts",
    path: "/api/v1/projects/:id/requirements",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/requirements.ts",
    path: "/api/v1/projects/:id/requirements",
    method: "PUT",
    auth: { project: "id", permission: "option:assign" },
    ok: 200,
    writes: true,
  },
  {
    file: "v1/options/[id]/comments.ts",
    path: "/api/v1/options/:id/comments",
    method: "GET",
    auth: { option: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/options/[id]/comments.ts",
    path: "/api/v1/options/:id/comments",
    method: "POST",
    auth: { option: "id", permission: "comment:create" },
    ok: 201,
    writes: true,
  },
  {
    file: "v1/options/[id]/decision.ts",
    path: "/api/v1/options/:id/decision",
    method: "POST",
    auth: { option: "id", permission: "option:review" },
    ok: 200,
    writes: true,
  },
  {
    file: "v1/projects/[id]/history.ts",
    path: "/api/v1/projects/:id/history",
    method: "GET",
    auth: { project: "id", permission: "project:readAll" },
    ok: 200,
    writes: false,
  },
  // E-mail deliveries of issued workbooks (the outbox).
  {
    file: "v1/projects/[id]/deliveries.ts",
    path: "/api/v1/projects/:id/deliveries",
    method: "GET",
    auth: { project: "id", permission: "export:create" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/projects/[id]/deliveries.ts",
    path: "/api/v1/projects/:id/deliveries",
    method: "POST",
    auth: { project: "id", permission: "export:create" },
    ok: 202,
    writes: true,
  },
  {
    file: "v1/deliveries/[id]/index.ts",
    path: "/api/v1/deliveries/:id",
    method: "GET",
    auth: { delivery: "id", permission: "export:create" },
    ok: 200,
    writes: false,
  },
  {
    file: "v1/deliveries/[id]/attachment.ts",
    path: "/api/v1/deliveries/:id/attachment",
    method: "GET",
    auth: { delivery: "id", permission: "export:create" },
    ok: 200,
    writes: false,
  },
  // The organisation's API keys (owners; a signed-in session only) and its history.
  {
    file: "v1/orgs/[orgId]/api-keys/index.ts",
    path: "/api/v1/orgs/:orgId/api-keys",
    method: "GET",
    auth: { org: "orgId", permission: "apiKey:manage" },
    ok: 200,
    writes: false,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/api-keys/index.ts",
    path: "/api/v1/orgs/:orgId/api-keys",
    method: "POST",
    auth: { org: "orgId", permission: "apiKey:manage" },
    ok: 201,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/api-keys/[id].ts",
    path: "/api/v1/orgs/:orgId/api-keys/:id",
    method: "DELETE",
    auth: { org: "orgId", permission: "apiKey:manage" },
    ok: 200,
    writes: true,
    sessionOnly: true,
  },
  {
    file: "v1/orgs/[orgId]/history.ts",
    path: "/api/v1/orgs/:orgId/history",
    method: "GET",
    auth: { org: "orgId", permission: "organization:update" },
    ok: 200,
    writes: false,
  },
];

/** "METHOD /path" of a row, for messages and test titles. */
export const routeKey = (r: Pick<RouteEntry, "method" | "path">) => `${r.method} ${r.path}`;

/** What an API key may be allowed to do, narrowest first; each scope includes the ones before it. */
export const KEY_SCOPES = ["read", "calculate", "read-write"] as const;
export type KeyScope = (typeof KEY_SCOPES)[number];

/** The calculation routes: a "calculate" key may call these besides every GET route. */
export const CALCULATION_PATHS: readonly string[] = ["/api/v1/calc/glazing", "/api/v1/calc/schedule"];

/**
 * The narrowest API-key scope that may call a route, or "session-only" when no key may (key management,
 * members and invitations, sign-up, invitation acceptance and everything of better-auth):
 * GET routes need "read", the calculation routes "calculate", every other route "read-write". A key also
 * acts only within its organisation and with its member's role: the route's `auth` rule still applies.
 */
export function keyScope(route: Pick<RouteEntry, "method" | "path" | "sessionOnly" | "auth">): KeyScope | "session-only" {
  if (route.sessionOnly || route.auth === "better-auth") return "session-only";
  if (route.method === "GET") return "read";
  if (CALCULATION_PATHS.includes(route.path)) return "calculate";
  return "read-write";
}

/** Whether a key of scope `held` may call a route that needs `needed`. */
export function scopeAllows(held: KeyScope, needed: KeyScope | "session-only"): boolean {
  return needed !== "session-only" && KEY_SCOPES.indexOf(held) >= KEY_SCOPES.indexOf(needed);
}

/**
 * The row that serves `method` on an Astro route pattern such as "/api/v1/projects/[id]/workbook.csv".
 * Astro reports patterns in lower case ("/api/v1/orgs/[orgid]/members"), so paths are compared without case.
 */
export function routeOfPattern(method: string, pattern: string): RouteEntry | undefined {
  const path = pattern
    .replace(/\[\.\.\.(\w+)\]/g, ":path*")
    .replace(/\[(\w+)\]/g, ":$1")
    .replace(/\/$/, "")
    .toLowerCase();
  const m = method.toUpperCase();
  return ROUTES.find((r) => r.path.toLowerCase() === path && (r.method === m || r.method === "ALL"));
}
