import { ResultsResponse } from "@/lib/contracts/results";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf } from "@/lib/contracts/pagination";
import { ResultsQuery } from "@/lib/contracts/revisions";
import { QueueFullError } from "@/lib/server/calc-pool";
import { endpoint, HttpError, jsonOf } from "@/lib/server/http";
import { projectResults } from "@/lib/server/services/results";

const params = z.object({ id: rowId });

/** Every façade × option of the project for a year (`?year=`, default the current year), with flags and the inputs key. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project, context }) => {
  const q = ResultsQuery.parse(queryOf(context.url));
  try {
    return jsonOf(ResultsResponse, await projectResults(project.id, q.year ?? new Date().getFullYear()));
  } catch (err) {
    if (err instanceof QueueFullError)
      throw new HttpError(503, `Every calculation worker is busy; try again in ${err.retryAfterS} s.`, { retryAfterSeconds: err.retryAfterS });
    throw err;
  }
});
