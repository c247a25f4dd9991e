import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { DEFAULT_PAGE_LIMIT, queryOf, TextPageQuery } from "@/lib/contracts/pagination";
import { ShareRequest, SharesPageResponse } from "@/lib/contracts/projects";
import { endpoint, jsonOf } from "@/lib/server/http";
import { shareProject, sharesPage } from "@/lib/server/services/projects";

const params = z.object({ id: rowId });

/** One page (`?limit=`, `?cursor=`) of the members who see only shared projects, by name, and whether each sees this one. */
export const GET = endpoint(
  { auth: { project: "id", permission: "project:share", action: "manage who sees this project" }, params },
  async ({ project, context }) => {
    const page = await sharesPage(project, TextPageQuery.parse(queryOf(context.url)));
    return jsonOf(SharesPageResponse, { shares: page.items, nextCursor: page.nextCursor });
  },
);

export const POST = endpoint(
  { auth: { project: "id", permission: "project:share" }, params, body: ShareRequest },
  async ({ project, body, user }) => {
    await shareProject(project, body.memberId, user.id);
    const page = await sharesPage(project, { limit: DEFAULT_PAGE_LIMIT });
    return jsonOf(SharesPageResponse, { shares: page.items, nextCursor: page.nextCursor }, 201);
  },
);
