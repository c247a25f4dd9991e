// Façade options for the browser tests, written straight to the database: a saved make-up with one revision and
// one option on the project's first façade (the routes that create options belong to another part of the API).
import { randomUUID } from "node:crypto";
import type pg from "pg";

export const CLEAR_DOUBLE_LAYERS = [
  { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 },
  { kind: "gap", widthMm: 16, gas: "air" },
  { kind: "pane", thicknessMm: 6, refractiveIndex: 1.52, absorptionPerMm: 0.02 },
];

/** Inserts a make-up, its revision and an option named `name` on the given façade (default: the project's first); returns their ids. */
export async function insertOption(
  db: pg.Client,
  projectId: string,
  name = "Fixture option",
  facadeId?: string,
): Promise<{ optionId: string; makeupId: string; facadeId: string }> {
  const p = (await db.query("select organization_id from project where id = $1", [projectId])).rows[0] as { organization_id: string };
  let f = facadeId
    ? { id: facadeId }
    : ((await db.query("select id from facade where project_id = $1 order by position, id limit 1", [projectId])).rows[0] as
        { id: string } | undefined);
  if (!f) {
    const id = randomUUID();
    await db.query("insert into facade (id, project_id, name, azimuth_deg) values ($1, $2, 'South', 180)", [id, projectId]);
    f = { id };
  }
  const makeupId = randomUUID();
  const revisionId = randomUUID();
  const optionId = randomUUID();
  await db.query("insert into makeup (id, organization_id, name) values ($1, $2, 'Clear double')", [makeupId, p.organization_id]);
  await db.query(
    "insert into makeup_revision (id, makeup_id, revision, name, description, layers, values) values ($1, $2, 1, 'Clear double', '6 | 16 air | 6', $3, $4)",
    [revisionId, makeupId, JSON.stringify(CLEAR_DOUBLE_LAYERS), JSON.stringify({ uValue: 2.7 })],
  );
  await db.query("insert into facade_option (id, project_id, facade_id, makeup_id, makeup_revision_id, name) values ($1, $2, $3, $4, $5, $6)", [
    optionId,
    projectId,
    f.id,
    makeupId,
    revisionId,
    name,
  ]);
  return { optionId, makeupId, facadeId: f.id };
}

/** Removes the fixture make-ups once their options have gone with their projects. */
export async function removeMakeups(db: pg.Client, makeupIds: string[]): Promise<void> {
  if (makeupIds.length === 0) return;
  await db.query("delete from facade_option where makeup_id = any($1)", [makeupIds]);
  await db.query("delete from makeup where id = any($1)", [makeupIds]);
}
