/** View model of an organisation's members page (owners only). */
import { roleCan } from "@/lib/auth/roles";
import type { InvitationEntry, MemberEntry } from "@/lib/contracts/auth";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { membershipsOf } from "@/lib/server/services/access";
import { DEFAULT_PAGE_LIMIT } from "@/lib/contracts/pagination";
import { invitationsPage, membersPage } from "@/lib/server/services/members";

/** Dates as ISO strings, as the island receives them. */
type Serialised<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] };
const serialise = <T extends object>(row: T): Serialised<T> =>
  Object.fromEntries(Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v])) as Serialised<T>;

export interface MembersPage {
  organizationId: string;
  organizationName: string;
  /** The first page (50) of members and of pending invitations. */
  members: MemberEntry[];
  invitations: InvitationEntry[];
  /** More members or invitations exist than the page shows. */
  hasMore: boolean;
}

/** NotFoundError when the user is not a member of the organisation; ForbiddenError unless an owner. */
export async function loadMembersPage(user: { id: string }, slug: string | undefined): Promise<MembersPage> {
  const membership = (await membershipsOf(user.id)).find((m) => m.organizationSlug === slug);
  if (!membership) throw new NotFoundError("No such organisation, or you are not a member of it");
  if (!roleCan(membership.role, { member: ["update"] })) throw ForbiddenError.forRole(membership.role, "manage members");
  const first = { limit: DEFAULT_PAGE_LIMIT };
  const [members, invitations] = await Promise.all([
    membersPage(membership.organizationId, first),
    invitationsPage(membership.organizationId, first),
  ]);
  return {
    organizationId: membership.organizationId,
    organizationName: membership.organizationName,
    members: members.items.map(serialise),
    invitations: invitations.items.map(serialise),
    hasMore: members.nextCursor !== null || invitations.nextCursor !== null,
  };
}
