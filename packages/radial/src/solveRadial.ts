/**
 * One-sided route: the ingoing-at-horizon solution is started from its
 * Frobenius series at x0 = r0 − r+ inside the series' disc of convergence,
 * integrated outward in r, and matched at r_match to the in/out asymptotic
 * series at infinity. For s > 0 the ingoing amplitude Z_in dominates at
 * infinity, so it is extracted without cancellation even when Γ ~ 1e-30; near
 * the horizon, though, that solution is the dominant one, so errors can be
 * amplified (docs/method.md, section 4): `solveTwoSided` avoids that.
 */
import { InputError } from '@penumbra/core';
import type { KerrHole } from '@penumbra/kerr';
import { singleSolveErrorEstimate, singleSolveMessage } from './diagnostics.js';
import { chooseMatch, farTarget, matchAmplitudes } from './farMatch.js';
import { horizonWavenumber } from './horizonSeries.js';
import { NEAR_ROUNDING_TOL, startAtHorizon } from './horizonStart.js';
import { fieldMassOf, radialEquation, type RadialMode } from './equation.js';
import { resolveRadialOptions, type RadialOptions, type ResolvedOptions } from './options.js';
import { validateProblem, type RadialProblem } from './problem.js';
import { chargedSteps, integrateHybridLeg } from './hybridLeg.js';
import type { Complex2, RadialSolution } from './solution.js';

function logAbs(z: Complex2): number {
  return Math.log(Math.hypot(z.re, z.im));
}

/**
 * How much the one-sided route can amplify integration errors in Z_in
 * (src/diagnostics.ts): (b x0/M²)^{−s} for s > 0, (|ω| r_match)^{2|s|} for s < 0.
 */
function oneSidedAmplification(hole: KerrHole, s: number, omega: number, x0: number, rMatch: number): number {
  const b = hole.rPlus - hole.rMinus;
  if (s > 0) return Math.max(1, ((b * x0) / (hole.mass * hole.mass)) ** -s);
  if (s < 0) return Math.max(1, (Math.abs(omega) * rMatch) ** (-2 * s));
  return 1;
}

/**
 * One-sided shooting for spin weight s of either sign: horizon series start,
 * integration to r_match, asymptotic match. Throws InputError for bad input
 * or options and ConvergenceError (with full diagnostics) when a series or the
 * integration fails.
 */
export function solveRadial(problem: RadialProblem, options: RadialOptions = {}): RadialSolution {
  const opts = resolveRadialOptions(options);
  const mode = validateProblem(problem);
  const solution = oneSidedChecked(problem.hole, mode, opts);
  const d = solution.diagnostics;
  d.message = singleSolveMessage(d.errorEstimate, d.amplification);
  return solution;
}

/**
 * `solveRadial` for a caller that has checked the mode (as `validateProblem`
 * does) and resolved the options (as `resolveRadialOptions` does): the same
 * solve without re-validating them, and with an empty diagnostics message.
 */
export function oneSidedChecked(hole: KerrHole, mode: RadialMode, opts: ResolvedOptions): RadialSolution {
  const method = `teukolsky-shooting/frobenius-start/asymptotic-match/${opts.integrator}`;
  const equation = radialEquation(hole, mode, hole.rPlus);
  // the default start stays inside the requested radii (the series is not sampled there)
  const start = startAtHorizon(
    hole,
    mode,
    equation,
    opts.startFraction,
    opts.grid.length > 0 ? Math.min(...opts.grid) : undefined,
    opts.tol,
  );
  const match = chooseMatch(
    hole,
    mode,
    opts.matchRadius,
    farTarget(opts.tol, fieldMassOf(mode) > 0),
    opts.tol >= NEAR_ROUNDING_TOL,
  );
  const r0 = hole.rPlus + start.x0;
  if (!(match.r > r0)) throw new InputError('matchRadius', `> start radius ${r0}`, match.r);
  const counter = { evaluations: 0 };
  const y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const seg = integrateHybridLeg(
    {
      hole,
      mode,
      equation,
      y,
      from: r0,
      fromOffset: start.x0,
      to: match.r,
      stops: opts.grid,
      tol: opts.tol,
      integrator: opts.integrator,
      maxSteps: opts.maxSteps,
      variable: opts.variable,
      counter,
      // every leg literal has the same keys in the same order (solveTwoSided.ts, hybridLeg.ts): one shape where legs are read
      logScale: 0,
      method,
    },
    opts.oscillation,
  );
  const { zIn, zOut } = matchAmplitudes(y, match.vin, match.vout);
  const farTruncation = Math.max(match.vin.truncation, match.vout.truncation);
  const amplification = oneSidedAmplification(hole, mode.s, mode.omega, start.x0, match.r);
  const errorEstimate = singleSolveErrorEstimate({
    steps: chargedSteps(seg),
    tol: opts.tol,
    horizonTruncation: start.truncation,
    farTruncation,
    amplification,
  });
  return {
    zIn,
    zOut,
    logScale: seg.logScale,
    logAbsZIn: logAbs(zIn) + seg.logScale,
    logAbsZOut: logAbs(zOut) + seg.logScale,
    k: horizonWavenumber(hole, mode),
    samples: seg.samples,
    diagnostics: {
      method,
      steps: seg.steps,
      rhsEvaluations: counter.evaluations,
      errorEstimate,
      // worded by the public route (greybody words its own: formatting it per solve was measured at ~1 %)
      message: '',
      integrator: opts.integrator,
      tol: opts.tol,
      startRadius: r0,
      matchRadius: match.r,
      horizonTerms: start.terms,
      horizonTruncation: start.truncation,
      farTerms: Math.max(match.vin.terms, match.vout.terms),
      farTruncation,
      rescalings: seg.rescalings,
      amplification,
      localErrorSum: seg.errorSum,
      riccatiSteps: seg.riccatiSteps,
    },
  };
}
