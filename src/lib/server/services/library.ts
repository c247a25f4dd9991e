/**
 * The organisation's glazing library: saved make-ups and panes. Saving a make-up computes and stores
 * its values (normal and hemispherical τe, ρe both sides, each pane's α, g, τv where known, U); every
 * change writes a new revision row, so options and issued schedules keep the revision they point at.
 */
import { and, asc, eq, gt, inArray, or } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, libraryPane, libraryPaneRevision, makeup, makeupRevision, project, user } from "@/lib/server/db/schema";
import { ConflictError, NotFoundError } from "@/lib/server/errors";
import { runCalc, sharedCalcPool, type CalcPool } from "@/lib/server/calc-pool";
import { GlazingRequest, type Gap, type GlazingResponse, type Pane } from "@/lib/contracts/glazing";
import type {
  LibraryRevisionLine,
  MakeupCreateRequest,
  MakeupEntry,
  MakeupPatchRequest,
  PaneCreateRequest,
  PaneEntry,
  PanePatchRequest,
} from "@/lib/contracts/library";
import type { MakeupValues } from "@/lib/contracts/results";
import { pageOf, type Page, type PageQuery } from "@/lib/contracts/pagination";
import { makeupDescription } from "@/lib/calc/makeup-description";

export interface LibraryActor {
  id: string;
  name: string;
}

/** The values a make-up revision stores: the normal-incidence row, the hemispherical values, U and the warnings. */
export async function makeupValues(layers: (Pane | Gap)[], pool: CalcPool | null = sharedCalcPool()): Promise<MakeupValues> {
  const req = GlazingRequest.parse({ layers, anglesDeg: [0] });
  const g = await runCalc<"glazing", GlazingResponse>(pool, "glazing", req);
  const { angleDeg: _angle, ...normal } = g.angles[0]!;
  void _angle;
  return { normal, hemispherical: g.hemispherical, uValue: g.uValue, warnings: g.warnings, light: g.light };
}

type MakeupRow = typeof makeup.$inferSelect;
type MakeupRevisionRow = typeof makeupRevision.$inferSelect;

function makeupEntry(m: MakeupRow, r: MakeupRevisionRow, createdBy: string | null): MakeupEntry {
  return {
    id: m.id,
    organizationId: m.organizationId,
    revision: r.revision,
    latestRevision: m.revision,
    name: r.name,
    description: r.description,
    layers: r.layers as unknown[],
    note: r.note,
    values: r.values as MakeupValues,
    createdBy,
    createdAt: m.createdAt.toISOString(),
    updatedAt: r.createdAt.toISOString(),
  };
}

