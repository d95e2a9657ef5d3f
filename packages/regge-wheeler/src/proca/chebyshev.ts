/**
 * Chebyshev collocation on one interval (Trefethen, Spectral Methods in
 * MATLAB, 2000, ch. 6 and 12): n + 1 Gauss–Lobatto nodes τ_j = −cos(πj/n) on
 * [−1, 1], the matrix S with ∫_{−1}^{τ_j} p = Σ_m S_jm p(τ_m) for polynomials
 * of degree ≤ n, and the matrix C that gives the Chebyshev coefficients of
 * such a polynomial from its node values (their tail measures the
 * interpolation error). Plus an in-place complex LU for the small systems of
 * the collocation Newton steps.
 */

/** Chebyshev polynomials T_0 … T_n at τ. */
function chebyshevRow(tau: number, n: number): number[] {
  const t = [1, tau];
  for (let k = 2; k <= n + 1; k++) t.push(2 * tau * t[k - 1] - t[k - 2]);
  return t;
}

/** Inverse of a small real matrix (Gauss–Jordan with partial pivoting). */
function invert(a: number[][]): number[][] {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let i = c + 1; i < n; i++) if (Math.abs(m[i][c]) > Math.abs(m[p][c])) p = i;
    [m[c], m[p]] = [m[p], m[c]];
    const d = m[c][c];
    for (let j = 0; j < 2 * n; j++) m[c][j] /= d;
    for (let i = 0; i < n; i++) {
      if (i === c) continue;
      const f = m[i][c];
      if (f !== 0) for (let j = 0; j < 2 * n; j++) m[i][j] -= f * m[c][j];
    }
  }
  return m.map((row) => row.slice(n));
}

/** The collocation matrices for n + 1 nodes. */
export interface ChebyshevRule {
  n: number;
  /** nodes τ_j, −1 … 1 */
  nodes: Float64Array;
  /** integration matrix, row-major (n + 1)² */
  S: Float64Array;
  /** coefficients from values, row-major (n + 1)² */
  C: Float64Array;
}

/** The rule with n + 1 Gauss–Lobatto nodes. */
export function chebyshevRule(n: number): ChebyshevRule {
  const nodes = Float64Array.from({ length: n + 1 }, (_, j) => -Math.cos((Math.PI * j) / n));
  const V = Array.from(nodes, (tau) => chebyshevRow(tau, n).slice(0, n + 1));
  const Vinv = invert(V);
  // ∫_{−1}^{τ} T_k
  const integral = (tau: number, k: number): number => {
    const t = chebyshevRow(tau, n);
    const lo = chebyshevRow(-1, n);
    if (k === 0) return tau + 1;
    if (k === 1) return (tau * tau - 1) / 2;
    const at = (row: number[]) => (row[k + 1] / (k + 1) - row[k - 1] / (k - 1)) / 2;
    return at(t) - at(lo);
  };
  const S = new Float64Array((n + 1) * (n + 1));
  const C = new Float64Array((n + 1) * (n + 1));
  for (let j = 0; j <= n; j++) {
    for (let m = 0; m <= n; m++) {
      let s = 0;
      for (let k = 0; k <= n; k++) s += integral(nodes[j], k) * Vinv[k][m];
      S[j * (n + 1) + m] = s;
      C[j * (n + 1) + m] = Vinv[j][m];
    }
  }
  return { n, nodes, S, C };
}

/**
 * LU factorisation in place of a complex n×n matrix (re, im row-major) with
 * partial pivoting; `pivots` receives the row order. The diagonal of U is
 * stored as its reciprocal, so that solves multiply instead of divide.
 * Returns false when singular.
 */
