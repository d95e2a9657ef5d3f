/**
 * Greybody factors of the massive Dirac field on Kerr (Chandrasekhar 1976;
 * Page, Phys. Rev. D 14, 1509 (1976)); derivation in docs/massive-dirac.md.
 *
 * λ from the angular pair (depends on aω and aμ), then the first-order radial
 * pair from the horizon to the far zone; the conserved current
 * |P₊|² − |P₋|² gives Γ = (ω + k∞)/(2k∞|A|²) ≥ 0 and R = |B/A|², so a Dirac
 * field is never amplified. Below threshold (ω ≤ μ) no wave reaches
 * infinity: InputError naming `omega`.
 */
import { ConvergenceError, InputError, requireKeyedObject, validateHole, validateMode } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { INTEGRATORS, solveMassiveDiracRadial, type DiracRadialProblem, type DiracRadialSolution } from '@penumbra/radial';
import { diracAngularEigenvalue, type DiracAngularEigenvalue } from '@penumbra/spheroidal';
import type { GreybodySolution } from './greybody.js';
import { checkGreybodyOptions, validateOmega, type GreybodyOptions, type GreybodyProblem } from './validate.js';

/**
 * Charge of the single-solve estimate: the radial solve's errorEstimate (steps
 * × tol plus the far-series truncation) times 2. Measured on 1 920 solves (a ≤ 0.99,
 * j ≤ 9/2, Mω 0.05–2.5, v = 0.05–0.995, both signs of κ, tol 1e-10…1e-12)
 * against tol-1e-14 solves, the error of Γ was at most 0.47 × steps × tol
 * (bench/massive-dirac.bench.mjs checks the estimate against the fixture).
 */
const SINGLE_SOLVE_CHARGE = 2;

/** A checked massive Dirac mode with its λ (the problem of `greybody` and `radialFunction`). */
export interface MassiveDiracMode {
  /** the radial problem: hole, ω, m, μ (units of 1/M) and λ */
  radial: DiracRadialProblem;
  j: number;
  kappaSign: 1 | -1;
  angular: DiracAngularEigenvalue;
}

/**
 * Check a massive Dirac problem (the mode must carry kappaSign, ω > μ) and
 * find its λ; InputError naming the offending parameter.
 */
export function massiveDiracMode(problem: GreybodyProblem): MassiveDiracMode {
  const p = requireKeyedObject('problem', problem, ['hole', 'mode', 'omega']);
  const { fieldMass: mu, l: j, m, kappaSign } = validateMode(p.mode, 'mode');
  if (kappaSign === undefined) {
    throw new InputError(
      'mode.kappaSign',
      '1 or −1 (--kappa-sign on the command line; required for a massive spin-1/2 field: the two signs of κ are different modes)',
      kappaSign,
    );
  }
  const { a, mass } = validateHole(p.hole, 'hole');
  const omega = validateOmega(p.omega, mass);
  if (!(omega > mu)) {
    throw new InputError(
      'omega',
      `ω > μ = ${mu} (Mμ = ${mu * mass})`,
      omega,
      'below threshold no wave reaches infinity and Γ is undefined',
    );
  }
  const hole = kerrHole({ a, mass });
  const angular = diracAngularEigenvalue({ j, m, aOmega: a * omega, aMu: a * mu, kappaSign });
  return { radial: { hole, omega, m, mu, lambda: angular.lambda }, j, kappaSign, angular };
}

/** Γ of one massive Dirac mode; the problem's mode must carry kappaSign. */
export function massiveDiracGreybody(problem: GreybodyProblem, options?: GreybodyOptions): GreybodySolution {
  const { radial, j, kappaSign, angular } = massiveDiracMode(problem);
  const opts = checkGreybodyOptions(options);
  const tol = opts.tol ?? 1e-8;
  const integrator = opts.integrator ?? INTEGRATORS[0];
  const { hole, omega, m, mu, lambda } = radial;
  const a = hole.a;
  const k = omega - m * hole.omegaH;
  let odeTol = Math.max(tol * 1e-3, 1e-14);
  for (let attempt = 1; attempt <= 3; attempt++) {
    const common = { integrator, startFraction: opts.startFraction, matchRadius: opts.matchRadius };
    const fine = solveMassiveDiracRadial(radial, { ...common, tol: odeTol });
    // one solve where its accumulation bound suffices (docs/massive-dirac.md): Γ ∝ |A|⁻², twice the bound of ln|A|
    const single =
      SINGLE_SOLVE_CHARGE * fine.diagnostics.errorEstimate +
      angular.diagnostics.errorEstimate +
      25 * Number.EPSILON * Math.sqrt(fine.diagnostics.rhsEvaluations);
    if (single <= tol) return solution(fine, single, attempt, odeTol, 0);
    const coarse = solveMassiveDiracRadial(radial, { ...common, tol: odeTol * 10 });
    const relError = Math.abs(Math.expm1(2 * (coarse.logAbsIn - fine.logAbsIn))) + angular.diagnostics.errorEstimate + 1e-15;
    if (relError <= tol) return solution(fine, relError, attempt, odeTol, coarse.diagnostics.rhsEvaluations);
    if (attempt === 3) {
      throw new ConvergenceError('massive Dirac greybody factor did not reach the requested accuracy', {
        ...fine.diagnostics,
        errorEstimate: relError,
        message: `relative error ${relError.toExponential(2)} > tol ${tol} after 3 attempts`,
        l: j,
        m,
        a,
        omega,
        fieldMass: mu,
        kappaSign,
      });
    }
    odeTol = Math.max(odeTol * 0.01, 1e-15);
  }
  throw new Error('unreachable');

  function solution(
    fine: DiracRadialSolution,
    relError: number,
    attempts: number,
    odeTol: number,
    extra: number,
  ): GreybodySolution {
    const kInf = fine.kInf;
    const lnGamma = Math.log((omega + kInf) / (2 * kInf)) - 2 * fine.logAbsIn;
    const underflow = lnGamma < Math.log(2.2250738585072014e-308);
    const gamma = underflow ? 0 : Math.exp(lnGamma);
    const reflection = Math.exp(2 * (fine.logAbsOut - fine.logAbsIn));
    const d = fine.diagnostics;
    return {
      hole: { a: hole.a, mass: hole.mass },
      mode: { field: { spin: 0.5, mass: mu }, l: j, m, kappaSign },
      omega,
      gamma,
      log10Gamma: lnGamma / Math.LN10,
      underflow,
      reflection,
      residual: Math.abs(gamma + reflection - 1),
      relError,
      amplification: -gamma,
      k,
      superradiant: false,
      diagnostics: {
        method: `${d.method}; λ by ${angular.diagnostics.method}`,
        steps: d.steps,
        rhsEvaluations: d.rhsEvaluations + extra,
        errorEstimate: relError,
        message: `converged: estimated relative error ${relError.toExponential(2)} after ${attempts} attempt(s)`,
        integrator,
        odeTol,
        startRadius: d.startRadius,
        matchRadius: d.matchRadius,
        horizonTerms: d.horizonTerms,
        farTerms: d.farTerms,
        eigenvalue: lambda,
        lambda,
        starobinskySquared: lambda * lambda,
        attempts,
      },
    };
  }
}
