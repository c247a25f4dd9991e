import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { PaneEntry, PanePatchRequest } from "@/lib/contracts/library";
import { endpoint, jsonOf } from "@/lib/server/http";
import { deletePane, getPane, updatePane } from "@/lib/server/services/library";

const params = z.object({ id: rowId });

/** A saved pane at its current revision. */
export const GET = endpoint({ auth: { pane: "id", permission: "glazing:read" }, params }, async ({ params }) =>
  jsonOf(PaneEntry, await getPane(params.id)),
);

/** Saves a new revision; `revision` is the one the change was based on (409 when someone saved meanwhile). */
export const PATCH = endpoint(
  { auth: { pane: "id", permission: "glazing:update" }, params, body: PanePatchRequest, maxBytes: 16 * 1024 },
  async ({ params, body, user }) => jsonOf(PaneEntry, await updatePane(params.id, { id: user.id, name: user.name }, body)),
);

/** Deletes the pane; make-ups hold copies of their panes and do not change. */
export const DELETE = endpoint({ auth: { pane: "id", permission: "glazing:delete" }, params }, async ({ params }) => {
  await deletePane(params.id);
  return new Response(null, { status: 204 });
});
