/**
 * A hole: its spin parameter a = J/M and its mass M (geometric units, default
 * M = 1). The derived background (horizons, Ω_H, κ, T_H) is @penumbra/kerr's
 * `kerrHole`. Negative a is a hole counter-rotating relative to m > 0.
 */
import { InputError, requireFinite, requireKeyedObject, requireLabel } from './errors.js';

/** A Kerr hole as a caller gives it: spin parameter a and mass M (geometric units). */
export interface Hole {
  /** spin parameter a = J/M in the units of `mass`, |a| < M */
  readonly a: number;
  /** mass M in geometric units (default 1) */
  readonly mass?: number;
}

/**
 * Largest |a|/M the horizon-based greybody solver takes. What sets it: the
 * Frobenius start needs r+ − r− > 0 (0.0089 M here), and the near-horizon
 * solution winds like x^{−ik/2κ} with k/2κ ∝ 1/(r+ − r−), so the steps grow
 * as the horizons merge: at Mω = 30 a mode took 1.1e4 steps at
 * a = 0.9999 M and 5e4 (|m| ≲ 10) to 3.1e5 (l = 200, m = −200) at a = 0.99999 M,
 * against a budget of 1e6 (docs/method.md, "Near extremality"). The extremal
 * hole is a limit, not an input.
 */
export const MAX_SOLVER_A_RATIO = 0.99999;

/** Validate a hole object; `maxARatio` is the largest |a|/M accepted (strictly below 1 by default). */
export function validateHole(value: unknown, parameter = 'hole', maxARatio = MAX_SOLVER_A_RATIO): { a: number; mass: number } {
  requireLabel('parameter', parameter);
  if (typeof maxARatio !== 'number' || !(maxARatio > 0 && maxARatio <= 1))
    throw new InputError('maxARatio', 'a number in (0, 1]', maxARatio);
  const { a, mass = 1 } = requireKeyedObject(parameter, value, ['a', 'mass'], 'an object { a, mass? } with |a| < mass');
  if (typeof mass !== 'number' || !Number.isFinite(mass)) requireFinite(`${parameter}.mass`, mass, 'a finite number > 0');
  const M = mass as number;
  if (!(M > 0) || !Number.isFinite(M * M)) throw new InputError(`${parameter}.mass`, 'a finite number > 0 with M² finite', M);
  // Formatted only on refusal (number formatting on every call was a visible share of a valid hole's check).
  const bound = () => (maxARatio < 1 ? `|a| ≤ ${maxARatio} M = ${maxARatio * M}` : `|a| < M = ${M}`);
  if (typeof a !== 'number' || !Number.isFinite(a)) requireFinite(`${parameter}.a`, a, bound());
  const A = a as number;
  const ok = maxARatio < 1 ? Math.abs(A) <= maxARatio * M : Math.abs(A) < M;
  if (!ok) {
    throw new InputError(
      `${parameter}.a`,
      bound(),
      A,
      Math.abs(A) === M
        ? 'the extremal hole has zero surface gravity and coincident horizons; it is a limit, not an input'
        : Math.abs(A) > M
          ? 'a hole with |a| > M has no horizon'
          : 'the horizon series start needs r+ − r− > 0; the extremal hole is a limit, not an input',
    );
  }
  return { a: A, mass: M };
}
