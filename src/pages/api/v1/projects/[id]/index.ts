import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ProjectUpdateRequest } from "@/lib/contracts/projects";
import { endpoint, json, parseParams, readJson, requireUser } from "@/lib/server/http";
import { requireProject } from "@/lib/server/services/access";
import { deleteProject, facadesOf, updateProject } from "@/lib/server/services/projects";

export const prerender = false;
const Params = z.object({ id: rowId });

export const GET = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  const { project, membership } = await requireProject(user.id, id);
  return json({ project, facades: await facadesOf(id), role: membership.role });
});

export const PATCH = endpoint(async ({ params, request, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  await requireProject(user.id, id, { project: ["update"] }, "edit projects");
  const input = await readJson(request, ProjectUpdateRequest);
  const project = await updateProject(id, input);
  return json({ project, facades: await facadesOf(id) });
});

export const DELETE = endpoint(async ({ params, locals }) => {
  const user = requireUser(locals);
  const { id } = parseParams(params, Params);
  await requireProject(user.id, id, { project: ["delete"] }, "delete projects");
  await deleteProject(id);
  return new Response(null, { status: 204 });
});
