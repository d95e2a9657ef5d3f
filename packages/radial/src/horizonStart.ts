/** Where the integration starts: the horizon series summed close enough to r+ to converge without cancelling digits. */
import type { KerrHole } from '@penumbra/kerr';
import type { RadialEquation, RadialMode } from './equation.js';
import { factorsThroat, horizonSeriesStart, type HorizonStart } from './horizonSeries.js';

/**
 * Start fraction where the horizon series carries the throat factor
 * (factorsThroat): the factored terms decay from the first, so the series is
 * summed out to half its radius whatever ω (at a = 0.99999, m = −l, Mω = 3–30
 * and a = 0.9999, l = 20, Mω = 1: at most 30 terms and truncation with
 * cancellation 1e-16 even at 0.75 (r+ − r−)). Right-hand-side evaluations at
 * tol 1e-8 summed over the factored modes with a = 0.999–0.99999, l ≤ 6,
 * m = −l, 0, l, Mω = 0.3–30 (456 solved, 36 more refused at every fraction and
 * by the plain series alike): 788,900 at 0.33, 692,850 at 0.5, 736,100 at 0.6,
 * 731,401 at 0.75.
 */
const THROAT_FRACTION = 0.5;

/** Truncation (cancellation included) accepted before the start point is moved inward. */
const START_TRUNCATION = 1e-13;
/**
 * The same for the wide default start (see defaultStartFraction). The
 * cancellation is charged at 1e-16 per unit of swell, but where |ν| = |k|·2Mr+/b
 * is large (near-extremal, counter-rotating) the rounding of the recurrence
 * was measured at up to ~250 times that (s = 2, l = 35, m = −25, a = 0.99999,
 * Mω = 0.092: truncation 6e-14, error of ln|Z_in| 1.5e-11); a start that
 * swells less than tenfold keeps that far below the tolerances it serves.
 */
const START_TRUNCATION_WIDE = 1e-15;

/**
 * Integrator tolerances below this (greybody tol below 1e-9) are near the
 * rounding floor: there the narrower start, shooting.ts's smaller first step
 * and farMatch.ts's tighter far series are kept. Measured: on the Kerr rows
 * of the 40-digit fixture at greybody tol 1e-12 the wide start let the true
 * error reach 4.1e-13 against 2.3e-13 and 9 rows were refused against 5
 * (bench/honesty.bench.mjs); at tol 1e-10 over 2,500 random and wide-range
 * modes 11 estimates fell below the error of a tol-1e-11 solve against 1
 * (bench/estimate.bench.mjs).
 */
export const NEAR_ROUNDING_TOL = 1e-12;

/**
 * Default start point as a fraction of r+ − r−. The series converges out to
 * x = r+ − r− (the singular point r−), geometrically with the fraction, and
 * is summed to 1e-17 of its value, so 0.75 costs ~150 cheap terms; near the
 * horizon the solution oscillates with wavenumber ≈ 2ωr+/(r+ − r−) in x, so
 * terms grow like (2ωr+·fraction)^n/n! before decaying; keeping
 * ωr+·fraction ≤ 1 bounds that cancellation (it is charged in the truncation,
 * and the start moves inward where it exceeds START_TRUNCATION_WIDE). Every bit
 * of x the series covers is integration saved (measured at tol 1e-8 over
 * random modes, against min(0.25, 0.5/(ωr+)): 11 % fewer right-hand-side
 * evaluations, the error estimate no closer to the true error;
 * bench/floor.bench.mjs). At an integrator tolerance below NEAR_ROUNDING_TOL
 * the start stays at min(0.25, 0.5/(ωr+)). Starting closer than necessary
 * costs digits for s > 0 (the outgoing horizon solution is relatively
 * amplified).
 */
export function defaultStartFraction(hole: KerrHole, omega: number, tol = 1e-11): number {
  if (tol < NEAR_ROUNDING_TOL) return Math.min(0.25, 0.5 / (Math.abs(omega) * hole.rPlus));
  return Math.min(0.75, 1 / (Math.abs(omega) * hole.rPlus));
}

/**
 * Horizon start for the ingoing solution at `startFraction` × (r+ − r−), or at
 * THROAT_FRACTION where the series carries the throat factor, or else at
 * the default fraction halved while the series cancels digits (large |k|/κ
 * near extremality makes the terms swell before they decay), and kept inside
 * `innerStop` (the smallest radius where the caller reads the integrated
 * solution: half way to it at most). `eq` is the mode's equation about r+;
 * `tol` is the integrator tolerance (see defaultStartFraction).
 */
export function startAtHorizon(
  hole: KerrHole,
  mode: RadialMode,
  eq: RadialEquation,
  startFraction?: number,
  innerStop = Number.POSITIVE_INFINITY,
  tol?: number,
): HorizonStart {
  const b = hole.rPlus - hole.rMinus;
  let x0 = (startFraction ?? (factorsThroat(hole, mode) ? THROAT_FRACTION : defaultStartFraction(hole, mode.omega, tol))) * b;
  const accepted = tol !== undefined && tol < NEAR_ROUNDING_TOL ? START_TRUNCATION : START_TRUNCATION_WIDE;
  if (startFraction === undefined && innerStop > hole.rPlus) x0 = Math.min(x0, 0.5 * (innerStop - hole.rPlus));
  for (;;) {
    const start = horizonSeriesStart(hole, mode, x0, eq, true);
    if (start === undefined) {
      // no more retries: the series' own ConvergenceError, with its diagnostics
      if (x0 < 1e-6 * b) return horizonSeriesStart(hole, mode, x0, eq);
    } else if (start.truncation <= accepted || x0 < 1e-4 * b || startFraction !== undefined) return start;
    x0 *= 0.5;
  }
}
