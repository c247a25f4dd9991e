// The schedule endpoint over real HTTP (session lookup, validation, computation, 2.5 MB of JSON on a socket):
// one surface, a full year of hours. Needs a running Paneray with the demo seeded (`npm start`); set
// BENCH_URL (e.g. http://127.0.0.1:4321). Without it this module says so and measures nothing.
import { DEMO_PASSWORD, demoUser } from "@/lib/demo-scenario";

export async function run(): Promise<void> {
  const base = process.env.BENCH_URL;
  if (!base) {
    console.log("skipped: set BENCH_URL to a running Paneray (npm start) to time the endpoint over HTTP");
    return;
  }
  const signIn = await fetch(`${base}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: base },
    body: JSON.stringify({ email: demoUser("consultant").email, password: DEMO_PASSWORD }),
  });
  if (signIn.status !== 200) throw new Error(`demo sign-in failed: ${signIn.status}`);
  const cookie = signIn.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
  const pane = { kind: "pane", thicknessMm: 4, refractiveIndex: 1.52, absorptionPerMm: 0.02 };
  const year = new Date().getFullYear();
  const body = JSON.stringify({
    site: { latitudeDeg: 38.7053, longitudeDeg: -9.1721, timeZone: "Europe/Lisbon" },
    from: `${year}-01-01`,
    to: `${year}-12-31`,
    surfaces: [{ name: "South", azimuthDeg: 180, tiltDeg: 90, layers: [pane, { kind: "gap", widthMm: 16, gas: "air" }, pane] }],
  });
  const times: number[] = [];
  let bytes = 0;
  for (let k = 0; k < 15; k++) {
    const t0 = performance.now();
    const res = await fetch(`${base}/api/v1/calc/schedule`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie, origin: base },
      body,
    });
    const text = await res.text();
    if (res.status !== 200) throw new Error(`endpoint answered ${res.status}: ${text.slice(0, 200)}`);
    bytes = text.length;
    if (k >= 3) times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  const median = times[Math.floor(times.length / 2)]!;
  console.log(
    `POST /api/v1/calc/schedule over HTTP, one surface × a year of hours (${(bytes / 1e6).toFixed(1)} MB): median ${median.toFixed(0)} ms ` +
      `(min ${times[0]!.toFixed(0)}, max ${times[times.length - 1]!.toFixed(0)}, 12 requests)   target ≤ 200 ms: ${median <= 200 ? "PASS" : "MISS"}`,
  );
}
