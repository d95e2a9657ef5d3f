/**
 * Asymptotic series of the Teukolsky radial equation at infinity:
 *
 *   R_in  = e^{−iωr*} r^{−1}      Σ c_n r^{−n}   (σ = −1)
 *   R_out = e^{+iωr*} r^{−2s−1}   Σ c_n r^{−n}   (σ = +1)
 *
 * Substituting R = e^{iσωr*} g into the radial equation gives
 * Δ² g'' + Δ[2iσω(r² + a²) + (s+1)Δ'] g' + Q_σ g = 0 with polynomial
 * coefficients; the leading balance fixes the power p and the c_n follow from
 * a recurrence (docs/method.md). The series is asymptotic: we sum it until the
 * terms fall below 1e-17 of the sum, and report failure if they turn upward
 * first, so the caller can move the matching radius outward.
 *
 * A massive scalar (s = 0, μ > 0) carries the long-range phase of its 2Mμ²/r
 * tail: R = e^{iσφ} r^{−1} Σ c_n r^{−n} with φ = k∞ r* + (Mμ²/k∞) L(r),
 * k∞ = √(ω² − μ²), L' = r/Δ (L ~ ln r), i.e. W = σ(k∞ϖ + (Mμ²/k∞) r). The
 * same recurrence then holds (docs/massive-fields.md); at μ = 0 it is the
 * massless series exactly.
 */
import type { KerrHole } from '@penumbra/kerr';
import { tortoiseFromHorizonDistance } from '@penumbra/kerr';
import { cpolyAt, type CPoly } from './complexPoly.js';
import { fieldMassOf, type RadialMode } from './equation.js';

/** Coefficients of one far-zone series, R = e^{iσωr*} r^p Σ c_n r^{−n}. */
export interface FarSeries {
  /** −1 ingoing, +1 outgoing */
  sigma: 1 | -1;
  /** leading power p of r (−1 for ingoing, −2s−1 for outgoing) */
  p: number;
  /** real parts of c_n */
  cRe: number[];
  /** imaginary parts of c_n */
  cIm: number[];
  /** the substituted phase numerator W = σ(k∞ϖ + βr) (φ' = W/Δ), in powers of r */
  W: CPoly;
  /** k∞ = √(ω² − μ²) (= ω for a massless field) */
  kInf: number;
  /** coefficient β = Mμ²/k∞ of the long-range phase β L(r), L' = r/Δ (0 when massless) */
  beta: number;
  /** Δ in powers of r */
  delta: CPoly;
  /** most terms the series may use (cRe and cIm are extended on demand up to it) */
  maxTerms: number;
  /** the recurrence that extends cRe and cIm (null once they hold maxTerms terms) */
  recurrence: FarRecurrence | null;
}

/**
 * The coefficients of the recurrence for c_n (powers of r, five of each), in
 * one array (one allocation where six were measured among a solve's): Δ² at
 * [0, 5) (real; [5, 10) holds its zero imaginary parts), the coefficient B of
 * g' at [10, 15) (re) and [15, 20) (im), the coefficient Q of g at [20, 25)
 * and [25, 30).
 */
export interface FarRecurrence {
  /** the packed coefficients (see above); a plain array: a Float64Array of 30 has a store of its own outside the heap (measured with the copies of W and Δ below: the two series of a match built in 2.3 → 0.9 µs, s = 1, l = 100, a = 0.99, Mω = 1) */
  coefficients: number[];
}

/** Offsets in FarRecurrence.coefficients. */
const A_RE = 0,
  A_IM = 5,
  B_RE = 10,
  B_IM = 15,
  Q_RE = 20,
  Q_IM = 25,
  RECURRENCE_SIZE = 30;

/** The imaginary parts of the real polynomials W and Δ of every series (never written). */
const ZERO3 = new Float64Array(3);

/** A far-zone series summed at one radius. */
export interface FarValue {
  /** R(r) as [re, im] */
  R: [number, number];
  /** R'(r) as [re, im] */
  dR: [number, number];
  /** terms summed */
  terms: number;
  /** magnitude of the last term kept relative to the sum */
  truncation: number;
  /** whether three successive terms fell below 1e-17 of the sum before the terms turned upward */
  converged: boolean;
}

