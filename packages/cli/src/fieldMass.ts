/** The --field-mass option (with an optional energy unit) shared by the commands that take a massive field. */
import type { FieldSpin } from '@penumbra/core';
import { massToKg, unitScales } from '@penumbra/kerr';
import { UsageError } from './command.js';
import { parseMassOption, parseNumber } from './options.js';

/** Help lines of --field-mass, --field-mass-unit and the hole mass they need. */
export const FIELD_MASS_HELP = `--field-mass MU  the field's mass: Mμ in units of 1/M (default 0; needs Mω > Mμ;
               a massive vector needs --a 0), or a rest energy μc² with --field-mass-unit
  --field-mass-unit U  eV, keV, MeV or GeV: --field-mass is then μc², converted to Mμ with the
               hole mass --mass M --unit g|kg|msun (CODATA 2018 constants)`;

/** Energy units a physical field mass may be given in, as GeV. */
const ENERGY_UNITS: Record<string, number> = { eV: 1e-9, keV: 1e-6, MeV: 1e-3, GeV: 1 };

/** The option texts that fix a field's mass. */
export interface FieldMassOptions {
  'field-mass'?: string;
  'field-mass-unit'?: string;
  mass?: string;
  unit?: string;
}

/** Mμ from the options: geometric as given, or μc² / (GeV per geometric energy unit 1/M of the hole). */
export function fieldMassFromOptions(values: FieldMassOptions): number {
  const text = values['field-mass'];
  const unitText = values['field-mass-unit'];
  if (text === undefined) {
    if (unitText !== undefined) throw new UsageError('--field-mass-unit needs --field-mass');
    return 0;
  }
  const value = parseNumber('--field-mass', text, { min: 0 });
  if (unitText === undefined) return value;
  const perUnit = ENERGY_UNITS[unitText];
  if (perUnit === undefined) {
    throw new UsageError(`--field-mass-unit expects one of ${Object.keys(ENERGY_UNITS).join(', ')}, got '${unitText}'`);
  }
  // --mass means what it means in every command: a hole mass with its --unit (no default unit).
  const hole = parseMassOption({ mass: values.mass, unit: values.unit });
  if (hole === undefined) throw new UsageError('--field-mass-unit needs the hole mass --mass M --unit g|kg|msun');
  const scales = unitScales(massToKg(hole.mass, hole.unit));
  return (value * perUnit) / scales.GeV;
}

/**
 * The field of `spin` with its mass from the options. A massless field is
 * returned without a mass key, so --field-mass 0 is exactly the massless
 * computation.
 */
export function fieldWithMass(spin: FieldSpin, values: FieldMassOptions): { spin: FieldSpin; mass?: number } {
  const mass = fieldMassFromOptions(values);
  return mass > 0 ? { spin, mass } : { spin };
}

/** parseOptions entries of the field-mass options (the hole mass options are the command's own). */
export const FIELD_MASS_OPTIONS = {
  'field-mass': { type: 'string' },
  'field-mass-unit': { type: 'string' },
} as const;
