/**
 * Low-frequency limit: Page, Phys. Rev. D 13, 198 (1976), eqs. (13)–(14), and
 * Starobinsky & Churilov, Sov. Phys. JETP 38, 1 (1974). The formula is the
 * leading term; the first correction is roughly a factor 1 + 2πMω (physics
 * notes), so we test the limit: the ratio numerical/formula approaches 1
 * linearly in Mω, not a tight match at one frequency.
 */
import { describe, expect, it } from 'vitest';
import { greybody, lowFrequencyGreybody } from '@penumbra/flux';

const CASES: [number, number, number, number][] = [
  [0, 0, 0, 0],
  [0, 1, 1, 0.9],
  [0.5, 0.5, 0.5, 0.9],
  [0.5, 1.5, -0.5, 0.5],
  [1, 1, 1, 0.7],
  [1, 1, -1, 0.99],
  [1, 2, 0, 0],
  [2, 2, 2, 0.9],
  [2, 2, 1, 0.5],
  [2, 3, 3, 0.99],
];

describe('greybody factors approach the Page/Starobinsky low-frequency formula', () => {
  for (const [spin, l, m, a] of CASES) {
    it(`s=${spin} l=${l} m=${m} a=${a}: |ratio − 1| < 4·(2πMω) at Mω = 1e-4 and shrinks ~10× from Mω = 1e-3 to 1e-4`, () => {
      const dev = [1e-3, 1e-4].map((omega) => {
        const g = greybody({ hole: { a }, mode: { field: { spin }, l, m }, omega });
        const f = lowFrequencyGreybody({ hole: { a }, mode: { field: { spin }, l, m }, omega });
        expect(Math.sign(g.gamma)).toBe(Math.sign(f));
        return g.gamma / f - 1;
      });
      expect(Math.abs(dev[1])).toBeLessThan(4 * 2 * Math.PI * 1e-4);
      const shrink = dev[0] / dev[1];
      expect(shrink).toBeGreaterThan(7);
      expect(shrink).toBeLessThan(13);
    });
  }

  it('reaches Γ ~ 1e-30 (s = 2, l = 3, Mω = 1e-4) with an error estimate below 1e-8', () => {
    const g = greybody({ hole: { a: 0.99 }, mode: { field: { spin: 2 }, l: 3, m: 3 }, omega: 1e-4 });
    expect(Math.abs(g.gamma)).toBeLessThan(1e-29);
    expect(g.relError).toBeLessThan(1e-8);
    expect(g.residual).toBeLessThan(1e-8);
  });
});
