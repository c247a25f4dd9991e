/**
 * Issued glazing schedules: immutable, lettered revisions (A, B, … Z, AA, AB …) of a project, each a
 * snapshot of every approved option with its make-up revision's layers and values, its results for the
 * year and its flags, who issued it and when. Nothing here ever updates a revision once written; editing
 * the library moves the make-up on to a new revision and leaves the snapshot as it was.
 */
import { and, asc, desc, eq, inArray, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, makeup, makeupRevision, project, scheduleRevision } from "@/lib/server/db/schema";
import { ConflictError, NotFoundError } from "@/lib/server/errors";
import type { RevisionFacadeSnapshot, RevisionResponse, RevisionSnapshot } from "@/lib/contracts/results";
import { revisionLetter } from "@/lib/contracts/revisions";
import { recordEvent, type Actor } from "./history";
import { projectResults, siteOf, type ProjectResultsOptions } from "./results";
import { weatherForResults } from "./uploads";

type RevisionRow = typeof scheduleRevision.$inferSelect;

export function revisionResponse(r: RevisionRow): RevisionResponse {
  // The stored weather rows stay on the server (a year of hours); the response says where they came from.
  const { weather: _weather, ...snapshot } = r.snapshot as RevisionSnapshot;
  void _weather;
  return {
    revision: r.letter,
    sequence: r.sequence,
    note: r.note,
    issuedAt: r.issuedAt.toISOString(),
    issuedBy: r.issuedByName,
    facades: snapshot.facades,
    snapshot,
    unapproved: snapshot.unapproved ?? [],
  };
}

/** Every issued revision of a project, newest first. */
export async function revisionsOf(projectId: string): Promise<RevisionResponse[]> {
  const rows = await db.select().from(scheduleRevision).where(eq(scheduleRevision.projectId, projectId)).orderBy(desc(scheduleRevision.sequence));
  return rows.map(revisionResponse);
}

/** The project's issued revisions as a list (letter, when, who, note, how many façades), newest first, without their snapshots. */
export async function revisionListOf(
  projectId: string,
): Promise<{ letter: string; issuedAt: string; issuedBy: string; note: string | null; facadeCount: number }[]> {
  const rows = await db
    .select({
      letter: scheduleRevision.letter,
      issuedAt: scheduleRevision.issuedAt,
      issuedBy: scheduleRevision.issuedByName,
      note: scheduleRevision.note,
      facadeCount: sql<number>`coalesce(jsonb_array_length(${scheduleRevision.snapshot} -> 'facades'), 0)::int`,
    })
    .from(scheduleRevision)
    .where(eq(scheduleRevision.projectId, projectId))
    .orderBy(desc(scheduleRevision.sequence));
  return rows.map((r) => ({ ...r, issuedAt: r.issuedAt.toISOString() }));
}

/** One issued revision by its letter; NotFoundError when the project has none of that letter. */
export async function revisionOf(projectId: string, letter: string): Promise<RevisionResponse> {
  const row = (
    await db
      .select()
      .from(scheduleRevision)
      .where(and(eq(scheduleRevision.projectId, projectId), eq(scheduleRevision.letter, letter)))
  )[0];
  if (!row) throw new NotFoundError(`This project has no revision ${letter}`);
  return revisionResponse(row);
}

/**
 * Issues the next revision: snapshots every approved option (one per façade at most) with its results
 * for `year`. Façades without an approved option are left out and listed as `unapproved`; when no façade
 * has one, ConflictError naming them. Records the issue in the project's history.
 */
