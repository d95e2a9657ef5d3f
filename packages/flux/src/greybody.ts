/**
 * Greybody factors of Kerr holes: problem → solve → result with diagnostics.
 *
 * Γ comes from the transmitted amplitude of the +|s| field (Z_in dominates at
 * infinity, so Γ ~ 1e-30 costs no digits). The reflection coefficient comes
 * from an independent integration of the −|s| field, where the outgoing
 * amplitude dominates at infinity, tied to the same physical mode through the
 * Teukolsky–Starobinsky map at the horizon; |Γ + R − 1| is then a genuine check
 * of both solves and of the flux normalisations (docs/method.md).
 */
import {
  ConvergenceError,
  InputError,
  attempt,
  validateOptions,
  type Attempt,
  type Diagnostics,
  type FieldSpin,
} from '@penumbra/core';
import { kerrHole, type KerrHole } from '@penumbra/kerr';
import { radialSeparationConstant } from '@penumbra/spheroidal';
import { spheroidalEigenvalueOfValidMode } from '@penumbra/spheroidal/internal';
import {
  INTEGRATORS,
  solveRadial,
  solveTwoSided,
  type IntegratorName,
  type RadialDiagnostics,
  type RadialMode,
  type RadialSample,
} from '@penumbra/radial';
import {
  RADIAL_DEFAULTS,
  oneSidedChecked,
  resolveTwoSidedOptions,
  twoSidedChecked,
  type ResolvedOptions,
} from '@penumbra/radial/internal';
import type { ProcaPolarization } from '@penumbra/regge-wheeler';
import {
  SINGLE_SOLVE_MARGIN,
  checkGeometry,
  gammaErrorEstimate,
  roundingFloor,
  singleSolveBudget,
  singleSolveGammaEstimate,
} from './errorEstimate.js';
import { horizonFactor, horizonMapSquared, starobinskyConstantSquared } from './normalisation.js';
import { ownMassiveSolver, ownRadialFunction, requireRadialEquationField } from './massive.js';
import type { DiracRadialFunction, MassiveDiracProblem, RadialFunctionOptions } from './radialFunctionDirac.js';
import type { ProcaRadialFunction } from './radialFunctionProca.js';
import {
  GREYBODY_OPTIONS,
  checkGreybodyOptions,
  checkProblem,
  type CheckedProblem,
  type GreybodyOptions,
  type GreybodyProblem,
} from './validate.js';

/** How a greybody factor was computed; `errorEstimate` is the relative error of Γ. */
export interface GreybodyDiagnostics extends Diagnostics {
  integrator: IntegratorName;
  odeTol: number;
  startRadius: number;
  matchRadius: number;
  horizonTerms: number;
  farTerms: number;
  /** the spheroidal eigenvalue A_{+s l m}(aω) and radial constant λ used (massive Dirac: both are Chandrasekhar's λ) */
  eigenvalue: number;
  lambda: number;
  /** |C_s|² (Teukolsky–Starobinsky; massive Dirac: λ², which is |C_{1/2}|² at μ = 0) */
  starobinskySquared: number;
  attempts: number;
  /** right-hand-side evaluations of the check solve behind the error estimate (included in rhsEvaluations; 0 where the single-solve estimate stood alone; absent for the massive Dirac and vector solvers) */
  checkEvaluations?: number;
}

/** The greybody factor of one mode, with the problem it answers. */
export interface GreybodySolution {
  hole: { a: number; mass: number };
  /** the mode; a massive Dirac mode also carries its field mass and kappaSign (docs/massive-dirac.md) */
  mode: { field: { spin: FieldSpin; mass?: number }; l: number; m: number; kappaSign?: 1 | -1 };
  omega: number;
  /** massive vector only: the polarisation computed (docs/massive-vector.md) */
  polarization?: ProcaPolarization;
  /**
   * absorbed fraction of the incident flux; negative in the superradiant band
   * (bosons). When |Γ| is below the normal double range (`underflow`), 0.
   */
  gamma: number;
  /**
   * log10 |Γ|, finite: it carries Γ when `gamma` underflows (e.g. s = 2, l = 30,
   * Mω = 1e-5 gives about 10^-330). Absent only at the exact superradiant
   * threshold k = 0, where Γ = 0 exactly.
   */
  log10Gamma?: number;
  /** true when |Γ| < 2.2250738585072014e-308 (not a normal double): `gamma` is then 0 and `log10Gamma` holds the value */
  underflow: boolean;
  /** reflected fraction, from an independent solve (NaN when not asked for) */
  reflection: number;
  /** |Γ + reflection − 1|, an accuracy check of both solves and the normalisations */
  residual: number;
  /** estimated relative error of Γ: the solve's local-error accumulation bound plus a rounding floor, or where that is not ten times below tol, from a check solve at a ten times looser tolerance from moved start and matching radii (errorEstimate.ts) */
  relError: number;
  /** amplification factor Z = −Γ (positive when the wave is amplified) */
  amplification: number;
  /** k = ω − mΩ_H; bosons are superradiant where k < 0 */
  k: number;
  superradiant: boolean;
  diagnostics: GreybodyDiagnostics;
}

