/**
 * The near-region (two-temperature) form of the absorption probability of a
 * Kerr hole at low frequency: Castro, Maloney & Strominger, Phys. Rev. D 82,
 * 024008 (2010) for the temperatures, the frequencies and the scalar; the
 * weights and the matching factor for every spin are derived in
 * docs/near-region.md. An analytic formula, not a solve.
 */
import { isFermion, type FieldSpin } from '@penumbra/core';
import { cardyEntropy, kerrHole, nearRegion } from '@penumbra/kerr';
import type { GreybodyProblem } from '@penumbra/flux';
import { logAbsGammaSquared, logCosh, logSinh } from './gammaModulus.js';
import { checkNearRegionProblem, type CheckedNearRegionProblem } from './problem.js';
import { conformalWeights, logMatchingFactor, thermalFactor, type ThermalFactor } from './weights.js';

/** ln of the smallest normal double, 2.2250738585072014e-308. */
const LN_MIN_NORMAL = Math.log(2.2250738585072014e-308);

/** The near-region quantities of one mode of one hole (geometric units, temperatures dimensionless). */
export interface NearRegionForm {
  hole: { a: number; mass: number };
  mode: { field: { spin: FieldSpin }; l: number; m: number };
  omega: number;
  /** left temperature T_L = (r+ + r−)/(4πa) */
  TL: number;
  /** right temperature T_R = (r+ − r−)/(4πa) */
  TR: number;
  /** central charges c_L = c_R = 12J, J = Ma */
  cL: number;
  cR: number;
  /** left frequency ω_L = 2M²ω/a */
  omegaL: number;
  /** right frequency ω_R = 2M²ω/a − m */
  omegaR: number;
  /** conformal weights h_L = l + 1 − s, h_R = l + 1 */
  hL: number;
  hR: number;
  /** the hyperbolic function of ω_L/2T_L + ω_R/2T_R: sinh (bosons) or cosh (fermions) */
  thermalFactor: ThermalFactor;
  /** ω_L/T_L + ω_R/T_R, equal to (ω − mΩ_H)/T_H */
  boltzmannExponent: number;
  /** ln of the matching factor N fixed by the far region */
  logMatchingFactor: number;
  /** the near-region absorption probability (0 when it underflows; see log10GammaNearRegion) */
  gammaNearRegion: number;
  /** log10 |Γ_near| (absent when Γ_near = 0 exactly: a boson at k = 0) */
  log10GammaNearRegion?: number;
  /** Cardy entropy (π²/3)(c_L T_L + c_R T_R) */
  cardyEntropy: number;
  /** Bekenstein–Hawking entropy A/4, equal to cardyEntropy */
  entropy: number;
}

/**
 * The near-region form of Γ for one mode (validated like `greybody`, but any
 * 1e-8 M ≤ a < M and 0 < Mω ≤ 30; a = 0 and a < 0 are refused, see the package
 * README; a ≥ 1e-8 M, Mω ≤ 30). Holds for Mω ≪ 1; its first correction is O(Mω).
 *
 * @example nearRegionForm({ hole: { a: 0.5 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 1e-3 })
 */
export function nearRegionForm(problem: GreybodyProblem): NearRegionForm {
  return formOf(checkNearRegionProblem(problem));
}

/** The form of a checked problem (used by the comparison, which checks with the solver's bound on a). */
export function formOf(p: CheckedNearRegionProblem): NearRegionForm {
  const { spin, l, m, a, mass, omega } = p;
  const hole = kerrHole({ a, mass });
  const temperatures = nearRegion(hole);
  const { TL, TR, cL, cR } = temperatures;
  const omegaL = (2 * mass * mass * omega) / a;
  const omegaR = omegaL - m;
  const { hL, hR } = conformalWeights(spin, l);
  const yL = omegaL / (2 * Math.PI * TL);
  const yR = omegaR / (2 * Math.PI * TR);
  // ω_L/2T_L + ω_R/2T_R = π(y_L + y_R) = 2π n₊, n₊ = (2Mr+ω − am)/(r+ − r−): formed from r+ directly, exact at k = 0.
  const nPlus = (2 * mass * hole.rPlus * omega - a * m) / (4 * Math.PI * a * TR); // r+ − r− = 4πaT_R, free of cancellation
  const x = 2 * Math.PI * nPlus;
  const fermion = isFermion(spin);
  const logN = logMatchingFactor(spin, l, mass * omega, TL);
  const logRest =
    (2 * hL - 1) * Math.log(TL) + (2 * hR - 1) * Math.log(TR) + logAbsGammaSquared(hL, yL) + logAbsGammaSquared(hR, yR);
  const logHyperbolic = fermion ? logCosh(x) : x === 0 ? -Infinity : logSinh(Math.abs(x));
  const lnGamma = logN + logRest + logHyperbolic;
  const sign = fermion ? 1 : Math.sign(x);
  const gammaNearRegion = lnGamma < LN_MIN_NORMAL ? 0 : sign * Math.exp(lnGamma);
  return {
    hole: { a, mass },
    mode: { field: { spin }, l, m },
    omega,
    TL,
    TR,
    cL,
    cR,
    omegaL,
    omegaR,
    hL,
    hR,
    thermalFactor: thermalFactor(spin),
    boltzmannExponent: omegaL / TL + omegaR / TR,
    logMatchingFactor: logN,
    gammaNearRegion,
    ...(Number.isFinite(lnGamma) ? { log10GammaNearRegion: lnGamma / Math.LN10 } : {}),
    cardyEntropy: cardyEntropy(temperatures),
    entropy: hole.entropy,
  };
}
