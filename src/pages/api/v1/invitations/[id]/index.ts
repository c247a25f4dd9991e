import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, HttpError, json, parseParams } from "@/lib/server/http";
import { invitationSummary } from "@/lib/server/services/members";

export const prerender = false;
const Params = z.object({ id: rowId });

/** What an invitation link is for (public: the id itself is the secret). */
export const GET = endpoint(async ({ params }) => {
  const { id } = parseParams(params, Params);
  const inv = await invitationSummary(id);
  if (!inv) throw new HttpError(404, "No such invitation");
  return json({ invitation: inv });
});