// The same mode is solved at two tolerances (and on both legs of the
// two-sided route), so recently built series are reused; entries are compared
// field by field (a string key was measured to cost more than building one
// series term).
interface CacheEntry {
  mass: number;
  a: number;
  s: number;
  m: number;
  omega: number;
  lambda: number;
  mu: number;
  sigma: 1 | -1;
  maxTerms: number;
  series: FarSeries;
}
const CACHE_SIZE = 64;
/** A ring of the last CACHE_SIZE series (a shifted array was measured to cost more than its lookups). */
const cache: (CacheEntry | undefined)[] = new Array(CACHE_SIZE).fill(undefined);
let cacheNext = 0;

/** Coefficients c_n (n < maxTerms) of the series with σ = ±1. */
export function farSeries(hole: KerrHole, mode: RadialMode, sigma: 1 | -1, maxTerms = 120): FarSeries {
  const mu = fieldMassOf(mode);
  // newest first, as the earlier list was searched
  for (let j = 1; j <= CACHE_SIZE; j++) {
    const e = cache[(cacheNext - j + CACHE_SIZE) % CACHE_SIZE];
    if (e === undefined) break;
    if (
      e.omega === mode.omega &&
      e.sigma === sigma &&
      e.lambda === mode.lambda &&
      e.a === hole.a &&
      e.mass === hole.mass &&
      e.s === mode.s &&
      e.m === mode.m &&
      e.mu === mu &&
      e.maxTerms === maxTerms
    )
      return e.series;
  }
  const series = buildFarSeries(hole, mode, sigma, maxTerms);
  cache[cacheNext] = {
    mass: hole.mass,
    a: hole.a,
    s: mode.s,
    m: mode.m,
    omega: mode.omega,
    lambda: mode.lambda,
    mu,
    sigma,
    maxTerms,
    series,
  };
  cacheNext = (cacheNext + 1) % CACHE_SIZE;
  return series;
}

/** Scratch lists of `buildFarSeries` (it runs to completion without re-entering itself; what it keeps is copied). */
const [sDelta, sK, sW, sMass] = Array.from({ length: 4 }, () => new Float64Array(3));
const [sDDelta, sDW, sSpin] = Array.from({ length: 3 }, () => new Float64Array(2));
function fill3(out: Float64Array, x0: number, x1: number, x2: number): Float64Array {
  out[0] = x0;
  out[1] = x1;
  out[2] = x2;
  return out;
}
/** A copy of a list of three (element by element: the copying constructor was measured at ~10 times the cost). */
function copy3(p: Float64Array): Float64Array {
  return fill3(new Float64Array(3), p[0], p[1], p[2]);
}
function fill2(out: Float64Array, x0: number, x1: number): Float64Array {
  out[0] = x0;
  out[1] = x1;
  return out;
}

/** out[at + i + j] += f · p[i] q[j] over the given lengths (real polynomials, lowest power first). */
function addProduct(out: number[], at: number, p: ArrayLike<number>, q: ArrayLike<number>, f = 1): void {
  for (let i = 0; i < p.length; i++) for (let j = 0; j < q.length; j++) out[at + i + j] += f * p[i] * q[j];
}

/**
 * The far-zone recurrence written out on real coefficient lists in powers of
 * r (the radial equation of equation.ts after `substitutePhase` with the real
 * W = σ(k∞ϖ + βr); every factor is real, so no complex polynomial is built):
 *   A = Δ², B = (s+1)ΔΔ' + 2iWΔ, Q = U − W² + i(W'Δ + sWΔ'),
 *   U = K² + Δ(−λ − μ²r²) + i(−sΔ'K + 4sωrΔ).
 * (Measured: building the equation and substituting as polynomials was a
 * few % of a greybody factor.)
 */
