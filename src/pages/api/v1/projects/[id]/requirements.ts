import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { RequirementsRequest, RequirementsResponse } from "@/lib/contracts/requirements";
import { endpoint, jsonOf } from "@/lib/server/http";
import { putRequirements, requirementsEntry } from "@/lib/server/services/requirements";

const params = z.object({ id: rowId });

/** The project's limits and per-façade overrides, with the version to send back on PUT. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project }) =>
  jsonOf(RequirementsResponse, await requirementsEntry(project.id)),
);

/** Replaces the requirements; `version` (optional) is the one read, 409 when someone saved meanwhile. */
export const PUT = endpoint(
  { auth: { project: "id", permission: "option:assign", action: "set the requirements" }, params, body: RequirementsRequest },
  async ({ project, body, user }) => jsonOf(RequirementsResponse, await putRequirements(project, { id: user.id, name: user.name }, body)),
);
