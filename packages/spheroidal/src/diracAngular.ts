/**
 * The separation constant λ of the massive Dirac field on Kerr
 * (Chandrasekhar, Proc. R. Soc. A 349, 571 (1976)): the eigenvalue of the
 * angular pair, a function of aω and aμ separately. Spectral method in
 * spin-±1/2 spherical harmonics (diracAngularMatrix.ts, docs/massive-dirac.md).
 *
 * Labels: j (half-integer, j ≥ |m|), m and `kappaSign` = ±1. At a = 0,
 * λ = kappaSign·(j + ½) = κ, the Dirac quantum number, negative for
 * j = l_orbital + ½ (κ = −1 is the s-wave: near threshold it is the mode that
 * is absorbed most, docs/massive-dirac.md). The
 * eigenvalues of a symmetric one-parameter family do not cross, so the label
 * follows λ continuously by its rank among the positive or negative eigenvalues.
 */
import { ConvergenceError, InputError, requireFinite, type Diagnostics } from '@penumbra/core';
import { setBounded } from '@penumbra/core/internal';
import { bandEigenvalue, diracAngularBand } from './diracAngularMatrix.js';

/** One angular problem of the massive Dirac field. */
export interface DiracAngularProblem {
  /** total angular momentum j, half-integer, 1/2 ≤ j ≤ 100 */
  readonly j: number;
  /** azimuthal number m, half-integer, |m| ≤ j */
  readonly m: number;
  /** aω (units: a and ω in units of M and 1/M) */
  readonly aOmega: number;
  /** aμ, with μ the field's rest mass */
  readonly aMu: number;
  /** sign of κ = λ(a = 0) = ±(j + ½); −1 includes the s-wave j = ½ */
  readonly kappaSign: 1 | -1;
}

/** How λ was obtained. */
export interface DiracAngularDiagnostics extends Diagnostics {
  /** number of j values kept (matrix size 2·truncation) */
  truncation: number;
  /** |λ(truncation) − λ(truncation − 12)|, the truncation check */
  truncationChange: number;
}

/** The separation constant λ and how it was obtained. */
export interface DiracAngularEigenvalue {
  /** Chandrasekhar's λ; λ = kappaSign·(j + ½) at a = 0 */
  lambda: number;
  diagnostics: DiracAngularDiagnostics;
}

/** Largest |aω| and |aμ| accepted (the radial solvers' range of Mω times |a| ≤ M). */
export const MAX_DIRAC_A_OMEGA = 30;

function check(problem: DiracAngularProblem): DiracAngularProblem {
  const j = requireFinite('j', problem?.j, 'a half-integer 1/2 ≤ j ≤ 100');
  if (!(j >= 0.5 && j <= 100 && Number.isInteger(j - 0.5))) throw new InputError('j', 'a half-integer 1/2 ≤ j ≤ 100', j);
  const m = requireFinite('m', problem.m, `a half-integer |m| ≤ j = ${j}`);
  if (!(Math.abs(m) <= j && Number.isInteger(m - 0.5))) throw new InputError('m', `a half-integer |m| ≤ j = ${j}`, m);
  const range = `|value| ≤ ${MAX_DIRAC_A_OMEGA}`;
  const aOmega = requireFinite('aOmega', problem.aOmega, range);
  if (Math.abs(aOmega) > MAX_DIRAC_A_OMEGA) throw new InputError('aOmega', range, aOmega);
  const aMu = requireFinite('aMu', problem.aMu, range);
  if (Math.abs(aMu) > MAX_DIRAC_A_OMEGA) throw new InputError('aMu', range, aMu);
  const kappaSign = problem.kappaSign;
  if (kappaSign !== 1 && kappaSign !== -1) throw new InputError('kappaSign', '1 or −1', kappaSign);
  return { j, m, aOmega, aMu, kappaSign };
}

/**
 * λ of the massive Dirac angular pair for (j, m, kappaSign) at (aω, aμ).
 * Throws InputError for a bad problem, ConvergenceError if λ still moves by
 * more than 4e-16 relative when the truncation grows by 12 values of j.
 * At aω = aμ = 0, λ = κ exactly; a repeat of a mode's last (aω, aμ) returns
 * the stored result.
 *
 * @example diracAngularEigenvalue({ j: 0.5, m: 0.5, aOmega: 0.3, aMu: 0.1, kappaSign: -1 }).lambda
 */
