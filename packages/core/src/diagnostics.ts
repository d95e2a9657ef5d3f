/**
 * The solve contract: problem → solve(problem, options) → solution.
 *
 * Every solution carries diagnostics extending `Diagnostics`; a solve that did
 * not reach its tolerance throws `ConvergenceError` with them. Batch callers
 * use `attempt` to get a status instead of an exception.
 */
import { ConvergenceError, InputError } from './errors.js';

/** What every solve reports about how it got its answer. */
export interface Diagnostics {
  /** the method that produced the answer, in words */
  method: string;
  /** accepted integration (or iteration) steps */
  steps: number;
  /** right-hand-side (or function) evaluations, all attempts included */
  rhsEvaluations: number;
  /** estimated relative error of the main result (at or above the true error) */
  errorEstimate: number;
  /** a readable one-line account of the outcome */
  message: string;
}

/** Outcome of a solve that does not throw. */
export type Status = 'success' | 'not-converged' | 'invalid-input';

/** A solve's outcome as a value: its solution `S`, or the error it threw, with a one-line message. */
export type Attempt<S> =
  | { status: 'success'; solution: S; message: string }
  | { status: 'not-converged'; error: ConvergenceError; message: string }
  | { status: 'invalid-input'; error: InputError; message: string };

/**
 * Run a solve and report its status instead of throwing for bad input or
 * non-convergence; any other error (a bug) still throws.
 */
export function attempt<S>(solve: () => S): Attempt<S> {
  if (typeof solve !== 'function') throw new InputError('solve', 'a function', solve);
  try {
    return { status: 'success', solution: solve(), message: 'converged' };
  } catch (error) {
    if (error instanceof ConvergenceError) return { status: 'not-converged', error, message: error.message };
    if (error instanceof InputError) return { status: 'invalid-input', error, message: error.message };
    throw error;
  }
}

/** Diagnostics for a result that needed no computation (e.g. an exact value). */
export function exactDiagnostics(method: string, message = 'exact'): Diagnostics {
  if (typeof method !== 'string') throw new InputError('method', 'a string', method);
  if (typeof message !== 'string') throw new InputError('message', 'a string', message);
  return { method, steps: 0, rhsEvaluations: 0, errorEstimate: 0, message };
}
