import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, requireUser } from "@/lib/server/http";
import { acceptInvitation } from "@/lib/server/services/members";

export const prerender = false;
const Params = z.object({ id: rowId });

export const POST = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  const inv = await acceptInvitation(user.id, user.email, id);
  return json({ invitation: inv });
});
