import { and, asc, count, desc, eq, exists, inArray, notInArray, or, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, member, project, projectShare, user } from "@/lib/server/db/schema";
import { fieldError, InvalidError, NotFoundError } from "@/lib/server/errors";
import { ROLE_NAMES, roleCan } from "@/lib/auth/roles";
import type { ProjectCreateRequest, ProjectUpdateRequest, ShareEntry } from "@/lib/contracts/projects";
import { canSeeProject, membershipsOf, type Membership, type ProjectRow } from "./access";

export type FacadeRow = typeof facade.$inferSelect;

export interface OrganizationProjects {
  membership: Membership;
  projects: (ProjectRow & { facadeCount: number })[];
}

const rolesThat = (action: "readAll" | "readShared") => ROLE_NAMES.filter((r) => roleCan(r, { project: [action] }));

/**
 * Every project the user may see, grouped per organisation (for the dashboard): one query for the
 * memberships and one grouped query for the visible projects with their façade counts.
 */
export async function projectsForUser(userId: string): Promise<OrganizationProjects[]> {
  const memberships = await membershipsOf(userId);
  if (!memberships.length) return [];
  const sharedWithMember = db
    .select({ one: sql`1` })
    .from(projectShare)
    .where(and(eq(projectShare.projectId, project.id), eq(projectShare.memberId, member.id)));
  const rows = await db
    .select({ project, memberId: member.id, facadeCount: count(facade.id) })
    .from(project)
    .innerJoin(member, and(eq(member.organizationId, project.organizationId), eq(member.userId, userId)))
    .leftJoin(facade, eq(facade.projectId, project.id))
    .where(or(inArray(member.role, rolesThat("readAll")), and(inArray(member.role, rolesThat("readShared")), exists(sharedWithMember))))
    .groupBy(project.id, member.id)
    .orderBy(desc(project.updatedAt), asc(project.id));
  return memberships.map((m) => ({
    membership: m,
    projects: rows.filter((r) => r.memberId === m.memberId).map((r) => ({ ...r.project, facadeCount: r.facadeCount })),
  }));
}

export async function facadesOf(projectId: string): Promise<FacadeRow[]> {
  return db.select().from(facade).where(eq(facade.projectId, projectId)).orderBy(asc(facade.position), asc(facade.createdAt));
}

export async function createProject(input: ProjectCreateRequest, userId: string): Promise<ProjectRow> {
  const { facades, organizationId, ...fields } = input;
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(project)
      .values({ ...fields, organizationId, createdById: userId })
      .returning();
    if (facades.length) {
      await tx.insert(facade).values(facades.map(({ id: _id, ...f }, i) => ({ ...f, projectId: row!.id, position: i })));
    }
    return row!;
  });
}

/** Updates fields; a given façade list replaces the old one (rows named by id are kept and updated). */
export async function updateProject(projectId: string, input: ProjectUpdateRequest): Promise<ProjectRow> {
  const { facades, ...fields } = input;
  return db.transaction(async (tx) => {
    let row: ProjectRow | undefined;
    if (Object.keys(fields).length) {
      [row] = await tx.update(project).set(fields).where(eq(project.id, projectId)).returning();
    } else {
      [row] = await tx.update(project).set({ updatedAt: new Date() }).where(eq(project.id, projectId)).returning();
    }
    if (facades) {
      const existing = await tx.select({ id: facade.id }).from(facade).where(eq(facade.projectId, projectId));
      const existingIds = new Set(existing.map((f) => f.id));
      for (const f of facades) {
        if (f.id && !existingIds.has(f.id))
          throw new InvalidError("facades", "unknown façade id", `Façade id "${f.id}" does not belong to this project`);
      }
      const keep = facades.flatMap((f) => (f.id ? [f.id] : []));
      await tx
        .delete(facade)
        .where(keep.length ? and(eq(facade.projectId, projectId), notInArray(facade.id, keep)) : eq(facade.projectId, projectId));
      for (const [i, { id, ...f }] of facades.entries()) {
        if (id)
          await tx
            .update(facade)
            .set({ ...f, position: i })
            .where(eq(facade.id, id));
        else await tx.insert(facade).values({ ...f, projectId, position: i });
      }
    }
    return row!;
  });
}

export async function deleteProject(projectId: string): Promise<void> {
  await db.delete(project).where(eq(project.id, projectId));
}

export type ShareRow = ShareEntry;

/** Members of the project's organisation who see projects only when shared, and whether they see this one. */
export async function sharesOf(p: ProjectRow): Promise<ShareRow[]> {
  const members = await db
    .select({ memberId: member.id, name: user.name, email: user.email, role: member.role })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(eq(member.organizationId, p.organizationId))
    .orderBy(asc(user.name));
  const shared = new Set(
    (await db.select({ memberId: projectShare.memberId }).from(projectShare).where(eq(projectShare.projectId, p.id))).map((s) => s.memberId),
  );
  return members.filter((m) => !roleCan(m.role, { project: ["readAll"] })).map((m) => ({ ...m, shared: shared.has(m.memberId) }));
}

export async function shareProject(p: ProjectRow, memberId: string, byUserId: string): Promise<void> {
  const target = (
    await db
      .select()
      .from(member)
      .where(and(eq(member.id, memberId), eq(member.organizationId, p.organizationId)))
  )[0];
  if (!target) throw new NotFoundError("No such member in this project's organisation", [fieldError("memberId", "unknown member")]);
  await db.insert(projectShare).values({ projectId: p.id, memberId, sharedById: byUserId }).onConflictDoNothing();
}

export async function unshareProject(p: ProjectRow, memberId: string): Promise<void> {
  await db.delete(projectShare).where(and(eq(projectShare.projectId, p.id), eq(projectShare.memberId, memberId)));
}

/** A project's visibility for a member (re-exported for pages). */
export { canSeeProject };
