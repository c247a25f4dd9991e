import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ShareRequest } from "@/lib/contracts/projects";
import { endpoint, json, parseParams, readJson, requireUser } from "@/lib/server/http";
import { requireProject } from "@/lib/server/services/access";
import { shareProject, sharesOf } from "@/lib/server/services/projects";

export const prerender = false;
const Params = z.object({ id: rowId });

/** Members who see only shared projects, and whether each sees this one. */
export const GET = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  const { project } = await requireProject(user.id, id, { project: ["share"] }, "manage who sees this project");
  return json({ shares: await sharesOf(project) });
});

export const POST = endpoint(async ({ params, request, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  const { project } = await requireProject(user.id, id, { project: ["share"] }, "share projects");
  const { memberId } = await readJson(request, ShareRequest);
  await shareProject(project, memberId, user.id);
  return json({ shares: await sharesOf(project) }, 201);
});
