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
}

export async function loadAppLayout(user: { id: string } | null): Promise<AppLayoutView> {
  if (!user) return { memberLinks: [] };
  const ownerOf = (await membershipsOf(user.id)).filter((m) => roleCan(m.role, { member: ["update"] }));
  return {
    memberLinks: ownerOf.map((m) => ({
      href: `/orgs/${m.organizationSlug}/members`,
      label: ownerOf.length > 1 ? `${m.organizationName}: members` : "Members",
    })),
  };
}
