import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { endpoint, json, parseParams, requireUser } from "@/lib/server/http";
import { requireProject } from "@/lib/server/services/access";
import { sharesOf, unshareProject } from "@/lib/server/services/projects";

export const prerender = false;
const Params = z.object({ id: rowId, memberId: rowId });

export const DELETE = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { id, memberId } = parseParams(params, Params);
  const { project } = await requireProject(user.id, id, { project: ["share"] }, "share projects");
  await unshareProject(project, memberId);
  return json({ shares: await sharesOf(project) });
});
