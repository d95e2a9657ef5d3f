/**
 * Series solutions at the two ends of the Schwarzschild problem.
 * Derivations: docs/method-schwarzschild-reference.md.
 *
 * Complex numbers are kept as (re, im) pairs of plain float64.
 */
import type { ModeProblem } from './potentials.js';
import { farZoneCoefficients } from './potentials.js';

/** ψ and P = dψ/dr* at one radius, as real and imaginary parts. */
export interface WaveState {
  psiRe: number;
  psiIm: number;
  dpsiRe: number;
  dpsiIm: number;
}

/** A series solution at one radius, with the terms summed and whether they fell below the floor. */
export interface SeriesValue extends WaveState {
  terms: number;
  converged: boolean;
}

/**
 * ψ = e^{iφ}(hRe + i hIm) and dψ/dr* = e^{iφ}(qRe + i qIm) with the series'
 * term count: every series here sums a slowly varying factor and puts the
 * oscillating phase back last.
 */
export function withPhase(
  phase: number,
  hRe: number,
  hIm: number,
  qRe: number,
  qIm: number,
  terms: number,
  converged: boolean,
): SeriesValue {
  const c = Math.cos(phase);
  const s = Math.sin(phase);
  return {
    psiRe: c * hRe - s * hIm,
    psiIm: c * hIm + s * hRe,
    dpsiRe: c * qRe - s * qIm,
    dpsiIm: c * qIm + s * qRe,
    terms,
    converged,
  };
}

/** Tortoise coordinate r* = r + 2M ln((r − 2M)/2M), taking x = r − 2M. */
export function tortoiseFromHorizonDistance(mass: number, x: number): number {
  const b = 2 * mass;
  return x + b + b * Math.log(x / b);
}

const HORIZON_SERIES_MAX_TERMS = 2000;
const SERIES_TERM_FLOOR = 1e-17;

/**
 * The ingoing horizon solution ψ = e^{−iωr*} h at r = 2M + x, normalised to
 * h → 1 at the horizon.
 *
 * Regge–Wheeler: h = Σ a_n t^n, t = x/2M, with (Ω = 2Mω, L = l(l+1))
 *   (n+1)(n+1 − 2iΩ) a_{n+1} = −[2n² − n − 6iΩn − L − 1 + s²] a_n
 *       − [(n−1)(n−2) − 6iΩ(n−1) − L] a_{n−1} + 2iΩ(n−2) a_{n−2}.
 * Dirac: V contains √f, so the series runs in z = √f = √(1 − 2M/r):
 *   (m+1)(m+1 − 4iΩ) a_{m+1} = 2σk a_m + [2(m² − 1) + 4k²] a_{m−1}
 *       − 6σk a_{m−2} − (m−3)(m+1) a_{m−3}.
 */