interface Prepared {
  spin: FieldSpin;
  /** field mass Mμ as given (0 when massless) */
  fieldMass: number;
  /** μ = Mμ/M, the field mass in the units of ω */
  mu: number;
  /** k∞ = √(ω² − μ²), the wavenumber at infinity (= ω when massless) */
  kInf: number;
  l: number;
  m: number;
  hole: KerrHole;
  omega: number;
  A: number;
  lambdaPlus: number;
}

/**
 * The separated mode. A massive scalar has the spheroidal equation with
 * c² = a²(ω² − μ²) and λ = A + a²ω² − 2amω (docs/massive-fields.md); with
 * μ = 0 every number is the massless one exactly.
 */
function prepare(checked: CheckedProblem): Prepared {
  const { spin, fieldMass, l, m, a, mass, omega } = checked;
  const hole = kerrHole({ a, mass });
  const mu = fieldMass / mass;
  const kInf = mu === 0 ? omega : Math.sqrt((omega - mu) * (omega + mu));
  // (spin, l, m) passed core's validateMode in checkProblem: skip re-checking them as a spheroidal problem.
  const eig = spheroidalEigenvalueOfValidMode(spin, l, m, a * kInf);
  const lambdaPlus = radialSeparationConstant(eig.A, a, omega, m);
  return { spin, fieldMass, mu, kInf, l, m, hole, omega, A: eig.A, lambdaPlus };
}

/** The checked problem of a field the radial equation takes (massless, or the massive scalar). */
function checkRadialProblem(problem: GreybodyProblem): CheckedProblem {
  const checked = checkProblem(problem);
  requireRadialEquationField(checked);
  return checked;
}

/**
 * Integrator tolerance for a requested relative accuracy of Γ. Measured at
 * the default 1e-8: the achieved error is at most 6e-10 (median 1e-11), so
 * the factor 1e-3 leaves more than an order of magnitude of room.
 */
function odeTolerance(tol: number): number {
  return Math.max(tol * 1e-3, 1e-14);
}

/** No sampled radii (greybody reads amplitudes only). */
const NO_RADII: readonly number[] = [];

/** An estimate within this factor of the rounding floor after the last attempt has stalled on rounding, not on the integration. */
const STALL_FACTOR = 10;

/**
 * The refusal of a tolerance below what double rounding allows for this mode:
 * an InputError naming `tol`, with the reason (the rounding floor `floor`)
 * and the tightest tolerance available here, the best estimate reached
 * (`reached`) rounded up to two figures: the same request at that tolerance
 * repeats the same deterministic solves (the working tolerance is the same
 * for every tol ≤ 1e-11) and is met.
 */
function tolBelowRoundingFloor(tol: number, floor: number, reached: number, evaluations: number): InputError {
  const unit = 10 ** (Math.floor(Math.log10(reached)) - 1);
  const tightest = Number((Math.ceil(reached / unit) * unit).toPrecision(2));
  return new InputError(
    'tol',
    `tol ≥ ${tightest} for this mode`,
    tol,
    `double rounding over ${evaluations} right-hand-side evaluations puts a floor of ${floor.toExponential(1)} under the relative error of Γ for this mode; a looser tol, or a smaller |a| or Mω, is reachable`,
  );
}

/**
 * The greybody factor Γ of one mode: the fraction of an incident wave's flux
 * the hole absorbs, with the reflection from an independent solve and an
 * error estimate (the solve's own error bound, or where that is not ten
 * times below tol a check solve; errorEstimate.ts). Throws
 * InputError for a bad problem or option, InputError naming `tol` (with the
 * tightest tolerance available) when double rounding rules the requested
 * accuracy out for this mode, and ConvergenceError (with diagnostics) if the
 * requested accuracy is not reached otherwise.
 *
 * @example greybody({ hole: { a: 0.9 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.3 })
 */
