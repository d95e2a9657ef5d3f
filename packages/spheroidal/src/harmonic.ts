import { InputError } from '@penumbra/core';
import { cosDiagonal, cosOffDiagonal } from './coupling.js';
import { type SpheroidalEigenvalue, solveMode } from './eigenvalue.js';
import type { SpheroidalOptions, SpheroidalProblem } from './problem.js';
import { lowestL } from './quantum.js';

/**
 * S_{slm}(θ; c) = Σ_l b_l u_l(θ), u_l the orthonormal spin-weighted spherical
 * harmonics (∫ u_l u_l' sinθ dθ = δ_ll', no e^{imφ} and no 2π).
 *
 * Phase convention: S(θ) / (sin^{|m+s|}(θ/2) cos^{|m−s|}(θ/2)) is positive at
 * θ = 0. That limit is the leading Frobenius coefficient at the pole, which
 * cannot vanish for a non-trivial solution, so the convention is continuous in
 * real c. Numerically the sign is read at whichever pole S is larger, using
 * the fact that the two limits have the fixed sign ratio (−1)^{l−lmin}.
 */
export interface SpheroidalHarmonic extends SpheroidalEigenvalue {
  /** l of each expansion coefficient. */
  basisL: Float64Array;
  /** Expansion coefficients b_l in orthonormal spin-weighted spherical harmonics; Σ b² = 1. */
  coefficients: Float64Array;
  /** S and dS/dθ at one angle θ ∈ [0, π]. */
  evaluate(theta: number): { S: number; dS: number };
  /** S and dS/dθ on a grid of angles. */
  sample(thetas: ArrayLike<number>): { S: Float64Array; dS: Float64Array };
}

const logFactorials: number[] = [0];
function logFactorial(n: number): number {
  for (let k = logFactorials.length; k <= n; k++) logFactorials[k] = logFactorials[k - 1] + Math.log(k);
  return logFactorials[n];
}

/** Everything the θ-evaluation needs, precomputed once per harmonic. */
class HarmonicEvaluator {
  private readonly alpha: number;
  private readonly beta: number;
  private readonly start: number;
  /** Recurrence coefficients over l = lmin … lLast. */
  private readonly a: Float64Array;
  private readonly b: Float64Array;
  /** Coefficient of v_{lmin + j} in S (zero for l outside the basis). */
  private readonly weights: Float64Array;

  constructor(s: number, m: number, basisL: Float64Array, coefficients: Float64Array) {
    const lmin = lowestL(s, m);
    this.alpha = Math.abs(m + s);
    this.beta = Math.abs(m - s);
    const count = Math.round(basisL[basisL.length - 1] - lmin) + 1;
    this.a = new Float64Array(count);
    this.b = new Float64Array(count);
    this.weights = new Float64Array(count);
    for (let j = 0; j < count; j++) {
      this.a[j] = cosOffDiagonal(lmin + j, m, s);
      this.b[j] = cosDiagonal(lmin + j, m, s);
    }
    for (let i = 0; i < basisL.length; i++) this.weights[Math.round(basisL[i] - lmin)] = coefficients[i];
    // u_lmin = v₀ sin^α(θ/2) cos^β(θ/2), v₀² = (α+β+1)! / (2 α! β!) from ∫ u² dx = 1.
    this.start = Math.exp(
      0.5 * (logFactorial(this.alpha + this.beta + 1) - Math.log(2) - logFactorial(this.alpha) - logFactorial(this.beta)),
    );
  }

