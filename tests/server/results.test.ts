// Project results, the comparison and issued revisions against PostgreSQL: results equal what the calculation
// endpoints give for the same inputs, the cache hits and misses with its inputs, issued revisions stay frozen.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { facade, facadeOption, project, projectEvent, projectRequirements, resultCache, scheduleRevision } from "@/lib/server/db/schema";
import { createProject, shareProject, projectsForUser } from "@/lib/server/services/projects";
import { projectResults } from "@/lib/server/services/results";
import { issueRevision, libraryChangesSince } from "@/lib/server/services/revisions";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { COMPARE_ANGLES_DEG, revisionLetter } from "@/lib/contracts/revisions";
import type { CompareResponse, ResultsResponse, RevisionResponse } from "@/lib/contracts/results";
import type { ScheduleResponse } from "@/lib/contracts/schedule";
import type { GlazingResponse } from "@/lib/contracts/glazing";
import { GET as resultsRoute } from "@/pages/api/v1/projects/[id]/results";
import { GET as compareRoute } from "@/pages/api/v1/projects/[id]/compare";
import { GET as listRevisions, POST as issueRoute } from "@/pages/api/v1/projects/[id]/revisions/index";
import { GET as revisionRoute } from "@/pages/api/v1/projects/[id]/revisions/[rev]";
import { POST as scheduleRoute } from "@/pages/api/v1/calc/schedule";
import { POST as glazingRoute } from "@/pages/api/v1/calc/glazing";
import { callRoute, invitedMember, newOwner } from "./helpers";
import { clear, double, editMakeup, insertMakeup, insertOption, measuredClear, tinted } from "./workspace-fixtures";

afterAll(() => pool.end());

const YEAR = 2025;
/** A site of this run's own (cache rows are shared by equal inputs, so a rerun on the same database must not meet the last run's). */
const LONGITUDE = -9.14 + Math.round(Math.random() * 1e6) / 1e9;
type Caller = { id: string; name: string; email: string };
type Route = typeof resultsRoute;

const call = (route: Route, caller: Caller, path: string, params: Record<string, string>, init: { method?: string; body?: unknown } = {}) =>
  callRoute(route as Parameters<typeof callRoute>[0], caller, path, params, init) as Promise<{ status: number; body: any }>; // eslint-disable-line @typescript-eslint/no-explicit-any -- each test reads its own response shape
const member = invitedMember;

let o: Awaited<ReturnType<typeof newOwner>>;
let owner: Caller;
let consultant: Caller;
let architect: Caller;
let client: Caller;
let projectId: string;
let north: string;
let west: string;
const mk = {} as Record<"clear" | "tinted" | "measured", Awaited<ReturnType<typeof insertMakeup>>>;
const opt = {} as Record<"northClear" | "northTinted" | "westClear" | "westMeasured", string>;

beforeAll(async () => {
  o = await newOwner("results");
  owner = { id: o.userId, name: "Test results", email: o.email };
  consultant = await member(o, "consultant");
  architect = await member(o, "architect");
  client = await member(o, "client");
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Results test block",
      siteName: "Test plot",
      latitudeDeg: 38.7,
      longitudeDeg: LONGITUDE,
      timeZone: "Europe/Lisbon",
      elevationM: 50,
      facades: [
        { name: "North", azimuthDeg: 0 },
        { name: "West", azimuthDeg: 270 },
      ],
    }),
    o.userId,
  );
  projectId = p.id;
  const fs = await db.select().from(facade).where(eq(facade.projectId, p.id));
  north = fs.find((f) => f.name === "North")!.id;
  west = fs.find((f) => f.name === "West")!.id;
  // West has a window under a 0.6 m overhang; the site has a monthly turbidity and the isotropic sky.
  await db
    .update(facade)
    .set({ windowWidthM: 1.5, windowHeightM: 2, glazedAreaM2: 120, shading: { overhang: { depthM: 0.6, gapAboveM: 0.2 } } })
    .where(eq(facade.id, west));
  await db
    .update(project)
    .set({ groundAlbedo: 0.25, skyModel: "isotropic", linkeTurbidity: [3, 3.2, 3.5, 3.8, 4, 4.1, 4.2, 4.1, 3.9, 3.6, 3.2, 3] })
    .where(eq(project.id, p.id));
  mk.clear = await insertMakeup(o.organizationId, "Clear double", double(clear(6), clear(4)));
  mk.tinted = await insertMakeup(o.organizationId, "Tinted double", double(tinted(6), clear(4)));
  mk.measured = await insertMakeup(o.organizationId, "Measured double", double(measuredClear(6), measuredClear(4)));
  opt.northClear = (await insertOption(p.id, north, mk.clear, "N clear")).id;
  opt.northTinted = (await insertOption(p.id, north, mk.tinted, "N tinted")).id;
  opt.westClear = (await insertOption(p.id, west, mk.clear, "W clear")).id;
  opt.westMeasured = (await insertOption(p.id, west, mk.measured, "W measured")).id;
});

