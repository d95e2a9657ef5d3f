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
import { InputError, requireMassless } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { checkProblem, type GreybodyProblem } from './validate.js';

/** ln n! for a non-negative integer n (a sum of logs: n ≤ 2·MAX_L + 2 here, and no overflow at l ≥ 86). */
function logFactorial(n: number): number {
  let f = 0;
  for (let i = 2; i <= n; i++) f += Math.log(i);
  return f;
}

/** ln n!! for a non-negative integer n. */
function logDoubleFactorial(n: number): number {
  let f = 0;
  for (let i = n; i > 1; i -= 2) f += Math.log(i);
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
  // In logarithms: the factorials overflow at l ≥ 86 and the power under- or overflows at large l.
  const logPre = logFactorial(l - s) + logFactorial(l + s) - logFactorial(2 * l) - logDoubleFactorial(2 * l + 1);
  const fermion = !Number.isInteger(s);
  let logProd = 0;
  const nMax = fermion ? l + 0.5 : l;
  for (let n = 1; n <= nMax; n++) {
    const nn = fermion ? n - 0.5 : n;
    logProd += Math.log1p((k / (nn * kap)) ** 2);
  }
  const boson = fermion ? 1 : (2 * k) / kap;
  if (boson === 0) return 0;
  const logGamma = 2 * logPre + logProd + Math.log(Math.abs(boson)) + (2 * l + 1) * Math.log((hole.rPlus - hole.rMinus) * omega);
  const gamma = Math.sign(boson) * Math.exp(logGamma);
  if (!Number.isFinite(gamma) || gamma === 0) {
    throw new InputError(
      'omega',
      'a frequency where the formula stays in double range',
      omega,
      `the low-frequency formula gives |Γ| = 10^${(logGamma / Math.LN10).toFixed(1)}, outside the double range (greybody reports such values as log10Gamma)`,
    );
  }
  return gamma;
}
