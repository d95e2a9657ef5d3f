import { ConvergenceError } from '@penumbra/core';
import { cdiv, complexArithmetic, type ComplexValue } from './complexArithmetic.js';
import { failureDiagnostics, type Tally } from './diagnostics.js';
import { leaverRecurrence, leaverScalars } from './leaverRecurrence.js';

/** F(A), dF/dA and the depth of the complex continued fraction. */
export interface ComplexContinuedFractionValue {
  value: ComplexValue;
  derivative: ComplexValue;
  depth: number;
}

const MAX_DEPTH = 20000;

/**
 * Leaver's continued fraction (J. Math. Phys. 27, 1238 (1986)) for complex c
 * and A, from the recurrence of leaverRecurrence.ts in complex pairs. The
 * infinite part is summed backwards (the stable direction for the minimal
 * solution) from a depth grown until the value is stable. Returns F(A) and
 * dF/dA for the `inversion`-th form, expanded about the pole picked by σ.
 */
export function leaverFunctionComplex(
  s: number,
  m: number,
  c: ComplexValue,
  A: ComplexValue,
  inversion: number,
  sigma: 1 | -1,
): ComplexContinuedFractionValue {
  const r = leaverRecurrence(s, m, sigma);
  const { beta0, slope, gammaScale } = leaverScalars(r, complexArithmetic, c, A);
  const alpha = r.alpha;
  const betaR = (n: number) => r.betaQuadratic(n) + r.betaLinear(n) * slope.re + beta0.re;
  const betaI = (n: number) => r.betaLinear(n) * slope.im + beta0.im;
  const gammaR = (n: number) => gammaScale.re * r.gammaWeight(n);
  const gammaI = (n: number) => gammaScale.im * r.gammaWeight(n);

  // Lower part t_j = β_j − α_{j−1}γ_j / t_{j−1}, dβ/dA = −1.
  let lowR = 0,
    lowI = 0,
    dLowR = 0,
    dLowI = 0;
  if (inversion > 0) {
    let tr = betaR(0),
      ti = betaI(0),
      dtr = -1,
      dti = 0;
    for (let j = 1; j <= inversion; j++) {
      const pr = alpha(j - 1) * gammaR(j),
        pi = alpha(j - 1) * gammaI(j);
      const q = cdiv({ re: pr, im: pi }, { re: tr, im: ti }); // p/t
      const q2 = cdiv(q, { re: tr, im: ti }); // p/t²
      const dq = { re: q2.re * dtr - q2.im * dti, im: q2.re * dti + q2.im * dtr }; // p dt / t²
      if (j === inversion) {
        lowR = -q.re;
        lowI = -q.im;
        dLowR = dq.re;
        dLowI = dq.im;
      } else {
        tr = betaR(j) - q.re;
        ti = betaI(j) - q.im;
        dtr = -1 + dq.re;
        dti = dq.im;
      }
    }
  }
  const upper = (depth: number) => {
    const start = inversion + depth;
    let tr = betaR(start),
      ti = betaI(start),
      dtr = -1,
      dti = 0;
    for (let n = start - 1; n > inversion; n--) {
      const ar = -alpha(n) * gammaR(n + 1),
        ai = -alpha(n) * gammaI(n + 1);
      const q = cdiv({ re: ar, im: ai }, { re: tr, im: ti });
      const q2 = cdiv(q, { re: tr, im: ti });
      const dq = { re: q2.re * dtr - q2.im * dti, im: q2.re * dti + q2.im * dtr };
      tr = betaR(n) + q.re;
      ti = betaI(n) + q.im;
      dtr = -1 - dq.re;
      dti = -dq.im;
    }
    const a1 = { re: -alpha(inversion) * gammaR(inversion + 1), im: -alpha(inversion) * gammaI(inversion + 1) };
    const v = cdiv(a1, { re: tr, im: ti });
    const v2 = cdiv(v, { re: tr, im: ti });
    return { v, dv: { re: -(v2.re * dtr - v2.im * dti), im: -(v2.re * dti + v2.im * dtr) } };
  };
  let depth = 40 + Math.ceil(8 * Math.hypot(c.re, c.im));
  let previous = upper(depth);
  for (;;) {
    const next = Math.ceil(1.5 * depth);
    if (next > MAX_DEPTH) {
      throw new ConvergenceError(
        'complex Leaver continued fraction did not converge',
        failureDiagnostics('leaver-continued-fraction-complex', `no stable value within ${MAX_DEPTH} terms`, depth, 1, {
          s,
          m,
          c,
          A,
          inversion,
          depth,
        }),
      );
    }
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

/** Outcome of Newton on the complex continued fraction (not converged is reported, not thrown). */
export interface ComplexLeaverRoot {
  A: ComplexValue;
  converged: boolean;
  iterations: number;
  lastStep: number;
  depth: number;
}

/**
 * Newton on the complex continued fraction from `start` (the spectral value),
 * at most 12 steps. Converged when a step is below 4e-16·max(1, |A|), or when
 * steps stop shrinking below 1e-10·max(1, |A|): the rounding floor grows like
 * e^{2|Im c|}ε (docs/spheroidal.md). Each evaluation is counted in `tally`.
 */
export function leaverRootComplex(
  s: number,
  m: number,
  c: ComplexValue,
  start: ComplexValue,
  inversion: number,
  sigma: 1 | -1,
  tally: Tally,
): ComplexLeaverRoot {
  let A = start;
  let iterations = 0;
  let lastStep = Infinity;
  let depth = 0;
  const scale = Math.max(1, Math.hypot(A.re, A.im));
  for (let it = 1; it <= 12; it++) {
    tally.evaluations++;
    const fv = leaverFunctionComplex(s, m, c, A, inversion, sigma);
    depth = fv.depth;
    const step = cdiv(fv.value, fv.derivative);
    if (!Number.isFinite(step.re) || !Number.isFinite(step.im)) break;
    A = { re: A.re - step.re, im: A.im - step.im };
    iterations = it;
    const size = Math.hypot(step.re, step.im);
    if (size <= 4e-16 * scale || (size <= 1e-10 * scale && size >= 0.5 * lastStep)) {
      return { A, converged: true, iterations, lastStep: size, depth };
    }
    lastStep = size;
  }
  return { A, converged: false, iterations, lastStep, depth };
}
