/**
 * Which massive fields the emission solves take, and how the solution names
 * the field and any approximation. Spin 0, 1/2 and 1 have massive greybody
 * factors (@penumbra/flux); a massive spin-2 field has none and is refused
 * rather than computed as massless.
 */
import { InputError, type CheckedField, type FieldSpin } from '@penumbra/core';
import { MOMEGA_RANGE } from '@penumbra/flux';
import { MASSIVE_VECTOR_KERR_APPROXIMATION } from './massiveModes.js';

/** The field of an emission solution; `mass` (Mμ) only for a massive field. */
export interface EmittedField {
  spin: FieldSpin;
  /** Mμ, present only when > 0 */
  mass?: number;
}

/**
 * Refuse a massive field without a massive route (spin 2), and a mass below
 * the solvers' lowest Mω (it would be indistinguishable from massless there
 * and is refused rather than guessed), with an InputError naming field.mass.
 */
export function requireMassiveRoute(field: CheckedField, parameter = 'field.mass'): void {
  if (field.mass === 0) return;
  if (field.spin === 2) {
    throw new InputError(parameter, '0 for spin 2 (massive fields are emitted for spin 0, 1/2 and 1)', field.mass);
  }
  if (field.mass < MOMEGA_RANGE.min) {
    throw new InputError(parameter, `0 or ${MOMEGA_RANGE.min} ≤ Mμ < ${MOMEGA_RANGE.max}`, field.mass);
  }
}

/** The field as a solution reports it, and the approximation used for it on a hole of a* = |a|/M (if any). */
export function solutionField(field: CheckedField, aStar: number): { field: EmittedField; approximation?: string } {
  const out: EmittedField = field.mass > 0 ? { spin: field.spin, mass: field.mass } : { spin: field.spin };
  if (field.mass > 0 && field.spin === 1 && aStar !== 0) return { field: out, approximation: MASSIVE_VECTOR_KERR_APPROXIMATION };
  return { field: out };
}
