/**
 * The radial pair of the massive Dirac field on Kerr (Chandrasekhar, Proc.
 * R. Soc. A 349, 571 (1976); derivation and conventions: docs/massive-dirac.md).
 * With ψ ∝ e^{−iωt + imφ}, P₊ = Δ^{1/2} R₊, P₋ = R₋, K = (r² + a²)ω − am:
 *
 *   dP₊/dr = −i(K/Δ) P₊ + ((λ − iμr)/√Δ) P₋
 *   dP₋/dr =  ((λ + iμr)/√Δ) P₊ + i(K/Δ) P₋
 *
 * and |P₊|² − |P₋|² is independent of r (the conserved current).
 */
import type { KerrHole } from '@penumbra/kerr';
import type { EvaluationCounter } from '../rhs.js';

/** One massive Dirac radial problem: hole, frequency, azimuthal number, mass μ and separation constant λ. */
export interface DiracRadialProblem {
  hole: KerrHole;
  omega: number;
  m: number;
  /** field mass μ (units of 1/M), ≥ 0 */
  mu: number;
  /** Chandrasekhar's separation constant λ (real) */
  lambda: number;
}

/** Right-hand side on y = (Re P₊, Im P₊, Re P₋, Im P₋); allocation-free. */
export function diracRhs(p: DiracRadialProblem): (dy: Float64Array | number[], y: Float64Array | number[], r: number) => void {
  const { hole, omega, m, mu, lambda } = p;
  const { a, rPlus, rMinus } = hole;
  return (dy, y, r) => {
    const delta = (r - rPlus) * (r - rMinus);
    const sq = Math.sqrt(delta);
    const kd = ((r * r + a * a) * omega - a * m) / delta;
    const g = lambda / sq;
    const h = (mu * r) / sq;
    // −i kd P₊ + (g − i h) P₋
    dy[0] = kd * y[1] + g * y[2] + h * y[3];
    dy[1] = -kd * y[0] + g * y[3] - h * y[2];
    // (g + i h) P₊ + i kd P₋
    dy[2] = g * y[0] - h * y[1] - kd * y[3];
    dy[3] = g * y[1] + h * y[0] + kd * y[2];
  };
}

/**
 * The pair's constants as the extrapolation loop reads them to evaluate the
 * right-hand side inline (gbsStepper.ts): the same operations as diracRhs,
 * so the same doubles, without two calls per evaluation.
 */
export interface DiracKernel {
  rPlus: number;
  rMinus: number;
  /** a² */
  a2: number;
  /** a·m */
  am: number;
  omega: number;
  mu: number;
  lambda: number;
  /** counts the evaluations */
  counter: EvaluationCounter;
}

/** The kernel of the pair of `p`, counting in `counter`. */
export function diracKernel(p: DiracRadialProblem, counter: EvaluationCounter): DiracKernel {
  const { hole, omega, m, mu, lambda } = p;
  return { rPlus: hole.rPlus, rMinus: hole.rMinus, a2: hole.a * hole.a, am: hole.a * m, omega, mu, lambda, counter };
}
