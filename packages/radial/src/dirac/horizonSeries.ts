/**
 * The ingoing solution of the massive Dirac pair near the horizon as a
 * Frobenius series in y = √(r − r₊) (docs/massive-dirac.md): in y the pair is
 * dP/dy = (R/y + Σ_k G_k y^k) P with R = diag(−iα, iα), α = 2K(r₊)/(r₊ − r₋)
 * = k/κ, so P = y^{−iα} Σ_n c_n y^n with c₀ = (1, 0) — P₊ → e^{−ikr*} up to a
 * constant phase, P₋ → 0 — and diag(n, n − 2iα) c_n = Σ_k G_k c_{n−1−k}.
 */
import { type C, type V2, ZERO, cadd, cdiv, cexp, cmul, cscale, vnorm } from './complex2.js';
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

/**
 * Sum the series at x = r − r₊ = fraction·(r₊ − r₋); throws RangeError if it
 * has not converged to 1e-17 in MAX_TERMS terms (the caller then moves closer).
 */
export function diracHorizonStart(p: DiracRadialProblem, fraction: number): DiracHorizonStart {
  const { hole, omega, m, mu, lambda } = p;
  const { a, rPlus, rMinus } = hole;
  const d = rPlus - rMinus;
  const count = MAX_TERMS / 2 + 2;
  // h(x) = 2K(r₊ + x)/(x + d), g∓(x) = 2(λ ∓ iμ(r₊ + x))/√(x + d)
  const kPlus = omega * (rPlus * rPlus + a * a) - a * m;
  const inv = seriesPower([d, 1], -1, count);
  const h = seriesProduct([2 * kPlus, 4 * omega * rPlus, 2 * omega], inv, count);
  const root = seriesPower([d, 1], -0.5, count);
  const gRe = seriesProduct([2 * lambda], root, count);
  const gIm = seriesProduct([2 * mu * rPlus, 2 * mu], root, count);
  const alpha = h[0];
  const c: V2[] = [[[1, 0], ZERO]];
  const x = fraction * d;
  const y = Math.sqrt(x);
  let sumP: C = [1, 0];
  let sumM: C = ZERO;
  let pw = 1;
  let small = 0;
  for (let n = 1; n <= MAX_TERMS; n++) {
    let bP: C = ZERO;
    let bM: C = ZERO;
    for (let k = 0; k <= n - 1; k++) {
      const prev = c[n - 1 - k];
      if (k % 2 === 1) {
        const hk = h[(k + 1) / 2];
        bP = cadd(bP, cmul([0, -hk], prev[0]));
        bM = cadd(bM, cmul([0, hk], prev[1]));
      } else {
        const i = k / 2;
        bP = cadd(bP, cmul([gRe[i], -gIm[i]], prev[1]));
        bM = cadd(bM, cmul([gRe[i], gIm[i]], prev[0]));
      }
    }
    const cn: V2 = [cscale(bP, 1 / n), cdiv(bM, [n, -2 * alpha])];
    c.push(cn);
    pw *= y;
    sumP = cadd(sumP, cscale(cn[0], pw));
    sumM = cadd(sumM, cscale(cn[1], pw));
    const size = vnorm(cn) * pw;
    small = size < 1e-17 * Math.hypot(sumP[0], sumP[1], sumM[0], sumM[1]) ? small + 1 : 0;
    if (small >= 2) {
      const phase = cexp([0, -alpha * Math.log(y)]);
      return { r: rPlus + x, value: [cmul(sumP, phase), cmul(sumM, phase)], terms: n + 1 };
    }
  }
  throw new RangeError(`Dirac horizon series did not converge at x/(r₊ − r₋) = ${fraction}`);
}
