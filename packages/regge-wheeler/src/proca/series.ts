/**
 * Series solutions of the Proca sectors at the two ends (M = 1).
 * Derivations: docs/massive-vector.md.
 */
import { tortoiseFromHorizonDistance } from '../series.js';
import type { Complex } from './complex.js';
import type { SectorModel } from './sectors.js';

/** u and P = du/dr* of one solution at one radius, one entry per channel. */
export interface ChannelState {
  u: Complex[];
  p: Complex[];
}

/** A series value with the number of terms summed and whether the terms fell below the floor. */
export interface SeriesState extends ChannelState {
  terms: number;
  converged: boolean;
  /** horizon series: Σ|terms| over |sum| of h and t dh/dt (its log10 is about the digits lost to cancellation) */
  cancellation?: number;
}

const HORIZON_MAX_TERMS = 1500;
const FAR_MAX_TERMS = 400;
const TERM_FLOOR = 1e-17;
/** Relative size of the last kept term of the asymptotic far-zone series, unless a caller asks for a looser one. */
export const FAR_TOLERANCE = 1e-16;

/**
 * Scratch of the two series (two channels at most), shared by every call:
 * each call writes an entry before it reads it, and no call runs inside another.
 */
const HORIZON_W = new Float64Array(4 * 4);
const HORIZON_ALT = new Float64Array(4);
const HORIZON_A = new Float64Array((HORIZON_MAX_TERMS + 2) * 4);
const FAR_W = new Float64Array(4);
const FAR_DW = new Float64Array(4);

/**
 * Ingoing horizon solution u = e^{−iωr*} h(t), t = (r − 2)/2, h(0) = e_start
 * (the unit vector of channel `start`). With W(t) = (2μ)²(1+t)² + L + Q(1/(2(1+t))):
 *   (n+1)(n+1 − 2iΩ) a_{n+1} = −n(n−1) a_n + 2iΩ[2n a_n + (n−1) a_{n−1}] + Σ_j W_j a_{n−j},
 * Ω = 2ω. Q = q0 + q1 y makes W_j = P_j + (−1)^j q1/2 with P_j zero past j = 2,
 * so Σ_j W_j a_{n−j} = Σ_{j≤2} P_j a_{n−j} + (q1/2) A_n with the alternating sum
 * A_n = a_n − A_{n−1}: each term costs the same, not n times more (the start
 * radius can move out where the series needs more terms).
 */
export function horizonSolution(model: SectorModel, start: number, x: number): SeriesState {
  // the single solve's start-offset choice (greybody.ts) sums the series at the offset the integration then
  // starts from: the last sum per start channel is kept (its arrays are not modified by any caller)
  const last = LAST_HORIZON[start];
  if (
    last &&
    last.model === model &&
    last.x === x &&
    last.omega === model.omega &&
    last.mu === model.mu &&
    last.L === model.L &&
    last.q0 === model.qCoeffs[0]
  )
    return last.state;
  const state = sumHorizonSeries(model, start, x);
  LAST_HORIZON[start] = { model, x, omega: model.omega, mu: model.mu, L: model.L, q0: model.qCoeffs[0], state };
  return state;
}

/** The last horizon-series sum per start channel, with the model values it was made for. */
const LAST_HORIZON: Array<
  { model: SectorModel; x: number; omega: number; mu: number; L: number; q0: number[]; state: SeriesState } | undefined
> = [undefined, undefined];

