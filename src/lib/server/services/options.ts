/**
 * A façade's options: candidate make-ups of the organisation's library, each pointing at one make-up
 * revision. Writes check the option's version (409 when stale) and record the change in the project's
 * history in the same transaction. Re-pointing an approved option sends it back to "proposed": the
 * approval was given to the make-up revision it pointed at.
 */
import { and, asc, eq, sql } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, facadeOption, makeup, makeupRevision, type FacadeOption } from "@/lib/server/db/schema";
import { ConflictError, InvalidError, NotFoundError } from "@/lib/server/errors";
import type { OptionCreateRequest, OptionEntry, OptionPatchRequest } from "@/lib/contracts/options";
import type { MakeupValues } from "@/lib/contracts/results";
import type { ProjectRow } from "./access";
import { recordEvent, type Actor } from "./history";

const columns = {
  o: facadeOption,
  makeupName: makeup.name,
  latest: makeup.revision,
  revision: makeupRevision.revision,
  description: makeupRevision.description,
  layers: makeupRevision.layers,
  values: makeupRevision.values,
};

type Joined = { o: FacadeOption; makeupName: string; latest: number; revision: number; description: string; layers: unknown; values: unknown };

function entry(r: Joined): OptionEntry {
  return {
    id: r.o.id,
    projectId: r.o.projectId,
    facadeId: r.o.facadeId,
    name: r.o.name,
    position: r.o.position,
    status: r.o.status,
    version: r.o.version,
    makeupId: r.o.makeupId,
    makeupName: r.makeupName,
    makeupRevision: r.revision,
    latestMakeupRevision: r.latest,
    description: r.description,
    layers: r.layers as unknown[],
    values: r.values as MakeupValues,
    createdAt: r.o.createdAt.toISOString(),
    updatedAt: r.o.updatedAt.toISOString(),
  };
}

const joined = () =>
  db
    .select(columns)
    .from(facadeOption)
    .innerJoin(makeup, eq(makeup.id, facadeOption.makeupId))
    .innerJoin(makeupRevision, eq(makeupRevision.id, facadeOption.makeupRevisionId));

/** Every option of a project, by façade order then option position. */
export async function optionsOf(projectId: string): Promise<OptionEntry[]> {
  const rows = await joined()
    .innerJoin(facade, eq(facade.id, facadeOption.facadeId))
    .where(eq(facadeOption.projectId, projectId))
    .orderBy(asc(facade.position), asc(facade.createdAt), asc(facadeOption.position), asc(facadeOption.createdAt));
  return rows.map(entry);
}

export async function optionEntry(id: string): Promise<OptionEntry> {
  const row = (await joined().where(eq(facadeOption.id, id)))[0];
  if (!row) throw new NotFoundError("No such option");
  return entry(row);
}

/** The current revision of a make-up of the organisation; InvalidError naming `makeupId` otherwise. */
async function currentRevision(organizationId: string, makeupId: string): Promise<{ id: string; name: string; revision: number }> {
  const row = (
    await db
      .select({ id: makeupRevision.id, name: makeup.name, revision: makeupRevision.revision })
      .from(makeup)
      .innerJoin(makeupRevision, and(eq(makeupRevision.makeupId, makeup.id), eq(makeupRevision.revision, makeup.revision)))
      .where(and(eq(makeup.id, makeupId), eq(makeup.organizationId, organizationId)))
  )[0];
  if (!row)
    throw new InvalidError("makeupId", "no such make-up in this organisation's library", "The chosen make-up is not in this organisation's library");
  return row;
}

