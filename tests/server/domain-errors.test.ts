// Services and loaders refuse with domain errors (not HTTP answers), against PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { invitation } from "@/lib/server/db/schema";
import { ConflictError, ForbiddenError, InvalidError, NotFoundError } from "@/lib/server/errors";
import { signUp } from "@/lib/server/services/accounts";
import { requireOrgPermission, requireProject } from "@/lib/server/services/access";
import { cancelInvitation, acceptInvitation, changeRole, inviteMember, membersOf } from "@/lib/server/services/members";
import { createProject, projectsForUser, shareProject, updateProject } from "@/lib/server/services/projects";
import { loadNewProjectPage, loadDashboardPage } from "@/lib/server/loaders/dashboard-page";
import { loadMembersPage } from "@/lib/server/loaders/members-page";
import { loadProjectEditPage, loadProjectPage } from "@/lib/server/loaders/project-pages";
import { loadInvitationPage } from "@/lib/server/loaders/invitation-page";
import { loadPage } from "@/lib/server/loaders/page";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { newOwner, uniqueEmail } from "./helpers";

afterAll(() => pool.end());

/** The error a promise rejects with (fails the test if it resolves). */
async function rejection(p: Promise<unknown>): Promise<Error> {
  try {
    await p;
  } catch (e) {
    return e as Error;
  }
  throw new Error("expected a refusal, but the call succeeded");
}

async function orgWithClientAndProject() {
  const o = await newOwner();
  const email = uniqueEmail("client");
  await inviteMember(o.headers, o.organizationId, email, "client");
  const invitationId = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
  const c = await signUp({ name: "Client", email, password: "long password", invitationId });
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Errors tower",
      siteName: "Plot 3",
      latitudeDeg: 52.37,
      longitudeDeg: 4.9,
      timeZone: "Europe/Amsterdam",
      facades: [
        { name: "South", azimuthDeg: 180 },
        { name: "East", azimuthDeg: 90 },
        { name: "West", azimuthDeg: 270 },
      ],
    }),
    o.userId,
  );
  return { o, c, p, email };
}

describe("services throw domain errors", () => {
  it("access: not visible is NotFoundError, visible but not allowed is ForbiddenError naming the role", async () => {
    const { o, c, p } = await orgWithClientAndProject();
    expect(await rejection(requireProject(c.userId, p.id))).toBeInstanceOf(NotFoundError);
    const cm = (await projectsForUser(c.userId))[0]!.membership;
    await shareProject(p, cm.memberId, o.userId);
    const refused = await rejection(requireProject(c.userId, p.id, { project: ["update"] }, "edit projects"));
    expect(refused).toBeInstanceOf(ForbiddenError);
    expect((refused as ForbiddenError).role).toBe("client");
    expect(refused.message).toBe("Your role (client) does not allow you to edit projects");

    const stranger = await newOwner("stranger");
    expect(await rejection(requireOrgPermission(stranger.userId, o.organizationId, { member: ["update"] }, "manage members"))).toBeInstanceOf(
      NotFoundError,
    );
    expect(await rejection(requireOrgPermission(c.userId, o.organizationId, { member: ["update"] }, "manage members"))).toBeInstanceOf(
      ForbiddenError,
    );
  });

  it("projects: a foreign façade id is InvalidError on field facades; an unknown member NotFoundError", async () => {
    const a = await orgWithClientAndProject();
    const b = await orgWithClientAndProject();
    const [foreign] = (await loadProjectPage({ id: b.o.userId }, b.p.id)).facades;
    const invalid = await rejection(updateProject(a.p.id, { facades: [{ id: foreign!.id, name: "x", azimuthDeg: 0, tiltDeg: 90 }] }));
    expect(invalid).toBeInstanceOf(InvalidError);
    expect((invalid as InvalidError).field).toBe("facades");
    expect((invalid as InvalidError).errors).toEqual([{ field: "facades", message: "unknown façade id" }]);
    const bMember = (await projectsForUser(b.c.userId))[0]!.membership;
    const unknown = await rejection(shareProject(a.p, bMember.memberId, a.o.userId));
    expect(unknown).toBeInstanceOf(NotFoundError);
    expect((unknown as NotFoundError).errors[0]?.field).toBe("memberId");
  });

  it("members and accounts: the last owner, a used invitation and a duplicate account are ConflictError", async () => {
    const { o, c, email } = await orgWithClientAndProject();
    const [owner] = await membersOf(o.organizationId);
    const last = await rejection(changeRole(o.organizationId, owner!.memberId, "consultant"));
    expect(last).toBeInstanceOf(ConflictError);
    expect((last as ConflictError).errors).toEqual([{ field: "role", message: "last owner" }]);
    const invitationId = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
    expect(await rejection(acceptInvitation(c.userId, email, invitationId))).toBeInstanceOf(ConflictError);
    const known = await newOwner("known");
    await inviteMember(o.headers, o.organizationId, known.email, "client");
    const knownInvitation = (await db.select().from(invitation).where(eq(invitation.email, known.email)))[0]!.id;
    const dup = await rejection(signUp({ name: "Again", email: known.email, password: "long password", invitationId: knownInvitation }));
    expect(dup).toBeInstanceOf(ConflictError);
    expect(await rejection(cancelInvitation(o.organizationId, "no-such-invitation"))).toBeInstanceOf(NotFoundError);
  });

  it("an invitation accepted from another address is ForbiddenError; signing up with another address InvalidError", async () => {
    const o = await newOwner();
    const email = uniqueEmail("invitee");
    await inviteMember(o.headers, o.organizationId, email, "architect");
    const invitationId = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
    const other = await newOwner("other");
    expect(await rejection(acceptInvitation(other.userId, other.email, invitationId))).toBeInstanceOf(ForbiddenError);
    const wrong = await rejection(signUp({ name: "Wrong", email: uniqueEmail("wrong"), password: "long password", invitationId }));
    expect(wrong).toBeInstanceOf(InvalidError);
    expect((wrong as InvalidError).field).toBe("email");
  });
});

