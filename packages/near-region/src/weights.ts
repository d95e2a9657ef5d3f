/**
 * Conformal weights and the matching factor of the near-region form, derived
 * in docs/near-region.md from the hypergeometric solution of the near-region
 * Teukolsky equation (field of spin s, ingoing at the horizon) matched to the
 * flat far-region solution:
 *
 *   Γ_near = N · T_L^{2h_L−1} T_R^{2h_R−1} · H(ω_L/2T_L + ω_R/2T_R)
 *            · |Γ(h_L + iω_L/2πT_L)|² |Γ(h_R + iω_R/2πT_R)|²
 *
 * with h_L = l + 1 − s, h_R = l + 1, H = sinh for bosons and cosh for fermions
 * (h_L − h_R = −s half-integer), and
 *
 *   N = (1/π) [(l + s)! / ((2l)! (2l + 1)!)]² (4Mω)^{2l+1} T_L^{2 − 2h_L − 2h_R}.
 *
 * For s = 0 the weights are those of Castro, Maloney & Strominger, Phys. Rev.
 * D 82, 024008 (2010).
 */
import { isFermion, type FieldSpin } from '@penumbra/core';
import { logFactorial } from './gammaModulus.js';

/** Left and right conformal weights (h_L, h_R) of a mode. */
export interface ConformalWeights {
  /** h_L = l + 1 − s */
  hL: number;
  /** h_R = l + 1 */
  hR: number;
}

/** The conformal weights of a field of spin `spin` in the multipole `l`: h_L = l + 1 − s, h_R = l + 1. */
export function conformalWeights(spin: FieldSpin, l: number): ConformalWeights {
  return { hL: l + 1 - spin, hR: l + 1 };
}

/** Which hyperbolic function carries the Boltzmann factors: sinh for bosons, cosh for fermions. */
export type ThermalFactor = 'sinh' | 'cosh';

/** sinh for bosons (Γ changes sign with k), cosh for fermions (never superradiant). */
export function thermalFactor(spin: FieldSpin): ThermalFactor {
  return isFermion(spin) ? 'cosh' : 'sinh';
}

/**
 * ln of the matching factor N (see the module comment): the power of Mω and
 * the constants that the far region fixes, with T_L the left temperature.
 */
export function logMatchingFactor(spin: FieldSpin, l: number, massTimesOmega: number, TL: number): number {
  const { hL, hR } = conformalWeights(spin, l);
  const constant = 2 * (logFactorial(l + spin) - logFactorial(2 * l) - logFactorial(2 * l + 1)) - Math.log(Math.PI);
  return constant + (2 * l + 1) * Math.log(4 * massTimesOmega) + (2 - 2 * hL - 2 * hR) * Math.log(TL);
}
