import { and, asc, count, desc, eq, exists, gt, inArray, lt, notInArray, or, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, member, organization, project, projectRequirements, projectShare, user } from "@/lib/server/db/schema";
import { fieldError, InvalidError, NotFoundError } from "@/lib/server/errors";
import { isRoleName, ROLE_NAMES, roleCan } from "@/lib/auth/roles";
import type { ProjectCreateRequest, ProjectUpdateRequest, ShareEntry } from "@/lib/contracts/projects";
import { DEFAULT_PAGE_LIMIT, pageOf, type Cursor, type Page } from "@/lib/contracts/pagination";
import { canSeeProject, keyOrganizationOf, membershipsOf, userIdOf, type Caller, type Membership, type ProjectRow } from "./access";
import { recordEvent, type Actor } from "./history";

export type FacadeRow = typeof facade.$inferSelect;

export type ProjectListRow = ProjectRow & { facadeCount: number };

export interface OrganizationProjects {
  membership: Membership;
  projects: ProjectListRow[];
  /** Cursor of this organisation's next page; null when `projects` holds the last ones. */
  nextCursor: string | null;
}

const rolesThat = (action: "readAll" | "readShared") => ROLE_NAMES.filter((r) => roleCan(r, { project: [action] }));

/** The change time as the cursor's sort key, to the microsecond (a JavaScript Date keeps only milliseconds). */
const updatedKey = sql<string>`to_char(${project.updatedAt} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;

interface VisibleQuery {
  organizationId?: string;
  limit: number;
  cursor?: Cursor;
}

/**
 * One page of the projects the user may see, most recently changed first (ties by id), with their
 * façade counts: a single query (the page's `limit + 1` rows in a subquery, to know whether another
 * page follows, joined to their façades and grouped).
 */
async function visibleProjects(
  userId: string,
  q: VisibleQuery,
): Promise<Page<ProjectListRow & { memberId: string }> & { memberships: Membership[] | null }> {
  const sharedWithMember = db
    .select({ one: sql`1` })
    .from(projectShare)
    .where(and(eq(projectShare.projectId, project.id), eq(projectShare.memberId, member.id)));
  const after = q.cursor
    ? or(
        lt(project.updatedAt, sql`${q.cursor.key}::timestamptz`),
        and(eq(project.updatedAt, sql`${q.cursor.key}::timestamptz`), gt(project.id, q.cursor.id)),
      )
    : undefined;
  // The page's rows first (limit + 1, on the sort order), then the façade counts of just those rows.
  const pageRows = db
    .select({ id: project.id, memberId: sql<string>`${member.id}`.as("member_id") })
    .from(project)
    .innerJoin(member, and(eq(member.organizationId, project.organizationId), eq(member.userId, userId)))
    .where(
      and(
        or(inArray(member.role, rolesThat("readAll")), and(inArray(member.role, rolesThat("readShared")), exists(sharedWithMember))),
        q.organizationId ? eq(project.organizationId, q.organizationId) : undefined,
        after,
      ),
    )
    .orderBy(desc(project.updatedAt), asc(project.id))
    .limit(q.limit + 1)
    .as("page_rows");
  // The user's memberships ride along as one uncorrelated subquery (evaluated once, not per row), which
  // saves the list a round trip to the database; an empty page has no row to carry them.
  const memberships = sql<
    MembershipJson[]
  >`(select coalesce(json_agg(json_build_array(${member.id}, ${member.organizationId}, ${organization.name}, ${organization.slug}, ${member.role}) order by ${member.createdAt}), '[]'::json) from ${member} inner join ${organization} on ${organization.id} = ${member.organizationId} where ${member.userId} = ${userId})`;
  const rows = await db
    .select({ project, memberId: pageRows.memberId, facadeCount: count(facade.id), sortKey: updatedKey, memberships })
    .from(pageRows)
    .innerJoin(project, eq(project.id, pageRows.id))
    .leftJoin(facade, eq(facade.projectId, project.id))
    .groupBy(project.id, pageRows.memberId)
    .orderBy(desc(project.updatedAt), asc(project.id));
  const page = pageOf(rows, q.limit, (r) => ({ key: r.sortKey, id: r.project.id }));
  return {
    items: page.items.map((r) => ({ ...r.project, facadeCount: r.facadeCount, memberId: r.memberId })),
    nextCursor: page.nextCursor,
    memberships: rows[0] ? membershipsFromJson(rows[0].memberships) : null,
  };
}

/** [memberId, organizationId, organizationName, organizationSlug, role] per membership, oldest first. */
type MembershipJson = [string, string, string, string, string];

function membershipsFromJson(rows: MembershipJson[]): Membership[] {
  return rows
    .map(([memberId, organizationId, organizationName, organizationSlug, role]) => ({
      memberId,
      organizationId,
      organizationName,
      organizationSlug,
      role,
    }))
    .filter((m): m is Membership => isRoleName(m.role));
}

const withoutMemberId = ({ memberId: _m, ...row }: ProjectListRow & { memberId: string }): ProjectListRow => row;

/**
 * The first page (`limit`, default 50) of each of the user's organisations, for the dashboard: one
 * query for the memberships and one per organisation. `from` starts one organisation's list at a
 * cursor instead (its "more" link).
 */
export async function projectsForUser(
  userId: string,
  opts: { limit?: number; from?: { organizationId: string; cursor: Cursor } } = {},
): Promise<OrganizationProjects[]> {
  const memberships = await membershipsOf(userId);
  const limit = opts.limit ?? DEFAULT_PAGE_LIMIT;
  return Promise.all(
    memberships.map(async (m) => {
      const cursor = opts.from?.organizationId === m.organizationId ? opts.from.cursor : undefined;
      const page = await visibleProjects(userId, { organizationId: m.organizationId, limit, cursor });
      return { membership: m, projects: page.items.map(withoutMemberId), nextCursor: page.nextCursor };
    }),
  );
}

/**
 * One page of every project the caller may see (optionally of one organisation), grouped per
 * organisation; every membership is listed, with the page's projects of that organisation. A caller
 * acting through an API key sees its key's organisation only.
 */
export async function projectsPage(
  caller: Caller,
  query: VisibleQuery,
): Promise<{ organizations: { membership: Membership; projects: ProjectListRow[] }[]; nextCursor: string | null }> {
  const only = keyOrganizationOf(caller);
  if (only && query.organizationId && query.organizationId !== only) return { organizations: [], nextCursor: null };
  const q = only ? { ...query, organizationId: only } : query;
  const userId = userIdOf(caller);
  const page = await visibleProjects(userId, q);
  const memberships = page.memberships ?? (await membershipsOf(userId));
  return {
    organizations: memberships
      .filter((m) => !q.organizationId || m.organizationId === q.organizationId)
      .map((m) => ({ membership: m, projects: page.items.filter((r) => r.memberId === m.memberId).map(withoutMemberId) })),
    nextCursor: page.nextCursor,
  };
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

/** How many glazing options each façade of the project has, by façade id (façades without options are absent). */
export async function optionCountsOf(projectId: string): Promise<Record<string, number>> {
  const rows = await db
    .select({ facadeId: facadeOption.facadeId, n: count() })
    .from(facadeOption)
    .where(eq(facadeOption.projectId, projectId))
    .groupBy(facadeOption.facadeId);
  return Object.fromEntries(rows.map((r) => [r.facadeId, r.n]));
}

/**
 * Updates fields; a given façade list replaces the old one (rows named by id are kept and updated).
 * A façade left out is deleted with its options (their comments and decisions go with them, by the
 * foreign keys' cascade); with an actor, each such façade that had options is recorded in the history.
 */
export async function updateProject(projectId: string, input: ProjectUpdateRequest, actor?: Actor): Promise<ProjectRow> {
  const { facades, ...fields } = input;
  return db.transaction(async (tx) => {
    let row: ProjectRow | undefined;
    if (Object.keys(fields).length) {
      [row] = await tx.update(project).set(fields).where(eq(project.id, projectId)).returning();
    } else {
      [row] = await tx.update(project).set({ updatedAt: new Date() }).where(eq(project.id, projectId)).returning();
    }
    if (facades) {
      const existing = await tx.select({ id: facade.id, name: facade.name }).from(facade).where(eq(facade.projectId, projectId));
      const existingIds = new Set(existing.map((f) => f.id));
      for (const f of facades) {
        if (f.id && !existingIds.has(f.id))
          throw new InvalidError("facades", "unknown façade id", `Façade id "${f.id}" does not belong to this project`);
      }
      const keep = new Set(facades.flatMap((f) => (f.id ? [f.id] : [])));
      const removed = existing.filter((f) => !keep.has(f.id));
      if (removed.length) {
        const ids = removed.map((f) => f.id);
        // Counted before the delete, whose cascade takes the options (and their comments and decisions) away.
        const options = await tx
          .select({ facadeId: facadeOption.facadeId, n: count() })
          .from(facadeOption)
          .where(inArray(facadeOption.facadeId, ids))
          .groupBy(facadeOption.facadeId);
        await tx.delete(facade).where(inArray(facade.id, ids));
        // The brief's overrides for those façades go too (the project's own limits stay).
        await tx
          .update(projectRequirements)
          .set({
            limits: sql`jsonb_set(${projectRequirements.limits}, '{facades}', coalesce(${projectRequirements.limits}->'facades', '{}'::jsonb) - array[${sql.join(
              ids.map((i) => sql`${i}`),
              sql`, `,
            )}]::text[])`,
          })
          .where(eq(projectRequirements.projectId, projectId));
        for (const o of actor ? options : []) {
          const name = removed.find((f) => f.id === o.facadeId)!.name;
          await recordEvent(tx, {
            projectId,
            actor: actor!,
            kind: "facade.deleted",
            summary: `Removed façade ${name} with its ${o.n === 1 ? "option" : `${o.n} options`}`,
            detail: { facadeId: o.facadeId, options: o.n },
          });
        }
      }
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

/**
 * One page of the members of the project's organisation who see projects only when shared, by name
 * (ties by member id), and whether they see this one: a single query.
 */
export async function sharesPage(p: ProjectRow, q: { limit: number; cursor?: Cursor }): Promise<Page<ShareRow>> {
  const rows = await db
    .select({
      memberId: member.id,
      name: user.name,
      email: user.email,
      role: member.role,
      shared: sql<boolean>`${projectShare.memberId} is not null`,
    })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .leftJoin(projectShare, and(eq(projectShare.projectId, p.id), eq(projectShare.memberId, member.id)))
    .where(
      and(
        eq(member.organizationId, p.organizationId),
        notInArray(member.role, rolesThat("readAll")),
        q.cursor ? sql`(${user.name}, ${member.id}) > (${q.cursor.key}, ${q.cursor.id})` : undefined,
      ),
    )
    .orderBy(asc(user.name), asc(member.id))
    .limit(q.limit + 1);
  return pageOf(rows, q.limit, (r) => ({ key: r.name, id: r.memberId }));
}

/** The first page of shares (the project page and the answers of the share endpoints). */
export async function sharesOf(p: ProjectRow, limit = DEFAULT_PAGE_LIMIT): Promise<ShareRow[]> {
  return (await sharesPage(p, { limit })).items;
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
