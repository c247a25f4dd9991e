// Organisation API keys against PostgreSQL: made and revoked by owners, stored as a hash, and the
// `Authorization: Bearer` path as the middleware runs it (lib/server/api-key-auth.ts → locals →
// endpoint(…)), with the scope rule of the route table, the key's organisation and its rate limit.
import { afterAll, describe, expect, it, vi } from "vitest";
import type { APIRoute } from "astro";
import { and, eq } from "drizzle-orm";

// The per-key limit is read once from the environment: a small one, so that the limit test stays short.
vi.hoisted(() => {
  process.env.API_KEY_RATE_LIMIT = "12";
});

import { db, pool } from "@/lib/server/db/client";
import { invitation, member, orgApiKey, organizationEvent } from "@/lib/server/db/schema";
import { apiKeyIdentity, bearerToken, INVALID_KEY } from "@/lib/server/api-key-auth";
import { acceptInvitation, inviteMember } from "@/lib/server/services/members";
import { createProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { ApiKeyCreatedResponse, ApiKeyListResponse, OrganizationHistoryResponse } from "@/lib/contracts/api-keys";
import { callRoute, invitedMember, newOwner, type RouteCaller } from "./helpers";
import * as apiKeysRoute from "@/pages/api/v1/orgs/[orgId]/api-keys/index";
import * as apiKeyRoute from "@/pages/api/v1/orgs/[orgId]/api-keys/[id]";
import * as orgHistoryRoute from "@/pages/api/v1/orgs/[orgId]/history";
import * as projectRoute from "@/pages/api/v1/projects/[id]/index";
import * as projectsRoute from "@/pages/api/v1/projects/index";
import * as glazingRoute from "@/pages/api/v1/calc/glazing";
import * as membersRoute from "@/pages/api/v1/orgs/[orgId]/members/index";
import * as signupRoute from "@/pages/api/v1/signup";
import * as acceptRoute from "@/pages/api/v1/invitations/[id]/accept";
import * as meRoute from "@/pages/api/v1/me";
import * as makeupsRoute from "@/pages/api/v1/orgs/[orgId]/makeups/index";

afterAll(() => pool.end());

const pane6 = { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
const air16 = { kind: "gap", widthMm: 16, gas: "air" };

interface Answer {
  status: number;
  body: { detail?: string; [k: string]: unknown } | null;
  headers: Headers;
}

/**
 * A request with `Authorization: Bearer key`, as the middleware handles it: the key is checked (401/429
 * answered there), then the route runs with the key's user and key in `locals` and Astro's route pattern.
 */
async function withKey(
  key: string,
  route: APIRoute,
  pattern: string,
  path: string,
  params: Record<string, string>,
  init: { method?: string; body?: unknown } = {},
): Promise<Answer> {
  const request = new Request(`http://127.0.0.1${path}`, {
    method: init.method ?? "GET",
    headers: { authorization: `Bearer ${key}`, ...(init.body !== undefined ? { "content-type": "application/json" } : {}) },
    ...(init.body !== undefined ? { body: JSON.stringify(init.body) } : {}),
  });
  const token = bearerToken(request.headers);
  expect(token).not.toBeNull();
  const identity = await apiKeyIdentity(token!);
  const res =
    identity instanceof Response
      ? identity
      : ((await route({
          request,
          url: new URL(request.url),
          params,
          routePattern: pattern,
          locals: { user: identity.user, session: null, apiKey: identity.apiKey },
        } as never)) as Response);
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null, headers: res.headers };
}

async function ownerWithProject(tag: string) {
  const o = await newOwner(tag);
  const caller: RouteCaller = { id: o.userId, name: `Test ${tag}`, email: o.email };
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: `Keyed tower ${tag}`,
      siteName: "Plot 3",
      latitudeDeg: 52,
      longitudeDeg: 4,
      timeZone: "UTC",
    }),
    o.userId,
  );
  return { ...o, caller, projectId: p.id };
}

