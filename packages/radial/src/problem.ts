/** The radial problem: one hole, one separated mode. */
import { requireFinite, requireObject, InputError } from '@penumbra/core';
import { requireKerrHole, type KerrHole } from '@penumbra/kerr';
import type { RadialMode } from './equation.js';

/** The input of `solveRadial` and `solveTwoSided`: `{ hole, s, m, omega, lambda, mu? }` (mu: s = 0, solveRadial only). */
export interface RadialProblem extends RadialMode {
  /** the background, from `kerrHole` of @penumbra/kerr */
  hole: KerrHole;
}

/** Check the problem's numbers; returns the mode part. */
export function validateProblem(problem: RadialProblem): RadialMode {
  requireObject('problem', problem, 'an object { hole, s, m, omega, lambda }');
  const hole = requireKerrHole(problem.hole, 'hole');
  const s = requireFinite('s', problem.s);
  const m = requireFinite('m', problem.m);
  const { omega, lambda } = problem;
  // |Mω| ≥ 1e-10: far below flux's 1e-5, and above the subnormal frequencies whose series never start.
  if (!Number.isFinite(omega) || !(Math.abs(omega) * hole.mass >= 1e-10)) {
    throw new InputError('omega', 'a finite frequency with |Mω| ≥ 1e-10', omega);
  }
  requireFinite('lambda', lambda);
  if (problem.mu === undefined || problem.mu === 0) return { s, m, omega, lambda };
  const mu = requireFinite('mu', problem.mu, 'a field mass μ ≥ 0');
  if (!(mu > 0)) throw new InputError('mu', 'a field mass μ ≥ 0', mu);
  if (s !== 0) throw new InputError('mu', '0 for s ≠ 0 (the mass term is the Klein–Gordon one, s = 0 only)', mu);
  if (!(Math.abs(omega) > mu)) {
    throw new InputError('omega', `|ω| > μ = ${mu}`, omega, 'below the mass threshold no wave reaches infinity (bound states)');
  }
  return { s, m, omega, lambda, mu };
}
