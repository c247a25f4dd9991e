import { z } from "zod";
import { InvitationRequest } from "@/lib/contracts/auth";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json } from "@/lib/server/http";
import { inviteMember, pendingInvitationsOf } from "@/lib/server/services/members";

/** Invites someone by e-mail with a role; the e-mail carries the link to join. */
export const POST = endpoint(
  { auth: { org: "orgId", permission: "invitation:create" }, params: z.object({ orgId: rowId }), body: InvitationRequest },
  async ({ request, params, body }) => {
    const invitation = await inviteMember(request.headers, params.orgId, body.email, body.role);
    return json({ invitation, invitations: await pendingInvitationsOf(params.orgId) }, 201);
  },
);