describe("page loaders", () => {
  it("work out what the user may do, and refuse with the role named", async () => {
    const { o, c, p } = await orgWithClientAndProject();
    const owner = await loadProjectPage({ id: o.userId }, p.id);
    expect(owner).toMatchObject({ role: "owner", canEdit: true, canDelete: true, canShare: true });
    expect(owner.shares.map((s) => s.shared)).toEqual([false]);

    const cm = (await projectsForUser(c.userId))[0]!.membership;
    await shareProject(p, cm.memberId, o.userId);
    const client = await loadProjectPage({ id: c.userId }, p.id);
    expect(client).toMatchObject({ role: "client", roleLabel: "Client", canEdit: false, canDelete: false, canShare: false, shares: [] });
    expect((await rejection(loadProjectEditPage({ id: c.userId }, p.id))).message).toContain("(client)");
    expect(await rejection(loadNewProjectPage({ id: c.userId }, null))).toBeInstanceOf(ForbiddenError);
    expect(await rejection(loadMembersPage({ id: c.userId }, "no-such-organisation"))).toBeInstanceOf(NotFoundError);
    expect(await rejection(loadInvitationPage(null, "<not an id>"))).toBeInstanceOf(NotFoundError);
  });

  it("the dashboard lists each organisation's visible projects with their façade counts", async () => {
    const { o, c, p } = await orgWithClientAndProject();
    const second = await createProject(
      ProjectCreateRequest.parse({
        organizationId: o.organizationId,
        name: "Bare block",
        siteName: "Plot 4",
        latitudeDeg: 1,
        longitudeDeg: 2,
        timeZone: "UTC",
      }),
      o.userId,
    );
    const { organizations } = await loadDashboardPage({ id: o.userId });
    expect(organizations).toHaveLength(1);
    expect(organizations[0]).toMatchObject({ role: "owner", canCreate: true, seesAll: true });
    const counts = Object.fromEntries(organizations[0]!.projects.map((x) => [x.id, x.facadeCount]));
    expect(counts).toEqual({ [p.id]: 3, [second.id]: 0 });
    const client = (await loadDashboardPage({ id: c.userId })).organizations[0]!;
    expect(client).toMatchObject({ canCreate: false, seesAll: false, projects: [] });
  });

  it("loadPage turns a refusal into status and reason phrase, and passes other errors on", async () => {
    const response: { status?: number; statusText?: string } = {};
    const refused = await loadPage(response, () => Promise.reject(ForbiddenError.forRole("architect", "manage members")));
    expect(refused.refusal).toMatchObject({ status: 403, role: "architect" });
    expect(response).toEqual({ status: 403, statusText: "Forbidden" });
    const missing: { status?: number; statusText?: string } = {};
    await loadPage(missing, () => Promise.reject(new NotFoundError("No such project")));
    expect(missing).toEqual({ status: 404, statusText: "Not Found" });
    await expect(loadPage({}, () => Promise.reject(new Error("database down")))).rejects.toThrow("database down");
    const ok: { status?: number } = {};
    expect((await loadPage(ok, async () => 42)).view).toBe(42);
    expect(ok.status).toBeUndefined();
  });
});
