import { and, asc, eq, gt, ne, sql, type AnyColumn } from "drizzle-orm";
import { DEFAULT_PAGE_LIMIT, pageOf, type Cursor, type Page } from "@/lib/contracts/pagination";
import { auth } from "@/lib/server/auth";
import { db } from "@/lib/server/db/client";
import { invitation, member, organization, user } from "@/lib/server/db/schema";
import { ConflictError, fieldError, ForbiddenError, InvalidError, NotFoundError } from "@/lib/server/errors";
import { isRoleName, type RoleName } from "@/lib/auth/roles";

export interface MemberView {
  memberId: string;
  userId: string;
  name: string;
  email: string;
  role: string;
  joinedAt: Date;
}

export interface InvitationView {
  id: string;
  email: string;
  role: string | null;
  status: string;
  expiresAt: Date;
  inviterName: string | null;
}

/**
 * A creation time as a cursor's sort key, to the microsecond. better-auth's tables store UTC times
 * as `timestamp` without zone, so the key is written and read back without any zone conversion.
 */
const createdKey = (column: AnyColumn) => sql<string>`to_char(${column}, 'YYYY-MM-DD"T"HH24:MI:SS.US"Z"')`;
const afterRow = (column: AnyColumn, id: AnyColumn, cursor?: Cursor) =>
  cursor ? sql`(${column}, ${id}) > (${cursor.key}::timestamp, ${cursor.id})` : undefined;

/** One page of an organisation's members, oldest membership first (ties by member id): one query. */
export async function membersPage(organizationId: string, q: { limit: number; cursor?: Cursor }): Promise<Page<MemberView>> {
  const rows = await db
    .select({
      memberId: member.id,
      userId: user.id,
      name: user.name,
      email: user.email,
      role: member.role,
      joinedAt: member.createdAt,
      sortKey: createdKey(member.createdAt),
    })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(and(eq(member.organizationId, organizationId), afterRow(member.createdAt, member.id, q.cursor)))
    .orderBy(asc(member.createdAt), asc(member.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.sortKey, id: r.memberId }));
  return { items: page.items.map(({ sortKey: _k, ...m }) => m), nextCursor: page.nextCursor };
}

/** The first page of members (the endpoints' answers after a change). */
export async function membersOf(organizationId: string, limit = DEFAULT_PAGE_LIMIT): Promise<MemberView[]> {
  return (await membersPage(organizationId, { limit })).items;
}

