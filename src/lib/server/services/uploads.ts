/**
 * Uploaded files and what is saved from them: measured panes into an organisation's library, and a project's
 * hourly weather series (one a project; a new upload replaces the old one and its file). The file is kept as
 * sent (bytes and SHA-256) in the same transaction as what was saved from it, so both are there or neither.
 */
import { and, desc, eq, inArray } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { libraryPane, libraryPaneRevision, project, upload, weatherSeries } from "@/lib/server/db/schema";
import type { PaneCreateRequest, PaneEntry } from "@/lib/contracts/library";
import type { IrradianceSource, UploadInfo, WeatherSummary } from "@/lib/contracts/uploads";
import { NotFoundError } from "@/lib/server/errors";
import { engineWeather, type StoredSeries, type WeatherCsvSeries } from "@/lib/server/uploads/weather-csv";
import { getPane } from "./library";
import { recordEvent, type Actor } from "./history";
import type { ProjectRow } from "./access";

/** An uploaded file as the HTTP edge read it. */
export interface FileInput {
  fileName: string;
  contentType: string;
  bytes: Buffer;
  sizeBytes: number;
  sha256: string;
}

type UploadRow = typeof upload.$inferSelect;

const uploadInfo = (u: Pick<UploadRow, "id" | "fileName" | "sizeBytes" | "sha256" | "rowCount" | "createdAt" | "createdByName">): UploadInfo => ({
  id: u.id,
  fileName: u.fileName,
  sizeBytes: u.sizeBytes,
  sha256: u.sha256,
  rowCount: u.rowCount,
  createdAt: u.createdAt.toISOString(),
  createdBy: u.createdByName,
});

/** Saves every pane of a validated file (each as revision 1) and the file itself, in one transaction. */
export async function importPanes(
  organizationId: string,
  actor: Actor,
  file: FileInput,
  panes: PaneCreateRequest[],
): Promise<{ panes: PaneEntry[]; upload: UploadInfo }> {
  const { ids, row } = await db.transaction(async (tx) => {
    const ids: string[] = [];
    for (const p of panes) {
      const [saved] = await tx.insert(libraryPane).values({ organizationId, name: p.name, revision: 1, createdById: actor.id }).returning();
      ids.push(saved!.id);
    }
    if (ids.length)
      await tx
        .insert(libraryPaneRevision)
        .values(panes.map((p, i) => ({ paneId: ids[i]!, revision: 1, name: p.name, layer: p.layer, note: p.note ?? null, createdById: actor.id })));
    const [row] = await tx
      .insert(upload)
      .values({
        organizationId,
        projectId: null,
        kind: "panes",
        fileName: file.fileName,
        contentType: file.contentType,
        sizeBytes: file.sizeBytes,
        sha256: file.sha256,
        content: file.bytes,
        rowCount: panes.length,
        summary: { paneIds: ids },
        createdById: actor.id,
        createdByName: actor.name,
      })
      .returning();
    return { ids, row: row! };
  });
  return { panes: await Promise.all(ids.map((id) => getPane(id))), upload: uploadInfo(row) };
}

const uploadColumns = {
  id: upload.id,
  fileName: upload.fileName,
  sizeBytes: upload.sizeBytes,
  sha256: upload.sha256,
  rowCount: upload.rowCount,
  createdAt: upload.createdAt,
  createdByName: upload.createdByName,
};

/** Replaces the project's weather series (and its file) with a validated one; records it in the history. */
export async function saveWeather(p: ProjectRow, actor: Actor, file: FileInput, w: WeatherCsvSeries): Promise<WeatherSummary> {
  await db.transaction(async (tx) => {
    // The project row lock orders two uploads to one project.
    await tx.select({ id: project.id }).from(project).where(eq(project.id, p.id)).for("update");
    const old = await tx
      .select({ id: upload.id })
      .from(upload)
      .where(and(eq(upload.projectId, p.id), eq(upload.kind, "weather")));
    if (old.length)
      await tx.delete(upload).where(
        inArray(
          upload.id,
          old.map((o) => o.id),
        ),
      );
    const [row] = await tx
      .insert(upload)
      .values({
        organizationId: p.organizationId,
        projectId: p.id,
        kind: "weather",
        fileName: file.fileName,
        contentType: file.contentType,
        sizeBytes: file.sizeBytes,
        sha256: file.sha256,
        content: file.bytes,
        rowCount: w.hours,
        summary: {
          from: new Date(w.fromMs).toISOString(),
          to: new Date(w.toMs).toISOString(),
          fromDate: w.fromDate,
          toDate: w.toDate,
          hours: w.hours,
          airTemperatureHours: w.series.airTemperatureC.filter((a) => a !== null).length,
        },
        createdById: actor.id,
        createdByName: actor.name,
      })
      .returning({ id: upload.id });
    await tx.insert(weatherSeries).values({
      projectId: p.id,
      uploadId: row!.id,
      fromTime: new Date(w.fromMs),
      toTime: new Date(w.toMs),
      stepMinutes: 60,
      series: w.series,
      hours: w.hours,
    });
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "weather.uploaded",
      summary: `Uploaded the weather file “${file.fileName}”: ${w.hours} hours from ${w.fromDate} to ${w.toDate}${old.length ? ", replacing the previous one" : ""}`,
      detail: { fileName: file.fileName, sha256: file.sha256, from: w.fromDate, to: w.toDate, hours: w.hours },
    });
  });
  return (await weatherOf(p.id))!;
}

