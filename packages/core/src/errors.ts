/**
 * The two typed errors every penumbra package throws.
 *
 * `InputError` names a parameter the caller gave and its allowed range, so a
 * caller (or the CLI) can print one readable line. `ConvergenceError` carries
 * the diagnostics of a computation that did not reach the requested accuracy:
 * penumbra never returns a number it cannot vouch for.
 */
import type { Diagnostics } from './diagnostics.js';

/** A caller-given `parameter` outside its `allowed` range; `value` is what was given. */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    readonly parameter: string,
    readonly allowed: string,
    readonly value: unknown,
    detail?: string,
  ) {
    // String(): a caller's symbol or object as the name must not turn the report into a TypeError
    super(
      `invalid ${String(parameter)} = ${formatValue(value)}: allowed ${String(allowed)}` + (detail ? ` (${String(detail)})` : ''),
    );
  }
}

/** A computation that did not reach its requested accuracy; `diagnostics` says how far it got. */
export class ConvergenceError<D extends Diagnostics = Diagnostics> extends Error {
  override readonly name = 'ConvergenceError';
  constructor(
    message: string,
    readonly diagnostics: D,
  ) {
    super(`${message}; diagnostics: ${safeJson(diagnostics)}`);
  }
}

function formatValue(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'NaN' : String(v);
  if (typeof v === 'string') return JSON.stringify(v);
  if (typeof v === 'bigint' || typeof v === 'symbol' || typeof v === 'function') return String(v);
  return safeJson(v);
}

function safeJson(v: unknown): string {
  try {
    const text = JSON.stringify(v, (_k, x) => (typeof x === 'number' && !Number.isFinite(x) ? String(x) : x));
    return text === undefined ? String(v) : text.length > 400 ? `${text.slice(0, 400)}…` : text;
  } catch {
    return String(v);
  }
}

/**
 * A parameter name (or other label) given by the caller must be a string: a
 * symbol in a template string would be a TypeError. Not re-exported by index.ts.
 */
export function requireLabel(label: string, value: unknown): string {
  if (typeof value !== 'string') throw new InputError(label, 'a string', value);
  return value;
}

/** Throw an InputError unless `x` is a finite number. */
export function requireFinite(parameter: string, x: unknown, allowed = 'a finite number'): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new InputError(parameter, allowed, x);
  return x;
}

/** Throw an InputError unless `x` is a finite number in [min, max]. */
export function requireInRange(
  parameter: string,
  x: unknown,
  min: number,
  max: number,
  allowed = `${String(min)} ≤ ${String(parameter)} ≤ ${String(max)}`,
): number {
  if (typeof min !== 'number' || typeof max !== 'number') throw new InputError('min, max', 'numbers', [min, max]);
  const v = requireFinite(parameter, x, allowed);
  if (!(v >= min && v <= max)) throw new InputError(parameter, allowed, v);
  return v;
}

/**
 * Throw an InputError unless `x` is a plain object whose keys are all among
 * `keys` (missing keys are the caller's to check); an unknown key is named as
 * `parameter.key`, so a misspelt key is refused rather than ignored.
 */
export function requireKeyedObject(
  parameter: string,
  x: unknown,
  keys: readonly string[],
  allowed = `an object { ${keys.join(', ')} }`,
): Record<string, unknown> {
  requireLabel('parameter', parameter);
  const value = requireObject(parameter, x, allowed);
  for (const key of Object.keys(value)) {
    if (!keys.includes(key)) {
      throw new InputError(
        `${parameter}.${key}`,
        `${keys.length === 1 ? 'the key' : 'the keys'} ${keys.join(', ')}`,
        key,
        'unknown key',
      );
    }
  }
  return value;
}

/** Throw an InputError unless `x` is a plain object (not null, not an array). */
export function requireObject(parameter: string, x: unknown, allowed = 'an object'): Record<string, unknown> {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) throw new InputError(parameter, allowed, x);
  return x as Record<string, unknown>;
}
