/**
 * ln |Γ(h + iy)|² for the weights the near-region form needs: h a positive
 * integer or half-integer. Exact closed forms (Abramowitz & Stegun 6.1.29,
 * 6.1.30: |Γ(1 + iy)|² = πy/sinh(πy), |Γ(1/2 + iy)|² = π/cosh(πy)) times the
 * finite product of the recurrence Γ(z + 1) = zΓ(z), all in logarithms so that
 * neither large y nor large h overflows.
 */

/** ln sinh(x) for x > 0, without overflow at large x. */
export function logSinh(x: number): number {
  return x > 20 ? x - Math.LN2 + Math.log1p(-Math.exp(-2 * x)) : Math.log(Math.sinh(x));
}

/** ln cosh(x), without overflow at large |x|. */
export function logCosh(x: number): number {
  const ax = Math.abs(x);
  return ax - Math.LN2 + Math.log1p(Math.exp(-2 * ax));
}

/** ln |Γ(h + iy)|² for h ∈ {1/2, 1, 3/2, 2, …} and real y. */
export function logAbsGammaSquared(h: number, y: number): number {
  const x = Math.PI * Math.abs(y);
  const halfInteger = !Number.isInteger(h);
  // |Γ(1 + iy)|² → 1 as y → 0; the closed form is 0/0 at y = 0 exactly.
  let value = halfInteger ? Math.log(Math.PI) - logCosh(x) : x === 0 ? 0 : Math.log(x) - logSinh(x);
  for (let j = halfInteger ? 0.5 : 1; j < h; j++) value += Math.log(j * j + y * y);
  return value;
}

/** ln n! for a non-negative integer n (a sum: n stays below a few hundred here). */
export function logFactorial(n: number): number {
  let value = 0;
  for (let i = 2; i <= n; i++) value += Math.log(i);
  return value;
}