export function greybody(problem: GreybodyProblem, options?: GreybodyOptions): GreybodySolution {
  const own = ownMassiveSolver(problem);
  if (own) return own(problem, options);
  const p = prepare(checkRadialProblem(problem));
  options = checkGreybodyOptions(options);
  if (options.polarization !== undefined) {
    throw new InputError('polarization', 'absent (a polarisation is chosen only for a massive vector)', options.polarization);
  }
  const tol = options.tol ?? 1e-8;
  const integrator = options.integrator ?? INTEGRATORS[0];
  const { spin, hole, omega, m, lambdaPlus } = p;
  const k = omega - m * hole.omegaH;
  const C2 = starobinskyConstantSquared(spin, lambdaPlus, hole, m, omega);
  // The radial options as radial resolves them, from options checked above (greybody's validators are at least as strict).
  const resolved: ResolvedOptions = {
    tol: RADIAL_DEFAULTS.tol,
    startFraction: options.startFraction,
    matchRadius: options.matchRadius,
    grid: NO_RADII,
    maxSteps: RADIAL_DEFAULTS.maxSteps,
    integrator,
    variable: RADIAL_DEFAULTS.variable,
    reflection: options.reflection !== false,
    oscillation: options.oscillation ?? RADIAL_DEFAULTS.oscillation,
    switchRadius: undefined,
  };

  // At the superradiant threshold k = 0 exactly the ingoing and outgoing horizon
  // solutions coincide; Γ vanishes there for bosons (it is proportional to k).
  if (k === 0 && spin !== 0.5) {
    return result(p, { sign: 0, reflection: 1, relError: 0, k, C2, odeTol: tol, attempts: 0, integrator, extraEvaluations: 0 });
  }

  let odeTol = odeTolerance(tol);
  let best = Number.POSITIVE_INFINITY;
  for (let attempt = 1; attempt <= 3; attempt++) {
    resolved.tol = odeTol;
    const fine = solveMode(p, resolved);
    const floor = roundingFloor(fine.diagnostics);
    const budget = fine.diagnostics.errorEstimate;
    let relError = singleSolveGammaEstimate(fine.sign, fine.lnGamma, singleSolveBudget(fine.diagnostics), floor);
    let checkEvaluations = 0;
    if (relError > tol / SINGLE_SOLVE_MARGIN) {
      // The check solve moves the start and matching radii too, so it sees the series truncation and part of the rounding (errorEstimate.ts).
      const check = solveMode(
        p,
        resolveTwoSidedOptions({
          integrator,
          ...(options.oscillation ? { oscillation: options.oscillation } : {}),
          ...checkGeometry(hole, fine.diagnostics),
          tol: odeTol * 10,
          reflection: false,
        }),
      );
      relError = gammaErrorEstimate(fine.sign, fine.lnGamma, check.lnGamma, budget, floor);
      checkEvaluations = check.diagnostics.rhsEvaluations;
    }
    // The best estimate of any attempt is what a repeated request reaches (the solves are deterministic).
    best = Math.min(best, relError);
    if (attempt === 1 && floor > tol) throw tolBelowRoundingFloor(tol, floor, best, fine.diagnostics.rhsEvaluations);
    if (relError <= tol) {
      return result(p, {
        sign: fine.sign,
        lnGamma: fine.lnGamma,
        reflection: fine.reflection,
        relError,
        k,
        C2,
        odeTol,
        attempts: attempt,
        integrator,
        d: fine.diagnostics,
        extraEvaluations: checkEvaluations,
      });
    }
    if (attempt === 3) {
      // Stalled at the rounding level: no integrator tolerance reaches tol here, so tol is refused (naming the tightest available).
      if (relError <= STALL_FACTOR * floor) throw tolBelowRoundingFloor(tol, floor, best, fine.diagnostics.rhsEvaluations);
      throw new ConvergenceError('greybody factor did not reach the requested accuracy', {
        ...fine.diagnostics,
        errorEstimate: relError,
        message: `relative error ${relError.toExponential(2)} > tol ${tol} after 3 attempts (last integrator tolerance ${odeTol}; rounding floor ${floor.toExponential(2)})`,
        spin,
        l: p.l,
        m,
        a: hole.a,
        omega,
        tol,
        odeTol,
      });
    }
    odeTol = Math.max(odeTol * 0.01, 1e-15);
  }
  throw new Error('unreachable');
}

interface ModeSolve {
  lnGamma: number;
  sign: number;
  reflection: number;
  diagnostics: RadialDiagnostics;
}

/**
 * s = 0: one-sided shooting has no trap (both solutions are of equal size at
 * both ends). s > 0: the two-sided route (−s from the horizon, Teukolsky–
 * Starobinsky map, +s to the far zone); Γ from Z_in of the +s field and the
 * reflection from Y_out of the −s field, each where it dominates.
 */
