import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf } from "@/lib/contracts/pagination";
import { WorkbookCsvQuery } from "@/lib/contracts/workbook";
import { endpoint } from "@/lib/server/http";
import { requireDraftAccess, workbookHeaders } from "@/lib/server/workbook-access";
import { workbookCsv, workbookPlan } from "@/lib/server/services/workbook";

const params = z.object({ id: rowId });

/** One table of the schedule workbook as CSV: `table=cover|schedule|hourly|angles`, `facadeId` for hourly and angles. */
export const GET = endpoint(
  { auth: { project: "id", permission: "export:receive", action: "download schedule workbooks" }, params },
  async ({ project, membership, context }) => {
    const q = WorkbookCsvQuery.parse(queryOf(context.url));
    if (!q.revision) requireDraftAccess(membership);
    const plan = await workbookPlan({ projectId: project.id, revision: q.revision ?? null, year: q.year });
    const csv = await workbookCsv(plan, q.table, q.facadeId);
    return new Response(csv.text, { status: 200, headers: workbookHeaders(csv.fileName, "text/csv; charset=utf-8") });
  },
);
