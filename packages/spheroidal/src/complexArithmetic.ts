import type { Arithmetic } from './leaverRecurrence.js';

/** A complex number as a plain pair (the hot loops keep re and im in separate Float64Arrays). */
export interface ComplexValue {
  re: number;
  im: number;
}

/** a / b. */
export function cdiv(a: ComplexValue, b: ComplexValue): ComplexValue {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

/** Complex pairs for the shared scalar formulas (leaverRecurrence.ts). */
export const complexArithmetic: Arithmetic<ComplexValue> = {
  add: (a, b) => ({ re: a.re + b.re, im: a.im + b.im }),
  sub: (a, b) => ({ re: a.re - b.re, im: a.im - b.im }),
  mul: (a, b) => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re }),
  neg: (a) => ({ re: -a.re, im: -a.im }),
  scale: (a, k) => ({ re: a.re * k, im: a.im * k }),
  real: (k) => ({ re: k, im: 0 }),
};
