/**
 * The ingoing solution of the massive Dirac pair near the horizon as a
 * Frobenius series in y = √(r − r₊) (docs/massive-dirac.md): in y the pair is
 * dP/dy = (R/y + Σ_k G_k y^k) P with R = diag(−iα, iα), α = 2K(r₊)/(r₊ − r₋)
 * = k/κ, so P = y^{−iα} Σ_n c_n y^n with c₀ = (1, 0) — P₊ → e^{−ikr*} up to a
 * constant phase, P₋ → 0 — and diag(n, n − 2iα) c_n = Σ_k G_k c_{n−1−k}.
 */
import { type C, cexp, cmul } from './complex2.js';
import type { DiracRadialProblem } from './equation.js';
import { seriesPower, seriesProduct } from './realSeries.js';

/** The state at the start radius and what it took. */
export interface DiracHorizonStart {
  r: number;
  /** (P₊, P₋) at r */
  value: [C, C];
  terms: number;
}

const MAX_TERMS = 400;
/** Coefficients of h and g computed first (enough for 2·FIRST_COUNT − 1 terms). */
const FIRST_COUNT = 24;
/** The coefficients c_n, shared by every call (each writes c_n before reading it). */
const COEFFICIENTS = new Float64Array(4 * (MAX_TERMS + 1));

/**
 * Sum the series at x = r − r₊ = fraction·(r₊ − r₋); throws RangeError if it
 * has not converged to 1e-17 in MAX_TERMS terms (the caller then moves closer).
 */
export function diracHorizonStart(p: DiracRadialProblem, fraction: number): DiracHorizonStart {
  const { hole, omega, m, mu, lambda } = p;
  const { a, rPlus, rMinus } = hole;
  const d = rPlus - rMinus;
  // h(x) = 2K(r₊ + x)/(x + d), g∓(x) = 2(λ ∓ iμ(r₊ + x))/√(x + d)
  const kPlus = omega * (rPlus * rPlus + a * a) - a * m;
  const expansions = (count: number) => {
    const inv = seriesPower([d, 1], -1, count);
    const root = seriesPower([d, 1], -0.5, count);
    return {
      h: seriesProduct([2 * kPlus, 4 * omega * rPlus, 2 * omega], inv, count),
      gRe: seriesProduct([2 * lambda], root, count),
      gIm: seriesProduct([2 * mu * rPlus, 2 * mu], root, count),
    };
  };
  // Their first coefficients do not depend on the count: a short set first (the series typically converges in
  // 20–40 terms, which read the first half of it), all MAX_TERMS/2 + 2 once a term needs more.
  let count = FIRST_COUNT;
  let { h, gRe, gIm } = expansions(count);
  const alpha = h[0];
  // c_n at [4n …] as (Re P₊, Im P₊, Re P₋, Im P₋): the operations of the complex helpers, in their order, on scalars
  const c = COEFFICIENTS;
  c[0] = 1;
  c[1] = 0;
  c[2] = 0;
  c[3] = 0;
  const x = fraction * d;
  const y = Math.sqrt(x);
  let sumP0 = 1;
  let sumP1 = 0;
  let sumM0 = 0;
  let sumM1 = 0;
  let pw = 1;
  let small = 0;
  for (let n = 1; n <= MAX_TERMS; n++) {
    if (n >> 1 >= count) {
      count = MAX_TERMS / 2 + 2;
      ({ h, gRe, gIm } = expansions(count));
    }
    let bP0 = 0;
    let bP1 = 0;
    let bM0 = 0;
    let bM1 = 0;
    for (let k = 0; k <= n - 1; k++) {
      const o = 4 * (n - 1 - k);
      const p0 = c[o];
      const p1 = c[o + 1];
      const q0 = c[o + 2];
      const q1 = c[o + 3];
      if (k % 2 === 1) {
        const hk = h[(k + 1) / 2];
        const nh = -hk;
        // bP += (−i hk) P₊,  bM += (i hk) P₋
        bP0 += 0 * p0 - nh * p1;
        bP1 += 0 * p1 + nh * p0;
        bM0 += 0 * q0 - hk * q1;
        bM1 += 0 * q1 + hk * q0;
      } else {
        const i = k / 2;
        const gr = gRe[i];
        const gi = gIm[i];
        const ngi = -gi;
        // bP += (g − i h) P₋,  bM += (g + i h) P₊
        bP0 += gr * q0 - ngi * q1;
        bP1 += gr * q1 + ngi * q0;
        bM0 += gr * p0 - gi * p1;
        bM1 += gr * p1 + gi * p0;
      }
    }
    const inv = 1 / n;
    const dRe = n;
    const dIm = -2 * alpha;
    const den = dRe * dRe + dIm * dIm;
    const o = 4 * n;
    c[o] = bP0 * inv;
    c[o + 1] = bP1 * inv;
    c[o + 2] = (bM0 * dRe + bM1 * dIm) / den;
    c[o + 3] = (bM1 * dRe - bM0 * dIm) / den;
    pw *= y;
    sumP0 += c[o] * pw;
    sumP1 += c[o + 1] * pw;
    sumM0 += c[o + 2] * pw;
    sumM1 += c[o + 3] * pw;
    // squared sizes of the term and the sum (Math.hypot of four was a visible share of the series)
    const t0 = c[o] * pw;
    const t1 = c[o + 1] * pw;
    const t2 = c[o + 2] * pw;
    const t3 = c[o + 3] * pw;
    const size2 = t0 * t0 + t1 * t1 + (t2 * t2 + t3 * t3);
    const sum2 = sumP0 * sumP0 + sumP1 * sumP1 + (sumM0 * sumM0 + sumM1 * sumM1);
    small = size2 < 1e-34 * sum2 ? small + 1 : 0;
    if (small >= 2) {
      const phase = cexp([0, -alpha * Math.log(y)]);
      return {
        r: rPlus + x,
        value: [cmul([sumP0, sumP1], phase), cmul([sumM0, sumM1], phase)],
        terms: n + 1,
      };
    }
  }
  throw new RangeError(`Dirac horizon series did not converge at x/(r₊ − r₋) = ${fraction}`);
}
