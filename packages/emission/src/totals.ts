/**
 * Total emission rates per degree of freedom: number rate dN/dt, power dE/dt
 * and torque dJ/dt, as Σ_{l,m} ∫_0^∞ dω of the mode rates (docs/emission.md).
 *
 * The sum and the integral are swapped: each mode is integrated on its own
 * (modeIntegral.ts), so every greybody solve is spent where that mode
 * matters, and dJ/dt = Σ m N_{lm} needs no extra solves. Whole modes with
 * mΩ_H < 0 are skipped when their Boltzmann bound from ω = 0 is below
 * tolerance. l-truncation: core's l-shell rule (sumLShellVectors) on the
 * number and energy rates of each shell, from l = s upward, stopping after two
 * shells that each add less than tol/5 of the running totals; the dropped tail
 * is bounded by S_last·q/(1 − q) per quantity (shells fall geometrically once
 * the barrier top l/b exceeds the thermal range). m-truncation (a ≠ 0): modes
 * are taken co-rotating first (m = l, l − 1, …); once a mode adding less
 * than tol/100 has fallen at least twofold from the one before, the rest of
 * the shell is bounded by the continued geometric series and not solved.
 * Each mode's greybody solves get the accuracy its predicted share of the
 * totals needs (modePlan), not a fixed tol/5.
 */
import {
  ConvergenceError,
  TOLERANCE_RANGE,
  isFunction,
  sumLShellVectors,
  validateField,
  validateHole,
  validateOptions,
  validateTolerance,
  type Diagnostics,
  type Field,
  type Hole,
} from '@penumbra/core';
import { requireMassiveRoute, solutionField, type EmittedField } from './massiveField.js';
import { boltzmannTailBound, modeContext, shellMs, torqueTailBound, type ModeContext } from './modes.js';
import {
  emptyAccumulator,
  integrateMode,
  type ModeTargets,
  type ModeTotal,
  type TotalsAccumulator,
  type Triple,
} from './modeIntegral.js';
import { checkMaxL, maxLOption, requireProblem } from './validate.js';

/** A field on a hole: the totals are summed over all of its modes. */
export interface TotalsProblem {
  readonly hole: Hole;
  readonly field: Field;
}

/** Options of emissionTotals; unknown keys are refused. */
export interface TotalsOptions {
  /** requested relative accuracy of the number rate and the power (default 1e-6; 1e-12 … 1e-2) */
  tol?: number;
  /** largest l before the shell sum counts as not converged (default 60, at most 100) */
  maxL?: number;
  /** progress: called after each integrated mode */
  onMode?: (mode: ModeTotal) => void;
}

/** A value with its error estimate. */
export interface EstimatedValue {
  value: number;
  /** estimated relative error (quadrature + greybody errors + truncation bounds) */
  relError: number;
  absError: number;
}

/** How totals were computed; `errorEstimate` is the larger relative error of number rate and power. */
export interface TotalsDiagnostics extends Diagnostics {
  tol: number;
  /** largest l summed */
  lMax: number;
  modesIntegrated: number;
  modesSkipped: number;
  /** greybody solves */
  gammaCalls: number;
  /** quadrature panels */
  panels: number;
  /** absolute error parts for numberRate / power / torque (unit-mass hole) */
  quadratureError: Triple;
  greybodyError: Triple;
  truncationBound: Triple;
  /** runs (each later one with ten times tighter inner tolerances) */
  attempts: number;
}

/** Number rate, power and torque per degree of freedom of one field on one hole. */
export interface EmissionTotals {
  hole: { a: number; mass: number };
  /** the field; `mass` (Mμ) only for a massive field */
  field: EmittedField;
  /** set when Γ is approximated rather than solved exactly (a massive vector on Kerr, a ≠ 0): which approximation */
  approximation?: string;
  /** dN/dt per degree of freedom, geometric units (∝ 1/M) */
  numberRate: EstimatedValue;
  /** dE/dt per degree of freedom, geometric units (∝ 1/M²) */
  power: EstimatedValue;
  /** dJ/dt per degree of freedom, geometric units (ħ = 1, ∝ 1/M); positive: the hole loses J along its spin */
  torque: EstimatedValue;
  diagnostics: TotalsDiagnostics;
  /** every integrated mode (unit-mass hole) */
  modes: ModeTotal[];
}

