// The list endpoints page with opaque cursors; text fields with control characters are refused before anything is saved.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq } from "drizzle-orm";
import type { APIRoute } from "astro";
import { db, pool } from "@/lib/server/db/client";
import { invitation, project, user } from "@/lib/server/db/schema";
import { encodeCursor } from "@/lib/contracts/pagination";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { signUp } from "@/lib/server/services/accounts";
import { inviteMember } from "@/lib/server/services/members";
import { createProject, projectsForUser, shareProject } from "@/lib/server/services/projects";
import { loadDashboardPage } from "@/lib/server/loaders/dashboard-page";
import * as projectsRoute from "@/pages/api/v1/projects/index";
import * as sharesRoute from "@/pages/api/v1/projects/[id]/shares/index";
import * as membersRoute from "@/pages/api/v1/orgs/[orgId]/members/index";
import * as invitationsRoute from "@/pages/api/v1/orgs/[orgId]/invitations/index";
import * as signupRoute from "@/pages/api/v1/signup";
import { newOwner, uniqueEmail } from "./helpers";

afterAll(() => pool.end());

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- answers are checked field by field
type Json = any;

interface Call {
  userId?: string;
  path: string;
  params?: Record<string, string>;
  body?: unknown;
}

/** Calls a route handler as Astro would, with the signed-in user in locals. */
async function call(route: APIRoute, c: Call): Promise<{ status: number; body: Json }> {
  const url = new URL(c.path, "http://127.0.0.1:4321");
  const request = new Request(
    url,
    c.body === undefined ? {} : { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(c.body) },
  );
  const res = await route({ locals: { user: c.userId ? { id: c.userId } : null }, params: c.params ?? {}, request, url } as never);
  return { status: res.status, body: await res.json() };
}

const projectInput = (organizationId: string, name: string, facades = 0) =>
  ProjectCreateRequest.parse({
    organizationId,
    name,
    siteName: "Plot 5",
    latitudeDeg: 45.76,
    longitudeDeg: 4.84,
    timeZone: "Europe/Paris",
    facades: Array.from({ length: facades }, (_, i) => ({ name: `F${i}`, azimuthDeg: (i * 90) % 360 })),
  });

const fieldsOf = (body: { errors?: { field: string }[] }) => (body.errors ?? []).map((e) => e.field);

let o: Awaited<ReturnType<typeof newOwner>>;
const created: string[] = [];
const facadeCounts = new Map<string, number>();

beforeAll(async () => {
  o = await newOwner("lists");
  // 70 projects in one statement share one change time (the id breaks the tie) …
  const rows = await db
    .insert(project)
    .values(Array.from({ length: 70 }, (_, i) => ({ ...projectInput(o.organizationId, `Bulk ${i}`), facades: undefined, createdById: o.userId })))
    .returning({ id: project.id });
  for (const r of rows) {
    created.push(r.id);
    facadeCounts.set(r.id, 0);
  }
  // … and 50 more come one by one, some with façades.
  for (let i = 0; i < 50; i++) {
    const p = await createProject(projectInput(o.organizationId, `Single ${i}`, i % 4), o.userId);
    created.push(p.id);
    facadeCounts.set(p.id, i % 4);
  }
}, 120_000);

