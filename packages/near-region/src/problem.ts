/**
 * Validation of near-region problems. A problem is the greybody problem
 * { hole, mode, omega } of @penumbra/flux; the near-region form also needs
 * a > 0: T_L and T_R diverge as a → 0, and a counter-rotating hole (a < 0)
 * is the mirror image of (|a|, −m), so it is asked for in that form.
 */
import {
  InputError,
  requireFinite,
  requireKeyedObject,
  requireMassless,
  validateHole,
  validateMode,
  type FieldSpin,
} from '@penumbra/core';

/** A checked problem: numbers only, mass filled in. */
export interface CheckedNearRegionProblem {
  spin: FieldSpin;
  l: number;
  m: number;
  a: number;
  mass: number;
  omega: number;
}

/**
 * Validate { hole, mode, omega } for the near-region form: 0 < a < M (a ≤
 * `maxARatio`·M when given), ω > 0 finite, a massless field.
 */
export function checkNearRegionProblem(problem: unknown, maxARatio = 1): CheckedNearRegionProblem {
  const p = requireKeyedObject('problem', problem, ['hole', 'mode', 'omega']);
  const { spin, fieldMass, l, m } = validateMode(p.mode, 'mode');
  requireMassless({ spin, mass: fieldMass }, 'mode.field.mass', 'the near-region form');
  const { a, mass } = validateHole(p.hole, 'hole', maxARatio);
  if (!(a > 0)) {
    throw new InputError(
      'hole.a',
      maxARatio < 1 ? `0 < a ≤ ${maxARatio} M` : '0 < a < M',
      a,
      a === 0
        ? 'T_L and T_R diverge as a → 0: the two-temperature form needs rotation'
        : 'a counter-rotating hole is the mirror image of (|a|, −m): give a > 0 and −m',
    );
  }
  const omega = requireFinite('omega', p.omega, 'a finite number > 0 (units of 1/M)');
  if (!(omega > 0)) throw new InputError('omega', 'a finite number > 0 (units of 1/M)', omega);
  return { spin, l, m, a, mass, omega };
}
