import { InputError } from '@penumbra/kerr';

/** Spin weights the package supports (massless fields of spin 0, 1/2, 1, 2). */
export const SUPPORTED_SPINS: readonly number[] = [-2, -1, -0.5, 0, 0.5, 1, 2];
/** Largest l accepted; tests cover l ≤ 60 and spot-check the top of this range. */
export const MAX_L = 100;
/** Largest |c| accepted for real c (tests and bench cover |c| ≤ 40). */
export const MAX_REAL_C = 40;

export interface ModeNumbers {
  s: number;
  l: number;
  m: number;
}

function isHalfInteger(x: number): boolean {
  return Number.isInteger(2 * x);
}

/** Validate (s, l, m); throws InputError naming the offending parameter. */
export function checkModeNumbers(q: ModeNumbers): void {
  const { s, l, m } = q;
  if (typeof s !== 'number' || !SUPPORTED_SPINS.includes(s)) {
    throw new InputError('s', 'one of 0, ±1/2, ±1, ±2', s);
  }
  if (typeof l !== 'number' || !Number.isFinite(l) || !isHalfInteger(l) || !Number.isInteger(l - s)) {
    throw new InputError('l', `a number with l − s an integer (s = ${s})`, l);
  }
  if (l < Math.abs(s)) throw new InputError('l', `l ≥ |s| = ${Math.abs(s)}`, l);
  if (l > MAX_L) throw new InputError('l', `l ≤ ${MAX_L}`, l);
  if (typeof m !== 'number' || !Number.isFinite(m) || !Number.isInteger(m - s)) {
    throw new InputError('m', `a number with m − s an integer (s = ${s})`, m);
  }
  if (Math.abs(m) > l) throw new InputError('m', `|m| ≤ l = ${l}`, m);
}

/** Validate a real spheroidicity c = aω. */
export function checkRealC(c: unknown): number {
  if (typeof c !== 'number' || !Number.isFinite(c)) throw new InputError('c', 'a finite real number', c);
  if (Math.abs(c) > MAX_REAL_C) throw new InputError('c', `|c| ≤ ${MAX_REAL_C}`, c);
  return c;
}

/** Lowest l in the (s, m) family: max(|m|, |s|). */
export function lowestL(s: number, m: number): number {
  return Math.max(Math.abs(m), Math.abs(s));
}

/** Eigenvalue at c = 0: A = (l − s)(l + s + 1). */
export function sphericalEigenvalue(s: number, l: number): number {
  return (l - s) * (l + s + 1);
}
