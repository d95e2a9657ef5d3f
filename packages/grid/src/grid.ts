/**
 * Grid descriptions: what a table run sweeps. Validation collects every
 * problem before any work starts, so a user fixes a grid file in one pass.
 *
 * All quantities are in geometric units of the hole mass (G = c = ħ = 1,
 * M = 1): a in units of M, ω in units of 1/M.
 */
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import { attempt, MAX_SOLVER_A_RATIO, parseFieldSpin, type FieldSpin, type FrequencyGrid } from '@penumbra/core';
import { MOMEGA_RANGE } from '@penumbra/flux';
import { fieldLs, readFieldEntry, readHoleMass, readSpecies, type GridField, type HoleMass } from './fields.js';

const MIN_MOMEGA = MOMEGA_RANGE.min;
const MAX_MOMEGA = MOMEGA_RANGE.max;

/** The quantities a grid can compute, in table order. */
export const QUANTITIES = ['gamma', 'reflection', 'crossSection', 'spectra'] as const;
/** One of `QUANTITIES`. */
export type Quantity = (typeof QUANTITIES)[number];

/** The modes of a grid: an explicit l range, or 'auto' (the l-shells the cross-section sum needs). */
export type LRange = { min: number; max: number } | 'auto';

/** A validated grid with every default filled in; its canonical JSON is the grid's identity. */
export interface GridSpec {
  /** the distinct field spins of `fields`, in order, each 0, 1/2, 1 or 2 */
  fieldSpins: FieldSpin[];
  /** the fields swept, in order: spin, mass Mμ (units of 1/M) and, in a species grid, the species */
  fields: GridField[];
  /** the hole's physical mass (species grids only): it turns each species' mass in GeV into Mμ */
  holeMass?: HoleMass;
  /** the hole's spin parameter a/M of each hole (M = 1) */
  holeA: number[];
  frequencies: FrequencyGrid;
  l: LRange;
  tolerance: number;
  quantities: Quantity[];
  chunkSize: number;
}

/** Relative accuracy of a grid that names none. */
export const DEFAULT_TOLERANCE = 1e-6;
/** Grid points per chunk file of a grid that names none. */
export const DEFAULT_CHUNK_SIZE = 16;
/** Explicit l ranges stop here; beyond it one grid point would cost thousands of solves. */
export const MAX_GRID_L = 40;
/** Largest number of (spin, a, ω) points of one grid. */
export const MAX_TASKS = 1_000_000;
/** Largest frequency count of one grid. */
const MAX_FREQUENCIES = 100_000;
/** The emission sums accept 1e-10 … 1e-2, the single-mode solver 1e-12 … 1e-2. */
const TOL_RANGE = { spectra: [1e-10, 1e-2], other: [1e-12, 1e-2] } as const;

const KNOWN_KEYS = [
  'fieldSpins',
  'fields',
  'species',
  'holeMass',
  'holeA',
  'frequencies',
  'l',
  'tolerance',
  'quantities',
  'chunkSize',
];
/** The key `holeA` had before it was renamed; still read, never written. */
const OLD_HOLE_KEY = 'holeSpins';

/** A grid that cannot be run; `problems` lists every problem found, each as one phrase. */
export class GridError extends Error {
  override readonly name = 'GridError';
  constructor(
    readonly problems: string[],
    subject = 'grid',
  ) {
    super(
      problems.length === 1
        ? `${subject}: ${problems[0]}`
        : `${subject} has ${problems.length} problems: ${problems.map((p, i) => `(${i + 1}) ${p}`).join('; ')}`,
    );
  }
}

const show = (value: unknown): string => {
  if (typeof value === 'string') return `'${value}'`;
  try {
    return JSON.stringify(value) ?? String(value);
  } catch {
    return String(value);
  }
};

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isFiniteNumber = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