function sumHorizonSeries(model: SectorModel, start: number, x: number): SeriesState {
  const N = model.channels;
  const NN = N * N;
  const Omega = 2 * model.omega;
  const t = x / 2;
  if (model.qCoeffs.length > 2) throw new Error('Proca sector with Q of degree > 1');
  // P_j (j = 0, 1, 2) at [j·NN …] and q1/2 at [3·NN …]
  const W = HORIZON_W;
  W.fill(0, 0, 4 * NN);
  const mass = 4 * model.mu * model.mu;
  for (let i = 0; i < N; i++) {
    W[i * N + i] = mass + model.L;
    W[NN + i * N + i] = 2 * mass;
    W[2 * NN + i * N + i] = mass;
  }
  const q0 = model.qCoeffs[0];
  const q1 = model.qCoeffs[1];
  for (let e = 0; e < NN; e++) {
    W[e] += q0[e];
    if (q1) W[3 * NN + e] = 0.5 * q1[e];
  }
  // A_n, the alternating sum of the coefficients up to a_n, (re, im) pairs per channel
  const alt = HORIZON_ALT;
  alt.fill(0, 0, 2 * N);
  const a = HORIZON_A;
  a.fill(0, 0, 2 * N);
  a[2 * start] = 1;
  const h = new Float64Array(2 * N);
  const hd = new Float64Array(2 * N); // dh/dt
  h[2 * start] = 1;
  let tPow = 1;
  let smallRun = 0;
  let converged = false;
  // Σ|terms| of h and of t dh/dt, against which the sums' sizes show the digits lost to cancellation
  let absSum = 1;
  let n = 0;
  for (; n < HORIZON_MAX_TERMS; n++) {
    const denRe = (n + 1) * (n + 1);
    const denIm = -(n + 1) * 2 * Omega;
    const den2 = denRe * denRe + denIm * denIm;
    for (let k = 0; k < 2 * N; k++) alt[k] = a[n * 2 * N + k] - alt[k];
    const next = (n + 1) * 2 * N;
    for (let i = 0; i < N; i++) {
      const an0 = a[n * 2 * N + 2 * i];
      const an1 = a[n * 2 * N + 2 * i + 1];
      let re = -n * (n - 1) * an0 - 2 * Omega * 2 * n * an1;
      let im = -n * (n - 1) * an1 + 2 * Omega * 2 * n * an0;
      if (n >= 1) {
        const am0 = a[(n - 1) * 2 * N + 2 * i];
        const am1 = a[(n - 1) * 2 * N + 2 * i + 1];
        re -= 2 * Omega * (n - 1) * am1;
        im += 2 * Omega * (n - 1) * am0;
      }
      for (let j = 0; j <= 2 && j <= n; j++) {
        const wo = j * NN + i * N;
        const so = (n - j) * 2 * N;
        for (let k = 0; k < N; k++) {
          const wv = W[wo + k];
          re += wv * a[so + 2 * k];
          im += wv * a[so + 2 * k + 1];
        }
      }
      for (let k = 0; k < N; k++) {
        const wv = W[3 * NN + i * N + k];
        re += wv * alt[2 * k];
        im += wv * alt[2 * k + 1];
      }
      a[next + 2 * i] = (re * denRe + im * denIm) / den2;
      a[next + 2 * i + 1] = (im * denRe - re * denIm) / den2;
    }
    const order = n + 1;
    const dWeight = order * tPow;
    tPow *= t;
    let termSize = 0;
    let scale = 0;
    for (let i = 0; i < N; i++) {
      const c0 = a[next + 2 * i];
      const c1 = a[next + 2 * i + 1];
      h[2 * i] += c0 * tPow;
      h[2 * i + 1] += c1 * tPow;
      hd[2 * i] += c0 * dWeight;
      hd[2 * i + 1] += c1 * dWeight;
      // Math.sqrt, not Math.hypot: a convergence test, and hypot was most of the cost of a term
      termSize += Math.sqrt(c0 * c0 + c1 * c1) * tPow * (1 + order);
      absSum += Math.sqrt(c0 * c0 + c1 * c1) * tPow * (1 + order);
      scale += Math.sqrt(h[2 * i] ** 2 + h[2 * i + 1] ** 2) + t * Math.sqrt(hd[2 * i] ** 2 + hd[2 * i + 1] ** 2);
    }
    if (termSize < TERM_FLOOR * scale) {
      if (++smallRun >= 3) {
        converged = true;
        n++;
        break;
      }
    } else smallRun = 0;
  }
  // u = e^{−iωr*} h;  du/dr* = e^{−iωr*} (−iω h + f dh/dr), dh/dr = (dh/dt)/2.
  const r = 2 + x;
  const f = x / r;
  const { u, p } = rotatedChannels(-model.omega * tortoiseFromHorizonDistance(1, x), N, h, hd, model.omega, 0.5 * f);
  let size = 0;
  for (let i = 0; i < N; i++)
    size += Math.sqrt(h[2 * i] ** 2 + h[2 * i + 1] ** 2) + t * Math.sqrt(hd[2 * i] ** 2 + hd[2 * i + 1] ** 2);
  return { u, p, terms: n + 1, converged, cancellation: absSum / size };
}

