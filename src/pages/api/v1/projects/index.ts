import { rowId } from "@/lib/contracts/common";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { callerOf, endpoint, json } from "@/lib/server/http";
import { createProject, projectsPage } from "@/lib/server/services/projects";

const ListQuery = InstantPageQuery.extend({ organizationId: rowId.optional() });

/**
 * One page of the caller's projects (`?limit=`, `?cursor=`, optionally `?organizationId=`), most
 * recently changed first, grouped per organisation; `nextCursor` fetches the next page (null at the end).
 * With an API key: the key's organisation only.
 */
export const GET = endpoint({ auth: "user" }, async ({ user, apiKey, context }) => {
  const q = ListQuery.parse(queryOf(context.url));
  const page = await projectsPage(callerOf(user.id, apiKey), q);
  return json({
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
    return json({ project: row }, 201, { location: `/api/v1/projects/${row.id}` });
  },
);
