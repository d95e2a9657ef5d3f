import { readFileSync } from 'node:fs';
import { ConvergenceError, InputError } from '@penumbra/core';
import { clearSpheroidalCache, radialSeparationConstant, smallCSeries, spheroidalEigenvalue } from '@penumbra/spheroidal';
import { describe, expect, it } from 'vitest';
import { relativeError } from './helpers.js';

const spins = [-2, -1, -0.5, 0, 0.5, 1, 2];

describe('spheroidalEigenvalue', () => {
  it('returns (l − s)(l + s + 1) exactly at c = 0 for every spin (Teukolsky 1973, spin-weighted spherical harmonics)', () => {
    for (const s of spins) {
      for (let l = Math.abs(s); l <= Math.abs(s) + 6; l++) {
        for (let m = -l; m <= l; m++) {
          const r = spheroidalEigenvalue({ s, l, m, c: 0 });
          expect(r.A).toBe((l - s) * (l + s + 1));
          expect(r.E).toBe(l * (l + 1));
        }
      }
    }
  });

  it('follows the second-order small-c series of Press & Teukolsky (1973) / Seidel (1989) with a remainder below 2c³ at c = 0.01 and 0.02', () => {
    for (const s of spins) {
      for (let l = Math.abs(s); l <= Math.abs(s) + 4; l++) {
        for (let m = -l; m <= l; m++) {
          const [A0, A1, A2] = smallCSeries(s, l, m);
          for (const c of [0.01, -0.02]) {
            const A = spheroidalEigenvalue({ s, l, m, c }, { continuation: false }).A;
            expect(Math.abs(A - (A0 + A1 * c + A2 * c * c))).toBeLessThan(2 * Math.abs(c) ** 3);
          }
        }
      }
    }
  });

  it('has the s = 0 second-order coefficient −½[1 − (2m−1)(2m+1)/((2l−1)(2l+3))] of Abramowitz & Stegun 21.7.6 with c² → −c² (formula from memory) to 1e-14', () => {
    for (let l = 0; l <= 8; l++) {
      for (let m = 0; m <= l; m++) {
        const expected = -0.5 * (1 - ((2 * m - 1) * (2 * m + 1)) / ((2 * l - 1) * (2 * l + 3)));
        expect(Math.abs(smallCSeries(0, l, m)[2] - expected)).toBeLessThan(1e-14);
      }
    }
  });

  it('matches scipy.special.obl_cv for s = 0 (A_{0lm}(c) = obl_cv(|m|, l, c), no shift) to 1e-13 relative for c ≤ 20', () => {
    const fixture = JSON.parse(readFileSync(new URL('./fixtures/oblate-cv.json', import.meta.url), 'utf8')) as {
      rows: { m: number; l: number; c: number; cv: number }[];
    };
    expect(fixture.rows.length).toBeGreaterThan(300);
    for (const { m, l, c, cv } of fixture.rows) {
      for (const sign of [1, -1]) {
        const A = spheroidalEigenvalue({ s: 0, l, m: sign * m, c: sign * c }, { continuation: false }).A;
        expect(relativeError(A, cv)).toBeLessThan(1e-13);
      }
    }
  });

  it('agrees with Leaver’s continued fraction (J. Math. Phys. 27, 1238 (1986)) to 1e-12 relative for |c| ≤ 10, l ≤ 12', () => {
    let worst = 0;
    for (const s of spins) {
      for (let l = Math.abs(s); l <= Math.abs(s) + 10; l += 2) {
        for (let m = -l; m <= l; m += Math.max(1, Math.floor(l / 2))) {
          for (const c of [-10, -4.5, -1.2, 0.3, 2.7, 6, 10]) {
            const r = spheroidalEigenvalue({ s, l, m, c }, { continuation: false, leaver: 'check' });
            worst = Math.max(worst, r.diagnostics.agreement ?? Infinity);
          }
        }
      }
    }
    expect(worst).toBeLessThan(1e-12);
  });

  it('reaches l = 60: Leaver agreement below 1e-12 for |c| ≤ 10 and A_{−s} = A_s + 2s to 1e-13 at |c| = 20', () => {
    for (const s of [-2, -0.5, 1]) {
      for (const l of [30.5 + (Number.isInteger(s) ? 0.5 : 0), 60 + (Number.isInteger(s) ? 0 : 0.5)]) {
        for (const m of [-l, s, l - 3]) {
          for (const c of [-10, 4, 10]) {
            const r = spheroidalEigenvalue({ s, l, m, c }, { continuation: false, leaver: 'check' });
            expect(r.diagnostics.agreement).toBeLessThan(1e-12);
          }
          for (const c of [-20, 20]) {
            const plus = spheroidalEigenvalue({ s, l, m, c }, { continuation: false }).A;
            const minus = spheroidalEigenvalue({ s: -s, l, m, c }, { continuation: false }).A;
            expect(relativeError(minus, plus + 2 * s)).toBeLessThan(1e-13);
          }
        }
      }
    }
  });

  it('gives the same value with continuation along c as from a cold start (to 1e-13 relative)', () => {
    clearSpheroidalCache();
    for (let k = 0; k <= 100; k++) {
      const c = -20 + 0.4 * k;
      const warm = spheroidalEigenvalue({ s: -2, l: 3, m: 1, c });
      const cold = spheroidalEigenvalue({ s: -2, l: 3, m: 1, c }, { continuation: false });
      expect(relativeError(warm.A, cold.A)).toBeLessThan(1e-13);
    }
  });

  it('reports diagnostics with a converged truncation and a residual at rounding level', () => {
    const r = spheroidalEigenvalue({ s: -2, l: 2, m: 2, c: 1.5 }, { continuation: false });
    expect(r.diagnostics.truncation).toBeGreaterThan(3);
    expect(r.diagnostics.residual).toBeLessThan(1e-14);
    expect(r.diagnostics.steps).toBeGreaterThan(0);
    expect(r.E).toBe(r.A + 2);
  });

  it('computes λ = A + a²ω² − 2amω', () => {
    expect(radialSeparationConstant(4, 0.5, 0.2, 2)).toBeCloseTo(4 + 0.01 - 0.4, 15);
    expect(() => radialSeparationConstant(Number.NaN, 0.5, 0.2, 2)).toThrow(InputError);
  });

  it('throws InputError for bad spin, l, m and c', () => {
    const bad: [object, string][] = [
      [{ s: 1.5, l: 2.5, m: 0.5, c: 1 }, 'problem.s'],
      [{ s: 3, l: 3, m: 0, c: 1 }, 'problem.s'],
      [{ s: -2, l: 2.5, m: 0, c: 1 }, 'problem.l'],
      [{ s: -2, l: 1, m: 0, c: 1 }, 'problem.l'],
      [{ s: -2, l: 2, m: 3, c: 1 }, 'problem.m'],
      [{ s: 0.5, l: 1.5, m: 1, c: 1 }, 'problem.m'],
      [{ s: 0, l: 2, m: 0, c: Number.NaN }, 'problem.c'],
      [{ s: 0, l: 2, m: 0, c: Infinity }, 'problem.c'],
      [{ s: 0, l: 2, m: 0, c: 1e3 }, 'problem.c'],
      [{ s: 0, l: 500, m: 0, c: 1 }, 'problem.l'],
      [{ s: 0, l: 2, m: 0, c: '1' }, 'problem.c'],
    ];
    for (const [q, parameter] of bad) {
      let caught: unknown;
      try {
        spheroidalEigenvalue(q as never);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(InputError);
      expect((caught as InputError).parameter).toBe(parameter);
    }
  });

  it('throws ConvergenceError with diagnostics when the continued fraction is started far from a root', async () => {
    const { leaverRoot } = await import('@penumbra/spheroidal/internal');
    expect(() => leaverRoot(0, 0, 2, 1e6, 0, 1, 3)).toThrow(ConvergenceError);
  });
});
