/**
 * The Proca greybody problem on Schwarzschild and its validation. The
 * problem names the field as core does ({ spin: 1, mass: Mμ > 0 }) and the
 * polarisation; Γ does not depend on m (spherical symmetry), so m is absent.
 */
import {
  InputError,
  oneOf,
  validateField,
  validateOptions,
  validateTolerance,
  type Field,
  type OptionSpec,
} from '@penumbra/core';
import type { ProcaSector } from './sectors.js';

/**
 * The polarisations of a massive vector mode of multipole l on Schwarzschild:
 * - 'odd': the axial sector (l ≥ 1), one channel;
 * - 'even-1', 'even-2': the two transmission eigen-polarisations of the
 *   coupled polar sector (l ≥ 1), with Γ(even-1) ≥ Γ(even-2); as Mμ → 0,
 *   even-1 tends to the massless s = 1 polar mode and even-2 to the massless
 *   scalar of the same l (the longitudinal mode);
 * - 'monopole': the single polar mode at l = 0 (longitudinal).
 */
export const PROCA_POLARIZATIONS = ['odd', 'even-1', 'even-2', 'monopole'] as const;
/** One of PROCA_POLARIZATIONS. */
export type ProcaPolarization = (typeof PROCA_POLARIZATIONS)[number];

/** One Proca greybody problem on Schwarzschild (geometric units G = c = 1). */
export interface ProcaGreybodyProblem {
  /** the field: spin 1 with mass Mμ > 0 */
  readonly field: Field;
  /** multipole l ≥ 0 (l = 0 only with polarization 'monopole'), l ≤ MAX_PROCA_L */
  readonly l: number;
  /** real frequency ω in units of 1/M, above the threshold: Mω > Mμ, Mω ≤ 50 */
  readonly omega: number;
  /** which polarisation (see PROCA_POLARIZATIONS) */
  readonly polarization: ProcaPolarization;
  /** hole mass M > 0 (default 1); ω is in units of 1/M, Mμ is the field's mass as in core */
  readonly mass?: number;
}

/** Options of `procaGreybody`. */
export interface ProcaGreybodyOptions {
  /** requested relative accuracy of Γ, in core's range [1e-12, 1e-2] (default 1e-10) */
  tol?: number;
  /** ODE integrator: 'extrapolation' (default, Gragg–Bulirsch–Stoer; requests below tol 1e-11, or where it stalls, are served by Cash–Karp) or 'cash-karp' (RK45, the earlier route, a cross-check) */
  integrator?: ProcaIntegrator;
}

/** The integrators of a Proca solve; the first is the default. */
export const PROCA_INTEGRATORS = ['extrapolation', 'cash-karp'] as const;
/** One of PROCA_INTEGRATORS. */
export type ProcaIntegrator = (typeof PROCA_INTEGRATORS)[number];

/** Default requested relative accuracy of the Proca Γ. */
export const DEFAULT_PROCA_TOLERANCE = 1e-10;
/** Largest l accepted. */
export const MAX_PROCA_L = 60;
const MAX_M_OMEGA = 50;

/** A checked problem in units M = 1. */
export interface CheckedProcaProblem {
  sector: ProcaSector;
  polarization: ProcaPolarization;
  l: number;
  /** Mω */
  omega: number;
  /** Mμ */
  mu: number;
  mass: number;
}

const KEYS = ['field', 'l', 'omega', 'polarization', 'mass'];

/** Validate a problem; InputErrors name the key as the caller wrote it. */
export function validateProcaProblem(problem: unknown): CheckedProcaProblem {
  if (typeof problem !== 'object' || problem === null || Array.isArray(problem)) {
    throw new InputError('problem', 'an object { field: { spin: 1, mass }, l, omega, polarization, mass? }', problem);
  }
  for (const key of Object.keys(problem)) {
    if (!KEYS.includes(key)) throw new InputError(key, `one of the keys ${KEYS.join(', ')}`, key, 'unknown key');
  }
  const q = problem as Record<string, unknown>;
  const field = validateField(q.field, 'field');
  if (field.spin !== 1) throw new InputError('field.spin', '1 (the Proca solver is for massive vectors)', field.spin);
  if (!(field.mass > 0)) {
    throw new InputError(
      'field.mass',
      'Mμ > 0',
      field.mass,
      'a massless vector is the s = 1 field of the Regge–Wheeler and Teukolsky solvers',
    );
  }
  const mass = q.mass ?? 1;
  if (typeof mass !== 'number' || !Number.isFinite(mass) || !(mass > 0))
    throw new InputError('mass', 'a finite number > 0', mass);
  const { l, omega, polarization } = q;
  if (!PROCA_POLARIZATIONS.includes(polarization as ProcaPolarization)) {
    throw new InputError('polarization', `one of ${PROCA_POLARIZATIONS.join(', ')}`, polarization);
  }
  const pol = polarization as ProcaPolarization;
  if (typeof l !== 'number' || !Number.isInteger(l) || l < 0 || l > MAX_PROCA_L) {
    throw new InputError('l', `an integer 0 ≤ l ≤ ${MAX_PROCA_L}`, l);
  }
  if ((l === 0) !== (pol === 'monopole')) {
    throw new InputError(
      'polarization',
      l === 0 ? "'monopole' (l = 0 has only the monopole)" : "'odd', 'even-1' or 'even-2' (the monopole is l = 0)",
      pol,
    );
  }
  if (typeof omega !== 'number' || !Number.isFinite(omega) || !(omega > 0))
    throw new InputError('omega', 'a finite number > 0', omega);
  const Momega = omega * mass;
  const mu = field.mass;
  if (!(Momega > mu)) {
    throw new InputError(
      'omega',
      `Mω > Mμ = ${mu}`,
      omega,
      'below threshold no wave reaches infinity (the mode is bound) and Γ is undefined',
    );
  }
  if (Momega > MAX_M_OMEGA) throw new InputError('omega', `Mω ≤ ${MAX_M_OMEGA}`, omega);
  const sector: ProcaSector = pol === 'odd' ? 'odd' : pol === 'monopole' ? 'monopole' : 'even';
  return { sector, polarization: pol, l, omega: Momega, mu, mass };
}

const SPEC: OptionSpec<ProcaGreybodyOptions> = { tol: validateTolerance, integrator: oneOf(PROCA_INTEGRATORS) };

/** Validate the options (unknown keys refused) and fill in the defaults. */
export function validateProcaOptions(options: unknown): { tol: number; integrator: ProcaIntegrator } {
  const o = validateOptions(options, SPEC);
  return { tol: o.tol ?? DEFAULT_PROCA_TOLERANCE, integrator: o.integrator ?? PROCA_INTEGRATORS[0] };
}
