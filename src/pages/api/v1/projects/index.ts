import { queryOf } from "@/lib/contracts/pagination";
import { ProjectCreateRequest, ProjectCreatedResponse, ProjectListQuery, ProjectListResponse } from "@/lib/contracts/projects";
import { callerOf, endpoint, jsonOf } from "@/lib/server/http";
import { createProject, projectsPage } from "@/lib/server/services/projects";

/**
 * One page of the caller's projects (`?limit=`, `?cursor=`, optionally `?organizationId=`), most
 * recently changed first, grouped per organisation; `nextCursor` fetches the next page (null at the end).
 * With an API key: the key's organisation only.
 */
export const GET = endpoint({ auth: "user" }, async ({ user, apiKey, context }) => {
  const q = ProjectListQuery.parse(queryOf(context.url));
  const page = await projectsPage(callerOf(user.id, apiKey), q);
  return jsonOf(ProjectListResponse, {
    nextCursor: page.nextCursor,
    organizations: page.organizations.map((g) => ({
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
    return jsonOf(ProjectCreatedResponse, { project: row }, 201, { location: `/api/v1/projects/${row.id}` });
  },
);