export async function createOption(p: ProjectRow, actor: Actor, input: OptionCreateRequest): Promise<OptionEntry> {
  const f = (
    await db
      .select()
      .from(facade)
      .where(and(eq(facade.id, input.facadeId), eq(facade.projectId, p.id)))
  )[0];
  if (!f) throw new InvalidError("facadeId", "no such façade in this project", "The chosen façade is not part of this project");
  const rev = await currentRevision(p.organizationId, input.makeupId);
  const id = await db.transaction(async (tx) => {
    const [{ next }] = (await tx
      .select({ next: sql<number>`coalesce(max(${facadeOption.position}) + 1, 0)::int` })
      .from(facadeOption)
      .where(eq(facadeOption.facadeId, f.id))) as [{ next: number }];
    const [row] = await tx
      .insert(facadeOption)
      .values({
        projectId: p.id,
        facadeId: f.id,
        makeupId: input.makeupId,
        makeupRevisionId: rev.id,
        name: input.name,
        position: next,
        createdById: actor.id,
      })
      .returning();
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "option.created",
      summary: `Added option “${input.name}” (${rev.name}, revision ${rev.revision}) to ${f.name}`,
      detail: { optionId: row!.id, facadeId: f.id, makeupId: input.makeupId, makeupRevision: rev.revision },
    });
    return row!.id;
  });
  return optionEntry(id);
}

const staleOption = (sent: number, current: number) =>
  new ConflictError(`Someone changed this option (version ${current}) after the version ${sent} you edited; reload and try again.`, [
    { field: "version", message: `version ${sent} is not the latest (${current})` },
  ]);

/** Renames, re-points or moves an option; a changed make-up revision sends an approved option back to "proposed". */
export async function updateOption(
  p: ProjectRow,
  option: FacadeOption,
  actor: Actor,
  input: OptionPatchRequest,
): Promise<{ option: OptionEntry; approvalWithdrawn: boolean }> {
  const rev =
    input.makeupId !== undefined
      ? await currentRevision(p.organizationId, input.makeupId)
      : input.makeupRevision === "latest"
        ? await currentRevision(p.organizationId, option.makeupId)
        : null;
  const repointed = rev !== null && rev.id !== option.makeupRevisionId;
  let approvalWithdrawn = false;
  await db.transaction(async (tx) => {
    const [locked] = await tx.select().from(facadeOption).where(eq(facadeOption.id, option.id)).for("update");
    if (!locked) throw new NotFoundError("No such option");
    if (locked.version !== input.version) throw staleOption(input.version, locked.version);
    approvalWithdrawn = repointed && locked.status === "approved";
    await tx
      .update(facadeOption)
      .set({
        version: locked.version + 1,
        ...(input.name !== undefined ? { name: input.name } : {}),
        ...(input.position !== undefined ? { position: input.position } : {}),
        ...(repointed ? { makeupId: input.makeupId ?? locked.makeupId, makeupRevisionId: rev!.id } : {}),
        ...(approvalWithdrawn ? { status: "proposed" as const } : {}),
      })
      .where(eq(facadeOption.id, option.id));
    const changes = [
      input.name !== undefined && input.name !== locked.name ? `renamed “${locked.name}” to “${input.name}”` : null,
      repointed ? `pointed “${input.name ?? locked.name}” at ${rev!.name}, revision ${rev!.revision}` : null,
      approvalWithdrawn ? "its approval was withdrawn (the make-up changed)" : null,
      input.position !== undefined && input.position !== locked.position
        ? `moved “${input.name ?? locked.name}” to position ${input.position + 1}`
        : null,
    ].filter(Boolean);
    if (changes.length)
      await recordEvent(tx, {
        projectId: p.id,
        actor,
        kind: repointed ? "option.repointed" : "option.updated",
        summary: changes.join("; ").replace(/^./, (c) => c.toUpperCase()),
        detail: { optionId: option.id, ...(repointed ? { makeupRevision: rev!.revision } : {}) },
      });
  });
  return { option: await optionEntry(option.id), approvalWithdrawn };
}

export async function deleteOption(p: ProjectRow, option: FacadeOption, actor: Actor): Promise<void> {
  await db.transaction(async (tx) => {
    const f = (await tx.select({ name: facade.name }).from(facade).where(eq(facade.id, option.facadeId)))[0];
    await tx.delete(facadeOption).where(eq(facadeOption.id, option.id));
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "option.deleted",
      summary: `Removed option “${option.name}” from ${f?.name ?? "a façade"}${option.status === "approved" ? " (it was approved)" : ""}`,
      detail: { optionId: option.id },
    });
  });
}
