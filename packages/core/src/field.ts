/**
 * A field: what propagates on the hole, given by its spin and its mass.
 * The mass is Mμ — the field's rest mass μ (ħ = c = G = 1, an inverse
 * length) times the hole's mass M — so a field of mass 0 is massless.
 *
 * Two spins appear in the Teukolsky equations and are kept apart by name:
 * the field spin `spin` ∈ {0, 1/2, 1, 2} (≥ 0, what a user chooses) and the
 * signed spin weight `s` = ±spin of one equation (±1/2, ±1, ±2). "Spin" alone
 * never means the hole's a/M: that is `a` (with the mass) or `aStar` = a/M.
 */
import { InputError, requireFinite, requireKeyedObject, requireLabel } from './errors.js';

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

/** What propagates on the hole: a field spin and a rest mass. */
export interface Field {
  /** field spin 0, 1/2, 1 or 2 ('1/2' accepted) */
  readonly spin: FieldSpinInput;
  /** rest mass as Mμ (units of 1/M, 0 ≤ Mμ < 30; default 0, massless) */
  readonly mass?: number;
}

/** A validated field: spin as a number, mass as Mμ (0 when massless). */
export interface CheckedField {
  readonly spin: FieldSpin;
  readonly mass: number;
}

/** Allowed field masses Mμ: massless up to (below) the largest Mω the solvers take. */
export const FIELD_MASS_RANGE = { min: 0, max: 30 } as const;

const ALLOWED = 'one of 0, 1/2, 1, 2';
const FIELD_KEYS = ['spin', 'mass'];
const FIELD_ALLOWED = `an object { spin, mass? } with spin ${ALLOWED}`;
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

/** Validate a field object and return it with its spin as a number and its mass (0 if absent). */
export function validateField(value: unknown, parameter = 'field'): CheckedField {
  requireLabel('parameter', parameter);
  const field = requireKeyedObject(parameter, value, FIELD_KEYS, FIELD_ALLOWED);
  const spin = parseFieldSpin(field.spin, `${parameter}.spin`);
  return { spin, mass: field.mass === undefined ? 0 : parseFieldMass(field.mass, `${parameter}.mass`) };
}

/** Read a field mass Mμ: a finite number with 0 ≤ Mμ < 30. */
export function parseFieldMass(value: unknown, parameter = 'field.mass'): number {
  const allowed = `${FIELD_MASS_RANGE.min} ≤ Mμ < ${FIELD_MASS_RANGE.max} (units of 1/M)`;
  const mu = requireFinite(parameter, value, allowed);
  if (!(mu >= FIELD_MASS_RANGE.min && mu < FIELD_MASS_RANGE.max)) throw new InputError(parameter, allowed, mu);
  return mu;
}

/**
 * Refuse a massive field where a computation has only the massless equations:
 * a mass silently ignored would be a wrong number.
 */
export function requireMassless(field: CheckedField, parameter = 'field.mass', what = 'this computation'): void {
  if (typeof field !== 'object' || field === null) throw new InputError('field', 'a checked field { spin, mass }', field);
  requireLabel('parameter', parameter);
  requireLabel('what', what);
  if (field.mass !== 0) {
    throw new InputError(
      parameter,
      `0 (${String(what)} takes massless fields only)`,
      field.mass,
      'massive fields are not supported here',
    );
  }
}

/** Half-integer spins are fermions (Fermi–Dirac occupation, never superradiant). */
export function isFermion(spin: FieldSpin): boolean {
  return spin === 0.5;
}

/** The spin as it is written: '0', '1/2', '1', '2'. */
export function formatFieldSpin(spin: number): string {
  return spin === 0.5 ? '1/2' : spin === -0.5 ? '-1/2' : String(spin);
}
