/**
 * Frobenius series of the Teukolsky radial equation at the outer horizon for
 * the solution that is ingoing there:
 *
 *   R = x^ν Σ d_n x^n,  x = r − r+,  ν = −s − i k (2 M r+)/(r+ − r−),
 *
 * normalised so that R → Δ^{−s} e^{−ikr*} with the tortoise constant of
 * @penumbra/kerr. The series converges for x < r+ − r− (the next singular
 * point is r−); we sum it at a fraction of that radius.
 */
import type { KerrHole } from '@penumbra/kerr';
import { ConvergenceError } from '@penumbra/core';
import { radialEquation, type RadialEquation, type RadialMode } from './equation.js';

/** The horizon series summed at one point. */
export interface HorizonStart {
  /** x0 = r0 − r+ where the series was summed */
  x0: number;
  /** R(r0) as [re, im] */
  R: [number, number];
  /** R'(r0) as [re, im] */
  dR: [number, number];
  /** number of series terms used */
  terms: number;
  /** magnitude of the last term relative to the sum */
  truncation: number;
  /** indicial exponent ν */
  nu: [number, number];
}

const MAX_TERMS = 600;

/** k = ω − mΩ_H */
export function horizonWavenumber(hole: KerrHole, mode: RadialMode): number {
  return mode.omega - mode.m * hole.omegaH;
}

/**
 * The coefficients d_n of the series, generated on demand and kept: they do not
 * depend on the point x0 where the series is summed, so a caller that tries
 * several x0 (startAtHorizon moving the start inward) runs the recurrence once.
 */
export class HorizonCoefficients {
  readonly nuRe: number;
  readonly nuIm: number;
  /** d_n for n < count */
  readonly re = new Float64Array(MAX_TERMS);
  readonly im = new Float64Array(MAX_TERMS);
  count = 1;
  readonly b: number;
  private readonly A2: number;
  private readonly A3: number;
  private readonly A4: number;
  private readonly B1: number;
  private readonly B2: number;
  private readonly B3: number;
  private readonly C: Float64Array;

  constructor(hole: KerrHole, mode: RadialMode, eq: RadialEquation = radialEquation(hole, mode, hole.rPlus)) {
    const { rPlus, rMinus, mass: M } = hole;
    const s = mode.s;
    const b = rPlus - rMinus;
    this.b = b;
    const k = horizonWavenumber(hole, mode);
    const cPlus = (2 * M * rPlus) / b;
    const cMinus = (2 * M * rMinus) / b;
    // ν = −s − i k cPlus
    this.nuRe = -s;
    this.nuIm = -k * cPlus;
    // Δ² = A2 x² + A3 x³ + A4 x⁴, (s+1)ΔΔ' = B1 x + B2 x² + B3 x³ (both real) and U = Σ C_j x^j,
    // x = r − r+, from the one definition; the recurrence is unrolled over these.
    if (eq.center !== rPlus || eq.s !== s) throw new Error("horizonSeriesStart: the equation must be the mode's, about r+");
    // read in place (coefficients past a polynomial's degree are 0)
    const at = (q: Float64Array, j: number): number => (j < q.length ? q[j] : 0);
    this.A2 = at(eq.A.re, 2);
    this.A3 = at(eq.A.re, 3);
    this.A4 = at(eq.A.re, 4);
    this.B1 = at(eq.B.re, 1);
    this.B2 = at(eq.B.re, 2);
    this.B3 = at(eq.B.re, 3);
    // C0…C4, real parts then imaginary parts
    this.C = new Float64Array(10);
    for (let j = 0; j < 5; j++) {
      this.C[j] = at(eq.C.re, j);
      this.C[5 + j] = at(eq.C.im, j);
    }
    // d_0: |d_0| = b^{−s}; phase from the additive constant of r*.
    const phaseConst = rPlus - cPlus * Math.log(2 * M) - cMinus * Math.log(b / (2 * M));
    const mag0 = Math.pow(b, -s);
    this.re[0] = mag0 * Math.cos(-k * phaseConst);
    this.im[0] = mag0 * Math.sin(-k * phaseConst);
  }

