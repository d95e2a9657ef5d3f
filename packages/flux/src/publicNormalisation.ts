/**
 * The flux normalisations of normalisation.ts for callers outside penumbra:
 * the same formulas, with their arguments checked (field spin, a hole from
 * kerrHole, finite ω, k, λ, m) and a result outside the double range refused.
 * greybody calls the unchecked ones in normalisation.ts, whose arguments it
 * has already validated.
 */
import { FIELD_SPINS, InputError, requireFinite } from '@penumbra/core';
import { requireKerrHole, type KerrHole } from '@penumbra/kerr';
import * as raw from './normalisation.js';

function checkSpin(s: unknown): number {
  if (typeof s !== 'number' || !(FIELD_SPINS as readonly number[]).includes(s))
    throw new InputError('s', 'a field spin 0, 0.5, 1 or 2', s);
  return s;
}

function finiteResult(value: number, parameter: string, given: unknown): number {
  if (!Number.isFinite(value)) throw new InputError(parameter, 'a value for which the factor is a finite double', given);
  return value;
}

/** Γ = horizonFactor / |Z_in|² for the +|s| field; ω ≠ 0 and k ≠ 0 (k = ω − mΩ_H). */
export function horizonFactor(s: number, hole: KerrHole, omega: number, k: number): number {
  checkSpin(s);
  requireKerrHole(hole);
  requireFinite('omega', omega);
  requireFinite('k', k);
  if (omega === 0) throw new InputError('omega', 'a finite number ≠ 0', omega);
  if (k === 0) throw new InputError('k', 'a finite number ≠ 0 (k = ω − mΩ_H)', k);
  return finiteResult(raw.horizonFactor(s, hole, omega, k), 'k', k);
}

/**
 * |C_s|², the squared Teukolsky–Starobinsky constant, from λ_{+s}
 * (λ_{−s} = λ_{+s} + 2s because A_{−s} = A_{+s} + 2s).
 */
export function starobinskyConstantSquared(s: number, lambdaPlus: number, hole: KerrHole, m: number, omega: number): number {
  checkSpin(s);
  requireFinite('lambdaPlus', lambdaPlus);
  requireKerrHole(hole);
  requireFinite('m', m);
  requireFinite('omega', omega);
  const largest = Math.abs(lambdaPlus) > Math.abs(omega) ? 'lambdaPlus' : 'omega';
  return finiteResult(
    raw.starobinskyConstantSquared(s, lambdaPlus, hole, m, omega),
    largest,
    largest === 'omega' ? omega : lambdaPlus,
  );
}

/**
 * |h_s|² where D^{2s} maps the horizon-normalised −|s| ingoing solution
 * Δ^{s} e^{−ikr*} to h_s Δ^{−s} e^{−ikr*} (see normalisation.ts).
 */
export function horizonMapSquared(s: number, hole: KerrHole, k: number): number {
  checkSpin(s);
  requireKerrHole(hole);
  requireFinite('k', k);
  return finiteResult(raw.horizonMapSquared(s, hole, k), 'k', k);
}
