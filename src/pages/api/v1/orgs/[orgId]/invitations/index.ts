import { z } from "zod";
import { InvitationRequest } from "@/lib/contracts/auth";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, readJson, requireUser } from "@/lib/server/http";
import { requireOrgPermission } from "@/lib/server/services/access";
import { inviteMember, pendingInvitationsOf } from "@/lib/server/services/members";
import type { RoleName } from "@/lib/auth/roles";

export const prerender = false;
const Params = z.object({ orgId: rowId });

/** Invites someone by e-mail with a role; the e-mail carries the link to join. */
export const POST = endpoint(async ({ params, request, locals }) => {
  const user = requireUser(locals);
  const { orgId } = parseParams(params, Params);
  await requireOrgPermission(user.id, orgId, { invitation: ["create"] }, "invite members");
  const { email, role } = await readJson(request, InvitationRequest);
  const invitation = await inviteMember(request.headers, orgId, email, role as RoleName);
  return json({ invitation, invitations: await pendingInvitationsOf(orgId) }, 201);
});
