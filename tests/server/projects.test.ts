// Project visibility and editing rules against PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { facadeOption, invitation, optionComment, optionDecision, projectEvent, projectRequirements } from "@/lib/server/db/schema";
import { signUp } from "@/lib/server/services/accounts";
import { requireProject } from "@/lib/server/services/access";
import {
  createProject,
  facadesOf,
  optionCountsOf,
  projectsForUser,
  shareProject,
  unshareProject,
  updateProject,
} from "@/lib/server/services/projects";
import { inviteMember } from "@/lib/server/services/members";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { problemFor } from "@/lib/server/http";
import { newOwner, uniqueEmail } from "./helpers";
import { clear, double, insertMakeup, insertOption } from "./workspace-fixtures";

afterAll(() => pool.end());
const status = async (p: Promise<unknown>) =>
  p.then(
    () => "ok" as const,
    (e) => problemFor(e)?.status ?? String(e),
  );

async function orgWithClient() {
  const o = await newOwner();
  const email = uniqueEmail("client");
  await inviteMember(o.headers, o.organizationId, email, "client");
  const id = (await db.select().from(invitation).where(eq(invitation.email, email)))[0]!.id;
  const c = await signUp({ name: "Client", email, password: "long password", invitationId: id });
  const p = await createProject(
    ProjectCreateRequest.parse({
      organizationId: o.organizationId,
      name: "Test tower",
      siteName: "Plot 9",
      latitudeDeg: -33.87,
      longitudeDeg: 151.21,
      timeZone: "Australia/Sydney",
      facades: [
        { name: "North", azimuthDeg: 0 },
        { name: "West", azimuthDeg: 270 },
      ],
    }),
    o.userId,
  );
  return { o, c, p };
}

describe("project visibility", () => {
  it("a client sees a project only once it is shared, and never edits it", async () => {
    const { o, c, p } = await orgWithClient();
    expect(await status(requireProject(c.userId, p.id))).toBe(404);
    expect((await projectsForUser(c.userId))[0]!.projects).toHaveLength(0);

    const cm = (await projectsForUser(c.userId))[0]!.membership;
    await shareProject(p, cm.memberId, o.userId);
    expect(await status(requireProject(c.userId, p.id))).toBe("ok");
    expect((await projectsForUser(c.userId))[0]!.projects.map((x) => x.id)).toEqual([p.id]);
    expect(await status(requireProject(c.userId, p.id, { project: ["update"] }))).toBe(403);

    await unshareProject(p, cm.memberId);
    expect(await status(requireProject(c.userId, p.id))).toBe(404);
  });

  it("members of another organisation get 404, not 403", async () => {
    const { p } = await orgWithClient();
    const stranger = await newOwner("stranger");
    expect(await status(requireProject(stranger.userId, p.id))).toBe(404);
    expect(await status(requireProject(stranger.userId, "no-such-project"))).toBe(404);
  });
});

