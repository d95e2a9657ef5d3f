/**
 * Typed errors shared by every penumbra package.
 *
 * `InputError` names the offending parameter and its allowed range, so that a
 * caller (or the CLI) can print one readable line. `ConvergenceError` carries
 * the diagnostics of a numerical procedure that did not reach the requested
 * accuracy: penumbra never returns a number it cannot vouch for.
 */
export class InputError extends Error {
  override readonly name = 'InputError';
  constructor(
    readonly parameter: string,
    readonly allowed: string,
    readonly value: unknown,
    detail?: string,
  ) {
    super(
      `invalid ${parameter} = ${formatValue(value)}: allowed ${allowed}` + (detail ? ` (${detail})` : ''),
    );
  }
}

export class ConvergenceError extends Error {
  override readonly name = 'ConvergenceError';
  constructor(
    message: string,
    readonly diagnostics: Record<string, unknown>,
  ) {
    super(`${message}; diagnostics: ${JSON.stringify(diagnostics)}`);
  }
}

function formatValue(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'NaN' : String(v);
  if (typeof v === 'string') return JSON.stringify(v);
  try {
    return JSON.stringify(v);
  } catch {
    return String(v);
  }
}

/** Throw an InputError unless `x` is a finite number. */
export function requireFinite(parameter: string, x: unknown, allowed = 'a finite number'): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new InputError(parameter, allowed, x);
  return x;
}