  /** Extend the coefficients to d_n (n < MAX_TERMS). */
  extendTo(n: number): void {
    const { re, im, nuRe, nuIm, A2, A3, A4, B1, B2, B3, C } = this;
    for (let j = this.count; j <= n; j++) {
      // numerator = −[ (A3 (μ1)(μ1−1) + B2 μ1 + C1) d_{j−1} + (A4 (μ2)(μ2−1) + B3 μ2 + C2) d_{j−2} + C3 d_{j−3} + C4 d_{j−4} ]
      let numRe = 0,
        numIm = 0;
      // index j−1: μ1 = j − 1 + ν
      {
        const mr = j - 1 + nuRe,
          mi = nuIm;
        // μ(μ−1) = (mr + i mi)(mr − 1 + i mi)
        const pr = mr * (mr - 1) - mi * mi;
        const pi = mr * mi + mi * (mr - 1);
        const cr = A3 * pr + B2 * mr + C[1];
        const ci = A3 * pi + B2 * mi + C[6];
        numRe += cr * re[j - 1] - ci * im[j - 1];
        numIm += cr * im[j - 1] + ci * re[j - 1];
      }
      if (j >= 2) {
        const mr = j - 2 + nuRe,
          mi = nuIm;
        const pr = mr * (mr - 1) - mi * mi;
        const pi = mr * mi + mi * (mr - 1);
        const cr = A4 * pr + B3 * mr + C[2];
        const ci = A4 * pi + B3 * mi + C[7];
        numRe += cr * re[j - 2] - ci * im[j - 2];
        numIm += cr * im[j - 2] + ci * re[j - 2];
      }
      if (j >= 3) {
        numRe += C[3] * re[j - 3] - C[8] * im[j - 3];
        numIm += C[3] * im[j - 3] + C[8] * re[j - 3];
      }
      if (j >= 4) {
        numRe += C[4] * re[j - 4] - C[9] * im[j - 4];
        numIm += C[4] * im[j - 4] + C[9] * re[j - 4];
      }
      // F(j + ν) = A2 μ(μ−1) + B1 μ + C0, μ = j + ν
      const mr = j + nuRe,
        mi = nuIm;
      const fr = A2 * (mr * (mr - 1) - mi * mi) + B1 * mr + C[0];
      const fi = A2 * (mr * mi + mi * (mr - 1)) + B1 * mi + C[5];
      const den = fr * fr + fi * fi;
      // d_j = −num / F
      re[j] = -(numRe * fr + numIm * fi) / den;
      im[j] = -(numIm * fr - numRe * fi) / den;
    }
    if (n >= this.count) this.count = n + 1;
  }
}

/**
 * R and R' of the ingoing horizon solution (normalised to Δ^{−s} e^{−ikr*}) at
 * r = r+ + x0, from its Frobenius series; `eq` is the mode's equation about r+
 * (built here if not given), `coefficients` the series' coefficients when the
 * caller keeps them across several x0.
 */
export function horizonSeriesStart(
  hole: KerrHole,
  mode: RadialMode,
  x0: number,
  eq?: RadialEquation,
  coefficients: HorizonCoefficients = new HorizonCoefficients(hole, mode, eq),
): HorizonStart {
  const { re, im, nuRe, nuIm, b } = coefficients;
  // Partial sums S = Σ d_n x0^n and S' = Σ (n + ν) d_n x0^n.
  let sRe = re[0],
    sIm = im[0];
  let tRe = nuRe * sRe - nuIm * sIm;
  let tIm = nuRe * sIm + nuIm * sRe;
  let pw = 1;
  let small = 0;
  let n = 1;
  // squared magnitudes in the loop (Math.hypot per term was measured to cost more than the recurrence)
  let scaleMax2 = sRe * sRe + sIm * sIm;
  let truncation2 = 1;
  for (; n < MAX_TERMS; n++) {
    if (n >= coefficients.count) coefficients.extendTo(Math.min(MAX_TERMS - 1, n + 15));
    const mr = n + nuRe,
      mi = nuIm;
    pw *= x0;
    const termRe = re[n] * pw,
      termIm = im[n] * pw;
    sRe += termRe;
    sIm += termIm;
    tRe += mr * termRe - mi * termIm;
    tIm += mr * termIm + mi * termRe;
    const termMag2 = termRe * termRe + termIm * termIm;
    const sumMag2 = sRe * sRe + sIm * sIm;
    // an overflowed term never comes back: fail now rather than after MAX_TERMS
    if (!Number.isFinite(sumMag2) || !Number.isFinite(termMag2)) {
      truncation2 = Number.NaN;
      break;
    }
    scaleMax2 = Math.max(scaleMax2, termMag2);
    truncation2 = termMag2 / sumMag2;
    if (termMag2 <= 1e-34 * sumMag2) {
      if (++small >= 3) break;
    } else small = 0;
  }
  const truncation = Math.sqrt(truncation2);
  if (small < 3) {
    throw new ConvergenceError('horizon series did not converge', {
      method: 'horizon Frobenius series',
      steps: n,
      rhsEvaluations: 0,
      errorEstimate: truncation,
      message: `the last of ${n} terms is ${truncation.toExponential(2)} of the sum at x0 = ${x0}`,
      x0,
      terms: n,
      truncation,
      b,
    });
  }
  // x0^ν = exp(ν ln x0)
  const lx = Math.log(x0);
  const mag = Math.exp(nuRe * lx);
  const ph = nuIm * lx;
  const xnRe = mag * Math.cos(ph),
    xnIm = mag * Math.sin(ph);
  const R: [number, number] = [xnRe * sRe - xnIm * sIm, xnRe * sIm + xnIm * sRe];
  const dR: [number, number] = [(xnRe * tRe - xnIm * tIm) / x0, (xnRe * tIm + xnIm * tRe) / x0];
  // Cancellation among terms costs accuracy: report it through truncation.
  const cancellation = Math.sqrt(scaleMax2) / Math.hypot(sRe, sIm);
  return { x0, R, dR, terms: n + 1, truncation: Math.max(truncation, cancellation * 1e-16), nu: [nuRe, nuIm] };
}
