/**
 * Input checks shared by the emission solves: problem objects with known keys
 * only, frequency grids, l limits. Errors name the parameter the caller gave
 * (`problem.grid`, `grid[3]`, `maxL`) and its allowed range.
 */
import {
  InputError,
  MAX_L,
  gridValues,
  numberIn,
  requireFinite,
  requireKeyedObject,
  requireObject,
  type FrequencyGrid,
} from '@penumbra/core';
import { MOMEGA_RANGE } from '@penumbra/flux';

/** A problem object with the given keys only (missing optional keys are fine): core's requireKeyedObject. */
export function requireProblem(problem: unknown, keys: readonly string[], parameter = 'problem'): Record<string, unknown> {
  return requireKeyedObject(parameter, problem, keys);
}

const GRID_ALLOWED = 'an array of increasing frequencies > 0, or a FrequencyGrid { spacing, from, to, count } | { values }';

/**
 * The frequencies of a grid (an array, or core's FrequencyGrid): non-empty,
 * strictly increasing, each finite and > 0, with Mω ≤ 30 (the greybody
 * solver's range; below its lower end the low-frequency formula takes over).
 */
export function validateGrid(grid: unknown, mass: number, parameter = 'grid'): number[] {
  let values: unknown[];
  if (Array.isArray(grid)) values = grid;
  else {
    const g = requireObject(parameter, grid, GRID_ALLOWED);
    if ('values' in g) {
      if (!Array.isArray(g.values)) throw new InputError(`${parameter}.values`, 'an array of frequencies', g.values);
      values = g.values;
    } else {
      if (g.spacing !== 'linear' && g.spacing !== 'log')
        throw new InputError(`${parameter}.spacing`, "'linear' or 'log'", g.spacing);
      values = gridValues(g as FrequencyGrid);
    }
  }
  if (values.length === 0) throw new InputError(parameter, GRID_ALLOWED, grid);
  const out: number[] = [];
  values.forEach((w, i) => {
    const x = requireFinite(`${parameter}[${i}]`, w, 'a finite number > 0');
    if (!(x > 0)) throw new InputError(`${parameter}[${i}]`, 'a finite number > 0', x);
    if (i > 0 && !(x > out[i - 1])) {
      throw new InputError(
        parameter,
        'strictly increasing values',
        grid,
        `${parameter}[${i}] = ${x} ≤ ${parameter}[${i - 1}] = ${out[i - 1]}`,
      );
    }
    out.push(x);
  });
  const top = out[out.length - 1];
  if (top * mass > MOMEGA_RANGE.max) {
    throw new InputError(
      `${parameter}[${out.length - 1}]`,
      `0 < Mω ≤ ${MOMEGA_RANGE.max}`,
      top,
      `the greybody solver covers Mω ≤ ${MOMEGA_RANGE.max}`,
    );
  }
  return out;
}

/** Validator of `maxL`: an integer up to the solvers' MAX_L (checked against the field spin by the caller). */
export const maxLOption = numberIn(0, MAX_L, true);

/** Refuse a maxL below the field's lowest l. */
export function checkMaxL(maxL: number, spin: number): number {
  if (maxL < spin) throw new InputError('maxL', `${spin} ≤ maxL ≤ ${MAX_L}`, maxL);
  return maxL;
}
