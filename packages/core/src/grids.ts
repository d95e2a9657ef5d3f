/**
 * Frequency grids: START..STOP with COUNT points, endpoints exact, linear or
 * geometric spacing; or an explicit list. Bounded in size so a typo cannot
 * start unbounded work.
 */
import { InputError, requireFinite, requireObject } from './errors.js';

/** Largest number of points a grid may have, so a typo cannot start unbounded work. */
export const MAX_GRID_POINTS = 1_000_000;

/** Spacing of a generated grid: equal steps, or equal ratios. */
export type GridSpacing = 'linear' | 'log';

/** A frequency grid: `count` points from `from` to `to` with a spacing, or an explicit list of values. */
export type FrequencyGrid = { spacing: GridSpacing; from: number; to: number; count: number } | { values: readonly number[] };

function checkCount(count: unknown, parameter: string): number {
  const allowed = `an integer 1 ≤ count ≤ ${MAX_GRID_POINTS}`;
  if (typeof count !== 'number' || !Number.isInteger(count) || count < 1 || count > MAX_GRID_POINTS) {
    throw new InputError(parameter, allowed, count);
  }
  return count;
}

/** `count` equally spaced points from `from` to `to`, endpoints exact. */
export function linearGrid(from: number, to: number, count: number): number[] {
  const a = requireFinite('from', from);
  const b = requireFinite('to', to);
  const n = checkCount(count, 'count');
  if (n === 1) return [a];
  const span = b - a;
  // (b − a)·i overflows only for ends near ±1e308: then a(1 − t) + bt, which stays finite
  if (!Number.isFinite(span * (n - 1)))
    return Array.from({ length: n }, (_, i) => (i === n - 1 ? b : a * (1 - i / (n - 1)) + b * (i / (n - 1))));
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? b : a + (span * i) / (n - 1)));
}

/** `count` geometrically spaced points from `from` to `to` (both > 0), endpoints exact. */
export function logGrid(from: number, to: number, count: number): number[] {
  const a = requireFinite('from', from, 'a finite number > 0');
  const b = requireFinite('to', to, 'a finite number > 0');
  if (!(a > 0)) throw new InputError('from', 'a finite number > 0', a);
  if (!(b > 0)) throw new InputError('to', 'a finite number > 0', b);
  const n = checkCount(count, 'count');
  if (n === 1) return [a];
  const ratio = b / a;
  if (Number.isFinite(ratio) && ratio > 0)
    return Array.from({ length: n }, (_, i) => (i === 0 ? a : i === n - 1 ? b : a * ratio ** (i / (n - 1))));
  // b / a overflows (or underflows) for ends far apart, e.g. a subnormal a: in logarithms
  const la = Math.log(a);
  const lb = Math.log(b);
  return Array.from({ length: n }, (_, i) => (i === 0 ? a : i === n - 1 ? b : Math.exp(la + ((lb - la) * i) / (n - 1))));
}

/** The points of a frequency grid. */
export function gridValues(grid: FrequencyGrid): number[] {
  const g = requireObject('grid', grid, 'a grid {spacing, from, to, count} or {values}');
  if ('values' in g) {
    if (!Array.isArray(g.values) || g.values.length > MAX_GRID_POINTS)
      throw new InputError('grid.values', `an array of at most ${MAX_GRID_POINTS} finite numbers`, g.values);
    return g.values.map((v, i) => requireFinite(`grid.values[${i}]`, v));
  }
  if (g.spacing !== 'linear' && g.spacing !== 'log') throw new InputError('grid.spacing', "'linear' or 'log'", g.spacing);
  const [from, to, count] = [g.from, g.to, g.count] as number[];
  try {
    return g.spacing === 'log' ? logGrid(from, to, count) : linearGrid(from, to, count);
  } catch (error) {
    // name the caller's keys: grid.from rather than from
    if (error instanceof InputError) throw new InputError(`grid.${error.parameter}`, error.allowed, error.value);
    throw error;
  }
}
