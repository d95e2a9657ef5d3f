/**
 * Greybody factors of a massive vector (Proca) field on Schwarzschild, for
 * each polarisation (docs/massive-vector.md). Two integrations that differ
 * in start radius, matching radius and step tolerance give the error
 * estimate; the more careful one is returned.
 */
import { ConvergenceError, type Diagnostics } from '@penumbra/core';
import { integrateProca, defaultProcaMatchRadius, farTruncation, tortoiseSpan, type ProcaIntegration } from './integrate.js';
import {
  type ProcaGreybodyOptions,
  type ProcaGreybodyProblem,
  type ProcaPolarization,
  validateProcaOptions,
  validateProcaProblem,
  type ProcaIntegrator,
} from './problem.js';
import { sectorModel, type SectorModel } from './sectors.js';
import { farWaveNumbers, horizonSolution } from './series.js';

/** How a Proca Γ was obtained. */
export interface ProcaGreybodyDiagnostics extends Diagnostics {
  /** accumulation bound of one integration, or the relative difference of Γ between two (start, match radius, step tolerance); floored at 3e-13 */
  errorEstimate: number;
  startRadius: number;
  matchRadius: number;
  seriesTerms: number;
}

/** The greybody factor of one Proca polarisation on Schwarzschild. */
export interface ProcaGreybodySolution {
  polarization: ProcaPolarization;
  l: number;
  /** ω in units of 1/M (as given) */
  omega: number;
  /** the field's mass Mμ */
  fieldMass: number;
  /** hole mass M */
  mass: number;
  /** k∞ = √(ω² − μ²), in units of 1/M */
  kInfinity: number;
  /** absorbed fraction of the incident flux in this polarisation */
  gamma: number;
  /** reflected fraction in this polarisation */
  reflection: number;
  /** largest entry of |T + R − 1| for the whole sector (unitarity of the S-matrix) */
  residual: number;
  /** Γ of every polarisation of the sector (even: [even-1, even-2]); their sum is basis-independent */
  sectorGammas: number[];
  diagnostics: ProcaGreybodyDiagnostics;
}

const ERROR_FLOOR = 3e-13;
/**
 * 200 ε per √(evaluations): near threshold (v = 0.05, matching radius ~2000 M)
 * solves of the extrapolation loop at tol 1e-10…1e-12 scatter by up to 2.5e-12
 * about the Cash–Karp value (whose own solves agree to 7e-14) while their
 * step-error bounds said less; with ~5e3 evaluations this floor is 3e-12.
 */
const ROUNDING_PER_ROOT_EVALUATION = 200 * Number.EPSILON;
/**
 * Charge per step of the extrapolation loop in its accumulation bound: measured
 * on 84 modes (every sector, l ≤ 6, Mω 0.1–3, v = 0.05–0.995) at step
 * tolerances 1e-10…1e-12 against tol-1e-12 Cash–Karp solves, the error of Γ
 * was at most 0.73 × steps × step tolerance; charged 3 (true error ≤ 0.25 of it).
 * From the start singleStartOffset picks and with chargedSteps: at most 1.17
 * (bench/results/proca-2026-12-04b-estimate.txt).
 */
const SINGLE_SOLVE_CHARGE = 3;
/**
 * Fewest steps charged: with the start at r0 = 3 and the phase-form far zone
 * a solve near threshold takes 15–25 steps, and there the error of Γ no
 * longer shrinks with the step count (l = 4, Mω = 1, v = 0.05, step
 * tolerance 1e-11: 4.7e-10 = 2.2 × steps × step tolerance in 21 steps, from
 * 8e-11 to 5e-10 as the step placement moves); charged as 40 steps it is 1.2.
 */
const MIN_CHARGED_STEPS = 40;