export function complexLu(re: Float64Array, im: Float64Array, n: number, pivots: Int32Array): boolean {
  for (let i = 0; i < n; i++) pivots[i] = i;
  for (let c = 0; c < n; c++) {
    let p = c;
    let best = re[c * n + c] ** 2 + im[c * n + c] ** 2;
    for (let i = c + 1; i < n; i++) {
      const v = re[i * n + c] ** 2 + im[i * n + c] ** 2;
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (best === 0) return false;
    if (p !== c) {
      for (let j = 0; j < n; j++) {
        const a = c * n + j;
        const b = p * n + j;
        const tr = re[a];
        re[a] = re[b];
        re[b] = tr;
        const ti = im[a];
        im[a] = im[b];
        im[b] = ti;
      }
      const tp = pivots[c];
      pivots[c] = pivots[p];
      pivots[p] = tp;
    }
    // 1 / a_cc
    const rc = c * n;
    const dr = re[rc + c] / best;
    const di = -im[rc + c] / best;
    re[rc + c] = dr;
    im[rc + c] = di;
    for (let i = c + 1; i < n; i++) {
      // l = a_ic / a_cc
      const ri = i * n;
      const ar = re[ri + c];
      const ai = im[ri + c];
      const lr = ar * dr - ai * di;
      const li = ai * dr + ar * di;
      re[ri + c] = lr;
      im[ri + c] = li;
      for (let j = c + 1; j < n; j++) {
        const br = re[rc + j];
        const bi = im[rc + j];
        re[ri + j] -= lr * br - li * bi;
        im[ri + j] -= lr * bi + li * br;
      }
    }
  }
  return true;
}

/**
 * Solve with an LU from complexLu for one or two right-hand sides: b (re, im, length n) is overwritten by x,
 * and so is c when given (the two share the passes over the factors).
 */
export function complexLuSolve(
  re: Float64Array,
  im: Float64Array,
  n: number,
  pivots: Int32Array,
  bRe: Float64Array,
  bIm: Float64Array,
  work: Float64Array,
  cRe?: Float64Array,
  cIm?: Float64Array,
): void {
  if (cRe && cIm) {
    solveTwo(re, im, n, pivots, bRe, bIm, cRe, cIm, work);
    return;
  }
  // permute: work[0..n) = re, work[n..2n) = im
  for (let i = 0; i < n; i++) {
    work[i] = bRe[pivots[i]];
    work[n + i] = bIm[pivots[i]];
  }
  for (let i = 0; i < n; i++) {
    let sr = work[i];
    let si = work[n + i];
    const row = i * n;
    for (let j = 0; j < i; j++) {
      const lr = re[row + j];
      const li = im[row + j];
      sr -= lr * work[j] - li * work[n + j];
      si -= lr * work[n + j] + li * work[j];
    }
    work[i] = sr;
    work[n + i] = si;
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = work[i];
    let si = work[n + i];
    const row = i * n;
    for (let j = i + 1; j < n; j++) {
      const ur = re[row + j];
      const ui = im[row + j];
      sr -= ur * work[j] - ui * work[n + j];
      si -= ur * work[n + j] + ui * work[j];
    }
    const dr = re[row + i];
    const di = im[row + i];
    const xr = sr * dr - si * di;
    const xi = si * dr + sr * di;
    work[i] = xr;
    work[n + i] = xi;
    bRe[i] = xr;
    bIm[i] = xi;
  }
}

/** complexLuSolve for two right-hand sides b and c; work holds 4n. */
function solveTwo(
  re: Float64Array,
  im: Float64Array,
  n: number,
  pivots: Int32Array,
  bRe: Float64Array,
  bIm: Float64Array,
  cRe: Float64Array,
  cIm: Float64Array,
  work: Float64Array,
): void {
  const n2 = 2 * n;
  const n3 = 3 * n;
  for (let i = 0; i < n; i++) {
    const q = pivots[i];
    work[i] = bRe[q];
    work[n + i] = bIm[q];
    work[n2 + i] = cRe[q];
    work[n3 + i] = cIm[q];
  }
  for (let i = 0; i < n; i++) {
    let sr = work[i];
    let si = work[n + i];
    let tr = work[n2 + i];
    let ti = work[n3 + i];
    const row = i * n;
    for (let j = 0; j < i; j++) {
      const lr = re[row + j];
      const li = im[row + j];
      const xr = work[j];
      const xi = work[n + j];
      const yr = work[n2 + j];
      const yi = work[n3 + j];
      sr -= lr * xr - li * xi;
      si -= lr * xi + li * xr;
      tr -= lr * yr - li * yi;
      ti -= lr * yi + li * yr;
    }
    work[i] = sr;
    work[n + i] = si;
    work[n2 + i] = tr;
    work[n3 + i] = ti;
  }
  for (let i = n - 1; i >= 0; i--) {
    let sr = work[i];
    let si = work[n + i];
    let tr = work[n2 + i];
    let ti = work[n3 + i];
    const row = i * n;
    for (let j = i + 1; j < n; j++) {
      const ur = re[row + j];
      const ui = im[row + j];
      const xr = work[j];
      const xi = work[n + j];
      const yr = work[n2 + j];
      const yi = work[n3 + j];
      sr -= ur * xr - ui * xi;
      si -= ur * xi + ui * xr;
      tr -= ur * yr - ui * yi;
      ti -= ur * yi + ui * yr;
    }
    const dr = re[row + i];
    const di = im[row + i];
    const xr = sr * dr - si * di;
    const xi = si * dr + sr * di;
    const yr = tr * dr - ti * di;
    const yi = ti * dr + tr * di;
    work[i] = xr;
    work[n + i] = xi;
    work[n2 + i] = yr;
    work[n3 + i] = yi;
    bRe[i] = xr;
    bIm[i] = xi;
    cRe[i] = yr;
    cIm[i] = yi;
  }
}
