/**
 * Diagnostics of a radial solve and its single-solve error estimate.
 *
 * One solve has no independent error estimate (that takes a second solve at
 * another tolerance, as @penumbra/flux does). What it can defend is the
 * local-error accumulation bound: each accepted step commits a local error of
 * at most `tol` relative to the solution, and for a linear equation whose
 * integrated solution is the dominant one these errors add, so the relative
 * error of the amplitude read where that solution dominates is at most
 * steps × tol, plus the truncation of the two boundary series. Where the route
 * reads an amplitude that is not dominant, the bound is multiplied by the
 * size ratio of the two solutions there (docs/method.md, section 4):
 *   one-sided, s > 0: (b x₀/M²)^{−s}, the ingoing horizon solution Δ^{−s}
 *     against the outgoing one near the start point (the shooting trap);
 *   one-sided, s < 0: (|ω| r_match)^{2|s|}, Z_in against Z_out at the match.
 * The two-sided route reads each amplitude where it dominates (factor 1).
 * Measured against 1e-15 solves over a 1000-case grid (a ≤ 0.9999,
 * |s| ≤ 2, 0.016 ≤ Mω ≤ 2, tol 1e-8…1e-12, both integrators, both routes),
 * the error of Z_in was at most 0.15 of this estimate; test/diagnostics.test.ts
 * keeps a sample of that check.
 */
import type { Diagnostics } from '@penumbra/core';
import type { IntegratorName } from './integrators.js';

/** Diagnostics of `solveRadial` and `solveTwoSided`: core's Diagnostics plus the solver's own figures. */
export interface RadialDiagnostics extends Diagnostics {
  /** the ODE integrator used */
  integrator: IntegratorName;
  /** local relative tolerance of the integrator */
  tol: number;
  /** where the horizon series handed over to the integrator */
  startRadius: number;
  /** where the far series took over (the larger of the two legs' for the two-sided route; the +s leg's alone without the reflection) */
  matchRadius: number;
  /** horizon series terms summed */
  horizonTerms: number;
  /** last horizon series term (and cancellation) relative to the sum */
  horizonTruncation: number;
  /** far series terms summed (most over the series used) */
  farTerms: number;
  /** last far series term relative to the sum (worst over the amplitudes read) */
  farTruncation: number;
  /** times the state was renormalised by 1e-300 to avoid overflow */
  rescalings: number;
  /** the factor by which the route may amplify integration errors in Z_in (1 where it reads Z_in where it dominates) */
  amplification: number;
  /**
   * sum over all legs of the accepted steps' own local error estimates,
   * relative to tol (each at most 1; 'gbs' reports the extrapolation
   * tableau's ‖T_kk − T_k,k−1‖, the error of the lower-order value it does
   * not keep; 'odex' and 'cash-karp' report none and count 1 per step; a
   * Riccati step of a massless leg counts its own error estimate, one of a
   * massive far zone RICCATI_STEP_CHARGE, and the integrator's stretches of a
   * massless leg with Riccati rungs count at their tighter tolerance,
   * hybridLeg.ts): at most `steps` charged, and what @penumbra/flux's
   * single-solve estimate of Γ is built from
   */
  localErrorSum: number;
  /** Riccati steps among `steps` (docs/method.md, section 9) */
  riccatiSteps: number;
}

/** The figures the single-solve error estimate is made of. */
export interface ErrorBudget {
  /** integration steps over all legs */
  steps: number;
  /** local relative tolerance */
  tol: number;
  /** horizon series truncation (cancellation included) */
  horizonTruncation: number;
  /** far series truncation of the amplitudes read */
  farTruncation: number;
  /** the route's error amplification for Z_in (1 where Z_in dominates) */
  amplification: number;
}

/** Relative error bound of Z_in from one solve: amplification × steps × tol + series truncations. */
export function singleSolveErrorEstimate({ steps, tol, horizonTruncation, farTruncation, amplification }: ErrorBudget): number {
  return amplification * Math.max(steps, 1) * tol + horizonTruncation + farTruncation;
}

/** The message that goes with a successful single solve. */
export function singleSolveMessage(estimate: number, amplification: number): string {
  const amp = amplification > 1 ? ` × route amplification ${amplification.toExponential(1)}` : '';
  return `converged; one solve has no independent error estimate: errorEstimate ${estimate.toExponential(1)} is the local-error accumulation bound (steps × tol${amp} + series truncations)`;
}