/** Steps charged in the accumulation bound of one extrapolation solve of `steps` steps. */
export function chargedSteps(steps: number): number {
  return Math.max(steps, MIN_CHARGED_STEPS);
}
/** Requests tighter than this go to Cash–Karp directly. */
const TIGHTEST_EXTRAPOLATION_TOL = 1e-11;
const START_OFFSET = 0.15;
/**
 * Start offsets of the single extrapolation solve, outermost first: r0 = 3
 * (t = 1/2 in the horizon series, whose radius of convergence is t = 1, the
 * singular point r = 0), r0 = 2.5, and r0 = 2.18 as before. Starting at r0 = 3
 * instead of 2.18 saves 10–18 % of the right-hand-side evaluations (the steps
 * that follow e^{−iωr*} off the horizon) with the same Γ (8 modes, every
 * sector, l ≤ 6, Mω 0.3–3, step tolerance 1.5e-11, against tol-1e-12
 * Cash–Karp solves: errors 7e-12…2.6e-10 at either start). Near threshold at
 * large Mω, or at large l and Mω, the series terms there grow far beyond
 * their sum (Mω = 50, Mμ = 49.5: by 6e10 at r0 = 3), so the outermost start
 * whose series loses at most one digit is taken.
 */
const SINGLE_START_OFFSETS = [0.5, 0.25];
const FALLBACK_START_OFFSET = 0.6 * START_OFFSET;
/** Largest Σ|terms| / |sum| of the horizon series accepted at the outer starts. */
const MAX_START_CANCELLATION = 10;

/** The start offset of the single extrapolation solve of a sector (see SINGLE_START_OFFSETS). */
export function singleStartOffset(model: SectorModel): number {
  for (const offset of SINGLE_START_OFFSETS) {
    let fits = true;
    for (let c = 0; c < model.channels && fits; c++) {
      const s = horizonSolution(model, c, 2 * offset);
      fits = s.converged && (s.cancellation ?? Infinity) <= MAX_START_CANCELLATION;
    }
    if (fits) return offset;
  }
  return FALLBACK_START_OFFSET;
}

/**
 * Local tolerance of the integrator for a requested tol over a tortoise span.
 * Cash–Karp takes thousands of steps and its local errors add up over the
 * span; the extrapolation loop takes tens to hundreds, so it gets the square
 * root of the phase (measured on 11 modes up to v = 0.05: error against tol-1e-12
 * solves at most 0.33 of the estimate at tol 1e-8 and 1e-10, 20 % fewer
 * right-hand-side evaluations than with the Cash–Karp rule).
 */
function stepTolerance(integrator: ProcaIntegrator, tol: number, span: number, omega: number, factor: number): number {
  const phase = integrator === 'cash-karp' ? omega * span : Math.sqrt(omega * span);
  return Math.max(1e-16, Math.min(1e-6, (factor * 0.1 * tol) / (3 + phase)));
}

/**
 * One extrapolation integration whose estimate is its accumulation bound
 * SINGLE_SOLVE_CHARGE × chargedSteps(steps) × step tolerance plus the rounding floor; its
 * step tolerance is tightened (twice at most) until that is within tol.
 * Returns the last run with its estimate (above tol if it never got there)
 * and the work of all runs.
 */
export function singleExtrapolationSolve(
  model: SectorModel,
  tol: number,
  span: number,
  sampleRadii?: readonly number[],
): { fine: ProcaIntegration; relError: number; steps: number; rhsEvaluations: number; stepTolerance: number } {
  let stepTol = Math.max(1e-16, tol / (5 * SINGLE_SOLVE_CHARGE * (30 + 2 * Math.sqrt(model.omega * span))));
  let steps = 0;
  let rhsEvaluations = 0;
  const startOffset = singleStartOffset(model);
  for (let attempt = 0; ; attempt++) {
    const run = integrateProca(model, {
      startOffset,
      stepTolerance: stepTol,
      integrator: 'extrapolation',
      ...(sampleRadii ? { sampleRadii } : {}),
    });
    steps += run.steps;
    rhsEvaluations += run.rhsEvaluations;
    // the far series' truncation (its last kept terms) enters Γ as an error of the far solutions: charged ten times
    const bound = SINGLE_SOLVE_CHARGE * chargedSteps(run.steps) * stepTol + 10 * farTruncation(stepTol);
    const relError = Math.max(bound + ROUNDING_PER_ROOT_EVALUATION * Math.sqrt(run.rhsEvaluations), ERROR_FLOOR);
    const next = stepTol * Math.min(0.5, (0.3 * tol) / bound);
    if (relError <= tol || attempt === 2 || !(next >= 1e-16))
      return { fine: run, relError, steps, rhsEvaluations, stepTolerance: stepTol };
    stepTol = next;
  }
}

