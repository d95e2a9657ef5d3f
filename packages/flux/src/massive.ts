/**
 * Which massive fields the greybody solver computes, and by which route: one
 * entry per field spin (and for `radialFunction`, the spins sampled by a
 * function of their own: the massive Dirac pair and the Proca field). Spin 0 (Klein–Gordon) runs inside `greybody` itself,
 * through the s = 0 radial equation with its −μ²r² term (docs/massive-fields.md).
 * Spins 1/2 (Dirac on Kerr) and 1 (Proca at a = 0) have solvers of their own,
 * called before the common problem check (their modes carry kappaSign, or
 * the l = 0 monopole). A spin without an entry is refused with an InputError
 * naming mode.field.mass (a mass silently ignored would be a wrong number).
 */
import { InputError, formatFieldSpin, validateField, type FieldSpin } from '@penumbra/core';
import type { GreybodySolution } from './greybody.js';
import { massiveDiracGreybody } from './massiveDirac.js';
import { massiveVectorGreybody } from './massiveVector.js';
import { radialFunctionDirac, type DiracRadialFunction } from './radialFunctionDirac.js';
import { radialFunctionProca, type ProcaRadialFunction } from './radialFunctionProca.js';
import { checkGreybodyOptions, type CheckedProblem, type GreybodyOptions, type GreybodyProblem } from './validate.js';

/** A massive-field solver of its own: the caller's problem and (unvalidated) options in, the usual solution out. */
export type MassiveSolver = (problem: GreybodyProblem, options: GreybodyOptions | undefined) => GreybodySolution;

const OWN_SOLVERS: Partial<Record<FieldSpin, MassiveSolver>> = {
  0.5: massiveDiracGreybody,
  1: (problem, options) => massiveVectorGreybody(problem, checkGreybodyOptions(options)),
};

/** `radialFunction` of a massive field without the Teukolsky radial function R: the caller's problem, radii and (unvalidated) options in. */
export type MassiveRadialFunction = (
  problem: GreybodyProblem,
  radii: readonly number[],
  options: Pick<GreybodyOptions, 'tol' | 'integrator' | 'polarization'> | undefined,
) => DiracRadialFunction | ProcaRadialFunction;

const OWN_RADIAL_FUNCTIONS: Partial<Record<FieldSpin, MassiveRadialFunction>> = {
  0.5: radialFunctionDirac,
  1: radialFunctionProca,
};

/** Massive spins `greybody` computes, for messages. */
const MASSIVE_SPINS = '0, 1/2, 1 (at a = 0 only)';

/**
 * The solver of its own for a massive field of spin 1/2 or 1, read from the
 * caller's problem; undefined for anything else (massless, spin 0, or a field
 * the common check will refuse with its own message).
 */
export function ownMassiveSolver(problem: unknown): MassiveSolver | undefined {
  return ownFor(problem, OWN_SOLVERS);
}

/** As ownMassiveSolver, the `radialFunction` of its own for a massive field of spin 1/2 (the Dirac pair) or 1 (the Proca field). */
export function ownRadialFunction(problem: unknown): MassiveRadialFunction | undefined {
  return ownFor(problem, OWN_RADIAL_FUNCTIONS);
}

function ownFor<T>(problem: unknown, table: Partial<Record<FieldSpin, T>>): T | undefined {
  try {
    const field = (problem as { mode?: { field?: unknown } } | null)?.mode?.field;
    // massless (no mass, or 0) has no solver of its own, valid or not: the common check follows (saves a second field check per solve)
    const given = typeof field === 'object' && field !== null ? (field as { mass?: unknown }).mass : undefined;
    if (given === undefined || given === 0) return undefined;
    const { spin, mass } = validateField(field, 'mode.field');
    return mass > 0 ? table[spin] : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Refuse a massive field the radial equation of `greybody` and `radialFunction`
 * cannot take (only massless fields and the massive scalar go through it),
 * naming mode.field.mass. Massive Dirac and vector fields never reach it: both
 * functions hand them to their own routes first (a ≠ 0 Proca refused there,
 * naming hole.a).
 */
export function requireRadialEquationField(problem: CheckedProblem): void {
  if (problem.fieldMass === 0 || problem.spin === 0) return;
  throw new InputError(
    'mode.field.mass',
    `0 for spin ${formatFieldSpin(problem.spin)} (massive fields are computed for spin ${MASSIVE_SPINS})`,
    problem.fieldMass,
    'massive fields of this spin are not supported',
  );
}
