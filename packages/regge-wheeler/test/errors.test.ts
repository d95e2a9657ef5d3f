import { describe, expect, it } from 'vitest';
import { ConvergenceError, InputError } from '@penumbra/kerr';
import { integrateOnce, schwarzschildGreybody } from '@penumbra/regge-wheeler';

describe('input validation throws InputError naming the parameter', () => {
  const bad: Array<[string, Record<string, unknown>]> = [
    ['spin', { spin: 1.5, l: 2, omega: 0.1 }],
    ['spin', { spin: -1, l: 1, omega: 0.1 }],
    ['spin', { spin: Number.NaN, l: 1, omega: 0.1 }],
    ['l', { spin: 1, l: 0, omega: 0.1 }],
    ['l', { spin: 2, l: 2.5, omega: 0.1 }],
    ['l', { spin: 0.5, l: 1, omega: 0.1 }],
    ['l', { spin: 0, l: Number.POSITIVE_INFINITY, omega: 0.1 }],
    ['omega', { spin: 0, l: 0, omega: 0 }],
    ['omega', { spin: 0, l: 0, omega: -0.3 }],
    ['omega', { spin: 0, l: 0, omega: Number.NaN }],
    ['omega', { spin: 0, l: 0, omega: Number.POSITIVE_INFINITY }],
    ['mass', { spin: 0, l: 0, omega: 0.1, mass: 0 }],
    ['tol', { spin: 0, l: 0, omega: 0.1, tol: 0 }],
    ['tol', { spin: 0, l: 0, omega: 0.1, tol: 1e-15 }],
    ['tol', { spin: 0, l: 0, omega: 0.1, tol: 0.5 }],
    ['tol', { spin: 0, l: 0, omega: 0.1, tol: Number.NaN }],
  ];
  for (const [parameter, query] of bad) {
    it(`rejects ${parameter} in ${JSON.stringify(query, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v))}`, () => {
      let caught: unknown;
      try {
        schwarzschildGreybody(query as never);
      } catch (e) {
        caught = e;
      }
      expect(caught).toBeInstanceOf(InputError);
      expect((caught as InputError).parameter).toBe(parameter);
    });
  }
});

describe('non-convergence throws ConvergenceError with diagnostics', () => {
  it('an exhausted step budget is reported, not returned as a number', () => {
    let caught: unknown;
    try {
      integrateOnce({ spin: 0, l: 2, omega: 0.3 }, { maxSteps: 10 });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConvergenceError);
    const d = (caught as ConvergenceError).diagnostics;
    expect(d.steps).toBe(11);
    expect(d).toHaveProperty('matchRadius');
    expect(d).toHaveProperty('rhsEvaluations');
  });
});
