import { bandTerms, combineTerms } from './bandTerms.js';
import { cdiv, type ComplexValue } from './complexArithmetic.js';
import type { Tally } from './diagnostics.js';

/**
 * The complex-symmetric spectral matrix K(c) = diag(A₀) − c²X² + 2csX for
 * complex c, by diagonals (real and imaginary parts), plus ∂K/∂c. Assembled
 * from the same terms as the real band (bandTerms.ts).
 */
export interface ComplexBand {
  size: number;
  d0r: Float64Array;
  d0i: Float64Array;
  d1r: Float64Array;
  d1i: Float64Array;
  d2r: Float64Array;
  d2i: Float64Array;
  e0r: Float64Array;
  e0i: Float64Array;
  e1r: Float64Array;
  e1i: Float64Array;
  e2r: Float64Array;
  e2i: Float64Array;
  /** max row sum of |K|: the scale for tolerances */
  norm: number;
}

/** The complex band K(c) and ∂K/∂c at c = cr + i·ci, assembled from the shared terms (bandTerms.ts). */
export function buildComplexBand(
  s: number,
  m: number,
  cr: number,
  ci: number,
  lFirst: number,
  stride: 1 | 2,
  size: number,
): ComplexBand {
  const terms = bandTerms(s, m, lFirst, stride, size);
  const [x2Diagonal, x2First, x2Second] = terms.squared;
  const [xDiagonal, xFirst] = terms.linear;
  // p = −c², q = 2cs multiply X² and X; ∂K/∂c has p = −2c and the real q = 2s.
  const pr = -(cr * cr - ci * ci);
  const pi = -2 * cr * ci;
  const qr = 2 * s * cr;
  const qi = 2 * s * ci;
  const dpr = -2 * cr;
  const dpi = -2 * ci;
  const dq = 2 * s;
  const mk = () => new Float64Array(size);
  const band: ComplexBand = {
    size,
    d0r: mk(),
    d0i: mk(),
    d1r: mk(),
    d1i: mk(),
    d2r: mk(),
    d2i: mk(),
    e0r: mk(),
    e0i: mk(),
    e1r: mk(),
    e1i: mk(),
    e2r: mk(),
    e2i: mk(),
    norm: 1,
  };
  combineTerms(band.d0r, size, terms.spherical, pr, x2Diagonal, qr, xDiagonal);
  combineTerms(band.d0i, size, null, pi, x2Diagonal, qi, xDiagonal);
  combineTerms(band.e0r, size, null, dpr, x2Diagonal, dq, xDiagonal);
  combineTerms(band.e0i, size, null, dpi, x2Diagonal, 0, null);
  combineTerms(band.d1r, size, null, pr, x2First, qr, xFirst);
  combineTerms(band.d1i, size, null, pi, x2First, qi, xFirst);
  combineTerms(band.e1r, size, null, dpr, x2First, dq, xFirst);
  combineTerms(band.e1i, size, null, dpi, x2First, 0, null);
  if (x2Second) {
    combineTerms(band.d2r, size, null, pr, x2Second, 0, null);
    combineTerms(band.d2i, size, null, pi, x2Second, 0, null);
    combineTerms(band.e2r, size, null, dpr, x2Second, 0, null);
    combineTerms(band.e2i, size, null, dpi, x2Second, 0, null);
  }
  let norm = 0;
  for (let i = 0; i < size; i++) {
    const row =
      Math.hypot(band.d0r[i], band.d0i[i]) +
      Math.hypot(band.d1r[i], band.d1i[i]) +
      Math.hypot(band.d2r[i], band.d2i[i]) +
      (i > 0 ? Math.hypot(band.d1r[i - 1], band.d1i[i - 1]) : 0) +
      (i > 1 ? Math.hypot(band.d2r[i - 2], band.d2i[i - 2]) : 0);
    norm = Math.max(norm, row);
  }
  band.norm = Math.max(norm, 1);
  return band;
}

