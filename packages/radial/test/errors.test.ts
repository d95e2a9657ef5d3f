import { describe, expect, it } from 'vitest';
import { ConvergenceError, InputError, type Diagnostics } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';
import { horizonSeriesStart, radialEquation } from '@penumbra/radial/internal';

const hole = kerrHole({ a: 0.5 });
const p = { hole, s: 1, m: 1, omega: 0.3, lambda: 1.5 };

/** The error thrown by `f`, which must throw. */
function thrown(f: () => unknown): unknown {
  try {
    f();
  } catch (e) {
    return e;
  }
  throw new Error('expected a throw');
}

/** Every core Diagnostics field present, numbers not NaN, message non-empty. */
function expectFullDiagnostics(d: Diagnostics): void {
  expect(typeof d.method).toBe('string');
  expect(d.method.length).toBeGreaterThan(0);
  for (const key of ['steps', 'rhsEvaluations', 'errorEstimate'] as const) {
    expect(typeof d[key]).toBe('number');
    expect(Number.isNaN(d[key])).toBe(false);
  }
  expect(typeof d.message).toBe('string');
  expect(d.message.length).toBeGreaterThan(0);
}

describe('radial solver input checks and failure reporting', () => {
  it('rejects a tolerance outside 1e-15 … 1e-3 with InputError(tol)', () => {
    expect(() => solveRadial(p, { tol: 0.1 })).toThrow(InputError);
    expect((thrown(() => solveRadial(p, { tol: 0.1 })) as InputError).parameter).toBe('tol');
  });
  it('rejects ω = 0 and NaN λ', () => {
    expect(() => solveRadial({ ...p, omega: 0 })).toThrow(/omega/);
    expect(() => solveRadial({ ...p, lambda: Number.NaN })).toThrow(/lambda/);
  });
  it('rejects the two-sided route for s ≤ 0 and a switching radius outside the domain', () => {
    expect(() => solveTwoSided({ ...p, s: -1 })).toThrow(InputError);
    expect(() => solveTwoSided(p, { switchRadius: hole.rPlus + 1e6 })).toThrow(/switchRadius/);
  });
  it('throws ConvergenceError with its diagnostics when the step budget is exhausted', () => {
    try {
      solveRadial(p, { maxSteps: 3 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ConvergenceError);
      expect((e as ConvergenceError).diagnostics).toHaveProperty('rhsEvaluations');
    }
  });
  it('throws ConvergenceError when the far series cannot converge at a forced matching radius', () => {
    expect(() => solveRadial(p, { matchRadius: 3 })).toThrow(ConvergenceError);
  });
});

describe('the solve contract: options validated by name', () => {
  it('refuses an unknown option key with an InputError naming it (both routes)', () => {
    const e1 = thrown(() => solveRadial(p, { tolerance: 1e-10 } as never)) as InputError;
    expect(e1).toBeInstanceOf(InputError);
    expect(e1.parameter).toBe('options.tolerance');
    const e2 = thrown(() => solveTwoSided(p, { bogus: true } as never)) as InputError;
    expect(e2.parameter).toBe('options.bogus');
  });
  it("refuses integrator: 'bogus' (it used to run Cash–Karp silently) and variable: 'bogus' with InputErrors naming the key", () => {
    const e = thrown(() => solveRadial(p, { integrator: 'bogus' } as never)) as InputError;
    expect(e).toBeInstanceOf(InputError);
    expect(e.parameter).toBe('integrator');
    expect(e.message).toMatch(/'odex', 'cash-karp'/);
    expect((thrown(() => solveTwoSided(p, { variable: 'bogus' } as never)) as InputError).parameter).toBe('variable');
  });
  it('refuses a switching radius in the one-sided route, a grid out of order, a non-integer step limit and a start fraction outside (0, 1)', () => {
    expect((thrown(() => solveRadial(p, { switchRadius: 3 } as never)) as InputError).parameter).toBe('options.switchRadius');
    expect((thrown(() => solveRadial(p, { grid: [10, 5] })) as InputError).parameter).toBe('grid');
    expect((thrown(() => solveRadial(p, { maxSteps: 2.5 })) as InputError).parameter).toBe('maxSteps');
    expect((thrown(() => solveRadial(p, { startFraction: 1 })) as InputError).parameter).toBe('startFraction');
  });
  it('accepts reflection in the one-sided route (a caller may pass one option set to either route) without changing ln|Z_in| (exactly)', () => {
    expect(solveRadial(p, { reflection: false }).logAbsZIn).toBe(solveRadial(p).logAbsZIn);
  });
  it('ConvergenceErrors carry the full core Diagnostics: step budget, far series at a forced radius, integration failure', () => {
    const budget = thrown(() => solveTwoSided(p, { maxSteps: 3 })) as ConvergenceError;
    const far = thrown(() => solveRadial(p, { matchRadius: 3 })) as ConvergenceError;
    const cashKarp = thrown(() => solveRadial(p, { maxSteps: 3, integrator: 'cash-karp' })) as ConvergenceError;
    for (const e of [budget, far, cashKarp]) {
      expect(e).toBeInstanceOf(ConvergenceError);
      expectFullDiagnostics(e.diagnostics);
    }
    expect(budget.diagnostics.errorEstimate).toBe(Infinity);
  });
  it('a successful solve reports the full core Diagnostics with a finite error estimate', () => {
    expectFullDiagnostics(solveRadial(p).diagnostics);
    const d = solveTwoSided(p).diagnostics;
    expectFullDiagnostics(d);
    expect(Number.isFinite(d.errorEstimate)).toBe(true);
    expect(d.message).toMatch(/no independent error estimate/);
  });
});

describe('horizon series that does not converge', () => {
  it('throws ConvergenceError (method named), or with quiet returns undefined; where it converges both give the same start (l = 75, a = 0.99, Mω = 1: the terms overflow at x0 = 10 (r+ − r−), beyond the radius of convergence)', () => {
    const near = kerrHole({ a: 0.99 });
    const mode = { s: 0, m: 38, omega: 1, lambda: 75 * 76 };
    const eq = radialEquation(near, mode, near.rPlus);
    const b = near.rPlus - near.rMinus;
    const e = thrown(() => horizonSeriesStart(near, mode, 10 * b, eq));
    expect(e).toBeInstanceOf(ConvergenceError);
    expect((e as ConvergenceError).diagnostics.method).toBe('horizon Frobenius series');
    expect(horizonSeriesStart(near, mode, 10 * b, eq, true)).toBeUndefined();
    expect(horizonSeriesStart(near, mode, 0.02 * b, eq, true)).toEqual(horizonSeriesStart(near, mode, 0.02 * b, eq));
  });
});