const optionOf = (r: ResultsResponse, id: string) => r.facades.flatMap((f) => f.options).find((x) => x.optionId === id)!;
const cacheRows = async () => (await db.select().from(resultCache).where(eq(resultCache.projectId, projectId))).length;

describe("project results", () => {
  it("equal what /api/v1/calc/schedule and /api/v1/calc/glazing give for the same inputs", async () => {
    const res = await call(resultsRoute, consultant, `/api/v1/projects/${projectId}/results?year=${YEAR}`, { id: projectId });
    expect(res.status).toBe(200);
    const r = res.body as ResultsResponse;
    expect(r.year).toBe(YEAR);
    expect(r.inputsKey).toMatch(/^[0-9a-f]{64}$/);
    expect(r.facades.map((f) => f.name)).toEqual(["North", "West"]);
    expect(r.site).toMatchObject({ skyModel: "isotropic", groundAlbedo: 0.25 });

    // The same West façade and make-up through the schedule endpoint (one surface, the whole year).
    const w = optionOf(r, opt.westMeasured);
    const sched = await call(
      scheduleRoute as Route,
      consultant,
      "/api/v1/calc/schedule",
      {},
      {
        method: "POST",
        body: {
          site: { latitudeDeg: 38.7, longitudeDeg: LONGITUDE, timeZone: "Europe/Lisbon", elevationM: 50 },
          from: `${YEAR}-01-01`,
          to: `${YEAR}-12-31`,
          sky: { model: "isotropic", albedo: 0.25, linkeTurbidity: [3, 3.2, 3.5, 3.8, 4, 4.1, 4.2, 4.1, 3.9, 3.6, 3.2, 3] },
          surfaces: [
            {
              name: "West",
              azimuthDeg: 270,
              tiltDeg: 90,
              layers: double(measuredClear(6), measuredClear(4)),
              shading: { window: { widthM: 1.5, heightM: 2 }, overhang: { depthM: 0.6, gapAboveM: 0.2 } },
            },
          ],
        },
      },
    );
    expect(sched.status).toBe(200);
    const s = (sched.body as ScheduleResponse).surfaces[0]!;
    expect(w.annual.transmittedKWhm2).toBeCloseTo(s.totals.period.transmittedKWhPerM2, 9);
    expect(w.annual.solarGainKWhm2).toBeCloseTo(s.totals.period.solarGainKWhPerM2, 9);
    expect(w.monthly.transmittedKWhm2).toHaveLength(12);
    w.monthly.solarGainKWhm2.forEach((v, m) => expect(v).toBeCloseTo(s.totals.monthly[m]!.solarGainKWhPerM2, 9));
    const peakRow = s.rows.reduce((a, b) => (b.transmittedWm2 > a.transmittedWm2 ? b : a));
    expect(w.peak.transmittedWm2).toBe(peakRow.transmittedWm2);
    expect(w.peak.at).toBe(peakRow.time);
    // Bound from outside: transmitted sunlight never exceeds the solar constant, 1361 W/m² (Kopp & Lean 2011, TSI 1360.8 ± 0.5).
    expect(w.peak.transmittedWm2).toBeGreaterThan(100);
    expect(w.peak.transmittedWm2).toBeLessThan(1361);
    // A west façade at 38.7° N peaks in the afternoon (common practice (no source)).
    expect(Number(w.peak.at!.slice(11, 13))).toBeGreaterThanOrEqual(13);

    // The stored values are the make-up's values as /calc/glazing gives them for its layers.
    const g = await call(
      glazingRoute as Route,
      consultant,
      "/api/v1/calc/glazing",
      {},
      { method: "POST", body: { layers: double(measuredClear(6), measuredClear(4)), anglesDeg: [0] } },
    );
    const gv = g.body as GlazingResponse;
    expect(w.values.normal.gValue).toBeCloseTo(gv.angles[0]!.gValue, 12);
    expect(w.values.hemispherical.solarTransmittance).toBeCloseTo(gv.hemispherical.solarTransmittance, 12);
    expect(w.values.uValue).toBeCloseTo(gv.uValue, 12);
    // Two panes of τ 0.83, ρ 0.075: τ ≈ 0.83² / (1 − 0.075²) = 0.6931 (two-pane interreflection formula, EN 410 §5.3 (from memory)).
    expect(w.values.normal.solarTransmittance).toBeCloseTo((0.83 * 0.83) / (1 - 0.075 * 0.075), 3);
  });

  it("the comparison's angular curves equal /api/v1/calc/glazing for the stored layers", async () => {
    const res = await call(
      compareRoute,
      architect,
      `/api/v1/projects/${projectId}/compare?options=${opt.northClear},${opt.northTinted}&year=${YEAR}`,
      {
        id: projectId,
      },
    );
    expect(res.status).toBe(200);
    const c = res.body as CompareResponse;
    expect(c.options.map((x) => x.name)).toEqual(["N clear", "N tinted"]);
    const g = await call(
      glazingRoute as Route,
      consultant,
      "/api/v1/calc/glazing",
      {},
      { method: "POST", body: { layers: double(tinted(6), clear(4)), anglesDeg: COMPARE_ANGLES_DEG } },
    );
    const tintedCurve = c.options[1]!.angles;
    expect(tintedCurve).toHaveLength(19);
    (g.body as GlazingResponse).angles.forEach((row, i) => {
      expect(tintedCurve[i]!.angleDeg).toBe(row.angleDeg);
      expect(tintedCurve[i]!.solarTransmittance).toBeCloseTo(row.solarTransmittance, 12);
      expect(tintedCurve[i]!.gValue).toBeCloseTo(row.gValue, 12);
    });
    // Transmittance falls to zero at grazing incidence (Fresnel: reflectance → 1 at 90°).
    expect(tintedCurve[18]!.solarTransmittance).toBeLessThan(0.01);
    // Tinted glass lets less through than clear (more absorption), the same results as /results.
    expect(c.options[1]!.annual.transmittedKWhm2).toBeLessThan(c.options[0]!.annual.transmittedKWhm2);
    expect(c.options[0]!.surface).toMatchObject({ azimuthDeg: 0, tiltDeg: 90 });

    const bad = await call(compareRoute, architect, `/api/v1/projects/${projectId}/compare?options=${opt.northClear}`, { id: projectId });
    expect(bad.status).toBe(400);
    expect(bad.body.detail).toContain("at least two options");
    const foreign = await call(compareRoute, architect, `/api/v1/projects/${projectId}/compare?options=${opt.northClear},nope`, { id: projectId });
    expect(foreign.status).toBe(404);
  });

  it("flags each option against the project limits with the façade's overrides; τv unknown without measured values", async () => {
    await db.insert(projectRequirements).values({
      projectId,
      limits: { project: { maxGValue: 0.6, minLightTransmittance: 0.7, maxUValue: 3.5 }, facades: { [west]: { maxGValue: 0.75 } } },
    });
    const r = await projectResults(projectId, YEAR);
    const n = optionOf(r, opt.northClear);
    expect(r.facades[0]!.limits).toEqual({ maxGValue: 0.6, minLightTransmittance: 0.7, maxUValue: 3.5 });
    expect(r.facades[1]!.limits).toEqual({ maxGValue: 0.75, minLightTransmittance: 0.7, maxUValue: 3.5 });
    const gFlag = n.flags.find((f) => f.requirement === "maxGValue")!;
    expect(gFlag.value).toBeCloseTo(n.values.normal.gValue, 12);
    expect(gFlag.margin).toBeCloseTo(0.6 - n.values.normal.gValue, 9);
    // Clear double glazing: g ≈ 0.75–0.78 (typical catalogue values, common practice (no source)), so it fails 0.6.
    expect(gFlag.status).toBe("fail");
    expect(n.flags.find((f) => f.requirement === "minLightTransmittance")).toMatchObject({ status: "unknown", value: null, margin: null });
    // Uncoated air-filled double glazing: U ≈ 2.7–2.9 W/m²K (EN 673 worked values, from memory): passes 3.5.
    expect(n.flags.find((f) => f.requirement === "maxUValue")!.status).toBe("pass");
    const m = optionOf(r, opt.westMeasured);
    expect(m.flags.find((f) => f.requirement === "minLightTransmittance")!.status).toBe("pass");
    await db.delete(projectRequirements).where(eq(projectRequirements.projectId, projectId));
  });
});

