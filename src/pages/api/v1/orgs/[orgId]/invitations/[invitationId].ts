import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, requireUser } from "@/lib/server/http";
import { requireOrgPermission } from "@/lib/server/services/access";
import { cancelInvitation, pendingInvitationsOf } from "@/lib/server/services/members";

export const prerender = false;
const Params = z.object({ orgId: rowId, invitationId: rowId });

export const DELETE = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { orgId, invitationId } = parseParams(params, Params);
  await requireOrgPermission(user.id, orgId, { invitation: ["cancel"] }, "cancel invitations");
  await cancelInvitation(orgId, invitationId);
  return json({ invitations: await pendingInvitationsOf(orgId) });
});
