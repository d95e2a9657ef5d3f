/**
 * The tolerance rule, once for every solve: `tol` is the requested relative
 * accuracy of the main result, in [1e-12, 1e-2]. A result whose error
 * estimate exceeds it is a ConvergenceError, never a silent number.
 */
import { InputError } from './errors.js';

/** Accepted range of a requested relative tolerance `tol`. */
export const TOLERANCE_RANGE = { min: 1e-12, max: 1e-2 } as const;

/** Return `value` if it is a tolerance in TOLERANCE_RANGE; otherwise throw an InputError naming `parameter`. */
export function validateTolerance(value: unknown, parameter = 'tol'): number {
  if (typeof value !== 'number' || !(value >= TOLERANCE_RANGE.min && value <= TOLERANCE_RANGE.max)) {
    throw new InputError(parameter, `${TOLERANCE_RANGE.min} ≤ ${parameter} ≤ ${TOLERANCE_RANGE.max}`, value);
  }
  return value;
}
