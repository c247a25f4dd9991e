import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { endpoint, json } from "@/lib/server/http";
import { createProject, projectsForUser } from "@/lib/server/services/projects";

/** The caller's projects, grouped per organisation. */
export const GET = endpoint({ auth: "user" }, async ({ user }) => {
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

export const POST = endpoint(
  { auth: { org: "organizationId", from: "body", permission: "project:create" }, body: ProjectCreateRequest },
  async ({ user, body }) => {
    const row = await createProject(body, user.id);
    return json({ project: row }, 201, { location: `/api/v1/projects/${row.id}` });
  },
);
