import { InvitationSummaryResponse } from "@/lib/contracts/auth";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { NotFoundError } from "@/lib/server/errors";
import { invitationSummary } from "@/lib/server/services/members";

/** What an invitation link is for (public: the id itself is the secret). */
export const GET = endpoint({ auth: "anonymous", params: z.object({ id: rowId }) }, async ({ params }) => {
  const inv = await invitationSummary(params.id);
  if (!inv) throw new NotFoundError("No such invitation");
  return jsonOf(InvitationSummaryResponse, { invitation: inv });
});