describe("GET /api/v1/projects pages", () => {
  it("walks more than 100 projects page by page, each exactly once, with façade counts, while new projects arrive", async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    let pages = 0;
    do {
      const res = await call(projectsRoute.GET, { userId: o.userId, path: `/api/v1/projects?limit=17${cursor ? `&cursor=${cursor}` : ""}` });
      expect(res.status).toBe(200);
      const org = res.body.organizations.find((g: { organizationId: string }) => g.organizationId === o.organizationId);
      expect(org.projects.length).toBeLessThanOrEqual(17);
      for (const p of org.projects) {
        expect(p.facadeCount, p.name).toBe(facadeCounts.get(p.id));
        seen.push(p.id);
      }
      cursor = res.body.nextCursor;
      pages++;
      // A project added during the walk is newer than every page already fetched: it shifts nothing.
      if (pages === 2) await createProject(projectInput(o.organizationId, "Arrived meanwhile"), o.userId);
    } while (cursor && pages < 20);
    expect(pages).toBe(Math.ceil(created.length / 17));
    expect(new Set(seen).size).toBe(seen.length);
    expect([...seen].sort()).toEqual([...created].sort());
  });

  it("defaults to 50 and allows at most 100 per page; the last page has nextCursor null", async () => {
    const first = await call(projectsRoute.GET, { userId: o.userId, path: "/api/v1/projects" });
    expect(first.body.organizations[0].projects).toHaveLength(50);
    expect(typeof first.body.nextCursor).toBe("string");
    const big = await call(projectsRoute.GET, { userId: o.userId, path: "/api/v1/projects?limit=100" });
    expect(big.body.organizations[0].projects).toHaveLength(100);
    const rest = await call(projectsRoute.GET, { userId: o.userId, path: `/api/v1/projects?limit=100&cursor=${big.body.nextCursor}` });
    expect(rest.body.organizations[0].projects.length).toBeLessThan(100);
    expect(rest.body.nextCursor).toBeNull();
  });

  it.each(["0", "101", "-1", "1.5", "ten", ""])("refuses limit=%s with 400 naming limit", async (limit) => {
    const res = await call(projectsRoute.GET, { userId: o.userId, path: `/api/v1/projects?limit=${limit}` });
    expect(res.status).toBe(400);
    expect(fieldsOf(res.body)).toEqual(["limit"]);
  });

  const b64 = (s: string) => Buffer.from(s).toString("base64url");
  it.each([
    ["not base64", "%%%"],
    ["not JSON", b64("hello")],
    ["wrong shape", b64(JSON.stringify({ key: 1 }))],
    ["not a time", encodeCursor({ key: "yesterday", id: "abc" })],
    ["no such day", encodeCursor({ key: "2026-02-31T10:00:00.000000Z", id: "abc" })],
    ["bad id", encodeCursor({ key: "2026-02-01T10:00:00.000000Z", id: "a b" })],
  ])("refuses a cursor that is %s with 400 naming cursor", async (_, cursor) => {
    const res = await call(projectsRoute.GET, { userId: o.userId, path: `/api/v1/projects?cursor=${cursor}` });
    expect(res.status).toBe(400);
    expect(fieldsOf(res.body)).toEqual(["cursor"]);
  });

  it("the dashboard shows the first 50 of an organisation and continues from its cursor", async () => {
    const first = await loadDashboardPage({ id: o.userId }, null);
    const org = first.organizations.find((g) => g.organizationId === o.organizationId)!;
    expect(org.projects).toHaveLength(50);
    expect(org.nextCursor).toBeTruthy();
    const next = await loadDashboardPage({ id: o.userId }, { organizationId: o.organizationId, cursor: org.nextCursor! });
    const more = next.organizations.find((g) => g.organizationId === o.organizationId)!;
    expect(more.projects).toHaveLength(50);
    expect(more.projects.some((p) => org.projects.some((q) => q.id === p.id))).toBe(false);
    expect(more.isContinuation).toBe(true);
  });
});

