/** Input checks for the emission API: typed InputError naming the parameter and its range. */
import { InputError, requireFinite } from '@penumbra/kerr';
import { MAX_SOLVER_A_RATIO as MAX_SPIN, parseFieldSpin as validateSpin, type FieldSpin } from '@penumbra/core';

export { validateSpin };
export type { FieldSpin };

export const TOL_RANGE = { min: 1e-10, max: 1e-2 } as const;

export function validateEmissionTol(tol: unknown, name = 'tol'): number {
  const allowed = `${TOL_RANGE.min} ≤ ${name} ≤ ${TOL_RANGE.max}`;
  requireFinite(name, tol, allowed);
  const t = tol as number;
  if (!(t >= TOL_RANGE.min && t <= TOL_RANGE.max)) throw new InputError(name, allowed, t);
  return t;
}

export function validateMass(mass: unknown, name = 'mass'): number {
  requireFinite(name, mass, 'a finite number > 0');
  if (!((mass as number) > 0)) throw new InputError(name, 'a finite number > 0', mass);
  return mass as number;
}

/** Spin a (same units as the mass); |a| ≤ MAX_SPIN·M as for the greybody solver. */
export function validateSpinParameter(a: unknown, mass: number, name = 'a'): number {
  const allowed = `|${name}| ≤ ${MAX_SPIN} M`;
  requireFinite(name, a, allowed);
  if (Math.abs(a as number) > MAX_SPIN * mass) {
    throw new InputError(name, allowed, a, 'the extremal hole is a limit of the horizon-based greybody solver, not an input');
  }
  return a as number;
}

/** A non-empty, strictly increasing grid of positive finite frequencies. */
export function validateGrid(grid: unknown, name = 'omega'): number[] {
  if (!Array.isArray(grid) || grid.length === 0) {
    throw new InputError(name, 'a non-empty array of increasing frequencies > 0', grid);
  }
  const out: number[] = [];
  for (let i = 0; i < grid.length; i++) {
    const w = grid[i];
    requireFinite(`${name}[${i}]`, w, 'a finite number > 0');
    if (!(w > 0)) throw new InputError(`${name}[${i}]`, 'a finite number > 0', w);
    if (i > 0 && !(w > out[i - 1])) {
      throw new InputError(name, 'strictly increasing values', grid, `${name}[${i}] = ${w} ≤ ${name}[${i - 1}] = ${out[i - 1]}`);
    }
    out.push(w);
  }
  return out;
}
