/**
 * The l range of emission spectra: the default maxL follows the highest
 * frequency by the geometric-optics rule (cut Mω·b_retro − 1/2, b_retro = 3√3
 * at a = 0: Bardeen, Press & Teukolsky, ApJ 178, 347 (1972)), and an l-sum
 * that could not stop within maxL is refused before any greybody solve.
 */
import { describe, expect, it } from 'vitest';
import { ConvergenceError } from '@penumbra/core';
import { emissionSpectrum } from '@penumbra/emission';

describe('emission spectra over the documented l range', () => {
  it('a spectrum whose l-sum cannot stop within the given maxL = 50 (Mω = 20, a = 0 needs l > 103) is refused before any point, with maxL, lCut and lNeeded in the diagnostics', () => {
    let points = 0;
    let error: unknown;
    try {
      emissionSpectrum({ hole: { a: 0 }, field: { spin: 1 }, grid: [1, 20] }, { maxL: 50, onPoint: () => points++ });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ConvergenceError);
    expect(points).toBe(0);
    const d = (error as ConvergenceError).diagnostics as unknown as Record<string, unknown>;
    expect(d).toMatchObject({ maxL: 50, lNeeded: 105, limit: 'the maxL option', steps: 0 });
    expect(d.lCut as number).toBeCloseTo(20 * 3 * Math.sqrt(3) - 0.5, 12);
  });

  it('at Mω = 16, a = 0 (whose cut l ≈ 83 is above the former default maxL 80) the spectrum point is computed, summing past l = 83', () => {
    const r = emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [16] }, { tol: 1e-2 });
    expect(r.points[0].lMax).toBeGreaterThan(83);
    expect(r.points[0].number).toBeGreaterThanOrEqual(0);
  });
});