/** Validators of the totals options, shared by contentTotals. */
export const TOTALS_OPTIONS = {
  tol: validateTolerance,
  maxL: maxLOption,
  onMode: isFunction<(mode: ModeTotal) => void>,
};

const METHOD =
  'per-mode adaptive nested-Fejér integrals of Γ·occupation/2π (Γ to each mode’s share of the tolerance), summed over whole l-shells with geometric tail bounds';

/** The predicted size of a mode: its number and energy rates. */
type ModeSize = Pick<ModeTotal, 'number' | 'energy'>;

/**
 * How to integrate a mode predicted to be about as large as `like` (a neighbour summed before it, or
 * the geometric continuation of the two before it):
 * its relative accuracy is its quadrature target over that size; its greybody solves get half of it,
 * within [baseTol, 1e-2] (baseTol: a fifth of the totals' tolerance); its initial panels follow from it.
 * A mode larger than predicted is caught after its integral (integrateMode), which then integrates it
 * again with tighter solves.
 */
function modePlan(
  like: ModeSize | undefined,
  leading: boolean,
  tolN: number,
  tolE: number,
  tolRel: number,
  baseTol: number,
): Pick<ModeTargets, 'greybodyTol' | 'panels'> {
  if (!like || !(like.number > 0) || !(like.energy > 0)) return { greybodyTol: baseTol, panels: 'thermal' };
  const rel = Math.min(Math.max(tolN, tolRel * like.number) / like.number, Math.max(tolE, tolRel * like.energy) / like.energy);
  const greybodyTol = Math.min(Math.max(0.5 * rel, baseTol), TOLERANCE_RANGE.max);
  // Thermal breaks pay where a leading mode is wanted accurately; a mode wanted to 10 % needs one panel.
  const panels = leading && rel < 1e-4 ? 'thermal' : rel < 0.1 ? 'threshold' : 'single';
  return { greybodyTol, panels };
}

