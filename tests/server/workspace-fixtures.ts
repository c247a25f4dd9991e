// Workspace rows for the results and revision tests, inserted directly (the library and option routes are
// built elsewhere): saved make-ups with revisions whose values are what POST /calc/glazing computes, and options.
import { eq } from "drizzle-orm";
import { db } from "@/lib/server/db/client";
import { facadeOption, makeup, makeupRevision } from "@/lib/server/db/schema";
import { calculateGlazing } from "@/lib/calc/glazing";
import { GlazingRequest } from "@/lib/contracts/glazing";
import type { MakeupValues } from "@/lib/contracts/results";

/** Clear float: n = 1.52 and a low absorption coefficient (common practice (no source) for 4–6 mm clear glass). */
export const clear = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
export const tinted = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.15 });
/** A pane with measured values including the visible ones, so that τv is known. */
export const measuredClear = (thicknessMm: number) => ({
  kind: "pane",
  thicknessMm,
  measured: {
    solarTransmittance: 0.83,
    solarReflectanceFront: 0.075,
    solarReflectanceBack: 0.075,
    visibleTransmittance: 0.9,
    visibleReflectanceFront: 0.082,
    visibleReflectanceBack: 0.082,
  },
});
export const double = (outer: object, inner: object, gapMm = 16) => [outer, { kind: "gap", widthMm: gapMm, gas: "air" }, inner];

/** The values a saved make-up stores, computed the way the library does it (normal row, hemispherical, U). */
export function valuesOf(layers: unknown[]): MakeupValues {
  const g = calculateGlazing(GlazingRequest.parse({ layers, anglesDeg: [0] }));
  const { angleDeg: _a, ...normal } = g.angles[0]!;
  void _a;
  return { normal, hemispherical: g.hemispherical, uValue: g.uValue, warnings: g.warnings };
}

export async function insertMakeup(organizationId: string, name: string, layers: unknown[]) {
  const [m] = await db.insert(makeup).values({ organizationId, name }).returning();
  const [r] = await db
    .insert(makeupRevision)
    .values({ makeupId: m!.id, revision: 1, name, description: `${name} (test)`, layers, values: valuesOf(layers) })
    .returning();
  return { makeup: m!, revision: r! };
}

/** A library edit: a new revision row, and the make-up moved on to it. */
export async function editMakeup(makeupId: string, layers: unknown[]) {
  const m = (await db.select().from(makeup).where(eq(makeup.id, makeupId)))[0]!;
  const next = m.revision + 1;
  const [r] = await db
    .insert(makeupRevision)
    .values({ makeupId, revision: next, name: m.name, description: `${m.name} r${next} (test)`, layers, values: valuesOf(layers) })
    .returning();
  await db.update(makeup).set({ revision: next }).where(eq(makeup.id, makeupId));
  return r!;
}

export async function insertOption(
  projectId: string,
  facadeId: string,
  mk: { makeup: { id: string }; revision: { id: string } },
  name: string,
  status: "proposed" | "approved" | "rejected" = "proposed",
) {
  const [o] = await db
    .insert(facadeOption)
    .values({ projectId, facadeId, makeupId: mk.makeup.id, makeupRevisionId: mk.revision.id, name, status })
    .returning();
  return o!;
}
