import { MembersPageResponse } from "@/lib/contracts/auth";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { DEFAULT_PAGE_LIMIT, InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { endpoint, jsonOf } from "@/lib/server/http";
import { invitationsPage, membersPage } from "@/lib/server/services/members";

/**
 * One page of the members (`?limit=`, `?cursor=`; oldest membership first) and the first page of the
 * pending invitations (owners only). `nextCursor` continues the members, `invitationsNextCursor` the
 * invitations (through GET …/invitations?cursor=).
 */
export const GET = endpoint(
  { auth: { org: "orgId", permission: "member:update" }, params: z.object({ orgId: rowId }) },
  async ({ params, context }) => {
    const q = InstantPageQuery.parse(queryOf(context.url));
    const [members, invitations] = await Promise.all([membersPage(params.orgId, q), invitationsPage(params.orgId, { limit: DEFAULT_PAGE_LIMIT })]);
    return jsonOf(MembersPageResponse, {
      members: members.items,
      nextCursor: members.nextCursor,
      invitations: invitations.items,
      invitationsNextCursor: invitations.nextCursor,
    });
  },
);
