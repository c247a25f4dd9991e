// Every computed case of a case module (and, where the script evaluates them, its closed-form cases) is
// reproduced by its committed script scripts/reference/<domain>.ts, an independent implementation of the
// published formula, within the case's own tolerance, so that a value in a case module cannot drift from
// its formula. The scripts and case modules import no product code.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { absorbingPaneComparison } from "@scripts/reference/absorbing-pane";
import type { ComparisonRow } from "@scripts/reference/compare";
import { fresnelComparison } from "@scripts/reference/fresnel";
import { gasPropertiesComparison } from "@scripts/reference/gas-properties";
import { gFromRecomputedOpticsComparison, gValueComparison, opticalInputComparison } from "@scripts/reference/g-value";
import { hemisphericalComparison } from "@scripts/reference/hemispherical";
import { incidenceComparison } from "@scripts/reference/incidence";
import { irradianceComparison } from "@scripts/reference/irradiance";
import { layerStackComparison } from "@scripts/reference/layer-stack";
import { measuredPaneComparison } from "@scripts/reference/measured-pane";
import { shadingComparison } from "@scripts/reference/shading";
import { shadingDiffuseComparison } from "@scripts/reference/shading-diffuse";
import { uValueComparison } from "@scripts/reference/u-value";
import { absorbingPaneDomain } from "@/lib/reference-cases/absorbing-pane";
import { fresnelDomain } from "@/lib/reference-cases/fresnel";
import { gasPropertiesDomain } from "@/lib/reference-cases/gas-properties";
import { gValueDomain } from "@/lib/reference-cases/g-value";
import { hemisphericalDomain } from "@/lib/reference-cases/hemispherical";
import { incidence } from "@/lib/reference-cases/incidence";
import { irradiance } from "@/lib/reference-cases/irradiance";
import { layerStackDomain } from "@/lib/reference-cases/layer-stack";
import { measuredPaneDomain } from "@/lib/reference-cases/measured-pane";
import { shading } from "@/lib/reference-cases/shading";
import { shadingDiffuse } from "@/lib/reference-cases/shading-diffuse";
import type { ReferenceDomain } from "@/lib/reference-cases/types";
import { uValueDomain } from "@/lib/reference-cases/u-value";

/**
 * One script and the domain it answers for. `slack`: the relative allowance on each tolerance for its binary
 * representation (1e-9 for tolerances of printed digits, 0 where the domain's tests compare with the bound
 * itself). `closedForm`: the script evaluates the domain's closed-form cases too.
 */
interface ScriptEntry {
  readonly script: string;
  readonly domain: ReferenceDomain;
  readonly rows: () => readonly ComparisonRow[];
  readonly slack: 1e-9 | 0;
  readonly closedForm: boolean;
}

const entries: readonly ScriptEntry[] = [
  { script: "fresnel", domain: fresnelDomain, rows: fresnelComparison, slack: 1e-9, closedForm: false },
  { script: "absorbing-pane", domain: absorbingPaneDomain, rows: absorbingPaneComparison, slack: 1e-9, closedForm: false },
  { script: "measured-pane", domain: measuredPaneDomain, rows: measuredPaneComparison, slack: 1e-9, closedForm: false },
  { script: "layer-stack", domain: layerStackDomain, rows: layerStackComparison, slack: 1e-9, closedForm: false },
  { script: "hemispherical", domain: hemisphericalDomain, rows: hemisphericalComparison, slack: 1e-9, closedForm: false },
  { script: "gas-properties", domain: gasPropertiesDomain, rows: gasPropertiesComparison, slack: 0, closedForm: true },
  { script: "u-value", domain: uValueDomain, rows: uValueComparison, slack: 0, closedForm: true },
  { script: "g-value", domain: gValueDomain, rows: gValueComparison, slack: 0, closedForm: true },
  { script: "incidence", domain: incidence, rows: incidenceComparison, slack: 1e-9, closedForm: false },
  { script: "irradiance", domain: irradiance, rows: irradianceComparison, slack: 1e-9, closedForm: false },
  { script: "shading", domain: shading, rows: shadingComparison, slack: 1e-9, closedForm: false },
  { script: "shading-diffuse", domain: shadingDiffuse, rows: shadingDiffuseComparison, slack: 0, closedForm: false },
];

/** |recomputed − printed| ≤ tolerance · (1 + slack) for every row, and the script's own verdict agrees. */
function expectReproduced(rows: readonly ComparisonRow[], slack: number): void {
  for (const r of rows) {
    expect(Number.isFinite(r.recomputed), `${r.caseId} ${r.quantity}: the script computes no value`).toBe(true);
    expect(Math.abs(r.recomputed - r.printed), `${r.caseId} ${r.quantity}: printed ${r.printed}, recomputed ${r.recomputed}`).toBeLessThanOrEqual(
      r.tolerance * (1 + slack),
    );
    expect(r.within, `${r.caseId} ${r.quantity}: the script's verdict`).toBe(true);
  }
}

