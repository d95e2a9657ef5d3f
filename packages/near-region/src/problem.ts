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

/** Smallest a/M the form takes: T_L = M/(2πa) and ω_L = 2M²ω/a stay far inside the double range. */
export const MIN_A_RATIO = 1e-8;

/** Largest Mω the form takes (the exact solver's upper end; the form itself is a low-frequency statement). */
export const MAX_MOMEGA = 30;

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
 * Validate { hole, mode, omega } for the near-region form: 1e-8 M ≤ a < M (a ≤
 * `maxARatio`·M when given), 0 < Mω ≤ 30, a massless field.
 */
export function checkNearRegionProblem(problem: unknown, maxARatio = 1): CheckedNearRegionProblem {
  const p = requireKeyedObject('problem', problem, ['hole', 'mode', 'omega']);
  const { spin, fieldMass, l, m } = validateMode(p.mode, 'mode');
  requireMassless({ spin, mass: fieldMass }, 'mode.field.mass', 'the near-region form');
  const { a, mass } = validateHole(p.hole, 'hole', maxARatio);
  const aRange = `${MIN_A_RATIO} M ≤ a ${maxARatio < 1 ? `≤ ${maxARatio} M` : '< M'}`;
  if (!(a > 0)) {
    throw new InputError(
      'hole.a',
      aRange,
      a,
      a === 0
        ? 'T_L and T_R diverge as a → 0: the two-temperature form needs rotation'
        : 'a counter-rotating hole is the mirror image of (|a|, −m): give a > 0 and −m',
    );
  }
  if (a < MIN_A_RATIO * mass) throw new InputError('hole.a', aRange, a, 'below it T_L ∝ 1/a leaves the double range');
  const omegaRange = `0 < Mω ≤ ${MAX_MOMEGA} (ω in units of 1/M)`;
  const omega = requireFinite('omega', p.omega, omegaRange);
  if (!(omega > 0 && omega * mass <= MAX_MOMEGA)) throw new InputError('omega', omegaRange, omega);
  return { spin, l, m, a, mass, omega };
}
