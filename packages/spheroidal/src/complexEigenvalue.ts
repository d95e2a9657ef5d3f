/**
 * The complex-c driver: continue the real-c eigenpair at Re c to c along the
 * path c(t) = Re c + i t Im c on the complex band (complexBand.ts), then
 * certify the end point with Leaver's continued fraction (complexLeaver.ts).
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { basisLayout } from './band.js';
import { buildComplexBand, complexRqi, overlap, type ComplexPair } from './complexBand.js';
import type { ComplexValue } from './complexArithmetic.js';
import { leaverRootComplex } from './complexLeaver.js';
import {
  type ComplexSpheroidalOptions,
  type ComplexSpheroidalProblem,
  validateComplexOptions,
  validateComplexProblem,
} from './complexProblem.js';
import { failureDiagnostics, type Tally } from './diagnostics.js';
import { solveMode } from './eigenvalue.js';
import { lowestL, sphericalA0 } from './quantum.js';
import { estimateSize } from './spectral.js';

/** How a complex-c eigenvalue was obtained (core's Diagnostics plus the path and check details). */
export interface ComplexSpheroidalDiagnostics extends Diagnostics {
  method: 'spectral-complex+leaver';
  /** Complex Rayleigh-quotient iterations along the accepted path plus Newton steps on the continued fraction. */
  steps: number;
  /**
   * Matrix and continued-fraction evaluations, all attempts included: the
   * real-c start's (see SpheroidalDiagnostics), one complex LDLᵀ
   * factorisation per Rayleigh-quotient iteration (rejected path steps too),
   * and one per continued-fraction evaluation.
   */
  rhsEvaluations: number;
  /**
   * Relative error estimate of A (scaled by max(1, |A|)): the larger of the
   * continued-fraction agreement and the residual bound of the spectral pair.
   * Against 30-digit values the spectral value is ~1e-15, so this is an upper
   * estimate (docs/spheroidal.md).
   */
  errorEstimate: number;
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
  /** Depth reached by the continued fraction. */
  continuedFractionDepth: number;
  /** |A_Leaver − A_spectral| / max(1, |A|). */
  agreement: number;
  /** ‖K b − A b‖ / ‖K‖ of the spectral eigenpair (unconjugated, complex symmetric). */
  residual: number;
}

/** The solution of a complex-c problem: the problem's numbers, A, E and diagnostics. */
export interface ComplexSpheroidalEigenvalue {
  s: number;
  l: number;
  m: number;
  c: ComplexValue;
  /** Angular separation constant A_{slm}(c), continued from the real axis. */
  A: ComplexValue;
  /** E = A + s(s + 1). */
  E: ComplexValue;
  diagnostics: ComplexSpheroidalDiagnostics;
}

/** Continued fraction and spectral values must agree this well (relative to max(1, |A|)). */
const COMPLEX_AGREEMENT_LIMIT = 1e-10;
const METHOD = 'spectral-complex+leaver';

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
 * fraction is the independent check, as for real c). Throws InputError for a
 * bad problem or options (outside the range included) and ConvergenceError
 * (with full diagnostics) on failure.
 */