/** Start offset and matching radius of a Proca solve: the tortoise span the step-tolerance rules use. */
export function procaSpan(model: SectorModel): number {
  return tortoiseSpan(START_OFFSET, 1.4 * defaultProcaMatchRadius(model));
}

/** One solve of a sector: the integration returned, its estimate and the work of every integration made. */
interface SectorSolve {
  run: ProcaIntegration;
  relError: number;
  steps: number;
  rhsEvaluations: number;
  used: ProcaIntegrator;
  note: string;
  /** true when run and relError do not depend on which polarisation was asked for (one integration's accumulation bound) */
  polarizationFree: boolean;
}

/**
 * The solve of one sector for the Γ of polarisation `index`. The
 * extrapolation route runs one integration with its accumulation bound as the
 * estimate (the same for every polarisation of the sector); where that cannot
 * reach tol, and for Cash–Karp, two integrations that differ in start,
 * matching radius and step tolerance give it for the polarisation asked for.
 */
function solveSector(model: SectorModel, tol: number, integrator: ProcaIntegrator, index: number): SectorSolve {
  const match = defaultProcaMatchRadius(model);
  const span = tortoiseSpan(START_OFFSET, 1.4 * match);
  let steps = 0;
  let rhsEvaluations = 0;
  const run2 = (name: ProcaIntegrator) => {
    let factor = 1;
    let fine: ProcaIntegration | undefined;
    let relError = Infinity;
    for (let attempt = 0; attempt < 3; attempt++) {
      const coarse = integrateProca(model, {
        startOffset: START_OFFSET,
        stepTolerance: stepTolerance(name, tol, span, model.omega, factor),
        integrator: name,
      });
      fine = integrateProca(model, {
        startOffset: 0.6 * START_OFFSET,
        matchRadius: 1.4 * match,
        stepTolerance: stepTolerance(name, tol, span, model.omega, factor / 8),
        integrator: name,
      });
      steps += coarse.steps + fine.steps;
      rhsEvaluations += coarse.rhsEvaluations + fine.rhsEvaluations;
      const g = fine.gammas[index];
      // the extrapolation loop's rounding floor: two of its solves can agree more closely than either is right
      const rounding = name === 'extrapolation' ? ROUNDING_PER_ROOT_EVALUATION * Math.sqrt(fine.rhsEvaluations) : 0;
      relError = Math.max(g > 0 ? Math.abs(coarse.gammas[index] - g) / g : Infinity, ERROR_FLOOR, rounding);
      if (relError <= tol) break;
      factor /= 10;
    }
    return { fine: fine!, relError };
  };
  const runSingle = () => {
    const r = singleExtrapolationSolve(model, tol, span);
    steps += r.steps;
    rhsEvaluations += r.rhsEvaluations;
    return r.relError <= tol ? r : undefined;
  };
  // below ~1e-11 the extrapolation loop's rounding floor (ROUNDING_PER_ROOT_EVALUATION) is in the way: Cash–Karp at once
  let used: ProcaIntegrator = integrator === 'extrapolation' && tol < TIGHTEST_EXTRAPOLATION_TOL ? 'cash-karp' : integrator;
  const single = used === 'extrapolation' ? runSingle() : undefined;
  if (single) {
    return {
      run: single.fine,
      relError: single.relError,
      steps,
      rhsEvaluations,
      used,
      note: '; error from the accumulation bound of one integration',
      polarizationFree: true,
    };
  }
  let { fine, relError } = run2(used);
  let note = '; error from two integrations';
  if (relError > tol && used === 'extrapolation') {
    // near the rounding floor (tol ~ 1e-12) the extrapolation loop can stall where Cash–Karp does not
    note = `; error from two integrations; extrapolation stalled at ${relError.toExponential(1)}, Cash–Karp used`;
    used = 'cash-karp';
    ({ fine, relError } = run2(used));
  }
  return { run: fine, relError, steps, rhsEvaluations, used, note, polarizationFree: false };
}

