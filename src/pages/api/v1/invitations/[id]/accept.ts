import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json } from "@/lib/server/http";
import { acceptInvitation } from "@/lib/server/services/members";

export const POST = endpoint({ auth: "user", params: z.object({ id: rowId }) }, async ({ user, params }) =>
  json({ invitation: await acceptInvitation(user.id, user.email, params.id) }),
);