function checkList<T extends number>(
  problems: string[],
  key: string,
  raw: unknown,
  read: (item: unknown, at: string) => T | undefined,
): T[] {
  if (!Array.isArray(raw) || raw.length === 0) {
    problems.push(`${key}: expected a non-empty list, got ${show(raw)}`);
    return [];
  }
  const out: T[] = [];
  raw.forEach((item, i) => {
    const value = read(item, `${key}[${i}]`);
    if (value === undefined) return;
    if (out.includes(value)) problems.push(`${key}[${i}]: ${show(item)} appears twice`);
    else out.push(value);
  });
  return out;
}

function checkOmega(problems: string[], at: string, w: unknown): w is number {
  if (!isFiniteNumber(w)) {
    problems.push(`${at}: expected a finite number, got ${show(w)}`);
    return false;
  }
  if (!(w >= MIN_MOMEGA && w <= MAX_MOMEGA)) {
    problems.push(`${at}: ω = ${w} is outside ${MIN_MOMEGA} ≤ Mω ≤ ${MAX_MOMEGA}`);
    return false;
  }
  return true;
}

function checkFrequencies(problems: string[], raw: unknown): FrequencyGrid | undefined {
  const allowed = `{"spacing": "linear"|"log", "from", "to", "count"} or {"values": [...]}`;
  if (!isObject(raw)) {
    problems.push(`frequencies: expected ${allowed}, got ${show(raw)}`);
    return undefined;
  }
  const hasValues = 'values' in raw;
  const rangeKeys = ['spacing', 'from', 'to', 'count'].filter((k) => k in raw);
  const unknown = Object.keys(raw).filter((k) => k !== 'values' && !rangeKeys.includes(k));
  for (const k of unknown) problems.push(`frequencies: unknown key '${k}' (allowed: values, or spacing, from, to, count)`);
  if (hasValues && rangeKeys.length > 0) {
    problems.push(`frequencies: give either "values" or "spacing/from/to/count", not both`);
    return undefined;
  }
  if (hasValues) {
    const values = raw.values;
    if (!Array.isArray(values) || values.length === 0) {
      problems.push(`frequencies.values: expected a non-empty list of numbers, got ${show(values)}`);
      return undefined;
    }
    let ok = true;
    values.forEach((w, i) => {
      if (!checkOmega(problems, `frequencies.values[${i}]`, w)) ok = false;
      else if (i > 0 && isFiniteNumber(values[i - 1]) && !(w > (values[i - 1] as number))) {
        problems.push(`frequencies.values[${i}]: ${w} is not above the previous value (the list must increase strictly)`);
        ok = false;
      }
    });
    return ok ? { values: values as number[] } : undefined;
  }
  const { spacing, from, to, count } = raw;
  let ok = true;
  if (spacing !== 'linear' && spacing !== 'log') {
    problems.push(`frequencies.spacing: expected 'linear' or 'log', got ${show(spacing)}`);
    ok = false;
  }
  if (!checkOmega(problems, 'frequencies.from', from)) ok = false;
  if (!checkOmega(problems, 'frequencies.to', to)) ok = false;
  if (!(isFiniteNumber(count) && Number.isInteger(count) && count >= 1 && count <= MAX_FREQUENCIES)) {
    problems.push(`frequencies.count: expected an integer from 1 to ${MAX_FREQUENCIES}, got ${show(count)}`);
    ok = false;
  }
  if (!ok) return undefined;
  const f = from as number,
    t = to as number,
    n = count as number;
  if (n === 1 && f !== t) {
    problems.push(`frequencies: count = 1 needs from = to (got from ${f}, to ${t})`);
    return undefined;
  }
  if (n > 1 && !(t > f)) {
    problems.push(`frequencies: 'to' (${t}) must exceed 'from' (${f}) when count > 1`);
    return undefined;
  }
  return { spacing: spacing as 'linear' | 'log', from: f, to: t, count: n };
}

