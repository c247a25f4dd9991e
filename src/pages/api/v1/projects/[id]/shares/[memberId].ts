import { ShareListResponse } from "@/lib/contracts/projects";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, jsonOf } from "@/lib/server/http";
import { sharesOf, unshareProject } from "@/lib/server/services/projects";

export const DELETE = endpoint(
  { auth: { project: "id", permission: "project:share" }, params: z.object({ id: rowId, memberId: rowId }) },
  async ({ project, params }) => {
    await unshareProject(project, params.memberId);
    return jsonOf(ShareListResponse, { shares: await sharesOf(project) });
  },
);
