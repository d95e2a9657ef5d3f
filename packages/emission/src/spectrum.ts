/**
 * Emission spectra per degree of freedom at given frequencies:
 *   d²N/(dt dω) = (1/2π) Σ_{l,m} Γ_{slm}(ω)/(exp((ω − mΩ_H)/T_H) ∓ 1),
 *   d²E/(dt dω) = ω d²N/(dt dω),  d²J/(dt dω) = (1/2π) Σ m Γ/(…).
 *
 * Truncation (same style as the flux cross-section): whole l-shells from
 * l = s upward; stop once l + 1/2 exceeds ω·b_retro(a) (the largest capture
 * impact parameter, so later shells sit below the barrier) and two shells in a
 * row add less than tol of the running sum; the dropped tail is bounded by
 * S_last·q/(1 − q), q = S_last/S_previous. Within a shell (a ≠ 0), modes with
 * ω > mΩ_H whose Boltzmann bound (Γ ≤ 1 there) times the number of remaining
 * m is below tol/100 of the sum are not solved; that bound is added to the
 * dropped part.
 */
import { ConvergenceError, InputError } from '@penumbra/kerr';
import { MOMEGA_RANGE } from '@penumbra/flux';

const MAX_MOMEGA = MOMEGA_RANGE.max;
import { modeContext, modeRate, occupation, retrogradeImpactParameter, shellMs, type ModeContext } from './modes.js';
import { validateEmissionTol, validateGrid, validateMass, validateSpin, validateSpinParameter, type FieldSpin } from './validate.js';

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
  lMax: number;
  modes: number;
}

export interface SpectrumOptions {
  /** relative accuracy of each point (default 1e-6, range 1e-10 … 1e-2) */
  tol?: number;
  /** largest l allowed before the sum counts as not converged (default 80) */
  maxL?: number;
  /** called after each frequency (progress reporting) */
  onPoint?: (done: number, total: number) => void;
}

export interface SpectrumProblem {
  spin: number;
  /** spin parameter a (units of mass) */
  a: number;
  /** hole mass M (geometric units, default 1) */
  mass?: number;
}

export interface SpectrumResult {
  spin: FieldSpin;
  a: number;
  mass: number;
  points: SpectrumPoint[];
  diagnostics: { gammaCalls: number; rhsEvaluations: number; tol: number };
}

/** Spectrum point for a unit-mass hole with a ≥ 0. */
export function spectrumPointUnit(ctx: ModeContext, omega: number, tol: number, maxL = 80): SpectrumPoint {
  const lCut = omega * retrogradeImpactParameter(ctx.aStar) - 0.5;
  const shells: number[] = [];
  let total = 0;
  let torque = 0;
  let errAbs = 0;
  let skipped = 0;
  let skippedTorque = 0;
  let modes = 0;
  let below = 0;
  let l = ctx.spin as number;
  for (; l <= maxL; l++) {
    const { ms, weight } = shellMs(ctx, l);
    let shell = 0;
    for (let i = 0; i < ms.length; i++) {
      const m = ms[i];
      const k = omega - m * ctx.hole.omegaH;
      if (k > 0) {
        // Γ ≤ 1 here, and every later m in this shell has a larger k.
        const bound = (occupation(ctx.fermion, k / ctx.hole.temperature) / (2 * Math.PI)) * (ms.length - i);
        if (bound < 0.01 * tol * (total + shell)) {
          skipped += bound;
          skippedTorque += bound * l;
          break;
        }
      }
      const r = modeRate(ctx, l, m, omega);
      shell += weight * r.rate;
      torque += weight * m * r.rate;
      errAbs += weight * r.rate * r.relError;
      modes++;
    }
    total += shell;
    shells.push(shell);
    if (l > lCut && l >= (ctx.spin as number) + 1 && shell <= tol * total) {
      if (++below >= 2) break;
    } else below = 0;
  }
  if (below < 2) throw new ConvergenceError('spectrum l-sum did not converge within maxL', { omega, maxL, lCut, total });
  const last = shells[shells.length - 1];
  const prev = shells[shells.length - 2];
  let tail = 0;
  let tailTorque = 0;
  if (last > 0) {
    const q = last / prev;
    if (!(q < 1)) throw new ConvergenceError('spectrum l-shells are not decreasing', { omega, last, prev, l });
    tail = (last * q) / (1 - q);
    // Σ_{j≥1} (l + j) S q^j bounds |torque| of the dropped shells (|m| ≤ l + j).
    tailTorque = last * ((l * q) / (1 - q) + q / ((1 - q) * (1 - q)));
  }
  const dropped = tail + skipped;
  return {
    omega,
    number: total,
    energy: omega * total,
    torque: ctx.aStar === 0 ? 0 : torque,
    relError: total > 0 ? (errAbs + dropped) / total : 0,
    droppedBound: dropped,
    lMax: l,
    modes,
    torqueDroppedBound: tailTorque + skippedTorque,
  };
}

/** Equally spaced grid START:STOP:COUNT helper. */
export function linearGrid(start: number, stop: number, count: number): number[] {
  if (!(count >= 1) || !Number.isInteger(count)) throw new InputError('count', 'a positive integer', count);
  if (count === 1) return [start];
  return Array.from({ length: count }, (_, i) => start + ((stop - start) * i) / (count - 1));
}

/**
 * The emission spectrum per degree of freedom on a frequency grid (ω in units
 * of 1/M, strictly increasing, 0 < Mω ≤ 30).
 */
export function emissionSpectrum(problem: SpectrumProblem, grid: readonly number[], options: SpectrumOptions = {}): SpectrumResult {
  const spin = validateSpin(problem.spin);
  const mass = validateMass(problem.mass ?? 1);
  const a = validateSpinParameter(problem.a, mass);
  const omegas = validateGrid(grid);
  const tol = validateEmissionTol(options.tol ?? 1e-6);
  if (omegas[omegas.length - 1] * mass > MAX_MOMEGA) {
    throw new InputError('omega', `0 < Mω ≤ ${MAX_MOMEGA}`, omegas[omegas.length - 1], 'the greybody solver covers Mω ≤ 30');
  }
  const ctx = modeContext(spin, Math.abs(a) / mass, Math.min(Math.max(tol / 10, 1e-12), 1e-2));
  const sign = a < 0 ? -1 : 1;
  const points = omegas.map((w, i) => {
    const p = spectrumPointUnit(ctx, w * mass, tol, options.maxL);
    options.onPoint?.(i + 1, omegas.length);
    // Rescale from the unit-mass hole: d²N/dtdω and d²J/dtdω are scale-free (ħ = 1), d²E/dtdω ∝ 1/M.
    return { ...p, omega: w, energy: p.energy / mass, torque: sign * p.torque };
  });
  return { spin, a, mass, points, diagnostics: { ...ctx.counters, tol } };
}
