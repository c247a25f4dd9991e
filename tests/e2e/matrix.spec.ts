// The authorization matrix: every row of the route table (src/lib/auth/route-table.ts) called by an anonymous
// visitor, each demo role and a member of another organisation, against the status the table's rule and the
// role table (src/lib/auth/roles.ts) give. Bodies are valid, so the answers are about access, not validation.
// Writes that succeed go to throwaway rows (fresh projects, members and invitations), which are removed after.
// Every row is also called with a read, a calculate and a read-write API key of the demo organisation (made by
// its owner), against what the route table's key scope rule (keyScope) and the owner's rights give.
import { expect, test } from "@playwright/test";
import { permissionFor, roleCan } from "@/lib/auth/roles";
import { KEY_SCOPES, keyScope, ROUTES, routeKey, scopeAllows, type KeyScope, type RouteEntry } from "@/lib/auth/route-table";
import { ACTORS, ANONYMOUS, addMember, call, createOutsider, signInAs, signInDemo, type Actor, type Caller, type Outsider } from "./api-actors";
import { AUTH_ROUTES } from "@/lib/server/auth-routes";
import pg from "pg";
import { uniqueEmail } from "./helpers";
import { clearPane, closeWorkspaceRows, deleteMakeupRows, doubleUnit, insertMakeupRow, insertOptionRow, tintedPane } from "./workspace-rows";
import { insertOption, removeMakeups } from "./review-fixtures";

// A request that reaches each better-auth path the app serves (AUTH_ROUTES, relative to /api/auth), and the
// answer every caller gets.
const AUTH_PROBES: Record<string, { url: string; body?: unknown; status: number }> = {
  "POST /sign-in/email": { url: "/sign-in/email", body: { email: "nobody@e2e.example", password: "not-a-password" }, status: 401 },
  "POST /sign-out": { url: "/sign-out", body: {}, status: 200 },
  "GET /get-session": { url: "/get-session", status: 200 },
  "POST /request-password-reset": {
    url: "/request-password-reset",
    body: { email: "nobody@e2e.example", redirectTo: "/reset-password" },
    status: 200,
  },
  "POST /reset-password": { url: "/reset-password", body: { token: "not-a-token", newPassword: "another-pass-2026" }, status: 400 },
  "GET /reset-password/:token": { url: "/reset-password/not-a-token?callbackURL=/reset-password", status: 302 },
  "GET /verify-email": { url: "/verify-email?token=not-a-token", status: 401 },
};

/** Fixtures shared by the cases, made once per worker. */
interface World {
  callers: Record<Actor, Caller>;
  /** API keys of the demo organisation, one per scope, made by the demo owner; their ids to revoke after. */
  keys: Record<KeyScope, Caller>;
  keyIds: string[];
  outsider: Outsider;
  orgId: string;
  clientMemberId: string;
  /** Ids of throwaway rows to remove afterwards. */
  projects: string[];
  members: string[];
  invitations: string[];
  /** Panes imported by the matrix's successful calls. */
  panes: string[];
  outsiderInvitationId: string;
  /** Fixture make-ups of the option routes, and the database connection that writes them. */
  makeups: string[];
  db: pg.Client;
}
let w: World;

type Target = "shared" | "unshared";
interface Prepared {
  path: string;
  body?: unknown;
}
interface Case {
  method: RouteEntry["method"];
  path: string;
  /** For project routes: whether the project is shared with the demo client. */
  target?: Target;
  prepare: (actor: Actor) => Promise<Prepared>;
  /** Overrides the rule's answer for signed-in callers where the resource itself decides (and says why). */
  signedIn?: { status: number; why: string };
  /** Adjusts the rule's answer where the handler asks for more (e.g. a permission for one form of the query). */
  want?: (actor: Actor, ruleStatus: number) => number;
  after?: (actor: Actor, status: number, body: unknown) => void;
  /** Names a second case of the same route (another form of its query), so that test titles stay unique. */
  variant?: string;
  /** Waits for background work per call (a delivery's workbook): the test gets three times the usual time. */
  slow?: true;
}

