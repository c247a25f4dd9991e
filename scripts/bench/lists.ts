// The projects list of a large organisation (2,148 projects, two façades each): one page of 50 and of 100
// against every project in one answer (the whole list walked page by page), as JSON bytes and time per
// answer through the GET handler. Needs DATABASE_URL (a migrated database, e.g. the one `npm start`
// prints); it adds a throwaway organisation and removes it at the end. Without it this module measures nothing.
import { eq } from "drizzle-orm";

const PROJECTS = 2148;
const TRIALS = 9;

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export async function run(): Promise<void> {
  if (!process.env.DATABASE_URL) {
    console.log("skipped: set DATABASE_URL to a migrated database to time the list endpoints");
    return;
  }
  const { db, pool } = await import("@/lib/server/db/client");
  const { facade, member, organization, project, user } = await import("@/lib/server/db/schema");
  const { GET } = await import("@/pages/api/v1/projects/index");
  const tag = `bench-${Date.now().toString(36)}`;
  const userId = `${tag}-user`;
  const orgId = `${tag}-org`;
  try {
    await db.insert(user).values({ id: userId, name: "Bench owner", email: `${tag}@bench.example`, emailVerified: true });
    await db.insert(organization).values({ id: orgId, name: "Bench firm", slug: tag, createdAt: new Date() });
    await db.insert(member).values({ id: `${tag}-member`, organizationId: orgId, userId, role: "owner", createdAt: new Date() });
    for (let start = 0; start < PROJECTS; start += 500) {
      const rows = await db
        .insert(project)
        .values(
          Array.from({ length: Math.min(500, PROJECTS - start) }, (_, i) => ({
            organizationId: orgId,
            name: `Bench tower ${start + i}`,
            reference: `B-${start + i}`,
            buildingName: "Block A",
            siteName: "Bench quay",
            latitudeDeg: 52.37,
            longitudeDeg: 4.9,
            timeZone: "Europe/Amsterdam",
            elevationM: 2,
            description: "A building for timing the lists.",
            createdById: userId,
          })),
        )
        .returning({ id: project.id });
      await db.insert(facade).values(
        rows.flatMap((r) => [
          { projectId: r.id, name: "South", azimuthDeg: 180, tiltDeg: 90, position: 0 },
          { projectId: r.id, name: "West", azimuthDeg: 270, tiltDeg: 90, position: 1 },
        ]),
      );
    }

    const get = async (query: string) => {
      const url = new URL(`/api/v1/projects${query}`, "http://127.0.0.1");
      const res = await GET({ locals: { user: { id: userId } }, params: {}, request: new Request(url), url } as never);
      const text = await res.text();
      if (res.status !== 200) throw new Error(`GET ${query} answered ${res.status}: ${text.slice(0, 200)}`);
      return { text, nextCursor: (JSON.parse(text) as { nextCursor: string | null }).nextCursor };
    };
    const time = async (fn: () => Promise<number>) => {
      const ms: number[] = [];
      let bytes = 0;
      for (let k = 0; k < TRIALS; k++) {
        const t0 = performance.now();
        bytes = await fn();
        ms.push(performance.now() - t0);
      }
      return { ms: median(ms), bytes };
    };
    const page50 = await time(async () => (await get("?limit=50")).text.length);
    const page100 = await time(async () => (await get("?limit=100")).text.length);
    let pages = 0;
    const all = await time(async () => {
      let bytes = 0;
      let cursor: string | null = null;
      pages = 0;
      do {
        const r = await get(`?limit=100${cursor ? `&cursor=${cursor}` : ""}`);
        bytes += r.text.length;
        cursor = r.nextCursor;
        pages++;
      } while (cursor);
      return bytes;
    });
    const kb = (b: number) => `${(b / 1024).toFixed(0)} KiB`;
    console.log(`GET /api/v1/projects, ${PROJECTS} projects, medians of ${TRIALS}:`);
    console.log(`  first page of 50:   ${kb(page50.bytes)}, ${page50.ms.toFixed(1)} ms`);
    console.log(`  first page of 100:  ${kb(page100.bytes)}, ${page100.ms.toFixed(1)} ms`);
    console.log(`  all ${pages} pages of 100: ${kb(all.bytes)}, ${all.ms.toFixed(1)} ms (what one unpaged answer carried)`);
    console.log(
      `  ratio page of 50 / whole list: bytes ${(page50.bytes / all.bytes).toFixed(3)}, time ${(page50.ms / all.ms).toFixed(3)}   target bytes ≤ 0.05: ${page50.bytes / all.bytes <= 0.05 ? "PASS" : "MISS"}`,
    );
  } finally {
    await db.delete(organization).where(eq(organization.id, orgId));
    await db.delete(user).where(eq(user.id, userId));
    await pool.end();
  }
}
