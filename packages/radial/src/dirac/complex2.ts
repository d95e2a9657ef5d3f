/**
 * Minimal complex arithmetic for the massive Dirac series: numbers as
 * [re, im] pairs, 2-vectors and 2×2 matrices of them, for what a solve does
 * a handful of times (the series' leading terms, the amplitudes), where
 * clarity wins over speed; the loops per series term or per step are written
 * out on scalars in the same operations (each helper allocates its result).
 */

/** A complex number [re, im]. */
export type C = [number, number];
/** A complex 2-vector (P₊, P₋). */
export type V2 = [C, C];
/** A complex 2×2 matrix, rows first. */
export type M2 = [[C, C], [C, C]];

export const ZERO: C = [0, 0];
export const cadd = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];
export const csub = (a: C, b: C): C => [a[0] - b[0], a[1] - b[1]];
export const cmul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
export const cscale = (a: C, s: number): C => [a[0] * s, a[1] * s];
export function cdiv(a: C, b: C): C {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
}
export const cabs = (a: C): number => Math.hypot(a[0], a[1]);
/** e^{z}. */
export function cexp(z: C): C {
  const e = Math.exp(z[0]);
  return [e * Math.cos(z[1]), e * Math.sin(z[1])];
}

export const vadd = (a: V2, b: V2): V2 => [cadd(a[0], b[0]), cadd(a[1], b[1])];
export const vscale = (a: V2, s: C): V2 => [cmul(a[0], s), cmul(a[1], s)];
export const vnorm = (a: V2): number => Math.hypot(a[0][0], a[0][1], a[1][0], a[1][1]);
/** Matrix times vector. */
export function mv(m: M2, v: V2): V2 {
  return [cadd(cmul(m[0][0], v[0]), cmul(m[0][1], v[1])), cadd(cmul(m[1][0], v[0]), cmul(m[1][1], v[1]))];
}
/** Row vector times column vector. */
export const dot = (l: V2, v: V2): C => cadd(cmul(l[0], v[0]), cmul(l[1], v[1]));
