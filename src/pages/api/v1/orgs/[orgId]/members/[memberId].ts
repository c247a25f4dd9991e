import { z } from "zod";
import { MemberRoleRequest } from "@/lib/contracts/auth";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, readJson, requireUser } from "@/lib/server/http";
import { requireOrgPermission } from "@/lib/server/services/access";
import { changeRole, membersOf, removeMember } from "@/lib/server/services/members";
import type { RoleName } from "@/lib/auth/roles";

export const prerender = false;
const Params = z.object({ orgId: rowId, memberId: rowId });

export const PATCH = endpoint(async ({ params, request, locals }) => {
  const user = requireUser(locals);
  const { orgId, memberId } = parseParams(params, Params);
  await requireOrgPermission(user.id, orgId, { member: ["update"] }, "change members' roles");
  const { role } = await readJson(request, MemberRoleRequest);
  await changeRole(orgId, memberId, role as RoleName);
  return json({ members: await membersOf(orgId) });
});

export const DELETE = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { orgId, memberId } = parseParams(params, Params);
  await requireOrgPermission(user.id, orgId, { member: ["delete"] }, "remove members");
  await removeMember(orgId, memberId);
  return json({ members: await membersOf(orgId) });
});
