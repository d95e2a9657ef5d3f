/**
 * Robustness sweep over the whole supported range (issue scope: every spin,
 * |a| ≤ 0.9999, 1e-4 ≤ Mω ≤ 30 here, l up to s + 20): every mode returns
 * with an error estimate within the request and, where Γ is not negligible,
 * conserves flux. Invariants only (Γ + R = 1 with R from the −s field);
 * reference values are checked elsewhere.
 */
import { describe, expect, it } from 'vitest';
import { greybody } from '@penumbra/flux';

describe('sweep over spins, spins of the hole, frequencies and multipoles', () => {
  for (const spin of [0, 0.5, 1, 2]) {
    it(`s = ${spin}: a ∈ {0, 0.99, −0.9999}, Mω ∈ {1e-4, 1e-2, 1, 10, 30}, l ∈ {s, s+20}, m = l: relError ≤ 1e-8 and |Γ + R − 1| < 1e-8`, () => {
      for (const a of [0, 0.99, -0.9999]) {
        for (const omega of [1e-4, 1e-2, 1, 10, 30]) {
          for (const L of [spin, spin + 20]) {
            const r = greybody({ hole: { a }, mode: { field: { spin }, l: L, m: L }, omega });
            expect(r.relError, `a=${a} Mω=${omega} l=${L}`).toBeLessThanOrEqual(1e-8);
            expect(r.residual, `a=${a} Mω=${omega} l=${L}`).toBeLessThan(1e-8);
          }
        }
      }
    });
  }
});
