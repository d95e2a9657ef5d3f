/**
 * The complex-c spheroidal problem (damped modes), its options and validation.
 */
import { Complex } from 'complex.js';
import { InputError, validateOptions, type OptionSpec } from '@penumbra/core';
import type { ComplexValue } from './complexArithmetic.js';
import { validateModeNumbers } from './problem.js';

/** Largest |c| accepted for complex c (measured, docs/spheroidal.md). */
export const MAX_COMPLEX_C = 10;
/** Largest |Im c|/|Re c| accepted: the path from the real axis stays clear of branch points (docs/spheroidal.md). */
export const MAX_COMPLEX_ARG_RATIO = 1;
/**
 * Largest |Im c| accepted: beyond it the continued-fraction check loses more
 * than ~e^{2|Im c|}ε and can no longer certify the spectral value to 1e-10.
 */
export const MAX_COMPLEX_IM_C = 4;

/**
 * One spheroidal eigenvalue problem for complex c = aω: `s`, `l`, `m` as in
 * SpheroidalProblem (s the signed spin weight, one of core's SPIN_WEIGHTS),
 * with |c| ≤ MAX_COMPLEX_C, |Im c| ≤ |Re c| and |Im c| ≤ MAX_COMPLEX_IM_C.
 */
export interface ComplexSpheroidalProblem {
  /** signed spin weight, one of core's SPIN_WEIGHTS */
  readonly s: number;
  /** multipole, |s| ≤ l ≤ MAX_L, l − s an integer */
  readonly l: number;
  /** azimuthal number, |m| ≤ l, m − s an integer */
  readonly m: number;
  /** c = aω, as { re, im }, a complex.js value, or anything complex.js parses. */
  readonly c: ComplexValue | Complex | string | number;
}

/**
 * Options of `spheroidalEigenvalueComplex`. The method has no knobs yet; an
 * options object is still validated, so a misspelt key is refused rather than
 * ignored.
 */
export type ComplexSpheroidalOptions = Record<string, never>;

const OPTION_SPEC = {} as OptionSpec<ComplexSpheroidalOptions>;

/** Validate options (any key is unknown today). */
export function validateComplexOptions(options: unknown): ComplexSpheroidalOptions {
  validateOptions(options, OPTION_SPEC);
  return {};
}

const KEYS = ['s', 'l', 'm', 'c'] as const;

/** Validate a complex-c problem; returns its numbers with c as { re, im }. */
export function validateComplexProblem(problem: unknown): { s: number; l: number; m: number; c: ComplexValue } {
  const { s, l, m } = validateModeNumbers(problem, KEYS);
  return { s, l, m, c: parseComplexC((problem as { c?: unknown }).c) };
}

function parseComplexC(value: unknown): ComplexValue {
  let z: Complex;
  try {
    z = new Complex(value as ComplexValue);
  } catch {
    throw new InputError('problem.c', 'a complex number { re, im }', value);
  }
  if (value === null || value === undefined || typeof value === 'boolean' || !Number.isFinite(z.re) || !Number.isFinite(z.im)) {
    throw new InputError('problem.c', 'a finite complex number { re, im }', value);
  }
  const re = z.re;
  const im = z.im;
  if (Math.hypot(re, im) > MAX_COMPLEX_C) throw new InputError('problem.c', `|c| ≤ ${MAX_COMPLEX_C}`, { re, im });
  if (Math.abs(im) > MAX_COMPLEX_ARG_RATIO * Math.abs(re)) {
    throw new InputError(
      'problem.c',
      `|Im c| ≤ |Re c|`,
      { re, im },
      'the continuation from the real axis is verified only there',
    );
  }
  if (Math.abs(im) > MAX_COMPLEX_IM_C) throw new InputError('problem.c', `|Im c| ≤ ${MAX_COMPLEX_IM_C}`, { re, im });
  return { re, im };
}