function buildFarSeries(hole: KerrHole, mode: RadialMode, sigma: 1 | -1, maxTerms: number): FarSeries {
  const { s, omega, lambda, m } = mode;
  const { a, rPlus, rMinus } = hole;
  const mu = fieldMassOf(mode);
  const { kInf, beta } = farWavenumber(hole, mode);
  const delta = fill3(sDelta, rPlus * rMinus, -rPlus - rMinus, 1);
  const dDelta = fill2(sDDelta, delta[1], 2);
  const K = fill3(sK, omega * a * a - a * m, 0, omega);
  const W = fill3(sW, sigma * kInf * a * a, sigma * beta, sigma * kInf);
  const dW = fill2(sDW, W[1], 2 * W[2]);
  const k: number[] = new Array<number>(RECURRENCE_SIZE).fill(0);
  addProduct(k, A_RE, delta, delta);
  addProduct(k, B_RE, delta, dDelta, s + 1);
  addProduct(k, B_IM, W, delta, 2);
  addProduct(k, Q_RE, K, K);
  addProduct(k, Q_RE, delta, fill3(sMass, -lambda, 0, -mu * mu));
  addProduct(k, Q_RE, W, W, -1);
  addProduct(k, Q_IM, dDelta, K, -s);
  addProduct(k, Q_IM, delta, fill2(sSpin, 0, 4 * s * omega));
  addProduct(k, Q_IM, dW, delta);
  addProduct(k, Q_IM, W, dDelta, s);
  // (the r⁴ terms of Q cancel in the algebra; the recurrence reads Q up to r² and the balance Q₃)
  // Leading balance: B4 p + C3 = 0 with B4 = 2iσω.
  const b4r = k[B_RE + 4],
    b4i = k[B_IM + 4];
  const c3r = k[Q_RE + 3],
    c3i = k[Q_IM + 3];
  const bb = b4r * b4r + b4i * b4i;
  const p = -(c3r * b4r + c3i * b4i) / bb; // real by construction
  // The c_n are made as the sums need them (most matching radii use a few dozen of the maxTerms).
  return {
    sigma,
    p,
    cRe: [1],
    cIm: [0],
    W: { re: copy3(W), im: ZERO3 },
    delta: { re: copy3(delta), im: ZERO3 },
    kInf,
    beta,
    maxTerms,
    recurrence: { coefficients: k },
  };
}

