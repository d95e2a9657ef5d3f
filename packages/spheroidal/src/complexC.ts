import { Complex } from 'complex.js';
import { ConvergenceError, InputError } from '@penumbra/kerr';
import { basisLayout } from './band.js';
import { cosDiagonal, cosOffDiagonal } from './coupling.js';
import { solveMode } from './eigenvalue.js';
import { checkModeNumbers, lowestL, sphericalEigenvalue } from './quantum.js';
import { estimateSize } from './spectral.js';

/** Largest |c| accepted for complex c (measured, docs/spheroidal.md). */
export const MAX_COMPLEX_C = 10;
/** Largest |Im c|/|Re c| accepted: the path from the real axis stays clear of branch points (docs/spheroidal.md). */
export const MAX_COMPLEX_ARG_RATIO = 1;
/**
 * Largest |Im c| accepted: beyond it the continued-fraction check loses more
 * than ~e^{2|Im c|}ε and can no longer certify the spectral value to 1e-10.
 */
export const MAX_COMPLEX_IM_C = 4;

export interface ComplexValue {
  re: number;
  im: number;
}

export interface ComplexSpheroidalQuery {
  s: number;
  l: number;
  m: number;
  /** c = aω, as { re, im }, a complex.js value, or anything complex.js parses. */
  c: ComplexValue | Complex | string | number;
}

export interface ComplexSpheroidalDiagnostics {
  method: 'spectral-complex+leaver';
  /** Basis functions kept in the complex-symmetric spectral check. */
  truncation: number;
  /** Steps of the path c(t) = Re c + i t Im c, t ∈ [0, 1]. */
  pathSteps: number;
  /** Complex Rayleigh-quotient iterations summed along the path. */
  spectralIterations: number;
  /** Newton steps on the continued fraction at the end point. */
  newtonIterations: number;
  /** Size of the last Newton step. */
  lastNewtonStep: number;
  continuedFractionDepth: number;
  /** |A_Leaver − A_spectral| / max(1, |A|). */
  agreement: number;
  /** ‖K b − A b‖ / ‖K‖ of the spectral eigenpair (unconjugated, complex symmetric). */
  residual: number;
}

export interface ComplexSpheroidalEigenvalue {
  s: number;
  l: number;
  m: number;
  c: ComplexValue;
  A: ComplexValue;
  E: ComplexValue;
  diagnostics: ComplexSpheroidalDiagnostics;
}

/** Continued fraction and spectral values must agree this well (relative to max(1, |A|)). */
const COMPLEX_AGREEMENT_LIMIT = 1e-10;

function parseComplexC(value: unknown): ComplexValue {
  let z: Complex;
  try {
    z = new Complex(value as ComplexValue);
  } catch {
    throw new InputError('c', 'a complex number { re, im }', value);
  }
  if (value === null || value === undefined || typeof value === 'boolean' || !Number.isFinite(z.re) || !Number.isFinite(z.im)) {
    throw new InputError('c', 'a finite complex number { re, im }', value);
  }
  const re = z.re;
  const im = z.im;
  if (Math.hypot(re, im) > MAX_COMPLEX_C) throw new InputError('c', `|c| ≤ ${MAX_COMPLEX_C}`, { re, im });
  if (Math.abs(im) > MAX_COMPLEX_ARG_RATIO * Math.abs(re)) {
    throw new InputError('c', `|Im c| ≤ |Re c|`, { re, im }, 'the continuation from the real axis is verified only there');
  }
  if (Math.abs(im) > MAX_COMPLEX_IM_C) throw new InputError('c', `|Im c| ≤ ${MAX_COMPLEX_IM_C}`, { re, im });
  return { re, im };
}

/**
 * The complex-symmetric spectral matrix K(c) = diag(A₀) − c²X² + 2csX for
 * complex c, by diagonals (real and imaginary parts), plus ∂K/∂c.
 */
interface ComplexBand {
  size: number;
  d0r: Float64Array; d0i: Float64Array;
  d1r: Float64Array; d1i: Float64Array;
  d2r: Float64Array; d2i: Float64Array;
  e0r: Float64Array; e0i: Float64Array;
  e1r: Float64Array; e1i: Float64Array;
  e2r: Float64Array; e2i: Float64Array;
  norm: number;
}

