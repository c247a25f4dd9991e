import { RevisionResponse } from "@/lib/contracts/results";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { RevisionLetter } from "@/lib/contracts/revisions";
import { endpoint, jsonOf } from "@/lib/server/http";
import { revisionOf } from "@/lib/server/services/revisions";

const params = z.object({ id: rowId, rev: RevisionLetter });

/** One issued revision by its letter, frozen as issued; clients of a shared project read it too. */
export const GET = endpoint({ auth: { project: "id" }, params }, async ({ project, params }) =>
  jsonOf(RevisionResponse, await revisionOf(project.id, params.rev)),
);
