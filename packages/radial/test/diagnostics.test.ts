/**
 * The single-solve error estimate (src/diagnostics.ts): steps × tol plus the
 * series truncations, times the route's amplification. It is checked here
 * against the error actually made, measured against a solve at tol = 1e-15
 * (for the one-sided s > 0 route, against the two-sided route, which does not
 * have the horizon trap; docs/method.md §4). The bound is a local-error
 * accumulation argument, not a published result: common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';
import { RICCATI_STEP_CHARGE } from '@penumbra/radial/internal';

const cases = [
  { a: 0, s: 0, m: 1, omega: 0.3, lambda: 2 },
  { a: 0.9999, s: 0, m: 2, omega: 0.0164, lambda: 6 },
  { a: 0.7, s: -1, m: 1, omega: 0.5, lambda: 4.3 },
  { a: 0.99, s: -2, m: 2, omega: 0.5, lambda: 8 },
  { a: 0.5, s: 0.5, m: 0.5, omega: 1.5, lambda: 1.2 },
  { a: 0.9, s: 1, m: 1, omega: 0.2, lambda: 0.7 },
  { a: 0.9999, s: 2, m: 2, omega: 0.0164, lambda: -2 },
  { a: 0.95, s: 2, m: 2, omega: 0.6, lambda: -1.9 },
];

const relError = (ln: number, lnRef: number) => Math.abs(Math.expm1(ln - lnRef));

describe('single-solve error estimate', () => {
  for (const { a, ...mode } of cases) {
    const hole = kerrHole({ a });
    const p = { hole, ...mode };
    it(`one-sided: the error of |Z_in| at tol 1e-8 and 1e-11 is at most errorEstimate (a=${a}, s=${mode.s}, Mω=${mode.omega})`, () => {
      const ref = mode.s > 0 ? solveTwoSided(p, { tol: 1e-15 }).logAbsZInPlus : solveRadial(p, { tol: 1e-15 }).logAbsZIn;
      for (const tol of [1e-8, 1e-11]) {
        const sol = solveRadial(p, { tol });
        expect(relError(sol.logAbsZIn, ref)).toBeLessThanOrEqual(sol.diagnostics.errorEstimate);
      }
    });
    if (mode.s > 0) {
      it(`two-sided: the error of |Z_in| at tol 1e-8 and 1e-11 is at most errorEstimate, which stays below 1e4 × tol (a=${a}, s=${mode.s}, Mω=${mode.omega})`, () => {
        const ref = solveTwoSided(p, { tol: 1e-15 }).logAbsZInPlus;
        for (const tol of [1e-8, 1e-11]) {
          const sol = solveTwoSided(p, { tol });
          const d = sol.diagnostics;
          expect(relError(sol.logAbsZInPlus, ref)).toBeLessThanOrEqual(d.errorEstimate);
          expect(d.errorEstimate).toBeLessThan(1e4 * tol);
          expect(d.amplification).toBe(1);
        }
      });
    }
  }
});

/** What the sum of the loop's own per-step estimates bounds: amplification × localErrorSum × tol + series truncations. */
const localBound = (d: {
  amplification: number;
  localErrorSum: number;
  tol: number;
  horizonTruncation: number;
  farTruncation: number;
}) => d.amplification * d.localErrorSum * d.tol + d.horizonTruncation + d.farTruncation;

describe('sum of the accepted steps’ own error estimates (localErrorSum)', () => {
  for (const { a, ...mode } of cases.filter((c) => c.s >= 0)) {
    const hole = kerrHole({ a });
    const p = { hole, ...mode };
    it(`is at most the steps charged and, with the series truncations and a rounding floor 25 ε √N, at least the error of |Z_in| at tol 1e-8 and 1e-11 (a=${a}, s=${mode.s}, Mω=${mode.omega}; measured largest ratio 0.54, common practice, no source)`, () => {
      const solve = (tol: number) => {
        if (mode.s > 0) {
          const sol = solveTwoSided(p, { tol });
          return { ln: sol.logAbsZInPlus, d: sol.diagnostics };
        }
        const sol = solveRadial(p, { tol });
        return { ln: sol.logAbsZIn, d: sol.diagnostics };
      };
      const ref = solve(1e-15).ln;
      for (const tol of [1e-8, 1e-11]) {
        const { ln, d } = solve(tol);
        expect(d.localErrorSum).toBeGreaterThan(0);
        // at most the steps charged: a Riccati step (counted once in steps) charges RICCATI_STEP_CHARGE
        expect(d.localErrorSum).toBeLessThanOrEqual(d.steps + (RICCATI_STEP_CHARGE - 1) * d.riccatiSteps);
        const floor = 25 * Number.EPSILON * Math.sqrt(d.rhsEvaluations);
        expect(relError(ln, ref)).toBeLessThanOrEqual(localBound(d) + floor);
      }
    });
  }
});
