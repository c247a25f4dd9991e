import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json } from "@/lib/server/http";
import { membersOf, pendingInvitationsOf } from "@/lib/server/services/members";

/** Members and pending invitations (owners only). */
export const GET = endpoint({ auth: { org: "orgId", permission: "member:update" }, params: z.object({ orgId: rowId }) }, async ({ params }) =>
  json({ members: await membersOf(params.orgId), invitations: await pendingInvitationsOf(params.orgId) }),
);
