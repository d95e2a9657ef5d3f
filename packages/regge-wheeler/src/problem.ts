/**
 * The Schwarzschild greybody problem, its options and their validation.
 *
 * The problem is { field, l, omega, mass? }, not a core Mode: at a = 0 the
 * greybody factor does not depend on m (spherical symmetry), and a solver
 * that demanded an m it then ignored would suggest otherwise. `field` and
 * `l` are named and validated as in core's Mode (field spin 0, 1/2, 1, 2 with
 * '1/2' accepted; l ≥ spin with l − spin an integer).
 */
import {
  InputError,
  numberIn,
  validateField,
  validateOptions,
  validateTolerance,
  type Field,
  type FieldSpin,
  type OptionSpec,
  requireMassless,
  requireKeyedObject,
} from '@penumbra/core';
import type { ModeProblem, PotentialKind } from './potentials.js';

/** One Schwarzschild greybody problem (geometric units G = c = 1). */
export interface SchwarzschildGreybodyProblem {
  /** the field: spin 0, 1/2 ('1/2' accepted), 1 or 2 (Γ is the same for ±s); a mass Mμ > 0 for spin 0 only, with Mω > Mμ */
  readonly field: Field;
  /** multipole, spin ≤ l ≤ MAX_REFERENCE_L with l − spin an integer */
  readonly l: number;
  /** real frequency ω > 0 in units of 1/mass, Mω ≤ 50 */
  readonly omega: number;
  /** hole mass M > 0 (default 1) */
  readonly mass?: number;
}

/** Options of `schwarzschildGreybody`. */
export interface SchwarzschildGreybodyOptions {
  /** requested relative accuracy of Γ, in core's range [1e-12, 1e-2] (default DEFAULT_TOLERANCE) */
  tol?: number;
}

/**
 * Options of one integration (`integrateOnce`, the "./internal" subpath): the
 * knobs the tests turn to show that Γ does not depend on them. The defaults
 * are what `schwarzschildGreybody` uses.
 */
export interface IntegrationOptions extends SchwarzschildGreybodyOptions {
  /** start at r0 = 2M (1 + startOffset), 0 < startOffset ≤ 0.5 (the horizon series converges below 1) */
  startOffset?: number;
  /** first matching radius tried, in units of M; moved outward until the far series converges */
  matchRadius?: number;
  /** local error tolerance of the Cash–Karp steps (relative to |ψ|, |dψ/dr*|); default from tol */
  stepTolerance?: number;
  /** multiplies the default step tolerance (ignored when stepTolerance is given) */
  stepToleranceFactor?: number;
  /** sign in the Dirac potential W² ± dW/dr* */
  diracSign?: 1 | -1;
  /** step budget; exceeding it throws ConvergenceError */
  maxSteps?: number;
}

/** Default requested relative accuracy of Γ. */
export const DEFAULT_TOLERANCE = 1e-11;
/** Largest l accepted: the reference solver is used above core's MAX_L (high-frequency cross-sections). */
export const MAX_REFERENCE_L = 200;
/** Largest Mω accepted: beyond it Γ = 1 to machine precision for any l the solver is meant for. */
const MAX_M_OMEGA = 50;
/** Below this the Cash–Karp error estimate is dominated by rounding. */
export const MIN_STEP_TOLERANCE = 1e-16;

function isSign(value: unknown, parameter: string): 1 | -1 {
  if (value !== 1 && value !== -1) throw new InputError(parameter, '1 or −1', value);
  return value;
}

const GREYBODY_SPEC: OptionSpec<SchwarzschildGreybodyOptions> = { tol: validateTolerance };

const INTEGRATION_SPEC: OptionSpec<IntegrationOptions> = {
  tol: validateTolerance,
  startOffset: (value, parameter) => {
    if (typeof value !== 'number' || !(value > 0 && value <= 0.5)) throw new InputError(parameter, 'in (0, 0.5]', value);
    return value;
  },
  matchRadius: numberIn(Number.MIN_VALUE, 1e12),
  stepTolerance: numberIn(MIN_STEP_TOLERANCE, 1e-2),
  stepToleranceFactor: numberIn(1e-8, 1e8),
  diracSign: isSign,
  maxSteps: numberIn(1, 1e9, true),
};

/** Validate the options of `schwarzschildGreybody` (unknown keys refused) and fill in the default tol. */
export function validateGreybodyOptions(options: unknown): { tol: number } {
  return { tol: validateOptions(options, GREYBODY_SPEC).tol ?? DEFAULT_TOLERANCE };
}

/** Validate the options of `integrateOnce` (unknown keys refused); tol gets its default. */
export function validateIntegrationOptions(options: unknown): IntegrationOptions & { tol: number } {
  const given = validateOptions(options, INTEGRATION_SPEC);
  return { ...given, tol: given.tol ?? DEFAULT_TOLERANCE };
}

const KEYS = ['field', 'l', 'omega', 'mass'];

/** Validate a problem; InputErrors name the key as the caller wrote it ('field.spin', 'l', 'omega', 'mass'; an unknown key as 'problem.key'). */
export function validateProblem(problem: unknown): Omit<ModeProblem, 'diracSign'> & { spin: FieldSpin; fieldMass: number } {
  // core's check: an unknown key is named problem.key
  requireKeyedObject('problem', problem, KEYS, 'an object { field: { spin }, l, omega, mass? }');
  const q = problem as { field?: unknown; l?: unknown; omega?: unknown; mass?: unknown };
  const field = validateField(q.field, 'field');
  // The massive Klein–Gordon potential is here (massiveSeries.ts); other massive spins are not.
  if (field.spin !== 0) requireMassless(field, 'field.mass', 'the Schwarzschild reference solver for spin ≠ 0');
  const { spin, mass: fieldMass } = field;
  const { l, omega } = q;
  if (typeof l !== 'number' || !Number.isFinite(l) || l < spin || !Number.isInteger(l - spin)) {
    throw new InputError('l', `l ≥ ${spin} with l − spin an integer`, l);
  }
  if (l > MAX_REFERENCE_L) throw new InputError('l', `l ≤ ${MAX_REFERENCE_L}`, l);
  if (typeof omega !== 'number' || !Number.isFinite(omega) || !(omega > 0)) {
    throw new InputError('omega', 'a finite number > 0', omega);
  }
  const mass = q.mass ?? 1;
  if (typeof mass !== 'number' || !Number.isFinite(mass) || !(mass > 0)) {
    throw new InputError('mass', 'a finite number > 0', mass);
  }
  if (mass * omega > MAX_M_OMEGA) {
    throw new InputError(
      'omega',
      `M ω ≤ ${MAX_M_OMEGA}`,
      omega,
      'beyond that Γ = 1 to machine precision for any l the solver is meant for',
    );
  }
  if (fieldMass > 0 && !(omega * mass > fieldMass)) {
    throw new InputError('omega', `Mω > Mμ = ${fieldMass}`, omega, 'for ω ≤ μ no wave reaches infinity (bound states)');
  }
  const kind: PotentialKind = spin === 0.5 ? 'dirac' : 'regge-wheeler';
  return { kind, spin, l, omega, mass, fieldMass };
}
