/**
 * The radial solution on request. Checks: near the horizon |R|·Δ^s → 1 (the
 * normalisation R → Δ^{−s} e^{−ikr*}, physics notes); on a benign mode the
 * two-sided samples equal the one-sided +s integration; the Z_in returned
 * reproduces Γ through the flux factor of docs/method.md.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { greybody, horizonFactor, radialFunction } from '@penumbra/flux';
import { solveRadial } from '@penumbra/radial';

describe('radialFunction', () => {
  const a = 0.7;
  const hole = kerrHole({ a: a });
  const problem = { hole: { a }, mode: { field: { spin: 2 as const }, l: 2, m: 2 }, omega: 0.5 };
  const radii = [hole.rPlus + 1e-4, hole.rPlus + 0.5, 3, 5, 20];
  const rf = radialFunction(problem, radii, { tol: 1e-10 });

  it('returns one sample per radius, in increasing order', () => {
    expect(rf.samples.map((s) => s.r)).toEqual(radii);
  });
  it('is normalised to Δ^{-s} e^{-ikr*} at the horizon: |R|Δ² = 1 within 1e-3 at r − r+ = 1e-4', () => {
    const s0 = rf.samples[0];
    const D = (s0.r - hole.rPlus) * (s0.r - hole.rMinus);
    expect(Math.abs(Math.hypot(s0.R.re, s0.R.im) * D * D - 1)).toBeLessThan(1e-3);
  });
  it('matches a one-sided +s integration outside the near-horizon zone to 1e-8 relative', () => {
    const lambda = greybody(problem).diagnostics.lambda;
    const one = solveRadial({ hole, s: 2, m: 2, omega: 0.5, lambda }, { tol: 1e-13, grid: radii.slice(1) });
    for (const [i, smp] of one.samples.entries()) {
      const mine = rf.samples[i + 1];
      expect(Math.hypot(mine.R.re - smp.R.re, mine.R.im - smp.R.im) / Math.hypot(smp.R.re, smp.R.im)).toBeLessThan(1e-8);
    }
  });
  it('its Z_in gives back Γ through the horizon flux factor to 1e-8', () => {
    const g = greybody(problem, { tol: 1e-10 });
    const h = horizonFactor(2, hole, 0.5, g.k);
    expect(Math.abs((h * Math.exp(-2 * rf.logAbsZIn)) / g.gamma - 1)).toBeLessThan(1e-8);
  });
});