export function diracAngularEigenvalue(problem: DiracAngularProblem): DiracAngularEigenvalue {
  const { j, m, aOmega, aMu, kappaSign } = check(problem);
  const key = modeKey(j, m, kappaSign);
  const previous = lastSolved.get(key);
  if (previous && previous.aOmega === aOmega && previous.aMu === aMu) return previous.result;
  const result = aOmega === 0 && aMu === 0 ? exact(kappaSign * (j + 0.5)) : solve(j, m, aOmega, aMu, kappaSign);
  setBounded(lastSolved, key, { aOmega, aMu, result }, CACHE_LIMIT);
  return result;
}

/** Last solved point of each (j, m, kappaSign): an exact repeat returns it (results never depend on it). */
const lastSolved = new Map<number, { aOmega: number; aMu: number; result: DiracAngularEigenvalue }>();
const CACHE_LIMIT = 4096;

/** A number per (j, m, kappaSign): 2j ≤ 200 and |2m| ≤ 2j are integers. */
function modeKey(j: number, m: number, kappaSign: 1 | -1): number {
  return ((2 * j * 512 + (2 * m + 256)) * 2 + (kappaSign > 0 ? 1 : 0)) | 0;
}

/** At a = 0 the pair is the spherical Dirac operator: λ = κ = kappaSign·(j + ½) exactly. */
function exact(kappa: number): DiracAngularEigenvalue {
  return {
    lambda: kappa,
    diagnostics: {
      method: 'exact',
      steps: 0,
      rhsEvaluations: 0,
      errorEstimate: 0,
      message: 'exact: λ = κ = kappaSign·(j + ½) at aω = aμ = 0',
      truncation: 1,
      truncationChange: 0,
    },
  };
}

function solve(j: number, m: number, aOmega: number, aMu: number, kappaSign: 1 | -1): DiracAngularEigenvalue {
  const rank = j - Math.abs(m);
  const strength = Math.abs(aOmega) + Math.abs(aMu);
  let count = Math.ceil(rank + 2 * strength + 12);
  let evaluations = 0;
  const solveAt = (n: number, guess: [number, number]) => {
    const band = diracAngularBand(m, aOmega, aMu, n);
    // n negative and n positive eigenvalues at a = 0; rank from zero outwards.
    const index = kappaSign > 0 ? n + rank : n - 1 - rank;
    const root = bandEigenvalue(band, index, guess);
    evaluations += root.counts;
    return { lambda: root.value, norm: band.norm };
  };
  // The a-dependent part of H is the compression of the multiplication by [[−aμ cosθ, aω sinθ], [aω sinθ, aμ cosθ]],
  // of norm ≤ max(|aω|, |aμ|): by Weyl's inequality λ lies that close to its a = 0 value κ = kappaSign·(j + ½).
  const kappa = kappaSign * (j + 0.5);
  const reach = Math.max(Math.abs(aOmega), Math.abs(aMu)) * (1 + 1e-12) + 1e-12;
  let previous = solveAt(count, [kappa - reach, kappa + reach]);
  for (let attempt = 1; attempt <= 8; attempt++) {
    // λ moves by little when the truncation grows: bisect from a narrow bracket about the last value (widened if it misses).
    const near = 64 * Number.EPSILON * Math.max(1, Math.abs(previous.lambda)) + 1e-15 * previous.norm;
    const next = solveAt(count + 12, [previous.lambda - near, previous.lambda + near]);
    const change = Math.abs(next.lambda - previous.lambda);
    const rounding = 8 * Number.EPSILON * next.norm;
    if (change <= Math.max(rounding, 4e-16 * Math.abs(next.lambda))) {
      const errorEstimate = (change + rounding) / Math.max(1, Math.abs(next.lambda));
      return {
        lambda: next.lambda,
        diagnostics: {
          method:
            'spectral (spin-±1/2 spherical harmonics): Sylvester counts of the symmetric band, bisection then Illinois steps on its determinant',
          steps: attempt,
          rhsEvaluations: evaluations,
          errorEstimate,
          message: `converged: λ moved by ${change.toExponential(1)} when the truncation grew from ${count} to ${count + 12} values of j`,
          truncation: count + 12,
          truncationChange: change,
        },
      };
    }
    previous = next;
    count += 12;
  }
  throw new ConvergenceError('Dirac angular expansion did not converge', {
    method: 'spectral (spin-±1/2 spherical harmonics)',
    steps: 8,
    rhsEvaluations: evaluations,
    errorEstimate: Infinity,
    message: 'λ still moving after 8 truncation increases',
    j,
    m,
    aOmega,
    aMu,
    kappaSign,
  });
}
