/**
 * The boundary series are checked against the radial equation itself, not
 * against reference numbers: two asymptotic solutions must have a constant
 * Wronskian Δ^{s+1}(R₁R₂' − R₁'R₂) (Abel's identity for Teukolsky's equation,
 * ApJ 185, 635 (1973)), and the horizon series summed at x₁ must agree with
 * the series summed at x₀ and integrated to x₁.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial } from '@penumbra/radial';
import { ConvergenceError } from '@penumbra/core';
import { evaluateFar, farSeries, horizonSeriesStart } from '@penumbra/radial/internal';

const modes = [
  { a: 0, s: 2, m: 0, omega: 0.3, lambda: 0 },
  { a: 0.9, s: -1, m: 1, omega: 0.5, lambda: 3.1 },
  { a: 0.7, s: 0.5, m: -0.5, omega: 1.2, lambda: 1.4 },
  { a: 0.999, s: -2, m: 2, omega: 0.8, lambda: 2.2 },
];

function wronskian(
  hole: ReturnType<typeof kerrHole>,
  s: number,
  r: number,
  p: { R: number[]; dR: number[] },
  q: { R: number[]; dR: number[] },
) {
  const re = p.R[0] * q.dR[0] - p.R[1] * q.dR[1] - (p.dR[0] * q.R[0] - p.dR[1] * q.R[1]);
  const im = p.R[0] * q.dR[1] + p.R[1] * q.dR[0] - (p.dR[0] * q.R[1] + p.dR[1] * q.R[0]);
  const w = Math.pow((r - hole.rPlus) * (r - hole.rMinus), s + 1);
  return [re * w, im * w];
}

describe('far-zone asymptotic series', () => {
  for (const { a, ...mode } of modes) {
    it(`in and out series have a constant Wronskian between two radii to 1e-13 (a=${a}, s=${mode.s}, Mω=${mode.omega})`, () => {
      const hole = kerrHole({ a: a });
      const fin = farSeries(hole, mode, -1),
        fout = farSeries(hole, mode, 1);
      const r1 = 60 / mode.omega,
        r2 = 3 * r1;
      const w1 = wronskian(hole, mode.s, r1, evaluateFar(hole, mode, fin, r1), evaluateFar(hole, mode, fout, r1));
      const w2 = wronskian(hole, mode.s, r2, evaluateFar(hole, mode, fin, r2), evaluateFar(hole, mode, fout, r2));
      expect(Math.hypot(w1[0] - w2[0], w1[1] - w2[1]) / Math.hypot(w1[0], w1[1])).toBeLessThan(1e-13);
    });
    it(`the leading powers are r^-1 (in) and r^(-2s-1) (out) (a=${a}, s=${mode.s})`, () => {
      const hole = kerrHole({ a: a });
      expect(farSeries(hole, mode, -1).p).toBeCloseTo(-1, 12);
      expect(farSeries(hole, mode, 1).p).toBeCloseTo(-2 * mode.s - 1, 12);
    });
  }
});

describe('horizon Frobenius series', () => {
  for (const { a, ...mode } of modes) {
    it(`summed at x₁ it agrees with the series at x₀ integrated to x₁ to 1e-10 (a=${a}, s=${mode.s})`, () => {
      const hole = kerrHole({ a: a });
      const b = hole.rPlus - hole.rMinus;
      const x0 = 0.05 * b,
        x1 = 0.2 * b;
      const direct = horizonSeriesStart(hole, mode, x1);
      const sol = solveRadial({ hole, ...mode }, { tol: 1e-13, startFraction: 0.05, grid: [hole.rPlus + x1] });
      const got = sol.samples[0];
      expect(sol.diagnostics.startRadius).toBeCloseTo(hole.rPlus + x0, 14);
      const err = Math.hypot(got.R.re - direct.R[0], got.R.im - direct.R[1]) / Math.hypot(direct.R[0], direct.R[1]);
      expect(err).toBeLessThan(1e-10);
    });
  }
  // Near extremality (|Im ν| ≈ 900 here) the series is summed with the throat
  // factor (1 + x/b)^β: checked against the equation itself, integrated from a
  // start ten times closer to the horizon (common practice, no source).
  for (const mode of [
    { s: -2, m: -2, omega: 3, lambda: 27.76 },
    { s: 0, m: -2, omega: 30, lambda: 297 },
  ]) {
    it(`near extremality (a = 0.99999, s = ${mode.s}, Mω = ${mode.omega}) the factored sum at 0.5 (r+ − r−) agrees with the sum at 0.05 (r+ − r−) integrated there to 1e-10`, () => {
      const hole = kerrHole({ a: 0.99999 });
      const b = hole.rPlus - hole.rMinus;
      const x1 = 0.5 * b;
      const direct = horizonSeriesStart(hole, mode, x1);
      expect(direct.truncation).toBeLessThan(1e-15);
      const sol = solveRadial({ hole, ...mode }, { tol: 1e-13, startFraction: 0.05, grid: [hole.rPlus + x1] });
      const got = sol.samples[0];
      const err = Math.hypot(got.R.re - direct.R[0], got.R.im - direct.R[1]) / Math.hypot(direct.R[0], direct.R[1]);
      const errD = Math.hypot(got.dR.re - direct.dR[0], got.dR.im - direct.dR[1]) / Math.hypot(direct.dR[0], direct.dR[1]);
      expect(err).toBeLessThan(1e-10);
      expect(errD).toBeLessThan(1e-10);
    });
  }
  it('has modulus |R| = Δ^{-s} e^{0} to leading order: |R|·x^s·b^s → 1 as x → 0 (s = 2, a = 0.5)', () => {
    const hole = kerrHole({ a: 0.5 });
    const b = hole.rPlus - hole.rMinus;
    const x = 1e-6 * b;
    const st = horizonSeriesStart(hole, { s: 2, m: 1, omega: 0.4, lambda: 1.3 }, x);
    expect(Math.abs(Math.hypot(...st.R) * (x * b) ** 2 - 1)).toBeLessThan(1e-5);
  });
  // Beyond its radius of convergence r+ − r− (x0 = 10 (r+ − r−)) the terms grow
  // like 10^n and their squares overflow the double range. Property (common
  // practice, no source): an overflowed sum is refused at the overflow, not
  // after the full 600 terms.
  it('refuses an overflowed sum at once with a ConvergenceError', () => {
    const hole = kerrHole({ a: 0.99999 });
    const b = hole.rPlus - hole.rMinus;
    const mode = { s: 0, m: -2, omega: 30, lambda: 297 };
    let caught: unknown;
    try {
      horizonSeriesStart(hole, mode, 10 * b);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConvergenceError);
    expect((caught as ConvergenceError).diagnostics.steps).toBeLessThan(200);
    expect(horizonSeriesStart(hole, mode, 5e-4 * b).truncation).toBeLessThan(1e-15);
  });
});