/** The status the route table's rule and the role table give `actor`. */
function expectedStatus(route: RouteEntry, actor: Actor, target?: Target): number {
  const rule = route.auth;
  if (rule === "anonymous" || rule === "better-auth") return route.ok;
  if (actor === "anonymous") return 401;
  if (rule === "user") return route.ok;
  if (actor === "outsider") return 404;
  if ("project" in rule || "option" in rule || "delivery" in rule) {
    const visible = roleCan(actor, { project: ["readAll"] }) || (target === "shared" && roleCan(actor, { project: ["readShared"] }));
    if (!visible) return 404;
  }
  if (rule.permission && !roleCan(actor, permissionFor(rule.permission))) return 403;
  return route.ok;
}

/**
 * The status for a call with an API key of `scope`: 403 when the route needs a session or a wider scope,
 * otherwise what its maker (the demo owner) gets, since a key acts as the member who made it.
 */
function expectedKeyStatus(route: RouteEntry, scope: KeyScope, target?: Target): number {
  const needed = keyScope(route);
  if (!scopeAllows(scope, needed)) return 403;
  return expectedStatus(route, "owner", target);
}

const consultant = () => w.callers.consultant;
const owner = () => w.callers.owner;

/** A fresh project in the demo organisation, made by the consultant, shared with the demo client or not. */
async function throwawayProject(target: Target): Promise<string> {
  const res = await call(consultant(), "POST", "/api/v1/projects", {
    organizationId: w.orgId,
    name: `Matrix throwaway (${target})`,
    siteName: "Test site",
    latitudeDeg: 50,
    longitudeDeg: 5,
    timeZone: "UTC",
  });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  const id = (res.body as { project: { id: string } }).project.id;
  w.projects.push(id);
  if (target === "shared")
    expect((await call(consultant(), "POST", `/api/v1/projects/${id}/shares`, { memberId: w.clientMemberId })).status).toBe(201);
  return id;
}

async function throwawayInvitation(): Promise<string> {
  const res = await call(owner(), "POST", `/api/v1/orgs/${w.orgId}/invitations`, { email: uniqueEmail("matrix-invite"), role: "architect" });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  const id = (res.body as { invitation: { id: string } }).invitation.id;
  w.invitations.push(id);
  return id;
}

const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const air16 = { kind: "gap", widthMm: 16, gas: "air" };
const fixed = (path: string, body?: unknown) => async (): Promise<Prepared> => ({ path, body });

/** A fresh option on a throwaway project (its make-up and option written to the database directly). */
async function throwawayOption(target: Target): Promise<string> {
  const projectId = await throwawayProject(target);
  const o = await insertOption(w.db, projectId, `Matrix option (${target})`);
  w.makeups.push(o.makeupId);
  return o.optionId;
}

