/**
 * Superradiance. Sign rules: Γ < 0 exactly for bosons with 0 < ω < mΩ_H and
 * fermions never amplify (Teukolsky & Press, ApJ 193, 443 (1974); Unruh,
 * Phys. Rev. D 10, 3194 (1974) for the Dirac field). Peak amplifications are
 * the rounded figures of Teukolsky & Press 1974 (values from memory, physics
 * notes): ≈0.4 % (s = 0, l = m = 1, a little below and largest near a ≈ 0.99),
 * ≈4.4 % (s = 1, l = m = 1, near extremality), 138 % (s = 2, l = m = 2, only
 * as a → 1; far lower at a = 0.99). We test trends and rounded figures.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { kerrHole } from '@penumbra/kerr';
import { greybody } from '@penumbra/flux';

function peakAmplification(spin: number, l: number, m: number, a: number, n = 40): number {
  const omegaH = kerrHole({ a: a }).omegaH;
  let best = 0;
  // coarse scan, then a golden-section polish around the best point
  let bestW = 0;
  for (let i = 1; i < n; i++) {
    const w = (m * omegaH * i) / n;
    const z = greybody(
      { hole: { a }, mode: { field: { spin }, l, m }, omega: w },
      { tol: 1e-7, reflection: false },
    ).amplification;
    if (z > best) [best, bestW] = [z, w];
  }
  let lo = Math.max(bestW - (m * omegaH) / n, 1e-4),
    hi = Math.min(bestW + (m * omegaH) / n, m * omegaH * 0.9999);
  const f = (w: number) =>
    greybody({ hole: { a }, mode: { field: { spin }, l, m }, omega: w }, { tol: 1e-7, reflection: false }).amplification;
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < 25; i++) {
    const x1 = hi - g * (hi - lo),
      x2 = lo + g * (hi - lo);
    if (f(x1) > f(x2)) hi = x2;
    else lo = x1;
  }
  return Math.max(best, f((lo + hi) / 2));
}

describe('superradiant amplification', () => {
  it('s = 0, l = m = 1: the peak is a little below 0.4 % and larger at a = 0.99 than at 0.9 or 0.9999 (rounded figure, from memory)', () => {
    const p90 = peakAmplification(0, 1, 1, 0.9);
    const p99 = peakAmplification(0, 1, 1, 0.99);
    const p9999 = peakAmplification(0, 1, 1, 0.9999);
    expect(p99).toBeGreaterThan(0.0033);
    expect(p99).toBeLessThan(0.004);
    expect(p99).toBeGreaterThan(p90);
    expect(p99).toBeGreaterThan(p9999);
  });

  it('s = 1, l = m = 1: the peak near extremality (a = 0.999) rounds to 4.4 % (from memory), to ±0.15 %', () => {
    expect(Math.abs(peakAmplification(1, 1, 1, 0.999) - 0.044)).toBeLessThan(0.0015);
  });

  it('s = 2, l = m = 2: the peak grows toward 138 % as a → 1 (from memory): ~55 % at 0.99, > 100 % at 0.999, < 138 % at 0.9999', () => {
    const p99 = peakAmplification(2, 2, 2, 0.99, 20);
    const p999 = peakAmplification(2, 2, 2, 0.999, 20);
    const p9999 = peakAmplification(2, 2, 2, 0.9999, 20);
    expect(p99).toBeGreaterThan(0.4);
    expect(p99).toBeLessThan(0.7);
    expect(p999).toBeGreaterThan(1.0);
    expect(p9999).toBeGreaterThan(p999);
    expect(p9999).toBeLessThan(1.38);
  });

  it('bosons: Γ < 0 exactly inside 0 < ω < mΩ_H and Γ > 0 outside it (property, fast-check)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(0, 1, 2),
        fc.double({ min: 0.3, max: 0.999, noNaN: true }),
        fc.double({ min: 0.05, max: 1.95, noNaN: true }),
        (spin, a, fraction) => {
          const l = Math.max(spin, 1),
            m = l;
          const omegaH = kerrHole({ a: a }).omegaH;
          const omega = fraction * m * omegaH;
          const g = greybody({ hole: { a }, mode: { field: { spin }, l, m }, omega }, { tol: 1e-6, reflection: false });
          return fraction < 1 ? g.gamma < 0 && g.superradiant : g.gamma > 0 && !g.superradiant;
        },
      ),
      { numRuns: 25, seed: 42 },
    );
  });

  it('s = 1/2 never amplifies: 0 < Γ ≤ 1 across the would-be superradiant band (property, fast-check)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.3, max: 0.9999, noNaN: true }),
        fc.double({ min: 0.05, max: 1.5, noNaN: true }),
        (a, fraction) => {
          const omega = fraction * 0.5 * kerrHole({ a: a }).omegaH;
          const g = greybody({ hole: { a }, mode: { field: { spin: 0.5 }, l: 0.5, m: 0.5 }, omega }, { tol: 1e-6 });
          return g.gamma > 0 && g.gamma <= 1 + 1e-9 && !g.superradiant;
        },
      ),
      { numRuns: 20, seed: 7 },
    );
  });

  it('Γ crosses zero smoothly at the threshold ω = mΩ_H (s = 2, a = 0.9): Γ/k is continuous within 1e-4 across ±1e-6', () => {
    const a = 0.9,
      m = 2,
      l = 2;
    const w0 = m * kerrHole({ a: a }).omegaH;
    const below = greybody({ hole: { a }, mode: { field: { spin: 2 }, l, m }, omega: w0 - 1e-6 });
    const above = greybody({ hole: { a }, mode: { field: { spin: 2 }, l, m }, omega: w0 + 1e-6 });
    expect(below.gamma).toBeLessThan(0);
    expect(above.gamma).toBeGreaterThan(0);
    expect(Math.abs(below.gamma / below.k / (above.gamma / above.k) - 1)).toBeLessThan(1e-4);
  });
});
