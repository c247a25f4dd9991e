import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ShareRequest } from "@/lib/contracts/projects";
import { endpoint, json } from "@/lib/server/http";
import { shareProject, sharesOf } from "@/lib/server/services/projects";

const params = z.object({ id: rowId });

/** Members who see only shared projects, and whether each sees this one. */
export const GET = endpoint(
  { auth: { project: "id", permission: "project:share", action: "manage who sees this project" }, params },
  async ({ project }) => json({ shares: await sharesOf(project) }),
);

export const POST = endpoint(
  { auth: { project: "id", permission: "project:share" }, params, body: ShareRequest },
  async ({ project, body, user }) => {
    await shareProject(project, body.memberId, user.id);
    return json({ shares: await sharesOf(project) }, 201);
  },
);