const reviewCases = (target: Target): Case[] => [
  {
    method: "GET",
    path: "/api/v1/options/:id/comments",
    target,
    prepare: async () => ({ path: `/api/v1/options/${await throwawayOption(target)}/comments` }),
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/comments",
    target,
    prepare: async () => ({ path: `/api/v1/options/${await throwawayOption(target)}/comments`, body: { body: "Checked by the access matrix" } }),
  },
  {
    method: "POST",
    path: "/api/v1/options/:id/decision",
    target,
    prepare: async () => ({ path: `/api/v1/options/${await throwawayOption(target)}/decision`, body: { decision: "approved", note: "Matrix" } }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/history",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}/history` }),
  },
];

const projectCases = (target: Target): Case[] => [
  { method: "GET", path: "/api/v1/projects/:id", target, prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}` }) },
  {
    method: "PATCH",
    path: "/api/v1/projects/:id",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}`, body: { description: "Checked by the access matrix" } }),
  },
  { method: "DELETE", path: "/api/v1/projects/:id", target, prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}` }) },
  {
    method: "GET",
    path: "/api/v1/projects/:id/shares",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}/shares` }),
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/shares",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}/shares`, body: { memberId: w.clientMemberId } }),
  },
  {
    method: "DELETE",
    path: "/api/v1/projects/:id/shares/:memberId",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}/shares/${w.clientMemberId}` }),
  },
];

/**
 * A fresh project with one façade and two options of saved make-ups (one approved), shared with the demo
 * client or not; `issued` also issues revision A as the consultant.
 */
async function workspaceProject(target: Target, issued = false): Promise<{ id: string; options: string[]; facadeId: string; makeupId: string }> {
  const res = await call(consultant(), "POST", "/api/v1/projects", {
    organizationId: w.orgId,
    name: `Matrix workspace (${target})`,
    siteName: "Test site",
    latitudeDeg: 50,
    longitudeDeg: 5,
    timeZone: "UTC",
    facades: [{ name: "South", azimuthDeg: 180 }],
  });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  const p = (res.body as { project: { id: string }; facades?: { id: string }[] }).project;
  w.projects.push(p.id);
  const got = (await call(consultant(), "GET", `/api/v1/projects/${p.id}`)).body as { facades: { id: string }[] };
  const facadeId = got.facades[0]!.id;
  if (target === "shared")
    expect((await call(consultant(), "POST", `/api/v1/projects/${p.id}/shares`, { memberId: w.clientMemberId })).status).toBe(201);
  const a = await insertMakeupRow(w.orgId, "Matrix clear double", doubleUnit(clearPane(6), clearPane(4)));
  const b = await insertMakeupRow(w.orgId, "Matrix tinted double", doubleUnit(tintedPane(6), clearPane(4)));
  w.makeups.push(a.id, b.id);
  const options = [await insertOptionRow(p.id, facadeId, a, "Clear", "approved"), await insertOptionRow(p.id, facadeId, b, "Tinted")];
  if (issued) expect((await call(consultant(), "POST", `/api/v1/projects/${p.id}/revisions`, { note: "Matrix" })).status).toBe(201);
  return { id: p.id, options, facadeId, makeupId: a.id };
}

/** A saved make-up of the demo organisation that no option uses. */
async function throwawayMakeup(): Promise<string> {
  const m = await insertMakeupRow(w.orgId, "Matrix library make-up", doubleUnit(clearPane(6), clearPane(4)));
  w.makeups.push(m.id);
  return m.id;
}

/** A saved pane of the demo organisation, made through the API by the consultant. */
async function throwawayPane(): Promise<string> {
  const res = await call(consultant(), "POST", `/api/v1/orgs/${w.orgId}/panes`, { name: "Matrix pane", layer: pane6 });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  return (res.body as { id: string }).id;
}

const libraryCases = (): Case[] => [
  { method: "GET", path: "/api/v1/orgs/:orgId/makeups", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/makeups` }) },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/makeups",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/makeups`, body: { name: "Matrix saved double", layers: [pane6, air16, pane6] } }),
    after: (_a, status, body) => {
      if (status === 201) w.makeups.push((body as { id: string }).id);
    },
  },
  { method: "GET", path: "/api/v1/makeups/:id", prepare: async () => ({ path: `/api/v1/makeups/${await throwawayMakeup()}` }) },
  {
    method: "PATCH",
    path: "/api/v1/makeups/:id",
    prepare: async () => ({ path: `/api/v1/makeups/${await throwawayMakeup()}`, body: { revision: 1, name: "Matrix renamed" } }),
  },
  { method: "DELETE", path: "/api/v1/makeups/:id", prepare: async () => ({ path: `/api/v1/makeups/${await throwawayMakeup()}` }) },
  { method: "GET", path: "/api/v1/orgs/:orgId/panes", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/panes` }) },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/panes`, body: { name: "Matrix saved pane", layer: pane6 } }),
  },
  { method: "GET", path: "/api/v1/panes/:id", prepare: async () => ({ path: `/api/v1/panes/${await throwawayPane()}` }) },
  {
    method: "PATCH",
    path: "/api/v1/panes/:id",
    prepare: async () => ({ path: `/api/v1/panes/${await throwawayPane()}`, body: { revision: 1, note: "Matrix" } }),
  },
  { method: "DELETE", path: "/api/v1/panes/:id", prepare: async () => ({ path: `/api/v1/panes/${await throwawayPane()}` }) },
];