describe("members, invitations and shares pages", () => {
  it("walks members, pending invitations and shares with small pages", async () => {
    const org = await newOwner("people");
    const names = ["Zora", "Abel", "Mina"];
    const memberIds: string[] = [];
    for (const name of names) {
      const email = uniqueEmail("client");
      await inviteMember(org.headers, org.organizationId, email, "client");
      const id = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
      await signUp({ name, email, password: "long password", invitationId: id });
    }
    for (let i = 0; i < 5; i++) await inviteMember(org.headers, org.organizationId, uniqueEmail("pending"), "architect");
    const p = await createProject(projectInput(org.organizationId, "Shared tower"), org.userId);

    const walk = async (route: APIRoute, path: string, key: string, params: Record<string, string>) => {
      const all: Json[] = [];
      let cursor: string | null = null;
      let guard = 0;
      do {
        const res = await call(route, { userId: org.userId, path: `${path}?limit=2${cursor ? `&cursor=${cursor}` : ""}`, params });
        expect(res.status, JSON.stringify(res.body)).toBe(200);
        expect(res.body[key].length).toBeLessThanOrEqual(2);
        all.push(...res.body[key]);
        cursor = res.body.nextCursor;
      } while (cursor && ++guard < 10);
      return all;
    };

    const members = await walk(membersRoute.GET, `/api/v1/orgs/${org.organizationId}/members`, "members", { orgId: org.organizationId });
    expect(members.map((m) => m.name)).toEqual(["Test people", ...names]);
    memberIds.push(...members.slice(1).map((m) => m.memberId));

    const invitations = await walk(invitationsRoute.GET, `/api/v1/orgs/${org.organizationId}/invitations`, "invitations", {
      orgId: org.organizationId,
    });
    expect(invitations).toHaveLength(5);
    expect(new Set(invitations.map((i) => i.id)).size).toBe(5);

    await shareProject(p, memberIds[0]!, org.userId);
    const shares = await walk(sharesRoute.GET, `/api/v1/projects/${p.id}/shares`, "shares", { id: p.id });
    expect(shares.map((s) => [s.name, s.shared])).toEqual([
      ["Abel", false],
      ["Mina", false],
      ["Zora", true],
    ]);

    const bad = await call(membersRoute.GET, {
      userId: org.userId,
      path: `/api/v1/orgs/${org.organizationId}/members?limit=500`,
      params: { orgId: org.organizationId },
    });
    expect(bad.status).toBe(400);
    expect(fieldsOf(bad.body)).toEqual(["limit"]);
  });
});

describe("text with control characters", () => {
  it("a project name with NUL is 400 naming the field, and nothing is saved", async () => {
    const before = (await db.select({ n: count() }).from(project).where(eq(project.organizationId, o.organizationId)))[0]!.n;
    const res = await call(projectsRoute.POST, {
      userId: o.userId,
      path: "/api/v1/projects",
      body: { organizationId: o.organizationId, name: "Tower\u0000", siteName: "Plot", latitudeDeg: 1, longitudeDeg: 2, timeZone: "UTC" },
    });
    expect(res.status).toBe(400);
    expect(fieldsOf(res.body)).toEqual(["name"]);
    expect(res.body.errors[0].message).toBe("name must not contain control characters");
    const after = (await db.select({ n: count() }).from(project).where(eq(project.organizationId, o.organizationId)))[0]!.n;
    expect(after).toBe(before);
  });

  it("a façade name with NUL is 400 naming the façade", async () => {
    const res = await call(projectsRoute.POST, {
      userId: o.userId,
      path: "/api/v1/projects",
      body: {
        organizationId: o.organizationId,
        name: "Tower",
        siteName: "Plot",
        latitudeDeg: 1,
        longitudeDeg: 2,
        timeZone: "UTC",
        facades: [{ name: "S\u0000", azimuthDeg: 180 }],
      },
    });
    expect(res.status).toBe(400);
    expect(fieldsOf(res.body)).toEqual(["facades[0].name"]);
  });

  it("a sign-up whose organisation name holds NUL is 400 naming organizationName, and no account is made", async () => {
    const email = uniqueEmail("nul");
    const res = await call(signupRoute.POST, {
      path: "/api/v1/signup",
      body: { name: "Nul Test", email, password: "long password", organizationName: "Firm\u0000" },
    });
    expect(res.status).toBe(400);
    expect(fieldsOf(res.body)).toEqual(["organizationName"]);
    expect(await db.select().from(user).where(eq(user.email, email))).toEqual([]);
  });
});

it("projectsForUser stays bounded per organisation", async () => {
  const groups = await projectsForUser(o.userId, { limit: 10 });
  expect(groups[0]!.projects).toHaveLength(10);
  expect(groups[0]!.nextCursor).toBeTruthy();
});
