/** What the app layout's header shows for the signed-in user. */
import { roleCan } from "@/lib/auth/roles";
import { membershipsOf } from "@/lib/server/services/access";

export interface NavLink {
  href: string;
  label: string;
}

export interface AppLayoutView {
  /** Links to the members pages of the organisations the user owns. */
  memberLinks: NavLink[];
  /** Whether the user's role includes the glazing library (not clients). */
  showLibrary: boolean;
}

export async function loadAppLayout(user: { id: string } | null): Promise<AppLayoutView> {
  if (!user) return { memberLinks: [], showLibrary: false };
  const memberships = await membershipsOf(user.id);
  const ownerOf = memberships.filter((m) => roleCan(m.role, { member: ["update"] }));
  return {
    showLibrary: memberships.some((m) => roleCan(m.role, { glazing: ["read"] })),
    memberLinks: ownerOf.map((m) => ({
      href: `/orgs/${m.organizationSlug}/members`,
      label: ownerOf.length > 1 ? `${m.organizationName}: members` : "Members",
    })),
  };
}
