/**
 * Totals over a particle content: per-degree-of-freedom totals of each field
 * spin that appears (one emissionTotals solve per spin), times each species'
 * degrees of freedom.
 */
import { isFunction, validateHole, validateOptions, type Diagnostics, type FieldSpin, type Hole } from '@penumbra/core';
import { emissionTotals, TOTALS_OPTIONS, type EmissionTotals, type EstimatedValue, type TotalsOptions } from './totals.js';
import { resolveContent, type Species, type SpeciesSpec } from './species.js';
import { requireProblem } from './validate.js';

/** A hole and the species it emits (default: photons, gravitons, three neutrino species). */
export interface ContentProblem {
  readonly hole: Hole;
  readonly content?: readonly SpeciesSpec[];
}

/** Options of contentTotals: those of emissionTotals, plus progress per field spin. */
export interface ContentOptions extends TotalsOptions {
  /** called after each field spin's totals */
  onSpin?: (spin: FieldSpin, done: number, total: number) => void;
}

/** One species' share of the totals. */
export interface SpeciesTotals extends Species {
  /** totals for all dof of this species (per-dof totals × dof) */
  numberRate: number;
  power: number;
  torque: number;
}

/** How content totals were computed: the per-spin solves added up; `errorEstimate` is the larger relative error of number rate and power. */
export interface ContentDiagnostics extends Diagnostics {
  /** greybody solves, all spins */
  gammaCalls: number;
}

/** Totals over a particle content. */
export interface ContentTotals {
  hole: { a: number; mass: number };
  species: SpeciesTotals[];
  numberRate: EstimatedValue;
  power: EstimatedValue;
  torque: EstimatedValue;
  /** per-dof totals for each field spin that appears */
  perDof: EmissionTotals[];
  diagnostics: ContentDiagnostics;
}

const OPTIONS = { ...TOTALS_OPTIONS, onSpin: isFunction<(spin: FieldSpin, done: number, total: number) => void> };

function combine(parts: { value: number; absError: number }[]): EstimatedValue {
  const value = parts.reduce((s, p) => s + p.value, 0);
  const absError = parts.reduce((s, p) => s + p.absError, 0);
  return { value, absError, relError: value !== 0 ? absError / Math.abs(value) : 0 };
}

/**
 * Number rate, power and torque of a hole summed over a particle content.
 * Throws InputError for an unknown species or bad input, ConvergenceError as
 * emissionTotals does.
 *
 * @example contentTotals({ hole: { a: 0.5 }, content: ['photon', 'graviton'] }, { tol: 1e-3 })
 */
export function contentTotals(problem: ContentProblem, options?: ContentOptions): ContentTotals {
  const p = requireProblem(problem, ['hole', 'content']);
  const species = resolveContent(p.content as readonly SpeciesSpec[] | undefined);
  const hole = validateHole(p.hole, 'hole');
  const { onSpin, ...totalsOptions } = validateOptions<ContentOptions>(options, OPTIONS);
  const spins = [...new Set(species.map((s) => s.spin))];
  const perDof = spins.map((spin, i) => {
    const r = emissionTotals({ hole, field: { spin } }, totalsOptions);
    onSpin?.(spin, i + 1, spins.length);
    return r;
  });
  const bySpin = new Map(perDof.map((r) => [r.field.spin, r]));
  const rows: SpeciesTotals[] = species.map((s) => {
    const r = bySpin.get(s.spin)!;
    return { ...s, numberRate: s.dof * r.numberRate.value, power: s.dof * r.power.value, torque: s.dof * r.torque.value };
  });
  const part = (key: 'numberRate' | 'power' | 'torque') =>
    combine(
      species.map((s) => ({
        value: s.dof * bySpin.get(s.spin)![key].value,
        absError: s.dof * bySpin.get(s.spin)![key].absError,
      })),
    );
  const numberRate = part('numberRate');
  const power = part('power');
  const errorEstimate = Math.max(numberRate.relError, power.relError);
  const sum = (key: 'steps' | 'rhsEvaluations' | 'gammaCalls') => perDof.reduce((s, r) => s + r.diagnostics[key], 0);
  return {
    hole,
    species: rows,
    numberRate,
    power,
    torque: part('torque'),
    perDof,
    diagnostics: {
      method: 'per-degree-of-freedom totals of each field spin, weighted by the degrees of freedom of each species',
      steps: sum('steps'),
      rhsEvaluations: sum('rhsEvaluations'),
      errorEstimate,
      message: `${species.length} species, ${spins.length} field spin(s); relative error ${errorEstimate.toExponential(2)}`,
      gammaCalls: sum('gammaCalls'),
    },
  };
}
