/**
 * Choosing and labelling scales: data spanning decades read better on a
 * logarithmic axis, and log and symmetric-log axes need ticks chosen for
 * them (Vega's own put none between the decades a reader needs).
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

/** The smallest nonzero |value| (Infinity if none). */
export function smallestMagnitude(values: readonly number[]): number {
  return smallest(values.map(Math.abs).filter((v) => v > 0));
}

/** How many decades below the largest |value| a symmetric-log axis shows before it turns linear. */
export const SYMLOG_DECADES = 6;

/**
 * The width of the linear part of a symmetric-log axis: the smallest nonzero
 * |value|, but no less than 10^−SYMLOG_DECADES of the largest, so that a
 * curve passing close to zero does not stretch the axis over twenty decades.
 */
export function symlogConstant(values: readonly number[]): number {
  const magnitudes = values.map(Math.abs).filter((v) => v > 0);
  if (magnitudes.length === 0) return 1;
  return Math.max(smallest(magnitudes), largest(magnitudes) * 10 ** -SYMLOG_DECADES);
}

/**
 * A value rounded away from zero to a round number, 1, 1.5, 2, 3, 4, 5, 6 or 8
 * times a power of ten (0.555 → 0.6, −0.555 → −0.6, 0.93 → 1); a value within
 * 1 % above a round number keeps it (1.0000001 → 1), so a curve that touches
 * 1 does not stretch the axis to 1.5.
 */
export function roundOut(value: number): number {
  if (value === 0 || !Number.isFinite(value)) return value;
  const magnitude = Math.abs(value);
  const decade = 10 ** Math.floor(Math.log10(magnitude));
  if (!(decade > 0) || !Number.isFinite(decade)) return value;
  const mantissa = magnitude / decade;
  const step = ROUND_MANTISSAS.find((m) => mantissa <= m * 1.01) ?? 10;
  const rounded = Number((step * decade).toPrecision(2));
  return Number.isFinite(rounded) ? Math.sign(value) * rounded : value;
}

const ROUND_MANTISSAS = [1, 1.5, 2, 3, 4, 5, 6, 8, 10];

/** The domain of a symmetric-log axis: the data's range and zero, each end rounded out to one significant figure. */
export function symlogDomain(values: readonly number[]): [number, number] {
  if (values.length === 0) return [-1, 1];
  const low = smallest(values);
  const high = largest(values);
  return [Math.min(0, roundOut(low)), Math.max(0, roundOut(high))];
}

/**
 * Ticks of a symmetric-log axis over `domain`: zero, signed powers of ten
 * from the linear width `constant` out to the ends (every decade up to seven
 * decades, every other beyond; 1, 2, 5 in each decade when there are only
 * one or two), and the ends themselves, so that the extreme of the data can
 * be read off. Ticks that would crowd an end are dropped.
 */
export function symlogTicks(
  values: readonly number[],
  domain = symlogDomain(values),
  constant = symlogConstant(values),
): number[] {
  const [low, high] = domain;
  const ticks = new Set<number>([0]);
  for (const [sign, end] of [
    [-1, -low],
    [1, high],
  ] as const) {
    if (!(end > 0)) continue;
    if (end > constant) for (const t of decadeTicks(constant, end)) ticks.add(sign * t);
    ticks.add(sign * end);
  }
  const inside = [...ticks].filter((t) => t >= low && t <= high).sort((p, q) => p - q);
  const position = (v: number) => Math.sign(v) * Math.log1p(Math.abs(v) / constant);
  const span = position(high) - position(low) || 1;
  // keep the ends and zero; drop a tick closer than 4 % of the axis to one of them
  const fixed = inside.filter((t) => t === low || t === high || t === 0);
  return inside.filter((t) => fixed.includes(t) || fixed.every((f) => Math.abs(position(t) - position(f)) / span > 0.04));
}

/**
 * Ticks of a logarithmic axis over [low, high] (both > 0): powers of ten,
 * thinned to at most about eight, with 2 and 5 between them when the range
 * spans two decades or less.
 */
export function logTicks(low: number, high: number): number[] {
  return decadeTicks(low, high).filter((t) => t >= low * (1 - 1e-12) && t <= high * (1 + 1e-12));
}

/** The domain of a logarithmic axis: the data's range widened to whole decades. */
export function logDomain(values: readonly number[]): [number, number] {
  const positive = values.filter((v) => v > 0);
  if (positive.length === 0) return [1, 10];
  return [10 ** Math.floor(Math.log10(smallest(positive))), 10 ** Math.ceil(Math.log10(largest(positive)))];
}

/** 1, 2, 5 × 10^k or every n-th 10^k between `from` and `to` (0 < from < to). */
function decadeTicks(from: number, to: number): number[] {
  const first = Math.ceil(Math.log10(from) - 1e-9);
  const last = Math.floor(Math.log10(to) + 1e-9);
  const decades = Math.max(0, last - first + 1);
  const mantissas = decades <= 2 ? [1, 2, 5] : [1];
  const step = Math.max(1, Math.ceil(decades / 8));
  const ticks: number[] = [];
  for (let k = first - 1; k <= last; k++) {
    if ((k - last) % step !== 0 && mantissas.length === 1) continue;
    for (const m of mantissas) {
      const t = Number((m * 10 ** k).toPrecision(3));
      if (t >= from * (1 - 1e-12) && t <= to * (1 + 1e-12)) ticks.push(t);
    }
  }
  return ticks;
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/**
 * A tick label for people: plain decimals from 0.001 to 10⁴ (`0.6`,
 * `−0.01`), powers of ten with a superscript exponent outside (`10⁻⁶`,
 * `−2×10⁻⁵`), a true minus sign throughout.
 */
export function tickLabel(value: number): string {
  if (value === 0) return '0';
  if (!Number.isFinite(value)) return String(value).replace('-', '−');
  const sign = value < 0 ? '−' : '';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-3 && magnitude < 1e4) return sign + String(Number(magnitude.toPrecision(3)));
  const [mantissa, exponent] = magnitude.toExponential(2).split('e');
  const m = String(Number(mantissa));
  const power = `10${[...String(Number(exponent))].map((c) => SUPERSCRIPT[c] ?? c).join('')}`;
  return sign + (m === '1' ? power : `${m}×${power}`);
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

const DIGITS = "['⁰','¹','²','³','⁴','⁵','⁶','⁷','⁸','⁹']";
const EXPONENT = 'floor(log(abs(datum.value)) / LN10 + 1e-9)';
const MANTISSA = `format(datum.value / pow(10, ${EXPONENT}), '.3~g')`;
const POWER = `'10' + (${EXPONENT} < 0 ? '⁻' : '') + (abs(${EXPONENT}) >= 10 ? ${DIGITS}[floor(abs(${EXPONENT}) / 10)] : '') + ${DIGITS}[abs(${EXPONENT}) % 10]`;

/**
 * The label expression of a linear axis (Vega expression language): Vega's
 * own labels from 0.001 to 10⁵, and m×10ᵏ with a superscript exponent
 * outside, where Vega would write twenty digits.
 */
export const LINEAR_LABEL_EXPR =
  `datum.value == 0 || (abs(datum.value) >= 1e-3 && abs(datum.value) < 1e5) ? datum.label : ` +
  `(${MANTISSA} == '1' ? ${POWER} : ${MANTISSA} == '-1' ? '−' + ${POWER} : replace(${MANTISSA}, '-', '−') + '×' + ${POWER})`;