  /** V(x) = Σ b_l v_l(x) and V′(x), with v_l = u_l / (sin^α(θ/2) cos^β(θ/2)) polynomials in x. */
  reduced(x: number): { V: number; dV: number } {
    const { a, b, weights } = this;
    let vPrev = 0,
      v = this.start,
      dvPrev = 0,
      dv = 0;
    let V = weights[0] * v;
    let dV = 0;
    for (let j = 0; j + 1 < weights.length; j++) {
      const aPrev = j > 0 ? a[j - 1] : 0;
      const vNext = ((x - b[j]) * v - aPrev * vPrev) / a[j];
      const dvNext = ((x - b[j]) * dv + v - aPrev * dvPrev) / a[j];
      vPrev = v;
      v = vNext;
      dvPrev = dv;
      dv = dvNext;
      V += weights[j + 1] * v;
      dV += weights[j + 1] * dv;
    }
    return { V, dV };
  }

  evaluate(theta: number): { S: number; dS: number } {
    const { alpha, beta } = this;
    const half = 0.5 * theta;
    const sh = Math.sin(half);
    const ch = Math.cos(half);
    const x = Math.cos(theta);
    const { V, dV } = this.reduced(x);
    const w = Math.pow(sh, alpha) * Math.pow(ch, beta);
    // dw/dθ written without cot/tan so that it is finite at the poles.
    let dw = 0;
    if (alpha > 0) dw += 0.5 * alpha * Math.pow(sh, alpha - 1) * Math.pow(ch, beta + 1);
    if (beta > 0) dw -= 0.5 * beta * Math.pow(sh, alpha + 1) * Math.pow(ch, beta - 1);
    return { S: w * V, dS: dw * V - Math.sin(theta) * w * dV };
  }
}

/** Sign that makes the reduced S positive at θ = 0 (see SpheroidalHarmonic). */
function phaseSign(evaluator: HarmonicEvaluator, nodes: number): number {
  const north = evaluator.reduced(1).V;
  const south = evaluator.reduced(-1).V;
  if (Math.abs(north) >= Math.abs(south)) return north >= 0 ? 1 : -1;
  const southSign = south >= 0 ? 1 : -1;
  return nodes % 2 === 0 ? southSign : -southSign;
}

function checkTheta(theta: number): void {
  if (typeof theta !== 'number' || !(theta >= 0 && theta <= Math.PI + 1e-12)) {
    throw new InputError('theta', '0 ≤ θ ≤ π', theta);
  }
}

/**
 * The harmonic S_{slm}(θ; c) for real c with its eigenvalue: the solve of
 * `spheroidalEigenvalue` (same problem, options, diagnostics and errors) plus
 * the expansion coefficients and S, dS/dθ at any θ ∈ [0, π].
 */
export function spheroidalHarmonic(problem: SpheroidalProblem, options?: SpheroidalOptions): SpheroidalHarmonic {
  const { result, spectral } = solveMode(problem, options);
  const { s, l, m } = result;
  let basisL: Float64Array;
  let coefficients: Float64Array;
  if (!spectral) {
    basisL = Float64Array.of(l);
    coefficients = Float64Array.of(1);
  } else {
    const { band, vector } = spectral;
    basisL = new Float64Array(band.size);
    for (let i = 0; i < band.size; i++) basisL[i] = band.lFirst + band.stride * i;
    coefficients = Float64Array.from(vector);
  }
  let evaluator = new HarmonicEvaluator(s, m, basisL, coefficients);
  if (spectral) {
    const sign = phaseSign(evaluator, l - lowestL(s, m));
    if (sign < 0) {
      for (let i = 0; i < coefficients.length; i++) coefficients[i] = -coefficients[i];
      evaluator = new HarmonicEvaluator(s, m, basisL, coefficients);
    }
  }
  const ev = evaluator;
  return {
    ...result,
    basisL,
    coefficients,
    evaluate(theta: number) {
      checkTheta(theta);
      return ev.evaluate(theta);
    },
    sample(thetas: ArrayLike<number>) {
      const n = thetas.length;
      const S = new Float64Array(n);
      const dS = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        checkTheta(thetas[i]);
        const r = ev.evaluate(thetas[i]);
        S[i] = r.S;
        dS[i] = r.dS;
      }
      return { S, dS };
    },
  };
}
