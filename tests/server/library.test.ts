// The glazing library against PostgreSQL: saved make-ups store the values the glazing calculation gives
// for their layers, every edit is a new revision, stale edits and deletes of make-ups in use are refused
// (409), roles and organisations are enforced by the routes.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { facade } from "@/lib/server/db/schema";
import { createProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { GlazingResponse } from "@/lib/contracts/glazing";
import type { MakeupEntry, PaneEntry } from "@/lib/contracts/library";
import { GET as listMakeups, POST as createMakeupRoute } from "@/pages/api/v1/orgs/[orgId]/makeups/index";
import { DELETE as deleteMakeupRoute, GET as getMakeupRoute, PATCH as patchMakeupRoute } from "@/pages/api/v1/makeups/[id]";
import { GET as listPanes, POST as createPaneRoute } from "@/pages/api/v1/orgs/[orgId]/panes/index";
import { DELETE as deletePaneRoute, GET as getPaneRoute, PATCH as patchPaneRoute } from "@/pages/api/v1/panes/[id]";
import { POST as glazingRoute } from "@/pages/api/v1/calc/glazing";
import { callRoute, invitedMember, newOwner, type RouteCaller } from "./helpers";
import { insertOption } from "./workspace-fixtures";

afterAll(() => pool.end());

type Caller = RouteCaller;
const call = (route: unknown, ...rest: Parameters<typeof callRoute> extends [unknown, ...infer R] ? R : never) =>
  callRoute(route as Parameters<typeof callRoute>[0], ...rest);
const member = invitedMember;

// Clear soda-lime float: n = 1.52, absorption 0.02 /mm (common practice, no source); the coated pane's
// values are invented test data with a low-e face (ε = 0.03) on its outdoor side, face #3 in the unit.
const clear = (thicknessMm: number) => ({ kind: "pane", thicknessMm, refractiveIndex: 1.52, absorptionPerMm: 0.02 });
const coated = {
  kind: "pane",
  thicknessMm: 4,
  emissivityFront: 0.03,
  measured: { solarTransmittance: 0.5, solarReflectanceFront: 0.3, solarReflectanceBack: 0.25 },
};
const argonGap = { kind: "gap", widthMm: 16, gas: { argon: 0.9, air: 0.1 } };
const layers = [clear(6), argonGap, coated];

let o: Awaited<ReturnType<typeof newOwner>>;
let owner: Caller;
let consultant: Caller;
let architect: Caller;
let client: Caller;
let outsider: Caller;
let created: MakeupEntry;

beforeAll(async () => {
  o = await newOwner("library");
  owner = { id: o.userId, name: "Test library", email: o.email };
  consultant = await member(o, "consultant");
  architect = await member(o, "architect");
  client = await member(o, "client");
  const other = await newOwner("library-outsider");
  outsider = { id: other.userId, name: "Outsider", email: other.email };
});

const makeupsPath = () => `/api/v1/orgs/${o.organizationId}/makeups`;

describe("saved make-ups", () => {
  it("are saved with a generated description and the values /api/v1/calc/glazing gives for their layers", async () => {
    const res = await call(
      createMakeupRoute,
      consultant,
      makeupsPath(),
      { orgId: o.organizationId },
      {
        method: "POST",
        body: { name: "Double low-e argon", layers, note: "Data sheet ref. TEST-1 (invented)" },
      },
    );
    expect(res.status).toBe(201);
    created = res.body as MakeupEntry;
    expect(created).toMatchObject({ revision: 1, latestRevision: 1, name: "Double low-e argon", description: "6 | 16 Ar 90% | 4 (m) low-e #3" });
    const g = await call(glazingRoute, consultant, "/api/v1/calc/glazing", {}, { method: "POST", body: { layers, anglesDeg: [0] } });
    const ref = g.body as GlazingResponse;
    const { angleDeg: _a, ...normal } = ref.angles[0]!;
    void _a;
    expect(created.values.normal).toEqual(normal);
    expect(created.values.hemispherical).toEqual(ref.hemispherical);
    expect(created.values.uValue).toBe(ref.uValue);
  });

  it("refuse bad layers with 400 naming the layer", async () => {
    const res = await call(
      createMakeupRoute,
      consultant,
      makeupsPath(),
      { orgId: o.organizationId },
      {
        method: "POST",
        body: { name: "Broken", layers: [clear(6), { kind: "gap", widthMm: 0.2, gas: "air" }, clear(4)] },
      },
    );
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/widthMm/);
  });

  it("list by name with the stored values; architects read, clients and other organisations do not", async () => {
    const list = await call(listMakeups, architect, makeupsPath(), { orgId: o.organizationId });
    expect(list.status).toBe(200);
    expect((list.body as { items: MakeupEntry[] }).items.map((m) => m.id)).toContain(created.id);
    expect((await call(listMakeups, client, makeupsPath(), { orgId: o.organizationId })).status).toBe(403);
    expect((await call(listMakeups, outsider, makeupsPath(), { orgId: o.organizationId })).status).toBe(404);
    expect((await call(getMakeupRoute, outsider, `/api/v1/makeups/${created.id}`, { id: created.id })).status).toBe(404);
    const post = await call(
      createMakeupRoute,
      architect,
      makeupsPath(),
      { orgId: o.organizationId },
      { method: "POST", body: { name: "x", layers } },
    );
    expect(post.status).toBe(403);
  });

  it("make a new revision on every edit and refuse a stale one with 409", async () => {
    const path = `/api/v1/makeups/${created.id}`;
    const edit = await call(
      patchMakeupRoute,
      consultant,
      path,
      { id: created.id },
      {
        method: "PATCH",
        body: { revision: 1, layers: [clear(8), argonGap, coated] },
      },
    );
    expect(edit.status).toBe(200);
    const r2 = edit.body as MakeupEntry;
    expect(r2).toMatchObject({ revision: 2, description: "8 | 16 Ar 90% | 4 (m) low-e #3" });
    // A thicker absorbing outer pane lets less of the sun through (Beer–Lambert).
    expect(r2.values.normal.solarTransmittance).toBeLessThan(created.values.normal.solarTransmittance);
    const staleEdit = await call(patchMakeupRoute, owner, path, { id: created.id }, { method: "PATCH", body: { revision: 1, name: "Late" } });
    expect(staleEdit.status).toBe(409);
    expect(JSON.stringify(staleEdit.body)).toMatch(/revision 2/);
    const old = await call(getMakeupRoute, architect, `${path}?revision=1`, { id: created.id });
    expect(old.body).toMatchObject({ revision: 1, latestRevision: 2, description: "6 | 16 Ar 90% | 4 (m) low-e #3" });
    expect((old.body as { revisions: { revision: number }[] }).revisions.map((r) => r.revision)).toEqual([2, 1]);
    expect((await call(patchMakeupRoute, architect, path, { id: created.id }, { method: "PATCH", body: { revision: 2, name: "A" } })).status).toBe(
      403,
    );
  });

  it("cannot be deleted while an option uses them (409 naming it), and can afterwards", async () => {
    const p = await createProject(
      ProjectCreateRequest.parse({
        organizationId: o.organizationId,
        name: "Library test block",
        siteName: "Plot",
        latitudeDeg: 50,
        longitudeDeg: 5,
        timeZone: "Europe/Brussels",
        facades: [{ name: "South", azimuthDeg: 180 }],
      }),
      o.userId,
    );
    const south = (await db.select().from(facade).where(eq(facade.projectId, p.id)))[0]!;
    const { getMakeup } = await import("@/lib/server/services/library");
    const entry = await getMakeup(created.id);
    const revRow = (await db.query.makeupRevision.findFirst({
      where: (r, { and, eq }) => and(eq(r.makeupId, entry.id), eq(r.revision, entry.revision)),
    }))!;
    await insertOption(p.id, south.id, { makeup: { id: entry.id }, revision: revRow } as never, "South option");
    const path = `/api/v1/makeups/${created.id}`;
    const refused = await call(deleteMakeupRoute, consultant, path, { id: created.id }, { method: "DELETE" });
    expect(refused.status).toBe(409);
    expect((refused.body as { detail: string }).detail).toMatch(/South option.*Library test block.*South/);
    const { facadeOption } = await import("@/lib/server/db/schema");
    await db.delete(facadeOption).where(eq(facadeOption.projectId, p.id));
    expect((await call(deleteMakeupRoute, architect, path, { id: created.id }, { method: "DELETE" })).status).toBe(403);
    expect((await call(deleteMakeupRoute, consultant, path, { id: created.id }, { method: "DELETE" })).status).toBe(204);
    expect((await call(getMakeupRoute, consultant, path, { id: created.id })).status).toBe(404);
  });

  it("warn that a pane described by glass properties with a low emissivity has unmodelled coating optics", async () => {
    const res = await call(
      createMakeupRoute,
      consultant,
      makeupsPath(),
      { orgId: o.organizationId },
      {
        method: "POST",
        body: { name: "Physical low-e", layers: [clear(6), argonGap, { ...clear(4), emissivityFront: 0.04 }] },
      },
    );
    expect(res.status).toBe(201);
    const entry = res.body as MakeupEntry;
    expect(entry.description).toBe("6 | 16 Ar 90% | 4 low-e #3");
    expect(entry.values.warnings.join(" ")).toMatch(/Pane 2 has a low-emissivity coating \(face #3\).*measured values/);
  });

  it("accept a measured pane with light transmittance alone and store its light values as a range with the reflectance unknown", async () => {
    // Invented data-sheet values: τv 0.70 given, no light reflectance.
    const tvOnly = { ...coated, measured: { ...coated.measured, visibleTransmittance: 0.7 } };
    const clearWithLight = {
      kind: "pane",
      thicknessMm: 6,
      measured: {
        solarTransmittance: 0.8,
        solarReflectanceFront: 0.07,
        solarReflectanceBack: 0.07,
        visibleTransmittance: 0.89,
        visibleReflectanceFront: 0.08,
        visibleReflectanceBack: 0.08,
      },
    };
    const res = await call(
      createMakeupRoute,
      consultant,
      makeupsPath(),
      { orgId: o.organizationId },
      { method: "POST", body: { name: "Light T only", layers: [clearWithLight, argonGap, tvOnly] } },
    );
    expect(res.status).toBe(201);
    const light = (res.body as MakeupEntry).values.light!;
    expect(light.basis).toBe("transmittance only");
    expect(light.transmittance).toBeNull();
    expect(light.reflectanceFront).toBeNull();
    // Adding method at normal incidence: low 0.89 × 0.70; high with the unknown face at 1 − 0.70 (see the bounds' reference test).
    expect(light.range!.low).toBeCloseTo(0.89 * 0.7, 12);
    expect(light.range!.high).toBeCloseTo((0.89 * 0.7) / (1 - 0.08 * 0.3), 12);
  });
});

describe("saved panes", () => {
  it("save, revise, refuse stale edits, and delete", async () => {
    const path = `/api/v1/orgs/${o.organizationId}/panes`;
    const res = await call(
      createPaneRoute,
      consultant,
      path,
      { orgId: o.organizationId },
      {
        method: "POST",
        body: { name: "Coated 4 mm", layer: { thicknessMm: 4, emissivityFront: 0.03, measured: coated.measured }, note: "Sheet X-4 (invented)" },
      },
    );
    expect(res.status).toBe(201);
    const pane = res.body as PaneEntry;
    expect(pane).toMatchObject({ revision: 1, description: "4 (m) low-e #1" });
    const bad = await call(
      createPaneRoute,
      consultant,
      path,
      { orgId: o.organizationId },
      {
        method: "POST",
        body: {
          name: "Bad",
          layer: { thicknessMm: 4, measured: { solarTransmittance: 0.8, solarReflectanceFront: 0.3, solarReflectanceBack: 0.1 } },
        },
      },
    );
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/must not exceed 1/);
    const one = `/api/v1/panes/${pane.id}`;
    const r2 = await call(patchPaneRoute, consultant, one, { id: pane.id }, { method: "PATCH", body: { revision: 1, name: "Coated 4 mm (2026)" } });
    expect(r2.body).toMatchObject({ revision: 2, name: "Coated 4 mm (2026)" });
    expect((await call(patchPaneRoute, consultant, one, { id: pane.id }, { method: "PATCH", body: { revision: 1, note: "x" } })).status).toBe(409);
    expect((await call(listPanes, client, path, { orgId: o.organizationId })).status).toBe(403);
    expect((await call(getPaneRoute, outsider, one, { id: pane.id })).status).toBe(404);
    expect((await call(deletePaneRoute, consultant, one, { id: pane.id }, { method: "DELETE" })).status).toBe(204);
  });
});
