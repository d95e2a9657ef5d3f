/**
 * The error estimate of a greybody factor, and what it is made of.
 *
 * First the single-solve estimate: LOCAL_ERROR_FACTOR × the sum of the
 * first solve's accepted per-step error estimates (radial's
 * `localErrorSum`, with the series truncations), or the steps × tol
 * accumulation bound where that is smaller, plus the rounding floor below
 * (singleSolveBudget; measured figures beside the constants). Where it is at least
 * SINGLE_SOLVE_MARGIN times below the requested tolerance nothing else is
 * computed; elsewhere (tight tolerances, long
 * integrations) the check solve below is run and the estimate is built from
 * the two solves, as before.
 *
 * A second solve at the same start point, matching radius and a ten times
 * looser integrator tolerance sees only the integration error: it shares the
 * horizon-series and far-series truncation of the first solve and, at tight
 * tolerances, most of its rounding, so the difference of the two can be far
 * below the true error (measured against the 40-digit fixture at tol 1e-12:
 * 197 of 649 estimates below the true error, by up to 43×). So the check
 * solve here also moves the start point inward (0.6 × the fraction of
 * r+ − r− used) and the matching radius outward (1.4×), as the Regge–Wheeler
 * reference does, and the estimate adds a floor for double rounding that
 * grows with the work done (bench/honesty.bench.mjs measures both).
 */
import type { RadialDiagnostics } from '@penumbra/radial';
import type { KerrHole } from '@penumbra/kerr';

/** The check solve starts at this fraction of the first solve's distance from r+ (nearer the horizon: the series converges faster). */
export const CHECK_START_FACTOR = 0.6;
/** The check solve matches at this multiple of the first solve's matching radius (the asymptotic series are better there). */
export const CHECK_MATCH_FACTOR = 1.4;

/**
 * Rounding floor of a solve, relative: ROUNDING_FACTOR × ε × √N over its N
 * right-hand-side evaluations (rounding errors of the state add up like a
 * random walk). The factor: the largest ratio of true error (against the
 * mpmath fixture) to ε√N over the fixture rows at tol 1e-12, 1e-10 and 1e-8
 * is about 24, and with the other terms of the estimate every row's estimate
 * is at least 2.7 times its true error (bench/honesty.bench.mjs); common
 * practice, no source.
 */
export const ROUNDING_FACTOR = 25;

/**
 * Share of the first solve's local-error accumulation bound (steps × tol +
 * series truncations, @penumbra/radial) taken as a lower limit of the
 * estimate: that bound was measured to exceed the error of Z_in by at least
 * 1/0.15 (radial's diagnostics.ts), and Γ ∝ |Z_in|⁻² doubles the relative
 * error, so 0.3 of it still covers the integration error where the two
 * solves happen to agree by chance (seen at tol 1e-8: up to 9× below).
 */
export const BUDGET_SHARE = 0.3;

/**
 * Share of the accumulation bound taken, whole, as the single-solve estimate
 * (see above; the measured worst true error is below 0.3 of the bound).
 */
export const SINGLE_SOLVE_SHARE = 1;

/**
 * Multiple of the local-error sum (the integrator's own accepted per-step
 * estimates, radial's `localErrorSum` × tol × route amplification, plus the
 * series truncations) taken as the single-solve estimate of Γ. Measured
 * (bench/estimate.bench.mjs, bench/results/estimate-2026-12-03b): the true
 * error of Γ beyond the rounding floor was at most 1.36 times the bare sum
 * against the 40-digit fixture at tol 1e-8 (0.29 at 1e-10), 1.13 on 1,500
 * random and 0.96 on 991 wide-range modes at tol 1e-8 against tol-1e-11
 * solves, and up to 2.4 at tol 1e-10, where those references' own errors of a
 * few 1e-12 dominate (the extrapolation's estimate is that of the lower-order
 * value; Γ ∝ |Z_in|⁻² doubles the error). Re-measured after the far series
 * moved to the integrator tolerance (bench/results/estimate-2026-12-04): 1.46
 * on the fixture and 1.53 on random modes at tol 1e-8. 5 keeps about the
 * margin of the steps × tol bound it refines.
 */