function buildComplexBand(s: number, m: number, cr: number, ci: number, lFirst: number, stride: 1 | 2, size: number): ComplexBand {
  const fullSize = stride * (size - 1) + 3;
  const a = new Float64Array(fullSize + 1);
  const b = new Float64Array(fullSize + 1);
  for (let j = 0; j <= fullSize; j++) {
    a[j] = cosOffDiagonal(lFirst + j, m, s);
    b[j] = cosDiagonal(lFirst + j, m, s);
  }
  const aBelow = cosOffDiagonal(lFirst - 1, m, s);
  // p = −c², q = 2cs multiply X² and X; ∂K/∂c has −2c and 2s.
  const pr = -(cr * cr - ci * ci);
  const pi = -2 * cr * ci;
  const qr = 2 * s * cr;
  const qi = 2 * s * ci;
  const mk = () => new Float64Array(size);
  const band: ComplexBand = {
    size,
    d0r: mk(), d0i: mk(), d1r: mk(), d1i: mk(), d2r: mk(), d2i: mk(),
    e0r: mk(), e0i: mk(), e1r: mk(), e1i: mk(), e2r: mk(), e2i: mk(),
    norm: 1,
  };
  for (let i = 0; i < size; i++) {
    const j = stride * i;
    const l = lFirst + j;
    const aPrev = j === 0 ? aBelow : a[j - 1];
    const x2Diag = aPrev * aPrev + b[j] * b[j] + a[j] * a[j];
    const x2Next = a[j] * (b[j] + b[j + 1]);
    const x2Skip = a[j] * a[j + 1];
    band.d0r[i] = sphericalEigenvalue(s, l) + pr * x2Diag + qr * b[j];
    band.d0i[i] = pi * x2Diag + qi * b[j];
    band.e0r[i] = -2 * cr * x2Diag + 2 * s * b[j];
    band.e0i[i] = -2 * ci * x2Diag;
    if (stride === 1) {
      band.d1r[i] = pr * x2Next + qr * a[j];
      band.d1i[i] = pi * x2Next + qi * a[j];
      band.e1r[i] = -2 * cr * x2Next + 2 * s * a[j];
      band.e1i[i] = -2 * ci * x2Next;
      band.d2r[i] = pr * x2Skip;
      band.d2i[i] = pi * x2Skip;
      band.e2r[i] = -2 * cr * x2Skip;
      band.e2i[i] = -2 * ci * x2Skip;
    } else {
      band.d1r[i] = pr * x2Skip;
      band.d1i[i] = pi * x2Skip;
      band.e1r[i] = -2 * cr * x2Skip;
      band.e1i[i] = -2 * ci * x2Skip;
    }
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
  r0: Float64Array, i0: Float64Array, r1: Float64Array, i1: Float64Array, r2: Float64Array, i2: Float64Array,
  n: number, xr: Float64Array, xi: Float64Array, yr: Float64Array, yi: Float64Array,
): void {
  for (let k = 0; k < n; k++) {
    let vr = r0[k] * xr[k] - i0[k] * xi[k];
    let vi = r0[k] * xi[k] + i0[k] * xr[k];
    if (k + 1 < n) { vr += r1[k] * xr[k + 1] - i1[k] * xi[k + 1]; vi += r1[k] * xi[k + 1] + i1[k] * xr[k + 1]; }
    if (k + 2 < n) { vr += r2[k] * xr[k + 2] - i2[k] * xi[k + 2]; vi += r2[k] * xi[k + 2] + i2[k] * xr[k + 2]; }
    if (k >= 1) { vr += r1[k - 1] * xr[k - 1] - i1[k - 1] * xi[k - 1]; vi += r1[k - 1] * xi[k - 1] + i1[k - 1] * xr[k - 1]; }
    if (k >= 2) { vr += r2[k - 2] * xr[k - 2] - i2[k - 2] * xi[k - 2]; vi += r2[k - 2] * xi[k - 2] + i2[k - 2] * xr[k - 2]; }
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

function cdiv(a: ComplexValue, b: ComplexValue): ComplexValue {
  const d = b.re * b.re + b.im * b.im;
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

/**
 * Solve (K − σI) y = x in place by the complex-symmetric LDLᵀ factorisation
 * without pivoting (transpose, not conjugate transpose); tiny pivots are nudged.
 */
function complexShiftedSolve(band: ComplexBand, sr: number, si: number, xr: Float64Array, xi: Float64Array): void {
  const n = band.size;
  const Dr = new Float64Array(n), Di = new Float64Array(n);
  const L1r = new Float64Array(n), L1i = new Float64Array(n);
  const L2r = new Float64Array(n), L2i = new Float64Array(n);
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
    if (Math.hypot(dr, di) < pivmin) { dr = pivmin; di = 0; }
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

interface ComplexPair {
  A: ComplexValue;
  xr: Float64Array;
  xi: Float64Array;
  /** dA/dc = xᵀ(∂K/∂c)x / xᵀx. */
  slope: ComplexValue;
  residual: number;
  iterations: number;
}

function normalise(n: number, xr: Float64Array, xi: Float64Array): number {
  let s2 = 0;
  for (let k = 0; k < n; k++) s2 += xr[k] * xr[k] + xi[k] * xi[k];
  const inv = 1 / Math.sqrt(s2);
  for (let k = 0; k < n; k++) { xr[k] *= inv; xi[k] *= inv; }
  return inv;
}

/**
 * Complex Rayleigh-quotient iteration (σ = xᵀKx/xᵀx, unconjugated, the
 * stationary quotient of a complex symmetric matrix) from a shift and a vector.
 * Returns null if it does not settle within 12 steps.
 */
function complexRqi(band: ComplexBand, shift: ComplexValue, xr0: Float64Array, xi0: Float64Array): ComplexPair | null {
  const n = band.size;
  const xr = new Float64Array(n), xi = new Float64Array(n);
  xr.set(xr0.subarray(0, Math.min(n, xr0.length)));
  xi.set(xi0.subarray(0, Math.min(n, xi0.length)));
  normalise(n, xr, xi);
  const yr = new Float64Array(n), yi = new Float64Array(n);
  let sigma = shift;
  const tol = 4e-16 * band.norm;
  for (let it = 1; it <= 12; it++) {
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
function overlap(n: number, ar: Float64Array, ai: Float64Array, br: Float64Array, bi: Float64Array): number {
  let re = 0;
  let im = 0;
  const k = Math.min(n, ar.length, br.length);
  for (let j = 0; j < k; j++) {
    re += ar[j] * br[j] + ai[j] * bi[j];
    im += ar[j] * bi[j] - ai[j] * br[j];
  }
  return Math.hypot(re, im);
}

/**
 * Leaver's continued fraction (J. Math. Phys. 27, 1238 (1986)) for complex c
 * and A, the recurrence of `leaverFunction` in complex pairs. The infinite part
 * is summed backwards (the stable direction for the minimal solution) from a
 * depth doubled until the value is stable. Returns F(A) and dF/dA.
 */
export function leaverFunctionComplex(
  s: number,
  m: number,
  c: ComplexValue,
  A: ComplexValue,
  inversion: number,
  sigma: 1 | -1,
): { value: ComplexValue; derivative: ComplexValue; depth: number } {
  const kMinus = Math.abs(m - s) / 2;
  const kPlus = Math.abs(m + s) / 2;
  const kSum = kMinus + kPlus;
  const cr = c.re, ci = c.im;
  const scr = sigma * cr, sci = sigma * ci;
  // β₀ = −(2c(2σk₋ + s + σ) − kΣ(kΣ + 1)) − (c² + s(s + 1) + A)
  const f = 2 * (2 * sigma * kMinus + s + sigma);
  const b0r = -(f * cr - kSum * (kSum + 1)) - (cr * cr - ci * ci + s * (s + 1) + A.re);
  const b0i = -(f * ci) - (2 * cr * ci + A.im);
  const alpha = (n: number) => -2 * (n + 1) * (n + 2 * kMinus + 1);
  // β_n = n(n−1) + 2n(kΣ + 1) − 4nσc + β₀
  const betaR = (n: number) => n * (n - 1) + 2 * n * (kSum + 1) - 4 * n * scr + b0r;
  const betaI = (n: number) => -4 * n * sci + b0i;
  // γ_n = 2σc(n + kΣ + σs)
  const gammaR = (n: number) => 2 * scr * (n + kSum + sigma * s);
  const gammaI = (n: number) => 2 * sci * (n + kSum + sigma * s);

  // Lower part t_j = β_j − α_{j−1}γ_j / t_{j−1}, dβ/dA = −1.
  let lowR = 0, lowI = 0, dLowR = 0, dLowI = 0;
  if (inversion > 0) {
    let tr = betaR(0), ti = betaI(0), dtr = -1, dti = 0;
    for (let j = 1; j <= inversion; j++) {
      const pr = alpha(j - 1) * gammaR(j), pi = alpha(j - 1) * gammaI(j);
      const q = cdiv({ re: pr, im: pi }, { re: tr, im: ti }); // p/t
      const q2 = cdiv(q, { re: tr, im: ti }); // p/t²
      const dq = { re: q2.re * dtr - q2.im * dti, im: q2.re * dti + q2.im * dtr }; // p dt / t²
      if (j === inversion) {
        lowR = -q.re; lowI = -q.im; dLowR = dq.re; dLowI = dq.im;
      } else {
        tr = betaR(j) - q.re; ti = betaI(j) - q.im;
        dtr = -1 + dq.re; dti = dq.im;
      }
    }
  }
  const upper = (depth: number) => {
    const start = inversion + depth;
    let tr = betaR(start), ti = betaI(start), dtr = -1, dti = 0;
    for (let n = start - 1; n > inversion; n--) {
      const ar = -alpha(n) * gammaR(n + 1), ai = -alpha(n) * gammaI(n + 1);
      const q = cdiv({ re: ar, im: ai }, { re: tr, im: ti });
      const q2 = cdiv(q, { re: tr, im: ti });
      const dq = { re: q2.re * dtr - q2.im * dti, im: q2.re * dti + q2.im * dtr };
      tr = betaR(n) + q.re; ti = betaI(n) + q.im;
      dtr = -1 - dq.re; dti = -dq.im;
    }
    const a1 = { re: -alpha(inversion) * gammaR(inversion + 1), im: -alpha(inversion) * gammaI(inversion + 1) };
    const v = cdiv(a1, { re: tr, im: ti });
    const v2 = cdiv(v, { re: tr, im: ti });
    return { v, dv: { re: -(v2.re * dtr - v2.im * dti), im: -(v2.re * dti + v2.im * dtr) } };
  };
  let depth = 40 + Math.ceil(8 * Math.hypot(cr, ci));
  let previous = upper(depth);
  for (;;) {
    const next = Math.ceil(1.5 * depth);
    if (next > 20000) throw new ConvergenceError('complex Leaver continued fraction did not converge', { s, m, c, A, inversion, depth });
    const current = upper(next);
    const change = Math.hypot(current.v.re - previous.v.re, current.v.im - previous.v.im);
    depth = next;
    previous = current;
    if (change <= 1e-17 * Math.hypot(current.v.re, current.v.im) + 1e-300) break;
  }
  return {
    value: { re: betaR(inversion) + lowR + previous.v.re, im: betaI(inversion) + lowI + previous.v.im },
    derivative: { re: -1 + dLowR + previous.dv.re, im: dLowI + previous.dv.im },
    depth,
  };
}

/**
 * Spin-weighted spheroidal eigenvalue for complex c = aω (damped modes), in
 * the convention of `spheroidalEigenvalue`, for |c| ≤ 10, |Im c| ≤ |Re c| and |Im c| ≤ 4.
 *
 * Method: the real-c eigenpair at Re c is continued along c(t) = Re c + i t Im c
 * with complex Rayleigh-quotient iteration on the complex-symmetric spectral
 * matrix (Hellmann–Feynman predictor, step halved whenever the eigenvector
 * turns by more than a small angle, so the root never changes branch); at the
 * end point Newton on Leaver's continued fraction in complex arithmetic,
 * started from the spectral value, must agree with it to 1e-10. The spectral
 * value is returned (it matches 30-digit values to ~1e-15; the continued
 * fraction is the independent check, as for real c). Throws InputError outside the
 * range and ConvergenceError (with diagnostics) on failure.
 */
export function spheroidalEigenvalueComplex(q: ComplexSpheroidalQuery): ComplexSpheroidalEigenvalue {
  if (q === null || typeof q !== 'object') throw new InputError('query', 'an object { s, l, m, c }', q);
  checkModeNumbers(q);
  const c = parseComplexC(q.c);
  const { s, l, m } = q;
  const real = solveMode({ s, l, m, c: c.re }, { continuation: false });
  const { lFirst, stride, index } = basisLayout(s, l, m);
  const absC = Math.hypot(c.re, c.im);
  const coldGuess = sphericalEigenvalue(s, l) - 0.5 * absC * absC;
  let size = Math.max(estimateSize(s, m, absC, lFirst, stride, index, coldGuess), index + 3, real.spectral?.band.size ?? 0);

  for (let growth = 0; growth < 4; growth++) {
    let pair: ComplexPair;
    let spectralIterations = 0;
    let pathSteps = 0;
    {
      const band = buildComplexBand(s, m, c.re, 0, lFirst, stride, size);
      const xr = new Float64Array(size);
      if (real.spectral) xr.set(real.spectral.vector.subarray(0, Math.min(size, real.spectral.vector.length)));
      else xr[index] = 1;
      const start = complexRqi(band, { re: real.result.A, im: 0 }, xr, new Float64Array(size));
      if (!start) throw new ConvergenceError('complex spectral start at Re c failed', { s, l, m, c, size });
      pair = start;
      spectralIterations += start.iterations;
    }
    let t = 0;
    let dt = Math.min(1, 0.25 / Math.max(Math.abs(c.im), 1e-300));
    while (t < 1 && c.im !== 0) {
      const tNext = 1 - t - dt < 1e-9 ? 1 : t + dt;
      const dc = (tNext - t) * c.im; // c changes by i·dc
      const band = buildComplexBand(s, m, c.re, tNext * c.im, lFirst, stride, size);
      // A(c + i dc) ≈ A + (dA/dc)(i dc)
      const guess = { re: pair.A.re - pair.slope.im * dc, im: pair.A.im + pair.slope.re * dc };
      const next = complexRqi(band, guess, pair.xr, pair.xi);
      const predictionError = next ? Math.hypot(next.A.re - guess.re, next.A.im - guess.im) : Infinity;
      const stepSize = Math.abs(dc) * Math.max(1, Math.hypot(pair.slope.re, pair.slope.im));
      if (!next || overlap(size, pair.xr, pair.xi, next.xr, next.xi) < 0.95 || predictionError > 0.5 * stepSize + 1e-12 * band.norm) {
        dt /= 2;
        if (dt < 1e-6) throw new ConvergenceError('complex-c continuation stalled (branch point near the path?)', { s, l, m, c, t, size });
        continue;
      }
      pair = next;
      spectralIterations += next.iterations;
      pathSteps++;
      t = tNext;
      dt = Math.min(dt * 1.5, 0.25 / Math.max(Math.abs(c.im), 1e-300));
    }
    // Truncation check on the eigenvector's tail, as for real c.
    const tail = stride === 1 ? Math.max(Math.hypot(pair.xr[size - 1], pair.xi[size - 1]), Math.hypot(pair.xr[size - 2], pair.xi[size - 2])) : Math.hypot(pair.xr[size - 1], pair.xi[size - 1]);
    if (tail > 1e-16) {
      size = Math.ceil(size * 1.5) + 8;
      continue;
    }

    const sigma: 1 | -1 = c.re > 0 ? -1 : 1;
    const inversion = l - lowestL(s, m);
    let A = pair.A;
    let newtonIterations = 0;
    let lastNewtonStep = Infinity;
    let depth = 0;
    const scale = Math.max(1, Math.hypot(A.re, A.im));
    let converged = false;
    for (let it = 1; it <= 12; it++) {
      const fv = leaverFunctionComplex(s, m, c, A, inversion, sigma);
      depth = fv.depth;
      const step = cdiv(fv.value, fv.derivative);
      if (!Number.isFinite(step.re) || !Number.isFinite(step.im)) break;
      A = { re: A.re - step.re, im: A.im - step.im };
      newtonIterations = it;
      const size2 = Math.hypot(step.re, step.im);
      // At the rounding floor (which grows like e^{2|Im c|}ε, docs/spheroidal.md) the steps stop shrinking.
      if (size2 <= 4e-16 * scale || (size2 <= 1e-10 * scale && size2 >= 0.5 * lastNewtonStep)) {
        lastNewtonStep = size2;
        converged = true;
        break;
      }
      lastNewtonStep = size2;
    }
    const leaverA = A;
    const agreement = Math.hypot(leaverA.re - pair.A.re, leaverA.im - pair.A.im) / Math.max(1, Math.hypot(pair.A.re, pair.A.im));
    const diagnostics: ComplexSpheroidalDiagnostics = {
      method: 'spectral-complex+leaver',
      truncation: size,
      pathSteps,
      spectralIterations,
      newtonIterations,
      lastNewtonStep,
      continuedFractionDepth: depth,
      agreement,
      residual: pair.residual,
    };
    if (!converged) throw new ConvergenceError('Newton on the complex Leaver continued fraction did not converge', { s, l, m, c, ...diagnostics });
    if (!(agreement <= COMPLEX_AGREEMENT_LIMIT)) {
      throw new ConvergenceError('complex continued fraction and spectral eigenvalues disagree', { s, l, m, c, ...diagnostics });
    }
    // The spectral value is the result: against 30-digit values it is at
    // rounding level, while the continued fraction loses ~e^{2|Im c|}ε to
    // cancellation (docs/spheroidal.md). At Im c = 0 it is the real-c value itself.
    const result = c.im === 0 ? { re: real.result.A, im: 0 } : pair.A;
    const shift = s * (s + 1);
    return { s, l, m, c, A: result, E: { re: result.re + shift, im: result.im }, diagnostics };
  }
  throw new ConvergenceError('complex spectral expansion did not converge', { s, l, m, c, size });
}