const optionCases = (target: Target): Case[] => [
  {
    method: "GET",
    path: "/api/v1/projects/:id/options",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target)).id}/options` }),
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/options",
    target,
    prepare: async () => {
      const p = await workspaceProject(target);
      return { path: `/api/v1/projects/${p.id}/options`, body: { facadeId: p.facadeId, makeupId: p.makeupId, name: "Matrix option" } };
    },
  },
  {
    method: "PATCH",
    path: "/api/v1/options/:id",
    target,
    prepare: async () => ({ path: `/api/v1/options/${(await workspaceProject(target)).options[1]}`, body: { version: 1, name: "Matrix renamed" } }),
  },
  {
    method: "DELETE",
    path: "/api/v1/options/:id",
    target,
    prepare: async () => ({ path: `/api/v1/options/${(await workspaceProject(target)).options[1]}` }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/requirements",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target)).id}/requirements` }),
  },
  {
    method: "PUT",
    path: "/api/v1/projects/:id/requirements",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target)).id}/requirements`, body: { project: { maxGValue: 0.5 } } }),
  },
];

const workspaceCases = (target: Target): Case[] => [
  {
    method: "GET",
    path: "/api/v1/projects/:id/results",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target)).id}/results?year=2026` }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/compare",
    target,
    prepare: async () => {
      const p = await workspaceProject(target);
      return { path: `/api/v1/projects/${p.id}/compare?options=${p.options.join(",")}&year=2026` };
    },
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/revisions",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/revisions` }),
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/revisions",
    target,
    prepare: async () => ({
      path: `/api/v1/projects/${(await workspaceProject(target)).id}/revisions`,
      body: { note: "Issued by the access matrix" },
    }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/revisions/:rev",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/revisions/A` }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/workbook",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/workbook?revision=A` }),
  },
  {
    // The draft (no revision named) needs export:create besides the row's rule: architects and clients get 403.
    method: "GET",
    path: "/api/v1/projects/:id/workbook",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target)).id}/workbook?year=2026` }),
    variant: "draft",
    want: (actor, ruled) => (ruled === 200 && !roleCan(actor, permissionFor("export:create")) ? 403 : ruled),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/workbook.csv",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/workbook.csv?revision=A&table=schedule` }),
  },
];

/** A delivery of revision A of a fresh issued project, queued by the consultant; `built` waits for its workbook. */
async function throwawayDelivery(target: Target, built = false): Promise<string> {
  const p = await workspaceProject(target, true);
  const res = await call(consultant(), "POST", `/api/v1/projects/${p.id}/deliveries`, { revision: "A", to: ["matrix.delivery@e2e.example"] });
  expect(res.status, res.text.slice(0, 200)).toBe(202);
  const id = (res.body as { id: string }).id;
  for (let i = 0; built && i < 100; i++) {
    const d = (await call(consultant(), "GET", `/api/v1/deliveries/${id}`)).body as { delivery: { attachment: unknown } };
    if (d.delivery.attachment) break;
    await new Promise((r) => setTimeout(r, 200));
  }
  return id;
}