describe("results cache", () => {
  it("hits for equal inputs and misses only what a change touches; unreachable rows are pruned", async () => {
    await db.delete(resultCache).where(eq(resultCache.projectId, projectId));
    const first = await projectResults(projectId, YEAR);
    // West clear and North clear share a make-up but not a façade: four distinct inputs.
    expect(first.cache).toEqual({ hits: 0, misses: 4 });
    const again = await projectResults(projectId, YEAR);
    expect(again.cache).toEqual({ hits: 4, misses: 0 });
    expect(again.inputsKey).toBe(first.inputsKey);
    expect(optionOf(again, opt.westClear).annual).toEqual(optionOf(first, opt.westClear).annual);
    expect(await cacheRows()).toBe(4);

    // A library edit re-pointed on one option: only that option recomputes.
    const rev2 = await editMakeup(mk.tinted.makeup.id, double(tinted(8), clear(4)));
    await db.update(facadeOption).set({ makeupRevisionId: rev2.id }).where(eq(facadeOption.id, opt.northTinted));
    const edited = await projectResults(projectId, YEAR);
    expect(edited.cache).toEqual({ hits: 3, misses: 1 });
    expect(edited.inputsKey).not.toBe(first.inputsKey);
    expect(optionOf(edited, opt.northTinted).makeupRevision).toBe(2);
    expect(optionOf(edited, opt.northTinted).annual.transmittedKWhm2).toBeLessThan(optionOf(first, opt.northTinted).annual.transmittedKWhm2);
    expect(await cacheRows()).toBe(4);

    // A façade change: that façade's two options.
    await db.update(facade).set({ azimuthDeg: 10 }).where(eq(facade.id, north));
    expect((await projectResults(projectId, YEAR)).cache).toEqual({ hits: 2, misses: 2 });
    await db
      .update(facade)
      .set({ shading: { overhang: { depthM: 0.9, gapAboveM: 0.2 } } })
      .where(eq(facade.id, west));
    expect((await projectResults(projectId, YEAR)).cache).toEqual({ hits: 2, misses: 2 });
    expect(await cacheRows()).toBe(4);

    // A site change: everything.
    await db.update(project).set({ groundAlbedo: 0.3 }).where(eq(project.id, projectId));
    const site = await projectResults(projectId, YEAR);
    expect(site.cache).toEqual({ hits: 0, misses: 4 });
    // Another year: everything, and this year's rows stay for a while.
    const other = await projectResults(projectId, YEAR + 1);
    expect(other.cache).toEqual({ hits: 0, misses: 4 });
    expect(other.inputsKey).not.toBe(site.inputsKey);
    expect(await cacheRows()).toBe(8);
    expect((await projectResults(projectId, YEAR)).cache).toEqual({ hits: 4, misses: 0 });

    // A renamed option changes the answer's key but computes nothing.
    await db.update(facadeOption).set({ name: "N clear (renamed)" }).where(eq(facadeOption.id, opt.northClear));
    const renamed = await projectResults(projectId, YEAR);
    expect(renamed.cache).toEqual({ hits: 4, misses: 0 });
    expect(renamed.inputsKey).not.toBe(site.inputsKey);
  });

  it("answers 400 naming the year in words for a bad year", async () => {
    const res = await call(resultsRoute, consultant, `/api/v1/projects/${projectId}/results?year=20x5`, { id: projectId });
    expect(res.status).toBe(400);
    expect(res.body.errors[0]).toMatchObject({ field: "year" });
    expect(res.body.errors[0].message).toContain("Year must be a whole number");
  });
});