/** y = M x for a complex symmetric band given by diagonals (r0,i0,r1,i1,r2,i2). */
function complexBandMultiply(
  r0: Float64Array,
  i0: Float64Array,
  r1: Float64Array,
  i1: Float64Array,
  r2: Float64Array,
  i2: Float64Array,
  n: number,
  xr: Float64Array,
  xi: Float64Array,
  yr: Float64Array,
  yi: Float64Array,
): void {
  for (let k = 0; k < n; k++) {
    let vr = r0[k] * xr[k] - i0[k] * xi[k];
    let vi = r0[k] * xi[k] + i0[k] * xr[k];
    if (k + 1 < n) {
      vr += r1[k] * xr[k + 1] - i1[k] * xi[k + 1];
      vi += r1[k] * xi[k + 1] + i1[k] * xr[k + 1];
    }
    if (k + 2 < n) {
      vr += r2[k] * xr[k + 2] - i2[k] * xi[k + 2];
      vi += r2[k] * xi[k + 2] + i2[k] * xr[k + 2];
    }
    if (k >= 1) {
      vr += r1[k - 1] * xr[k - 1] - i1[k - 1] * xi[k - 1];
      vi += r1[k - 1] * xi[k - 1] + i1[k - 1] * xr[k - 1];
    }
    if (k >= 2) {
      vr += r2[k - 2] * xr[k - 2] - i2[k - 2] * xi[k - 2];
      vi += r2[k - 2] * xi[k - 2] + i2[k - 2] * xr[k - 2];
    }
    yr[k] = vr;
    yi[k] = vi;
  }
}

/** Unconjugated xᵀy. */
function bilinear(n: number, xr: Float64Array, xi: Float64Array, yr: Float64Array, yi: Float64Array): ComplexValue {
  let re = 0;
  let im = 0;
  for (let k = 0; k < n; k++) {
    re += xr[k] * yr[k] - xi[k] * yi[k];
    im += xr[k] * yi[k] + xi[k] * yr[k];
  }
  return { re, im };
}

/**
 * Solve (K − σI) y = x in place by the complex-symmetric LDLᵀ factorisation
 * without pivoting (transpose, not conjugate transpose); tiny pivots are nudged.
 */
function complexShiftedSolve(band: ComplexBand, sr: number, si: number, xr: Float64Array, xi: Float64Array): void {
  const n = band.size;
  const Dr = new Float64Array(n),
    Di = new Float64Array(n);
  const L1r = new Float64Array(n),
    L1i = new Float64Array(n);
  const L2r = new Float64Array(n),
    L2i = new Float64Array(n);
  const pivmin = 1e-30 * band.norm;
  for (let k = 0; k < n; k++) {
    let dr = band.d0r[k] - sr;
    let di = band.d0i[k] - si;
    if (k >= 1) {
      // L1[k−1]² D[k−1]
      const qr = L1r[k - 1] * L1r[k - 1] - L1i[k - 1] * L1i[k - 1];
      const qi = 2 * L1r[k - 1] * L1i[k - 1];
      dr -= qr * Dr[k - 1] - qi * Di[k - 1];
      di -= qr * Di[k - 1] + qi * Dr[k - 1];
    }
    if (k >= 2) {
      const qr = L2r[k - 2] * L2r[k - 2] - L2i[k - 2] * L2i[k - 2];
      const qi = 2 * L2r[k - 2] * L2i[k - 2];
      dr -= qr * Dr[k - 2] - qi * Di[k - 2];
      di -= qr * Di[k - 2] + qi * Dr[k - 2];
    }
    if (Math.hypot(dr, di) < pivmin) {
      dr = pivmin;
      di = 0;
    }
    Dr[k] = dr;
    Di[k] = di;
    const dd = dr * dr + di * di;
    let offr = k + 1 < n ? band.d1r[k] : 0;
    let offi = k + 1 < n ? band.d1i[k] : 0;
    if (k >= 1 && k + 1 < n) {
      // off −= L2[k−1] L1[k−1] D[k−1]
      const tr = L2r[k - 1] * L1r[k - 1] - L2i[k - 1] * L1i[k - 1];
      const ti = L2r[k - 1] * L1i[k - 1] + L2i[k - 1] * L1r[k - 1];
      offr -= tr * Dr[k - 1] - ti * Di[k - 1];
      offi -= tr * Di[k - 1] + ti * Dr[k - 1];
    }
    L1r[k] = (offr * dr + offi * di) / dd;
    L1i[k] = (offi * dr - offr * di) / dd;
    const er = k + 2 < n ? band.d2r[k] : 0;
    const ei = k + 2 < n ? band.d2i[k] : 0;
    L2r[k] = (er * dr + ei * di) / dd;
    L2i[k] = (ei * dr - er * di) / dd;
  }
  for (let k = 1; k < n; k++) {
    xr[k] -= L1r[k - 1] * xr[k - 1] - L1i[k - 1] * xi[k - 1];
    xi[k] -= L1r[k - 1] * xi[k - 1] + L1i[k - 1] * xr[k - 1];
    if (k >= 2) {
      xr[k] -= L2r[k - 2] * xr[k - 2] - L2i[k - 2] * xi[k - 2];
      xi[k] -= L2r[k - 2] * xi[k - 2] + L2i[k - 2] * xr[k - 2];
    }
  }
  for (let k = 0; k < n; k++) {
    const q = cdiv({ re: xr[k], im: xi[k] }, { re: Dr[k], im: Di[k] });
    xr[k] = q.re;
    xi[k] = q.im;
  }
  for (let k = n - 2; k >= 0; k--) {
    xr[k] -= L1r[k] * xr[k + 1] - L1i[k] * xi[k + 1];
    xi[k] -= L1r[k] * xi[k + 1] + L1i[k] * xr[k + 1];
    if (k + 2 < n) {
      xr[k] -= L2r[k] * xr[k + 2] - L2i[k] * xi[k + 2];
      xi[k] -= L2r[k] * xi[k + 2] + L2i[k] * xr[k + 2];
    }
  }
}

