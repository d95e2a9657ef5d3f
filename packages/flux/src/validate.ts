/**
 * Validation of greybody problems and options in the shared vocabulary
 * (@penumbra/core): a problem is { hole, mode, omega }; errors name the
 * parameter the caller gave (`hole.a`, `mode.l`, `omega`, `options.tol`).
 */
import {
  InputError,
  MAX_L,
  isBoolean,
  numberIn,
  oneOf,
  requireFinite,
  requireKeyedObject,
  validateHole,
  validateMode,
  validateOptions,
  validateTolerance,
  type FieldSpin,
  type Hole,
  type Mode,
} from '@penumbra/core';
import { retrogradeImpactParameter } from '@penumbra/kerr';
import { INTEGRATORS, OSCILLATIONS, type IntegratorName, type Oscillation } from '@penumbra/radial';
import { PROCA_POLARIZATIONS, type ProcaPolarization } from '@penumbra/regge-wheeler';

/** Frequencies the solver covers, as Mω. */
export const MOMEGA_RANGE = { min: 1e-5, max: 30 } as const;

/** One mode of a hole at one real frequency. */
export interface GreybodyProblem {
  readonly hole: Hole;
  readonly mode: Mode;
  /** real frequency ω > 0 in units of 1/M, 1e-5 ≤ Mω ≤ 30 */
  readonly omega: number;
}

/** A checked problem: numbers only, defaults filled. */
export interface CheckedProblem {
  spin: FieldSpin;
  /** field mass Mμ (0 when massless) */
  fieldMass: number;
  l: number;
  m: number;
  a: number;
  mass: number;
  omega: number;
}

// Built once (formatting the range on every call was a visible share of a greybody factor).
const OMEGA_ALLOWED = `${MOMEGA_RANGE.min} ≤ Mω ≤ ${MOMEGA_RANGE.max} (ω in units of 1/M)`;

/** Validate ω against the solver's range for a hole of mass `mass`. */
export function validateOmega(omega: unknown, mass: number, parameter = 'omega'): number {
  const w = requireFinite(parameter, omega, OMEGA_ALLOWED);
  if (!(w * mass >= MOMEGA_RANGE.min && w * mass <= MOMEGA_RANGE.max)) throw new InputError(parameter, OMEGA_ALLOWED, w);
  return w;
}

const PROBLEM_KEYS = ['hole', 'mode', 'omega'];
// requireKeyedObject's own text for these keys, formatted once instead of on every call.
const PROBLEM_ALLOWED = `an object { ${PROBLEM_KEYS.join(', ')} }`;

/**
 * Validate a greybody problem { hole, mode, omega }. A massive field must be
 * above its mass threshold (Mω > Mμ); whether its spin has a massive solver
 * is decided by the dispatch (massive.ts).
 */
export function checkProblem(problem: unknown, anyPositiveOmega = false): CheckedProblem {
  const p = requireKeyedObject('problem', problem, PROBLEM_KEYS, PROBLEM_ALLOWED);
  const { spin, fieldMass, l, m } = validateMode(p.mode, 'mode');
  const { a, mass } = validateHole(p.hole, 'hole');
  const omega = anyPositiveOmega ? positiveOmega(p.omega) : validateOmega(p.omega, mass);
  requireAboveThreshold(omega, mass, fieldMass);
  return { spin, fieldMass, l, m, a, mass, omega };
}

/**
 * Refuse ω ≤ μ (Mω ≤ Mμ) for a field of mass Mμ: there k∞² = ω² − μ² ≤ 0, no
 * wave reaches infinity (the modes are bound), and Γ is undefined.
 */
export function requireAboveThreshold(omega: number, mass: number, fieldMass: number, parameter = 'omega'): void {
  if (fieldMass > 0 && !(omega * mass > fieldMass)) {
    throw new InputError(
      parameter,
      `Mω > Mμ = ${fieldMass} (above the field's mass threshold)`,
      omega,
      'for ω ≤ μ no wave reaches infinity: the modes are bound states and no greybody factor exists',
    );
  }
}

function positiveOmega(omega: unknown): number {
  const w = requireFinite('omega', omega, 'a finite number > 0');
  if (!(w > 0)) throw new InputError('omega', 'a finite number > 0', w);
  return w;
}

/** Options of one greybody solve; unknown keys are refused. */
export interface GreybodyOptions {
  /** requested relative accuracy of Γ (default 1e-8, range 1e-12 … 1e-2) */
  tol?: number;
  /** ODE integrator (default 'gbs', the extrapolation loop; 'odex' and 'cash-karp' for cross-checks) */
  integrator?: IntegratorName;
  /** override the start point (fraction of r+ − r−, 0 < f < 1) to show the answer does not move */
  startFraction?: number;
  /** override the matching radius (units of M) to show the answer does not move */
  matchRadius?: number;
  /** also compute the reflection coefficient from the −|s| field (default true) */
  reflection?: boolean;
  /** how fast-oscillating stretches are crossed: Riccati steps, with Taylor-series steps between them on massless legs ('riccati', default), or the ODE integrator throughout ('ode', the earlier route, kept for cross-checks); @penumbra/radial */
  oscillation?: Oscillation;
  /** massive vector only (spin 1, mass > 0): which polarisation (default 'odd', or 'monopole' at l = 0); see docs/massive-vector.md */
  polarization?: ProcaPolarization;
}

/** Validators of the greybody options, shared by every solve that passes them on. */
export const GREYBODY_OPTIONS = {
  tol: validateTolerance,
  integrator: oneOf(INTEGRATORS),
  startFraction: (v: unknown, p: string) => {
    const f = requireFinite(p, v, '0 < startFraction < 1');
    if (!(f > 0 && f < 1)) throw new InputError(p, '0 < startFraction < 1', f);
    return f;
  },
  matchRadius: numberIn(3, 1e8),
  reflection: isBoolean,
  oscillation: oneOf(OSCILLATIONS),
  polarization: oneOf(PROCA_POLARIZATIONS),
};

/** Validate greybody options (unknown keys and integrator names refused). */
export function checkGreybodyOptions(options: unknown): GreybodyOptions {
  return validateOptions<GreybodyOptions>(options, GREYBODY_OPTIONS);
}

/** Largest l an l-sum may reach (the spheroidal solver's range). */
export const MAX_SUM_L = MAX_L;

/**
 * Shells past the geometric-optics cut that an automatic maxL allows. Beyond
 * the barrier peak Γ falls about e^{−2π} per unit of l (the WKB barrier
 * formula, Iyer & Will, Phys. Rev. D 35, 3621 (1987)), so 20 shells take it
 * far below the tightest tolerance 1e-12.
 */
export const L_TAIL_MARGIN = 20;

/** Where an l-sum's limit comes from, for the diagnostics of a sum refused up front. */
export const MAX_L_LIMIT = `core's MAX_L = ${MAX_L}, the largest l the solvers take`;

/**
 * The maxL an l-sum at frequency Mω on a hole of a* = |a|/M gets by default:
 * its geometric-optics cut Mω·b_retro(a*) − 1/2 plus L_TAIL_MARGIN shells,
 * capped at MAX_L (a sum that would need more is refused before any work).
 */
export function automaticMaxL(mOmega: number, aStar: number): number {
  return Math.min(MAX_L, Math.ceil(mOmega * retrogradeImpactParameter(aStar) - 0.5) + L_TAIL_MARGIN);
}
