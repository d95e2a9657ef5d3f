/** Input validation shared by the flux API: typed errors naming the parameter and its range. */
import { InputError, requireFinite } from '@penumbra/kerr';

export const SUPPORTED_SPINS = [0, 0.5, 1, 2] as const;
export type FieldSpin = (typeof SUPPORTED_SPINS)[number];
/** Largest |a|/M the horizon-based solver accepts. */
export const MAX_SPIN = 0.9999;
export const MIN_MOMEGA = 1e-5;
export const MAX_MOMEGA = 30;

export function validateSpin(spin: unknown): FieldSpin {
  if (typeof spin !== 'number' || !(SUPPORTED_SPINS as readonly number[]).includes(spin)) {
    throw new InputError('spin', 'one of 0, 1/2, 1, 2', spin);
  }
  return spin as FieldSpin;
}

export function validateMode(spin: number, l: unknown, m: unknown): { l: number; m: number } {
  requireFinite('l', l, `l ≥ ${spin} with l − s an integer`);
  requireFinite('m', m, '|m| ≤ l with m − s an integer');
  const L = l as number, Mz = m as number;
  if (L < spin || !Number.isInteger(L - spin)) {
    throw new InputError('l', `l ≥ |s| = ${spin} with l − s an integer`, L);
  }
  if (Math.abs(Mz) > L || !Number.isInteger(Mz - spin)) {
    throw new InputError('m', `|m| ≤ l = ${L} with m − s an integer`, Mz);
  }
  return { l: L, m: Mz };
}

export function validateHole(a: unknown, mass: unknown): { a: number; mass: number } {
  requireFinite('mass', mass, 'a finite number > 0');
  if (!((mass as number) > 0)) throw new InputError('mass', 'a finite number > 0', mass);
  const M = mass as number;
  requireFinite('a', a, `|a| ≤ ${MAX_SPIN} M`);
  if (Math.abs(a as number) > MAX_SPIN * M) {
    throw new InputError(
      'a',
      `|a| ≤ ${MAX_SPIN} M = ${MAX_SPIN * M}`,
      a,
      'the horizon series start needs r+ − r− > 0; the extremal hole is a limit, not an input',
    );
  }
  return { a: a as number, mass: M };
}

export function validateOmega(omega: unknown, mass: number): number {
  const allowed = `${MIN_MOMEGA} ≤ Mω ≤ ${MAX_MOMEGA} (ω in units of 1/M)`;
  requireFinite('omega', omega, allowed);
  const w = omega as number;
  if (!(w > 0)) throw new InputError('omega', allowed, w, 'ω must be positive');
  if (w * mass < MIN_MOMEGA || w * mass > MAX_MOMEGA) throw new InputError('omega', allowed, w);
  return w;
}

export function validateTol(tol: unknown): number {
  requireFinite('tol', tol, '1e-12 ≤ tol ≤ 1e-2');
  const t = tol as number;
  if (!(t >= 1e-12 && t <= 1e-2)) throw new InputError('tol', '1e-12 ≤ tol ≤ 1e-2', t);
  return t;
}
