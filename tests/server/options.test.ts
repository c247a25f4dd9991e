// Façade options and requirements against PostgreSQL: options point at the library's current make-up
// revision, stale writes answer 409, re-pointing withdraws an approval, every change is in the history,
// and the roles decide who may read and write.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { facade, facadeOption, projectEvent } from "@/lib/server/db/schema";
import { createProject, shareProject } from "@/lib/server/services/projects";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import type { OptionEntry } from "@/lib/contracts/options";
import { GET as listOptions, POST as createOptionRoute } from "@/pages/api/v1/projects/[id]/options/index";
import { DELETE as deleteOptionRoute, PATCH as patchOptionRoute } from "@/pages/api/v1/options/[id]/index";
import { GET as getRequirements, PUT as putRequirementsRoute } from "@/pages/api/v1/projects/[id]/requirements";
import { callRoute, invitedMember, newOwner, type RouteCaller } from "./helpers";
import { clear, double, editMakeup, insertMakeup, tinted } from "./workspace-fixtures";

afterAll(() => pool.end());

type Caller = RouteCaller;
const call = (route: unknown, ...rest: Parameters<typeof callRoute> extends [unknown, ...infer R] ? R : never) =>
  callRoute(route as Parameters<typeof callRoute>[0], ...rest);
const member = invitedMember;

let o: Awaited<ReturnType<typeof newOwner>>;
let consultant: Caller;
let architect: Caller;
let client: Caller;
let outsider: Caller;
let projectId: string;
let south: string;
let makeupA: Awaited<ReturnType<typeof insertMakeup>>;
let foreignMakeup: Awaited<ReturnType<typeof insertMakeup>>;
let option: OptionEntry;

beforeAll(async () => {
  o = await newOwner("options");
  consultant = await member(o, "consultant");
  architect = await member(o, "architect");
  client = await member(o, "client");
  const other = await newOwner("options-outsider");
  outsider = { id: other.userId, name: "Outsider", email: other.email };
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Options test block",
      siteName: "Plot",
      latitudeDeg: 45,
      longitudeDeg: 7,
      timeZone: "Europe/Rome",
      facades: [
        { name: "South", azimuthDeg: 180 },
        { name: "East", azimuthDeg: 90 },
      ],
    }),
    o.userId,
  );
  projectId = p.id;
  const clientMember = (await db.query.member.findFirst({ where: (m, { eq }) => eq(m.userId, client.id) }))!;
  await shareProject(p, clientMember.id, o.userId);
  south = (await db.select().from(facade).where(eq(facade.projectId, p.id))).find((f) => f.name === "South")!.id;
  makeupA = await insertMakeup(o.organizationId, "Clear double", double(clear(6), clear(4)));
  foreignMakeup = await insertMakeup(other.organizationId, "Not ours", double(clear(6), clear(4)));
});

const optionsPath = () => `/api/v1/projects/${projectId}/options`;

