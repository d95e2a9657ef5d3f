/**
 * Greybody factors of a massive vector (Proca) field on Schwarzschild, for
 * each polarisation (docs/massive-vector.md). Two integrations that differ
 * in start radius, matching radius and step tolerance give the error
 * estimate; the more careful one is returned.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { integrateProca, defaultProcaMatchRadius, tortoiseSpan, type ProcaIntegration } from './integrate.js';
import {
  type ProcaGreybodyOptions,
  type ProcaGreybodyProblem,
  type ProcaPolarization,
  validateProcaOptions,
  validateProcaProblem,
} from './problem.js';
import { sectorModel } from './sectors.js';
import { farWaveNumbers } from './series.js';

/** How a Proca Γ was obtained. */
export interface ProcaGreybodyDiagnostics extends Diagnostics {
  /** relative difference of Γ between two integrations (start, match radius, step tolerance), floored at 3e-13 */
  errorEstimate: number;
  startRadius: number;
  matchRadius: number;
  seriesTerms: number;
}

/** The greybody factor of one Proca polarisation on Schwarzschild. */
export interface ProcaGreybodySolution {
  polarization: ProcaPolarization;
  l: number;
  /** ω in units of 1/M (as given) */
  omega: number;
  /** the field's mass Mμ */
  fieldMass: number;
  /** hole mass M */
  mass: number;
  /** k∞ = √(ω² − μ²), in units of 1/M */
  kInfinity: number;
  /** absorbed fraction of the incident flux in this polarisation */
  gamma: number;
  /** reflected fraction in this polarisation */
  reflection: number;
  /** largest entry of |T + R − 1| for the whole sector (unitarity of the S-matrix) */
  residual: number;
  /** Γ of every polarisation of the sector (even: [even-1, even-2]); their sum is basis-independent */
  sectorGammas: number[];
  diagnostics: ProcaGreybodyDiagnostics;
}

const ERROR_FLOOR = 3e-13;
const START_OFFSET = 0.15;

function stepTolerance(tol: number, span: number, omega: number, factor: number): number {
  return Math.max(1e-16, Math.min(1e-6, (factor * 0.1 * tol) / (3 + omega * span)));
}

/**
 * Γ of one polarisation of a massive vector mode on Schwarzschild. Throws
 * InputError for a bad problem (below threshold: `omega`) or options, and
 * ConvergenceError (full diagnostics) when the two integrations disagree by
 * more than `options.tol` (default 1e-10) after two tightenings.
 *
 * @example procaGreybody({ field: { spin: 1, mass: 0.1 }, l: 1, omega: 0.3, polarization: 'odd' })
 */
export function procaGreybody(problem: ProcaGreybodyProblem, options?: ProcaGreybodyOptions): ProcaGreybodySolution {
  const p = validateProcaProblem(problem);
  const { tol, integrator } = validateProcaOptions(options);
  const model = sectorModel(p.sector, p.l, p.omega, p.mu);
  const index = p.polarization === 'even-2' ? 1 : 0;
  const match = defaultProcaMatchRadius(model);
  const span = tortoiseSpan(START_OFFSET, 1.4 * match);
  let factor = 1;
  let steps = 0;
  let rhsEvaluations = 0;
  let fine: ProcaIntegration | undefined;
  let relError = Infinity;
  for (let attempt = 0; attempt < 3; attempt++) {
    const coarse = integrateProca(model, {
      startOffset: START_OFFSET,
      stepTolerance: stepTolerance(tol, span, p.omega, factor),
      integrator,
    });
    fine = integrateProca(model, {
      startOffset: 0.6 * START_OFFSET,
      matchRadius: 1.4 * match,
      stepTolerance: stepTolerance(tol, span, p.omega, factor / 8),
      integrator,
    });
    steps += coarse.steps + fine.steps;
    rhsEvaluations += coarse.rhsEvaluations + fine.rhsEvaluations;
    const g = fine.gammas[index];
    relError = Math.max(g > 0 ? Math.abs(coarse.gammas[index] - g) / g : Infinity, ERROR_FLOOR);
    if (relError <= tol) break;
    factor /= 10;
  }
  const run = fine!;
  const converged = relError <= tol;
  const diagnostics: ProcaGreybodyDiagnostics = {
    method: `Proca ${model.sector} sector (${model.channels} channel${model.channels > 1 ? 's' : ''}); horizon Frobenius series, ${integrator === 'cash-karp' ? 'Cash–Karp RK45' : 'Gragg–Bulirsch–Stoer extrapolation'} in r, far-zone series with the long-range log phase; error from two integrations`,
    steps,
    rhsEvaluations,
    errorEstimate: relError,
    message: converged
      ? `converged: two integrations agree to ${relError.toExponential(1)} (tol ${tol})`
      : `not converged: two integrations differ by ${relError.toExponential(1)} > tol ${tol}`,
    startRadius: run.startRadius * p.mass,
    matchRadius: run.matchRadius * p.mass,
    seriesTerms: run.seriesTerms,
  };
  if (!converged) throw new ConvergenceError(`Proca greybody factor did not reach relative accuracy ${tol}`, diagnostics);
  return {
    polarization: p.polarization,
    l: p.l,
    omega: p.omega / p.mass,
    fieldMass: p.mu,
    mass: p.mass,
    kInfinity: farWaveNumbers(model).k / p.mass,
    gamma: run.gammas[index],
    reflection: run.reflections[index],
    residual: run.residual,
    sectorGammas: run.gammas,
    diagnostics,
  };
}
