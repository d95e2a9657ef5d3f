/**
 * An integrator's own failure (its step limit, or a breakdown inside the
 * package) as the ConvergenceError of the solve it serves: the integrators
 * throw it where they stop, with the caller's method and evaluation count,
 * so no caller has to translate a bare Error.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import type { IntegratorName } from './integrators.js';
import type { EvaluationCounter } from './rhs.js';

/** What a stepper quotes when it fails, given by its caller. */
export interface FailureContext {
  /** the caller's method, in words */
  method: string;
  /** the counter its right-hand side increments (all legs of the solve) */
  counter: EvaluationCounter;
  /** the integrator's argument is r − origin */
  origin: number;
}

/** Diagnostics of an integrator failure. */
export interface StepperFailureDiagnostics extends Diagnostics {
  /** which integrator stopped */
  integrator: IntegratorName;
  /** the radius it reached */
  r: number;
  /** its step limit per advance */
  maxSteps: number;
}

/** `integrator` stopped with `what` (e.g. "exceeded its step limit of 100 steps") after `steps` steps of one advance, at argument `x`. */
export function stepperFailure(
  context: FailureContext,
  integrator: IntegratorName,
  what: string,
  steps: number,
  x: number,
  maxSteps: number,
): ConvergenceError<StepperFailureDiagnostics> {
  const r = context.origin + x;
  const message = `${integrator} ${what} at r = ${r}`;
  return new ConvergenceError(message, {
    method: context.method,
    steps,
    rhsEvaluations: context.counter.evaluations,
    errorEstimate: Infinity,
    message,
    integrator,
    r,
    maxSteps,
  });
}
