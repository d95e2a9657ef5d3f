import { describe, expect, it } from 'vitest';
import { ConvergenceError, InputError, kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';

const hole = kerrHole({ a: 0.5 });
const p = { hole, s: 1, m: 1, omega: 0.3, lambda: 1.5 };

describe('radial solver input checks and failure reporting', () => {
  it('rejects a tolerance outside 1e-15 … 1e-3 with InputError(tol)', () => {
    expect(() => solveRadial(p, { tol: 0.1 })).toThrow(InputError);
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
