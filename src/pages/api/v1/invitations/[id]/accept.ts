import { InvitationSummaryResponse } from "@/lib/contracts/auth";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { acceptInvitation } from "@/lib/server/services/members";

export const POST = endpoint({ auth: "user", params: z.object({ id: rowId }) }, async ({ user, params }) =>
  jsonOf(InvitationSummaryResponse, { invitation: await acceptInvitation(user.id, user.email, params.id) }),
);
