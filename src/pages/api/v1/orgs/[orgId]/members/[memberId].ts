import { z } from "zod";
import { MemberListResponse, MemberRoleRequest } from "@/lib/contracts/auth";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { changeRole, membersOf, removeMember } from "@/lib/server/services/members";

const params = z.object({ orgId: rowId, memberId: rowId });

export const PATCH = endpoint(
  { auth: { org: "orgId", permission: "member:update", action: "change members' roles" }, params, body: MemberRoleRequest },
  async ({ params, body }) => {
    await changeRole(params.orgId, params.memberId, body.role);
    return jsonOf(MemberListResponse, { members: await membersOf(params.orgId) });
  },
);

export const DELETE = endpoint({ auth: { org: "orgId", permission: "member:delete" }, params }, async ({ params }) => {
  await removeMember(params.orgId, params.memberId);
  return jsonOf(MemberListResponse, { members: await membersOf(params.orgId) });
});
