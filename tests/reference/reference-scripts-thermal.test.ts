// The computed check values of the thermal case modules are reproduced by their independent scripts
// (scripts/reference/*.ts) within each case's tolerance, so a case value cannot drift from its formula.
import { describe, expect, it } from 'vitest';
import { gasPropertiesDomain } from '@/lib/reference-cases/gas-properties';
import { gasPropertiesComparison } from '@scripts/reference/gas-properties';
import type { ComparisonRow } from '@scripts/reference/thermal-compare';

const expectReproduced = (rows: readonly ComparisonRow[]) => {
  for (const r of rows) {
    expect(Math.abs(r.recomputed - r.printed), `${r.caseId} ${r.quantity}: printed ${r.printed}, recomputed ${r.recomputed}`).toBeLessThanOrEqual(r.tolerance);
  }
};

describe('scripts/reference/gas-properties.ts', () => {
  const rows = gasPropertiesComparison();
  it('covers every computed and closed-form case', () => {
    const covered = new Set(rows.map((r) => r.caseId));
    for (const c of gasPropertiesDomain.cases) {
      if (c.source.kind === 'computed' || c.source.kind === 'closed-form') expect(covered.has(c.id), c.id).toBe(true);
    }
  });
  it('reproduces every computed value within its tolerance', () => expectReproduced(rows));
});
