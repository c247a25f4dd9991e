// The import-boundary and configuration rules of eslint.config.js, checked on snippets linted at
// virtual paths: each forbidden import must be reported by the rule named, each allowed one by none.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { ESLint } from "eslint";
import { beforeAll, describe, expect, it } from "vitest";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");
let eslint: ESLint;

beforeAll(() => {
  eslint = new ESLint({ cwd: root, overrideConfigFile: path.join(root, "eslint.config.js") });
});

async function lint(filePath: string, code: string) {
  const [result] = await eslint.lintText(code, { filePath: path.join(root, filePath) });
  return result!.messages.map((m) => ({ ruleId: m.ruleId, line: m.line, message: m.message }));
}

/** A module that imports one name from each source and uses them all. */
const importing = (...sources: string[]) =>
  sources.map((s, i) => `import { a${i} } from "${s}";\n`).join("") + `export const b = [${sources.map((_, i) => `a${i}`).join(", ")}];\n`;

const forbidden: [string, string, string, string][] = [
  // [case, virtual path, code, rule]
  ["physics → server db", "src/lib/physics/fresnel.ts", importing("@/lib/server/db/client"), "no-restricted-imports"],
  ["physics → calc, relative", "src/lib/physics/fresnel.ts", importing("../calc/glazing"), "no-restricted-imports"],
  ["physics → calc, alias", "src/lib/physics/fresnel.ts", importing("@/lib/calc/glazing"), "no-restricted-imports"],
  ["physics → another package", "src/lib/physics/fresnel.ts", importing("zod"), "no-restricted-imports"],
  [
    "physics → contracts, type only",
    "src/lib/physics/fresnel.ts",
    'import type { Pane } from "@/lib/contracts/glazing";\nexport type P = Pane;\n',
    "no-restricted-imports",
  ],
  ["physics re-export → server", "src/lib/physics/index.ts", 'export { db } from "@/lib/server/db/client";\n', "no-restricted-imports"],
  ["physics sub-folder → calc, relative", "src/lib/physics/shading/overhang.ts", importing("../../calc/glazing"), "no-restricted-imports"],
  ["physics dynamic import", "src/lib/physics/fresnel.ts", 'export const m = () => import("./units");\n', "no-restricted-syntax"],
  ["calc → server", "src/lib/calc/glazing.ts", importing("@/lib/server/db/client"), "no-restricted-imports"],
  ["calc → package", "src/lib/calc/glazing.ts", importing("drizzle-orm"), "no-restricted-imports"],
  ["calc → format, relative", "src/lib/calc/glazing.ts", importing("../format"), "no-restricted-imports"],
  ["time → physics", "src/lib/time/local-timeline.ts", importing("@/lib/physics/units"), "no-restricted-imports"],
  ["time → package", "src/lib/time/local-timeline.ts", importing("suncalc"), "no-restricted-imports"],
  ["reference-cases → physics", "src/lib/reference-cases/fresnel.ts", importing("@/lib/physics/fresnel"), "no-restricted-imports"],
  ["validation → server", "src/lib/validation/report.ts", importing("@/lib/server/db/client"), "no-restricted-imports"],
  ["validation → calc", "src/lib/validation/engines/fresnel.ts", importing("@/lib/calc/glazing"), "no-restricted-imports"],
  ["validation → node:fs", "src/lib/validation/report.ts", importing("node:fs"), "no-restricted-imports"],
  ["reference script → physics", "scripts/reference/fresnel.ts", importing("@/lib/physics/fresnel"), "no-restricted-imports"],
  ["reference script → calc", "scripts/reference/glazing.ts", importing("@/lib/calc/glazing"), "no-restricted-imports"],
  ["reference script → physics, relative", "scripts/reference/fresnel.ts", importing("../src/lib/physics/fresnel"), "no-restricted-imports"],
  ["island → server auth", "src/components/ShareManager.tsx", importing("@/lib/server/auth"), "no-restricted-imports"],
  ["island hook → server", "src/components/forms/useThing.ts", importing("@/lib/server/services/projects"), "no-restricted-imports"],
  [
    "island dynamic import → server",
    "src/components/ShareManager.tsx",
    'export const m = () => import("@/lib/server/auth");\n',
    "no-restricted-syntax",
  ],
  [
    "astro component → server",
    "src/components/Caution.astro",
    '---\nimport { a } from "@/lib/server/auth";\nconst b = a;\n---\n<p>{b}</p>\n',
    "no-restricted-imports",
  ],
  ["client → server, relative", "src/lib/client/api.ts", importing("../server/auth"), "no-restricted-imports"],
  ["service → http, alias", "src/lib/server/services/projects.ts", importing("@/lib/server/http"), "no-restricted-imports"],
  ["service → http, relative", "src/lib/server/services/projects.ts", importing("../http"), "no-restricted-imports"],
  ["service → http folder", "src/lib/server/services/projects.ts", importing("@/lib/server/http/problem"), "no-restricted-imports"],
  ["service → node:http", "src/lib/server/services/projects.ts", importing("node:http"), "no-restricted-imports"],
  ["src reads process.env", "src/lib/server/auth.ts", "export const v = process.env.SECRET;\n", "no-restricted-properties"],
  ["src destructures process.env", "src/pages/index.ts", "const { env } = process;\nexport const v = env.X;\n", "no-restricted-properties"],
  [
    "src imports env from node:process",
    "src/lib/server/auth.ts",
    importing("node:process").replace("{ a0 }", "{ env as a0 }"),
    "no-restricted-imports",
  ],
  ["../../ in a test", "tests/unit/some.test.ts", importing("../../src/lib/format"), "no-restricted-imports"],
  ["../../ in a page", "src/pages/api/v1/me.ts", importing("../../../lib/server/auth"), "no-restricted-imports"],
];