function checkL(problems: string[], raw: unknown, fields: readonly GridField[], quantities: Quantity[]): LRange | undefined {
  const perMode = quantities.includes('gamma') || quantities.includes('reflection');
  if (raw === undefined || raw === 'auto') return 'auto';
  if (!isObject(raw)) {
    problems.push(`l: expected "auto" or {"min": L0, "max": L1}, got ${show(raw)}`);
    return undefined;
  }
  for (const k of Object.keys(raw)) if (k !== 'min' && k !== 'max') problems.push(`l: unknown key '${k}' (allowed: min, max)`);
  const isHalfInteger = (v: unknown): v is number => isFiniteNumber(v) && Number.isInteger(2 * v) && v >= 0;
  const max = raw.max;
  const min = raw.min ?? 0;
  let ok = true;
  if (!isHalfInteger(max) || max > MAX_GRID_L) {
    problems.push(`l.max: expected an integer or half-integer from 0 to ${MAX_GRID_L}, got ${show(max)}`);
    ok = false;
  }
  if (!isHalfInteger(min)) {
    problems.push(`l.min: expected an integer or half-integer ≥ 0, got ${show(min)}`);
    ok = false;
  }
  if (!ok) return undefined;
  const range = { min: min as number, max: max as number };
  if (range.min > range.max) {
    problems.push(`l: min (${range.min}) exceeds max (${range.max})`);
    return undefined;
  }
  if (!perMode && quantities.length > 0) {
    problems.push(
      `l: an explicit l range applies to gamma and reflection only; crossSection and spectra truncate their l-sums themselves (use "auto" or leave l out)`,
    );
  }
  const refused = new Set<number>();
  for (const field of fields) {
    if (fieldLs(field, range).length === 0 && !refused.has(field.spin)) {
      refused.add(field.spin);
      problems.push(
        `l: the range ${range.min}…${range.max} holds no mode of field spin ${field.spin} (l ≥ ${field.spin}, l − spin an integer)`,
      );
    }
  }
  return range;
}

/**
 * The fields of a grid: exactly one of `fieldSpins` (massless spins),
 * `fields` (spins or {spin, mass}) and `species` (with `holeMass`).
 */
function checkFields(problems: string[], raw: Record<string, unknown>): GridField[] {
  const given = ['fieldSpins', 'fields', 'species'].filter((k) => k in raw);
  // None given: the fieldSpins reader below reports the missing list, as before fields and species existed.
  if (given.length > 1) problems.push(`give one of ${given.join(', ')}, not ${given.length === 2 ? 'both' : 'all three'}`);
  if ('holeMass' in raw && !('species' in raw))
    problems.push('holeMass: applies to species only (give the mass of a field as Mμ in fields)');
  // Every key given is read, so that its problems are listed too; the first of species, fields, fieldSpins is the grid's.
  let read: GridField[] | undefined;
  if ('species' in raw) {
    const holeMass = 'holeMass' in raw ? readHoleMass(problems, raw.holeMass) : undefined;
    if (!('holeMass' in raw))
      problems.push(`holeMass: missing; species need the hole's mass to set Mμ (e.g. {"value": 1e15, "unit": "g"})`);
    read = readSpecies(problems, raw.species, holeMass);
  }
  if ('fields' in raw) {
    const fields = checkFieldList(problems, raw.fields);
    read ??= fields;
  }
  if ('fieldSpins' in raw || !read) {
    const spins = checkList(problems, 'fieldSpins', raw.fieldSpins, (item, at) => {
      const spin = attempt(() => parseFieldSpin(item));
      if (spin.status === 'success') return spin.solution;
      problems.push(`${at}: expected a field spin 0, 1/2 (or 0.5), 1 or 2, got ${show(item)}`);
      return undefined;
    });
    read ??= spins.map((spin) => ({ spin, mass: 0 }));
  }
  return read;
}

