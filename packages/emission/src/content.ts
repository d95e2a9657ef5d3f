/**
 * Totals over a particle content: per-degree-of-freedom totals of each
 * distinct (field spin, Mμ) that appears, times each species' degrees of
 * freedom (docs/emission.md, "Content totals").
 *
 * A species' Mμ = G·M·m/(ħc) follows from the hole's physical mass
 * (`physicalMass`, CODATA 2018 through @penumbra/kerr). Rules, each reported in
 * the species row's `status`:
 * - confinement (common practice, no source): quarks and gluons are emitted as
 *   free partons only when T_H > `confinementScaleGeV` (default 0.3 GeV), the
 *   pions only when T_H ≤ it;
 * - a species with Mμ ≤ MASSLESS_PROXY_MAX_MU takes the massless per-dof
 *   totals with a measured relative bound added to its error, and so does one
 *   with Mμ ≤ MASSLESS_PROXY_RANGE_MAX whose bound (times its massless
 *   emission) is below tol/10 of the running total;
 * - a species whose geometric-optics Boltzmann bound (speciesBounds.ts) is
 *   below tol/100 of the running total is not solved: the bound is its error.
 */
import {
  InputError,
  isFunction,
  numberIn,
  validateHole,
  validateOptions,
  type Diagnostics,
  type FieldSpin,
  type Hole,
} from '@penumbra/core';
import { kerrHole, requirePhysicalMass, unitScales } from '@penumbra/kerr';
import { MOMEGA_RANGE } from '@penumbra/flux';
import { emissionTotals, TOTALS_OPTIONS, type EmissionTotals, type EstimatedValue, type TotalsOptions } from './totals.js';
import { resolveContent, type Species, type SpeciesSpec } from './species.js';
import { boltzmannSpeciesBound, MASSLESS_PROXY_MAX_MU, MASSLESS_PROXY_RANGE_MAX, masslessProxyBound } from './speciesBounds.js';
import { requireProblem } from './validate.js';
import { checkPhysicalMass, type PhysicalMass } from './physicalMass.js';

export type { PhysicalMass } from './physicalMass.js';

/**
 * A hole and the species it emits (default: photons, gravitons, three
 * neutrino species). `physicalMass` is required when a species has a mass or
 * a confinement role: it sets every Mμ and the temperature in GeV.
 */
export interface ContentProblem {
  readonly hole: Hole;
  readonly content?: readonly SpeciesSpec[];
  readonly physicalMass?: PhysicalMass;
}

/** Options of contentTotals: those of emissionTotals, the confinement scale, and progress per solve. */
export interface ContentOptions extends TotalsOptions {
  /** called after each per-dof solve (a distinct field spin and Mμ) with that solve's field spin and the count of solves so far (twice: the total is not known ahead) */
  onSpin?: (spin: FieldSpin, done: number, total: number) => void;
  /** T_H above which quarks and gluons are emitted and below which pions are, in GeV (default 0.3; common practice, no source) */
  confinementScaleGeV?: number;
}

/** How a species entered the totals. */
export type SpeciesStatus =
  /** solved per dof (massless, or massive with its exact or named approximate Γ) */
  | 'solved'
  /** Mμ ≤ MASSLESS_PROXY_MAX_MU: massless per-dof totals, the measured bound in the error */
  | 'massless-limit'
  /** not solved: the Boltzmann bound is its error */
  | 'boltzmann-negligible'
  /** a parton at T_H ≤ the confinement scale, or a pion above it: not emitted */
  | 'confinement';

/** One species' share of the totals (all its degrees of freedom, geometric units as ContentTotals). */
export interface SpeciesTotals extends Species {
  /** Mμ for this hole (0 when massless or without a physical mass) */
  fieldMass: number;
  status: SpeciesStatus;
  /** totals for all dof of this species (per-dof totals × dof) */
  numberRate: number;
  power: number;
  torque: number;
  /** absolute error bounds of the three, all dof */
  errors: { numberRate: number; power: number; torque: number };
  /** the approximation used for Γ, if any (a massive vector on a spinning hole) */
  approximation?: string;
}

/** How content totals were computed: the per-dof solves added up; `errorEstimate` is the larger relative error of number rate and power. */
export interface ContentDiagnostics extends Diagnostics {
  /** greybody solves, all per-dof totals */
  gammaCalls: number;
  /** the hole's temperature in GeV (when a physical mass was given) */
  temperatureGeV?: number;
  /** the confinement scale used, GeV */
  confinementScaleGeV: number;
}

