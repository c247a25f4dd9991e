import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { OrganizationHistoryResponse } from "@/lib/contracts/api-keys";
import { endpoint, jsonOf } from "@/lib/server/http";
import { orgHistoryOf } from "@/lib/server/services/org-history";

/** One page (`?limit=`, `?cursor=`) of the organisation's history (e.g. API keys created and revoked), newest first. */
export const GET = endpoint(
  { auth: { org: "orgId", permission: "organization:update" }, params: z.object({ orgId: rowId }) },
  async ({ params, context }) => {
    const page = await orgHistoryOf(params.orgId, InstantPageQuery.parse(queryOf(context.url)));
    return jsonOf(OrganizationHistoryResponse, { events: page.items, nextCursor: page.nextCursor });
  },
);
