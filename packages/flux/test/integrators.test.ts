/**
 * The default integrator 'gbs' (an allocation-free extrapolation loop) against
 * the two generic packages it replaced as the default: 'odex' runs the same
 * Gragg–Bulirsch–Stoer algorithm with the same step and order control, so
 * every double must agree; 'cash-karp' (a different method, npm
 * `ode45-cash-karp`) is the independent cross-check and must agree within the
 * requested tolerance. Modes: a fixed spread over every spin, a up to 0.9999,
 * co- and counter-rotating m, 0.02 ≤ Mω ≤ 2.5.
 */
import { describe, expect, it } from 'vitest';
import { greybody } from '@penumbra/flux';

const MODES = [
  { spin: 0, l: 0, m: 0, a: 0, omega: 0.3 },
  { spin: 0, l: 2, m: -2, a: 0.9999, omega: 1.1 },
  { spin: 0.5, l: 1.5, m: 0.5, a: 0.7, omega: 0.05 },
  { spin: 0.5, l: 0.5, m: -0.5, a: 0.99, omega: 2.5 },
  { spin: 1, l: 1, m: 1, a: 0.99, omega: 0.4 },
  { spin: 1, l: 3, m: -2, a: 0.7, omega: 0.02 },
  { spin: 2, l: 2, m: 2, a: 0.9999, omega: 0.8 },
  { spin: 2, l: 3, m: -1, a: 0, omega: 1.3 },
] as const;

const problem = (x: (typeof MODES)[number]) => ({
  hole: { a: x.a },
  mode: { field: { spin: x.spin }, l: x.l, m: x.m },
  omega: x.omega,
});

describe("the default integrator 'gbs'", () => {
  // relError is not compared bit for bit: 'gbs' sums its own accepted per-step error estimates (radial's localErrorSum),
  // which the odex package does not report, so 'odex' counts 1 per step (the steps × tol bound); the same steps give
  // the same Γ, and the sum of estimates that are each at most 1 can only be smaller.
  it("is the default and returns the same doubles as 'odex' (Γ, reflection, steps, RHS evaluations) on 8 modes of every spin, with a relError no larger", () => {
    for (const x of MODES) {
      const byDefault = greybody(problem(x));
      const odex = greybody(problem(x), { integrator: 'odex' });
      expect(byDefault.diagnostics.integrator).toBe('gbs');
      expect([byDefault.gamma, byDefault.reflection]).toEqual([odex.gamma, odex.reflection]);
      expect([byDefault.diagnostics.steps, byDefault.diagnostics.rhsEvaluations]).toEqual([
        odex.diagnostics.steps,
        odex.diagnostics.rhsEvaluations,
      ]);
      expect(byDefault.relError).toBeLessThanOrEqual(odex.relError);
    }
  });

  it("agrees with the independent 'cash-karp' integrator within the requested 1e-8 relative on the same 8 modes", () => {
    for (const x of MODES) {
      const gbs = greybody(problem(x), { tol: 1e-8 });
      const ck = greybody(problem(x), { tol: 1e-8, integrator: 'cash-karp' });
      expect(Math.abs(gbs.gamma / ck.gamma - 1)).toBeLessThan(1e-8);
    }
  });
});
