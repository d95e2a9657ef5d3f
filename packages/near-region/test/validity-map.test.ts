import { expect, test } from 'vitest';
import { toCsv } from '@penumbra/core';
import { validityEdgesTable, validityMap, validityPointsTable } from '@penumbra/near-region';

// A tiny map (the full one is bench/near-region-map.mjs). Its content follows from the O(Mω) correction measured in
// limit.test.ts (rate near −2π, the Sommerfeld factor of Page, Phys. Rev. D 13, 198 (1976)): within 1 % up to
// Mω ≈ 1e-3, within 10 % up to Mω ≈ 1e-2, not at Mω = 0.1.
test('tiny map, s = 0, l = m = 0, a = 0.5 and 0.9, Mω = 1e-3, 1e-2, 0.1: edges 1e-3 (1 %) and 1e-2 (10 %), and tables with units in the header', () => {
  const map = validityMap(
    { mode: { field: { spin: 0 }, l: 0, m: 0 }, aValues: [0.5, 0.9], omegaValues: [1e-3, 1e-2, 0.1] },
    { tol: 1e-6 },
  );
  expect(map.points).toHaveLength(6);
  for (const edge of map.edges) {
    expect(edge.within1Percent).toBe(1e-3);
    expect(edge.within10Percent).toBe(1e-2);
  }
  const csv = toCsv(validityPointsTable([map]));
  expect(csv.split('\n')[0]).toBe('spin [1],l [1],m [1],a [M],omega [1/M],gamma [1],gammaNearRegion [1],ratio [1]');
  expect(toCsv(validityEdgesTable([map])).split('\n')[0]).toBe(
    'spin [1],l [1],m [1],a [M],within1Percent [1/M],within10Percent [1/M]',
  );
});
