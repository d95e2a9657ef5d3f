/**
 * Low-frequency limit of the greybody factor, Page, Phys. Rev. D 13, 198
 * (1976), eqs. (13)–(14), after Starobinsky & Churilov, Sov. Phys. JETP 38, 1
 * (1974):
 *
 *   bosons:   Γ ≈ [(l−s)!(l+s)!/((2l)!(2l+1)!!)]² Π_{n=1}^{l} [1 + (k/(nκ))²] · 2(k/κ) · ((r+ − r−)ω)^{2l+1}
 *   fermions: the product runs over n − 1/2 (n = 1 … l + 1/2) and the factor 2k/κ is absent,
 *
 * with k = ω − mΩ_H. Valid for Mω ≪ 1 and (l + 1)Mω ≪ 1; its first correction
 * is roughly a factor 1 + 2πMω.
 */
import { requireMassless } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { checkProblem, type GreybodyProblem } from './validate.js';

function factorial(n: number): number {
  let f = 1;
  for (let i = 2; i <= n; i++) f *= i;
  return f;
}

/** Double factorial n!! for a non-negative integer n. */
function doubleFactorial(n: number): number {
  let f = 1;
  for (let i = n; i > 1; i -= 2) f *= i;
  return f;
}

/**
 * The low-frequency (Page–Starobinsky) approximation to Γ for the same
 * problem as `greybody` (validated the same way). An analytic formula, not a
 * solve: it carries no error estimate and holds only for Mω ≪ 1.
 */
export function lowFrequencyGreybody(problem: GreybodyProblem): number {
  const { spin: s, fieldMass, l, m, a, mass, omega } = checkProblem(problem, true);
  requireMassless({ spin: s, mass: fieldMass }, 'mode.field.mass', 'the low-frequency formula');
  const hole = kerrHole({ a, mass });
  const k = omega - m * hole.omegaH;
  const kap = hole.kappa;
  const pre = (factorial(l - s) * factorial(l + s)) / (factorial(2 * l) * doubleFactorial(2 * l + 1));
  const fermion = !Number.isInteger(s);
  let prod = 1;
  const nMax = fermion ? l + 0.5 : l;
  for (let n = 1; n <= nMax; n++) {
    const nn = fermion ? n - 0.5 : n;
    prod *= 1 + (k / (nn * kap)) ** 2;
  }
  const boson = fermion ? 1 : (2 * k) / kap;
  return pre * pre * prod * boson * Math.pow((hole.rPlus - hole.rMinus) * omega, 2 * l + 1);
}