async function makeKey(o: { organizationId: string; caller: RouteCaller }, scope: "read" | "calculate" | "read-write", name = `Script (${scope})`) {
  const res = await callRoute(
    apiKeysRoute.POST,
    o.caller,
    `/api/v1/orgs/${o.organizationId}/api-keys`,
    { orgId: o.organizationId },
    {
      method: "POST",
      body: { name, scope },
    },
  );
  expect(res.status).toBe(201);
  return ApiKeyCreatedResponse.parse(res.body);
}

const PROJECT = "/api/v1/projects/[id]";
const getProject = (key: string, id: string) => withKey(key, projectRoute.GET, PROJECT, `/api/v1/projects/${id}`, { id });
const patchProject = (key: string, id: string) =>
  withKey(key, projectRoute.PATCH, PROJECT, `/api/v1/projects/${id}`, { id }, { method: "PATCH", body: { description: "Changed by a script" } });
const calcGlazing = (key: string) =>
  withKey(key, glazingRoute.POST, "/api/v1/calc/glazing", "/api/v1/calc/glazing", {}, { method: "POST", body: { layers: [pane6, air16, pane6] } });

describe("making and listing keys", () => {
  it("shows the key once (201), lists it without the secret and stores only its SHA-256", async () => {
    const o = await ownerWithProject("keys-once");
    const created = await makeKey(o, "read", "Nightly export");
    expect(created.key).toMatch(/^pnr_[A-Za-z0-9_-]{43}$/);
    expect(created.apiKey).toMatchObject({
      name: "Nightly export",
      scope: "read",
      start: created.key.slice(0, 10),
      lastUsedAt: null,
      revokedAt: null,
    });

    const list = await callRoute(apiKeysRoute.GET, o.caller, `/api/v1/orgs/${o.organizationId}/api-keys`, { orgId: o.organizationId });
    expect(list.status).toBe(200);
    const parsed = ApiKeyListResponse.parse(list.body);
    expect(parsed.apiKeys.map((k) => k.id)).toEqual([created.apiKey.id]);
    expect(JSON.stringify(list.body)).not.toContain(created.key);

    const rows = await db.select().from(orgApiKey).where(eq(orgApiKey.organizationId, o.organizationId));
    expect(rows).toHaveLength(1);
    expect(JSON.stringify(rows)).not.toContain(created.key);
    // SHA-256 of the key, hex (computed independently with node:crypto).
    const { createHash } = await import("node:crypto");
    expect(rows[0]!.keyHash).toBe(createHash("sha256").update(created.key).digest("hex"));
  });

  it("refuses a bad name or scope naming the field, other roles (403) and non-members (404)", async () => {
    const o = await ownerWithProject("keys-refusals");
    const path = `/api/v1/orgs/${o.organizationId}/api-keys`;
    const bad = await callRoute(
      apiKeysRoute.POST,
      o.caller,
      path,
      { orgId: o.organizationId },
      { method: "POST", body: { name: "Ex\u0000port", scope: "admin" } },
    );
    expect(bad.status).toBe(400);
    const fields = (bad.body as { errors: { field: string; message: string }[] }).errors.map((e) => e.field).sort();
    expect(fields).toEqual(["name", "scope"]);
    expect(JSON.stringify(bad.body)).toContain("scope must be one of read, calculate, read-write");

    const consultant = await invitedMember(o, "consultant");
    const refused = await callRoute(
      apiKeysRoute.POST,
      consultant,
      path,
      { orgId: o.organizationId },
      { method: "POST", body: { name: "Mine", scope: "read" } },
    );
    expect(refused.status).toBe(403);
    expect((refused.body as { detail: string }).detail).toBe("Your role (consultant) does not allow you to manage API keys");

    const other = await ownerWithProject("keys-outsider");
    expect((await callRoute(apiKeysRoute.GET, other.caller, path, { orgId: o.organizationId })).status).toBe(404);
  });
});

