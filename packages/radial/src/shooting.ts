/**
 * The integration loop: carry y = (Re R, Im R, Re R', Im R') outward through
 * the requested radii, renormalising when |R| grows past 1e150 (the equation
 * is linear, so the factor is tracked exactly in logScale).
 *
 * Near extremality the independent variable is x = r − r+, not r: there the
 * solution winds like x^{−ik/2κ} with wavelengths (measured: 1e-7 M at
 * a = 0.99999, Mω = 30) so short that the spacing of doubles near r = r+
 * (2e-16 M) costs the integrator its tolerance (odex stalled at 1e-13);
 * near x = 0 the doubles are dense. Further from extremality the argument
 * stays r, so results there are those of the earlier range unchanged.
 */
import { ConvergenceError } from '@penumbra/core';
import type { KerrHole } from '@penumbra/kerr';
import type { RadialEquation, RadialMode } from './equation.js';
import { NEAR_ROUNDING_TOL } from './horizonStart.js';
import { makeStepper, type IntegratorName } from './integrators.js';
import type { RadialVariable } from './options.js';
import { convertPhase, phaseEquation } from './phaseVariable.js';
import { equationKernel, kernelRhs, type EvaluationCounter } from './rhs.js';
import type { RadialSample } from './solution.js';

/** One outward leg of a solve. */
export interface Leg {
  /** the background */
  hole: KerrHole;
  /** the mode integrated on this leg */
  mode: RadialMode;
  /** the mode's equation about r+ (`radialEquation(hole, mode, hole.rPlus)`) */
  equation: RadialEquation;
  /** the state at `from`, advanced in place to `to` */
  y: Float64Array;
  /** start radius */
  from: number;
  /** from − r+ when known more exactly than the difference (the horizon start's x0) */
  fromOffset?: number;
  /** end radius */
  to: number;
  /** radii at which to record the solution; those outside (from, to] are skipped */
  stops: readonly number[];
  /** local relative tolerance */
  tol: number;
  /** ODE integrator */
  integrator: IntegratorName;
  /** step limit of the leg */
  maxSteps: number;
  /** integrate R, or u = e^{iφ}R */
  variable: RadialVariable;
  /** counts right-hand-side evaluations across the legs of one solve */
  counter: EvaluationCounter;
  /** ln of the scale already taken out of y (default 0) */
  logScale?: number;
  /** the route's method name, for failure diagnostics */
  method: string;
}

/** A sample as integrated: unscaled state, with the log-scale in force when it was taken. */
export interface RawSample {
  /** radius */
  r: number;
  /** (Re R, Im R, Re R', Im R') divided by e^{logScale} */
  y: number[];
  /** ln of the scale taken out of y */
  logScale: number;
}

/** What one leg produced. */
export interface Segment {
  /** ln of the scale taken out of the final state */
  logScale: number;
  /** steps taken */
  steps: number;
  /** sum of the accepted steps' local error estimates relative to tol (1 per step where the integrator reports none) */
  errorSum: number;
  /** renormalisations by 1e-300 */
  rescalings: number;
  /** the solution at the stops inside (from, to] */
  samples: RadialSample[];
  /** the same samples unscaled, with the log-scale in force when each was taken */
  raw: RawSample[];
}

/**
 * Horizon separation r+ − r− (units of M) below which legs are integrated in
 * x = r − r+: 0.02 M is a ≈ 0.99995 M, beyond the earlier limit a = 0.9999 M
 * (r+ − r− = 0.028 M), where the argument r was measured to suffice.
 */
export const X_ARGUMENT_WIDTH = 0.02;

const OVERFLOW = 1e150;
const RESCALE = 1e-300;
const LN_RESCALE = 300 * Math.LN10;

function legFailure(leg: Leg, message: string, steps: number, extra: Record<string, unknown>): ConvergenceError {
  return new ConvergenceError(message, {
    method: leg.method,
    steps,
    rhsEvaluations: leg.counter.evaluations,
    errorEstimate: Infinity,
    message: `${message} (${leg.integrator}, from r = ${leg.from} to ${leg.to})`,
    integrator: leg.integrator,
    from: leg.from,
    to: leg.to,
    ...extra,
  });
}