/**
 * The last even-sector solve whose Γ do not depend on the polarisation asked
 * for, with the polarisation it served: one integration carries both
 * horizon-ingoing solutions and gives the Γ of even-1 and even-2 at once, so
 * a caller that asks for both in turn (the emission and cross-section sums
 * do) pays for one integration. It serves the other polarisation once, with
 * the result a fresh solve would give, bit for bit; asking again for the same
 * one solves afresh.
 */
let lastEvenSolve: { key: string; index: number; solve: SectorSolve } | undefined;

/**
 * Γ of one polarisation of a massive vector mode on Schwarzschild. The
 * extrapolation route runs one integration with its accumulation bound as the
 * estimate; where that cannot reach tol, and for Cash–Karp, two integrations
 * that differ in start, matching radius and step tolerance give it. One
 * even-sector integration gives both even Γ: asking for even-2 right after
 * even-1 of the same l, Mω, Mμ and options (or the reverse) reuses it once,
 * and its diagnostics then count no new steps or evaluations. Throws InputError for a bad problem
 * (below threshold: `omega`) or options, and ConvergenceError (full
 * diagnostics) when the estimate stays above `options.tol` (default 1e-10)
 * after two tightenings.
 *
 * @example procaGreybody({ field: { spin: 1, mass: 0.1 }, l: 1, omega: 0.3, polarization: 'odd' })
 */
export function procaGreybody(problem: ProcaGreybodyProblem, options?: ProcaGreybodyOptions): ProcaGreybodySolution {
  const p = validateProcaProblem(problem);
  const { tol, integrator } = validateProcaOptions(options);
  const model = sectorModel(p.sector, p.l, p.omega, p.mu);
  const index = p.polarization === 'even-2' ? 1 : 0;
  const key = `${p.l}|${p.omega}|${p.mu}|${tol}|${integrator}`;
  const last = lastEvenSolve;
  const reused = p.sector === 'even' && last?.key === key && last.index !== index ? last.solve : undefined;
  const solved = reused ?? solveSector(model, tol, integrator, index);
  if (p.sector === 'even') lastEvenSolve = !reused && solved.polarizationFree ? { key, index, solve: solved } : undefined;
  const { run, relError, used, note } = solved;
  const converged = relError <= tol;
  const how = solved.polarizationFree ? 'accumulation bound of one integration' : 'two integrations differ by';
  const diagnostics: ProcaGreybodyDiagnostics = {
    method: `Proca ${model.sector} sector (${model.channels} channel${model.channels > 1 ? 's' : ''}); horizon Frobenius series, ${used === 'cash-karp' ? 'Cash–Karp RK45' : 'Gragg–Bulirsch–Stoer extrapolation'} in r, far-zone series with the long-range log phase${note}`,
    steps: reused ? 0 : solved.steps,
    rhsEvaluations: reused ? 0 : solved.rhsEvaluations,
    errorEstimate: relError,
    message: `${converged ? 'converged' : 'not converged'}: ${how} ${relError.toExponential(1)} (tol ${tol})${
      reused
        ? `; both even Γ from the even-sector integration of an earlier call (${solved.steps} steps, ${solved.rhsEvaluations} evaluations, counted there)`
        : ''
    }`,
    startRadius: run.startRadius * p.mass,
    matchRadius: run.matchRadius * p.mass,
    seriesTerms: run.seriesTerms,
  };
  if (!converged) throw new ConvergenceError(`Proca greybody factor did not reach relative accuracy ${tol}`, diagnostics);
  return {
    polarization: p.polarization,
    l: p.l,
    omega: p.omega / p.mass,
    fieldMass: p.mu,
    mass: p.mass,
    kInfinity: farWaveNumbers(model).k / p.mass,
    gamma: run.gammas[index],
    reflection: run.reflections[index],
    residual: run.residual,
    sectorGammas: run.gammas,
    diagnostics,
  };
}