/** One shell's m-modes (co-rotating first), with the Boltzmann skip and the geometric m-truncation. */
function shellTotals(
  ctx: ModeContext,
  l: number,
  tol: number,
  modeAbs: number,
  modeRel: number,
  acc: TotalsAccumulator,
  state: { first: boolean; shellLeads: ModeTotal[] },
  baseTol: number,
  onMode?: (m: ModeTotal) => void,
): number[] {
  // The size a new mode is predicted to have: the previous shell's leading mode for m = l; the previous
  // m of this shell for m = l − 1; from m = l − 2 on, the previous m times its fall from the one before
  // (counter-rotating modes fall geometrically in m, ever faster), so that negligible modes are planned
  // as such. A prediction only sets the initial panels and the greybody accuracy: each mode is still
  // integrated to its own targets, and a Γ error larger than its share is caught (integrateMode).
  const predictor = (a: TotalsAccumulator, i: number): ModeSize | undefined => {
    if (i === 0) return state.shellLeads[state.shellLeads.length - 1];
    const last = a.modes[a.modes.length - 1];
    if (i === 1) return last;
    const prev = a.modes[a.modes.length - 2];
    const fall = (x: number, y: number) => (x > 0 && y > x ? x / y : 1);
    return { number: last.number * fall(last.number, prev.number), energy: last.energy * fall(last.energy, prev.energy) };
  };
  const { ms, weight } = shellMs(ctx, l);
  let sN = 0;
  let sE = 0;
  for (let i = 0; i < ms.length; i++) {
    const m = ms[i];
    const tolN = state.first ? 0 : modeAbs * acc.v[0];
    const tolE = state.first ? 0 : modeAbs * acc.v[1];
    if (!state.first && m * ctx.hole.omegaH < 0) {
      // k > 0 at every ω: Γ ≤ 1, and later m (more counter-rotating) are smaller still.
      const b = boltzmannTailBound(ctx, m, 0);
      const rest = ms.length - i;
      if (weight * rest * b.number <= 0.01 * tolN && weight * rest * b.energy <= 0.01 * tolE) {
        acc.t[0] += weight * rest * b.number;
        acc.t[1] += weight * rest * b.energy;
        acc.t[2] += weight * rest * l * b.number;
        sN += weight * rest * b.number;
        sE += weight * rest * b.energy;
        acc.skipped += rest;
        break;
      }
    }
    const plan = modePlan(predictor(acc, i), i === 0, tolN, tolE, modeRel, baseTol);
    const mode = integrateMode(ctx, l, m, weight, { tolN, tolE, tolRel: modeRel, ...plan }, acc, onMode);
    state.first = false;
    if (i === 0) state.shellLeads.push(mode);
    sN += mode.number;
    sE += mode.energy;
    // m-truncation (a ≠ 0): counter-rotating modes fall geometrically in m, ever faster;
    // once a mode below tol/100 has fallen at least twofold from the one before, bound the rest of
    // the shell by the geometric series of that ratio.
    const j = acc.modes.length;
    if (i >= 1 && i + 1 < ms.length) {
      const last = acc.modes[j - 1];
      const prev = acc.modes[j - 2];
      const tiny = (x: ModeTotal) => x.number <= 0.01 * tol * acc.v[0] && x.energy <= 0.01 * tol * acc.v[1];
      if (tiny(last) && last.number <= 0.5 * prev.number && last.energy <= 0.5 * prev.energy) {
        const rest = ms.length - i - 1;
        const series = (x: number, y: number) => {
          const q = x / y;
          return (x * q * (1 - Math.pow(q, rest))) / (1 - q);
        };
        const bN = series(last.number, prev.number);
        const bE = series(last.energy, prev.energy);
        acc.t[0] += bN;
        acc.t[1] += bE;
        acc.t[2] += l * bN;
        sN += bN;
        sE += bE;
        acc.skipped += rest;
        break;
      }
    }
  }
  return [sN, sE];
}

/** Totals of the unit-mass hole of `ctx`; inner tolerances scaled by `looseness` (1, 0.1, 0.01). */
function totalsUnit(ctx: ModeContext, tol: number, maxL: number, looseness: number, onMode?: (m: ModeTotal) => void) {
  const acc = emptyAccumulator();
  const modeRel = 0.2 * tol * looseness;
  const modeAbs = 0.05 * tol * looseness;
  const state = { first: true, shellLeads: [] as ModeTotal[] };
  const baseTol = Math.max(0.2 * tol * looseness, TOLERANCE_RANGE.min);
  const summed = sumLShellVectors(
    ctx.spin,
    {
      // No frequency, so no geometric-optics cut: the thermal factor ends the sum.
      lCut: -Infinity,
      tol: 0.2 * tol,
      maxL,
      lMinToStop: ctx.spin + 1,
      context: () => ({ ...ctx.counters, spin: ctx.spin, aStar: ctx.aStar, numberRate: acc.v[0], power: acc.v[1] }),
    },
    (l) => shellTotals(ctx, l, tol, modeAbs, modeRel, acc, state, baseTol, onMode),
    'emission totals l-sum',
  );
  const lastN = summed.shells[summed.shells.length - 1].sums[0];
  const truncation: Triple = [summed.tailBounds[0], summed.tailBounds[1], torqueTailBound(lastN, summed.q[0], summed.lMax)];
  for (let i = 0; i < 3; i++) acc.t[i] += truncation[i];
  return { acc, lMax: summed.lMax };
}

