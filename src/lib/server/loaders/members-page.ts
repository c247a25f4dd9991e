/** View model of an organisation's members page (owners only). */
import { roleCan } from "@/lib/auth/roles";
import type { InvitationEntry, MemberEntry } from "@/lib/contracts/auth";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { membershipsOf } from "@/lib/server/services/access";
import { membersOf, pendingInvitationsOf } from "@/lib/server/services/members";

/** Dates as ISO strings, as the island receives them. */
type Serialised<T> = { [K in keyof T]: T[K] extends Date ? string : T[K] };
const serialise = <T extends object>(row: T): Serialised<T> =>
  Object.fromEntries(Object.entries(row).map(([k, v]) => [k, v instanceof Date ? v.toISOString() : v])) as Serialised<T>;

export interface MembersPage {
  organizationId: string;
  organizationName: string;
  members: MemberEntry[];
  invitations: InvitationEntry[];
}

/** NotFoundError when the user is not a member of the organisation; ForbiddenError unless an owner. */
export async function loadMembersPage(user: { id: string }, slug: string | undefined): Promise<MembersPage> {
  const membership = (await membershipsOf(user.id)).find((m) => m.organizationSlug === slug);
  if (!membership) throw new NotFoundError("No such organisation, or you are not a member of it");
  if (!roleCan(membership.role, { member: ["update"] })) throw ForbiddenError.forRole(membership.role, "manage members");
  const [members, invitations] = await Promise.all([membersOf(membership.organizationId), pendingInvitationsOf(membership.organizationId)]);
  return {
    organizationId: membership.organizationId,
    organizationName: membership.organizationName,
    members: members.map(serialise),
    invitations: invitations.map(serialise),
  };
}
