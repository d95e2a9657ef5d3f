/**
 * Choosing and labelling scales: data spanning decades read better on a
 * logarithmic axis, and a symmetric-log axis needs ticks chosen for it.
 */
import { InputError } from '@penumbra/core';
import type { ScaleType } from './figure.js';

/**
 * The scale for data whose nonzero magnitudes span a factor `minSpan` or
 * more: `'log'` when every value is positive, `'symlog'` otherwise; below
 * that span, or with fewer than two nonzero values, `'linear'`.
 */
export function autoScale(values: readonly number[], minSpan = 100): ScaleType {
  if (!Array.isArray(values)) throw new InputError('values', 'an array of finite numbers', values);
  values.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new InputError(`values[${i}]`, 'a finite number', v);
  });
  if (typeof minSpan !== 'number' || !(minSpan >= 1 && minSpan < Infinity))
    throw new InputError('minSpan', 'a finite number ≥ 1', minSpan);
  const magnitudes = values.map(Math.abs).filter((v) => v > 0);
  if (magnitudes.length < 2) return 'linear';
  const span = largest(magnitudes) / smallest(magnitudes);
  if (span < minSpan) return 'linear';
  return values.every((v) => v > 0) ? 'log' : 'symlog';
}

/** The smallest nonzero |value| (Infinity if none): the default linear width of a symlog axis. */
export function smallestMagnitude(values: readonly number[]): number {
  return smallest(values.map(Math.abs).filter((v) => v > 0));
}

/** Powers of ten (with sign) across the data, at most about a dozen, and zero: symlog axes get no useful ticks of their own. */
export function symlogTicks(values: readonly number[]): number[] {
  const magnitudes = values.map(Math.abs).filter((v) => v > 0);
  if (magnitudes.length === 0) return [0];
  const low = Math.floor(Math.log10(smallest(magnitudes)));
  const high = Math.ceil(Math.log10(largest(magnitudes)));
  const step = Math.max(1, Math.ceil((high - low + 1) / 6));
  const ticks: number[] = [0];
  for (let k = high; k >= low; k -= step) {
    const p = 10 ** k;
    if (values.some((v) => v >= p / 10)) ticks.push(p);
    if (values.some((v) => v <= -p / 10)) ticks.push(-p);
  }
  return ticks.sort((x, y) => x - y);
}

// Loops, not Math.min(...values): a large table would overflow the argument list.
function smallest(values: readonly number[]): number {
  let min = Infinity;
  for (const v of values) if (v < min) min = v;
  return min;
}

function largest(values: readonly number[]): number {
  let max = -Infinity;
  for (const v of values) if (v > max) max = v;
  return max;
}
