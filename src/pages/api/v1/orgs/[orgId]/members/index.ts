import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, requireUser } from "@/lib/server/http";
import { requireOrgPermission } from "@/lib/server/services/access";
import { membersOf, pendingInvitationsOf } from "@/lib/server/services/members";

export const prerender = false;
const Params = z.object({ orgId: rowId });

/** Members and pending invitations (owners only). */
export const GET = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { orgId } = parseParams(params, Params);
  await requireOrgPermission(user.id, orgId, { member: ["update"] }, "manage members");
  return json({ members: await membersOf(orgId), invitations: await pendingInvitationsOf(orgId) });
});
