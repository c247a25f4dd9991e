// The computed check values of the thermal case modules are reproduced by their independent scripts
// (scripts/reference/*.ts) within each case's tolerance, so a case value cannot drift from its formula.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { gasPropertiesDomain } from '@/lib/reference-cases/gas-properties';
import { gValueDomain } from '@/lib/reference-cases/g-value';
import { uValueDomain } from '@/lib/reference-cases/u-value';
import { gasPropertiesComparison } from '@scripts/reference/gas-properties';
import { uValueComparison } from '@scripts/reference/u-value';
import { gFromRecomputedOpticsComparison, gValueComparison, opticalInputComparison } from '@scripts/reference/g-value';
import type { ComparisonRow } from '@scripts/reference/thermal-compare';
import type { ReferenceDomain } from '@/lib/reference-cases/types';

const expectReproduced = (rows: readonly ComparisonRow[]) => {
  for (const r of rows) {
    expect(Math.abs(r.recomputed - r.printed), `${r.caseId} ${r.quantity}: printed ${r.printed}, recomputed ${r.recomputed}`).toBeLessThanOrEqual(r.tolerance);
  }
};

/** Every computed or closed-form case of the domain is covered by the script (none is left out). */
const expectCovered = (domain: ReferenceDomain, rows: readonly ComparisonRow[]) => {
  const covered = new Set(rows.map((r) => r.caseId));
  const due = domain.cases.filter((c) => c.source.kind === 'computed' || c.source.kind === 'closed-form');
  expect(due.length).toBeGreaterThan(0);
  for (const c of due) expect(covered.has(c.id), c.id).toBe(true);
  expect(rows).toHaveLength(due.reduce((n, c) => n + c.expected.length, 0));
};

describe('scripts/reference/gas-properties.ts', () => {
  const rows = gasPropertiesComparison();
  it('covers every computed and closed-form case', () => expectCovered(gasPropertiesDomain, rows));
  it('reproduces every computed value within its tolerance', () => expectReproduced(rows));
});

describe('scripts/reference/u-value.ts', () => {
  const rows = uValueComparison();
  it('covers every computed and closed-form case', () => expectCovered(uValueDomain, rows));
  it('reproduces every computed value within its tolerance', () => expectReproduced(rows));
});

describe('scripts/reference/g-value.ts', () => {
  const rows = gValueComparison();
  it('covers every computed and closed-form case', () => expectCovered(gValueDomain, rows));
  it('reproduces every g, q_i, N_k, Λ and h_s from the printed optical inputs within its tolerance', () => expectReproduced(rows));

  // The optical inputs of the g cases are printed optics of the named panes: recomputed from the panes
  // (Fresnel + slab + adding method, 400-node Gauss–Legendre) they agree within half a printed unit.
  const optics = opticalInputComparison();
  it('recomputes every printed optical input (T, R, A_k) within its printed rounding', () => {
    const printed = gValueDomain.cases.reduce((n, c) => {
      const o = c.input.optics;
      return o ? n + 1 + (o.solarReflectanceFront === undefined ? 0 : 1) + o.absorptances.length : n;
    }, 0);
    expect(optics).toHaveLength(printed);
    expectReproduced(optics);
  });

  it('reproduces every printed g and q_i from the recomputed, unrounded optics too', () => {
    const fromOptics = gFromRecomputedOpticsComparison();
    expect(fromOptics.length).toBeGreaterThan(0);
    expectReproduced(fromOptics);
  });
});

describe('independence', () => {
  const importsOf = (path: string) => [...readFileSync(path, 'utf8').matchAll(/^\s*import\b[^;]*?from\s+['"]([^'"]+)['"]/gm)].map((m) => m[1]!);

  it('the thermal scripts import no product code (only case modules, each other and libraries)', () => {
    for (const script of ['gas-properties', 'u-value', 'g-value', 'thermal-compare']) {
      const imports = importsOf(`scripts/reference/${script}.ts`);
      expect(imports.length, script).toBeGreaterThan(0);
      for (const from of imports) {
        expect(from.startsWith('@/lib/reference-cases/') || from.startsWith('./'), `${script}.ts imports ${from}`).toBe(true);
      }
    }
  });

  it('the thermal case modules are pure data: they import nothing but ./types', () => {
    for (const domain of ['gas-properties', 'u-value', 'g-value']) {
      expect(importsOf(`src/lib/reference-cases/${domain}.ts`), domain).toEqual(['./types']);
    }
  });
});
