/**
 * Massive scalar at a = 0: the Teukolsky-type route (@penumbra/flux, radial
 * equation with −μ²r², far series in the long-range phase) against the
 * independent real-potential solver (@penumbra/regge-wheeler, V = f[l(l+1)/r²
 * + 2M/r³ + μ²], its own series; the two share no numerical code).
 */
import { describe, expect, it } from 'vitest';
import { greybody } from '@penumbra/flux';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';

const CASES: [number, number, number][] = [
  // l, Mω, Mμ: near threshold (v ≈ 0.14), moderate, high l, ω ≫ μ
  [0, 0.1, 0.099],
  [0, 0.3, 0.2],
  [1, 0.4, 0.3],
  [2, 0.6, 0.5],
  [3, 1.0, 0.4],
  [1, 1.2, 0.05],
];

describe('massive scalar: Teukolsky-type route against the Regge–Wheeler-type solver at a = 0', () => {
  it(`agrees on Γ to 1e-9 relative and on the reflection to 1e-9 for ${CASES.length} modes from near threshold to ω ≫ μ`, () => {
    for (const [l, omega, mu] of CASES) {
      const t = greybody({ hole: { a: 0 }, mode: { field: { spin: 0, mass: mu }, l, m: 0 }, omega }, { tol: 1e-10 });
      const r = schwarzschildGreybody({ field: { spin: 0, mass: mu }, l, omega });
      const where = `l=${l} Mω=${omega} Mμ=${mu}`;
      expect(Math.abs(t.gamma / r.gamma - 1), where).toBeLessThan(1e-9);
      expect(Math.abs(t.reflection - r.reflection), where).toBeLessThan(1e-9);
    }
  });
});
