/** View models of the dashboard and the new-project page. */
import { roleCan, ROLE_LABELS, type RoleName } from "@/lib/auth/roles";
import { ForbiddenError } from "@/lib/server/errors";
import { membershipsOf, type ProjectRow } from "@/lib/server/services/access";
import { projectsForUser } from "@/lib/server/services/projects";

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
  projects: (ProjectRow & { facadeCount: number })[];
}

export async function loadDashboardPage(user: PageUser): Promise<{ organizations: DashboardOrganization[] }> {
  const groups = await projectsForUser(user.id);
  return {
    organizations: groups.map(({ membership: m, projects }) => ({
      organizationId: m.organizationId,
      organizationName: m.organizationName,
      role: m.role,
      roleLabel: ROLE_LABELS[m.role],
      canCreate: roleCan(m.role, { project: ["create"] }),
      seesAll: roleCan(m.role, { project: ["readAll"] }),
      projects,
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