const allowed: [string, string, string][] = [
  ["physics → itself, complex.js, suncalc", "src/lib/physics/fresnel.ts", importing("./units", "@/lib/physics/units", "complex.js", "suncalc")],
  ["physics sub-folder → physics, relative", "src/lib/physics/shading/overhang.ts", importing("../units", "./fin", "..", "@/lib/physics/fresnel")],
  [
    "calc → physics, time, contracts, itself",
    "src/lib/calc/glazing.ts",
    importing("@/lib/physics/units", "@/lib/time/local-timeline", "@/lib/contracts/glazing", "./schedule", "."),
  ],
  ["time → itself", "src/lib/time/local-timeline.ts", importing("./zones")],
  ["reference-cases → itself", "src/lib/reference-cases/fresnel.ts", importing("@/lib/reference-cases/types", "./types")],
  [
    "validation → physics, time, reference-cases, reference libraries",
    "src/lib/validation/engines/sun.ts",
    importing("@/lib/physics/units", "@/lib/time/local-timeline", "@/lib/reference-cases/types", "../types", "astronomy-engine", "suncalc"),
  ],
  [
    "reference script → reference-cases, packages",
    "scripts/reference/sun.ts",
    importing("@/lib/reference-cases/sun", "astronomy-engine", "node:fs") + "export const e = process.env.X;\n",
  ],
  [
    "island → client, contracts, physics",
    "src/components/ShareManager.tsx",
    importing("@/lib/client/api", "@/lib/contracts/projects", "@/lib/physics/units", "@/lib/calc/glazing", "react"),
  ],
  [
    "service → db, itself, contracts, packages",
    "src/lib/server/services/projects.ts",
    importing("@/lib/server/db/client", "./access", "@/lib/contracts/projects", "drizzle-orm"),
  ],
  [
    "astro component → contracts",
    "src/components/Caution.astro",
    '---\nimport { a } from "@/lib/contracts/glazing";\nconst b = a;\n---\n<p>{b}</p>\n',
  ],
  ["page → server", "src/pages/dashboard.ts", importing("@/lib/server/services/projects")],
  ["env.ts reads process.env", "src/lib/server/env.ts", "export const v = process.env.DATABASE_URL;\n"],
  ["a script reads process.env", "scripts/seed.ts", "export const v = process.env.DATABASE_URL;\n"],
  ["a test reads process.env", "tests/server/helpers.ts", "export const v = process.env.DATABASE_URL;\n"],
];

describe("eslint boundary rules", () => {
  it.each(forbidden)("reports %s", async (_case, filePath, code, rule) => {
    const messages = await lint(filePath, code);
    expect(messages.map((m) => m.ruleId)).toContain(rule);
  });

  it.each(allowed)("allows %s", async (_case, filePath, code) => {
    expect(await lint(filePath, code)).toEqual([]);
  });
});
