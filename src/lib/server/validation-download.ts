/**
 * The validation report's downloads (/validation.csv, /validation.json): the cached report as a file, or a
 * problem response when it cannot be computed right now (a full calculation queue: 503 with Retry-After).
 */
import { QueueFullError } from "./calc-pool";
import { problem } from "./http";
import { validationReport } from "./validation-report";
import type { ValidationReport } from "@/lib/validation/report";

/** The report's file in one format, with its content type and download name. */
export async function validationDownload(contentType: string, fileName: string, serialize: (r: ValidationReport) => string): Promise<Response> {
  try {
    const report = await validationReport();
    return new Response(serialize(report), {
      headers: {
        "content-type": contentType,
        "content-disposition": `attachment; filename="${fileName}"`,
        "cache-control": "no-cache",
      },
    });
  } catch (err) {
    if (err instanceof QueueFullError) {
      const res = problem(503, "The calculations are busy; the validation report is computed as soon as there is room. Try again in a few seconds.");
      res.headers.set("retry-after", String(err.retryAfterS));
      return res;
    }
    console.error("[validation] report failed:", err);
    return problem(500, "The validation report could not be computed.");
  }
}
