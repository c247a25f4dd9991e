import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { endpoint, json, readJson, requireUser } from "@/lib/server/http";
import { requireOrgPermission } from "@/lib/server/services/access";
import { createProject, projectsForUser } from "@/lib/server/services/projects";

export const prerender = false;

/** The caller's projects, grouped per organisation. */
export const GET = endpoint(async ({ locals }) => {
  const user = requireUser(locals);
  const groups = await projectsForUser(user.id);
  return json({
    organizations: groups.map((g) => ({
      organizationId: g.membership.organizationId,
      organizationName: g.membership.organizationName,
      role: g.membership.role,
      projects: g.projects,
    })),
  });
});

export const POST = endpoint(async ({ request, locals }) => {
  const user = requireUser(locals);
  const input = await readJson(request, ProjectCreateRequest);
  await requireOrgPermission(user.id, input.organizationId, { project: ["create"] }, "create projects");
  const row = await createProject(input, user.id);
  return json({ project: row }, 201, { location: `/api/v1/projects/${row.id}` });
});