const deliveryCases = (target: Target): Case[] => [
  {
    method: "GET",
    path: "/api/v1/projects/:id/deliveries",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/deliveries` }),
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/deliveries",
    target,
    prepare: async () => ({
      path: `/api/v1/projects/${(await workspaceProject(target, true)).id}/deliveries`,
      body: { revision: "A", to: ["matrix.delivery@e2e.example"], message: "Sent by the access matrix" },
    }),
  },
  { method: "GET", path: "/api/v1/deliveries/:id", target, prepare: async () => ({ path: `/api/v1/deliveries/${await throwawayDelivery(target)}` }) },
  {
    method: "GET",
    path: "/api/v1/deliveries/:id/attachment",
    target,
    slow: true,
    prepare: async () => ({ path: `/api/v1/deliveries/${await throwawayDelivery(target, true)}/attachment` }),
  },
];

/** A multipart body with a CSV file in the field `file`, as the upload forms send it. */
const csvForm = (text: string, fileName = "matrix.csv") => {
  const form = new FormData();
  form.set("file", new Blob([text], { type: "text/csv" }), fileName);
  return form;
};
const matrixPanes = () => csvForm(`name,thickness_mm,solar_t,solar_rf,solar_rb\nMatrix imported pane,6,0.8,0.07,0.07\n`);
/** Three invented hours of weather for a project in UTC. */
const matrixWeather = () =>
  csvForm(
    "time,ghi_wm2,dni_wm2,dhi_wm2,air_temperature_c\n2026-06-21T10:00Z,700,650,150,21\n2026-06-21T11:00Z,760,690,160,22\n2026-06-21T12:00Z,780,700,165,\n",
  );

/** A throwaway project with a weather file, uploaded by the consultant. */
async function projectWithWeather(target: Target): Promise<string> {
  const id = await throwawayProject(target);
  const res = await call(consultant(), "POST", `/api/v1/projects/${id}/weather`, matrixWeather());
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  return id;
}

const uploadCases = (target: Target): Case[] => [
  {
    method: "GET",
    path: "/api/v1/projects/:id/weather",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await projectWithWeather(target)}/weather` }),
  },
  {
    method: "POST",
    path: "/api/v1/projects/:id/weather",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await throwawayProject(target)}/weather`, body: matrixWeather() }),
  },
  {
    method: "DELETE",
    path: "/api/v1/projects/:id/weather",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await projectWithWeather(target)}/weather` }),
  },
  {
    method: "GET",
    path: "/api/v1/projects/:id/weather/file",
    target,
    prepare: async () => ({ path: `/api/v1/projects/${await projectWithWeather(target)}/weather/file` }),
  },
];

const CASES: Case[] = [
  { method: "GET", path: "/api/health", prepare: fixed("/api/health") },
  { method: "GET", path: "/api/v1/me", prepare: fixed("/api/v1/me") },
  { method: "GET", path: "/api/v1/openapi.json", prepare: fixed("/api/v1/openapi.json") },
  {
    method: "POST",
    path: "/api/v1/signup",
    prepare: async () => ({
      path: "/api/v1/signup",
      body: { name: "Matrix Signup", email: uniqueEmail("matrix-signup"), password: "matrix-pass-2026", organizationName: "Matrix Signup Ltd" },
    }),
  },
  { method: "POST", path: "/api/v1/calc/glazing", prepare: fixed("/api/v1/calc/glazing", { layers: [pane6, air16, pane6] }) },
  {
    method: "POST",
    path: "/api/v1/calc/schedule",
    prepare: fixed("/api/v1/calc/schedule", {
      site: { latitudeDeg: 38.7, longitudeDeg: -9.17, timeZone: "Europe/Lisbon" },
      from: "2026-06-21",
      to: "2026-06-21",
      surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: [pane6, air16, pane6] }],
    }),
  },
  { method: "GET", path: "/api/v1/invitations/:id", prepare: async () => ({ path: `/api/v1/invitations/${w.outsiderInvitationId}` }) },
  {
    method: "POST",
    path: "/api/v1/invitations/:id/accept",
    prepare: async () => ({ path: `/api/v1/invitations/${w.outsiderInvitationId}/accept` }),
    signedIn: { status: 403, why: "the invitation is addressed to another e-mail address" },
  },
  { method: "GET", path: "/api/v1/orgs/:orgId/members", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/members` }) },
  {
    method: "PATCH",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    // The client keeps the role they have, so a successful call changes nothing other tests see.
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/members/${w.clientMemberId}`, body: { role: "client" } }),
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/members/:memberId",
    prepare: async () => {
      const { memberId } = await addMember(owner(), w.orgId, "architect");
      w.members.push(memberId);
      return { path: `/api/v1/orgs/${w.orgId}/members/${memberId}` };
    },
  },
  { method: "GET", path: "/api/v1/orgs/:orgId/invitations", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/invitations` }) },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/invitations",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/invitations`, body: { email: uniqueEmail("matrix-invite"), role: "architect" } }),
    after: (_a, status, body) => {
      if (status === 201) w.invitations.push((body as { invitation: { id: string } }).invitation.id);
    },
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/invitations/:invitationId",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/invitations/${await throwawayInvitation()}` }),
  },
  { method: "GET", path: "/api/v1/projects", prepare: fixed("/api/v1/projects") },
  {
    method: "POST",
    path: "/api/v1/projects",
    prepare: async () => ({
      path: "/api/v1/projects",
      body: { organizationId: w.orgId, name: "Matrix throwaway (created)", siteName: "Test site", latitudeDeg: 50, longitudeDeg: 5, timeZone: "UTC" },
    }),
    after: (_a, status, body) => {
      if (status === 201) w.projects.push((body as { project: { id: string } }).project.id);
    },
  },
  ...projectCases("shared"),
  ...projectCases("unshared"),
  ...workspaceCases("shared"),
  ...workspaceCases("unshared"),
  ...libraryCases(),
  ...optionCases("shared"),
  ...optionCases("unshared"),
  ...reviewCases("shared"),
  ...reviewCases("unshared"),
  ...deliveryCases("shared"),
  ...deliveryCases("unshared"),
  ...uploadCases("shared"),
  ...uploadCases("unshared"),
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/panes/import",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/panes/import`, body: matrixPanes() }),
    after: (_a, status, body) => {
      if (status === 201) w.panes.push(...(body as { panes: { id: string }[] }).panes.map((p) => p.id));
    },
  },
];