describe("issued revisions", () => {
  it("letters run A … Z, AA, AB … ZZ, AAA", () => {
    expect([1, 2, 3, 26, 27, 28, 52, 53, 702, 703].map(revisionLetter)).toEqual(["A", "B", "C", "Z", "AA", "AB", "AZ", "BA", "ZZ", "AAA"]);
  });

  it("refuse with 409 naming the façades when none has an approved option", async () => {
    const res = await call(issueRoute, consultant, `/api/v1/projects/${projectId}/revisions`, { id: projectId }, { method: "POST", body: {} });
    expect(res.status).toBe(409);
    expect(res.body.detail).toContain("“North”");
    expect(res.body.detail).toContain("“West”");
  });

  it("snapshot the approved options, list the unapproved façades, and stay unchanged after the library is edited", async () => {
    await db.update(facadeOption).set({ status: "approved" }).where(eq(facadeOption.id, opt.westClear));
    const res = await call(
      issueRoute,
      consultant,
      `/api/v1/projects/${projectId}/revisions`,
      { id: projectId },
      { method: "POST", body: { note: "For tender", year: YEAR } },
    );
    expect(res.status).toBe(201);
    const a = res.body as RevisionResponse;
    expect(a).toMatchObject({ revision: "A", sequence: 1, note: "For tender", issuedBy: "Test consultant" });
    expect(a.facades.map((f) => [f.facadeName, f.optionId])).toEqual([["West", opt.westClear]]);
    expect(a.unapproved).toEqual([{ facadeId: north, name: "North" }]);
    expect(a.facades[0]!.layers).toEqual(double(clear(6), clear(4)));
    const live = optionOf(await projectResults(projectId, YEAR), opt.westClear);
    expect(a.facades[0]!.annual).toEqual(live.annual);
    expect(a.snapshot.year).toBe(YEAR);
    const events = await db
      .select()
      .from(projectEvent)
      .where(and(eq(projectEvent.projectId, projectId), eq(projectEvent.kind, "revision.issued")));
    expect(events).toHaveLength(1);
    expect(events[0]!.actorName).toBe("Test consultant");

    // The library moves on and the option is re-pointed: revision A is as issued, the change is reported.
    const rev2 = await editMakeup(mk.clear.makeup.id, double(tinted(10), clear(4)));
    await db.update(facadeOption).set({ makeupRevisionId: rev2.id }).where(eq(facadeOption.id, opt.westClear));
    const after = await call(revisionRoute, owner, `/api/v1/projects/${projectId}/revisions/A`, { id: projectId, rev: "A" });
    expect(after.status).toBe(200);
    expect(after.body).toEqual(a);
    const changes = await libraryChangesSince(projectId);
    expect(changes.find((c) => c.since === "A")).toMatchObject({
      makeupId: mk.clear.makeup.id,
      usedRevision: 1,
      currentRevision: 2,
      facadeName: "West",
    });
    expect(changes.find((c) => c.since === null && c.optionId === opt.northClear)).toMatchObject({ usedRevision: 1, currentRevision: 2 });

    // The next issue is B, with the new make-up revision; A still lists the old one.
    const b = await issueRevision(projectId, { id: owner.id, name: owner.name }, { note: null, year: YEAR });
    expect(b.revision).toBe("B");
    expect(b.facades[0]!.makeupRevision).toBe(2);
    expect(b.facades[0]!.annual.transmittedKWhm2).toBeLessThan(a.facades[0]!.annual.transmittedKWhm2);
    const list = await call(listRevisions, owner, `/api/v1/projects/${projectId}/revisions`, { id: projectId });
    expect((list.body.revisions as RevisionResponse[]).map((r) => r.revision)).toEqual(["B", "A"]);
  });

  it("continue with AA after Z", async () => {
    const [row] = await db
      .select()
      .from(scheduleRevision)
      .where(and(eq(scheduleRevision.projectId, projectId), eq(scheduleRevision.letter, "B")));
    for (let seq = 3; seq <= 26; seq++) {
      await db
        .insert(scheduleRevision)
        .values({ projectId, sequence: seq, letter: revisionLetter(seq), issuedByName: "Test", snapshot: row!.snapshot });
    }
    const aa = await issueRevision(projectId, { id: owner.id, name: owner.name }, { note: null, year: YEAR });
    expect(aa).toMatchObject({ revision: "AA", sequence: 27 });
    const got = await call(revisionRoute, owner, `/api/v1/projects/${projectId}/revisions/AA`, { id: projectId, rev: "AA" });
    expect(got.body.revision).toBe("AA");
    expect((await call(revisionRoute, owner, `/api/v1/projects/${projectId}/revisions/AB`, { id: projectId, rev: "AB" })).status).toBe(404);
  });
});