describe("Authorization: Bearer", () => {
  it("gives each scope its routes and names the scope needed outside it (403)", async () => {
    const o = await ownerWithProject("keys-scopes");
    const read = (await makeKey(o, "read")).key;
    const calc = (await makeKey(o, "calculate")).key;
    const rw = (await makeKey(o, "read-write")).key;

    for (const [scope, key, want] of [
      ["read", read, { get: 200, calc: 403, patch: 403 }],
      ["calculate", calc, { get: 200, calc: 200, patch: 403 }],
      ["read-write", rw, { get: 200, calc: 200, patch: 200 }],
    ] as const) {
      const g = await getProject(key, o.projectId);
      const c = await calcGlazing(key);
      const p = await patchProject(key, o.projectId);
      expect([g.status, c.status, p.status], scope).toEqual([want.get, want.calc, want.patch]);
      if (c.status === 403)
        expect(c.body!.detail).toBe(`This API key's scope (${scope}) does not allow this route; it needs a "calculate" key or wider`);
      if (p.status === 403)
        expect(p.body!.detail).toBe(`This API key's scope (${scope}) does not allow this route; it needs a "read-write" key or wider`);
    }
    // A route with a camel-case parameter, found from the lower-case pattern Astro reports.
    const orgId = o.organizationId;
    const library = await withKey(read, makeupsRoute.GET, "/api/v1/orgs/[orgid]/makeups", `/api/v1/orgs/${orgId}/makeups`, { orgId });
    expect(library.status).toBe(200);
    const save = { method: "POST", body: { name: "Scripted double", layers: [pane6, air16, pane6] } };
    const saved = await withKey(calc, makeupsRoute.POST, "/api/v1/orgs/[orgid]/makeups", `/api/v1/orgs/${orgId}/makeups`, { orgId }, save);
    expect(saved.status).toBe(403);
    expect((await withKey(rw, makeupsRoute.POST, "/api/v1/orgs/[orgid]/makeups", `/api/v1/orgs/${orgId}/makeups`, { orgId }, save)).status).toBe(201);
    const unknown = await withKey(read, makeupsRoute.GET, "/api/v1/orgs/[orgid]/nothing", `/api/v1/orgs/${orgId}/makeups`, { orgId });
    expect([unknown.status, unknown.body!.detail]).toEqual([403, "This route is not open to API keys"]);
    const patched = await getProject(rw, o.projectId);
    expect((patched.body as { project: { description: string } }).project.description).toBe("Changed by a script");
  });

  it("acts in the key's organisation only, even when its member belongs to another", async () => {
    const a = await ownerWithProject("keys-org-a");
    const b = await ownerWithProject("keys-org-b");
    // a's owner also becomes a consultant of b's organisation: a session of theirs sees b's project.
    await inviteMember(b.headers, b.organizationId, a.email, "consultant");
    const inv = (
      await db
        .select()
        .from(invitation)
        .where(and(eq(invitation.email, a.email), eq(invitation.organizationId, b.organizationId)))
    )[0]!;
    await acceptInvitation(a.userId, a.email, inv.id);
    expect((await callRoute(projectRoute.GET, a.caller, `/api/v1/projects/${b.projectId}`, { id: b.projectId })).status).toBe(200);

    const key = (await makeKey(a, "read-write")).key;
    const other = await getProject(key, b.projectId);
    expect(other.status).toBe(404);
    expect(other.body!.detail).toBe("No such project, or it is not shared with you");
    expect((await patchProject(key, b.projectId)).status).toBe(404);
    expect((await withKey(key, membersRoute.GET, "/api/v1/orgs/[orgid]/members", "/x", { orgId: b.organizationId })).status).toBe(403);

    const listed = await withKey(key, projectsRoute.GET, "/api/v1/projects", "/api/v1/projects", {});
    expect(listed.status).toBe(200);
    const orgs = (listed.body as { organizations: { organizationId: string; projects: { id: string }[] }[] }).organizations;
    expect(orgs.map((g) => g.organizationId)).toEqual([a.organizationId]);
    expect(orgs[0]!.projects.map((p) => p.id)).toEqual([a.projectId]);
    const asked = await withKey(key, projectsRoute.GET, "/api/v1/projects", `/api/v1/projects?organizationId=${b.organizationId}`, {});
    expect((asked.body as { organizations: unknown[] }).organizations).toEqual([]);
    const me = await withKey(key, meRoute.GET, "/api/v1/me", "/api/v1/me", {});
    // The caller every handler sees (and records in histories and comments) is the maker with the key's name.
    expect((me.body as { user: { name: string } }).user.name).toBe(`${a.caller.name} (API key “Script (read-write)”)`);
    expect((me.body as { memberships: { organizationId: string }[] }).memberships.map((m) => m.organizationId)).toEqual([a.organizationId]);
    // A session of the same person still sees both organisations.
    const session = await callRoute(projectsRoute.GET, a.caller, "/api/v1/projects", {});
    expect((session.body as { organizations: unknown[] }).organizations).toHaveLength(2);
  });

  it("refuses session-only routes with any key (403 naming the session)", async () => {
    const o = await ownerWithProject("keys-session-only");
    const key = (await makeKey(o, "read-write")).key;
    const orgId = o.organizationId;
    const answers = [
      await withKey(key, membersRoute.GET, "/api/v1/orgs/[orgid]/members", `/api/v1/orgs/${orgId}/members`, { orgId }),
      await withKey(key, apiKeysRoute.GET, "/api/v1/orgs/[orgid]/api-keys", `/api/v1/orgs/${orgId}/api-keys`, { orgId }),
      await withKey(
        key,
        apiKeysRoute.POST,
        "/api/v1/orgs/[orgid]/api-keys",
        `/api/v1/orgs/${orgId}/api-keys`,
        { orgId },
        { method: "POST", body: { name: "Child", scope: "read" } },
      ),
      await withKey(
        key,
        signupRoute.POST,
        "/api/v1/signup",
        "/api/v1/signup",
        {},
        { method: "POST", body: { name: "X", email: "x@test.example", password: "long password", organizationName: "X" } },
      ),
      await withKey(key, acceptRoute.POST, "/api/v1/invitations/[id]/accept", "/api/v1/invitations/abc/accept", { id: "abc" }, { method: "POST" }),
    ];
    expect(answers.map((a) => a.status)).toEqual([403, 403, 403, 403, 403]);
    for (const a of answers) expect(a.body!.detail).toBe("This route needs a signed-in session; API keys cannot call it");
    expect(await db.select().from(orgApiKey).where(eq(orgApiKey.organizationId, orgId))).toHaveLength(1);
  });

  it("answers 401 for a revoked key at once, and for forged or garbled keys", async () => {
    const o = await ownerWithProject("keys-revoke");
    const { key, apiKey } = await makeKey(o, "read", "Short-lived");
    expect((await getProject(key, o.projectId)).status).toBe(200);
    const revoked = await callRoute(apiKeyRoute.DELETE, o.caller, "/x", { orgId: o.organizationId, id: apiKey.id }, { method: "DELETE" });
    expect(revoked.status).toBe(200);
    expect((revoked.body as { apiKey: { revokedAt: string | null } }).apiKey.revokedAt).not.toBeNull();
    const after = await getProject(key, o.projectId);
    expect(after.status).toBe(401);
    expect(after.body!.detail).toBe(INVALID_KEY);
    expect(after.headers.get("content-type")).toContain("application/problem+json");
    // Revoking twice is a conflict; another organisation's owner cannot see the key at all.
    expect((await callRoute(apiKeyRoute.DELETE, o.caller, "/x", { orgId: o.organizationId, id: apiKey.id }, { method: "DELETE" })).status).toBe(409);

    const live = (await makeKey(o, "read")).key;
    const flipped = live.slice(0, -1) + (live.endsWith("A") ? "B" : "A");
    const forged = "pnr_" + "x".repeat(43);
    for (const k of [flipped, forged, "pnr_short", "not-a-key", "pnr_" + "é".repeat(43)]) {
      const res = await getProject(k, o.projectId);
      expect(res.status, k).toBe(401);
      expect(res.body!.detail).toBe(INVALID_KEY);
    }
    expect((await getProject(live, o.projectId)).status).toBe(200);
  });

  it("stops a key once its maker is no longer an owner of the organisation", async () => {
    const o = await ownerWithProject("keys-demoted");
    const key = (await makeKey(o, "read")).key;
    expect((await getProject(key, o.projectId)).status).toBe(200);
    await db
      .update(member)
      .set({ role: "consultant" })
      .where(and(eq(member.userId, o.userId), eq(member.organizationId, o.organizationId)));
    expect((await getProject(key, o.projectId)).status).toBe(401);
    await db
      .update(member)
      .set({ role: "owner" })
      .where(and(eq(member.userId, o.userId), eq(member.organizationId, o.organizationId)));
    expect((await getProject(key, o.projectId)).status).toBe(200);
  });

  it("limits each key per minute (429 with Retry-After) and records its last use", async () => {
    const o = await ownerWithProject("keys-limit");
    const { key, apiKey } = await makeKey(o, "read");
    const other = (await makeKey(o, "read")).key;
    const statuses: number[] = [];
    for (let i = 0; i < 13; i++) statuses.push((await getProject(key, o.projectId)).status);
    // API_KEY_RATE_LIMIT=12 (set above): twelve answers, then the limit.
    expect(statuses.filter((s) => s === 200)).toHaveLength(12);
    expect(statuses[12]).toBe(429);
    const limited = await getProject(key, o.projectId);
    expect(limited.status).toBe(429);
    const retry = Number(limited.headers.get("retry-after"));
    expect(retry).toBeGreaterThanOrEqual(1);
    expect(retry).toBeLessThanOrEqual(60);
    expect(limited.body!.detail).toMatch(/more than 12 requests in a minute/);
    // Another key of the same organisation has its own count.
    expect((await getProject(other, o.projectId)).status).toBe(200);

    const list = ApiKeyListResponse.parse(
      (await callRoute(apiKeysRoute.GET, o.caller, `/api/v1/orgs/${o.organizationId}/api-keys`, { orgId: o.organizationId })).body,
    );
    const used = list.apiKeys.find((k) => k.id === apiKey.id)!;
    expect(used.lastUsedAt).not.toBeNull();
    expect(Math.abs(Date.parse(used.lastUsedAt!) - Date.now())).toBeLessThan(60_000);
  });
});

