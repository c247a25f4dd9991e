import { RevisionListResponse, RevisionResponse } from "@/lib/contracts/results";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { RevisionIssueRequest } from "@/lib/contracts/revisions";
import { QueueFullError } from "@/lib/server/calc-pool";
import { endpoint, HttpError, jsonOf } from "@/lib/server/http";
import { issueRevision, revisionsOf } from "@/lib/server/services/revisions";

const params = z.object({ id: rowId });

/** The project's issued revisions, newest first; clients of a shared project read them too. */
export const GET = endpoint({ auth: { project: "id" }, params }, async ({ project }) =>
  jsonOf(RevisionListResponse, { revisions: await revisionsOf(project.id) }),
);

/** Issues the next lettered revision of every approved option (façades without one are listed as `unapproved`). */
export const POST = endpoint(
  { auth: { project: "id", permission: "revision:issue" }, params, body: RevisionIssueRequest, maxBytes: 16 * 1024 },
  async ({ project, user, body }) => {
    try {
      const r = await issueRevision(project.id, { id: user.id, name: user.name }, { note: body.note, year: body.year ?? new Date().getFullYear() });
      return jsonOf(RevisionResponse, r, 201);
    } catch (err) {
      if (err instanceof QueueFullError)
        throw new HttpError(503, `Every calculation worker is busy; try again in ${err.retryAfterS} s.`, { retryAfterSeconds: err.retryAfterS });
      throw err;
    }
  },
);