/** Extend the coefficients of `series` to at least `n` terms (at most maxTerms), by the recurrence. */
export function extendFarSeries(series: FarSeries, n: number): void {
  const { cRe, cIm, p, recurrence } = series;
  if (recurrence === null) return;
  const k = recurrence.coefficients;
  const b4r = k[B_RE + 4],
    b4i = k[B_IM + 4];
  const end = Math.min(n, series.maxTerms);
  let N = cRe.length;
  for (; N < end && N < 5; N++) extendTerm(series, N);
  // From N = 5 on every term of the recurrence is present: the same sums, unrolled on locals (measured: the
  // generic loop was a quarter of choosing the matching radius).
  if (N < end) {
    const ar0 = k[A_RE],
      ar1 = k[A_RE + 1],
      ar2 = k[A_RE + 2],
      ar3 = k[A_RE + 3],
      ar4 = k[A_RE + 4],
      ai0 = k[A_IM],
      ai1 = k[A_IM + 1],
      ai2 = k[A_IM + 2],
      ai3 = k[A_IM + 3],
      ai4 = k[A_IM + 4];
    const br0 = k[B_RE],
      br1 = k[B_RE + 1],
      br2 = k[B_RE + 2],
      br3 = k[B_RE + 3],
      bi0 = k[B_IM],
      bi1 = k[B_IM + 1],
      bi2 = k[B_IM + 2],
      bi3 = k[B_IM + 3];
    const qr0 = k[Q_RE],
      qr1 = k[Q_RE + 1],
      qr2 = k[Q_RE + 2],
      qi0 = k[Q_IM],
      qi1 = k[Q_IM + 1],
      qi2 = k[Q_IM + 2];
    for (; N < end; N++) {
      let rr = 0,
        ri = 0;
      // A: j = 0…4, n = N − 5 + j; f = (p − n)(p − n − 1)
      let m = N - 5;
      let f = (p - m) * (p - m - 1);
      rr += f * (ar0 * cRe[m] - ai0 * cIm[m]);
      ri += f * (ar0 * cIm[m] + ai0 * cRe[m]);
      m++;
      f = (p - m) * (p - m - 1);
      rr += f * (ar1 * cRe[m] - ai1 * cIm[m]);
      ri += f * (ar1 * cIm[m] + ai1 * cRe[m]);
      m++;
      f = (p - m) * (p - m - 1);
      rr += f * (ar2 * cRe[m] - ai2 * cIm[m]);
      ri += f * (ar2 * cIm[m] + ai2 * cRe[m]);
      m++;
      f = (p - m) * (p - m - 1);
      rr += f * (ar3 * cRe[m] - ai3 * cIm[m]);
      ri += f * (ar3 * cIm[m] + ai3 * cRe[m]);
      m++;
      f = (p - m) * (p - m - 1);
      rr += f * (ar4 * cRe[m] - ai4 * cIm[m]);
      ri += f * (ar4 * cIm[m] + ai4 * cRe[m]);
      // B: j = 0…3, n = N − 4 + j; f = p − n
      m = N - 4;
      f = p - m;
      rr += f * (br0 * cRe[m] - bi0 * cIm[m]);
      ri += f * (br0 * cIm[m] + bi0 * cRe[m]);
      m++;
      f = p - m;
      rr += f * (br1 * cRe[m] - bi1 * cIm[m]);
      ri += f * (br1 * cIm[m] + bi1 * cRe[m]);
      m++;
      f = p - m;
      rr += f * (br2 * cRe[m] - bi2 * cIm[m]);
      ri += f * (br2 * cIm[m] + bi2 * cRe[m]);
      m++;
      f = p - m;
      rr += f * (br3 * cRe[m] - bi3 * cIm[m]);
      ri += f * (br3 * cIm[m] + bi3 * cRe[m]);
      // Q: j = 0…2, n = N − 3 + j
      m = N - 3;
      rr += qr0 * cRe[m] - qi0 * cIm[m];
      ri += qr0 * cIm[m] + qi0 * cRe[m];
      m++;
      rr += qr1 * cRe[m] - qi1 * cIm[m];
      ri += qr1 * cIm[m] + qi1 * cRe[m];
      m++;
      rr += qr2 * cRe[m] - qi2 * cIm[m];
      ri += qr2 * cIm[m] + qi2 * cRe[m];
      // c_N = rest / (B4 N)
      const dr = b4r * N,
        di = b4i * N;
      const den = dr * dr + di * di;
      cRe.push((rr * dr + ri * di) / den);
      cIm.push((ri * dr - rr * di) / den);
    }
  }
  if (cRe.length >= series.maxTerms) series.recurrence = null;
}

/** The recurrence's term c_N (N < 5, where some of its terms reach below c_0), appended. */
function extendTerm(series: FarSeries, N: number): void {
  const { cRe, cIm, p } = series;
  const k = (series.recurrence as FarRecurrence).coefficients;
  let rr = 0,
    ri = 0;
  for (let j = 0; j <= 4; j++) {
    const n = N + j - 5;
    if (n < 0) continue;
    const f = (p - n) * (p - n - 1);
    rr += f * (k[A_RE + j] * cRe[n] - k[A_IM + j] * cIm[n]);
    ri += f * (k[A_RE + j] * cIm[n] + k[A_IM + j] * cRe[n]);
  }
  for (let j = 0; j <= 3; j++) {
    const n = N + j - 4;
    if (n < 0) continue;
    const f = p - n;
    rr += f * (k[B_RE + j] * cRe[n] - k[B_IM + j] * cIm[n]);
    ri += f * (k[B_RE + j] * cIm[n] + k[B_IM + j] * cRe[n]);
  }
  for (let j = 0; j <= 2; j++) {
    const n = N + j - 3;
    if (n < 0) continue;
    rr += k[Q_RE + j] * cRe[n] - k[Q_IM + j] * cIm[n];
    ri += k[Q_RE + j] * cIm[n] + k[Q_IM + j] * cRe[n];
  }
  // c_N = rest / (B4 N)
  const dr = k[B_RE + 4] * N,
    di = k[B_IM + 4] * N;
  const den = dr * dr + di * di;
  cRe.push((rr * dr + ri * di) / den);
  cIm.push((ri * dr - rr * di) / den);
}