/**
 * The N channels of a series solution, u_i = e^{iφ} v_i and
 * p_i = e^{iφ} (−iα v_i + β d_i), from the summed series v (re, im pairs) and
 * its derivative sum d: the one form of both ends (horizon: φ = −ωr*,
 * α = ω, β = f/2; far zone: φ = k r* + η ln r, α = −g, β = −f/r).
 */
function rotatedChannels(
  phase: number,
  N: number,
  v: Float64Array,
  d: Float64Array,
  alpha: number,
  beta: number,
): { u: Complex[]; p: Complex[] } {
  const cph = Math.cos(phase);
  const sph = Math.sin(phase);
  const rot = (z: Complex): Complex => [cph * z[0] - sph * z[1], cph * z[1] + sph * z[0]];
  const u: Complex[] = [];
  const p: Complex[] = [];
  for (let i = 0; i < N; i++) {
    const vr = v[2 * i];
    const vi = v[2 * i + 1];
    u.push(rot([vr, vi]));
    p.push(rot([alpha * vi + beta * d[2 * i], -alpha * vr + beta * d[2 * i + 1]]));
  }
  return { u, p };
}

/** k∞ = √(ω² − μ²) and the long-range phase coefficient η = μ²/k∞ (M = 1). */
export function farWaveNumbers(model: SectorModel): { k: number; eta: number } {
  const k = Math.sqrt((model.omega - model.mu) * (model.omega + model.mu));
  return { k, eta: (model.mu * model.mu) / k };
}

/**
 * Outgoing far-zone solution u = e^{i(k r* + η ln r)} Σ c_n r^{−n}, c_0 = e_start.
 * With y = 1/r and D = y d/dy the equation for w = Σ c_n y^n is
 * Σ_j y^j [a_j D² + b_j D + C_j] w = 0 (docs/massive-vector.md), whose
 * y^{n+1} coefficient gives
 *   2ik n c_n = Σ_{j≥2} [a_j (n+1−j)² + b_j (n+1−j) + C_j] c_{n+1−j}.
 * The incoming solution is its complex conjugate (real coefficients).
 */
export function outgoingFarSolution(model: SectorModel, start: number, r: number, target = FAR_TOLERANCE): SeriesState {
  const N = model.channels;
  const { k, eta } = farWaveNumbers(model);
  const y = 1 / r;
  const summed = sumFarSeries(model, start, r, target);
  const converged = summed > 0;
  const n = Math.abs(summed);
  const w = FAR_W;
  const Dw = FAR_DW;
  // u = e^{iS} w;  du/dr* = e^{iS} (i g w − f y D w), g = k + f η / r.
  const f = 1 - 2 * y;
  const g = k + f * eta * y;
  const phase = k * tortoiseFromHorizonDistance(1, r - 2) + eta * Math.log(r);
  const { u, p } = rotatedChannels(phase, N, w, Dw, -g, -(f * y));
  return { u, p, terms: n, converged };
}

/**
 * Whether the far series of `start` converges at r to `target` (the matching-radius ladder asks this at each
 * rung, and builds the solutions only where it does).
 */
export function farSeriesConverges(model: SectorModel, start: number, r: number, target = FAR_TOLERANCE): boolean {
  return sumFarSeries(model, start, r, target) > 0;
}

/**
 * The far series w = Σ T_n and y dw/dy of `start` at r, into FAR_W and FAR_DW: the number of terms summed,
 * negative when they did not fall below `target`.
 */