describe.each(entries.map((e) => [`scripts/reference/${e.script}.ts`, e] as const))(
  "%s reproduces its cases",
  (_path, { script, domain, rows: comparison, slack, closedForm }) => {
    const rows = comparison();
    const due = domain.cases.filter((c) => c.source.kind === "computed" || (closedForm && c.source.kind === "closed-form"));

    it("covers every computed case of its domain (and every closed-form case it evaluates), each value once", () => {
      expect(due.length).toBeGreaterThan(0);
      // no computed case is left to another script
      for (const c of due) if (c.source.kind === "computed") expect(c.source.script, c.id).toBe(`scripts/reference/${script}.ts`);
      const covered = new Set(rows.map((r) => r.caseId));
      for (const c of due) expect(covered.has(c.id), c.id).toBe(true);
      expect(rows).toHaveLength(due.reduce((n, c) => n + c.expected.length, 0));
    });

    it.each(rows.map((r) => [`${r.caseId} ${r.quantity}`, r] as const))("%s within its tolerance", (_name, r) => {
      expectReproduced([r], slack);
    });
  },
);

describe("scripts/reference/g-value.ts: the printed optical inputs of the g cases", () => {
  // The optical inputs of the g cases are printed optics of the named panes: recomputed from the panes
  // (Fresnel + slab + adding method, 400-node Gauss–Legendre) they agree within half a printed unit.
  const optics = opticalInputComparison();
  it("recomputes every printed optical input (T, R, A_k) within its printed rounding", () => {
    const printed = gValueDomain.cases.reduce((n, c) => {
      const o = c.input.optics;
      return o ? n + 1 + (o.solarReflectanceFront === undefined ? 0 : 1) + o.absorptances.length : n;
    }, 0);
    expect(optics).toHaveLength(printed);
    expectReproduced(optics, 0);
  });

  it("reproduces every printed g and q_i from the recomputed, unrounded optics too", () => {
    const fromOptics = gFromRecomputedOpticsComparison();
    expect(fromOptics.length).toBeGreaterThan(0);
    expectReproduced(fromOptics, 0);
  });
});

describe("the scripts and case modules are independent of the product's code", () => {
  // tests run from the repository root
  const scriptDir = join(process.cwd(), "scripts", "reference");
  const caseDir = join(process.cwd(), "src", "lib", "reference-cases");
  const tsFiles = (dir: string) =>
    readdirSync(dir)
      .filter((f) => f.endsWith(".ts"))
      .sort();
  /** Every module a file loads: `import … from`, `export … from`, `import "…"` and `import("…")`. */
  const importsOf = (path: string) => {
    const text = readFileSync(path, "utf8");
    const forms = [/^\s*(?:import|export)\b[^;]*?from\s+['"]([^'"]+)['"]/gm, /^\s*import\s+['"]([^'"]+)['"]/gm, /\bimport\(\s*['"]([^'"]+)['"]/g];
    return forms.flatMap((re) => [...text.matchAll(re)].map((m) => m[1]!));
  };
  /** npm packages the scripts may use: general-purpose libraries, not the product. */
  const LIBRARIES = ["complex.js"];

  it("finds every script of the table above and the shared comparison", () => {
    expect(tsFiles(scriptDir)).toEqual([...entries.map((e) => `${e.script}.ts`), "compare.ts"].sort());
  });

  it.each(tsFiles(scriptDir))("scripts/reference/%s imports only case modules, other scripts, node: modules and libraries", (name) => {
    const imports = importsOf(join(scriptDir, name));
    expect(imports.length, name).toBeGreaterThan(0);
    for (const spec of imports) {
      expect(spec, `${name} imports ${spec}`).not.toMatch(/lib\/(physics|calc)/);
      const allowed = spec.startsWith("@/lib/reference-cases/") || /^\.\/[\w-]+$/.test(spec) || spec.startsWith("node:") || LIBRARIES.includes(spec);
      expect(allowed, `${name} imports ${spec}`).toBe(true);
    }
  });

  it.each(tsFiles(caseDir))("src/lib/reference-cases/%s is pure data: it imports only files of its own folder", (name) => {
    const imports = importsOf(join(caseDir, name));
    // a module of cases builds a domain of the shared shapes
    if (/\bReferenceDomain</.test(readFileSync(join(caseDir, name), "utf8")) && name !== "types.ts") expect(imports, name).toContain("./types");
    for (const spec of imports) {
      expect(spec, `${name} imports ${spec}`).toMatch(/^\.\/[\w-]+$/);
      expect(tsFiles(caseDir), `${name} imports ${spec}`).toContain(`${spec.slice(2)}.ts`);
    }
  });
});
