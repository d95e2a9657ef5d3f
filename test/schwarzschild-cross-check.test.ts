/**
 * The Teukolsky route (packages/flux: −s/+s two-sided shooting with flux
 * normalisations from Teukolsky & Press, ApJ 193, 443 (1974)) against the
 * independent Schwarzschild solver (packages/regge-wheeler: Regge–Wheeler
 * potential for s = 0, 1, 2 and Chandrasekhar's real Dirac potential for
 * s = 1/2, where Γ = |T|² by the Wronskian). The two share no code beyond the
 * Kerr background; agreement pins the flux normalisation of every spin.
 */
import { describe, expect, it } from 'vitest';
import { greybody } from '@penumbra/flux';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';

const OMEGAS = [1e-3, 0.01, 0.1, 0.3, 1, 2, 5];

describe('Teukolsky greybody factors at a = 0 agree with the independent Regge–Wheeler/Dirac solver', () => {
  for (const spin of [0, 0.5, 1, 2]) {
    it(`spin ${spin}: l ≤ 6, 1e-3 ≤ Mω ≤ 5, agree to 1e-9 relative wherever Γ ≥ 1e-30`, () => {
      let compared = 0;
      for (let l = spin; l <= 6; l++) {
        for (const omega of OMEGAS) {
          const ref = schwarzschildGreybody({ field: { spin }, l, omega }, { tol: 1e-11 });
          if (ref.gamma < 1e-30) continue;
          const m = spin === 0.5 ? 0.5 : 0;
          const got = greybody({ hole: { a: 0 }, mode: { field: { spin }, l, m }, omega }, { tol: 1e-10 });
          expect(Math.abs(got.gamma / ref.gamma - 1), `s=${spin} l=${l} Mω=${omega}`).toBeLessThan(1e-9);
          compared++;
        }
      }
      expect(compared).toBeGreaterThan(20);
    });
  }
});
