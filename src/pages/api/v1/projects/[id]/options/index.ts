import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { OptionCreateRequest, OptionCreatedResponse, OptionListResponse } from "@/lib/contracts/options";
import { endpoint, jsonOf } from "@/lib/server/http";
import { createOption, optionsOf } from "@/lib/server/services/options";

const params = z.object({ id: rowId });

/** Every option of the project's façades with the make-up revision each points at and the library's newest one. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project }) =>
  jsonOf(OptionListResponse, { options: await optionsOf(project.id) }),
);

/** Adds an option to a façade, pointing at the make-up's current revision. */
export const POST = endpoint(
  { auth: { project: "id", permission: "option:assign" }, params, body: OptionCreateRequest },
  async ({ project, body, user }) => {
    const option = await createOption(project, { id: user.id, name: user.name }, body);
    return jsonOf(OptionCreatedResponse, { option }, 201, { location: `/api/v1/options/${option.id}` });
  },
);
