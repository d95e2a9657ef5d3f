import type { Diagnostics } from '@penumbra/core';

/**
 * Work counted across one solve, all attempts included: `evaluations` are
 * matrix evaluations (an LDLᵀ factorisation of K − σI, real or complex, or a
 * dense eigen-solve of K) plus continued-fraction evaluations. It becomes
 * the `rhsEvaluations` of the diagnostics.
 */
export interface Tally {
  evaluations: number;
}

/**
 * Full diagnostics for a ConvergenceError: the work spent, no usable error
 * estimate (Infinity), and the solver's own fields.
 */
export function failureDiagnostics<E extends object>(
  method: string,
  message: string,
  steps: number,
  rhsEvaluations: number,
  extra: E,
): Diagnostics & E {
  return { ...extra, method, steps, rhsEvaluations, errorEstimate: Infinity, message };
}
