/**
 * The massive Klein–Gordon potential V = f[l(l+1)/r² + 2M/r³ + μ²] of the
 * Schwarzschild reference solver, with its own far-zone series carrying the
 * long-range phase k r* + (Mμ²/k) ln r (docs/massive-fields.md, section 4).
 * Reference: the 30-digit mpmath values of test/fixtures/massive (made by
 * make_massive_reference.py there, from the Kerr-form radial equation at a = 0).
 */
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { integrateOnce } from '@penumbra/regge-wheeler/internal';

interface Row {
  l: number;
  a: number;
  omega: number;
  fieldMass: number;
  gamma_str: string;
  reflection_str: string;
}
const rows: Row[] = JSON.parse(
  readFileSync(new URL('../../../test/fixtures/massive/reference.json', import.meta.url), 'utf8'),
).rows.filter((r: Row) => r.a === 0);

describe('massive scalar on Schwarzschild (reference solver)', () => {
  it(`matches the ${rows.length} a = 0 rows of the 30-digit mpmath reference to 1e-10 relative, reflection to 1e-10`, () => {
    expect(rows.length).toBeGreaterThanOrEqual(3);
    for (const r of rows) {
      const g = schwarzschildGreybody({ field: { spin: 0, mass: r.fieldMass }, l: r.l, omega: r.omega });
      const where = `l=${r.l} Mω=${r.omega} Mμ=${r.fieldMass}`;
      expect(Math.abs(g.gamma / Number(r.gamma_str) - 1), where).toBeLessThan(1e-10);
      expect(Math.abs(g.reflection - Number(r.reflection_str)), where).toBeLessThan(1e-10);
      expect(g.residual, where).toBeLessThan(1e-10);
      expect(g.fieldMass).toBe(r.fieldMass);
    }
  });

  it('does not move with the matching radius or the start point: Γ at r_match = 60M … 2000M, start offsets 0.1 … 0.3 agree to 1e-10 relative', () => {
    const problem = { field: { spin: 0 as const, mass: 0.3 }, l: 1, omega: 0.4 };
    const base = integrateOnce(problem, { tol: 1e-12 }).gamma;
    for (const matchRadius of [60, 300, 2000]) {
      expect(Math.abs(integrateOnce(problem, { tol: 1e-12, matchRadius }).gamma / base - 1)).toBeLessThan(1e-10);
    }
    for (const startOffset of [0.1, 0.3]) {
      expect(Math.abs(integrateOnce(problem, { tol: 1e-12, startOffset }).gamma / base - 1)).toBeLessThan(1e-10);
    }
  });

  it('mass 0 given explicitly is the massless Regge–Wheeler result exactly', () => {
    const a = schwarzschildGreybody({ field: { spin: 0, mass: 0 }, l: 1, omega: 0.4 });
    const b = schwarzschildGreybody({ field: { spin: 0 }, l: 1, omega: 0.4 });
    expect(a).toEqual(b);
  });

  it('refuses Mω ≤ Mμ (InputError naming omega) and a massive field of spin ≠ 0 (InputError naming field.mass)', () => {
    expect(() => schwarzschildGreybody({ field: { spin: 0, mass: 0.4 }, l: 0, omega: 0.4 })).toThrow(InputError);
    expect(() => schwarzschildGreybody({ field: { spin: 0, mass: 0.4 }, l: 0, omega: 0.4 })).toThrow(
      expect.objectContaining({ parameter: 'omega' }),
    );
    expect(() => schwarzschildGreybody({ field: { spin: 1, mass: 0.1 }, l: 1, omega: 0.4 })).toThrow(
      expect.objectContaining({ parameter: 'field.mass' }),
    );
  });
});
