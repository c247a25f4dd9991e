/**
 * Who may do what, decided on the server from the member's role in the organisation that
 * owns the resource. Pages and endpoints call these; the UI only mirrors them.
 */
import { and, asc, eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { delivery, facadeOption, libraryPane, makeup, member, organization, project, projectShare, type FacadeOption } from "@/lib/server/db/schema";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { roleCan, type Permission, isRoleName, type RoleName } from "@/lib/auth/roles";

/**
 * Who is asking: a signed-in user (their id), or a member acting through one of the organisation's API keys,
 * who is then a member of that organisation only (anything of another organisation is not found, exactly as
 * for a non-member).
 */
export type Caller = string | KeyCaller;
export interface KeyCaller {
  userId: string;
  /** The organisation of the key: the only one the caller acts in. */
  organizationId: string;
}

export const userIdOf = (caller: Caller) => (typeof caller === "string" ? caller : caller.userId);
/** The one organisation a key caller is limited to, or null for a session. */
export const keyOrganizationOf = (caller: Caller) => (typeof caller === "string" ? null : caller.organizationId);

export interface Membership {
  memberId: string;
  organizationId: string;
  organizationName: string;
  organizationSlug: string;
  role: RoleName;
}

/** The caller's organisations with their role, oldest membership first (a key caller: the key's only). */
export async function membershipsOf(caller: Caller): Promise<Membership[]> {
  const only = keyOrganizationOf(caller);
  const rows = await db
    .select({
      memberId: member.id,
      organizationId: member.organizationId,
      organizationName: organization.name,
      organizationSlug: organization.slug,
      role: member.role,
    })
    .from(member)
    .innerJoin(organization, eq(organization.id, member.organizationId))
    .where(and(eq(member.userId, userIdOf(caller)), only ? eq(member.organizationId, only) : undefined))
    .orderBy(asc(member.createdAt));
  return rows.filter((r): r is Membership => isRoleName(r.role));
}

export async function membershipIn(caller: Caller, organizationId: string): Promise<Membership | null> {
  const only = keyOrganizationOf(caller);
  if (only && only !== organizationId) return null;
  const all = await membershipsOf(caller);
  return all.find((m) => m.organizationId === organizationId) ?? null;
}

/**
 * The caller's membership of an organisation, provided the role grants `permission`.
 * Not a member: NotFoundError (the organisation's existence is not revealed). Member without the
 * right: ForbiddenError naming the role.
 */
export async function requireOrgPermission(caller: Caller, organizationId: string, permission: Permission, action: string): Promise<Membership> {
  const m = await membershipIn(caller, organizationId);
  if (!m) throw new NotFoundError("No such organisation, or you are not a member of it");
  if (!roleCan(m.role, permission)) throw ForbiddenError.forRole(m.role, action);
  return m;
}

export type ProjectRow = typeof project.$inferSelect;

/** Whether the member sees the project at all (all of the organisation's, or those shared with them). */
export async function canSeeProject(m: Membership, p: ProjectRow): Promise<boolean> {
  if (m.organizationId !== p.organizationId) return false;
  if (roleCan(m.role, { project: ["readAll"] })) return true;
  if (!roleCan(m.role, { project: ["readShared"] })) return false;
  const share = await db
    .select({ p: projectShare.projectId })
    .from(projectShare)
    .where(and(eq(projectShare.projectId, p.id), eq(projectShare.memberId, m.memberId)));
  return share.length > 0;
}

/**
 * Loads a project for the user: NotFoundError when it does not exist or is not visible to them,
 * ForbiddenError (naming the role) when visible but the role lacks `permission`.
 */
export async function requireProject(
  caller: Caller,
  projectId: string,
  permission?: Permission,
  action = "change this project",
): Promise<{ project: ProjectRow; membership: Membership }> {
  const p = (await db.select().from(project).where(eq(project.id, projectId)))[0];
  const notFound = new NotFoundError("No such project, or it is not shared with you");
  if (!p) throw notFound;
  const m = await membershipIn(caller, p.organizationId);
  if (!m || !(await canSeeProject(m, p))) throw notFound;
  if (permission && !roleCan(m.role, permission)) throw ForbiddenError.forRole(m.role, action);
  return { project: p, membership: m };
}

/**
 * Loads a façade option's project for the user, with the project's rule: NotFoundError when the
 * option does not exist or its project is not visible to them, ForbiddenError without `permission`.
 */
export async function requireOption(
  caller: Caller,
  optionId: string,
  permission?: Permission,
  action = "change this option",
): Promise<{ project: ProjectRow; membership: Membership; option: FacadeOption }> {
  const o = (await db.select().from(facadeOption).where(eq(facadeOption.id, optionId)))[0];
  if (!o) throw new NotFoundError("No such option, or its project is not shared with you");
  try {
    return { ...(await requireProject(caller, o.projectId, permission, action)), option: o };
  } catch (err) {
    if (err instanceof NotFoundError) throw new NotFoundError("No such option, or its project is not shared with you");
    throw err;
  }
}

/**
 * The caller's membership of the organisation that owns a saved make-up or pane, provided the role
 * grants `permission`: NotFoundError when the item does not exist or belongs to an organisation the
 * caller is not a member of, ForbiddenError without the right.
 */
export async function requireLibraryItem(
  caller: Caller,
  kind: "makeup" | "pane",
  itemId: string,
  permission: Permission,
  action: string,
): Promise<{ membership: Membership; organizationId: string }> {
  const table = kind === "makeup" ? makeup : libraryPane;
  const row = (await db.select({ organizationId: table.organizationId }).from(table).where(eq(table.id, itemId)))[0];
  const notFound = new NotFoundError(kind === "makeup" ? "No such make-up in your library" : "No such pane in your library");
  if (!row) throw notFound;
  const m = await membershipIn(caller, row.organizationId);
  if (!m) throw notFound;
  if (!roleCan(m.role, permission)) throw ForbiddenError.forRole(m.role, action);
  return { membership: m, organizationId: row.organizationId };
}

/**
 * Loads an e-mail delivery's project for the user, with the project's rule (as requireOption): NotFoundError
 * when the delivery does not exist or its project is not visible to them, ForbiddenError without `permission`.
 */
export async function requireDelivery(
  caller: Caller,
  deliveryId: string,
  permission?: Permission,
  action = "see this project's deliveries",
): Promise<{ project: ProjectRow; membership: Membership; deliveryId: string }> {
  const d = (await db.select({ projectId: delivery.projectId }).from(delivery).where(eq(delivery.id, deliveryId)))[0];
  const notFound = new NotFoundError("No such delivery, or its project is not shared with you");
  if (!d) throw notFound;
  try {
    return { ...(await requireProject(caller, d.projectId, permission, action)), deliveryId };
  } catch (err) {
    if (err instanceof NotFoundError) throw notFound;
    throw err;
  }
}