/**
 * k∞ = √(ω² − μ²) and the long-range phase coefficient β = Mμ²/k∞ of a mode
 * (k∞ = ω and β = 0 exactly when massless); ω > μ is the caller's to check.
 */
export function farWavenumber(hole: KerrHole, mode: RadialMode): { kInf: number; beta: number } {
  const mu = fieldMassOf(mode);
  if (mu === 0) return { kInf: mode.omega, beta: 0 };
  const kInf = Math.sign(mode.omega) * Math.sqrt((mode.omega - mu) * (mode.omega + mu));
  return { kInf, beta: (hole.mass * mu * mu) / kInf };
}

/**
 * L(r) = ∫ r/Δ dr = ln(r − r+) + (r−/(r+ − r−)) ln((r − r+)/(r − r−)) (→ ln r),
 * written with log1p so that it stays accurate as r+ − r− shrinks.
 */
export function longRangeLog(hole: KerrHole, r: number): number {
  const b = hole.rPlus - hole.rMinus;
  return Math.log(r - hole.rPlus) + (hole.rMinus / b) * Math.log1p(-b / (r - hole.rMinus));
}

/** The sums of a far-zone series at one radius, before the phase and power factors: S = Σ c_n r^{−n}, T = Σ (p − n) c_n r^{−n}. */
export interface FarSums {
  /** S as [re, im] */
  S: [number, number];
  /** T as [re, im] */
  T: [number, number];
  /** terms summed */
  terms: number;
  /** magnitude of the last term kept relative to the sum */
  truncation: number;
  /** whether three successive terms fell below 1e-17 of the sum before the terms turned upward */
  converged: boolean;
}

/** Sum a far-zone series at radius r (no phase yet): cheap, so a search for the matching radius tries radii with it. */
export function sumFar(series: FarSeries, r: number, target = 1e-17): FarSums {
  return sumFarInto(series, r, target, { S: [0, 0], T: [0, 0], terms: 0, truncation: 1, converged: false });
}

/**
 * The largest sum of the terms' moduli, relative to |c_0| = 1, that a
 * massive field's series may climb to before its terms turn downward (see
 * `sumFarInto`): beyond it the rounding (FAR_ROUNDING ε × that sum) would
 * pass the rounding accepted (ROUNDING_SHARE × target), so the radius is
 * given up at once.
 */
const HUMP_LIMIT = 1e4;
/** Rounding of a sum, in units of ε × the sum of its terms' moduli: the cancellation of terms larger than the sum (common practice, no source). */
const FAR_ROUNDING = 8;
/**
 * The rounding a massive field's sum may carry, in units of its target: the
 * massive far target is 1e-3 of the integrator's tolerance (farMatch.ts), so
 * at 1e3 the rounding stays below that tolerance, and it is reported in the
 * truncation (which the error estimate charges).
 */
const ROUNDING_SHARE = 1e3;

/**
 * `sumFar` into `out` (returned): a search for the matching radius reuses a
 * few of these instead of making one per radius tried. A massive field's
 * series (β ≠ 0) first climbs: with the long-range phase its terms grow
 * while n ≲ β²/(2k∞r) (the Coulomb-like tail) before they fall, so two
 * successive increases there are no sign of divergence; the climb is
 * followed up to HUMP_LIMIT, and the rounding of the cancellation it leaves
 * (FAR_ROUNDING ε × the sum of the moduli) is added to the truncation and
 * must stay below ROUNDING_SHARE × target. Measured on the 70 modes of
 * bench/massive-cpu.bench.mjs: matching radii near threshold fell by up to
 * 2.4 times (a = 0.327, l = 2, m = −2, Mω = 1.751, v = 0.029: 11,256 →
 * 4,610), one Riccati step fewer where that drops a rung of the far zone
 * (a = 0.875, l = 3, m = −1, Mω = 0.973, v = 0.042: 1,883 → 1,205, 11 %
 * fewer evaluations); Γ moved by at most 6e-4 of its error estimate.
 */
