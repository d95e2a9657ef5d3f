/**
 * Two-sided route for s > 0 (docs/method.md, section 4): the −|s| field is
 * integrated from the horizon, where its ingoing solution is the one that
 * grows outward (stable), to the far zone, giving Y_out without cancellation;
 * at a switching radius it is mapped by D^{2s} to the +|s| field, which is
 * integrated outward to give Z_in without cancellation. Neither end asks for
 * a subdominant solution.
 */
import { InputError } from '@penumbra/core';
import type { KerrHole } from '@penumbra/kerr';
import { singleSolveErrorEstimate, singleSolveMessage } from './diagnostics.js';
import { radialEquation, type RadialEquation, type RadialMode } from './equation.js';
import { chooseMatch, farTarget, matchAmplitudes } from './farMatch.js';
import { horizonSeriesStart, horizonWavenumber } from './horizonSeries.js';
import { NEAR_ROUNDING_TOL, startAtHorizon } from './horizonStart.js';
import { resolveTwoSidedOptions, type ResolvedOptions, type TwoSidedOptions } from './options.js';
import { validateProblem, type RadialProblem } from './problem.js';
import { chargedSteps, integrateHybridLeg } from './hybridLeg.js';
import type { Leg, RawSample } from './shooting.js';
import type { Complex2, RadialSample, TwoSidedSolution } from './solution.js';
import { applyStarobinskyMap, starobinskyHorizonFactor, starobinskyMapAt } from './starobinskyMap.js';

function logAbs(z: Complex2): number {
  return Math.log(Math.hypot(z.re, z.im));
}

const NO_AMPLITUDE: Complex2 = { re: Number.NaN, im: Number.NaN };

/** The default switching radius: beyond the near-horizon zone (a few b, at least M) but well inside the matching radius. */
function defaultSwitchRadius(hole: KerrHole, r0: number, rMatch: number): number {
  const b = hole.rPlus - hole.rMinus;
  return Math.min(hole.rPlus + Math.max(hole.mass, 2 * b), (r0 + rMatch) / 2);
}

/**
 * The two-sided route for s > 0: Z_in of the +s field and Y_out of the −s
 * field, each read where it dominates; `lambda` is λ of the +s field.
 * Throws InputError for bad input or options and ConvergenceError (with full
 * diagnostics) when a series or an integration fails.
 */
export function solveTwoSided(problem: RadialProblem, options: TwoSidedOptions = {}): TwoSidedSolution {
  const opts = resolveTwoSidedOptions(options);
  const mode = validateProblem(problem);
  const solution = twoSidedChecked(problem.hole, mode, opts);
  const d = solution.diagnostics;
  d.message = singleSolveMessage(d.errorEstimate, d.amplification);
  return solution;
}

/**
 * `solveTwoSided` for a caller that has checked the mode (as `validateProblem`
 * does) and resolved the options (as `resolveTwoSidedOptions` does): the same
 * solve without re-validating them, and with an empty diagnostics message (measured: the checks were several % of a
 * greybody factor).
 */