export function spheroidalEigenvalueComplex(
  problem: ComplexSpheroidalProblem,
  options?: ComplexSpheroidalOptions,
): ComplexSpheroidalEigenvalue {
  const { s, l, m, c } = validateComplexProblem(problem);
  validateComplexOptions(options);
  const real = solveMode({ s, l, m, c: c.re }, { continuation: false });
  const tally: Tally = { evaluations: real.result.diagnostics.rhsEvaluations };
  const { lFirst, stride, index } = basisLayout(s, l, m);
  const absC = Math.hypot(c.re, c.im);
  const coldGuess = sphericalA0(s, l) - 0.5 * absC * absC;
  let size = Math.max(estimateSize(s, m, absC, lFirst, stride, index, coldGuess), index + 3, real.spectral?.band.size ?? 0);
  let spectralIterations = 0;
  const fail = (message: string, detail: string, extra: object) =>
    new ConvergenceError(
      message,
      failureDiagnostics(METHOD, detail, spectralIterations, tally.evaluations, { s, l, m, c, size, ...extra }),
    );

  for (let growth = 0; growth < 4; growth++) {
    let pair: ComplexPair;
    spectralIterations = 0;
    let pathSteps = 0;
    let norm: number;
    {
      const band = buildComplexBand(s, m, c.re, 0, lFirst, stride, size);
      norm = band.norm;
      const xr = new Float64Array(size);
      if (real.spectral) xr.set(real.spectral.vector.subarray(0, Math.min(size, real.spectral.vector.length)));
      else xr[index] = 1;
      const start = complexRqi(band, { re: real.result.A, im: 0 }, xr, new Float64Array(size), tally);
      if (!start)
        throw fail('complex spectral start at Re c failed', 'Rayleigh-quotient iteration did not settle in 12 steps', {});
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
      const next = complexRqi(band, guess, pair.xr, pair.xi, tally);
      const predictionError = next ? Math.hypot(next.A.re - guess.re, next.A.im - guess.im) : Infinity;
      const stepSize = Math.abs(dc) * Math.max(1, Math.hypot(pair.slope.re, pair.slope.im));
      if (
        !next ||
        overlap(size, pair.xr, pair.xi, next.xr, next.xi) < 0.95 ||
        predictionError > 0.5 * stepSize + 1e-12 * band.norm
      ) {
        dt /= 2;
        if (dt < 1e-6)
          throw fail('complex-c continuation stalled (branch point near the path?)', `path step below 1e-6 at t = ${t}`, {
            t,
            pathSteps,
          });
        continue;
      }
      pair = next;
      norm = band.norm;
      spectralIterations += next.iterations;
      pathSteps++;
      t = tNext;
      dt = Math.min(dt * 1.5, 0.25 / Math.max(Math.abs(c.im), 1e-300));
    }
    // Truncation check on the eigenvector's tail, as for real c.
    const tail =
      stride === 1
        ? Math.max(Math.hypot(pair.xr[size - 1], pair.xi[size - 1]), Math.hypot(pair.xr[size - 2], pair.xi[size - 2]))
        : Math.hypot(pair.xr[size - 1], pair.xi[size - 1]);
    if (tail > 1e-16) {
      size = Math.ceil(size * 1.5) + 8;
      continue;
    }

    const sigma: 1 | -1 = c.re > 0 ? -1 : 1;
    const root = leaverRootComplex(s, m, c, pair.A, l - lowestL(s, m), sigma, tally);
    const agreement = Math.hypot(root.A.re - pair.A.re, root.A.im - pair.A.im) / Math.max(1, Math.hypot(pair.A.re, pair.A.im));
    const residualBound = (Math.max(pair.residual, 4 * Number.EPSILON) * norm) / Math.max(1, Math.hypot(pair.A.re, pair.A.im));
    const diagnostics: ComplexSpheroidalDiagnostics = {
      method: METHOD,
      steps: spectralIterations + root.iterations,
      rhsEvaluations: tally.evaluations,
      errorEstimate: Math.max(agreement, residualBound),
      message: `converged: continued from the real axis in ${pathSteps} steps; Leaver's continued fraction agrees to ${agreement.toExponential(1)}`,
      truncation: size,
      pathSteps,
      spectralIterations,
      newtonIterations: root.iterations,
      lastNewtonStep: root.lastStep,
      continuedFractionDepth: root.depth,
      agreement,
      residual: pair.residual,
    };
    if (!root.converged) {
      throw new ConvergenceError('Newton on the complex Leaver continued fraction did not converge', {
        s,
        l,
        m,
        c,
        ...diagnostics,
        errorEstimate: Infinity,
        message: `Newton did not converge in ${root.iterations} steps`,
      });
    }
    if (!(agreement <= COMPLEX_AGREEMENT_LIMIT)) {
      throw new ConvergenceError('complex continued fraction and spectral eigenvalues disagree', {
        s,
        l,
        m,
        c,
        ...diagnostics,
        message: `agreement ${agreement.toExponential(1)} above ${COMPLEX_AGREEMENT_LIMIT}`,
      });
    }
    // The spectral value is the result: against 30-digit values it is at
    // rounding level, while the continued fraction loses ~e^{2|Im c|}ε to
    // cancellation (docs/spheroidal.md). At Im c = 0 it is the real-c value itself.
    const result = c.im === 0 ? { re: real.result.A, im: 0 } : pair.A;
    const shift = s * (s + 1);
    return { s, l, m, c, A: result, E: { re: result.re + shift, im: result.im }, diagnostics };
  }
  throw fail('complex spectral expansion did not converge', 'eigenvector tail above 1e-16 after 4 truncations', {});
}