function sumFarSeries(model: SectorModel, start: number, r: number, target: number): number {
  const N = model.channels;
  const { k } = farWaveNumbers(model);
  const y = 1 / r;
  const ref = farTerms(model, start, y);
  // T_n(r) = T_n(r_ref) q^n, q = r_ref / r ≤ 1: the terms at the reference radius, rescaled
  const q = y / ref.y;
  const T = ref.T;
  // w and y dw/dy: shared scratch (the matching-radius ladder sums the series a dozen times per solve)
  const w = FAR_W;
  const Dw = FAR_DW;
  w.fill(0);
  Dw.fill(0);
  w[2 * start] = 1;
  let smallRun = 0;
  let converged = false;
  let previous = 1;
  let n = 1;
  let qn = 1;
  for (; n <= FAR_MAX_TERMS; n++) {
    if (n > ref.count) extendFarTerms(ref, N, k, n);
    const next = n * 2 * N;
    qn *= q;
    let size = 0;
    let scale = 0;
    for (let i = 0; i < N; i++) {
      const t0 = T[next + 2 * i] * qn;
      const t1 = T[next + 2 * i + 1] * qn;
      w[2 * i] += t0;
      w[2 * i + 1] += t1;
      Dw[2 * i] += n * t0;
      Dw[2 * i + 1] += n * t1;
      // Math.sqrt, not Math.hypot: a convergence test, and hypot was most of the cost of a term
      size += Math.sqrt(t0 * t0 + t1 * t1) * (n + 1);
      scale += Math.sqrt(w[2 * i] ** 2 + w[2 * i + 1] ** 2);
    }
    if (size < target * scale) {
      if (++smallRun >= 3) {
        converged = true;
        break;
      }
    } else {
      smallRun = 0;
      if (n > model.l + 3 && size > previous && size > 1e-3 * scale) break;
    }
    previous = size;
  }
  return converged ? n : -n;
}

/**
 * The far series' terms T_n = c_n y_ref^n of one start at a reference radius 1/y_ref. The coefficients c_n do
 * not depend on r: the matching-radius ladder (integrate.ts), which sums the series at radii 1.2 apart until
 * it converges, rescales these instead of running the recurrence again at every rung.
 */
interface FarTerms {
  model: SectorModel | undefined;
  /** the model's values when the terms were made (a model object edited in place must not reuse them) */
  omega: number;
  mu: number;
  L: number;
  q0: number[] | undefined;
  y: number;
  /** y_ref^{j−1} at index j = 1 … 4 */
  yPow: Float64Array;
  /** terms made so far: T_0 … T_count */
  count: number;
  /** T_n at [n·2N …] as (re, im) pairs */
  T: Float64Array;
  /** C_j (complex N×N, j = 2, 3, 4) at [(j·NN + i)·2], and the scalars a_j, Re b_j, Im b_j of the recurrence */
  C: Float64Array;
  a: Float64Array;
  bRe: Float64Array;
  bIm: Float64Array;
}

/** One set of terms per start channel (two at most), shared by every call; no call runs inside another. */
const FAR_TERMS: FarTerms[] = [0, 1].map(() => ({
  model: undefined,
  omega: Number.NaN,
  mu: Number.NaN,
  L: Number.NaN,
  q0: undefined,
  y: Number.NaN,
  yPow: new Float64Array(5),
  count: 0,
  T: new Float64Array((FAR_MAX_TERMS + 2) * 4),
  C: new Float64Array(5 * 4 * 2),
  a: new Float64Array(5),
  bRe: new Float64Array(5),
  bIm: new Float64Array(5),
}));

/**
 * Rescaling by q^n, q = y / y_ref, stays within range while y_ref ≤ y / MIN_RESCALE: the terms made at the
 * reference are at most the last ones summed at r (about one) times q^{−n}, and 4^400 ≈ 1e241.
 */
const MIN_RESCALE = 0.25;