/** A key of the demo organisation made by its owner, to be revoked by a case (and by afterAll if not). */
async function throwawayKey(): Promise<string> {
  const res = await call(owner(), "POST", `/api/v1/orgs/${w.orgId}/api-keys`, { name: "Matrix throwaway key", scope: "read" });
  expect(res.status, res.text.slice(0, 200)).toBe(201);
  const id = (res.body as { apiKey: { id: string } }).apiKey.id;
  w.keyIds.push(id);
  return id;
}

const apiKeyCases = (): Case[] => [
  { method: "GET", path: "/api/v1/orgs/:orgId/api-keys", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/api-keys` }) },
  {
    method: "POST",
    path: "/api/v1/orgs/:orgId/api-keys",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/api-keys`, body: { name: "Matrix created key", scope: "calculate" } }),
    after: (_a, status, body) => {
      if (status === 201) w.keyIds.push((body as { apiKey: { id: string } }).apiKey.id);
    },
  },
  {
    method: "DELETE",
    path: "/api/v1/orgs/:orgId/api-keys/:id",
    prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/api-keys/${await throwawayKey()}` }),
  },
  { method: "GET", path: "/api/v1/orgs/:orgId/history", prepare: async () => ({ path: `/api/v1/orgs/${w.orgId}/history` }) },
];
CASES.push(...apiKeyCases());

const routeOf = (c: Pick<Case, "method" | "path">) => ROUTES.find((r) => r.method === c.method && r.path === c.path);

test.beforeAll(async () => {
  const callers = { anonymous: ANONYMOUS } as Record<Actor, Caller>;
  for (const role of ["owner", "consultant", "architect", "client"] as const) callers[role] = await signInDemo(role);
  const outsider = await createOutsider("matrix-outsider");
  callers.outsider = outsider;
  const me = (await call(callers.owner, "GET", "/api/v1/me")).body as { memberships: { organizationId: string }[] };
  const orgId = me.memberships[0]!.organizationId;
  const members = (await call(callers.owner, "GET", `/api/v1/orgs/${orgId}/members`)).body as { members: { memberId: string; role: string }[] };
  const inv = await call(outsider, "POST", `/api/v1/orgs/${outsider.organizationId}/invitations`, {
    email: uniqueEmail("matrix-invitee"),
    role: "client",
  });
  expect(inv.status).toBe(201);
  const db = new pg.Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  const keys = {} as Record<KeyScope, Caller>;
  const keyIds: string[] = [];
  for (const scope of KEY_SCOPES) {
    const res = await call(callers.owner, "POST", `/api/v1/orgs/${orgId}/api-keys`, { name: `Matrix key (${scope})`, scope });
    expect(res.status, res.text.slice(0, 200)).toBe(201);
    const created = res.body as { key: string; apiKey: { id: string } };
    keys[scope] = { actor: "owner", cookie: null, bearer: created.key };
    keyIds.push(created.apiKey.id);
  }
  w = {
    db,
    keys,
    keyIds,
    makeups: [],
    callers,
    outsider,
    orgId,
    clientMemberId: members.members.find((m) => m.role === "client")!.memberId,
    projects: [],
    members: [],
    invitations: [],
    panes: [],
    outsiderInvitationId: (inv.body as { invitation: { id: string } }).invitation.id,
  };
});

test.afterAll(async () => {
  if (!w) return;
  for (const id of w.projects) await call(w.callers.consultant, "DELETE", `/api/v1/projects/${id}`);
  for (const id of w.members) await call(w.callers.owner, "DELETE", `/api/v1/orgs/${w.orgId}/members/${id}`);
  for (const id of w.invitations) await call(w.callers.owner, "DELETE", `/api/v1/orgs/${w.orgId}/invitations/${id}`);
  for (const id of w.panes) await call(w.callers.owner, "DELETE", `/api/v1/panes/${id}`);
  for (const id of w.keyIds) await call(w.callers.owner, "DELETE", `/api/v1/orgs/${w.orgId}/api-keys/${id}`);
  await deleteMakeupRows(w.makeups);
  await closeWorkspaceRows();
  await removeMakeups(w.db, w.makeups);
  await w.db.end();
});

test("every route in the table has a case, and every case a route", () => {
  const covered = new Set(CASES.map((c) => routeKey(c)));
  const missing = ROUTES.filter((r) => r.auth !== "better-auth" && !covered.has(routeKey(r))).map(routeKey);
  expect(missing, "routes of src/lib/auth/route-table.ts without a case in this matrix").toEqual([]);
  expect(CASES.filter((c) => !routeOf(c)).map((c) => routeKey(c))).toEqual([]);
  expect(ROUTES.filter((r) => r.auth === "better-auth").map(routeKey)).toEqual(["ALL /api/auth/:path*"]);
  expect(AUTH_ROUTES.map((r) => `${r.method} ${r.path}`).sort()).toEqual(Object.keys(AUTH_PROBES).sort());
});

for (const c of CASES) {
  test(`${routeKey(c)}${c.variant ? ` [${c.variant}]` : ""}${c.target ? ` (${c.target} project)` : ""}`, async () => {
    if (c.slow) test.slow();
    const route = routeOf(c)!;
    const rows: string[] = [];
    // Least rights first, so a successful destructive call by a later role cannot hide a refusal.
    let last: Prepared | undefined;
    for (const actor of ACTORS) {
      const { path, body } = (last = await c.prepare(actor));
      const res = await call(w.callers[actor], c.method, path, body);
      c.after?.(actor, res.status, res.body);
      const ruled = actor !== "anonymous" && c.signedIn ? c.signedIn.status : expectedStatus(route, actor, c.target);
      const want = c.want ? c.want(actor, ruled) : ruled;
      rows.push(`${actor.padEnd(10)} ${res.status} (expected ${want})`);
      expect.soft(res.status, `${actor}: ${c.method} ${path} answered ${res.text.slice(0, 160)}`).toBe(want);
      if (res.status >= 400)
        expect.soft(res.headers.get("content-type") ?? "", `${actor}: refusals are problem+json`).toContain("application/problem+json");
    }
    // The same row with each API key: one call per key, after the sessions. A route that writes nothing is
    // called on the owner's target; a writing route gets a fresh one per key.
    for (const scope of KEY_SCOPES) {
      const { path, body } = route.writes ? await c.prepare("owner") : last!;
      const res = await call(w.keys[scope], c.method, path, body);
      c.after?.("owner", res.status, res.body);
      const allowed = scopeAllows(scope, keyScope(route));
      const ruled = allowed ? (c.signedIn ? c.signedIn.status : expectedKeyStatus(route, scope, c.target)) : 403;
      const want = allowed && c.want ? c.want("owner", ruled) : ruled;
      rows.push(`${`key:${scope}`.padEnd(14)} ${res.status} (expected ${want})`);
      expect.soft(res.status, `${scope} key: ${c.method} ${path} answered ${res.text.slice(0, 160)}`).toBe(want);
      if (res.status >= 400)
        expect.soft(res.headers.get("content-type") ?? "", `${scope} key: refusals are problem+json`).toContain("application/problem+json");
      if (!allowed)
        expect
          .soft((res.body as { detail?: string }).detail, `${scope} key: the refusal says what is needed`)
          .toContain(keyScope(route) === "session-only" ? "signed-in session" : `"${keyScope(route)}"`);
    }
    test.info().annotations.push({ type: "matrix", description: rows.join("\n") });
  });
}

test.describe("better-auth routes on the allowlist", () => {
  for (const r of AUTH_ROUTES) {
    const key = `${r.method} ${r.path}`;
    test(`${r.method} /api/auth${r.path}`, async () => {
      const probe = AUTH_PROBES[key]!;
      for (const actor of ACTORS) {
        // Signing out ends the session: sign out a second session of the same user.
        let caller = w.callers[actor];
        if (key === "POST /sign-out" && caller.cookie) {
          caller =
            actor === "outsider"
              ? await signInAs(actor, w.outsider.email, w.outsider.password)
              : await signInDemo(actor as Exclude<Actor, "anonymous" | "outsider">);
        }
        const res = await call(caller, r.method, `/api/auth${probe.url}`, probe.body);
        expect.soft(res.status, `${actor}: ${res.text.slice(0, 160)}`).toBe(probe.status);
      }
    });
  }
});

test("API keys cannot call better-auth (403: a signed-in session is needed)", async () => {
  for (const r of AUTH_ROUTES) {
    const probe = AUTH_PROBES[`${r.method} ${r.path}`]!;
    for (const scope of KEY_SCOPES) {
      const res = await call(w.keys[scope], r.method, `/api/auth${probe.url}`, probe.body);
      expect.soft(res.status, `${scope} key: ${r.method} /api/auth${probe.url} answered ${res.text.slice(0, 160)}`).toBe(403);
    }
  }
});

// Everything else better-auth could serve is closed: these answer 404 to everyone. The requests are harmless if
// they were served (no organisation is created, the role change keeps the client's role).
test.describe("better-auth routes outside the allowlist", () => {
  const closed = [
    { method: "GET", url: "/organization/list-members", body: undefined as (() => unknown) | undefined },
    {
      method: "POST",
      url: "/organization/update-member-role",
      body: () => ({ memberId: w.clientMemberId, role: "client", organizationId: w.orgId }),
    },
    { method: "POST", url: "/organization/create", body: () => ({}) },
    {
      method: "POST",
      url: "/sign-up/email",
      body: () => ({ name: "Direct Signup", email: uniqueEmail("direct-signup"), password: "direct-pass-2026" }),
    },
  ];
  for (const r of closed) {
    test(`${r.method} /api/auth${r.url} answers 404`, async () => {
      for (const actor of ACTORS) {
        const res = await call(w.callers[actor], r.method, `/api/auth${r.url}`, r.body?.());
        expect.soft(res.status, `${actor}: ${res.text.slice(0, 160)}`).toBe(404);
      }
    });
  }
});
