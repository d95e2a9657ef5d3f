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
import { EigenvalueDecomposition } from 'ml-matrix';
import { diracAngularMatrix } from './diracAngularMatrix.js';

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
  /** ‖Hb − λb‖ of the normalised eigenvector */
  residual: number;
}

/** The separation constant λ and how it was obtained. */
export interface DiracAngularEigenvalue {
  /** Chandrasekhar's λ; λ = kappaSign·(j + ½) at a = 0 */
  lambda: number;
  diagnostics: DiracAngularDiagnostics;
}

/** Largest |aω| and |aμ| accepted (the radial solvers' range of Mω times |a| ≤ M). */
export const MAX_DIRAC_A_OMEGA = 30;

const TAIL = 1e-15;

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
 * Throws InputError for a bad problem, ConvergenceError if the eigenvector's
 * tail does not fall below 1e-15.
 *
 * @example diracAngularEigenvalue({ j: 0.5, m: 0.5, aOmega: 0.3, aMu: 0.1, kappaSign: -1 }).lambda
 */
export function diracAngularEigenvalue(problem: DiracAngularProblem): DiracAngularEigenvalue {
  const { j, m, aOmega, aMu, kappaSign } = check(problem);
  const rank = j - Math.abs(m);
  const strength = Math.abs(aOmega) + Math.abs(aMu);
  let count = Math.ceil(rank + 2 * strength + 20);
  for (let attempt = 1; attempt <= 6; attempt++) {
    const H = diracAngularMatrix(m, aOmega, aMu, count);
    const evd = new EigenvalueDecomposition(H, { assumeSymmetric: true });
    const values = evd.realEigenvalues;
    const order = values.map((_, i) => i).sort((p, q) => values[p] - values[q]);
    // count negative and count positive eigenvalues; rank from zero outwards.
    const column = kappaSign > 0 ? order[count + rank] : order[count - 1 - rank];
    const V = evd.eigenvectorMatrix;
    const n = 2 * count;
    const tail = Math.max(Math.abs(V.get(n - 1, column)), Math.abs(V.get(n - 2, column)));
    if (tail < TAIL) {
      const lambda = values[column];
      const residual = residualOf(H, V, column, lambda);
      const errorEstimate = Math.max(residual, 4 * Number.EPSILON * (j + 1 + strength)) / Math.max(1, Math.abs(lambda));
      return {
        lambda,
        diagnostics: {
          method: 'spectral (spin-±1/2 spherical harmonics, dense symmetric eigen-solve)',
          steps: attempt,
          rhsEvaluations: attempt,
          errorEstimate,
          message: `converged: eigenvector tail ${tail.toExponential(1)} < ${TAIL} with ${count} values of j`,
          truncation: count,
          residual,
        },
      };
    }
    count = Math.ceil(count * 1.5);
  }
  throw new ConvergenceError('Dirac angular expansion did not converge', {
    method: 'spectral (spin-±1/2 spherical harmonics)',
    steps: 6,
    rhsEvaluations: 6,
    errorEstimate: Infinity,
    message: 'eigenvector tail above 1e-15 after 6 truncations',
    j,
    m,
    aOmega,
    aMu,
    kappaSign,
  });
}

function residualOf(H: import('ml-matrix').Matrix, V: import('ml-matrix').Matrix, column: number, lambda: number): number {
  const n = H.rows;
  let r2 = 0;
  for (let i = 0; i < n; i++) {
    let s = -lambda * V.get(i, column);
    for (let k = Math.max(0, i - 3); k <= Math.min(n - 1, i + 3); k++) s += H.get(i, k) * V.get(k, column);
    r2 += s * s;
  }
  return Math.sqrt(r2);
}
