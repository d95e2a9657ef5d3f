/**
 * Option validation shared by every solve: unknown keys and unknown method
 * names are refused with an InputError naming the key.
 */
import { InputError, requireObject, requireLabel } from './errors.js';

/** One validator per accepted key; each returns the cleaned value. */
export type OptionSpec<O> = { [K in keyof O]-?: (value: unknown, parameter: string) => O[K] };

/**
 * Validate an options object against its spec. `undefined` keys are skipped;
 * `options` itself may be undefined (no options). Returns a fresh object.
 */
export function validateOptions<O extends object>(options: unknown, spec: OptionSpec<O>, context = 'options'): Partial<O> {
  requireLabel('context', context);
  if (typeof spec !== 'object' || spec === null) throw new InputError('spec', 'an object of validators', spec);
  if (options === undefined) return {};
  // The key list is formatted only on refusal.
  if (typeof options !== 'object' || options === null || Array.isArray(options))
    requireObject(context, options, `an object with keys ${Object.keys(spec).join(', ') || '(none)'}`);
  const given = options as Record<string, unknown>;
  const out: Partial<O> = {};
  for (const key of Object.keys(given)) {
    if (!Object.hasOwn(spec, key)) {
      throw new InputError(
        `${context}.${key}`,
        `one of the keys ${Object.keys(spec).join(', ') || '(none)'}`,
        key,
        'unknown option',
      );
    }
    const value = given[key];
    if (value === undefined) continue;
    (out as Record<string, unknown>)[key] = (spec as Record<string, (v: unknown, p: string) => unknown>)[key](value, key);
  }
  return out;
}

/** A validator accepting one of a fixed list of names (methods, integrators, units). */
export function oneOf<T extends string>(allowed: readonly T[]): (value: unknown, parameter: string) => T {
  if (!Array.isArray(allowed) || allowed.length === 0 || !allowed.every((a) => typeof a === 'string'))
    throw new InputError('allowed', 'a non-empty array of strings', allowed);
  return (value, parameter) => {
    if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
      throw new InputError(parameter, `one of ${allowed.map((a) => `'${a}'`).join(', ')}`, value);
    }
    return value as T;
  };
}

/** A validator accepting only true or false. */
export function isBoolean(value: unknown, parameter: string): boolean {
  if (typeof value !== 'boolean') throw new InputError(parameter, 'true or false', value);
  return value;
}

/**
 * A validator accepting any function (its arguments are not checked).
 * @typeParam F the function type the caller expects
 */
export function isFunction<F extends (...args: never[]) => unknown>(value: unknown, parameter: string): F {
  if (typeof value !== 'function') throw new InputError(parameter, 'a function', value);
  return value as F;
}

/** A validator for a finite number in [min, max] (integer if asked). */
export function numberIn(min: number, max: number, integer = false): (value: unknown, parameter: string) => number {
  if (typeof min !== 'number' || typeof max !== 'number' || !(min <= max))
    throw new InputError('numberIn bounds', 'numbers min ≤ max', [min, max]);
  return (value, parameter) => {
    const allowed = `${integer ? 'an integer' : 'a number'} in [${min}, ${max}]`;
    if (
      typeof value !== 'number' ||
      !Number.isFinite(value) ||
      value < min ||
      value > max ||
      (integer && !Number.isInteger(value))
    ) {
      throw new InputError(parameter, allowed, value);
    }
    return value;
  };
}
