/**
 * The emission spectrum per degree of freedom of one field on a hole, on a
 * frequency grid: problem { hole, field, grid } → emissionSpectrum → solution
 * with diagnostics. Sums are done for the unit-mass hole with a* = |a|/M and
 * rescaled (docs/emission.md); a < 0 flips the sign of the torque.
 */
import {
  MAX_L,
  TOLERANCE_RANGE,
  isFunction,
  requireLShellReach,
  validateField,
  validateHole,
  validateOptions,
  validateTolerance,
  type Diagnostics,
  type Field,
  type FrequencyGrid,
  type Hole,
} from '@penumbra/core';
import { modeContext } from './modes.js';
import { requireMassiveRoute, solutionField, type EmittedField } from './massiveField.js';
import { automaticMaxL } from '@penumbra/flux';
import { spectrumLCut, spectrumPointUnit, type SpectrumPoint } from './spectrumPoint.js';
import { checkMaxL, maxLOption, requireProblem, validateGrid } from './validate.js';

/** A field on a hole and the frequencies (units of 1/M, increasing, Mω ≤ 30) to sample. */
export interface SpectrumProblem {
  readonly hole: Hole;
  readonly field: Field;
  /** frequencies ω in units of 1/M: an increasing array or a FrequencyGrid */
  readonly grid: FrequencyGrid | readonly number[];
}

/** Options of emissionSpectrum; unknown keys are refused. */
export interface SpectrumOptions {
  /** relative accuracy of each point (default 1e-6, range 1e-12 … 1e-2) */
  tol?: number;
  /**
   * largest l allowed before the sum counts as not converged (at most core's
   * MAX_L; default @penumbra/flux's `automaticMaxL` at the highest frequency:
   * its geometric-optics cut plus 20 shells)
   */
  maxL?: number;
  /** called after each frequency (progress reporting) */
  onPoint?: (done: number, total: number) => void;
}

/** How a spectrum was computed; `errorEstimate` is the largest relative error of a point. */
export interface SpectrumDiagnostics extends Diagnostics {
  /** greybody solves */
  gammaCalls: number;
  /** the requested relative accuracy */
  tol: number;
}

/** The spectrum of one field on one hole, per degree of freedom. */
export interface EmissionSpectrum {
  hole: { a: number; mass: number };
  /** the field; `mass` (Mμ) only for a massive field */
  field: EmittedField;
  /** set when Γ is approximated rather than solved exactly (a massive vector on Kerr, a ≠ 0): which approximation */
  approximation?: string;
  /** points at Mω ≤ Mμ (below a massive field's threshold) are zero: nothing reaches infinity there */
  points: SpectrumPoint[];
  diagnostics: SpectrumDiagnostics;
}

const OPTIONS = {
  tol: validateTolerance,
  maxL: maxLOption,
  onPoint: isFunction<(done: number, total: number) => void>,
};

/**
 * The emission spectrum per degree of freedom (d²N/dtdω, d²E/dtdω, d²J/dtdω)
 * on a frequency grid. A massive field (spin 0, 1/2 or 1) is zero at and
 * below its threshold Mω ≤ Mμ; a massive vector on a spinning hole uses the
 * approximation named in `approximation`. Throws InputError for a bad problem or option,
 * ConvergenceError (with diagnostics) if an l-sum or a greybody solve does
 * not converge.
 *
 * @example emissionSpectrum({ hole: { a: 0.9 }, field: { spin: 1 }, grid: [0.1, 0.2, 0.4] }, { tol: 1e-4 })
 */
export function emissionSpectrum(problem: SpectrumProblem, options?: SpectrumOptions): EmissionSpectrum {
  const p = requireProblem(problem, ['hole', 'field', 'grid']);
  const field = validateField(p.field, 'field');
  const { spin, mass: fieldMass } = field;
  const { a, mass } = validateHole(p.hole, 'hole');
  requireMassiveRoute(field);
  const omegas = validateGrid(p.grid, mass);
  const { tol = 1e-6, maxL: givenMaxL, onPoint } = validateOptions<SpectrumOptions>(options, OPTIONS);
  const aStar = Math.abs(a) / mass;
  const top = Math.max(...omegas) * mass;
  const maxL = checkMaxL(givenMaxL ?? automaticMaxL(top, aStar), spin);
  // Every point's l-sum must be able to stop within maxL: refuse the grid before its first point, not at its last.
  requireLShellReach(
    spin,
    { lCut: spectrumLCut(aStar, top), tol, maxL, lMinToStop: spin + 1 },
    `spectrum l-sum at Mω = ${top}`,
    givenMaxL === undefined ? `core's MAX_L = ${MAX_L}, the largest l the solvers take` : 'the maxL option',
  );
  // Γ to a tenth of the point's tolerance, never below the solver's floor.
  const ctx = modeContext(spin, aStar, Math.max(tol / 10, TOLERANCE_RANGE.min), fieldMass);
  const sign = a < 0 ? -1 : 1;
  const points = omegas.map((w, i) => {
    const point =
      w * mass > fieldMass || fieldMass === 0 ? spectrumPointUnit(ctx, w * mass, tol, maxL) : belowThreshold(w * mass);
    onPoint?.(i + 1, omegas.length);
    // Rescale from the unit-mass hole: d²N/dtdω and d²J/dtdω are scale-free (ħ = 1), d²E/dtdω ∝ 1/M.
    return { ...point, omega: w, energy: point.energy / mass, torque: sign * point.torque };
  });
  const errorEstimate = Math.max(...points.map((pt) => pt.relError));
  const { field: emitted, approximation } = solutionField(field, aStar);
  return {
    hole: { a, mass },
    field: emitted,
    ...(approximation ? { approximation } : {}),
    points,
    diagnostics: {
      method: 'Σ over whole l-shells of Γ·occupation/2π, geometric tail and Boltzmann bounds',
      steps: ctx.counters.steps,
      rhsEvaluations: ctx.counters.rhsEvaluations,
      errorEstimate,
      message: `${points.length} frequencies, largest l ${Math.max(...points.map((pt) => pt.lMax))}, largest relative error ${errorEstimate.toExponential(2)}`,
      gammaCalls: ctx.counters.gammaCalls,
      tol,
    },
  };
}

/** A spectrum point below a massive field's threshold (Mω ≤ Mμ): no wave reaches infinity, every rate is 0. */
function belowThreshold(omega: number): SpectrumPoint {
  return { omega, number: 0, energy: 0, torque: 0, relError: 0, droppedBound: 0, torqueDroppedBound: 0, lMax: 0, modes: 0 };
}
