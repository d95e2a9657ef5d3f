import { describe, expect, test } from 'vitest';
import { lowFrequencyGreybody } from '@penumbra/flux';
import { compareNearRegion, nearRegionForm } from '@penumbra/near-region';

// The near-region form (Castro, Maloney & Strominger, Phys. Rev. D 82, 024008 (2010); weights and matching factor
// for every spin derived in docs/near-region.md) is the leading term of Γ as Mω → 0. Its first correction is O(Mω):
// the far region drops the Newtonian tail, whose Sommerfeld factor is about 1 + 2πMω (Page, Phys. Rev. D 13, 198 (1976)).
const SPINS = [0, 0.5, 1, 2] as const;
const modes = SPINS.flatMap((s) => [s, s + 1].map((l) => ({ field: { spin: s }, l, m: l })));

describe('ratio Γ_near/Γ → 1 as Mω → 0 at fixed a, with an O(Mω) first correction', () => {
  test.each(modes.map((mode) => ({ s: mode.field.spin, l: mode.l, mode })))(
    's = $s, l = m = $l, a = 0.5: |ratio − 1| < 10 Mω at Mω = 1e-3 and 1e-4, and (ratio − 1)/Mω agrees at both to 5 % (a linear rate)',
    ({ mode }) => {
      const slope = (omega: number) => {
        const c = compareNearRegion({ hole: { a: 0.5 }, mode, omega }, { tol: 1e-9 });
        expect(Math.abs(c.ratio - 1)).toBeLessThan(10 * omega);
        return (c.ratio - 1) / omega;
      };
      const coarse = slope(1e-3);
      const fine = slope(1e-4);
      expect(Math.abs(coarse / fine - 1)).toBeLessThan(0.05);
      // the measured rate is near −2π, the Sommerfeld factor's (Page 1976); common practice, no source for the band
      expect(fine).toBeLessThan(-4);
      expect(fine).toBeGreaterThan(-9);
    },
  );
});

describe('agreement with the low-frequency formula (Page, Phys. Rev. D 13, 198 (1976); Starobinsky & Churilov, Sov. Phys. JETP 38, 1 (1974))', () => {
  const cases = [
    { spin: 0, l: 0, m: 0, a: 0.5 },
    { spin: 0, l: 2, m: -1, a: 0.9 },
    { spin: 0.5, l: 0.5, m: 0.5, a: 0.5 },
    { spin: 0.5, l: 1.5, m: -1.5, a: 0.7 },
    { spin: 1, l: 1, m: 1, a: 0.5 },
    { spin: 1, l: 2, m: 0, a: 0.3 },
    { spin: 2, l: 2, m: 2, a: 0.99 },
    { spin: 2, l: 3, m: -1, a: 0.8 },
  ] as const;
  test.each(cases)(
    's = $spin, l = $l, m = $m, a = $a: Γ_near/Γ_Page − 1 < 1e-4 at Mω = 1e-5 and its rate (ratio − 1)/Mω moves by less than 1 % from Mω = 1e-5 to 1e-6 (their common limit, reached at O(Mω))',
    ({ spin, l, m, a }) => {
      const rate = (omega: number) => {
        const problem = { hole: { a }, mode: { field: { spin }, l, m }, omega };
        const ratio = nearRegionForm(problem).gammaNearRegion / lowFrequencyGreybody(problem);
        return { deviation: ratio - 1, rate: (ratio - 1) / omega };
      };
      const coarse = rate(1e-5);
      const fine = rate(1e-6);
      expect(Math.abs(coarse.deviation)).toBeLessThan(1e-4);
      // m = 0 has no first-order term: both rates vanish, so compare them absolutely there
      expect(Math.abs(coarse.rate - fine.rate)).toBeLessThan(0.01 * Math.abs(fine.rate) + 1e-3);
    },
  );
});
