import { z } from "zod";
import { InvitationCreatedResponse, InvitationRequest, InvitationsPageResponse } from "@/lib/contracts/auth";
import { rowId } from "@/lib/contracts/common";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { endpoint, jsonOf } from "@/lib/server/http";
import { invitationsPage, inviteMember, pendingInvitationsOf } from "@/lib/server/services/members";

/** One page (`?limit=`, `?cursor=`) of the pending invitations, oldest first (owners only). */
export const GET = endpoint(
  { auth: { org: "orgId", permission: "member:update" }, params: z.object({ orgId: rowId }) },
  async ({ params, context }) => {
    const page = await invitationsPage(params.orgId, InstantPageQuery.parse(queryOf(context.url)));
    return jsonOf(InvitationsPageResponse, { invitations: page.items, nextCursor: page.nextCursor });
  },
);

/** Invites someone by e-mail with a role; the e-mail carries the link to join. */
export const POST = endpoint(
  { auth: { org: "orgId", permission: "invitation:create" }, params: z.object({ orgId: rowId }), body: InvitationRequest },
  async ({ request, params, body }) => {
    const invitation = await inviteMember(request.headers, params.orgId, body.email, body.role);
    return jsonOf(InvitationCreatedResponse, { invitation, invitations: await pendingInvitationsOf(params.orgId) }, 201);
  },
);