/** One page of an organisation's pending, unexpired invitations, oldest first (ties by id): one query. */
export async function invitationsPage(organizationId: string, q: { limit: number; cursor?: Cursor }): Promise<Page<InvitationView>> {
  const rows = await db
    .select({
      id: invitation.id,
      email: invitation.email,
      role: invitation.role,
      status: invitation.status,
      expiresAt: invitation.expiresAt,
      inviterName: user.name,
      sortKey: createdKey(invitation.createdAt),
    })
    .from(invitation)
    .leftJoin(user, eq(user.id, invitation.inviterId))
    .where(
      and(
        eq(invitation.organizationId, organizationId),
        eq(invitation.status, "pending"),
        gt(invitation.expiresAt, new Date()),
        afterRow(invitation.createdAt, invitation.id, q.cursor),
      ),
    )
    .orderBy(asc(invitation.createdAt), asc(invitation.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (r) => ({ key: r.sortKey, id: r.id }));
  return { items: page.items.map(({ sortKey: _k, ...i }) => i), nextCursor: page.nextCursor };
}

/** The first page of pending invitations. */
export async function pendingInvitationsOf(organizationId: string, limit = DEFAULT_PAGE_LIMIT): Promise<InvitationView[]> {
  return (await invitationsPage(organizationId, { limit })).items;
}

/** Sends an invitation e-mail (through better-auth, which records it and calls our mailer). */
export async function inviteMember(headers: Headers, organizationId: string, email: string, role: RoleName) {
  requireRole(role);
  const already = await db
    .select({ id: member.id })
    .from(member)
    .innerJoin(user, eq(user.id, member.userId))
    .where(and(eq(member.organizationId, organizationId), eq(user.email, email)));
  if (already.length) throw new ConflictError(`${email} is already a member of this organisation`, [fieldError("email", "already a member")]);
  return auth.api.createInvitation({ headers, body: { email, role, organizationId, resend: true } });
}

export async function cancelInvitation(organizationId: string, invitationId: string): Promise<void> {
  const res = await db
    .update(invitation)
    .set({ status: "canceled" })
    .where(and(eq(invitation.id, invitationId), eq(invitation.organizationId, organizationId), eq(invitation.status, "pending")))
    .returning({ id: invitation.id });
  if (!res.length) throw new NotFoundError("No such pending invitation");
}

async function ownerCount(organizationId: string, exceptMemberId?: string): Promise<number> {
  const rows = await db
    .select({ id: member.id })
    .from(member)
    .where(and(eq(member.organizationId, organizationId), eq(member.role, "owner"), exceptMemberId ? ne(member.id, exceptMemberId) : undefined));
  return rows.length;
}

async function memberOf(organizationId: string, memberId: string) {
  const m = (
    await db
      .select()
      .from(member)
      .where(and(eq(member.id, memberId), eq(member.organizationId, organizationId)))
  )[0];
  if (!m) throw new NotFoundError("No such member in this organisation");
  return m;
}

/** Changes a member's role; an organisation always keeps at least one owner. */
export async function changeRole(organizationId: string, memberId: string, role: RoleName): Promise<void> {
  requireRole(role);
  const m = await memberOf(organizationId, memberId);
  if (m.role === "owner" && role !== "owner" && (await ownerCount(organizationId, memberId)) === 0) {
    throw new ConflictError("An organisation needs at least one owner: make someone else owner first", [fieldError("role", "last owner")]);
  }
  await db.update(member).set({ role }).where(eq(member.id, memberId));
}

export async function removeMember(organizationId: string, memberId: string): Promise<void> {
  const m = await memberOf(organizationId, memberId);
  if (m.role === "owner" && (await ownerCount(organizationId, memberId)) === 0) {
    throw new ConflictError("The last owner cannot be removed");
  }
  await db.delete(member).where(eq(member.id, memberId));
}

export interface InvitationSummary {
  id: string;
  email: string;
  role: RoleName;
  organizationId: string;
  organizationName: string;
  inviterName: string | null;
  status: "pending" | "accepted" | "expired" | "canceled" | "rejected";
  expiresAt: Date;
}

/** What an invitation link shows before sign-in (the id is an unguessable token). */
export async function invitationSummary(invitationId: string): Promise<InvitationSummary | null> {
  const row = (
    await db
      .select({
        id: invitation.id,
        email: invitation.email,
        role: invitation.role,
        status: invitation.status,
        expiresAt: invitation.expiresAt,
        organizationId: organization.id,
        organizationName: organization.name,
        inviterName: user.name,
      })
      .from(invitation)
      .innerJoin(organization, eq(organization.id, invitation.organizationId))
      .leftJoin(user, eq(user.id, invitation.inviterId))
      .where(eq(invitation.id, invitationId))
  )[0];
  if (!row) return null;
  const role = isRoleName(row.role) ? row.role : "client";
  const status = row.status === "pending" && row.expiresAt < new Date() ? "expired" : (row.status as InvitationSummary["status"]);
  return { ...row, role, status };
}

/**
 * Makes the user a member with the invited role. The invitation must be pending, unexpired
 * and addressed to the user's e-mail.
 */
export async function acceptInvitation(userId: string, userEmail: string, invitationId: string): Promise<InvitationSummary> {
  const inv = await invitationSummary(invitationId);
  if (!inv) throw new NotFoundError("No such invitation");
  if (inv.status !== "pending") throw new ConflictError(`This invitation is ${inv.status}; ask the organisation's owner for a new one`);
  if (inv.email.toLowerCase() !== userEmail.toLowerCase()) {
    throw new ForbiddenError(`This invitation is addressed to ${inv.email}; sign in with that address to accept it`);
  }
  await db.transaction((tx) => joinByInvitation(tx, userId, userEmail, invitationId, inv));
  return { ...inv, status: "accepted" };
}

type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];

/**
 * Inside a transaction: makes the user a member in the invited role and marks the invitation accepted. The
 * invitation is checked again under a row lock, so that it is used once.
 */
export async function joinByInvitation(tx: Tx, userId: string, userEmail: string, invitationId: string, checked?: InvitationSummary): Promise<void> {
  const row = (await tx.select().from(invitation).where(eq(invitation.id, invitationId)).for("update"))[0];
  if (!row || row.status !== "pending" || row.expiresAt < new Date())
    throw new ConflictError("This invitation is no longer valid", [fieldError("invitationId", "not pending")]);
  if (row.email.toLowerCase() !== userEmail.toLowerCase())
    throw new ForbiddenError(`This invitation is addressed to ${row.email}; sign in with that address to accept it`);
  const role = requireRole(checked?.role ?? row.role);
  const existing = await tx
    .select({ id: member.id })
    .from(member)
    .where(and(eq(member.userId, userId), eq(member.organizationId, row.organizationId)));
  if (existing.length) await tx.update(member).set({ role }).where(eq(member.id, existing[0]!.id));
  else await tx.insert(member).values({ id: crypto.randomUUID(), userId, organizationId: row.organizationId, role, createdAt: new Date() });
  await tx.update(invitation).set({ status: "accepted" }).where(eq(invitation.id, invitationId));
}

/** A role as stored: exactly one of the four (anything else is refused, never written). */
export function requireRole(role: unknown): RoleName {
  if (typeof role !== "string" || !isRoleName(role))
    throw new InvalidError("role", "is not one of the roles", "The role must be one of owner, consultant, architect, client");
  return role;
}
