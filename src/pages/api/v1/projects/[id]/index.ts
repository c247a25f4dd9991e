import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ProjectResponse, ProjectUpdateRequest, ProjectUpdatedResponse } from "@/lib/contracts/projects";
import { endpoint, jsonOf } from "@/lib/server/http";
import { deleteProject, facadesOf, updateProject } from "@/lib/server/services/projects";

const params = z.object({ id: rowId });

export const GET = endpoint({ auth: { project: "id" }, params }, async ({ project, membership }) =>
  jsonOf(ProjectResponse, { project, facades: await facadesOf(project.id), role: membership.role }),
);

export const PATCH = endpoint(
  { auth: { project: "id", permission: "project:update" }, params, body: ProjectUpdateRequest },
  async ({ project, body, user }) =>
    jsonOf(ProjectUpdatedResponse, {
      project: await updateProject(project.id, body, { id: user.id, name: user.name }),
      facades: await facadesOf(project.id),
    }),
);

export const DELETE = endpoint({ auth: { project: "id", permission: "project:delete" }, params }, async ({ project }) => {
  await deleteProject(project.id);
  return new Response(null, { status: 204 });
});
