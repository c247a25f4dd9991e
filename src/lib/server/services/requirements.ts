/**
 * The brief's requirements of a project: the consultant's limits for the whole project and overrides per
 * façade, with a version for stale-write checks. Paneray ships no code values; the consultant enters them.
 */
import { eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facade, projectRequirements } from "@/lib/server/db/schema";
import { ConflictError, InvalidError } from "@/lib/server/errors";
import { REQUIREMENT_KEYS, REQUIREMENT_LABELS, type Limits, type RequirementsRequest } from "@/lib/contracts/requirements";
import type { ProjectRow } from "./access";
import { recordEvent, type Actor } from "./history";

export interface RequirementsEntry {
  project: Limits;
  facades: Record<string, Limits>;
  /** 0 while nothing has been entered. */
  version: number;
  updatedAt: string | null;
}

export async function requirementsEntry(projectId: string): Promise<RequirementsEntry> {
  const row = (await db.select().from(projectRequirements).where(eq(projectRequirements.projectId, projectId)))[0];
  const limits = (row?.limits ?? {}) as { project?: Limits; facades?: Record<string, Limits> };
  return {
    project: limits.project ?? {},
    facades: limits.facades ?? {},
    version: row?.version ?? 0,
    updatedAt: row?.updatedAt.toISOString() ?? null,
  };
}

const describe = (l: Limits) =>
  REQUIREMENT_KEYS.filter((k) => l[k] !== undefined)
    .map((k) => `${REQUIREMENT_LABELS[k]} ${l[k]}`)
    .join(", ") || "none";

/** Replaces the project's requirements; façade keys must be façades of the project; a stale version is a ConflictError. */
export async function putRequirements(p: ProjectRow, actor: Actor, input: RequirementsRequest): Promise<RequirementsEntry> {
  const facades = await db.select({ id: facade.id, name: facade.name }).from(facade).where(eq(facade.projectId, p.id));
  const names = new Map(facades.map((f) => [f.id, f.name]));
  for (const id of Object.keys(input.facades)) {
    if (!names.has(id))
      throw new InvalidError(`facades.${id}`, "not a façade of this project", "Façade overrides name a façade that is not part of this project");
  }
  // Overrides with no limit in them are dropped: they would override nothing.
  const overrides = Object.fromEntries(Object.entries(input.facades).filter(([, l]) => Object.keys(l).length > 0));
  await db.transaction(async (tx) => {
    const [current] = await tx.select().from(projectRequirements).where(eq(projectRequirements.projectId, p.id)).for("update");
    const currentVersion = current?.version ?? 0;
    if (input.version !== undefined && input.version !== currentVersion)
      throw new ConflictError(
        `Someone changed the requirements (version ${currentVersion}) after the version ${input.version} you edited; reload them.`,
        [{ field: "version", message: `version ${input.version} is not the latest (${currentVersion})` }],
      );
    const limits = { project: input.project, facades: overrides };
    if (current)
      await tx
        .update(projectRequirements)
        .set({ limits, version: currentVersion + 1, updatedById: actor.id })
        .where(eq(projectRequirements.projectId, p.id));
    else await tx.insert(projectRequirements).values({ projectId: p.id, limits, version: 1, updatedById: actor.id });
    const facadeText = Object.entries(overrides).map(([id, l]) => `${names.get(id)}: ${describe(l)}`);
    await recordEvent(tx, {
      projectId: p.id,
      actor,
      kind: "requirements.updated",
      summary: `Set the requirements: project ${describe(input.project)}${facadeText.length ? `; ${facadeText.join("; ")}` : ""}`,
      detail: limits,
    });
  });
  return requirementsEntry(p.id);
}