describe("roles", () => {
  it("clients of a shared project read issued revisions only; architects cannot issue; results hide drafts from clients", async () => {
    const at = (id: string) => ({ id: projectId, rev: id });
    // Not shared yet: the client sees nothing.
    expect((await call(listRevisions, client, `/api/v1/projects/${projectId}/revisions`, { id: projectId })).status).toBe(404);
    const cm = (await projectsForUser(client.id))[0]!.membership;
    const p = (await db.select().from(project).where(eq(project.id, projectId)))[0]!;
    await shareProject(p, cm.memberId, o.userId);
    expect((await call(listRevisions, client, `/api/v1/projects/${projectId}/revisions`, { id: projectId })).status).toBe(200);
    expect((await call(revisionRoute, client, `/api/v1/projects/${projectId}/revisions/A`, at("A"))).status).toBe(200);
    expect((await call(resultsRoute, client, `/api/v1/projects/${projectId}/results`, { id: projectId })).status).toBe(403);
    expect((await call(compareRoute, client, `/api/v1/projects/${projectId}/compare?options=a,b`, { id: projectId })).status).toBe(403);
    expect((await call(issueRoute, client, `/api/v1/projects/${projectId}/revisions`, { id: projectId }, { method: "POST", body: {} })).status).toBe(
      403,
    );
    const arch = await call(issueRoute, architect, `/api/v1/projects/${projectId}/revisions`, { id: projectId }, { method: "POST", body: {} });
    expect(arch.status).toBe(403);
    expect(arch.body.detail).toContain("issue schedule revisions");
    expect((await call(resultsRoute, architect, `/api/v1/projects/${projectId}/results?year=${YEAR}`, { id: projectId })).status).toBe(200);
    // Another organisation's owner: 404 everywhere.
    const other = await newOwner("outsider");
    const outsider = { id: other.userId, name: "Outsider", email: other.email };
    expect((await call(revisionRoute, outsider, `/api/v1/projects/${projectId}/revisions/A`, at("A"))).status).toBe(404);
    expect((await call(resultsRoute, outsider, `/api/v1/projects/${projectId}/results`, { id: projectId })).status).toBe(404);
    // A bad note is refused naming the field in words.
    const bad = await call(
      issueRoute,
      owner,
      `/api/v1/projects/${projectId}/revisions`,
      { id: projectId },
      { method: "POST", body: { note: "x".repeat(2001) } },
    );
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0]).toMatchObject({ field: "note", message: "Note must be at most 2000 characters" });
  });
});