export function twoSidedChecked(hole: KerrHole, plus: RadialMode, opts: ResolvedOptions): TwoSidedSolution {
  const { s } = plus;
  if (!(s > 0)) throw new InputError('s', 's > 0 for the two-sided route', s);
  const minus: RadialMode = { s: -s, m: plus.m, omega: plus.omega, lambda: plus.lambda + 2 * s };
  const method = `teukolsky-two-sided/frobenius-start(−s)/starobinsky-map/asymptotic-match/${opts.integrator}`;
  const minusEquation = radialEquation(hole, minus, hole.rPlus);
  // a switching radius given without a start fraction keeps the default start inside it
  const start = startAtHorizon(hole, minus, minusEquation, opts.startFraction, opts.switchRadius, opts.tol);
  const r0 = hole.rPlus + start.x0;
  // The −s field is matched only for Y_out (the reflection).
  const matchMinus = opts.reflection
    ? chooseMatch(hole, minus, opts.matchRadius, farTarget(opts.tol), opts.tol >= NEAR_ROUNDING_TOL)
    : null;
  const matchPlus = chooseMatch(hole, plus, opts.matchRadius, farTarget(opts.tol), opts.tol >= NEAR_ROUNDING_TOL);
  const rSwitch = opts.switchRadius ?? defaultSwitchRadius(hole, r0, matchPlus.r);
  if (!(rSwitch > r0 && rSwitch < matchPlus.r)) {
    throw new InputError('switchRadius', `between the start ${r0} and the matching radius ${matchPlus.r}`, rSwitch);
  }
  const grid = opts.grid;
  // Radii inside the start point are evaluated from the horizon series itself.
  const series = grid.filter((g) => g > hole.rPlus && g <= r0);
  const inner = grid.filter((g) => g > r0 && g < rSwitch);
  const outer = grid.filter((g) => g > rSwitch && g <= matchPlus.r);
  if (grid.length !== series.length + inner.length + outer.length + grid.filter((g) => g === rSwitch).length) {
    throw new InputError('grid', `radii within (r+, ${matchPlus.r}] = (${hole.rPlus}, ${matchPlus.r}]`, grid);
  }
  const counter = { evaluations: 0 };
  // Legs are built field by field (object spreads were measured at several µs each).
  const leg = (
    mode: RadialMode,
    equation: RadialEquation,
    y: Float64Array,
    from: number,
    to: number,
    stops: readonly number[],
    logScale = 0,
    fromOffset?: number,
  ): Leg => ({
    hole,
    mode,
    equation,
    y,
    from,
    fromOffset,
    to,
    stops,
    tol: opts.tol,
    integrator: opts.integrator,
    maxSteps: opts.maxSteps,
    variable: opts.variable,
    counter,
    logScale,
    method,
  });

  // −s leg: horizon → switching radius (→ far zone for Y_out).
  const y = new Float64Array([start.R[0], start.R[1], start.dR[0], start.dR[1]]);
  const segMinus = integrateHybridLeg(
    leg(minus, minusEquation, y, r0, matchMinus ? matchMinus.r : rSwitch, [...inner, rSwitch], 0, start.x0),
    opts.oscillation,
  );
  const minusAmps = matchMinus ? matchAmplitudes(y, matchMinus.vin, matchMinus.vout) : { zIn: NO_AMPLITUDE, zOut: NO_AMPLITUDE };

  // Map (R, R') of the −s field to the +s field at the switching radius, then the +s leg to the far zone.
  const atSwitch = segMinus.raw[segMinus.raw.length - 1];
  const rawSwitch = applyStarobinskyMap(starobinskyMapAt(hole, minus, rSwitch), atSwitch.y);
  const yPlus = new Float64Array(rawSwitch);
  const segPlus = integrateHybridLeg(
    // fromOffset given as the legs would compute it (r_sw − r+), so that every leg carries a number there (one shape)
    leg(
      plus,
      radialEquation(hole, plus, hole.rPlus, minusEquation),
      yPlus,
      rSwitch,
      matchPlus.r,
      outer,
      atSwitch.logScale,
      rSwitch - hole.rPlus,
    ),
    opts.oscillation,
  );
  const amp = matchAmplitudes(yPlus, matchPlus.vin, matchPlus.vout);
  const k = horizonWavenumber(hole, plus);
  const h = starobinskyHorizonFactor(hole, s, k);
  const logH = Math.log(Math.hypot(h[0], h[1]));

  // Samples of the normalised +s solution: mapped −s samples inside r_sw, the +s leg outside.
  const hh = h[0] * h[0] + h[1] * h[1];
  const overH = (re: number, im: number, f: number): Complex2 => ({
    re: (f * (re * h[0] + im * h[1])) / hh,
    im: (f * (im * h[0] - re * h[1])) / hh,
  });
  const plusSample = (r: number, yy: ArrayLike<number>, logScale: number): RadialSample => {
    const f = Math.exp(logScale);
    return { r, R: overH(yy[0], yy[1], f), dR: overH(yy[2], yy[3], f) };
  };
  const seriesSamples: RawSample[] = series.map((g) => {
    const st = horizonSeriesStart(hole, minus, g - hole.rPlus, minusEquation);
    return { r: g, y: [st.R[0], st.R[1], st.dR[0], st.dR[1]], logScale: 0 };
  });
  const samples: RadialSample[] = [];
  for (const smp of [...seriesSamples, ...segMinus.raw]) {
    if (smp.r === rSwitch) {
      if (grid.includes(rSwitch)) samples.push(plusSample(rSwitch, rawSwitch, smp.logScale));
      continue;
    }
    samples.push(plusSample(smp.r, applyStarobinskyMap(starobinskyMapAt(hole, minus, smp.r), smp.y), smp.logScale));
  }
  for (const smp of segPlus.raw) samples.push(plusSample(smp.r, smp.y, smp.logScale));

  const horizonTruncation = start.truncation;
  const farTruncation = Math.max(matchMinus ? matchMinus.vout.truncation : 0, matchPlus.vin.truncation);
  const steps = segMinus.steps + segPlus.steps;
  const errorEstimate = singleSolveErrorEstimate({
    steps: chargedSteps(segMinus) + chargedSteps(segPlus),
    tol: opts.tol,
    horizonTruncation,
    farTruncation,
    amplification: 1,
  });
  return {
    logAbsZInPlus: logAbs(amp.zIn) + segPlus.logScale - logH,
    logAbsZOutPlus: logAbs(amp.zOut) + segPlus.logScale - logH,
    logAbsYOutMinus: logAbs(minusAmps.zOut) + segMinus.logScale,
    logAbsYInMinus: logAbs(minusAmps.zIn) + segMinus.logScale,
    samples,
    k,
    switchRadius: rSwitch,
    diagnostics: {
      method,
      steps,
      rhsEvaluations: counter.evaluations,
      errorEstimate,
      // worded by the public route (greybody words its own: formatting it per solve was measured at ~1 %)
      message: '',
      integrator: opts.integrator,
      tol: opts.tol,
      startRadius: r0,
      matchRadius: matchMinus ? Math.max(matchMinus.r, matchPlus.r) : matchPlus.r,
      horizonTerms: start.terms,
      horizonTruncation,
      farTerms: Math.max(
        matchMinus ? Math.max(matchMinus.vin.terms, matchMinus.vout.terms) : 0,
        matchPlus.vin.terms,
        matchPlus.vout.terms,
      ),
      farTruncation,
      rescalings: segMinus.rescalings + segPlus.rescalings,
      amplification: 1,
      localErrorSum: segMinus.errorSum + segPlus.errorSum,
      riccatiSteps: segMinus.riccatiSteps + segPlus.riccatiSteps,
    },
  };
}