describe("project editing", () => {
  it("keeps façades named by id, adds new ones, drops the rest, in the given order", async () => {
    const { p } = await orgWithClient();
    const [north] = await facadesOf(p.id);
    await updateProject(p.id, {
      facades: [
        { name: "South", azimuthDeg: 180, tiltDeg: 90 },
        { id: north!.id, name: "North (renamed)", azimuthDeg: 5, tiltDeg: 90 },
      ],
    });
    const after = await facadesOf(p.id);
    expect(after.map((f) => f.name)).toEqual(["South", "North (renamed)"]);
    expect(after[1]!.id).toBe(north!.id);
  });

  it("refuses a façade id of another project and changes nothing", async () => {
    const a = await orgWithClient();
    const b = await orgWithClient();
    const [foreign] = await facadesOf(b.p.id);
    expect(await status(updateProject(a.p.id, { name: "Renamed", facades: [{ id: foreign!.id, name: "x", azimuthDeg: 0, tiltDeg: 90 }] }))).toBe(400);
    expect((await facadesOf(a.p.id)).map((f) => f.name)).toEqual(["North", "West"]);
    expect((await requireProject(a.o.userId, a.p.id)).project.name).toBe("Test tower");
  });

  it("the database itself refuses an out-of-range latitude", async () => {
    const { p } = await orgWithClient();
    await expect(updateProject(p.id, { latitudeDeg: 123 })).rejects.toThrow();
  });

  it("saving without a façade takes its options, their comments and decisions with it, records that, and keeps the others'", async () => {
    const { o, p } = await orgWithClient();
    const [north, west] = await facadesOf(p.id);
    const mk = await insertMakeup(o.organizationId, "Cascade clear", double(clear(6), clear(4)));
    const gone = [await insertOption(p.id, west!.id, mk, "W1", "approved"), await insertOption(p.id, west!.id, mk, "W2")];
    const kept = await insertOption(p.id, north!.id, mk, "N1");
    await db.insert(optionComment).values({ optionId: gone[0]!.id, authorId: o.userId, authorName: "Owner", body: "Fine by me" });
    await db.insert(optionDecision).values({ optionId: gone[0]!.id, decision: "approved", decidedById: o.userId, decidedByName: "Owner" });
    expect(await optionCountsOf(p.id)).toEqual({ [west!.id]: 2, [north!.id]: 1 });
    await db.insert(projectRequirements).values({
      projectId: p.id,
      limits: { project: { maxGValue: 0.5 }, facades: { [west!.id]: { maxGValue: 0.3 }, [north!.id]: { minLightTransmittance: 0.6 } } },
    });

    await updateProject(p.id, { facades: [{ id: north!.id, name: "North", azimuthDeg: 0, tiltDeg: 90 }] }, { id: o.userId, name: "Owner" });

    expect((await facadesOf(p.id)).map((f) => f.id)).toEqual([north!.id]);
    const left = await db.select({ id: facadeOption.id }).from(facadeOption).where(eq(facadeOption.projectId, p.id));
    expect(left.map((r) => r.id)).toEqual([kept.id]);
    expect(await db.select().from(optionComment).where(eq(optionComment.optionId, gone[0]!.id))).toHaveLength(0);
    expect(await db.select().from(optionDecision).where(eq(optionDecision.optionId, gone[0]!.id))).toHaveLength(0);
    expect(await optionCountsOf(p.id)).toEqual({ [north!.id]: 1 });
    const events = await db.select().from(projectEvent).where(eq(projectEvent.projectId, p.id));
    expect(events.map((e) => [e.kind, e.summary])).toEqual([["facade.deleted", "Removed façade West with its 2 options"]]);

    // The brief's override for the removed façade goes with it; the project's limits and the other façade's stay.
    const [req] = await db.select().from(projectRequirements).where(eq(projectRequirements.projectId, p.id));
    expect(req!.limits).toEqual({ project: { maxGValue: 0.5 }, facades: { [north!.id]: { minLightTransmittance: 0.6 } } });
  });

  it("stores a façade's shading devices as sent, and drops a device sent as absent", async () => {
    const { p } = await orgWithClient();
    const [north, west] = await facadesOf(p.id);
    const window = { windowWidthM: 1.5, windowHeightM: 2 };
    const shading = { overhang: { depthM: 0.8, gapAboveM: 0.3, extensionLeftM: 0.5 }, fins: { depthM: 0.4, gapM: 0.1 }, horizonDeg: 12 };
    const keep = { id: west!.id, name: "West", azimuthDeg: 270, tiltDeg: 90 };
    await updateProject(p.id, { facades: [{ id: north!.id, name: "North", azimuthDeg: 0, tiltDeg: 90, ...window, shading }, keep] });
    expect((await facadesOf(p.id))[0]).toMatchObject({ ...window, shading });
    await updateProject(p.id, {
      facades: [{ id: north!.id, name: "North", azimuthDeg: 0, tiltDeg: 90, ...window, shading: { fins: shading.fins } }, keep],
    });
    expect((await facadesOf(p.id))[0]!.shading).toEqual({ fins: shading.fins });
  });
});