export function horizonSeries(p: ModeProblem, x: number): SeriesValue {
  const b = 2 * p.mass;
  const Omega = p.omega * b;
  const r = b + x;
  const isDirac = p.kind === 'dirac';
  // Expansion variable and d(variable)/dr.
  const v = isDirac ? Math.sqrt(x / r) : x / b;
  const dvdr = isDirac ? b / (2 * v * r * r) : 1 / b;

  // Last four coefficients a_{n}, a_{n−1}, a_{n−2}, a_{n−3}.
  let a0r = 1,
    a0i = 0; // a_n
  let a1r = 0,
    a1i = 0; // a_{n−1}
  let a2r = 0,
    a2i = 0; // a_{n−2}
  let a3r = 0,
    a3i = 0; // a_{n−3}
  let hRe = 1,
    hIm = 0; // Σ a_n v^n
  let hvRe = 0,
    hvIm = 0; // Σ n a_n v^{n−1}
  let vPow = 1; // v^n
  let smallRun = 0;
  let n = 0;
  let converged = false;
  const L = p.l * (p.l + 1);
  const s2 = p.spin * p.spin;
  const k = p.l + 0.5;
  const sigma = p.diracSign;

  for (; n < HORIZON_SERIES_MAX_TERMS; n++) {
    // Right-hand side of the recurrence for a_{n+1}.
    let numRe: number;
    let numIm: number;
    let denRe: number;
    let denIm: number;
    if (!isDirac) {
      // c0 = −[2n² − n − L − 1 + s²] + 6iΩn
      const c0r = -(2 * n * n - n - L - 1 + s2);
      const c0i = 6 * Omega * n;
      // c1 = −[(n−1)(n−2) − L] + 6iΩ(n−1)
      const c1r = -((n - 1) * (n - 2) - L);
      const c1i = 6 * Omega * (n - 1);
      // c2 = 2iΩ(n−2)
      const c2i = 2 * Omega * (n - 2);
      numRe = c0r * a0r - c0i * a0i + c1r * a1r - c1i * a1i - c2i * a2i;
      numIm = c0r * a0i + c0i * a0r + c1r * a1i + c1i * a1r + c2i * a2r;
      denRe = (n + 1) * (n + 1);
      denIm = -(n + 1) * 2 * Omega;
    } else {
      const m = n;
      const c0 = 2 * sigma * k;
      const c1 = 2 * (m * m - 1) + 4 * k * k;
      const c2 = -6 * sigma * k;
      const c3 = -(m - 3) * (m + 1);
      numRe = c0 * a0r + c1 * a1r + c2 * a2r + c3 * a3r;
      numIm = c0 * a0i + c1 * a1i + c2 * a2i + c3 * a3i;
      denRe = (m + 1) * (m + 1);
      denIm = -(m + 1) * 4 * Omega;
    }
    const den2 = denRe * denRe + denIm * denIm;
    const nextRe = (numRe * denRe + numIm * denIm) / den2;
    const nextIm = (numIm * denRe - numRe * denIm) / den2;
    a3r = a2r;
    a3i = a2i;
    a2r = a1r;
    a2i = a1i;
    a1r = a0r;
    a1i = a0i;
    a0r = nextRe;
    a0i = nextIm;

    const order = n + 1;
    const derivWeight = order * vPow; // n a_n v^{n−1} for the new coefficient
    vPow *= v;
    const termRe = a0r * vPow;
    const termIm = a0i * vPow;
    hRe += termRe;
    hIm += termIm;
    hvRe += a0r * derivWeight;
    hvIm += a0i * derivWeight;

    const termSize = Math.hypot(termRe, termIm) * (1 + order);
    const scale = Math.hypot(hRe, hIm) + v * Math.hypot(hvRe, hvIm);
    if (termSize < SERIES_TERM_FLOOR * scale) {
      // Four consecutive small terms: the recurrence reaches back three steps.
      if (++smallRun >= 4) {
        converged = true;
        n++;
        break;
      }
    } else {
      smallRun = 0;
    }
  }

  // ψ = e^{−iωr*} h;  dψ/dr* = e^{−iωr*} (−iω h + f dh/dr).
  const f = x / r;
  const dhdrRe = hvRe * dvdr;
  const dhdrIm = hvIm * dvdr;
  const qRe = p.omega * hIm + f * dhdrRe;
  const qIm = -p.omega * hRe + f * dhdrIm;
  const phase = -p.omega * tortoiseFromHorizonDistance(p.mass, x);
  return withPhase(phase, hRe, hIm, qRe, qIm, n + 1, converged);
}

const FAR_SERIES_MAX_TERMS = 600;
/** Relative size of the last kept term of the asymptotic series (brief: 1e-15, we ask a little more). */
export const FAR_SERIES_TOLERANCE = 1e-16;

