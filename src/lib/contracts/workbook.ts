/** Query strings of the workbook downloads: GET /projects/:id/workbook and GET /projects/:id/workbook.csv. */
import { z } from "./zod";
import { rowId } from "./common";
import { ResultsYear } from "./revisions";

const REVISION_MESSAGE = "revision must be an issued revision's letter (A … Z, AA …), or left out for the current draft";

/** An issued revision's letter; omitted = the current draft (owners and consultants only). */
const revision = z
  .string({ error: REVISION_MESSAGE })
  .regex(/^[A-Z]{1,4}$/, REVISION_MESSAGE)
  .optional();

/** GET /projects/:id/workbook?revision=A (or ?year=YYYY for the draft; an issued revision keeps its own year). */
export const WorkbookQuery = z.object({ revision, year: ResultsYear.optional() });
export type WorkbookQuery = z.infer<typeof WorkbookQuery>;

export const WORKBOOK_TABLES = ["cover", "schedule", "hourly", "angles"] as const;

/**
 * GET /projects/:id/workbook.csv?revision=A&table=schedule: one table of the workbook as CSV. `hourly` and
 * `angles` name the façade (`facadeId`) whose approved option's hourly table or make-up's angular values to give.
 */
export const WorkbookCsvQuery = z
  .object({
    revision,
    year: ResultsYear.optional(),
    table: z.enum(WORKBOOK_TABLES, { error: `table must be one of ${WORKBOOK_TABLES.join(", ")}` }),
    facadeId: rowId.optional(),
  })
  .superRefine((q, ctx) => {
    if ((q.table === "hourly" || q.table === "angles") && !q.facadeId)
      ctx.addIssue({
        code: "custom",
        path: ["facadeId"],
        message: `facadeId is required for the ${q.table} table (the façade whose option it shows)`,
      });
  });
export type WorkbookCsvQuery = z.infer<typeof WorkbookCsvQuery>;
