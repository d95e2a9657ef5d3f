/**
 * A field: what propagates on the hole. Today a field is its spin (massless
 * fields); the massive-fields work adds its mass here, in one place.
 *
 * Two spins appear in the Teukolsky equations and are kept apart by name:
 * the field spin `spin` ∈ {0, 1/2, 1, 2} (≥ 0, what a user chooses) and the
 * signed spin weight `s` = ±spin of one equation (±1/2, ±1, ±2). "Spin" alone
 * never means the hole's a/M: that is `a` (with the mass) or `aStar` = a/M.
 */
import { InputError, requireKeyedObject } from './errors.js';

/** Field spins penumbra computes, in one list. */
export const FIELD_SPINS = [0, 0.5, 1, 2] as const;
/** A field spin as a number: 0, 0.5, 1 or 2. */
export type FieldSpin = (typeof FIELD_SPINS)[number];

/** A field spin as a caller may write it: a number, or the text '0', '1/2', '1', '2'. */
export type FieldSpinInput = FieldSpin | '0' | '1/2' | '1' | '2';

/** Signed spin weights of the Teukolsky equations (s = ±spin). */
export const SPIN_WEIGHTS = [-2, -1, -0.5, 0, 0.5, 1, 2] as const;
/** A signed spin weight s of one Teukolsky equation. */
export type SpinWeight = (typeof SPIN_WEIGHTS)[number];

/** What propagates on the hole; today a massless field, given by its spin. */
export interface Field {
  /** field spin 0, 1/2, 1 or 2 ('1/2' accepted) */
  readonly spin: FieldSpinInput;
}

const ALLOWED = 'one of 0, 1/2, 1, 2';
const TEXT: Record<string, FieldSpin> = { '0': 0, '1/2': 0.5, '0.5': 0.5, '1': 1, '2': 2 };

/** Read a field spin from a number or its text ('1/2' and 0.5 are the same spin). */
export function parseFieldSpin(value: unknown, parameter = 'spin'): FieldSpin {
  if (typeof value === 'number' && (FIELD_SPINS as readonly number[]).includes(value)) return value as FieldSpin;
  if (typeof value === 'string') {
    const spin = TEXT[value.replace(/\s+/g, '')];
    if (spin !== undefined) return spin;
  }
  throw new InputError(parameter, ALLOWED, value);
}

/** Validate a field object and return it with its spin as a number. */
export function validateField(value: unknown, parameter = 'field'): { spin: FieldSpin } {
  const field = requireKeyedObject(parameter, value, ['spin'], `an object { spin } with spin ${ALLOWED}`);
  return { spin: parseFieldSpin(field.spin, `${parameter}.spin`) };
}

/** Half-integer spins are fermions (Fermi–Dirac occupation, never superradiant). */
export function isFermion(spin: FieldSpin): boolean {
  return spin === 0.5;
}

/** The spin as it is written: '0', '1/2', '1', '2'. */
export function formatFieldSpin(spin: number): string {
  return spin === 0.5 ? '1/2' : spin === -0.5 ? '-1/2' : String(spin);
}