/**
 * Number rate, power and torque per degree of freedom of a field emitted by a
 * hole of mass M (geometric, default 1) and spin parameter a. A massive field
 * (mass Mμ, spin 0, 1/2 or 1) is emitted only above its threshold ω > μ; a
 * massive vector on a spinning hole uses the approximation named in the
 * solution's `approximation` (docs/emission.md). Throws
 * InputError for a bad problem or option, ConvergenceError (with diagnostics)
 * if the number rate or power misses `tol` after three runs.
 *
 * @example emissionTotals({ hole: { a: 0.5 }, field: { spin: '1/2' } }, { tol: 1e-4 })
 */
export function emissionTotals(problem: TotalsProblem, options?: TotalsOptions): EmissionTotals {
  const p = requireProblem(problem, ['hole', 'field']);
  const field = validateField(p.field, 'field');
  const { a, mass } = validateHole(p.hole, 'hole');
  requireMassiveRoute(field);
  const { spin } = field;
  const { tol = 1e-6, maxL = 60, onMode } = validateOptions<TotalsOptions>(options, TOTALS_OPTIONS);
  checkMaxL(maxL, spin);
  const aStar = Math.abs(a) / mass;
  // Γ to a fifth of the requested accuracy to start with (each mode sets its own, totalsUnit).
  const ctx = modeContext(spin, aStar, Math.max(tol / 5, TOLERANCE_RANGE.min), field.mass);
  let looseness = 1;
  for (let attempt = 1; ; attempt++) {
    const { acc, lMax } = totalsUnit(ctx, tol, maxL, looseness, onMode);
    const absErr = [0, 1, 2].map((i) => acc.q[i] + acc.g[i] + acc.t[i]);
    const rel = absErr.map((e, i) => (i === 2 && aStar === 0 ? 0 : e / Math.abs(acc.v[i])));
    // The torque of a slowly spinning hole is a small difference of co- and counter-rotating
    // sums: its relative error (reported) grows like tol/a*, so it does not gate convergence.
    const converged = rel[0] <= tol && rel[1] <= tol;
    const errorEstimate = Math.max(rel[0], rel[1]);
    const diagnostics: TotalsDiagnostics = {
      method: METHOD,
      steps: ctx.counters.steps,
      rhsEvaluations: ctx.counters.rhsEvaluations,
      errorEstimate,
      message: converged
        ? `converged: relative error ${errorEstimate.toExponential(2)} (number rate, power) after ${attempt} run(s), l ≤ ${lMax}`
        : `relative error ${errorEstimate.toExponential(2)} > tol ${tol} after ${attempt} runs`,
      tol,
      lMax,
      modesIntegrated: acc.modes.length,
      modesSkipped: acc.skipped,
      gammaCalls: ctx.counters.gammaCalls,
      panels: acc.panels,
      quadratureError: acc.q,
      greybodyError: acc.g,
      truncationBound: acc.t,
      attempts: attempt,
    };
    if (converged || attempt >= 3) {
      if (!converged) {
        throw new ConvergenceError('emission totals did not reach the requested accuracy', {
          ...diagnostics,
          spin,
          fieldMass: field.mass,
          a,
          relError: rel,
        });
      }
      const sign = a < 0 ? -1 : 1;
      const ev = (i: number, scale: number, s = 1): EstimatedValue => ({
        value: (s * acc.v[i]) / scale,
        relError: rel[i],
        absError: absErr[i] / scale,
      });
      const { field: emitted, approximation } = solutionField(field, aStar);
      return {
        hole: { a, mass },
        field: emitted,
        ...(approximation ? { approximation } : {}),
        numberRate: ev(0, mass),
        power: ev(1, mass * mass),
        torque: aStar === 0 ? { value: 0, relError: 0, absError: 0 } : ev(2, mass, sign),
        diagnostics,
        modes: acc.modes,
      };
    }
    looseness /= 10;
  }
}