/** The terms of `start` at a reference radius no further out than 1/y and at most 1/MIN_RESCALE inside it. */
function farTerms(model: SectorModel, start: number, y: number): FarTerms {
  const ref = FAR_TERMS[start];
  if (
    ref.model === model &&
    ref.omega === model.omega &&
    ref.mu === model.mu &&
    ref.L === model.L &&
    ref.q0 === model.qCoeffs[0] &&
    y <= ref.y &&
    y >= MIN_RESCALE * ref.y
  )
    return ref;
  const N = model.channels;
  const NN = N * N;
  const { k, eta } = farWaveNumbers(model);
  const L = model.L;
  const d2 = eta * eta;
  const Q0 = model.qCoeffs[0];
  const Q1 = model.qCoeffs[1];
  // a_j, b_j (complex scalars) and C_j (complex matrices), j = 2, 3, 4
  ref.a.set([0, 0, 1, -4, 4]);
  ref.bRe.set([0, 0, 1, -6, 8]);
  ref.bIm.set([0, -2 * k, -2 * (eta - 2 * k), 8 * eta, -8 * eta]);
  const scalarRe = [0, 0, 4 * model.mu * model.mu - d2 - L, 4 * d2 + 2 * L, -4 * d2];
  const scalarIm = [0, 0, -eta, 6 * eta, -8 * eta];
  for (let j = 2; j <= 4; j++) {
    for (let i = 0; i < NN; i++) {
      const diagonal = i % (N + 1) === 0;
      const q1 = Q1 ? Q1[i] : 0;
      const qv = j === 2 ? -Q0[i] : j === 3 ? -(q1 - 2 * Q0[i]) : 2 * q1;
      ref.C[(j * NN + i) * 2] = (diagonal ? scalarRe[j] : 0) + qv;
      ref.C[(j * NN + i) * 2 + 1] = diagonal ? scalarIm[j] : 0;
    }
  }
  ref.model = model;
  ref.omega = model.omega;
  ref.mu = model.mu;
  ref.L = model.L;
  ref.q0 = model.qCoeffs[0];
  ref.y = y;
  ref.yPow.set([0, 1, y, y * y, y * y * y]);
  ref.count = 0;
  ref.T.fill(0, 0, 2 * N);
  ref.T[2 * start] = 1;
  return ref;
}

/**
 * Terms up to T_n at the reference radius, from the recurrence 2ik n c_n = Σ_{j≥2} [a_j (n+1−j)² + b_j (n+1−j) + C_j] c_{n+1−j}
 * (times y_ref^n: T_{n+1−j} y_ref^{j−1}).
 */
function extendFarTerms(ref: FarTerms, N: number, k: number, upTo: number): void {
  const NN = N * N;
  const { T, C, a, bRe, bIm } = ref;
  const yPow = ref.yPow; // y^{j−1} at index j
  for (let n = ref.count + 1; n <= upTo; n++) {
    const next = n * 2 * N;
    for (let i = 0; i < N; i++) {
      let re = 0;
      let im = 0;
      for (let j = 2; j <= 4; j++) {
        const idx = n + 1 - j;
        if (idx < 0) continue;
        const src = idx * 2 * N;
        const yj = yPow[j];
        const coeffRe = a[j] * idx * idx + bRe[j] * idx;
        const coeffIm = bIm[j] * idx;
        for (let c = 0; c < N; c++) {
          let mr = C[(j * NN + i * N + c) * 2];
          let mi = C[(j * NN + i * N + c) * 2 + 1];
          if (c === i) {
            mr += coeffRe;
            mi += coeffIm;
          }
          re += (mr * T[src + 2 * c] - mi * T[src + 2 * c + 1]) * yj;
          im += (mr * T[src + 2 * c + 1] + mi * T[src + 2 * c]) * yj;
        }
      }
      // T_n = num / (2ik n)
      const d = 2 * k * n;
      T[next + 2 * i] = im / d;
      T[next + 2 * i + 1] = -re / d;
    }
  }
  ref.count = upTo;
}
