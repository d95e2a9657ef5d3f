/**
 * Real power series (coefficient arrays) the Dirac coefficient expansions
 * are built from.
 */

/** Coefficients of a(t)^p for a series a with a₀ > 0 (J. C. P. Miller's recurrence). */
export function seriesPower(a: readonly number[], p: number, count: number): number[] {
  const b = new Array<number>(count).fill(0);
  b[0] = a[0] ** p;
  for (let n = 1; n < count; n++) {
    let s = 0;
    for (let k = 1; k <= Math.min(n, a.length - 1); k++) s += (k * (p + 1) - n) * a[k] * b[n - k];
    b[n] = s / (n * a[0]);
  }
  return b;
}

/** Product of two series, truncated to `count` terms. */
export function seriesProduct(a: readonly number[], b: readonly number[], count: number): number[] {
  const c = new Array<number>(count).fill(0);
  for (let i = 0; i < Math.min(a.length, count); i++) {
    for (let j = 0; j < Math.min(b.length, count - i); j++) c[i + j] += a[i] * b[j];
  }
  return c;
}