/** A converged eigenpair of the complex band. */
export interface ComplexPair {
  A: ComplexValue;
  xr: Float64Array;
  xi: Float64Array;
  /** dA/dc = xᵀ(∂K/∂c)x / xᵀx. */
  slope: ComplexValue;
  /** ‖K x − A x‖ / ‖K‖ */
  residual: number;
  iterations: number;
}

function normalise(n: number, xr: Float64Array, xi: Float64Array): number {
  let s2 = 0;
  for (let k = 0; k < n; k++) s2 += xr[k] * xr[k] + xi[k] * xi[k];
  const inv = 1 / Math.sqrt(s2);
  for (let k = 0; k < n; k++) {
    xr[k] *= inv;
    xi[k] *= inv;
  }
  return inv;
}

/**
 * Complex Rayleigh-quotient iteration (σ = xᵀKx/xᵀx, unconjugated, the
 * stationary quotient of a complex symmetric matrix) from a shift and a vector.
 * Returns null if it does not settle within 12 steps. Each step is one
 * factorisation, counted in `tally`.
 */
export function complexRqi(
  band: ComplexBand,
  shift: ComplexValue,
  xr0: Float64Array,
  xi0: Float64Array,
  tally: Tally,
): ComplexPair | null {
  const n = band.size;
  const xr = new Float64Array(n),
    xi = new Float64Array(n);
  xr.set(xr0.subarray(0, Math.min(n, xr0.length)));
  xi.set(xi0.subarray(0, Math.min(n, xi0.length)));
  normalise(n, xr, xi);
  const yr = new Float64Array(n),
    yi = new Float64Array(n);
  let sigma = shift;
  const tol = 4e-16 * band.norm;
  for (let it = 1; it <= 12; it++) {
    tally.evaluations++;
    complexShiftedSolve(band, sigma.re, sigma.im, xr, xi);
    normalise(n, xr, xi);
    complexBandMultiply(band.d0r, band.d0i, band.d1r, band.d1i, band.d2r, band.d2i, n, xr, xi, yr, yi);
    const next = cdiv(bilinear(n, xr, xi, yr, yi), bilinear(n, xr, xi, xr, xi));
    const step = Math.hypot(next.re - sigma.re, next.im - sigma.im);
    sigma = next;
    if (step <= tol || (it >= 3 && step <= 1e-13 * band.norm)) {
      complexBandMultiply(band.d0r, band.d0i, band.d1r, band.d1i, band.d2r, band.d2i, n, xr, xi, yr, yi);
      let r2 = 0;
      for (let k = 0; k < n; k++) {
        const rr = yr[k] - (sigma.re * xr[k] - sigma.im * xi[k]);
        const ri = yi[k] - (sigma.re * xi[k] + sigma.im * xr[k]);
        r2 += rr * rr + ri * ri;
      }
      complexBandMultiply(band.e0r, band.e0i, band.e1r, band.e1i, band.e2r, band.e2i, n, xr, xi, yr, yi);
      const slope = cdiv(bilinear(n, xr, xi, yr, yi), bilinear(n, xr, xi, xr, xi));
      return { A: sigma, xr, xi, slope, residual: Math.sqrt(r2) / band.norm, iterations: it };
    }
  }
  return null;
}

/** |x₁ᴴ x₂| for normalised vectors: how much of the old eigenvector the new one keeps. */
export function overlap(n: number, ar: Float64Array, ai: Float64Array, br: Float64Array, bi: Float64Array): number {
  let re = 0;
  let im = 0;
  const k = Math.min(n, ar.length, br.length);
  for (let j = 0; j < k; j++) {
    re += ar[j] * br[j] + ai[j] * bi[j];
    im += ar[j] * bi[j] - ai[j] * br[j];
  }
  return Math.hypot(re, im);
}
