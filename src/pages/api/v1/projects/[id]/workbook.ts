import { PassThrough, Readable } from "node:stream";
import { z } from "zod";
import { rowId } from "@/lib/contracts/common";
import { queryOf } from "@/lib/contracts/pagination";
import { WorkbookQuery } from "@/lib/contracts/workbook";
import { endpoint } from "@/lib/server/http";
import { requireDraftAccess, workbookHeaders } from "@/lib/server/workbook-access";
import { workbookPlan, XLSX_CONTENT_TYPE } from "@/lib/server/services/workbook";
import { writeWorkbookInThread } from "@/lib/server/workbook-thread";

const params = z.object({ id: rowId });

/**
 * The schedule workbook (.xlsx), streamed: `?revision=A` an issued revision (every role that sees the
 * project), no revision the current draft (owners and consultants; `?year=` its year).
 */
export const GET = endpoint(
  { auth: { project: "id", permission: "export:receive", action: "download schedule workbooks" }, params },
  async ({ project, membership, context }) => {
    const q = WorkbookQuery.parse(queryOf(context.url));
    if (!q.revision) requireDraftAccess(membership);
    const plan = await workbookPlan({ projectId: project.id, revision: q.revision ?? null, year: q.year });
    const out = new PassThrough();
    // Written on an export thread with a bounded heap (lib/server/workbook-thread); this thread only passes bytes on.
    writeWorkbookInThread(plan, out).catch((err: unknown) => {
      console.error(`[api] workbook of project ${project.id} failed while streaming:`, err);
      out.destroy(err instanceof Error ? err : new Error(String(err)));
    });
    return new Response(Readable.toWeb(out) as ReadableStream<Uint8Array>, {
      status: 200,
      headers: workbookHeaders(plan.fileName, XLSX_CONTENT_TYPE),
    });
  },
);