/**
 * Outgoing far-zone solution Φ_out = e^{iωr*} Σ c_n r^{−n}, c_0 = 1, from
 *   2iω(n+1) c_{n+1} = [n(n+1) − ε_0] c_n − 2M(n² − 1) c_{n−1} − Σ_{j≥1} ε_j (2M)^j c_{n−j}
 * (ε_j from farZoneCoefficients). The series is asymptotic: it is summed
 * until the terms fall below FAR_SERIES_TOLERANCE relative to the sum, and
 * reported as not converged if they start to grow first.
 * The incoming solution is the complex conjugate (the potential is real).
 */
export function outgoingFarSeries(p: ModeProblem, r: number): SeriesValue {
  const b = 2 * p.mass;
  const beta = b / r;
  const eps = farZoneCoefficients(p, p.kind === 'dirac' ? FAR_SERIES_MAX_TERMS + 1 : 2);
  const epsCount = eps.length;
  // betaPow[j] = β^j ε_j, so the convolution is a plain dot product.
  const weighted = new Float64Array(epsCount);
  let bp = 1;
  for (let j = 0; j < epsCount; j++) {
    weighted[j] = eps[j] * bp;
    bp *= beta;
  }
  // Terms T_n = c_n r^{−n}.
  const tRe = new Float64Array(FAR_SERIES_MAX_TERMS + 1);
  const tIm = new Float64Array(FAR_SERIES_MAX_TERMS + 1);
  tRe[0] = 1;
  let uRe = 1,
    uIm = 0; // Σ T_n
  let duRe = 0,
    duIm = 0; // Σ −n T_n  (= r du/dr)
  const twoOmegaR = 2 * p.omega * r;
  const flatTermination = Math.ceil(p.l) + 2;
  let smallRun = 0;
  let converged = false;
  let n = 0;
  let previousSize = 1;
  for (; n < FAR_SERIES_MAX_TERMS; n++) {
    // numerator = n(n+1) T_n − β(n² − 1) T_{n−1} − Σ_j β^j ε_j T_{n−j}
    let numRe = n * (n + 1) * tRe[n];
    let numIm = n * (n + 1) * tIm[n];
    if (n >= 1) {
      numRe -= beta * (n * n - 1) * tRe[n - 1];
      numIm -= beta * (n * n - 1) * tIm[n - 1];
    }
    const jMax = Math.min(n, epsCount - 1);
    for (let j = 0; j <= jMax; j++) {
      numRe -= weighted[j] * tRe[n - j];
      numIm -= weighted[j] * tIm[n - j];
    }
    // T_{n+1} = numerator / (2iω r (n+1))
    const d = twoOmegaR * (n + 1);
    const nextRe = numIm / d;
    const nextIm = -numRe / d;
    tRe[n + 1] = nextRe;
    tIm[n + 1] = nextIm;
    uRe += nextRe;
    uIm += nextIm;
    duRe -= (n + 1) * nextRe;
    duIm -= (n + 1) * nextIm;
    const size = Math.hypot(nextRe, nextIm) * (n + 2);
    const scale = Math.hypot(uRe, uIm);
    if (size < FAR_SERIES_TOLERANCE * scale) {
      if (++smallRun >= 3) {
        converged = true;
        n++;
        break;
      }
    } else {
      smallRun = 0;
      // Growing terms past the flat-space part: the asymptotic series has
      // turned before reaching the floor; the caller must move outward.
      if (n + 1 > flatTermination && size > previousSize && size > 1e-3 * scale) break;
    }
    previousSize = size;
  }
  // Φ = e^{iωr*} u;  dΦ/dr* = e^{iωr*} (iω u + f du/dr), du/dr = (Σ −n T_n)/r.
  const f = 1 - beta;
  const qRe = -p.omega * uIm + (f * duRe) / r;
  const qIm = p.omega * uRe + (f * duIm) / r;
  const phase = p.omega * tortoiseFromHorizonDistance(p.mass, r - b);
  return withPhase(phase, uRe, uIm, qRe, qIm, n + 1, converged);
}