export function sumFarInto(series: FarSeries, r: number, target: number, out: FarSums): FarSums {
  const { cRe, cIm, p } = series;
  const massive = series.beta !== 0;
  const inv = 1 / r;
  // squared magnitudes throughout (Math.hypot was measured at a tenth of a solve's time here)
  const target2 = target * target;
  let sRe = 0,
    sIm = 0,
    tRe = 0,
    tIm = 0;
  let pw = 1;
  let small = 0;
  let terms = 0;
  let truncation2 = 1;
  let converged = false;
  let prev1 = Infinity,
    prev2 = Infinity;
  // a massive series still climbing its first hump, and the sum of its moduli so far
  let climbing = massive,
    moduli = 0;
  for (let n = 0; n < series.maxTerms; n++) {
    if (n >= cRe.length) extendFarSeries(series, n + 8);
    const termRe = cRe[n] * pw,
      termIm = cIm[n] * pw;
    const mag2 = termRe * termRe + termIm * termIm;
    if (climbing) {
      if (n > 0 && mag2 < prev1) climbing = false;
      else if (moduli > HUMP_LIMIT) break;
    }
    // Divergence has set in after two successive increases (a single uptick
    // can follow a coefficient that vanishes by accident).
    else if (n > 3 && mag2 > prev1 && prev1 > prev2 && mag2 > target2 * (sRe * sRe + sIm * sIm)) break;
    if (massive) moduli += Math.sqrt(mag2);
    prev2 = prev1;
    prev1 = mag2;
    sRe += termRe;
    sIm += termIm;
    tRe += (p - n) * termRe;
    tIm += (p - n) * termIm;
    terms = n + 1;
    truncation2 = mag2 / (sRe * sRe + sIm * sIm);
    if (truncation2 < target2) {
      if (++small >= 3) {
        converged = true;
        break;
      }
    } else small = 0;
    pw *= inv;
  }
  out.S[0] = sRe;
  out.S[1] = sIm;
  out.T[0] = tRe;
  out.T[1] = tIm;
  out.terms = terms;
  if (!massive) {
    out.truncation = Math.sqrt(truncation2);
    out.converged = converged;
    return out;
  }
  const rounding = (FAR_ROUNDING * Number.EPSILON * moduli) / Math.sqrt(sRe * sRe + sIm * sIm);
  out.truncation = Math.max(Math.sqrt(truncation2), rounding);
  out.converged = converged && rounding <= ROUNDING_SHARE * target;
  return out;
}

/** R and R' of a far-zone series solution at radius r from its sums there (`sumFar`). */
export function farValue(hole: KerrHole, series: FarSeries, r: number, sums: FarSums): FarValue {
  const { p, sigma, kInf, beta } = series;
  const [sRe, sIm] = sums.S;
  const [tRe, tIm] = sums.T;
  const inv = 1 / r;
  const rs = tortoiseFromHorizonDistance(hole, r - hole.rPlus);
  const rp = Math.pow(r, p);
  const ph = beta === 0 ? sigma * kInf * rs : sigma * (kInf * rs + beta * longRangeLog(hole, r));
  const eRe = rp * Math.cos(ph),
    eIm = rp * Math.sin(ph);
  // g = r^p S, g' = r^{p−1} T; R = e g, R' = e (g' + i(W/Δ) g), W/Δ = σ(k∞ϖ + βr)/Δ
  const R: [number, number] = [eRe * sRe - eIm * sIm, eRe * sIm + eIm * sRe];
  const w = cpolyAt(series.W, r)[0] / cpolyAt(series.delta, r)[0];
  const gpRe = tRe * inv - w * sIm;
  const gpIm = tIm * inv + w * sRe;
  const dR: [number, number] = [eRe * gpRe - eIm * gpIm, eRe * gpIm + eIm * gpRe];
  return { R, dR, terms: sums.terms, truncation: sums.truncation, converged: sums.converged };
}

/** Evaluate R and R' of a far-zone series solution at radius r. */
export function evaluateFar(hole: KerrHole, _mode: RadialMode, series: FarSeries, r: number): FarValue {
  return farValue(hole, series, r, sumFar(series, r));
}
