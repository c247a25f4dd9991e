/** View models of the dashboard and the new-project page. */
import { roleCan, ROLE_LABELS, type RoleName } from "@/lib/auth/roles";
import { ForbiddenError } from "@/lib/server/errors";
import { membershipsOf, type ProjectRow } from "@/lib/server/services/access";
import { projectsForUser } from "@/lib/server/services/projects";
import { decodeCursor, DEFAULT_PAGE_LIMIT, isCursorInstant } from "@/lib/contracts/pagination";

interface PageUser {
  id: string;
}

export interface DashboardOrganization {
  organizationId: string;
  organizationName: string;
  role: RoleName;
  roleLabel: string;
  canCreate: boolean;
  /** Sees every project of the organisation (otherwise only those shared with them). */
  seesAll: boolean;
  /** At most DASHBOARD_PAGE projects, most recently changed first. */
  projects: (ProjectRow & { facadeCount: number })[];
  /** Cursor of the next projects (the "more" link), null when these are the last. */
  nextCursor: string | null;
  /** These projects continue the list from a cursor (the page offers a way back to the first ones). */
  isContinuation: boolean;
}

/** Projects shown per organisation on one dashboard page. */
export const DASHBOARD_PAGE = DEFAULT_PAGE_LIMIT;

/**
 * The user's organisations with the first DASHBOARD_PAGE projects of each; `from` (the page's
 * `?org=…&cursor=…`) continues one organisation's list. A cursor that is not ours shows the first page.
 */
export async function loadDashboardPage(
  user: PageUser,
  from: { organizationId: string; cursor: string } | null = null,
): Promise<{ organizations: DashboardOrganization[] }> {
  const cursor = from ? decodeCursor(from.cursor) : null;
  const start = from && cursor && isCursorInstant(cursor.key) ? { organizationId: from.organizationId, cursor } : undefined;
  const groups = await projectsForUser(user.id, { limit: DASHBOARD_PAGE, from: start });
  return {
    organizations: groups.map(({ membership: m, projects, nextCursor }) => ({
      organizationId: m.organizationId,
      organizationName: m.organizationName,
      role: m.role,
      roleLabel: ROLE_LABELS[m.role],
      canCreate: roleCan(m.role, { project: ["create"] }),
      seesAll: roleCan(m.role, { project: ["readAll"] }),
      projects,
      nextCursor,
      isContinuation: start?.organizationId === m.organizationId,
    })),
  };
}

export interface NewProjectPage {
  organizations: { id: string; name: string }[];
  defaultOrganizationId: string;
}

/**
 * The organisations where the user may create projects, the preferred one first choice;
 * ForbiddenError (naming the role) when there is none.
 */
export async function loadNewProjectPage(user: PageUser, preferredOrganizationId: string | null): Promise<NewProjectPage> {
  const memberships = await membershipsOf(user.id);
  const orgs = memberships.filter((m) => roleCan(m.role, { project: ["create"] }));
  if (orgs.length === 0) {
    const role = memberships[0]?.role;
    throw role ? ForbiddenError.forRole(role, "create projects") : new ForbiddenError("Only members of an organisation create projects");
  }
  return {
    organizations: orgs.map((o) => ({ id: o.organizationId, name: o.organizationName })),
    defaultOrganizationId: orgs.some((o) => o.organizationId === preferredOrganizationId) ? preferredOrganizationId! : orgs[0]!.organizationId,
  };
}