export async function issueRevision(
  projectId: string,
  actor: Actor,
  input: { note: string | null; year: number },
  opts: Pick<ProjectResultsOptions, "pool"> = {},
): Promise<RevisionResponse> {
  const approved = await db
    .select({ id: facadeOption.id, facadeId: facadeOption.facadeId })
    .from(facadeOption)
    .where(and(eq(facadeOption.projectId, projectId), eq(facadeOption.status, "approved")));
  const facades = await db
    .select({ id: facade.id, name: facade.name })
    .from(facade)
    .where(eq(facade.projectId, projectId))
    .orderBy(asc(facade.position), asc(facade.createdAt), asc(facade.id));
  const approvedFacades = new Set(approved.map((a) => a.facadeId));
  const unapproved = facades.filter((f) => !approvedFacades.has(f.id)).map((f) => ({ facadeId: f.id, name: f.name }));
  if (approved.length === 0) {
    const names = unapproved.map((f) => `“${f.name}”`).join(", ");
    throw new ConflictError(
      facades.length === 0
        ? "This project has no façades, so there is nothing to issue."
        : `No façade has an approved option yet (${names}); an architect or owner approves one option per façade before a schedule is issued.`,
    );
  }

  // Results outside the transaction (the engine may take a moment); the snapshot re-checks the options below.
  const results = await projectResults(projectId, input.year, { pool: opts.pool, optionIds: approved.map((a) => a.id) });
  const irradiance = results.irradiance ?? { source: "clear sky" as const };
  const weather = irradiance.source === "weather series" ? await weatherForResults(projectId) : null;
  if (irradiance.source === "weather series" && weather?.irradiance.sha256 !== irradiance.sha256)
    throw new ConflictError("The project's weather file changed while the schedule was being issued; issue it again.");

  return db.transaction(async (tx) => {
    // One issuer at a time per project: the row lock orders concurrent issues, so letters never clash.
    const p = (await tx.select().from(project).where(eq(project.id, projectId)).for("update"))[0];
    if (!p) throw new NotFoundError("No such project, or it is not shared with you");
    const still = await tx
      .select({ option: facadeOption, layers: makeupRevision.layers, revisionId: makeupRevision.id })
      .from(facadeOption)
      .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId))
      .where(
        and(
          eq(facadeOption.projectId, projectId),
          eq(facadeOption.status, "approved"),
          inArray(
            facadeOption.id,
            approved.map((a) => a.id),
          ),
        ),
      );
    const current = new Map(still.map((s) => [s.option.id, s]));
    const snapshots: RevisionFacadeSnapshot[] = [];
    for (const f of results.facades) {
      for (const o of f.options) {
        const s = current.get(o.optionId);
        // An option re-pointed or un-approved while the results were computed: refuse rather than snapshot a mix.
        if (!s || s.option.makeupRevisionId !== s.revisionId || o.status !== "approved") {
          throw new ConflictError("An approved option changed while the schedule was being issued; issue it again.");
        }
        snapshots.push({
          facadeId: f.facadeId,
          facadeName: f.name,
          azimuthDeg: f.azimuthDeg,
          tiltDeg: f.tiltDeg,
          optionId: o.optionId,
          optionName: o.name,
          makeupId: o.makeupId,
          makeupRevision: o.makeupRevision,
          makeupName: o.makeupName,
          description: o.description,
          layers: s.layers as unknown[],
          values: o.values,
          annual: o.annual,
          peak: o.peak,
          monthly: o.monthly,
          flags: o.flags,
          glazedAreaM2: f.glazedAreaM2,
          shading: f.shading ?? null,
        });
      }
    }
    const last = (
      await tx
        .select({ sequence: scheduleRevision.sequence })
        .from(scheduleRevision)
        .where(eq(scheduleRevision.projectId, projectId))
        .orderBy(desc(scheduleRevision.sequence))
        .limit(1)
    )[0];
    const sequence = (last?.sequence ?? 0) + 1;
    const letter = revisionLetter(sequence);
    const snapshot: RevisionSnapshot = {
      year: results.year,
      site: siteOf(p),
      facades: snapshots,
      unapproved,
      irradiance,
      ...(weather ? { weather: weather.rows } : {}),
    };
    const [row] = await tx
      .insert(scheduleRevision)
      .values({ projectId, sequence, letter, note: input.note, issuedById: actor.id, issuedByName: actor.name, snapshot })
      .returning();
    await recordEvent(tx, {
      projectId,
      actor,
      kind: "revision.issued",
      summary: `Issued revision ${letter} (${snapshots.length} façade${snapshots.length === 1 ? "" : "s"}${unapproved.length ? `, ${unapproved.length} without an approved option` : ""})`,
      detail: {
        revision: letter,
        sequence,
        year: input.year,
        options: snapshots.map((s) => s.optionId),
        unapproved: unapproved.map((u) => u.facadeId),
      },
    });
    return revisionResponse(row!);
  });
}

/** A library make-up that has changed since it was issued in a revision, or since an option was pointed at it. */
export interface LibraryChange {
  makeupId: string;
  makeupName: string;
  /** The make-up revision in use (in the revision's snapshot, or the option's). */
  usedRevision: number;
  /** The library's current revision of the make-up. */
  currentRevision: number;
  facadeName: string;
  optionId: string;
  optionName: string;
  /** The issued revision's letter, or null when it is a project option (not yet issued) that lags behind. */
  since: string | null;
}

/**
 * Where the library has moved on: for the latest issued revision, each snapshot whose make-up has a newer
 * library revision; for the project's options, each one pointing at an older revision than the library's.
 * The project page shows these as "library item changed since revision X".
 */
export async function libraryChangesSince(projectId: string): Promise<LibraryChange[]> {
  const latest = (
    await db.select().from(scheduleRevision).where(eq(scheduleRevision.projectId, projectId)).orderBy(desc(scheduleRevision.sequence)).limit(1)
  )[0];
  const options = await db
    .select({
      option: facadeOption,
      usedRevision: makeupRevision.revision,
      currentRevision: makeup.revision,
      makeupName: makeup.name,
      facadeName: facade.name,
    })
    .from(facadeOption)
    .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId))
    .innerJoin(makeup, eq(makeup.id, facadeOption.makeupId))
    .innerJoin(facade, eq(facade.id, facadeOption.facadeId))
    .where(eq(facadeOption.projectId, projectId))
    .orderBy(asc(facade.position), asc(facadeOption.position), asc(facadeOption.id));
  const changes: LibraryChange[] = [];
  if (latest) {
    const snap = latest.snapshot as RevisionSnapshot;
    const ids = [...new Set(snap.facades.map((f) => f.makeupId))];
    const current = ids.length
      ? await db.select({ id: makeup.id, revision: makeup.revision, name: makeup.name }).from(makeup).where(inArray(makeup.id, ids))
      : [];
    const byId = new Map(current.map((m) => [m.id, m]));
    for (const f of snap.facades) {
      const m = byId.get(f.makeupId);
      if (m && m.revision !== f.makeupRevision) {
        changes.push({
          makeupId: f.makeupId,
          makeupName: m.name,
          usedRevision: f.makeupRevision,
          currentRevision: m.revision,
          facadeName: f.facadeName,
          optionId: f.optionId,
          optionName: f.optionName,
          since: latest.letter,
        });
      }
    }
  }
  for (const o of options) {
    if (o.usedRevision !== o.currentRevision) {
      changes.push({
        makeupId: o.option.makeupId,
        makeupName: o.makeupName,
        usedRevision: o.usedRevision,
        currentRevision: o.currentRevision,
        facadeName: o.facadeName,
        optionId: o.option.id,
        optionName: o.option.name,
        since: null,
      });
    }
  }
  return changes;
}
