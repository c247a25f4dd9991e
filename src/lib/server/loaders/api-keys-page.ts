/** View model of an organisation's API keys page (owners only): the first page of keys and of the history. */
import { roleCan } from "@/lib/auth/roles";
import type { ApiKeyEntry, OrganizationEventEntry } from "@/lib/contracts/api-keys";
import { DEFAULT_PAGE_LIMIT } from "@/lib/contracts/pagination";
import { ForbiddenError, NotFoundError } from "@/lib/server/errors";
import { membershipsOf } from "@/lib/server/services/access";
import { apiKeysOf } from "@/lib/server/services/api-keys";
import { orgHistoryOf } from "@/lib/server/services/org-history";

export interface ApiKeysPage {
  organizationId: string;
  organizationName: string;
  organizationSlug: string;
  apiKeys: ApiKeyEntry[];
  events: OrganizationEventEntry[];
}

/** NotFoundError when the user is not a member of the organisation; ForbiddenError unless their role manages keys. */
export async function loadApiKeysPage(user: { id: string }, slug: string | undefined): Promise<ApiKeysPage> {
  const membership = (await membershipsOf(user.id)).find((m) => m.organizationSlug === slug);
  if (!membership) throw new NotFoundError("No such organisation, or you are not a member of it");
  if (!roleCan(membership.role, { apiKey: ["manage"] })) throw ForbiddenError.forRole(membership.role, "manage API keys");
  const first = { limit: DEFAULT_PAGE_LIMIT };
  const [keys, events] = await Promise.all([apiKeysOf(membership.organizationId, first), orgHistoryOf(membership.organizationId, first)]);
  return {
    organizationId: membership.organizationId,
    organizationName: membership.organizationName,
    organizationSlug: membership.organizationSlug,
    apiKeys: keys.items,
    events: events.items,
  };
}