/** Totals over a particle content. */
export interface ContentTotals {
  hole: { a: number; mass: number };
  /** the physical mass, when given */
  physicalMass?: PhysicalMass;
  species: SpeciesTotals[];
  numberRate: EstimatedValue;
  power: EstimatedValue;
  torque: EstimatedValue;
  /** per-dof totals of each distinct (field spin, Mμ) solved */
  perDof: EmissionTotals[];
  /** the approximations used by any species (empty when every Γ is exact) */
  approximations: string[];
  diagnostics: ContentDiagnostics;
}

/** Default confinement scale, GeV (common practice, no source: "a few hundred MeV"). */
export const DEFAULT_CONFINEMENT_SCALE_GEV = 0.3;

const OPTIONS = {
  ...TOTALS_OPTIONS,
  onSpin: isFunction<(spin: FieldSpin, done: number, total: number) => void>,
  confinementScaleGeV: numberIn(1e-3, 1e3),
};

function combine(parts: { value: number; absError: number }[]): EstimatedValue {
  const value = parts.reduce((s, p) => s + p.value, 0);
  const absError = parts.reduce((s, p) => s + p.absError, 0);
  return { value, absError, relError: value !== 0 ? absError / Math.abs(value) : 0 };
}

type Triple3 = { numberRate: number; power: number; torque: number };
const KEYS = ['numberRate', 'power', 'torque'] as const;

/**
 * Number rate, power and torque of a hole summed over a particle content,
 * with per-species rows. Throws InputError for an unknown species or bad
 * input (a massive or QCD species without `physicalMass`, naming it),
 * ConvergenceError as emissionTotals does.
 *
 * @example contentTotals({ hole: { a: 0.5 }, content: ['standard-model'], physicalMass: { value: 1e15, unit: 'g' } }, { tol: 1e-3 })
 */
