/**
 * The real-c spheroidal problem and its options, with their validation.
 *
 * Parameters are named as the caller wrote them ('problem.s', 'problem.l',
 * 'problem.m', 'problem.c'), so an InputError points at the offending key of
 * the problem object.
 */
import {
  InputError,
  MAX_L,
  SPIN_WEIGHTS,
  isBoolean,
  oneOf,
  requireKeyedObject,
  validateOptions,
  type OptionSpec,
} from '@penumbra/core';

/** Largest |c| accepted for real c (tests and bench cover |c| ≤ 40). */
export const MAX_REAL_C = 40;

/**
 * One spin-weighted spheroidal eigenvalue problem for real c.
 *
 * `s` is the signed spin weight of one Teukolsky equation (s = ±spin of the
 * field, core's SPIN_WEIGHTS: −2, −1, −1/2, 0, 1/2, 1, 2); `l` and `m` are
 * the angular numbers (l ≥ |s|, |m| ≤ l, l − s and m − s integers, l ≤ core's
 * MAX_L); `c` = aω is the spheroidicity, |c| ≤ MAX_REAL_C.
 */
export interface SpheroidalProblem {
  /** signed spin weight, one of core's SPIN_WEIGHTS */
  readonly s: number;
  /** multipole, |s| ≤ l ≤ MAX_L, l − s an integer */
  readonly l: number;
  /** azimuthal number, |m| ≤ l, m − s an integer */
  readonly m: number;
  /** spheroidicity c = aω (real), |c| ≤ MAX_REAL_C */
  readonly c: number;
}

/** Options of the real-c solves (`spheroidalEigenvalue`, `spheroidalHarmonic`). */
export interface SpheroidalOptions {
  /**
   * Leaver's continued fraction as a second method: 'off' (default: the
   * spectral value alone), 'check' (solve the fraction by Newton from the
   * spectral value and report the agreement; above 1e-7 it is a
   * ConvergenceError), or 'polish' (check, and adopt the root only where it
   * agrees within the spectral error bound). Measured against a 40-digit
   * reference the spectral value is already at rounding level while the
   * fraction loses digits at large |c| (docs/spheroidal.md), so 'polish'
   * never moves a real-c value beyond its error estimate.
   */
  leaver?: 'off' | 'check' | 'polish';
  /** Use and update the per-mode continuation cache (default true). */
  continuation?: boolean;
}

const OPTION_SPEC: OptionSpec<SpheroidalOptions> = {
  leaver: oneOf(['off', 'check', 'polish'] as const),
  continuation: isBoolean,
};

const DEFAULT_OPTIONS: Readonly<Required<SpheroidalOptions>> = { leaver: 'off', continuation: true };

/**
 * Validate options (unknown keys refused) and fill in the defaults. A
 * well-formed object is read directly (core's validateOptions costs ~1 µs, a
 * few per cent of a warm solve); anything else goes to validateOptions, so
 * every refusal is core's.
 */
export function validateSpheroidalOptions(options: unknown): Readonly<Required<SpheroidalOptions>> {
  if (options === undefined) return DEFAULT_OPTIONS;
  if (typeof options === 'object' && options !== null && !Array.isArray(options)) {
    let wellFormed = true;
    for (const key in options) {
      if (key !== 'leaver' && key !== 'continuation') wellFormed = false;
    }
    const { leaver = 'off', continuation = true } = options as { leaver?: unknown; continuation?: unknown };
    if (wellFormed && (leaver === 'off' || leaver === 'check' || leaver === 'polish') && typeof continuation === 'boolean') {
      return { leaver, continuation };
    }
  }
  const given = validateOptions(options, OPTION_SPEC);
  return { leaver: given.leaver ?? 'off', continuation: given.continuation ?? true };
}

/** requireKeyedObject's own text for a key list, formatted once per list instead of on every call. */
const keyedTexts = new WeakMap<readonly string[], string>();
function keyedText(keys: readonly string[]): string {
  let text = keyedTexts.get(keys);
  if (text === undefined) {
    text = `an object { ${keys.join(', ')} }`;
    keyedTexts.set(keys, text);
  }
  return text;
}

const SPIN_WEIGHT_TEXT = 'one of −2, −1, −1/2, 0, 1/2, 1, 2 (SPIN_WEIGHTS)';

/**
 * Validate a problem object with the keys `keys` (unknown keys refused by
 * core's requireKeyedObject) and its mode numbers (s, l, m); c is validated
 * by the caller. Errors name `${parameter}.key` (problem.l), or the bare key
 * when `parameter` is '' (the numbers were the caller's own arguments).
 */
export function validateModeNumbers(
  problem: unknown,
  keys: readonly string[],
  parameter = 'problem',
): { s: number; l: number; m: number } {
  const name = (key: string) => (parameter ? `${parameter}.${key}` : key);
  if (parameter) requireKeyedObject(parameter, problem, keys, keyedText(keys));
  const { s, l, m } = problem as { s?: unknown; l?: unknown; m?: unknown };
  if (typeof s !== 'number' || !(SPIN_WEIGHTS as readonly number[]).includes(s))
    throw new InputError(name('s'), SPIN_WEIGHT_TEXT, s);
  if (typeof l !== 'number' || !Number.isFinite(l) || !Number.isInteger(l - s)) {
    throw new InputError(name('l'), `a number with l − s an integer (s = ${s})`, l);
  }
  if (l < Math.abs(s)) throw new InputError(name('l'), `l ≥ |s| = ${Math.abs(s)}`, l);
  if (l > MAX_L) throw new InputError(name('l'), `l ≤ ${MAX_L}`, l);
  if (typeof m !== 'number' || !Number.isFinite(m) || !Number.isInteger(m - s)) {
    throw new InputError(name('m'), `a number with m − s an integer (s = ${s})`, m);
  }
  if (Math.abs(m) > l) throw new InputError(name('m'), `|m| ≤ l = ${l}`, m);
  return { s, l, m };
}

const REAL_KEYS = ['s', 'l', 'm', 'c'] as const;

/** Validate a real-c problem; returns its numbers. */
export function validateSpheroidalProblem(problem: unknown): { s: number; l: number; m: number; c: number } {
  const { s, l, m } = validateModeNumbers(problem, REAL_KEYS);
  return { s, l, m, c: validateRealC((problem as { c?: unknown }).c) };
}

/** Validate the spheroidicity of a real-c problem (InputError naming problem.c); tiny |c| becomes 0. */
export function validateRealC(c: unknown): number {
  if (typeof c !== 'number' || !Number.isFinite(c)) throw new InputError('problem.c', 'a finite real number', c);
  if (Math.abs(c) > MAX_REAL_C) throw new InputError('problem.c', `|c| ≤ ${MAX_REAL_C}`, c);
  // A c below 1e-150 changes A by c² < 1e-300 relative to c = 0: take the exact c = 0 values (a subnormal c
  // would underflow inside the series).
  return Math.abs(c) < 1e-150 ? 0 : c;
}
