/**
 * One point of the emission spectrum per degree of freedom, for the unit-mass
 * hole with a* ≥ 0:
 *   d²N/(dt dω) = (1/2π) Σ_{l,m} Γ_{slm}(ω)/(exp((ω − mΩ_H)/T_H) ∓ 1),
 *   d²E/(dt dω) = ω d²N/(dt dω),  d²J/(dt dω) = (1/2π) Σ m Γ/(…).
 *
 * Truncation: core's l-shell rule (sumLShells) from l = s upward, with the
 * geometric-optics cut l + 1/2 > ω·b_retro(a) (the largest capture impact
 * parameter, so later shells sit below the barrier), at least one shell past
 * the lowest, and two negligible shells in a row; the dropped tail is bounded
 * by S_last·q/(1 − q) and its torque by Σ_j (l + j)·S_last·q^j. Within a shell
 * (a ≠ 0), modes with ω > mΩ_H whose Boltzmann bound (Γ ≤ 1 there) times the
 * number of remaining m is below tol/100 of the sum are not solved; that
 * bound is added to the dropped part.
 */
import { sumLShells } from '@penumbra/core';
import { modeRate, occupation, retrogradeImpactParameter, shellMs, torqueTailBound, type ModeContext } from './modes.js';

/** The spectrum at one frequency, per degree of freedom. */
export interface SpectrumPoint {
  /** frequency ω (units 1/M) */
  omega: number;
  /** d²N/(dt dω) per degree of freedom (dimensionless: rate per unit ω per unit time) */
  number: number;
  /** d²E/(dt dω) = ω d²N/(dt dω), units 1/M */
  energy: number;
  /** d²J/(dt dω) (dimensionless, ħ = 1) */
  torque: number;
  /** estimated relative error of `number` (Γ errors plus the truncation bound) */
  relError: number;
  /** bound on the dropped part of `number` */
  droppedBound: number;
  /** bound on |dropped part| of `torque` */
  torqueDroppedBound: number;
  /** largest l summed */
  lMax: number;
  /** modes solved */
  modes: number;
}

/** The geometric-optics cut of the l-sum at Mω for a hole of a* = |a|/M. */
export function spectrumLCut(aStar: number, mOmega: number): number {
  return mOmega * retrogradeImpactParameter(aStar) - 0.5;
}

/** Spectrum point for the unit-mass hole of `ctx` (a* ≥ 0) at frequency ω. */
export function spectrumPointUnit(ctx: ModeContext, omega: number, tol: number, maxL = 80): SpectrumPoint {
  const lCut = spectrumLCut(ctx.aStar, omega);
  // The running sum of the finished shells, the scale of the Boltzmann skip below.
  let total = 0;
  let torque = 0;
  let errAbs = 0;
  let skipped = 0;
  let skippedTorque = 0;
  let modes = 0;
  const shell = (l: number): number => {
    const { ms, weight } = shellMs(ctx, l);
    let sum = 0;
    for (let i = 0; i < ms.length; i++) {
      const m = ms[i];
      const k = omega - m * ctx.hole.omegaH;
      if (k > 0) {
        // Γ ≤ 1 here, and every later m in this shell has a larger k.
        const bound = (occupation(ctx.fermion, k / ctx.hole.temperature) / (2 * Math.PI)) * (ms.length - i);
        if (bound < 0.01 * tol * (total + sum)) {
          skipped += bound;
          skippedTorque += bound * l;
          break;
        }
      }
      const r = modeRate(ctx, l, m, omega);
      sum += weight * r.rate;
      torque += weight * m * r.rate;
      errAbs += weight * r.rate * r.relError;
      modes++;
    }
    total += sum;
    return sum;
  };
  const summed = sumLShells(
    ctx.spin,
    { lCut, tol, maxL, lMinToStop: ctx.spin + 1, context: () => ({ ...ctx.counters, omega }) },
    shell,
    'spectrum l-sum',
  );
  const last = summed.shells[summed.shells.length - 1].sum;
  const dropped = summed.tailBound + skipped;
  return {
    omega,
    number: summed.total,
    energy: omega * summed.total,
    torque: ctx.aStar === 0 ? 0 : torque,
    relError: summed.total > 0 ? (errAbs + dropped) / summed.total : 0,
    droppedBound: dropped,
    lMax: summed.lMax,
    modes,
    torqueDroppedBound: torqueTailBound(last, summed.q, summed.lMax) + skippedTorque,
  };
}
