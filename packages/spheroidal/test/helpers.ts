/** Gauss–Legendre nodes and weights on [−1, 1] (Newton on P_n; Golub–Welsch not needed at this size). */
export function gaussLegendre(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return { x, w };
}

/** Legendre polynomial P_l(x) by the Bonnet recurrence. */
export function legendre(l: number, x: number): number {
  let p0 = 1;
  let p1 = x;
  if (l === 0) return 1;
  for (let k = 2; k <= l; k++) {
    const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
    p0 = p1;
    p1 = p2;
  }
  return p1;
}

/** Relative difference scaled by max(1, |reference|). */
export function relativeError(value: number, reference: number): number {
  return Math.abs(value - reference) / Math.max(1, Math.abs(reference));
}