/** The project's weather series without its hourly values, or null (clear sky). */
export async function weatherOf(projectId: string): Promise<WeatherSummary | null> {
  const row = (
    await db
      .select({
        w: { fromTime: weatherSeries.fromTime, toTime: weatherSeries.toTime, hours: weatherSeries.hours, stepMinutes: weatherSeries.stepMinutes },
        u: uploadColumns,
        summary: upload.summary,
      })
      .from(weatherSeries)
      .innerJoin(upload, eq(upload.id, weatherSeries.uploadId))
      .where(eq(weatherSeries.projectId, projectId))
  )[0];
  if (!row) return null;
  const s = row.summary as { fromDate: string; toDate: string; airTemperatureHours?: number };
  return {
    from: row.w.fromTime.toISOString(),
    to: row.w.toTime.toISOString(),
    fromDate: s.fromDate,
    toDate: s.toDate,
    hours: row.w.hours,
    stepMinutes: row.w.stepMinutes,
    airTemperatureHours: s.airTemperatureHours ?? 0,
    sha256: row.u.sha256,
    upload: uploadInfo(row.u),
  };
}

/** Removes the project's weather series and its file; the results go back to the clear-sky model. */
export async function deleteWeather(p: ProjectRow, actor: Actor): Promise<void> {
  await db.transaction(async (tx) => {
    const old = await tx
      .select({ id: upload.id, fileName: upload.fileName })
      .from(upload)
      .where(and(eq(upload.projectId, p.id), eq(upload.kind, "weather")));
    if (!old.length) throw new NotFoundError("This project has no weather file; its results use the clear-sky model");
    await tx.delete(upload).where(
      inArray(
        upload.id,
        old.map((o) => o.id),
      ),
    );
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "weather.removed",
      summary: `Removed the weather file “${old[0]!.fileName}”; results use the clear-sky model again`,
    });
  });
}

/** The weather file as it was uploaded. */
export async function weatherFileOf(projectId: string): Promise<{ fileName: string; contentType: string; content: Buffer; sha256: string }> {
  const row = (
    await db
      .select({ fileName: upload.fileName, contentType: upload.contentType, content: upload.content, sha256: upload.sha256 })
      .from(weatherSeries)
      .innerJoin(upload, eq(upload.id, weatherSeries.uploadId))
      .where(eq(weatherSeries.projectId, projectId))
  )[0];
  if (!row) throw new NotFoundError("This project has no weather file; its results use the clear-sky model");
  return row;
}

/** What the results need of a project's weather: where it came from and the engine's rows. */
export interface ResultsWeather {
  irradiance: Extract<IrradianceSource, { source: "weather series" }>;
  rows: ReturnType<typeof engineWeather>;
}

export async function weatherForResults(projectId: string): Promise<ResultsWeather | null> {
  const row = (
    await db
      .select({
        series: weatherSeries.series,
        from: weatherSeries.fromTime,
        to: weatherSeries.toTime,
        hours: weatherSeries.hours,
        fileName: upload.fileName,
        sha256: upload.sha256,
        summary: upload.summary,
      })
      .from(weatherSeries)
      .innerJoin(upload, eq(upload.id, weatherSeries.uploadId))
      .where(eq(weatherSeries.projectId, projectId))
  )[0];
  if (!row) return null;
  const s = row.summary as { fromDate: string; toDate: string };
  return {
    irradiance: {
      source: "weather series",
      fileName: row.fileName,
      sha256: row.sha256,
      from: row.from.toISOString(),
      to: row.to.toISOString(),
      fromDate: s.fromDate,
      toDate: s.toDate,
      hours: row.hours,
    },
    rows: engineWeather(row.series as StoredSeries),
  };
}

/** The library's uploaded pane files, newest first (at most 20). */
export async function paneUploadsOf(organizationId: string): Promise<UploadInfo[]> {
  const rows = await db
    .select(uploadColumns)
    .from(upload)
    .where(and(eq(upload.organizationId, organizationId), eq(upload.kind, "panes")))
    .orderBy(desc(upload.createdAt), desc(upload.id))
    .limit(20);
  return rows.map(uploadInfo);
}