/** One page of the organisation's make-ups (current revisions), by name. */
export async function makeupsPage(organizationId: string, q: PageQuery): Promise<Page<MakeupEntry>> {
  const rows = await db
    .select({ m: makeup, r: makeupRevision, by: user.name })
    .from(makeup)
    .innerJoin(makeupRevision, and(eq(makeupRevision.makeupId, makeup.id), eq(makeupRevision.revision, makeup.revision)))
    .leftJoin(user, eq(user.id, makeupRevision.createdById))
    .where(
      and(
        eq(makeup.organizationId, organizationId),
        q.cursor ? or(gt(makeup.name, q.cursor.key), and(eq(makeup.name, q.cursor.key), gt(makeup.id, q.cursor.id))) : undefined,
      ),
    )
    .orderBy(asc(makeup.name), asc(makeup.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (row) => ({ key: row.m.name, id: row.m.id }));
  return { items: page.items.map((row) => makeupEntry(row.m, row.r, row.by)), nextCursor: page.nextCursor };
}

/** A make-up at its current revision, or at `revision`; NotFoundError when either does not exist. */
export async function getMakeup(id: string, revision?: number): Promise<MakeupEntry> {
  const row = (
    await db
      .select({ m: makeup, r: makeupRevision, by: user.name })
      .from(makeup)
      .innerJoin(makeupRevision, and(eq(makeupRevision.makeupId, makeup.id), eq(makeupRevision.revision, revision ?? makeup.revision)))
      .leftJoin(user, eq(user.id, makeupRevision.createdById))
      .where(eq(makeup.id, id))
  )[0];
  if (!row) throw new NotFoundError(revision ? `This make-up has no revision ${revision}` : "No such make-up in your library");
  return makeupEntry(row.m, row.r, row.by);
}

/** Every revision of a make-up, newest first. */
export async function makeupRevisions(id: string): Promise<LibraryRevisionLine[]> {
  const rows = await db
    .select({ revision: makeupRevision.revision, name: makeupRevision.name, by: user.name, at: makeupRevision.createdAt })
    .from(makeupRevision)
    .leftJoin(user, eq(user.id, makeupRevision.createdById))
    .where(eq(makeupRevision.makeupId, id))
    .orderBy(asc(makeupRevision.revision));
  return rows.reverse().map((r) => ({ revision: r.revision, name: r.name, createdBy: r.by, createdAt: r.at.toISOString() }));
}

export async function createMakeup(
  organizationId: string,
  actor: LibraryActor,
  input: MakeupCreateRequest,
  pool?: CalcPool | null,
): Promise<MakeupEntry> {
  const values = await makeupValues(input.layers, pool);
  const id = await db.transaction(async (tx) => {
    const [m] = await tx.insert(makeup).values({ organizationId, name: input.name, revision: 1, createdById: actor.id }).returning();
    await tx.insert(makeupRevision).values({
      makeupId: m!.id,
      revision: 1,
      name: input.name,
      description: makeupDescription(input.layers),
      layers: input.layers,
      note: input.note ?? null,
      values,
      createdById: actor.id,
    });
    return m!.id;
  });
  return getMakeup(id);
}

const stale = (what: string, sent: number, current: number) =>
  new ConflictError(
    `Someone saved revision ${current} of this ${what} after the revision ${sent} you edited; reload it and apply your change again.`,
    [{ field: "revision", message: `revision ${sent} is not the latest (${current})` }],
  );

/** Saves a new revision; ConflictError when `input.revision` is not the current one. */
export async function updateMakeup(id: string, actor: LibraryActor, input: MakeupPatchRequest, pool?: CalcPool | null): Promise<MakeupEntry> {
  const current = await getMakeup(id);
  if (input.revision !== current.latestRevision) throw stale("make-up", input.revision, current.latestRevision);
  const layers = (input.layers ?? current.layers) as (Pane | Gap)[];
  const values = input.layers ? await makeupValues(layers, pool) : current.values;
  await db.transaction(async (tx) => {
    // The row lock makes two saves of the same revision queue; the second then sees the new number.
    const [locked] = await tx.select({ revision: makeup.revision }).from(makeup).where(eq(makeup.id, id)).for("update");
    if (!locked) throw new NotFoundError("No such make-up in your library");
    if (locked.revision !== input.revision) throw stale("make-up", input.revision, locked.revision);
    const next = locked.revision + 1;
    const name = input.name ?? current.name;
    await tx.insert(makeupRevision).values({
      makeupId: id,
      revision: next,
      name,
      description: makeupDescription(layers),
      layers,
      note: input.note === undefined ? current.note : input.note,
      values,
      createdById: actor.id,
    });
    await tx.update(makeup).set({ revision: next, name }).where(eq(makeup.id, id));
  });
  return getMakeup(id);
}

/** The options (with their project and façade) that use a make-up. */
export async function optionsUsingMakeup(id: string): Promise<{ optionName: string; projectName: string; facadeName: string }[]> {
  return db
    .select({ optionName: facadeOption.name, projectName: project.name, facadeName: facade.name })
    .from(facadeOption)
    .innerJoin(project, eq(project.id, facadeOption.projectId))
    .innerJoin(facade, eq(facade.id, facadeOption.facadeId))
    .where(eq(facadeOption.makeupId, id))
    .orderBy(asc(project.name), asc(facade.position), asc(facadeOption.position));
}

/** Deletes a make-up and its revisions; ConflictError naming the options when any option uses it. */
export async function deleteMakeup(id: string): Promise<void> {
  const users = await optionsUsingMakeup(id);
  if (users.length) {
    const list = users.map((u) => `“${u.optionName}” (${u.projectName}, ${u.facadeName})`);
    throw new ConflictError(
      `This make-up is used by ${users.length === 1 ? "an option" : `${users.length} options`}: ${list.join("; ")}. Point them at another make-up or remove them first.`,
    );
  }
  try {
    await db.delete(makeup).where(eq(makeup.id, id));
  } catch (err) {
    // An option created meanwhile: the foreign key refuses (restrict).
    if ((err as { code?: string }).code === "23503") throw new ConflictError("An option started using this make-up just now; reload and try again.");
    throw err;
  }
}

type PaneRow = typeof libraryPane.$inferSelect;
type PaneRevisionRow = typeof libraryPaneRevision.$inferSelect;

function paneEntry(p: PaneRow, r: PaneRevisionRow, createdBy: string | null): PaneEntry {
  return {
    id: p.id,
    organizationId: p.organizationId,
    revision: r.revision,
    latestRevision: p.revision,
    name: r.name,
    description: makeupDescription([r.layer as Pane]),
    layer: r.layer,
    note: r.note,
    createdBy,
    createdAt: p.createdAt.toISOString(),
    updatedAt: r.createdAt.toISOString(),
  };
}

export async function panesPage(organizationId: string, q: PageQuery): Promise<Page<PaneEntry>> {
  const rows = await db
    .select({ p: libraryPane, r: libraryPaneRevision, by: user.name })
    .from(libraryPane)
    .innerJoin(libraryPaneRevision, and(eq(libraryPaneRevision.paneId, libraryPane.id), eq(libraryPaneRevision.revision, libraryPane.revision)))
    .leftJoin(user, eq(user.id, libraryPaneRevision.createdById))
    .where(
      and(
        eq(libraryPane.organizationId, organizationId),
        q.cursor ? or(gt(libraryPane.name, q.cursor.key), and(eq(libraryPane.name, q.cursor.key), gt(libraryPane.id, q.cursor.id))) : undefined,
      ),
    )
    .orderBy(asc(libraryPane.name), asc(libraryPane.id))
    .limit(q.limit + 1);
  const page = pageOf(rows, q.limit, (row) => ({ key: row.p.name, id: row.p.id }));
  return { items: page.items.map((row) => paneEntry(row.p, row.r, row.by)), nextCursor: page.nextCursor };
}

export async function getPane(id: string, revision?: number): Promise<PaneEntry> {
  const row = (
    await db
      .select({ p: libraryPane, r: libraryPaneRevision, by: user.name })
      .from(libraryPane)
      .innerJoin(
        libraryPaneRevision,
        and(eq(libraryPaneRevision.paneId, libraryPane.id), eq(libraryPaneRevision.revision, revision ?? libraryPane.revision)),
      )
      .leftJoin(user, eq(user.id, libraryPaneRevision.createdById))
      .where(eq(libraryPane.id, id))
  )[0];
  if (!row) throw new NotFoundError(revision ? `This pane has no revision ${revision}` : "No such pane in your library");
  return paneEntry(row.p, row.r, row.by);
}

export async function createPane(organizationId: string, actor: LibraryActor, input: PaneCreateRequest): Promise<PaneEntry> {
  const id = await db.transaction(async (tx) => {
    const [p] = await tx.insert(libraryPane).values({ organizationId, name: input.name, revision: 1, createdById: actor.id }).returning();
    await tx
      .insert(libraryPaneRevision)
      .values({ paneId: p!.id, revision: 1, name: input.name, layer: input.layer, note: input.note ?? null, createdById: actor.id });
    return p!.id;
  });
  return getPane(id);
}

export async function updatePane(id: string, actor: LibraryActor, input: PanePatchRequest): Promise<PaneEntry> {
  const current = await getPane(id);
  await db.transaction(async (tx) => {
    const [locked] = await tx.select({ revision: libraryPane.revision }).from(libraryPane).where(eq(libraryPane.id, id)).for("update");
    if (!locked) throw new NotFoundError("No such pane in your library");
    if (locked.revision !== input.revision) throw stale("pane", input.revision, locked.revision);
    const next = locked.revision + 1;
    const name = input.name ?? current.name;
    await tx.insert(libraryPaneRevision).values({
      paneId: id,
      revision: next,
      name,
      layer: input.layer ?? current.layer,
      note: input.note === undefined ? current.note : input.note,
      createdById: actor.id,
    });
    await tx.update(libraryPane).set({ revision: next, name }).where(eq(libraryPane.id, id));
  });
  return getPane(id);
}

/** Saved panes are copied into make-ups by value, so deleting one changes no make-up. */
export async function deletePane(id: string): Promise<void> {
  await db.delete(libraryPane).where(eq(libraryPane.id, id));
}

/** Which of these make-up ids belong to the organisation (for options pointing at them). */
export async function makeupsOfOrganization(organizationId: string, ids: string[]): Promise<Set<string>> {
  if (!ids.length) return new Set();
  const rows = await db
    .select({ id: makeup.id })
    .from(makeup)
    .where(and(eq(makeup.organizationId, organizationId), inArray(makeup.id, ids)));
  return new Set(rows.map((r) => r.id));
}
