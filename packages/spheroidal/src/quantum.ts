import { validateModeNumbers } from './problem.js';

/** Lowest l in the (s, m) family: max(|m|, |s|). */
export function lowestL(s: number, m: number): number {
  return Math.max(Math.abs(m), Math.abs(s));
}

/**
 * A_{slm}(0) = (l − s)(l + s + 1) without checks, for the solvers' inner
 * loops (their callers validated s and l).
 */
export function sphericalA0(s: number, l: number): number {
  return (l - s) * (l + s + 1);
}

/**
 * The eigenvalue at c = 0, A_{slm}(0) = (l − s)(l + s + 1) (spin-weighted
 * spherical harmonics), for s one of core's SPIN_WEIGHTS and |s| ≤ l ≤ MAX_L
 * with l − s an integer (InputError naming s or l otherwise).
 */
export function sphericalEigenvalue(s: number, l: number): number {
  validateModeNumbers({ s, l, m: s }, ['s', 'l', 'm'], '');
  return sphericalA0(s, l);
}
