/**
 * Far-zone matching: choose the matching radius where both asymptotic series
 * converge, and split the integrated solution there into its ingoing and
 * outgoing amplitudes.
 */
import type { KerrHole } from '@penumbra/kerr';
import { ConvergenceError } from '@penumbra/core';
import { NEAR_ROUNDING_TOL } from './horizonStart.js';
import { farSeries, farValue, farWavenumber, sumFarInto, type FarSums, type FarValue } from './farSeries.js';
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

/** The sums a search holds at once (its rung, and a bisection's trial), reused: `chooseMatch` runs to completion without re-entering itself. */
const sums: FarSums[] = Array.from({ length: 4 }, () => ({ S: [0, 0], T: [0, 0], terms: 0, truncation: 1, converged: false }));

/**
 * The far-series convergence asked of a solve at integrator tolerance `tol`:
 * tol itself, between 1e-17 and 1e-11 (a massive field, or a tolerance
 * below NEAR_ROUNDING_TOL: 1e-3 tol, between 1e-17 and 1e-14, as before).
 * The truncation enters the error estimate beside the integration error
 * (diagnostics.ts; flux charges it five times), and the series converges at
 * smaller ωr the looser the target, so fewer integration steps lie between
 * the barrier and the match (measured at greybody's default tol 1e-8, with
 * the lower ladder start and the refinement of `chooseMatch`: about 17 %
 * fewer right-hand-side evaluations over random massless modes, Γ moved by
 * at most 3e-11; bench/floor.bench.mjs). Near the rounding floor the tighter
 * target and the earlier ladder keep the tight estimates where they were
 * (bench/estimate.bench.mjs at tol 1e-10). A massive field's far zone beyond
 * k∞r ≈ 20 is crossed by Riccati steps, which the long-range phase makes
 * cheaper there than the series (packages/radial/test/riccati.test.ts).
 */
export function farTarget(tol: number, massive = false): number {
  return massive || tol < NEAR_ROUNDING_TOL
    ? Math.min(1e-14, Math.max(1e-17, 1e-3 * tol))
    : Math.min(1e-11, Math.max(1e-17, tol));
}
const LADDER_RATIO = 1.25;
/** Halvings (in ln r) of the last ladder rung: the radius found is within 1.25^(1/8) ≈ 1.03 of the smallest that converges. */
const REFINEMENTS = 3;
/**
 * A massless field's ladder starts at LADDER_START / ω (with 6M and r+ + 4M;
 * it was 20/ω): where the series converges there is decided by the series
 * alone. A massive field, and any field near the rounding floor, keeps 20/k∞
 * and the bare ladder (see farTarget).
 */
const LADDER_START = 4;
const LADDER_START_MASSIVE = 20;

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
 * The smallest radius on a geometric ladder from max(6M, r+ + 4M, 4/ω)
 * (20/k∞ for a massive field, k∞ = √(ω² − μ²)) where both asymptotic series converge to `target`
 * (three successive terms below it, relative to the sum; default 1e-17),
 * brought in by bisecting the last rung in ln r (with `wide` false, from
 * 20/k∞ and without the bisection, as before); or exactly `fixed`, if given.
 */
export function chooseMatch(hole: KerrHole, mode: RadialMode, fixed?: number, target = 1e-17, wide = true): FarMatch {
  const inSeries = farSeries(hole, mode, -1);
  const outSeries = farSeries(hole, mode, 1);
  const M = hole.mass;
  const { kInf, beta } = farWavenumber(hole, mode);
  const lowStart = wide && beta === 0;
  const start = lowStart ? LADDER_START : LADDER_START_MASSIVE;
  let r = fixed ?? Math.max(6 * M, hole.rPlus + 4 * M, start / Math.abs(kInf));
  for (let attempt = 0; ; attempt++) {
    const last = fixed !== undefined || attempt + 1 >= LADDER_STEPS;
    // the sums decide (the outgoing one only where the ingoing one converged, or for the diagnostics of a
    // failure); the phase factors are computed only where both converged (the same values)
    let sin = sumFarInto(inSeries, r, target, sums[0]);
    if (sin.converged || last) {
      let sout = sumFarInto(outSeries, r, target, sums[1]);
      if (sin.converged && sout.converged) {
        if (fixed === undefined && attempt > 0 && lowStart) {
          // the rung below failed: bisect (r/1.25, r] in ln r, keeping a radius where both converge
          let lo = r / LADDER_RATIO;
          let min = sums[2],
            mout = sums[3];
          for (let i = 0; i < REFINEMENTS; i++) {
            const mid = Math.sqrt(lo * r);
            sumFarInto(inSeries, mid, target, min);
            if (min.converged && sumFarInto(outSeries, mid, target, mout).converged) {
              r = mid;
              [sin, min] = [min, sin];
              [sout, mout] = [mout, sout];
            } else lo = mid;
          }
        }
        return { r, vin: farValue(hole, inSeries, r, sin), vout: farValue(hole, outSeries, r, sout) };
      }
      if (last) {
        const vin = farValue(hole, inSeries, r, sin);
        const vout = farValue(hole, outSeries, r, sout);
        if (fixed !== undefined)
          throw seriesFailure('far-zone series do not converge at the requested matching radius', r, vin, vout);
        throw seriesFailure('far-zone series did not converge at any matching radius tried', r, vin, vout);
      }
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
