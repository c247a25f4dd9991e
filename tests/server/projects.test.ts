// Project visibility and editing rules against PostgreSQL.
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db, pool } from "@/lib/server/db/client";
import { invitation } from "@/lib/server/db/schema";
import { signUp } from "@/lib/server/services/accounts";
import { requireProject } from "@/lib/server/services/access";
import { createProject, facadesOf, projectsForUser, shareProject, unshareProject, updateProject } from "@/lib/server/services/projects";
import { inviteMember } from "@/lib/server/services/members";
import { ProjectCreateRequest } from "@/lib/contracts/projects";
import { problemFor } from "@/lib/server/http";
import { newOwner, uniqueEmail } from "./helpers";

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
});
