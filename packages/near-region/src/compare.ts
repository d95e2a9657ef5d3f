/**
 * The near-region form against the exact greybody factor of @penumbra/flux:
 * one call gives the two-temperature quantities, both Γ and their ratio.
 */
import { validateOptions, validateTolerance, type Diagnostics } from '@penumbra/core';
import { greybody, type GreybodyDiagnostics, type GreybodyProblem } from '@penumbra/flux';
import { formOf, type NearRegionForm } from './form.js';
import { checkNearRegionProblem } from './problem.js';

/** Options of the comparison; unknown keys are refused. */
export interface NearRegionComparisonOptions {
  /** requested relative accuracy of the exact Γ (default 1e-8, range 1e-12 … 1e-2) */
  tol?: number;
}

/** How the comparison was made: the exact solve's diagnostics, and its error as the error of the ratio. */
export interface NearRegionDiagnostics extends Diagnostics {
  /** diagnostics of the exact greybody solve */
  greybody: GreybodyDiagnostics;
}

/** The near-region form, the exact Γ and their ratio for one mode. */
export interface NearRegionComparison extends NearRegionForm {
  /** the exact greybody factor (0 when it underflows; see log10Gamma) */
  gamma: number;
  /** log10 |Γ| of the exact solve (absent at k = 0 exactly) */
  log10Gamma?: number;
  /** Γ_near / Γ; NaN at k = 0 exactly for bosons, where both vanish */
  ratio: number;
  /** k = ω − mΩ_H */
  k: number;
  /** estimated relative error of the exact Γ, hence of the ratio */
  relError: number;
  diagnostics: NearRegionDiagnostics;
}

/**
 * Compare the near-region form with the exact greybody factor for one mode of
 * a hole with 0 < a ≤ 0.9999 M and 1e-5 ≤ Mω ≤ 30 (the solver's ranges).
 * Throws InputError for a bad problem or option (a = 0 and a < 0 included),
 * ConvergenceError if the exact solve misses its tolerance.
 *
 * @example compareNearRegion({ hole: { a: 0.5 }, mode: { field: { spin: 0 }, l: 1, m: 1 }, omega: 1e-3 }).ratio
 */
export function compareNearRegion(problem: GreybodyProblem, options?: NearRegionComparisonOptions): NearRegionComparison {
  const checked = checkNearRegionProblem(problem, 0.9999);
  const { tol } = validateOptions<NearRegionComparisonOptions>(options, { tol: validateTolerance });
  const exact = greybody(
    {
      hole: { a: checked.a, mass: checked.mass },
      mode: { field: { spin: checked.spin }, l: checked.l, m: checked.m },
      omega: checked.omega,
    },
    { tol, reflection: false },
  );
  const form = formOf(checked);
  return {
    ...form,
    gamma: exact.gamma,
    ...(exact.log10Gamma === undefined ? {} : { log10Gamma: exact.log10Gamma }),
    ratio: ratioOf(form, exact.log10Gamma),
    k: exact.k,
    relError: exact.relError,
    diagnostics: {
      method: `near-region form (analytic) against ${exact.diagnostics.method}`,
      steps: exact.diagnostics.steps,
      rhsEvaluations: exact.diagnostics.rhsEvaluations,
      errorEstimate: exact.relError,
      message: `ratio carries the exact solve's relative error ${exact.relError.toExponential(2)}`,
      greybody: exact.diagnostics,
    },
  };
}

/**
 * Γ_near/Γ from the logarithms, so that it survives when both underflow. Both
 * carry the sign of k (n₊ = 2Mr₊k/(r₊ − r₋) in the form), so the ratio is positive.
 */
function ratioOf(form: NearRegionForm, log10Gamma: number | undefined): number {
  if (form.log10GammaNearRegion === undefined || log10Gamma === undefined) return Number.NaN;
  return 10 ** (form.log10GammaNearRegion - log10Gamma);
}
