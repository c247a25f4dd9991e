import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { OptionPatchRequest, OptionUpdatedResponse } from "@/lib/contracts/options";
import { endpoint, jsonOf } from "@/lib/server/http";
import { deleteOption, updateOption } from "@/lib/server/services/options";

const params = z.object({ id: rowId });

/** Renames, re-points (another make-up, or the newest revision) or moves an option; `version` is the one read (409 when stale). */
export const PATCH = endpoint(
  { auth: { option: "id", permission: "option:assign" }, params, body: OptionPatchRequest },
  async ({ project, option, body, user }) =>
    jsonOf(OptionUpdatedResponse, await updateOption(project, option, { id: user.id, name: user.name }, body)),
);

/** Removes the option (with its comments and decisions). */
export const DELETE = endpoint({ auth: { option: "id", permission: "option:assign" }, params }, async ({ project, option, user }) => {
  await deleteOption(project, option, { id: user.id, name: user.name });
  return new Response(null, { status: 204 });
});