function checkFieldList(problems: string[], raw: unknown): GridField[] {
  if (!Array.isArray(raw) || raw.length === 0) {
    problems.push(`fields: expected a non-empty list of field spins or {"spin", "mass"}, got ${show(raw)}`);
    return [];
  }
  const out: GridField[] = [];
  raw.forEach((item, i) => {
    const field = readFieldEntry(problems, item, `fields[${i}]`);
    if (!field) return;
    if (out.some((f) => f.spin === field.spin && f.mass === field.mass))
      problems.push(`fields[${i}]: ${show(item)} appears twice`);
    else out.push(field);
  });
  return out;
}

/** The l values of a field spin inside an explicit range (l ≥ spin, l − spin an integer). */
export function modeLs(spin: number, range: { min: number; max: number }): number[] {
  const out: number[] = [];
  for (let l = spin; l <= range.max; l++) if (l >= range.min) out.push(l);
  return out;
}

/**
 * Validates a raw grid description (parsed JSON or built from CLI flags) and
 * returns it with defaults filled in; throws GridError listing every problem.
 */
export function validateGrid(raw: unknown): GridSpec {
  const problems: string[] = [];
  if (!isObject(raw)) throw new GridError([`expected a JSON object with keys ${KNOWN_KEYS.join(', ')}, got ${show(raw)}`]);
  for (const k of Object.keys(raw)) {
    if (!KNOWN_KEYS.includes(k) && k !== OLD_HOLE_KEY) problems.push(`unknown key '${k}' (known: ${KNOWN_KEYS.join(', ')})`);
  }
  if ('holeA' in raw && OLD_HOLE_KEY in raw) problems.push(`give holeA only ('${OLD_HOLE_KEY}' is its old name)`);
  const fields = checkFields(problems, raw);
  const holeKey = 'holeA' in raw || !(OLD_HOLE_KEY in raw) ? 'holeA' : OLD_HOLE_KEY;
  const holeA = checkList(problems, holeKey, raw[holeKey], (item, at) => {
    if (!isFiniteNumber(item) || Math.abs(item) > MAX_SOLVER_A_RATIO) {
      const note = isFiniteNumber(item) ? ' (the extremal hole a = M is a limit, not an input)' : '';
      problems.push(`${at}: expected a/M with |a/M| ≤ ${MAX_SOLVER_A_RATIO}, got ${show(item)}${note}`);
      return undefined;
    }
    return item === 0 ? 0 : item; // −0 and 0 are one hole
  });
  if (raw.frequencies === undefined)
    problems.push('frequencies: missing (e.g. {"spacing": "log", "from": 0.01, "to": 2, "count": 50})');
  const frequencies = raw.frequencies === undefined ? undefined : checkFrequencies(problems, raw.frequencies);

  let quantities: Quantity[] = [];
  const rawQ = raw.quantities ?? ['gamma'];
  if (!Array.isArray(rawQ) || rawQ.length === 0) {
    problems.push(`quantities: expected a non-empty list of ${QUANTITIES.join(', ')}, got ${show(rawQ)}`);
  } else {
    rawQ.forEach((q, i) => {
      if (!(QUANTITIES as readonly unknown[]).includes(q))
        problems.push(`quantities[${i}]: expected one of ${QUANTITIES.join(', ')}, got ${show(q)}`);
      else if (quantities.includes(q as Quantity)) problems.push(`quantities[${i}]: '${q}' appears twice`);
      else quantities.push(q as Quantity);
    });
    quantities = QUANTITIES.filter((q) => quantities.includes(q));
  }

  const l = checkL(problems, raw.l, fields, quantities);

  const tolerance = raw.tolerance ?? DEFAULT_TOLERANCE;
  const [tolMin, tolMax] = quantities.includes('spectra') ? TOL_RANGE.spectra : TOL_RANGE.other;
  if (!isFiniteNumber(tolerance) || tolerance < tolMin || tolerance > tolMax) {
    problems.push(
      `tolerance: expected a relative accuracy from ${tolMin} to ${tolMax}${quantities.includes('spectra') ? ' (spectra)' : ''}, got ${show(tolerance)}`,
    );
  }
  const chunkSize = raw.chunkSize ?? DEFAULT_CHUNK_SIZE;
  if (!isFiniteNumber(chunkSize) || !Number.isInteger(chunkSize) || chunkSize < 1 || chunkSize > 10_000) {
    problems.push(`chunkSize: expected an integer from 1 to 10000 (grid points per output chunk), got ${show(chunkSize)}`);
  }
  if (frequencies && fields.length && holeA.length) {
    const tasks = fields.length * holeA.length * frequencyCount(frequencies);
    if (tasks > MAX_TASKS)
      problems.push(`the grid has ${tasks} (field, a, ω) points; split it into several grids of at most ${MAX_TASKS}`);
  }
  if (problems.length > 0 || !frequencies || !l) throw new GridError(problems);
  const fieldSpins = fields.map((f) => f.spin).filter((spin, i, all) => all.indexOf(spin) === i);
  const holeMass = fields[0].species ? (raw.holeMass as HoleMass) : undefined;
  return {
    fieldSpins,
    fields,
    ...(holeMass ? { holeMass: { value: holeMass.value, unit: holeMass.unit } } : {}),
    holeA,
    frequencies,
    l,
    tolerance: tolerance as number,
    quantities,
    chunkSize: chunkSize as number,
  };
}

