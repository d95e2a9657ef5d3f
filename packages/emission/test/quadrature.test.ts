import { describe, expect, test } from 'vitest';
import { adaptiveKronrod, kronrodPanel } from '@penumbra/emission/internal';

describe('Gauss–Kronrod rule (QUADPACK qk15 nodes, Piessens et al. 1983)', () => {
  test('the 15-point Kronrod rule integrates x^k on [0, 1] exactly for k ≤ 22 (to 1e-14 relative)', () => {
    for (let k = 0; k <= 22; k++) {
      const p = kronrodPanel((x) => [x ** k], 0, 1, 1);
      expect(Math.abs(p.value[0] * (k + 1) - 1)).toBeLessThan(1e-14);
    }
  });
  test('the embedded 7-point Gauss rule is exact to degree 13: its error estimate is at the rounding floor there (below 1e-13)', () => {
    for (let k = 0; k <= 13; k++) expect(kronrodPanel((x) => [x ** k], -1, 1, 1).error[0]).toBeLessThan(1e-13);
  });
  test('adaptive integration of x³e^{−x} over [0, 60] gives Γ(4) = 6 (Abramowitz & Stegun 6.1.1) to 1e-10 relative', () => {
    const r = adaptiveKronrod((x) => [x ** 3 * Math.exp(-x), x * Math.exp(-x)], [0, 60], [1e-11, 1e-11]);
    expect(Math.abs(r.value[0] / 6 - 1)).toBeLessThan(1e-10);
    expect(Math.abs(r.value[1] - 1)).toBeLessThan(1e-10);
    expect(r.error[0]).toBeLessThan(1e-10);
  });
});
