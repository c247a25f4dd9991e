// Make-ups and façade options for the browser tests, written straight into the test database (the library
// and option routes are tested on their own): a saved make-up whose values are what POST /calc/glazing gives.
import pg from "pg";
import { calculateGlazing } from "@/lib/calc/glazing";
import { GlazingRequest } from "@/lib/contracts/glazing";

let client: pg.Client | null = null;
async function db(): Promise<pg.Client> {
  if (client) return client;
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run the tests through npm test");
  client = new pg.Client({ connectionString: url });
  await client.connect();
  return client;
}
export async function closeWorkspaceRows(): Promise<void> {
  await client?.end();
  client = null;
}

export const clearPane = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
export const tintedPane = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.15 });
export const doubleUnit = (outer: object, inner: object) => [outer, { kind: "gap", widthMm: 16, gas: "air" }, inner];

function valuesOf(layers: unknown[]) {
  const g = calculateGlazing(GlazingRequest.parse({ layers, anglesDeg: [0] }));
  const { angleDeg: _a, ...normal } = g.angles[0]!;
  void _a;
  return { normal, hemispherical: g.hemispherical, uValue: g.uValue, warnings: g.warnings };
}

/** A saved make-up of the organisation (revision 1). */
export async function insertMakeupRow(organizationId: string, name: string, layers: unknown[]) {
  const c = await db();
  const id = crypto.randomUUID();
  const revisionId = crypto.randomUUID();
  await c.query("insert into makeup (id, organization_id, name) values ($1, $2, $3)", [id, organizationId, name]);
  await c.query("insert into makeup_revision (id, makeup_id, revision, name, description, layers, values) values ($1, $2, 1, $3, $4, $5, $6)", [
    revisionId,
    id,
    name,
    `${name} (test)`,
    JSON.stringify(layers),
    JSON.stringify(valuesOf(layers)),
  ]);
  return { id, revisionId };
}

/** An option of a façade pointing at a make-up's revision. */
export async function insertOptionRow(
  projectId: string,
  facadeId: string,
  mk: { id: string; revisionId: string },
  name: string,
  status: "proposed" | "approved" = "proposed",
): Promise<string> {
  const id = crypto.randomUUID();
  await (
    await db()
  ).query("insert into facade_option (id, project_id, facade_id, makeup_id, makeup_revision_id, name, status) values ($1, $2, $3, $4, $5, $6, $7)", [
    id,
    projectId,
    facadeId,
    mk.id,
    mk.revisionId,
    name,
    status,
  ]);
  return id;
}

/** Removes saved make-ups made by a test (their projects, and so their options, deleted first). */
export async function deleteMakeupRows(ids: readonly string[]): Promise<void> {
  if (ids.length) await (await db()).query("delete from makeup where id = any($1)", [ids]);
}
