/**
 * The table columns of the quantities every output shares — a mode's field
 * spin and mass, the hole's spin, the frequency, l, m and Γ — defined once so
 * the CLI tables, grid files, near-region maps and the explorer name and
 * describe them alike. Values are in units of M (ω and μ as Mω and Mμ).
 */
import type { Column } from './table.js';

/** The field spin s ∈ {0, 1/2, 1, 2}. */
export const SPIN_COLUMN: Column = Object.freeze({ name: 'spin', unit: '1', description: 'field spin' });

/** The field's rest mass μ in units of 1/M (the number Mμ). */
export const FIELD_MASS_COLUMN: Column = Object.freeze({
  name: 'fieldMass',
  unit: '1/M',
  description: "the field's rest mass as Mμ (0: massless)",
});

/** The hole's spin parameter a in units of M. */
export const HOLE_SPIN_COLUMN: Column = Object.freeze({ name: 'a', unit: 'M', description: "the hole's spin parameter a = J/M" });

/** The wave frequency ω in units of 1/M (the number Mω). */
export const OMEGA_COLUMN: Column = Object.freeze({ name: 'omega', unit: '1/M', description: 'wave frequency ω' });

/** The spheroidal index l (the multipole l on a non-rotating hole). */
export const L_COLUMN: Column = Object.freeze({ name: 'l', unit: '1', description: 'spheroidal index l' });

/** The azimuthal number m. */
export const M_COLUMN: Column = Object.freeze({ name: 'm', unit: '1', description: 'azimuthal number m' });

/** The greybody factor Γ of one mode. */
export const GAMMA_COLUMN: Column = Object.freeze({
  name: 'gamma',
  unit: '1',
  description: 'greybody factor Γ (absorbed fraction of the incident flux; < 0 when superradiant)',
});

/** One mode at one hole and frequency, in the order of the mode tables: s, l, m, a, ω. */
export const MODE_COLUMNS: readonly Column[] = Object.freeze([SPIN_COLUMN, L_COLUMN, M_COLUMN, HOLE_SPIN_COLUMN, OMEGA_COLUMN]);
