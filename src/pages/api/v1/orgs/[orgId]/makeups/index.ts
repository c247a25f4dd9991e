import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf, TextPageQuery } from "@/lib/contracts/pagination";
import { MakeupCreateRequest, MakeupEntry, MakeupPageResponse } from "@/lib/contracts/library";
import { endpoint, jsonOf } from "@/lib/server/http";
import { createMakeup, makeupsPage } from "@/lib/server/services/library";

const params = z.object({ orgId: rowId });

/** One page (`?limit=`, `?cursor=`) of the organisation's saved make-ups, by name, with their stored values. */
export const GET = endpoint({ auth: { org: "orgId", permission: "glazing:read" }, params }, async ({ params, context }) => {
  const page = await makeupsPage(params.orgId, TextPageQuery.parse(queryOf(context.url)));
  return jsonOf(MakeupPageResponse, { items: page.items, nextCursor: page.nextCursor });
});

/** Saves a make-up (revision 1): its description is generated from the layers and its values computed. */
export const POST = endpoint(
  { auth: { org: "orgId", permission: "glazing:create" }, params, body: MakeupCreateRequest, maxBytes: 64 * 1024, engineErrorsField: "layers" },
  async ({ params, body, user }) => {
    const entry = await createMakeup(params.orgId, { id: user.id, name: user.name }, body);
    return jsonOf(MakeupEntry, entry, 201, { location: `/api/v1/makeups/${entry.id}` });
  },
);
