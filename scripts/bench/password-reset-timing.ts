// Password-reset requests for a known and an unknown address must take the same time (the mail is sent after
// the answer). Needs a running Paneray with the demo seeded and AUTH_RATE_LIMIT=off (20 requests each would pass
// the per-address limit); set BENCH_URL (e.g. http://127.0.0.1:4321). Without it this module measures nothing.
import { demoUser } from "@/lib/demo-scenario";

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
};

export async function run(): Promise<void> {
  const base = process.env.BENCH_URL;
  if (!base) {
    console.log("skipped: set BENCH_URL to a running Paneray (npm start, AUTH_RATE_LIMIT=off) to time password-reset requests");
    return;
  }
  const ask = async (email: string) => {
    const t0 = performance.now();
    const res = await fetch(`${base}/api/auth/request-password-reset`, {
      method: "POST",
      headers: { "content-type": "application/json", origin: base },
      body: JSON.stringify({ email, redirectTo: "/reset-password" }),
    });
    await res.text();
    if (res.status !== 200) throw new Error(`request-password-reset answered ${res.status}`);
    return performance.now() - t0;
  };
  const known: number[] = [];
  const unknown: number[] = [];
  await ask(demoUser("client").email); // warm-up
  for (let i = 0; i < 20; i++) {
    // Interleaved, so that load on the machine affects both alike.
    known.push(await ask(demoUser("client").email));
    unknown.push(await ask(`nobody-${Date.now().toString(36)}-${i}@unknown.example`));
  }
  const k = median(known);
  const u = median(unknown);
  const ratio = Math.max(k, u) / Math.min(k, u);
  console.log(
    `password-reset request, median of 20: known address ${k.toFixed(1)} ms, unknown address ${u.toFixed(1)} ms, ratio ${ratio.toFixed(2)}`,
  );
  console.log(`target: ratio ≤ 1.5 → ${ratio <= 1.5 ? "PASS" : "MISS"}`);
}
