/**
 * The schedule workbook of a project: an issued revision (or the current draft) as an .xlsx, written with
 * exceljs' streaming writer so that memory stays flat however many hourly rows it holds.
 *
 * `writeWorkbook` streams into any writable (the download route); `workbookFile` builds the whole file in
 * memory for an e-mail attachment (the delivery worker), with its SHA-256. Access is checked by the caller.
 */
import { createHash } from "node:crypto";
import { PassThrough, type Writable } from "node:stream";
import ExcelJS from "exceljs";
import { revisionOf } from "./revisions";
import { eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { project } from "@/lib/server/db/schema";
import { NotFoundError } from "@/lib/server/errors";

export interface WorkbookRequest {
  projectId: string;
  /** An issued revision's letter; null = the current draft (owners and consultants only, checked by the caller). */
  revision: string | null;
}

export interface WorkbookFile {
  fileName: string;
  bytes: Buffer;
  sha256: string;
}

/** "Cordage-Works-refurbishment_rev-A.xlsx": letters, digits and dashes only. */
export function workbookFileName(projectName: string, revision: string | null): string {
  const base =
    projectName
      .normalize("NFKD")
      .replace(/[^\w-]+/g, "-")
      .replace(/-+/g, "-")
      .replace(/^-|-$/g, "") || "project";
  return `${base}_${revision ? `rev-${revision}` : "DRAFT"}.xlsx`;
}

/** Text that a spreadsheet would read as a formula starts with ' (shown as typed, never evaluated). */
export function safeText(value: string | null | undefined): string {
  if (!value) return "";
  return /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
}

/** Streams the workbook into `out`; resolves with its file name once the last byte is written. */
export async function writeWorkbook(req: WorkbookRequest, out: Writable): Promise<{ fileName: string }> {
  const p = (await db.select().from(project).where(eq(project.id, req.projectId)))[0];
  if (!p) throw new NotFoundError("No such project");
  if (req.revision === null) throw new Error("writeWorkbook: the draft workbook is not written yet");
  const rev = await revisionOf(req.projectId, req.revision);
  const wb = new ExcelJS.stream.xlsx.WorkbookWriter({ stream: out, useStyles: true, useSharedStrings: false });
  wb.creator = "Paneray";
  const cover = wb.addWorksheet("Cover");
  cover.addRow(["Project", safeText(p.name)]).commit();
  cover.addRow(["Revision", rev.revision]).commit();
  cover.addRow(["Issued", rev.issuedAt, "by", safeText(rev.issuedBy)]).commit();
  cover.addRow(["Site", safeText(rev.snapshot.site.name)]).commit();
  cover.addRow(["Latitude (°)", rev.snapshot.site.latitudeDeg]).commit();
  cover.addRow(["Longitude (°)", rev.snapshot.site.longitudeDeg]).commit();
  cover.addRow(["Time zone", rev.snapshot.site.timeZone]).commit();
  cover.addRow(["Elevation (m)", rev.snapshot.site.elevationM]).commit();
  cover.addRow([]).commit();
  cover
    .addRow(["These are estimates for comparing options, not certified or declared values; local codes and licensed professionals decide."])
    .commit();
  cover.commit();
  const schedule = wb.addWorksheet("Glazing schedule");
  schedule.addRow(["Façade", "Azimuth (°)", "Option", "Make-up", "τe (−)", "ρe outdoor side (−)", "g (−)", "U (W/(m²K))"]).commit();
  for (const f of rev.facades) {
    schedule
      .addRow([
        safeText(f.facadeName),
        f.azimuthDeg,
        safeText(f.optionName),
        safeText(f.description),
        f.values.normal.solarTransmittance,
        f.values.normal.solarReflectanceFront,
        f.values.normal.gValue,
        f.values.uValue,
      ])
      .commit();
  }
  schedule.commit();
  await wb.commit();
  return { fileName: workbookFileName(p.name, rev.revision) };
}

/** The whole workbook in memory, for an attachment. */
export async function workbookFile(req: WorkbookRequest): Promise<WorkbookFile> {
  const sink = new PassThrough();
  const chunks: Buffer[] = [];
  sink.on("data", (c: Buffer) => chunks.push(c));
  const ended = new Promise<void>((resolve, reject) => {
    sink.on("end", resolve);
    sink.on("error", reject);
  });
  const { fileName } = await writeWorkbook(req, sink);
  await ended;
  const bytes = Buffer.concat(chunks);
  return { fileName, bytes, sha256: createHash("sha256").update(bytes).digest("hex") };
}
