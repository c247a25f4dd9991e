// A project's weather file of 8,760 hours (an invented year, UTC instants, and the same year as local times in
// Europe/Berlin with both clock changes): the CSV checks alone, and the whole upload through the POST handler
// (multipart body read with its size limit, SHA-256, checks, the series and the file saved in one transaction,
// the history event). Target: ≤ 1 s for the whole upload. The upload part needs DATABASE_URL (a migrated
// database); it adds a throwaway organisation and project and removes them at the end.
import { eq } from "drizzle-orm";
import { validateWeatherCsv } from "@/lib/server/uploads/weather-csv";
import { weatherCsv } from "../weather-year";

const TRIALS = 9;
const TARGET_MS = 1000;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const verdict = (ok: boolean) => (ok ? "PASS" : "MISS");

async function timed(f: () => Promise<unknown> | unknown): Promise<number> {
  await f(); // warm-up
  const t: number[] = [];
  for (let k = 0; k < TRIALS; k++) {
    const t0 = performance.now();
    await f();
    t.push(performance.now() - t0);
  }
  return median(t);
}

export async function run(): Promise<void> {
  const utc = new TextEncoder().encode(weatherCsv({ year: 2025, latitudeDeg: 52.52, longitudeDeg: 13.4, times: "utc" }));
  const local = new TextEncoder().encode(
    weatherCsv({ year: 2025, latitudeDeg: 52.52, longitudeDeg: 13.4, times: "local", timeZone: "Europe/Berlin" }),
  );
  for (const [label, bytes] of [
    ["UTC instants", utc],
    ["local times", local],
  ] as const) {
    const ms = await timed(() => {
      const r = validateWeatherCsv(bytes, "Europe/Berlin");
      if (!r.ok || r.weather.hours !== 8760) throw new Error(`the bench file was refused: ${JSON.stringify(!r.ok && r.errors.slice(0, 2))}`);
    });
    console.log(`checks of 8,760 hours (${label}, ${(bytes.length / 1024).toFixed(0)} KB): median ${ms.toFixed(1)} ms of ${TRIALS}`);
  }

  if (!process.env.DATABASE_URL) {
    console.log("upload through the handler skipped: set DATABASE_URL to a migrated database to time it");
    return;
  }
  const { db, pool } = await import("@/lib/server/db/client");
  const { member, organization, project, user } = await import("@/lib/server/db/schema");
  const { POST } = await import("@/pages/api/v1/projects/[id]/weather/index");
  const tag = `bench-${Date.now().toString(36)}`;
  const userId = `${tag}-user`;
  const orgId = `${tag}-org`;
  try {
    await db.insert(user).values({ id: userId, name: "Bench owner", email: `${tag}@bench.example`, emailVerified: true });
    await db.insert(organization).values({ id: orgId, name: "Bench firm", slug: tag, createdAt: new Date() });
    await db.insert(member).values({ id: `${tag}-member`, organizationId: orgId, userId, role: "owner", createdAt: new Date() });
    const [p] = await db
      .insert(project)
      .values({
        organizationId: orgId,
        name: "Bench weather",
        siteName: "Bench site",
        latitudeDeg: 52.52,
        longitudeDeg: 13.4,
        timeZone: "Europe/Berlin",
        createdById: userId,
      })
      .returning();
    const caller = { id: userId, name: "Bench owner", email: `${tag}@bench.example` };
    for (const [label, bytes] of [
      ["UTC instants", utc],
      ["local times", local],
    ] as const) {
      const ms = await timed(async () => {
        const form = new FormData();
        form.set("file", new Blob([bytes], { type: "text/csv" }), "bench-year.csv");
        const request = new Request(`http://127.0.0.1/api/v1/projects/${p!.id}/weather`, { method: "POST", body: form });
        const res = (await POST({ request, url: new URL(request.url), params: { id: p!.id }, locals: { user: caller } } as never)) as Response;
        if (res.status !== 201) throw new Error(`upload answered ${res.status}: ${(await res.text()).slice(0, 200)}`);
      });
      console.log(
        `POST /api/v1/projects/:id/weather, 8,760 hours (${label}): median ${ms.toFixed(0)} ms of ${TRIALS} · target ≤ ${TARGET_MS} ms ${verdict(ms <= TARGET_MS)}`,
      );
    }
  } finally {
    await db.delete(organization).where(eq(organization.id, orgId));
    await db.delete(user).where(eq(user.id, userId));
    await pool.end();
  }
}
