/** The radial problem: one hole, one separated mode. */
import { requireFinite, requireObject, InputError } from '@penumbra/core';
import type { KerrHole } from '@penumbra/kerr';
import type { RadialMode } from './equation.js';

/** The input of `solveRadial` and `solveTwoSided`: `{ hole, s, m, omega, lambda }`. */
export interface RadialProblem extends RadialMode {
  /** the background, from `kerrHole` of @penumbra/kerr */
  hole: KerrHole;
}

/** Check the problem's numbers; returns the mode part. */
export function validateProblem(problem: RadialProblem): RadialMode {
  requireObject('problem', problem, 'an object { hole, s, m, omega, lambda }');
  requireObject('hole', problem.hole, 'a hole from kerrHole({ a, mass })');
  const s = requireFinite('s', problem.s);
  const m = requireFinite('m', problem.m);
  const { omega, lambda } = problem;
  if (!Number.isFinite(omega) || omega === 0) throw new InputError('omega', 'a finite non-zero frequency', omega);
  requireFinite('lambda', lambda);
  return { s, m, omega, lambda };
}
