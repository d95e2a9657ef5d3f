/**
 * Which massive fields the greybody solver computes, and by which route: one
 * entry per field spin. A spin without an entry is refused with an InputError
 * naming mode.field.mass (a mass silently ignored would be a wrong number).
 */
import { InputError, formatFieldSpin, type FieldSpin } from '@penumbra/core';
import type { GreybodySolution } from './greybody.js';
import type { CheckedProblem, GreybodyOptions } from './validate.js';

/**
 * A massive-field solver of its own: the checked problem and the caller's
 * (unvalidated) options in — it validates them, and may accept options of its
 * own — the usual solution out. Adding one is one entry in MASSIVE_ROUTES.
 */
export type MassiveSolver = (problem: CheckedProblem, options: GreybodyOptions | undefined) => GreybodySolution;

/**
 * How a massive field is solved: 'klein-gordon' is the s = 0 radial equation
 * of @penumbra/radial with its −μ²r² term, inside `greybody` itself
 * (docs/massive-fields.md); any other route is a solver of its own.
 */
export type MassiveRoute = 'klein-gordon' | MassiveSolver;

const MASSIVE_ROUTES: Partial<Record<FieldSpin, MassiveRoute>> = {
  0: 'klein-gordon',
};

/** Field spins with a massive route, for messages: spin 1/2 and spin 1 are dispatched in `greybody` before this table is read. */
function massiveSpins(): string {
  const here = Object.keys(MASSIVE_ROUTES).map((s) => formatFieldSpin(Number(s)));
  return [...here, '1/2 (greybody only)', '1 (greybody at a = 0 only)'].join(', ');
}

/** The route of a massive problem; undefined when the field is massless; InputError for a spin without one. */
export function massiveRoute(problem: CheckedProblem): MassiveRoute | undefined {
  if (problem.fieldMass === 0) return undefined;
  const route = MASSIVE_ROUTES[problem.spin];
  if (route === undefined) {
    throw new InputError(
      'mode.field.mass',
      `0 for spin ${formatFieldSpin(problem.spin)} (massive fields are computed for spin ${massiveSpins()})`,
      problem.fieldMass,
      'massive fields of this spin are not supported',
    );
  }
  return route;
}
