/** The --field-mass option shared by the commands that take a massive field. */
import type { FieldSpin } from '@penumbra/core';
import { parseNumber } from './options.js';

/** Help line of --field-mass (geometric units: Mμ in units of 1/M). */
export const FIELD_MASS_HELP = "--field-mass MU  the field's mass Mμ (units of 1/M, default 0; spin 0 only; needs Mω > Mμ)";

/**
 * The field of `spin` with the mass given by --field-mass (Mμ ≥ 0). A massless
 * field is returned without a mass key, so --field-mass 0 is exactly the
 * massless computation.
 */
export function fieldWithMass(spin: FieldSpin, text: string | undefined): { spin: FieldSpin; mass?: number } {
  const mass = text === undefined ? 0 : parseNumber('--field-mass', text, { min: 0 });
  return mass > 0 ? { spin, mass } : { spin };
}
