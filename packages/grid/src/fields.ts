/**
 * The fields a grid sweeps: massless spins (`fieldSpins`), fields with a mass
 * Mμ (`fields`), or emitted species (`species`, from emission's registry or
 * the user's own) on a hole of physical mass `holeMass`, each species a field
 * of mass Mμ = G M m/(ħ c). Each reader adds its problems to a shared list.
 */
import { FIELD_MASS_RANGE, InputError, parseFieldSpin, type FieldSpin } from '@penumbra/core';
import type { ProcaPolarization } from '@penumbra/flux';
import { FIELD_MASS_PER_GRAM_GEV, resolveContent, type Species } from '@penumbra/emission';
import { MASS_UNITS, requirePhysicalMass, type MassUnit } from '@penumbra/kerr';

/** An emitted species as the grid holds it: its registry values written out. */
export interface GridSpecies {
  name: string;
  spin: FieldSpin;
  /** degrees of freedom (helicities or spin states, particle and antiparticle) */
  dof: number;
  /** rest mass in GeV */
  massGeV: number;
}

/** One field of a grid: spin, mass Mμ (units of 1/M; 0 massless) and the species it stands for, if any. */
export interface GridField {
  spin: FieldSpin;
  mass: number;
  species?: GridSpecies;
}

/** The hole's physical mass of a species grid. */
export interface HoleMass {
  value: number;
  unit: MassUnit;
}

const SPECIES_KEYS = ['name', 'spin', 'dof', 'massGeV'];
const MASS_ALLOWED = `${FIELD_MASS_RANGE.min} ≤ Mμ < ${FIELD_MASS_RANGE.max}`;

const show = (value: unknown): string => {
  try {
    return typeof value === 'string' ? `'${value}'` : (JSON.stringify(value) ?? String(value));
  } catch {
    return String(value);
  }
};
const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/** A massive field of spin 2 has no route in the solvers. */
const massiveSpinProblem = (spin: FieldSpin, mass: number) =>
  spin === 2 && mass > 0 ? 'spin 2 takes mass 0 only (no massive spin-2 route)' : undefined;

/** One entry of `fields`: a spin (massless) or { spin, mass } with mass = Mμ. */
export function readFieldEntry(problems: string[], item: unknown, at: string): GridField | undefined {
  const spinRule = 'a field spin 0, 1/2 (or 0.5), 1 or 2';
  if (!isObject(item)) {
    try {
      return { spin: parseFieldSpin(item), mass: 0 };
    } catch {
      problems.push(`${at}: expected ${spinRule} or {"spin", "mass"} (mass Mμ in units of 1/M), got ${show(item)}`);
      return undefined;
    }
  }
  let ok = true;
  for (const k of Object.keys(item))
    if (k !== 'spin' && k !== 'mass') {
      problems.push(`${at}: unknown key '${k}' (allowed: spin, mass)`);
      ok = false;
    }
  let spin: FieldSpin | undefined;
  try {
    spin = parseFieldSpin(item.spin);
  } catch {
    problems.push(`${at}.spin: expected ${spinRule}, got ${show(item.spin)}`);
    ok = false;
  }
  const mass = item.mass ?? 0;
  if (typeof mass !== 'number' || !(mass >= FIELD_MASS_RANGE.min && mass < FIELD_MASS_RANGE.max)) {
    problems.push(`${at}.mass: expected Mμ with ${MASS_ALLOWED} (units of 1/M), got ${show(item.mass)}`);
    ok = false;
  }
  if (!ok || spin === undefined) return undefined;
  const refused = massiveSpinProblem(spin, mass as number);
  if (refused) {
    problems.push(`${at}.mass: ${refused}, got ${show(mass)}`);
    return undefined;
  }
  return { spin, mass: mass as number };
}

/** `holeMass`: { value, unit } with unit 'g', 'kg' or 'msun' (kerr's physical-mass range). */
export function readHoleMass(problems: string[], raw: unknown): HoleMass | undefined {
  const allowed = `{"value": M, "unit": ${MASS_UNITS.map((u) => `'${u}'`).join(' | ')}}`;
  if (!isObject(raw)) {
    problems.push(`holeMass: expected ${allowed}, got ${show(raw)}`);
    return undefined;
  }
  for (const k of Object.keys(raw))
    if (k !== 'value' && k !== 'unit') problems.push(`holeMass: unknown key '${k}' (allowed: value, unit)`);
  if (!(MASS_UNITS as readonly unknown[]).includes(raw.unit)) {
    problems.push(`holeMass.unit: expected one of ${MASS_UNITS.join(', ')}, got ${show(raw.unit)}`);
    return undefined;
  }
  try {
    requirePhysicalMass(raw.value as number, raw.unit as MassUnit);
  } catch (error) {
    if (!(error instanceof InputError)) throw error;
    problems.push(`holeMass.value: expected ${error.allowed}, got ${show(raw.value)}`);
    return undefined;
  }
  return { value: raw.value as number, unit: raw.unit as MassUnit };
}

