import { existsSync, readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';

// Independent arbitrary-precision reference (mpmath), made by
// test/fixtures/greybody/make_reference.py at the repository root.
const FIXTURE = fileURLToPath(new URL('../../../test/fixtures/greybody/reference.json', import.meta.url));

interface ReferenceRow {
  route: string;
  spin: number;
  l: number;
  omega: number;
  omega_str?: string;
  M?: number;
  gamma: number;
  gamma_str?: string;
  digits?: number;
}

function schwarzschildRows(): ReferenceRow[] {
  if (!existsSync(FIXTURE)) return [];
  const doc = JSON.parse(readFileSync(FIXTURE, 'utf8')) as { schwarzschild?: { rows?: ReferenceRow[] } };
  return (doc.schwarzschild?.rows ?? []).filter((row) => row.route === 'regge-wheeler' || row.route === 'dirac');
}

const allRows = schwarzschildRows();
// A 1e-9 comparison needs a reference good to better than 1e-10: the fixture
// stores, per row, the agreement of two runs at different precision, start
// and matching radius in "digits".
const rows = allRows.filter((row) => row.digits === undefined || row.digits >= 11);

describe.skipIf(allRows.length === 0)('mpmath high-precision reference (test/fixtures/greybody/reference.json)', () => {
  it(`matches all ${rows.length} Schwarzschild rows (routes regge-wheeler and dirac) to 1e-9 relative`, () => {
    const failures: string[] = [];
    for (const row of rows) {
      const omega = row.omega_str !== undefined ? Number(row.omega_str) : row.omega;
      const reference = row.gamma_str !== undefined ? Number(row.gamma_str) : row.gamma;
      const ours = schwarzschildGreybody({ field: { spin: row.spin }, l: row.l, omega, mass: row.M ?? 1 });
      const rel = Math.abs(ours.gamma / reference - 1);
      if (!(rel <= 1e-9))
        failures.push(
          `${row.route} s=${row.spin} l=${row.l} Mω=${omega}: ${ours.gamma} vs ${reference} (rel ${rel.toExponential(2)})`,
        );
    }
    expect(failures).toEqual([]);
  });

  it(`uses at least 95 % of the fixture's ${allRows.length} Schwarzschild rows (the rest have fewer than 11 reference digits)`, () => {
    expect(rows.length).toBeGreaterThanOrEqual(0.95 * allRows.length);
  });
});
