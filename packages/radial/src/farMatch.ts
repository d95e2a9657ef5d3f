/**
 * Far-zone matching: choose the matching radius where both asymptotic series
 * converge, and split the integrated solution there into its ingoing and
 * outgoing amplitudes.
 */
import type { KerrHole } from '@penumbra/kerr';
import { ConvergenceError } from '@penumbra/core';
import { farSeries, farValue, farWavenumber, sumFar, type FarValue } from './farSeries.js';
import type { RadialMode } from './equation.js';
import type { Complex2 } from './solution.js';

/** The matching radius and both far series evaluated there. */
export interface FarMatch {
  /** matching radius */
  r: number;
  /** the ingoing series R_in at r */
  vin: FarValue;
  /** the outgoing series R_out at r */
  vout: FarValue;
}

const LADDER_STEPS = 60;

/**
 * The far-series convergence asked of a solve at integrator tolerance `tol`:
 * 1e-3 tol, between 1e-17 and 1e-14. The truncation enters the error
 * estimate beside the integration error (diagnostics.ts), so a thousand times
 * below the local tolerance it does not show, and the matching radius comes
 * in where the ladder allows it (measured: 10–25 % fewer right-hand-side
 * evaluations above Mω ≈ 0.3 at tol 1e-11 than with 1e-17 throughout;
 * bench/floor.bench.mjs).
 */
export function farTarget(tol: number): number {
  return Math.min(1e-14, Math.max(1e-17, 1e-3 * tol));
}
const LADDER_RATIO = 1.25;

function seriesFailure(message: string, r: number, vin: FarValue, vout: FarValue): ConvergenceError {
  const truncation = Math.max(vin.truncation, vout.truncation);
  return new ConvergenceError(message, {
    method: 'far-zone asymptotic series',
    steps: 0,
    rhsEvaluations: 0,
    errorEstimate: truncation,
    message: `at r = ${r} the series stopped at relative terms ${vin.truncation.toExponential(2)} (in) and ${vout.truncation.toExponential(2)} (out)`,
    matchRadius: r,
    inTruncation: vin.truncation,
    outTruncation: vout.truncation,
  });
}

/**
 * The smallest radius on a geometric ladder from max(6M, r+ + 4M, 20/|k∞|)
 * (k∞ = ω when massless) where both asymptotic series converge to `target`
 * (three successive terms below it, relative to the sum; default 1e-17); or
 * exactly `fixed`, if given.
 */
export function chooseMatch(hole: KerrHole, mode: RadialMode, fixed?: number, target = 1e-17): FarMatch {
  const inSeries = farSeries(hole, mode, -1);
  const outSeries = farSeries(hole, mode, 1);
  const M = hole.mass;
  let r = fixed ?? Math.max(6 * M, hole.rPlus + 4 * M, 20 / Math.abs(farWavenumber(hole, mode).kInf));
  for (let attempt = 0; ; attempt++) {
    // the sums decide; the phase factors are computed only where both converged (the same values)
    const sin = sumFar(inSeries, r, target);
    const sout = sumFar(outSeries, r, target);
    if (sin.converged && sout.converged)
      return { r, vin: farValue(hole, inSeries, r, sin), vout: farValue(hole, outSeries, r, sout) };
    if (fixed !== undefined || attempt + 1 >= LADDER_STEPS) {
      const vin = farValue(hole, inSeries, r, sin);
      const vout = farValue(hole, outSeries, r, sout);
      if (fixed !== undefined)
        throw seriesFailure('far-zone series do not converge at the requested matching radius', r, vin, vout);
      throw seriesFailure('far-zone series did not converge at any matching radius tried', r, vin, vout);
    }
    r *= LADDER_RATIO;
  }
}

/** The two amplitudes at infinity of an integrated solution. */
export interface MatchedAmplitudes {
  /** Z_in, the coefficient of R_in */
  zIn: Complex2;
  /** Z_out, the coefficient of R_out */
  zOut: Complex2;
}

/** Solve R = Z_in R_in + Z_out R_out at the matching radius (2×2 complex system); y = (Re R, Im R, Re R', Im R'). */
export function matchAmplitudes(y: ArrayLike<number>, vin: FarValue, vout: FarValue): MatchedAmplitudes {
  const [ir, ii] = vin.R,
    [idr, idi] = vin.dR,
    [or, oi] = vout.R,
    [odr, odi] = vout.dR;
  const detRe = ir * odr - ii * odi - (idr * or - idi * oi);
  const detIm = ir * odi + ii * odr - (idr * oi + idi * or);
  const numInRe = y[0] * odr - y[1] * odi - (y[2] * or - y[3] * oi);
  const numInIm = y[0] * odi + y[1] * odr - (y[2] * oi + y[3] * or);
  const numOutRe = ir * y[2] - ii * y[3] - (idr * y[0] - idi * y[1]);
  const numOutIm = ir * y[3] + ii * y[2] - (idr * y[1] + idi * y[0]);
  const dd = detRe * detRe + detIm * detIm;
  return {
    zIn: { re: (numInRe * detRe + numInIm * detIm) / dd, im: (numInIm * detRe - numInRe * detIm) / dd },
    zOut: { re: (numOutRe * detRe + numOutIm * detIm) / dd, im: (numOutIm * detRe - numOutRe * detIm) / dd },
  };
}