/** Mμ of a species of `massGeV` on a hole of `holeMass`. */
export function speciesFieldMass(massGeV: number, holeMass: HoleMass): number {
  const grams = requirePhysicalMass(holeMass.value, holeMass.unit) * 1e3;
  return massGeV === 0 ? 0 : massGeV * grams * FIELD_MASS_PER_GRAM_GEV;
}

/**
 * `species`: registry names (emission's KNOWN_SPECIES, or 'standard-model'),
 * registry names with their dof or massGeV overridden, or the user's own
 * {name, spin, dof, massGeV}; each resolved by emission's resolveContent and
 * turned into a field with Mμ from the hole mass (when that is known).
 */
export function readSpecies(problems: string[], raw: unknown, holeMass: HoleMass | undefined): GridField[] {
  if (!Array.isArray(raw) || raw.length === 0) {
    problems.push(`species: expected a non-empty list of species names or {"name", "spin", "dof", "massGeV"}, got ${show(raw)}`);
    return [];
  }
  const out: GridField[] = [];
  raw.forEach((item, i) => {
    const at = `species[${i}]`;
    if (isObject(item)) {
      const unknown = Object.keys(item).filter((k) => !SPECIES_KEYS.includes(k));
      for (const k of unknown) problems.push(`${at}: unknown key '${k}' (allowed: ${SPECIES_KEYS.join(', ')})`);
      if (unknown.length) return;
    }
    let resolved: Species[];
    try {
      resolved = resolveContent([item as string]);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      // resolveContent names its own list `content`; the grid's is `species`.
      const key = String(error.parameter).replace(/^content\[0\]/, at);
      problems.push(`${key}: expected ${error.allowed}, got ${show(error.value)}`);
      return;
    }
    for (const s of resolved) {
      const species: GridSpecies = { name: s.name, spin: s.spin, dof: s.dof, massGeV: s.massGeV };
      if (out.some((f) => f.species?.name === s.name)) {
        problems.push(`${at}: species '${s.name}' appears twice`);
        continue;
      }
      if (!holeMass) {
        out.push({ spin: s.spin, mass: 0, species });
        continue;
      }
      const mass = speciesFieldMass(s.massGeV, holeMass);
      if (!(mass < FIELD_MASS_RANGE.max)) {
        const limit = FIELD_MASS_RANGE.max / speciesFieldMass(1, holeMass);
        problems.push(
          `${at}.massGeV: ${s.name} of ${s.massGeV} GeV on a hole of ${holeMass.value.toPrecision(3)} ${holeMass.unit} has Mμ = ${mass.toPrecision(3)}; allowed ${MASS_ALLOWED}, i.e. massGeV < ${limit.toPrecision(3)} on this hole`,
        );
        continue;
      }
      out.push({ spin: s.spin, mass, species });
    }
  });
  return out;
}

/** The fields' l values inside an explicit range: l ≥ spin, l − spin an integer; a massive vector from l = 0 (its monopole). */
export function fieldLs(field: Pick<GridField, 'spin' | 'mass'>, range: { min: number; max: number }): number[] {
  const out: number[] = [];
  for (let l = firstL(field); l <= range.max; l++) if (l >= range.min) out.push(l);
  return out;
}

/** The lowest l of a field: its spin, or 0 for a massive vector (the monopole). */
export function firstL(field: Pick<GridField, 'spin' | 'mass'>): number {
  return field.spin === 1 && field.mass > 0 ? 0 : field.spin;
}

/** Spin states of one (l, m) of a field in the mode table: the Dirac sign κ, the Proca polarisation, or the one helicity. */
export interface ModeState {
  kappaSign?: 1 | -1;
  polarization?: ProcaPolarization;
}

/** The states of shell l: both signs of κ for a massive Dirac field, the polarisations of a massive vector, else one. */
export function modeStates(field: Pick<GridField, 'spin' | 'mass'>, l: number): ModeState[] {
  if (field.mass > 0 && field.spin === 0.5) return [{ kappaSign: 1 }, { kappaSign: -1 }];
  if (field.mass > 0 && field.spin === 1)
    return l === 0
      ? [{ polarization: 'monopole' }]
      : (['odd', 'even-1', 'even-2'] as const).map((polarization) => ({ polarization }));
  return [{}];
}