/** The first trial step of a leg, as a fraction of its start's distance from r+ (at most 1). */
const FIRST_STEP = 0.3;
/** The same below NEAR_ROUNDING_TOL (horizonStart.ts). */
const FIRST_STEP_NEAR_ROUNDING = 0.05;

/** Integrate one leg; y ends as the solution at `leg.to` (divided by e^{logScale}). */
export function integrateLeg(leg: Leg): Segment {
  const { hole, mode, y, from: r0, to: rEnd, stops, maxSteps } = leg;
  const phased = leg.variable === 'phase';
  const eq = leg.equation;
  const inX = hole.rPlus - hole.rMinus < X_ARGUMENT_WIDTH * hole.mass;
  const origin = inX ? hole.rPlus : 0;
  const integrated = phased ? phaseEquation(eq) : eq;
  // One packing of the coefficients serves both: 'gbs' reads the kernel inline, the others call the right-hand side.
  const packed = equationKernel(integrated, leg.counter, origin);
  const rhs = kernelRhs(packed);
  const kernel = leg.integrator === 'gbs' ? packed : undefined;
  const stepper = makeStepper({
    integrator: leg.integrator,
    rhs,
    tol: leg.tol,
    rPlus: hole.rPlus - origin,
    maxSteps,
    kernel,
    method: leg.method,
    counter: leg.counter,
    origin,
  });
  if (phased) convertPhase(hole, mode, eq, r0, y, 1);
  let logScale = leg.logScale ?? 0;
  let rescalings = 0;
  let steps = 0;
  let errorSum = 0;
  const samples: RadialSample[] = [];
  const raw: RawSample[] = [];
  const targets = [...stops.filter((g) => g > r0 && g < rEnd), rEnd];
  let x = inX ? (leg.fromOffset ?? r0 - origin) : r0;
  let r = r0;
  // first trial step: 0.3 of the distance from r+ (at most 0.3); the step control takes it from there
  // (measured at tol 1e-8 over random modes, against 0.05: 5 % fewer right-hand-side evaluations; 1.0 let
  // first steps through with errors nearer their estimate; bench/floor.bench.mjs); 0.05 near the rounding floor
  let h = (leg.tol < NEAR_ROUNDING_TOL ? FIRST_STEP_NEAR_ROUNDING : FIRST_STEP) * Math.min(inX ? x : r0 - hole.rPlus, 1);
  for (const target of targets) {
    const xTarget = target - origin;
    while (x < xTarget) {
      const adv = stepper.advance(y, x, xTarget, h, OVERFLOW);
      steps += adv.steps;
      errorSum += adv.errorSum ?? adv.steps;
      x = adv.r;
      r = x === xTarget ? target : origin + x;
      h = adv.h;
      if (steps > maxSteps) throw legFailure(leg, 'radial integration exceeded the step limit', steps, { r, maxSteps });
      if (Math.abs(y[0]) + Math.abs(y[1]) > OVERFLOW) {
        for (let i = 0; i < 4; i++) y[i] *= RESCALE;
        logScale += LN_RESCALE;
        rescalings++;
      }
    }
    if (stops.includes(target)) {
      // copied by hand: Array.from on a typed array goes through the iterator (measured at several µs)
      const yr = [y[0], y[1], y[2], y[3]];
      if (phased) convertPhase(hole, mode, eq, target, yr, -1);
      const f = Math.exp(logScale);
      samples.push({ r: target, R: { re: yr[0] * f, im: yr[1] * f }, dR: { re: yr[2] * f, im: yr[3] * f } });
      raw.push({ r: target, y: yr, logScale });
    }
  }
  if (phased) convertPhase(hole, mode, eq, rEnd, y, -1);
  if (!y.every(Number.isFinite)) throw legFailure(leg, 'radial integration produced non-finite values', steps, { r });
  return { logScale, steps, errorSum, rescalings, samples, raw };
}
