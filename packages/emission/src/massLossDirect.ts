/**
 * f(M, a*) and g(M, a*) computed on demand, without tables: one
 * emissionTotals solve per distinct (field spin, Mμ) of the content, Mμ =
 * G M m/(ħ c). The reference the tables of massLoss.ts are checked against.
 */
import {
  InputError,
  MAX_SOLVER_A_RATIO,
  isFunction,
  requireFinite,
  validateOptions,
  validateTolerance,
  type Diagnostics,
} from '@penumbra/core';
import { FIELD_MASS_PER_GRAM_GEV, checkSpecies, type EmittedSpecies } from './massLoss.js';
import { emissionTotals } from './totals.js';
import { requireProblem } from './validate.js';

/** A content, a hole mass in grams and a*. */
export interface MassLossAtProblem {
  readonly species: readonly EmittedSpecies[];
  readonly massGrams: number;
  readonly aStar: number;
}

/** Options of massLossAt; unknown keys are refused. */
export interface MassLossAtOptions {
  /** relative accuracy of each totals solve (default 1e-4, range 1e-12 … 1e-2) */
  tol?: number;
  /** called after each solve */
  onSolve?: (done: number, total: number) => void;
}

/** How f and g were computed; `errorEstimate` is the relative error of f. */
export interface MassLossAtDiagnostics extends Diagnostics {
  /** greybody solves */
  gammaCalls: number;
  /** emissionTotals solves (distinct spin and Mμ) */
  solves: number;
}

/** f and g at one (M, a*), with the species' shares and errors. */
export interface MassLossAt {
  massGrams: number;
  aStar: number;
  f: number;
  g: number;
  /** relative error estimates of f and g */
  fRelError: number;
  gRelError: number;
  /** per species: Mμ, dof·P̂ (share of f) and dof·Ĵ/a* (share of g; at a* = 0 not computed, 0) */
  species: { name: string; fieldMass: number; power: number; torqueOverA: number }[];
  diagnostics: MassLossAtDiagnostics;
}

const OPTIONS = { tol: validateTolerance, onSolve: isFunction<(done: number, total: number) => void> };

/**
 * f(M, a*) and g(M, a*) of a content at one hole mass (grams) and a*, by
 * direct emissionTotals solves (seconds per massive species). g is not
 * computed at a* = 0 (it is a limit there; use massLossRates). Throws
 * InputError for bad input, ConvergenceError as emissionTotals.
 *
 * @example massLossAt({ species: [{ name: 'electron', spin: 0.5, dof: 4, massGeV: 0.000511 }], massGrams: 1e16, aStar: 0.3 }, { tol: 1e-3 })
 */
export function massLossAt(problem: MassLossAtProblem, options?: MassLossAtOptions): MassLossAt {
  const p = requireProblem(problem, ['species', 'massGrams', 'aStar']);
  const species = checkSpecies(p.species, [0, 0.5, 1]);
  const massGrams = requireFinite('massGrams', p.massGrams, 'a hole mass in grams > 0');
  if (!(massGrams > 0 && massGrams < 1e60)) throw new InputError('massGrams', 'a hole mass in grams from 0 to 1e60', massGrams);
  const aStar = requireFinite('aStar', p.aStar);
  if (!(aStar >= 0 && aStar <= MAX_SOLVER_A_RATIO)) throw new InputError('aStar', `0 ≤ a* ≤ ${MAX_SOLVER_A_RATIO}`, aStar);
  const { tol = 1e-4, onSolve } = validateOptions<MassLossAtOptions>(options, OPTIONS);
  const fieldMass = (s: EmittedSpecies) => s.massGeV * massGrams * FIELD_MASS_PER_GRAM_GEV;
  // above Mμ ≈ 3 every rate is below e^{−75} of the massless one at any a* ≤ 0.99: not solved, 0
  const key = (s: EmittedSpecies) => `${s.spin}:${fieldMass(s) > 3 ? 'heavy' : fieldMass(s)}`;
  const distinct = [...new Map(species.map((s) => [key(s), s])).values()];
  const results = new Map<
    string,
    { power: number; torque: number; pErr: number; jErr: number; calls: number; steps: number; rhs: number }
  >();
  distinct.forEach((s, i) => {
    const mu = fieldMass(s);
    if (mu > 3) results.set(key(s), { power: 0, torque: 0, pErr: 0, jErr: 0, calls: 0, steps: 0, rhs: 0 });
    else {
      const r = emissionTotals({ hole: { a: aStar }, field: mu > 0 ? { spin: s.spin, mass: mu } : { spin: s.spin } }, { tol });
      results.set(key(s), {
        power: r.power.value,
        torque: r.torque.value,
        pErr: r.power.absError,
        jErr: r.torque.absError,
        calls: r.diagnostics.gammaCalls,
        steps: r.diagnostics.steps,
        rhs: r.diagnostics.rhsEvaluations,
      });
    }
    onSolve?.(i + 1, distinct.length);
  });
  let f = 0;
  let g = 0;
  let fErr = 0;
  let gErr = 0;
  const rows = species.map((s) => {
    const r = results.get(key(s))!;
    const power = s.dof * r.power;
    const torqueOverA = aStar > 0 ? (s.dof * r.torque) / aStar : 0;
    f += power;
    g += torqueOverA;
    fErr += s.dof * r.pErr;
    gErr += aStar > 0 ? (s.dof * r.jErr) / aStar : 0;
    return { name: s.name, fieldMass: fieldMass(s), power, torqueOverA };
  });
  const all = [...results.values()];
  const sum = (k: 'calls' | 'steps' | 'rhs') => all.reduce((t, r) => t + r[k], 0);
  const fRelError = f > 0 ? fErr / f : 0;
  return {
    massGrams,
    aStar,
    f,
    g,
    fRelError,
    gRelError: g > 0 ? gErr / g : 0,
    species: rows,
    diagnostics: {
      method: 'emissionTotals per distinct field spin and Mμ, weighted by the degrees of freedom',
      steps: sum('steps'),
      rhsEvaluations: sum('rhs'),
      errorEstimate: fRelError,
      message: `${distinct.length} totals solve(s) for ${species.length} species; relative error of f ${fRelError.toExponential(2)}`,
      gammaCalls: sum('calls'),
      solves: distinct.length,
    },
  };
}