describe("façade options", () => {
  it("point at the make-up's current revision; consultants add them, architects and clients cannot", async () => {
    const res = await call(
      createOptionRoute,
      consultant,
      optionsPath(),
      { id: projectId },
      {
        method: "POST",
        body: { facadeId: south, makeupId: makeupA.makeup.id, name: "Clear double" },
      },
    );
    expect(res.status).toBe(201);
    option = (res.body as { option: OptionEntry }).option;
    expect(option).toMatchObject({ facadeId: south, makeupRevision: 1, latestMakeupRevision: 1, status: "proposed", version: 1 });
    expect(option.values.normal.solarTransmittance).toBeGreaterThan(0.6);
    const body = { facadeId: south, makeupId: makeupA.makeup.id, name: "x" };
    expect((await call(createOptionRoute, architect, optionsPath(), { id: projectId }, { method: "POST", body })).status).toBe(403);
    expect((await call(createOptionRoute, client, optionsPath(), { id: projectId }, { method: "POST", body })).status).toBe(403);
    expect((await call(createOptionRoute, outsider, optionsPath(), { id: projectId }, { method: "POST", body })).status).toBe(404);
  });

  it("refuse a make-up of another organisation and a façade of another project (400 naming the field)", async () => {
    const foreign = await call(
      createOptionRoute,
      consultant,
      optionsPath(),
      { id: projectId },
      {
        method: "POST",
        body: { facadeId: south, makeupId: foreignMakeup.makeup.id, name: "Sneaky" },
      },
    );
    expect(foreign.status).toBe(400);
    expect(JSON.stringify(foreign.body)).toMatch(/makeupId/);
    const wrongFacade = await call(
      createOptionRoute,
      consultant,
      optionsPath(),
      { id: projectId },
      {
        method: "POST",
        body: { facadeId: "no-such-facade", makeupId: makeupA.makeup.id, name: "Lost" },
      },
    );
    expect(wrongFacade.status).toBe(400);
    expect(JSON.stringify(wrongFacade.body)).toMatch(/facadeId/);
  });

  it("are read by architects but not by clients (drafts)", async () => {
    expect((await call(listOptions, architect, optionsPath(), { id: projectId })).status).toBe(200);
    expect((await call(listOptions, client, optionsPath(), { id: projectId })).status).toBe(403);
  });

  it("show that the library changed since, re-point to the latest revision, withdraw an approval, and refuse stale versions", async () => {
    await editMakeup(makeupA.makeup.id, double(clear(8), clear(4)));
    const listed = (await call(listOptions, consultant, optionsPath(), { id: projectId })).body as { options: OptionEntry[] };
    expect(listed.options.find((x) => x.id === option.id)).toMatchObject({ makeupRevision: 1, latestMakeupRevision: 2 });
    await db.update(facadeOption).set({ status: "approved" }).where(eq(facadeOption.id, option.id));
    const path = `/api/v1/options/${option.id}`;
    const res = await call(
      patchOptionRoute,
      consultant,
      path,
      { id: option.id },
      { method: "PATCH", body: { version: 1, makeupRevision: "latest" } },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ approvalWithdrawn: true, option: { makeupRevision: 2, status: "proposed", version: 2 } });
    const stale = await call(patchOptionRoute, consultant, path, { id: option.id }, { method: "PATCH", body: { version: 1, name: "Late" } });
    expect(stale.status).toBe(409);
    expect((await call(patchOptionRoute, architect, path, { id: option.id }, { method: "PATCH", body: { version: 2, name: "A" } })).status).toBe(403);
    expect((await call(patchOptionRoute, outsider, path, { id: option.id }, { method: "PATCH", body: { version: 2, name: "A" } })).status).toBe(404);
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, projectId));
    expect(events.map((e) => e.kind)).toEqual(expect.arrayContaining(["option.created", "option.repointed"]));
    expect(events.find((e) => e.kind === "option.repointed")!.summary).toMatch(/approval was withdrawn/);
  });

  it("are pointed at another make-up of the library, which withdraws an approval; a make-up of another organisation is refused", async () => {
    const makeupB = await insertMakeup(o.organizationId, "Tinted double", double(tinted(6), clear(6)));
    await db.update(facadeOption).set({ status: "approved" }).where(eq(facadeOption.id, option.id));
    const path = `/api/v1/options/${option.id}`;
    const foreign = await call(
      patchOptionRoute,
      consultant,
      path,
      { id: option.id },
      { method: "PATCH", body: { version: 2, makeupId: foreignMakeup.makeup.id } },
    );
    expect(foreign.status).toBe(400);
    expect((foreign.body as { errors: { field: string }[] }).errors.map((e) => e.field)).toEqual(["makeupId"]);
    const unchanged = (await db.select().from(facadeOption).where(eq(facadeOption.id, option.id)))[0]!;
    expect([unchanged.makeupId, unchanged.status, unchanged.version]).toEqual([makeupA.makeup.id, "approved", 2]);
    const res = await call(
      patchOptionRoute,
      consultant,
      path,
      { id: option.id },
      { method: "PATCH", body: { version: 2, makeupId: makeupB.makeup.id } },
    );
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({
      approvalWithdrawn: true,
      option: { makeupId: makeupB.makeup.id, makeupName: "Tinted double", makeupRevision: 1, status: "proposed", version: 3 },
    });
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, projectId));
    expect(events.map((e) => e.summary)).toContain(
      "Pointed “Clear double” at Tinted double, revision 1; its approval was withdrawn (the make-up changed)",
    );
  });

  it("are removed by consultants, with the removal in the history", async () => {
    const path = `/api/v1/options/${option.id}`;
    expect((await call(deleteOptionRoute, client, path, { id: option.id }, { method: "DELETE" })).status).toBe(403);
    expect((await call(deleteOptionRoute, consultant, path, { id: option.id }, { method: "DELETE" })).status).toBe(204);
    expect((await db.select().from(facadeOption).where(eq(facadeOption.id, option.id))).length).toBe(0);
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, projectId));
    expect(events.some((e) => e.kind === "option.deleted")).toBe(true);
  });
});

describe("requirements", () => {
  const path = () => `/api/v1/projects/${projectId}/requirements`;
  it("are saved with per-façade overrides and a version; stale versions, unknown façades and bad limits are refused", async () => {
    const put = await call(
      putRequirementsRoute,
      consultant,
      path(),
      { id: projectId },
      {
        method: "PUT",
        body: { project: { maxGValue: 0.4, minLightTransmittance: 0.6 }, facades: { [south]: { maxGValue: 0.3 } }, version: 0 },
      },
    );
    expect(put.status).toBe(200);
    expect(put.body).toMatchObject({ version: 1, project: { maxGValue: 0.4 }, facades: { [south]: { maxGValue: 0.3 } } });
    const stale = await call(putRequirementsRoute, consultant, path(), { id: projectId }, { method: "PUT", body: { project: {}, version: 0 } });
    expect(stale.status).toBe(409);
    const unknown = await call(
      putRequirementsRoute,
      consultant,
      path(),
      { id: projectId },
      { method: "PUT", body: { project: {}, facades: { nope: { maxUValue: 1 } } } },
    );
    expect(unknown.status).toBe(400);
    const bad = await call(putRequirementsRoute, consultant, path(), { id: projectId }, { method: "PUT", body: { project: { maxGValue: 1.5 } } });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/maxGValue/);
    expect((await call(putRequirementsRoute, architect, path(), { id: projectId }, { method: "PUT", body: { project: {} } })).status).toBe(403);
    expect((await call(getRequirements, architect, path(), { id: projectId })).status).toBe(200);
    expect((await call(getRequirements, client, path(), { id: projectId })).status).toBe(403);
  });
});
