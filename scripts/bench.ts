// npm run bench: every benchmark module under scripts/bench/, in turn. Each prints its own figures
// (medians over repeated trials, with the target and PASS/MISS). Usage: npm run bench [-- name …]
import { readdirSync } from "node:fs";
import { basename, dirname, join } from "node:path";
import { fileURLToPath } from "node:url";

const dir = join(dirname(fileURLToPath(import.meta.url)), "bench");
const wanted = process.argv.slice(2);
const modules = readdirSync(dir)
  .filter((f) => f.endsWith(".ts"))
  .sort()
  .filter((f) => wanted.length === 0 || wanted.includes(basename(f, ".ts")));

console.log(`Paneray benchmarks · node ${process.version} · ${new Date().toISOString()}`);
for (const f of modules) {
  console.log(`\n== ${basename(f, ".ts")} ==`);
  const mod = (await import(join(dir, f))) as { run: () => Promise<void> };
  await mod.run();
}
