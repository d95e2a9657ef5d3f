/**
 * What a species costs to leave out. Two rules, each with a bound added to the
 * species' error instead of a solve (docs/emission.md, "Content totals"):
 *
 * - Boltzmann-negligible: every mode has ω > μ and, by geometric optics, only
 *   l ≤ ω·b_retro(a) + 1 are above the barrier (b_retro, the largest capture
 *   impact parameter, bounds a massive particle's too: its critical angular
 *   momentum is below the massless one at the same energy, e.g. 4Mμ against
 *   √27·Mμ at threshold on Schwarzschild). With |m| ≤ l and
 *   c = 1 − Ω_H·b_pro(a) > 0, k = ω − mΩ_H ≥ cω − Ω_H > 0, so Γ ≤ 1 and
 *   occupation ≤ e^{−k/T}/(1 − e^{−k_min/T}); summing (2l + 1) over the l above
 *   gives the bound ∫_μ^∞ (bω + 2)² e^{−(cω − Ω_H)/T} dω /(2π(1 − e^{−k_min/T})).
 *   Modes past the geometric-optics l are tunnelling-suppressed, not zero:
 *   the bound is a geometric-optics one, common practice.
 * - Nearly massless: a species with Mμ below MASSLESS_PROXY_MAX_MU uses the
 *   massless per-dof totals (spin 1: (2 × photon + 1 × scalar)/3, the μ → 0
 *   limit of the Proca field), with the relative bound MASSLESS_PROXY_BOUND(Mμ),
 *   measured (bench/massless-limit.bench.mjs).
 */
import { kerrHole, retrogradeImpactParameter } from '@penumbra/kerr';

/**
 * Prograde equatorial photon-orbit impact parameter in units of M,
 * b = 3√(M r) − a with r = 2M[1 + cos((2/3) arccos(−a/M))] (Bardeen, Press &
 * Teukolsky, ApJ 178, 347 (1972)): 3√3 at a = 0, 2 at a = M. Co-rotating modes
 * with m > ω·b_pro + 1 are below the barrier.
 */
function progradeImpactParameter(aStar: number): number {
  const a = Math.abs(aStar);
  const r = 2 * (1 + Math.cos((2 / 3) * Math.acos(-a)));
  return 3 * Math.sqrt(r) - a;
}

/**
 * ∫_x0^∞ p(x) e^{−λx} dx for the polynomial p with coefficients `coef`
 * (p(x) = Σ coef[k] x^k), as e^{−λx0} Σ_k p^{(k)}(x0)/λ^{k+1}.
 */
function polyExpTail(coef: readonly number[], lambda: number, x0: number): number {
  let c = coef.slice();
  let total = 0;
  for (let k = 0; c.length > 0; k++) {
    const value = c.reduce((s, ck, j) => s + ck * x0 ** j, 0);
    total += value / lambda ** (k + 1);
    c = c.slice(1).map((ck, j) => ck * (j + 1));
  }
  return Math.exp(-lambda * x0) * total;
}

/**
 * Bound on the per-dof number rate, power and |torque| of a field of mass Mμ
 * on the unit-mass hole of a* = aStar (geometric-optics l range, Γ ≤ 1);
 * Infinity when c = 1 − Ω_H·b_pro ≤ 0 or k_min ≤ 0 (superradiant reach: no bound).
 */
export function boltzmannSpeciesBound(aStar: number, fieldMass: number): { number: number; power: number; torque: number } {
  const hole = kerrHole({ a: aStar, mass: 1 });
  const T = hole.temperature;
  const W = hole.omegaH;
  const b = retrogradeImpactParameter(aStar);
  const c = 1 - W * progradeImpactParameter(aStar);
  const kMin = c * fieldMass - W;
  if (!(c > 0) || !(kMin > 0)) return { number: Infinity, power: Infinity, torque: Infinity };
  const lambda = c / T;
  const pref = Math.exp(W / T) / (2 * Math.PI * -Math.expm1(-kMin / T));
  // (bω + 2)² and ω(bω + 2)² and (bω + 2)³ (|m| ≤ l ≤ bω + 1 for the torque)
  const n = [4, 4 * b, b * b];
  const e = [0, 4, 4 * b, b * b];
  const t = [8, 12 * b, 6 * b * b, b * b * b];
  return {
    number: pref * polyExpTail(n, lambda, fieldMass),
    power: pref * polyExpTail(e, lambda, fieldMass),
    torque: pref * polyExpTail(t, lambda, fieldMass),
  };
}

/** Largest Mμ for which a species uses the massless per-dof totals (with MASSLESS_PROXY_BOUND). */
export const MASSLESS_PROXY_MAX_MU = 1e-4;

/** Largest Mμ for which MASSLESS_PROXY_BOUND was measured (bench/massless-limit.bench.mjs). */
export const MASSLESS_PROXY_RANGE_MAX = 0.05;

/**
 * Relative bound on |totals(Mμ) − totals(0)|/totals(0) per dof for Mμ ≤ 0.05,
 * every spin and quantity: 1·Mμ + 200·(Mμ)², above the measured differences
 * (at Mμ = 1e-3 at most 4e-4, the scalar number rate; at 0.05 at most 0.26)
 * by bench/massless-limit.bench.mjs.
 */
export function masslessProxyBound(fieldMass: number): number {
  return fieldMass + 200 * fieldMass * fieldMass;
}
