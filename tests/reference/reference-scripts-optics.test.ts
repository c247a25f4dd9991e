// The computed-kind optics reference cases must be reproduced by their scripts under scripts/reference/,
// each within the case's own tolerance, so that a case value cannot drift from its formula.
import { readdirSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { absorbingPaneComparison } from "@scripts/reference/absorbing-pane";
import { fresnelComparison } from "@scripts/reference/fresnel";
import { hemisphericalComparison } from "@scripts/reference/hemispherical";
import { layerStackComparison } from "@scripts/reference/layer-stack";
import { measuredPaneComparison } from "@scripts/reference/measured-pane";
import type { ComparisonRow } from "@scripts/reference/optics-compare";
import { absorbingPaneDomain } from "@/lib/reference-cases/absorbing-pane";
import { fresnelDomain } from "@/lib/reference-cases/fresnel";
import { hemisphericalDomain } from "@/lib/reference-cases/hemispherical";
import { layerStackDomain } from "@/lib/reference-cases/layer-stack";
import { measuredPaneDomain } from "@/lib/reference-cases/measured-pane";
import type { ReferenceDomain } from "@/lib/reference-cases/types";

function expectReproduced(domain: ReferenceDomain, rows: readonly ComparisonRow[]): void {
  const computedValues = domain.cases
    .filter((c) => c.source.kind === "computed")
    .reduce((n, c) => n + c.expected.length, 0);
  // every expected value of every computed case is compared (no case is left to another script)
  expect(rows).toHaveLength(computedValues);
  for (const r of rows) {
    expect(Number.isFinite(r.recomputed), `${r.caseId} ${r.quantity}: the script computes no value`).toBe(true);
    expect(
      Math.abs(r.recomputed - r.printed),
      `${r.caseId} ${r.quantity}: printed ${r.printed}, script ${r.recomputed}`,
    ).toBeLessThanOrEqual(r.tolerance * (1 + 1e-9));
  }
}

describe("optics reference scripts reproduce the computed cases", () => {
  it("fresnel: scripts/reference/fresnel.ts", () => expectReproduced(fresnelDomain, fresnelComparison()));
  it("absorbing-pane: scripts/reference/absorbing-pane.ts", () =>
    expectReproduced(absorbingPaneDomain, absorbingPaneComparison()));
  it("measured-pane: scripts/reference/measured-pane.ts", () =>
    expectReproduced(measuredPaneDomain, measuredPaneComparison()));
  it("layer-stack: scripts/reference/layer-stack.ts", () => expectReproduced(layerStackDomain, layerStackComparison()));
  it("hemispherical: scripts/reference/hemispherical.ts (400-node Gauss–Legendre)", () =>
    expectReproduced(hemisphericalDomain, hemisphericalComparison()));
});

describe("the optics reference scripts are independent of the product's code", () => {
  const dir = join(process.cwd(), "scripts", "reference"); // tests run from the repository root
  const scripts = ["fresnel.ts", "absorbing-pane.ts", "measured-pane.ts", "layer-stack.ts", "hemispherical.ts", "optics-compare.ts"];
  it.each(scripts)("%s imports neither src/lib/physics nor src/lib/calc", (name) => {
    expect(readdirSync(dir)).toContain(name);
    const imports = [...readFileSync(join(dir, name), "utf8").matchAll(/^import[^;]*?from\s+"([^"]+)"/gms)].map((m) => m[1]!);
    expect(imports.length).toBeGreaterThan(0);
    for (const spec of imports) {
      expect(spec, `${name} imports ${spec}`).not.toMatch(/lib\/(physics|calc)/);
      if (spec.startsWith("@/")) expect(spec, `${name} imports ${spec}`).toMatch(/^@\/lib\/reference-cases\//);
    }
  });
});
