/**
 * Schwarzschild greybody factors from the real one-dimensional wave equations
 *   d²ψ/dr*² + (ω² − V) ψ = 0
 * with ψ → e^{−iωr*} at the horizon and ψ → A_in e^{−iωr*} + A_out e^{iωr*}
 * at infinity; Γ = 1/|A_in|² (Wronskian), reflection = |A_out/A_in|².
 *
 * This package is an independent check of the Teukolsky-based solver and
 * deliberately shares no numerical code with it. Method and derivations:
 * docs/method-schwarzschild-reference.md.
 */
import { ConvergenceError, type Diagnostics, type FieldSpin } from '@penumbra/core';
import {
  DEFAULT_START_OFFSET,
  defaultMatchRadius,
  integrate,
  type IntegrationControls,
  type SingleIntegration,
} from './integrate.js';
import { integrateMassiveScalar, massiveMatchRadius } from './massiveIntegrate.js';
import {
  type SchwarzschildGreybodyOptions,
  type SchwarzschildGreybodyProblem,
  validateGreybodyOptions,
  validateProblem,
} from './problem.js';

/** How Γ was obtained: core's Diagnostics plus the radii and series terms of the returned integration. */
export interface SchwarzschildGreybodyDiagnostics extends Diagnostics {
  /** the potential and the method, in words */
  method: string;
  /** accepted Cash–Karp steps, every integration included */
  steps: number;
  /** right-hand-side evaluations of the wave equation, every integration included */
  rhsEvaluations: number;
  /**
   * Estimated relative error of Γ: the relative difference between two
   * integrations that differ in start radius, first matching radius and step
   * tolerance, floored at 3e-13 (rounding over ~1e4 steps).
   */
  errorEstimate: number;
  /** start radius r0 of the returned integration */
  startRadius: number;
  /** matching radius of the returned integration */
  matchRadius: number;
  /** horizon-series plus far-series terms of the returned integration */
  seriesTerms: number;
}

/** The greybody factor of one Schwarzschild mode, with the problem's numbers and diagnostics. */
export interface SchwarzschildGreybodySolution {
  /** field spin as a number (0, 0.5, 1, 2) */
  spin: FieldSpin;
  l: number;
  omega: number;
  mass: number;
  /** field mass Mμ, present only for a massive field */
  fieldMass?: number;
  /** Γ = 1/|A_in|² (ω/(k|A_in|²) for a massive field), the absorbed fraction of the incident flux */
  gamma: number;
  /** |A_out/A_in|², the reflected fraction */
  reflection: number;
  /** |Γ + R − 1| (flux conservation of a real potential) */
  residual: number;
  diagnostics: SchwarzschildGreybodyDiagnostics;
}

const RELATIVE_ERROR_FLOOR = 3e-13;

/**
 * Greybody factor of a Schwarzschild hole for a field of spin 0, 1/2, 1 or 2.
 *
 * Two integrations with different start radius, matching radius and step
 * tolerance are compared; their difference is the error estimate
 * (diagnostics.errorEstimate), and the more careful one is returned; the
 * step tolerance is tightened up to twice until the estimate is below
 * `options.tol` (default 1e-11). Throws InputError for a bad problem or
 * options, and ConvergenceError (full diagnostics) when the estimate stays
 * above tol.
 */
export function schwarzschildGreybody(
  problem: SchwarzschildGreybodyProblem,
  options?: SchwarzschildGreybodyOptions,
): SchwarzschildGreybodySolution {
  const p = validateProblem(problem);
  const { tol } = validateGreybodyOptions(options);
  // A massive scalar has its own series (long-range far-zone phase); everything else goes through `integrate`.
  const massive = p.fieldMass > 0 ? { l: p.l, omega: p.omega, mu: p.fieldMass / p.mass, mass: p.mass } : undefined;
  const integrateMode = (controls: IntegrationControls): SingleIntegration =>
    massive ? integrateMassiveScalar(massive, controls) : integrate(p, controls);
  const firstMatch = massive ? massiveMatchRadius(massive) : defaultMatchRadius(p);
  let factor = 1;
  let steps = 0;
  let rhsEvaluations = 0;
  let last: SingleIntegration | undefined;
  let relError = Infinity;
  for (let attempt = 0; attempt < 3; attempt++) {
    const coarse = integrateMode({ tol, stepToleranceFactor: factor, startOffset: DEFAULT_START_OFFSET });
    const fine = integrateMode({
      tol,
      stepToleranceFactor: factor / 8,
      startOffset: 0.6 * DEFAULT_START_OFFSET,
      matchRadius: 1.4 * firstMatch,
    });
    steps += coarse.steps + fine.steps;
    rhsEvaluations += coarse.rhsEvaluations + fine.rhsEvaluations;
    last = fine;
    relError = fine.gamma > 0 ? Math.abs(coarse.gamma - fine.gamma) / fine.gamma : Infinity;
    // Floor: rounding accumulated over ~1e4 steps (measured up to 2e-13 in
    // bench/accuracy.mjs) is invisible to the comparison of two runs.
    relError = Math.max(relError, RELATIVE_ERROR_FLOOR);
    if (relError <= tol) break;
    factor /= 10;
  }
  const run = last!;
  const converged = relError <= tol;
  const diagnostics: SchwarzschildGreybodyDiagnostics = {
    method:
      (massive
        ? 'massive Klein–Gordon potential, long-range far-zone phase'
        : p.kind === 'dirac'
          ? 'Dirac potential W² + dW/dr*'
          : 'Regge–Wheeler potential') +
      '; horizon Frobenius series, Cash–Karp RK45 in r, asymptotic-series match; error from two independent integrations',
    steps,
    rhsEvaluations,
    errorEstimate: relError,
    message: converged
      ? `converged: two integrations agree to ${relError.toExponential(1)} (tol ${tol})`
      : `not converged: two integrations differ by ${relError.toExponential(1)} > tol ${tol}`,
    startRadius: run.startRadius,
    matchRadius: run.matchRadius,
    seriesTerms: run.seriesTerms,
  };
  if (!converged) {
    throw new ConvergenceError(`greybody factor did not reach relative accuracy ${tol}`, {
      spin: p.spin,
      l: p.l,
      omega: p.omega,
      mass: p.mass,
      gamma: run.gamma,
      ...diagnostics,
    });
  }
  return {
    spin: p.spin,
    l: p.l,
    omega: p.omega,
    mass: p.mass,
    ...(massive ? { fieldMass: p.fieldMass } : {}),
    gamma: run.gamma,
    reflection: run.reflection,
    residual: run.residual,
    diagnostics,
  };
}
