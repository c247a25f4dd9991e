import { InvitationListResponse } from "@/lib/contracts/auth";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { cancelInvitation, pendingInvitationsOf } from "@/lib/server/services/members";

export const DELETE = endpoint(
  { auth: { org: "orgId", permission: "invitation:cancel" }, params: z.object({ orgId: rowId, invitationId: rowId }) },
  async ({ params }) => {
    await cancelInvitation(params.orgId, params.invitationId);
    return jsonOf(InvitationListResponse, { invitations: await pendingInvitationsOf(params.orgId) });
  },
);
