// Seeds the demo scenario (src/lib/demo-scenario.ts). Idempotent: rows that exist are left alone.
import { seedDemo } from "@/lib/server/services/seed";
import { seedDemoWorkspace } from "@/lib/server/services/seed-workspace";
import { pool } from "@/lib/server/db/client";

try {
  const created = [...(await seedDemo()), ...(await seedDemoWorkspace())];
  console.error(created.length ? `[paneray] demo seeded: ${created.join(", ")}` : "[paneray] demo data already present");
} finally {
  await pool.end();
}
