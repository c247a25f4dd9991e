import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf, TextPageQuery } from "@/lib/contracts/pagination";
import { PaneCreateRequest, PaneEntry, PanePageResponse } from "@/lib/contracts/library";
import { endpoint, jsonOf } from "@/lib/server/http";
import { createPane, panesPage } from "@/lib/server/services/library";

const params = z.object({ orgId: rowId });

/** One page (`?limit=`, `?cursor=`) of the organisation's saved panes, by name. */
export const GET = endpoint({ auth: { org: "orgId", permission: "glazing:read" }, params }, async ({ params, context }) => {
  const page = await panesPage(params.orgId, TextPageQuery.parse(queryOf(context.url)));
  return jsonOf(PanePageResponse, { items: page.items, nextCursor: page.nextCursor });
});

/** Saves a pane (glass properties or measured values) as revision 1. */
export const POST = endpoint(
  { auth: { org: "orgId", permission: "glazing:create" }, params, body: PaneCreateRequest, maxBytes: 16 * 1024 },
  async ({ params, body, user }) => {
    const entry = await createPane(params.orgId, { id: user.id, name: user.name }, body);
    return jsonOf(PaneEntry, entry, 201, { location: `/api/v1/panes/${entry.id}` });
  },
);
