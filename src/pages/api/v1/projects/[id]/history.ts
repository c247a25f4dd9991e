import { HistoryResponse } from "@/lib/contracts/review";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { InstantPageQuery, queryOf } from "@/lib/contracts/pagination";
import { endpoint, jsonOf } from "@/lib/server/http";
import { historyOf } from "@/lib/server/services/review";

const params = z.object({ id: rowId });

/** One page (`?limit=`, `?cursor=`) of the project's history, newest first. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project, context }) =>
  jsonOf(HistoryResponse, await historyOf(project.id, InstantPageQuery.parse(queryOf(context.url)))),
);