function solveMode(p: Prepared, opts: ResolvedOptions): ModeSolve {
  const { spin, hole, omega, m, lambdaPlus } = p;
  const k = omega - m * hole.omegaH;
  // the mode as radial's validateProblem returns it (its numbers passed checkProblem and prepare)
  const mode: RadialMode =
    p.mu > 0 ? { s: spin, m, omega, lambda: lambdaPlus, mu: p.mu } : { s: spin, m, omega, lambda: lambdaPlus };
  if (spin === 0) {
    // The flux at infinity carries k∞ (= ω when massless): Γ = (k/k∞)(2Mr+)/|Z_in|².
    const h = horizonFactor(0, hole, p.kInf, k);
    const sol = oneSidedChecked(hole, mode, opts);
    return {
      lnGamma: Math.log(Math.abs(h)) - 2 * sol.logAbsZIn,
      sign: Math.sign(h),
      reflection: Math.exp(2 * (sol.logAbsZOut - sol.logAbsZIn)),
      diagnostics: sol.diagnostics,
    };
  }
  const h = horizonFactor(spin, hole, omega, k);
  const sol = twoSidedChecked(hole, mode, opts);
  // R = |C|² |Y_out|² / (|h_s|² |Z_in|²), derived in docs/method.md (|C|² only where the reflection is asked for).
  const reflection =
    opts.reflection === false
      ? Number.NaN
      : Math.exp(
          Math.log(starobinskyConstantSquared(spin, lambdaPlus, hole, m, omega)) +
            2 * sol.logAbsYOutMinus -
            Math.log(horizonMapSquared(spin, hole, k)) -
            2 * sol.logAbsZInPlus,
        );
  return {
    lnGamma: Math.log(Math.abs(h)) - 2 * sol.logAbsZInPlus,
    sign: Math.sign(h),
    reflection,
    diagnostics: sol.diagnostics,
  };
}

interface Outcome {
  /** sign of Γ (0 at the exact threshold, where Γ = 0) */
  sign: number;
  /** ln |Γ| (absent at the exact threshold) */
  lnGamma?: number;
  reflection: number;
  relError: number;
  k: number;
  C2: number;
  odeTol: number;
  attempts: number;
  integrator: IntegratorName;
  /** diagnostics of the accepted solve (none at the exact threshold) */
  d?: RadialDiagnostics;
  /** right-hand-side evaluations of the error-estimate solve */
  extraEvaluations: number;
}

/** ln of the smallest normal double, 2.2250738585072014e-308. */
const LN_MIN_NORMAL = Math.log(2.2250738585072014e-308);

function result(
  p: Prepared,
  { sign, lnGamma, reflection, relError, k, C2, odeTol, attempts, integrator, d, extraEvaluations }: Outcome,
): GreybodySolution {
  // Γ below the normal double range is reported through log10Gamma, never as a subnormal.
  const underflow = lnGamma !== undefined && lnGamma < LN_MIN_NORMAL;
  const gamma = lnGamma === undefined || underflow ? 0 : sign * Math.exp(lnGamma);
  const diagnostics: GreybodyDiagnostics = {
    method: d ? d.method : 'superradiant threshold: Γ = 0 exactly',
    errorEstimate: relError,
    message: d
      ? `converged: estimated relative error ${relError.toExponential(2)} after ${attempts} attempt(s)`
      : 'k = ω − mΩ_H = 0 exactly: ingoing and outgoing horizon solutions coincide and Γ = 0 (no integration: startRadius = matchRadius = 0)',
    integrator,
    odeTol,
    // no integration at the exact threshold: 0 says "no radius used", not NaN
    startRadius: d?.startRadius ?? 0,
    matchRadius: d?.matchRadius ?? 0,
    horizonTerms: d?.horizonTerms ?? 0,
    farTerms: d?.farTerms ?? 0,
    steps: d?.steps ?? 0,
    rhsEvaluations: (d?.rhsEvaluations ?? 0) + extraEvaluations,
    eigenvalue: p.A,
    lambda: p.lambdaPlus,
    starobinskySquared: C2,
    attempts,
    checkEvaluations: extraEvaluations,
  };
  const hole = { a: p.hole.a, mass: p.hole.mass };
  const mode = { field: p.fieldMass > 0 ? { spin: p.spin, mass: p.fieldMass } : { spin: p.spin }, l: p.l, m: p.m };
  const residual = Math.abs(gamma + reflection - 1);
  const amplification = gamma === 0 ? 0 : -gamma;
  const superradiant = p.spin !== 0.5 && k < 0;
  const omega = p.omega;
  // Two literals rather than a conditional spread (spreads were measured at µs a call); the keys keep their order.
  if (lnGamma === undefined) {
    return { hole, mode, omega, gamma, underflow, reflection, residual, relError, amplification, k, superradiant, diagnostics };
  }
  const log10Gamma = lnGamma / Math.LN10;
  return {
    hole,
    mode,
    omega,
    gamma,
    log10Gamma,
    underflow,
    reflection,
    residual,
    relError,
    amplification,
    k,
    superradiant,
    diagnostics,
  };
}

