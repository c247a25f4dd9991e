// The computed-kind optics reference cases must be reproduced by their scripts under scripts/reference/,
// each within the case's own tolerance, so that a case value cannot drift from its formula.
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
