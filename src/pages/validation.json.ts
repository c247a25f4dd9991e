// The validation report as JSON: versions, time and duration, totals, per-domain summaries and every row.
import type { APIRoute } from "astro";
import { validationDownload } from "@/lib/server/validation-download";
import { reportJson } from "@/lib/validation/report";

export const GET: APIRoute = () => validationDownload("application/json; charset=utf-8", "paneray-validation.json", reportJson);