/** `radialFunction` of a field the Teukolsky radial equation takes. */
export interface TeukolskyRadialFunction {
  samples: RadialSample[];
  logAbsZIn: number;
  logAbsZOut: number;
  diagnostics: RadialDiagnostics;
}

/**
 * The radial solution R_{+s}(r) (ingoing at the horizon, normalised to
 * Δ^{−s} e^{−ikr*} there) and dR/dr at the requested radii, with ln|Z_in| and
 * ln|Z_out| of the same solution. For s > 0 it comes from the two-sided route
 * (inside the switching radius, the −s solution mapped by D^{2s}). A massive
 * vector at a = 0 gets the Proca solution of one polarisation instead
 * (`options.polarization`; radialFunctionProca.ts), a massive spin-1/2 mode
 * (mass > 0, with kappaSign) the Dirac pair (P₊, P₋) (radialFunctionDirac.ts).
 */
export function radialFunction(
  problem: MassiveDiracProblem,
  radii: readonly number[],
  options?: RadialFunctionOptions,
): DiracRadialFunction;
export function radialFunction(
  problem: GreybodyProblem,
  radii: readonly number[],
  options?: Pick<GreybodyOptions, 'tol' | 'integrator' | 'polarization'>,
): TeukolskyRadialFunction | ProcaRadialFunction;
export function radialFunction(
  problem: GreybodyProblem,
  radii: readonly number[],
  options?: Pick<GreybodyOptions, 'tol' | 'integrator' | 'polarization'>,
): TeukolskyRadialFunction | ProcaRadialFunction | DiracRadialFunction {
  const own = ownRadialFunction(problem);
  if (own) return own(problem, radii, options);
  const p = prepare(checkRadialProblem(problem));
  const checked = validateOptions<Pick<GreybodyOptions, 'tol' | 'integrator'>>(options, {
    tol: GREYBODY_OPTIONS.tol,
    integrator: GREYBODY_OPTIONS.integrator,
  });
  const tol = checked.tol ?? 1e-8;
  const sorted = checkRadii(radii, p.hole).sort((x, y) => x - y);
  const radial = { hole: p.hole, s: p.spin, m: p.m, omega: p.omega, lambda: p.lambdaPlus, ...(p.mu > 0 ? { mu: p.mu } : {}) };
  const opts = { tol: odeTolerance(tol), grid: sorted, integrator: checked.integrator };
  if (p.spin === 0) {
    const sol = solveRadial(radial, opts);
    return { samples: sol.samples, logAbsZIn: sol.logAbsZIn, logAbsZOut: sol.logAbsZOut, diagnostics: sol.diagnostics };
  }
  const sol = solveTwoSided(radial, { ...opts, reflection: false });
  return { samples: sol.samples, logAbsZIn: sol.logAbsZInPlus, logAbsZOut: sol.logAbsZOutPlus, diagnostics: sol.diagnostics };
}

/** Largest number of radii one radialFunction call samples. */
export const MAX_RADII = 100_000;

function checkRadii(radii: unknown, hole: KerrHole): number[] {
  const allowed = `an array of at most ${MAX_RADII} finite radii r > r+ = ${hole.rPlus}`;
  if (!Array.isArray(radii) || radii.length > MAX_RADII) throw new InputError('radii', allowed, radii);
  radii.forEach((r, i) => {
    if (typeof r !== 'number' || !(r > hole.rPlus) || !Number.isFinite(r)) throw new InputError(`radii[${i}]`, allowed, r);
  });
  return [...(radii as number[])];
}

/**
 * `greybody` for batch callers: never throws for bad input or
 * non-convergence; returns a status ('success', 'not-converged',
 * 'invalid-input') with the solution or the typed error.
 */
export function tryGreybody(problem: GreybodyProblem, options?: GreybodyOptions): Attempt<GreybodySolution> {
  return attempt(() => greybody(problem, options));
}