export function contentTotals(problem: ContentProblem, options?: ContentOptions): ContentTotals {
  const p = requireProblem(problem, ['hole', 'content', 'physicalMass']);
  const species = resolveContent(p.content as readonly SpeciesSpec[] | undefined);
  const hole = validateHole(p.hole, 'hole');
  const physicalMass = checkPhysicalMass(p.physicalMass);
  const {
    onSpin,
    confinementScaleGeV = DEFAULT_CONFINEMENT_SCALE_GEV,
    ...totalsOptions
  } = validateOptions<ContentOptions>(options, OPTIONS);
  const tol = totalsOptions.tol ?? 1e-6;
  const aStar = Math.abs(hole.a) / hole.mass;
  const M = hole.mass;
  // GeV per geometric energy unit 1/M of the physical hole; T_H of the unit hole is in units of 1/M.
  const gevPerUnit = physicalMass ? unitScales(requirePhysicalMass(physicalMass.value, physicalMass.unit)).GeV : undefined;
  const temperatureGeV = gevPerUnit === undefined ? undefined : kerrHole({ a: aStar, mass: 1 }).temperature * gevPerUnit;
  species.forEach((s, i) => {
    if (gevPerUnit === undefined && (s.massGeV > 0 || s.qcd)) {
      throw new InputError(
        'physicalMass',
        `the hole's physical mass { value, unit } (content[${i}] = ${s.name} has a mass or a confinement role)`,
        undefined,
      );
    }
  });

  const perDof = new Map<string, EmissionTotals>();
  const order: string[] = [];
  const solvePerDof = (spin: FieldSpin, fieldMass: number, speciesTol = tol): EmissionTotals => {
    const key = `${spin}:${fieldMass}`;
    let r = perDof.get(key);
    if (!r) {
      const field = fieldMass > 0 ? { spin, mass: fieldMass } : { spin };
      r = emissionTotals({ hole, field }, { ...totalsOptions, tol: speciesTol });
      perDof.set(key, r);
      order.push(key);
      onSpin?.(spin, order.length, order.length);
    }
    return r;
  };
  const zero = (): Triple3 => ({ numberRate: 0, power: 0, torque: 0 });
  const rows: SpeciesTotals[] = species.map((s) => ({
    ...s,
    fieldMass: gevPerUnit === undefined ? 0 : s.massGeV / gevPerUnit,
    status: 'solved',
    ...zero(),
    errors: zero(),
  }));
  const fill = (row: SpeciesTotals, r: EmissionTotals, extraRel = 0) => {
    for (const k of KEYS) {
      row[k] = row.dof * r[k].value;
      row.errors[k] = row.dof * (r[k].absError + extraRel * Math.abs(r[k].value));
    }
    if (r.approximation) row.approximation = r.approximation;
  };
  const running = () => rows.reduce((s, r) => s + r.power, 0);
  const runningNumber = () => rows.reduce((s, r) => s + r.numberRate, 0);

  // Confinement first; then massless and nearly massless species; then massive ones, lightest first,
  // so that the running total that decides a Boltzmann skip only grows.
  const massive: SpeciesTotals[] = [];
  for (const row of rows) {
    if (row.qcd !== undefined && temperatureGeV !== undefined) {
      const deconfined = temperatureGeV > confinementScaleGeV;
      if ((row.qcd === 'parton') !== deconfined) {
        row.status = 'confinement';
        continue;
      }
    }
    if (row.fieldMass === 0) fill(row, solvePerDof(row.spin, 0));
    else if (row.fieldMass <= MASSLESS_PROXY_MAX_MU) {
      row.status = 'massless-limit';
      fill(row, masslessLimit(row.spin, solvePerDof), masslessProxyBound(row.fieldMass));
    } else massive.push(row);
  }
  massive.sort((x, y) => x.fieldMass - y.fieldMass);
  for (const row of massive) {
    if (row.fieldMass <= MASSLESS_PROXY_RANGE_MAX) {
      // Light enough that the massless limit's bound is below tol/10 of the running total: no solve.
      const limit = masslessLimit(row.spin, solvePerDof);
      const bound = masslessProxyBound(row.fieldMass) * row.dof;
      if (bound * limit.numberRate.value <= 0.1 * tol * runningNumber() && bound * limit.power.value <= 0.1 * tol * running()) {
        row.status = 'massless-limit';
        fill(row, limit, masslessProxyBound(row.fieldMass));
        continue;
      }
    }
    const b = boltzmannSpeciesBound(aStar, row.fieldMass);
    const n = (row.dof * b.number) / M;
    const e = (row.dof * b.power) / (M * M);
    if (n <= 0.01 * tol * runningNumber() && e <= 0.01 * tol * running()) {
      row.status = 'boltzmann-negligible';
      row.errors = { numberRate: n, power: e, torque: (row.dof * b.torque) / M };
      continue;
    }
    if (row.fieldMass >= MOMEGA_RANGE.max) {
      throw new InputError(
        'physicalMass',
        `a hole light enough that ${row.name} has Mμ < ${MOMEGA_RANGE.max}, or one where its emission is Boltzmann-negligible`,
        physicalMass,
        `${row.name}: Mμ = ${row.fieldMass} is beyond the greybody solvers' range and its Boltzmann bound is not negligible at a* = ${aStar}`,
      );
    }
    // A species far below the running total needs less relative accuracy: its Boltzmann bound is
    // above its emission, so tol·(running/bound) relative keeps its error below tol of the total.
    const share = Math.min(n > 0 ? runningNumber() / n : Infinity, e > 0 ? running() / e : Infinity);
    const speciesTol = Math.min(Math.max(tol, tol * share), 1e-2);
    fill(row, solvePerDof(row.spin, row.fieldMass, speciesTol));
  }

  const part = (k: (typeof KEYS)[number]) => combine(rows.map((r) => ({ value: r[k], absError: r.errors[k] })));
  const numberRate = part('numberRate');
  const power = part('power');
  const errorEstimate = Math.max(numberRate.relError, power.relError);
  const solved = order.map((k) => perDof.get(k)!);
  const sum = (key: 'steps' | 'rhsEvaluations' | 'gammaCalls') => solved.reduce((s, r) => s + r.diagnostics[key], 0);
  const approximations = [...new Set(rows.flatMap((r) => (r.approximation ? [r.approximation] : [])))];
  return {
    hole,
    ...(physicalMass ? { physicalMass } : {}),
    species: rows,
    numberRate,
    power,
    torque: part('torque'),
    perDof: solved,
    approximations,
    diagnostics: {
      method:
        'per-degree-of-freedom totals of each distinct field spin and Mμ, weighted by the degrees of freedom of each species; confinement, massless-limit and Boltzmann rules with bounds',
      steps: sum('steps'),
      rhsEvaluations: sum('rhsEvaluations'),
      errorEstimate,
      message: `${species.length} species, ${solved.length} per-dof solve(s); relative error ${errorEstimate.toExponential(2)}`,
      gammaCalls: sum('gammaCalls'),
      ...(temperatureGeV === undefined ? {} : { temperatureGeV }),
      confinementScaleGeV,
    },
  };
}

/** The μ → 0 per-dof totals of a spin: massless, except spin 1 whose longitudinal mode survives ((2 × photon + 1 × scalar)/3). */
function masslessLimit(spin: FieldSpin, solve: (spin: FieldSpin, mass: number) => EmissionTotals): EmissionTotals {
  if (spin !== 1) return solve(spin, 0);
  const t = solve(1, 0);
  const s = solve(0, 0);
  const mix = (k: (typeof KEYS)[number]): EstimatedValue => {
    const value = (2 * t[k].value + s[k].value) / 3;
    const absError = (2 * t[k].absError + s[k].absError) / 3;
    return { value, absError, relError: value !== 0 ? absError / Math.abs(value) : 0 };
  };
  return { ...t, numberRate: mix('numberRate'), power: mix('power'), torque: mix('torque') };
}