describe("the organisation's history", () => {
  it("records the creation (name and scope) and the revocation, in the same transaction as the change", async () => {
    const o = await ownerWithProject("keys-history");
    const { apiKey } = await makeKey(o, "calculate", "Façade sync");
    await callRoute(apiKeyRoute.DELETE, o.caller, "/x", { orgId: o.organizationId, id: apiKey.id }, { method: "DELETE" });
    const res = await callRoute(orgHistoryRoute.GET, o.caller, `/api/v1/orgs/${o.organizationId}/history`, { orgId: o.organizationId });
    expect(res.status).toBe(200);
    const { events } = OrganizationHistoryResponse.parse(res.body);
    expect(events.map((e) => [e.kind, e.summary, e.actorName])).toEqual([
      ["api-key.revoked", "Revoked the API key “Façade sync” (calculate)", "Test keys-history"],
      ["api-key.created", "Created the API key “Façade sync” (calculate)", "Test keys-history"],
    ]);
    // A refused revocation (already revoked) writes no event.
    await callRoute(apiKeyRoute.DELETE, o.caller, "/x", { orgId: o.organizationId, id: apiKey.id }, { method: "DELETE" });
    expect(await db.select().from(organizationEvent).where(eq(organizationEvent.organizationId, o.organizationId))).toHaveLength(2);
  });
});
