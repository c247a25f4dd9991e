import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ApiKeyCreatedResponse, ApiKeyCreateRequest, ApiKeyListResponse } from "@/lib/contracts/api-keys";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { endpoint, jsonOf } from "@/lib/server/http";
import { apiKeysOf, createApiKey } from "@/lib/server/services/api-keys";

const params = z.object({ orgId: rowId });

/** One page (`?limit=`, `?cursor=`) of the organisation's API keys, newest first, without the keys themselves. */
export const GET = endpoint({ auth: { org: "orgId", permission: "apiKey:manage" }, params }, async ({ params, context }) => {
  const page = await apiKeysOf(params.orgId, InstantPageQuery.parse(queryOf(context.url)));
  return jsonOf(ApiKeyListResponse, { apiKeys: page.items, nextCursor: page.nextCursor });
});

/** A new key (201): the answer holds the key itself, which is shown this once and stored only as a hash. */
export const POST = endpoint(
  { auth: { org: "orgId", permission: "apiKey:manage" }, params, body: ApiKeyCreateRequest, maxBytes: 4096 },
  async ({ params, body, user }) => {
    const created = await createApiKey(params.orgId, { id: user.id, name: user.name }, body);
    return jsonOf(ApiKeyCreatedResponse, created, 201, { location: `/api/v1/orgs/${params.orgId}/api-keys/${created.apiKey.id}` });
  },
);
