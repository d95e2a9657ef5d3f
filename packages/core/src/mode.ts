/**
 * A mode: a field and its angular numbers (l, m), with l ≥ spin, |m| ≤ l and
 * l − spin, m − spin integers (half-integer l, m for fermions).
 */
import { InputError, requireFinite, requireKeyedObject } from './errors.js';
import { validateField, type Field, type FieldSpin } from './field.js';

/** A field with its angular numbers l and m. */
export interface Mode {
  readonly field: Field;
  readonly l: number;
  readonly m: number;
  /**
   * Massive Dirac modes only (spin 1/2): the sign of the Dirac quantum number
   * κ = ±(l + ½) — the sign of Chandrasekhar's separation constant, its value
   * at a = 0 — which tells apart the two modes of one j = l; −1 includes the
   * s-wave. At mass 0 both signs give the same Γ (docs/massive-dirac.md).
   */
  readonly kappaSign?: 1 | -1;
}

/**
 * Largest l the solvers take (the spheroidal and radial solvers are tested to
 * it). 230 covers every l-sum of the documented range Mω ≤ 30: its
 * geometric-optics cut is Mω·b with b ≤ 7M (the retrograde capture impact
 * parameter as a → M), l ≈ 210, plus 20 shells for Γ to fall below 1e-12.
 */
export const MAX_L = 230;

/** Validate angular numbers for a field spin. */
export function validateAngular(spin: FieldSpin, l: unknown, m: unknown, parameter = 'mode'): { l: number; m: number } {
  // The texts are formatted only on refusal: formatting them on every call was most of a valid mode's check.
  const lAllowed = () => `${spin} ≤ l ≤ ${MAX_L} with l − ${spin} an integer`;
  if (typeof l !== 'number' || !Number.isFinite(l)) requireFinite(`${parameter}.l`, l, lAllowed());
  const L = l as number;
  if (L < spin || L > MAX_L || !Number.isInteger(L - spin)) throw new InputError(`${parameter}.l`, lAllowed(), L);
  const mAllowed = () => `|m| ≤ l = ${L} with m − ${spin} an integer`;
  if (typeof m !== 'number' || !Number.isFinite(m)) requireFinite(`${parameter}.m`, m, mAllowed());
  const Mz = m as number;
  if (Math.abs(Mz) > L || !Number.isInteger(Mz - spin)) throw new InputError(`${parameter}.m`, mAllowed(), Mz);
  return { l: L, m: Mz };
}

/** Validate a mode object; returns its field spin as a number, its mass Mμ (0 when massless) and kappaSign when given. */
export function validateMode(
  value: unknown,
  parameter = 'mode',
): { spin: FieldSpin; fieldMass: number; l: number; m: number; kappaSign?: 1 | -1 } {
  const v = requireKeyedObject(
    parameter,
    value,
    ['field', 'l', 'm', 'kappaSign'],
    'an object { field: { spin, mass? }, l, m, kappaSign? }',
  );
  const { spin, mass } = validateField(v.field, `${parameter}.field`);
  // field by field (a spread here was a visible share of a valid mode's check)
  const { l, m } = validateAngular(spin, v.l, v.m, parameter);
  const angular = { spin, fieldMass: mass, l, m };
  if (v.kappaSign === undefined) return angular;
  if (spin !== 0.5) throw new InputError(`${parameter}.kappaSign`, 'absent (kappaSign labels spin-1/2 modes only)', v.kappaSign);
  if (v.kappaSign !== 1 && v.kappaSign !== -1) throw new InputError(`${parameter}.kappaSign`, '1 or −1', v.kappaSign);
  return { ...angular, kappaSign: v.kappaSign };
}
