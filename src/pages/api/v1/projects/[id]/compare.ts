import { CompareResponse } from "@/lib/contracts/results";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf } from "@/lib/contracts/pagination";
import { CompareQuery } from "@/lib/contracts/revisions";
import { QueueFullError } from "@/lib/server/calc-pool";
import { endpoint, HttpError, jsonOf } from "@/lib/server/http";
import { compareOptions } from "@/lib/server/services/results";

const params = z.object({ id: rowId });

/** Two or more options side by side (`?options=id,id&year=`): results, angular curves and each surface for a day's profile. */
export const GET = endpoint({ auth: { project: "id", permission: "project:readAll" }, params }, async ({ project, context }) => {
  const q = CompareQuery.parse(queryOf(context.url));
  try {
    return jsonOf(CompareResponse, await compareOptions(project.id, q.options, q.year ?? new Date().getFullYear()));
  } catch (err) {
    if (err instanceof QueueFullError)
      throw new HttpError(503, `Every calculation worker is busy; try again in ${err.retryAfterS} s.`, { retryAfterSeconds: err.retryAfterS });
    throw err;
  }
});