export const LOCAL_ERROR_FACTOR = 5;

/**
 * The single-solve estimate stands alone only this many times below the
 * requested tolerance: it rests on a measured bound, so it is trusted only
 * with an order of magnitude to spare; nearer the request the check solve
 * decides (common practice, no source).
 */
export const SINGLE_SOLVE_MARGIN = 10;

/** ε, the spacing of doubles at 1 (2^−52). */
const EPSILON = Number.EPSILON;

/**
 * The integration part of the single-solve estimate of Γ: the smaller of the
 * steps × tol accumulation bound (`errorEstimate`) and LOCAL_ERROR_FACTOR ×
 * the sum of the accepted steps' own error estimates (both measured to cover
 * the true error; the sum is far smaller where steps were taken well inside
 * the tolerance).
 */
export function singleSolveBudget(
  d: Pick<RadialDiagnostics, 'errorEstimate' | 'localErrorSum' | 'tol' | 'amplification' | 'horizonTruncation' | 'farTruncation'>,
): number {
  const local = LOCAL_ERROR_FACTOR * (d.amplification * d.localErrorSum * d.tol + d.horizonTruncation + d.farTruncation);
  return Math.min(d.errorEstimate, local);
}

/** Rounding floor of the relative error of Γ for a solve with these diagnostics. */
export function roundingFloor(d: Pick<RadialDiagnostics, 'rhsEvaluations'>): number {
  return ROUNDING_FACTOR * EPSILON * Math.sqrt(Math.max(d.rhsEvaluations, 1));
}

/** Start fraction and matching radius of the check solve, from where the first solve started and matched. */
export function checkGeometry(
  hole: KerrHole,
  d: Pick<RadialDiagnostics, 'startRadius' | 'matchRadius'>,
): { startFraction: number; matchRadius: number } {
  const fraction = (d.startRadius - hole.rPlus) / (hole.rPlus - hole.rMinus);
  return { startFraction: CHECK_START_FACTOR * fraction, matchRadius: CHECK_MATCH_FACTOR * d.matchRadius };
}

/** What Γ > 1 proves about the error (Γ ≤ 1 for every mode; in the superradiant band Γ < 0 and |Γ| may exceed 1). */
function provenByOverOne(sign: number, lnFine: number): number {
  return sign > 0 && lnFine > 0 ? -Math.expm1(-lnFine) : 0;
}

/**
 * Relative error estimate of Γ from one solve: SINGLE_SOLVE_SHARE × its
 * accumulation bound `budget` plus the rounding floor; never less than what
 * Γ > 1 proves. `sign` is the sign of Γ and `lnFine` ln |Γ|.
 */
export function singleSolveGammaEstimate(sign: number, lnFine: number, budget: number, floor: number): number {
  return Math.max(SINGLE_SOLVE_SHARE * budget + floor, provenByOverOne(sign, lnFine));
}

/**
 * Relative error estimate of Γ: the larger of the difference of the two
 * solves and BUDGET_SHARE × the first solve's accumulation bound, plus the
 * rounding floor; never less than what Γ > 1 proves (Γ ≤ 1 for every mode;
 * in the superradiant band Γ < 0 and |Γ| may exceed 1). `sign` is the sign
 * of Γ, `lnFine` and `lnCheck` are ln |Γ| of the two solves.
 */
export function gammaErrorEstimate(sign: number, lnFine: number, lnCheck: number, budget: number, floor: number): number {
  const difference = Math.abs(Math.expm1(lnFine - lnCheck));
  return Math.max(Math.max(difference, BUDGET_SHARE * budget) + floor, provenByOverOne(sign, lnFine));
}
