// The validation report as CSV: one line per expected value (RFC 4180, header line).
import type { APIRoute } from "astro";
import { validationDownload } from "@/lib/server/validation-download";
import { reportCsv } from "@/lib/validation/report";

export const GET: APIRoute = () => validationDownload("text/csv; charset=utf-8", "paneray-validation.csv", reportCsv);