/** Stable text of a grid: fixed key order, so equal grids give equal bytes and hashes. */
export function canonicalGridJson(grid: GridSpec): string {
  const frequencies =
    'values' in grid.frequencies
      ? { values: grid.frequencies.values }
      : {
          spacing: grid.frequencies.spacing,
          from: grid.frequencies.from,
          to: grid.frequencies.to,
          count: grid.frequencies.count,
        };
  const l = grid.l === 'auto' ? 'auto' : { min: grid.l.min, max: grid.l.max };
  return JSON.stringify({
    ...canonicalFields(grid),
    holeA: grid.holeA,
    frequencies,
    l,
    tolerance: grid.tolerance,
    quantities: grid.quantities,
    chunkSize: grid.chunkSize,
  });
}

/**
 * The fields as the grid's identity holds them: `fieldSpins` while every
 * field is massless (so a grid written before masses existed keeps its
 * bytes and hash), `fields` with their masses otherwise, and for a species
 * grid every species' registry values written out and the hole mass.
 */
function canonicalFields(grid: GridSpec): Record<string, unknown> {
  if (grid.holeMass && grid.fields.every((f) => f.species)) {
    return {
      species: grid.fields.map(({ species: s }) => ({ name: s!.name, spin: s!.spin, dof: s!.dof, massGeV: s!.massGeV })),
      holeMass: { value: grid.holeMass.value, unit: grid.holeMass.unit },
    };
  }
  if (grid.fields.some((f) => f.mass > 0)) return { fields: grid.fields.map((f) => ({ spin: f.spin, mass: f.mass })) };
  return { fieldSpins: grid.fields.map((f) => f.spin) };
}

/** True when the rows carry the field's mass (a massive field or a species grid). */
export function hasFieldMasses(grid: GridSpec): boolean {
  return grid.holeMass !== undefined || grid.fields.some((f) => f.mass > 0);
}

/** True when the rows carry the species name and its degrees of freedom. */
export function hasSpecies(grid: GridSpec): boolean {
  return grid.holeMass !== undefined;
}

/** The grid's identity in files and messages: the first 16 hex digits of the SHA-256 of its canonical JSON. */
export function gridHash(grid: GridSpec): string {
  return bytesToHex(sha256(utf8ToBytes(canonicalGridJson(grid)))).slice(0, 16);
}

function frequencyCount(grid: FrequencyGrid): number {
  return 'values' in grid ? grid.values.length : grid.count;
}
