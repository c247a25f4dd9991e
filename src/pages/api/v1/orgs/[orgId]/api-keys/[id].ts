import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { ApiKeyRevokedResponse } from "@/lib/contracts/api-keys";
import { endpoint, jsonOf } from "@/lib/server/http";
import { revokeApiKey } from "@/lib/server/services/api-keys";

/** Revokes the key at once: the next request that carries it answers 401. */
export const DELETE = endpoint(
  { auth: { org: "orgId", permission: "apiKey:manage" }, params: z.object({ orgId: rowId, id: rowId }) },
  async ({ params, user }) =>
    jsonOf(ApiKeyRevokedResponse, { apiKey: await revokeApiKey(params.orgId, params.id, { id: user.id, name: user.name }) }),
);
