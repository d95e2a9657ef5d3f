/**
 * Parsing helpers shared by the commands. All of them throw UsageError (a
 * malformed command line) or InputError from @penumbra/core (a well-formed
 * value outside the physics range); main.ts prints either as one line with
 * exit code 2. Field spins and frequency grids follow core's rules; these
 * helpers only add the option names to the messages.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { attempt, FIELD_SPINS, formatFieldSpin, linearGrid, logGrid, parseFieldSpin as parseCoreFieldSpin } from '@penumbra/core';
import { kerrHole, MASS_UNITS, type MassUnit } from '@penumbra/kerr';
import { UsageError } from './command.js';

/** The option config of node:util parseArgs. */
export type OptionsConfig = NonNullable<ParseArgsConfig['options']>;

/** What parseOptions returns: `values` typed by the option config, and `positionals`. */
export type ParsedOptions<O extends OptionsConfig> = ReturnType<
  typeof parseArgs<{ args: string[]; options: O; strict: true; allowPositionals: boolean }>
>;

/**
 * node:util parseArgs in strict mode, with its errors turned into one-line
 * UsageErrors. A negative number after a string option (`--a -0.9`) is taken
 * as that option's value rather than as an unknown option.
 */
export function parseOptions<const O extends OptionsConfig>(
  argv: string[],
  options: O,
  allowPositionals = false,
): ParsedOptions<O> {
  const args = attachNegativeValues(argv, options);
  try {
    return parseArgs({ args, options, strict: true, allowPositionals });
  } catch (error) {
    throw new UsageError(withSuggestion(conciseParseError(error), options));
  }
}

/** "unknown option '--omgea'" gains "; did you mean --omega?" when one option is close. */
function withSuggestion(message: string, options: OptionsConfig): string {
  const unknown = /^unknown option '--([^'=]+)/.exec(message);
  if (!unknown) return message;
  const near = closest(unknown[1], Object.keys(options));
  return near === undefined ? message : `${message}; did you mean --${near}?`;
}

/** Edit distance (insert, delete, substitute, swap two neighbours) between two short words. */
function editDistance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) =>
    Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

/**
 * The candidate nearest to a mistyped word, if it is near enough to be the
 * likely intent (at most 2 edits, and fewer than half the word's letters).
 */
export function closest(word: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const distance = editDistance(word.toLowerCase(), c.toLowerCase());
    if (distance < bestDistance) [best, bestDistance] = [c, distance];
  }
  return bestDistance <= 2 && bestDistance < Math.max(word.length, 2) / 2 ? best : undefined;
}

/**
 * A comma-separated list of names from `known`, e.g. --content
 * photon,graviton; an unknown name is a UsageError listing the known ones
 * (and the nearest one when it looks like a typo).
 */
export function parseNameList(option: string, text: string, known: readonly string[]): string[] {
  const names = text.split(',').map((s) => s.trim());
  for (const name of names) {
    if (known.includes(name)) continue;
    const near = closest(name, known);
    const hint = near === undefined ? '' : `; did you mean ${near}?`;
    throw new UsageError(`${option} expects a comma-separated list of ${known.join(', ')}, got '${name}'${hint}`);
  }
  return names;
}

const NEGATIVE_NUMBER = /^-(\d|\.\d|inf)/i;

function attachNegativeValues(argv: string[], options: OptionsConfig): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const token = argv[i];
    const next = argv[i + 1];
    if (token === '--') return out.concat(argv.slice(i));
    const name = token.startsWith('--') ? token.slice(2) : findShort(options, token);
    if (name !== undefined && options[name]?.type === 'string' && next !== undefined && NEGATIVE_NUMBER.test(next)) {
      out.push(`--${name}=${next}`);
      i++;
    } else {
      out.push(token);
    }
  }
  return out;
}

function findShort(options: OptionsConfig, token: string): string | undefined {
  if (!/^-[A-Za-z]$/.test(token)) return undefined;
  return Object.keys(options).find((key) => options[key].short === token.slice(1));
}

function conciseParseError(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  // Node appends advice about '--' to some messages; the first sentence is the useful part.
  const first = message.split(/\.\s/)[0].replace(/\.$/, '');
  return first.charAt(0).toLowerCase() + first.slice(1);
}

/** Throws UsageError naming the option unless it was given. */
export function requireOption(value: string | undefined, option: string, meaning: string): string {
  if (value === undefined) throw new UsageError(`missing ${option} (${meaning})`);
  return value;
}

/** What parseNumber accepts. */
export interface NumberConstraints {
  min?: number;
  max?: number;
  /** min and max themselves are excluded */
  exclusive?: boolean;
  integer?: boolean;
}

/**
 * The decimal numbers the command line accepts: optional sign, digits with an
 * optional fraction (or a leading-dot fraction), optional exponent. Number()
 * alone would also take '0x1', '0b1', 'Infinity' and '' (as 0).
 */
const DECIMAL_NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A finite number from the command line, e.g. parseNumber('--mass', '1e15', { min: 0, exclusive: true }). */
export function parseNumber(option: string, text: string, constraints: NumberConstraints = {}): number {
  const trimmed = text.trim();
  const value = DECIMAL_NUMBER.test(trimmed) ? Number(trimmed) : Number.NaN;
  if (!Number.isFinite(value)) throw new UsageError(`${option} expects a finite number, got '${text}'`);
  const { min, max, exclusive = false, integer = false } = constraints;
  if (integer && !Number.isInteger(value)) throw new UsageError(`${option} expects an integer, got '${text}'`);
  const belowMin = min !== undefined && (exclusive ? value <= min : value < min);
  const aboveMax = max !== undefined && (exclusive ? value >= max : value > max);
  if (belowMin || aboveMax) {
    throw new UsageError(`${option} must be ${describeRange(constraints)}, got ${text}`);
  }
  return value;
}

function describeRange({ min, max, exclusive = false }: NumberConstraints): string {
  const lower = exclusive ? '>' : '≥';
  const upper = exclusive ? '<' : '≤';
  if (min !== undefined && max !== undefined) return `${lower} ${min} and ${upper} ${max}`;
  if (min !== undefined) return `${lower} ${min}`;
  return `${upper} ${max}`;
}

/** Comma-separated numbers, e.g. '0,0.5,0.9'. */
export function parseNumberList(option: string, text: string, constraints: NumberConstraints = {}): number[] {
  const items = text.split(',');
  if (items.some((item) => item.trim() === ''))
    throw new UsageError(`${option} expects a comma-separated list of numbers, got '${text}'`);
  return items.map((item) => parseNumber(option, item, constraints));
}

/**
 * The hole's spin parameter a/M, |a/M| < 1. A well-formed number outside that
 * range throws the InputError of kerrHole, whose message explains the extremal limit.
 */
export function parseHoleA(option: string, text: string): number {
  const value = parseNumber(option, text);
  kerrHole({ a: value, mass: 1 });
  return value;
}

/**
 * A field spin by core's rule ('0', '1/2' or '0.5', '1', '2'); with
 * `allowNegative`, a signed spin weight s = ±spin. Core's InputError becomes a
 * UsageError naming the option.
 */
export function parseFieldSpin(
  option: string,
  text: string,
  { allowNegative = false }: { allowNegative?: boolean } = {},
): number {
  const trimmed = text.trim();
  const signed = allowNegative && /^[+-]/.test(trimmed);
  const magnitude = signed ? trimmed.slice(1) : trimmed;
  const number = DECIMAL_NUMBER.test(magnitude) ? Number(magnitude) : Number.NaN;
  const read = attempt(() => parseCoreFieldSpin(Number.isFinite(number) ? number : magnitude));
  if (read.status !== 'success') {
    const names = FIELD_SPINS.map(formatFieldSpin).join(', ');
    throw new UsageError(`${option} expects a field spin ${allowNegative ? '±' : ''}{${names}}, got '${text}'`);
  }
  const spin: number = read.solution;
  return spin === 0 ? 0 : signed && trimmed.startsWith('-') ? -spin : spin;
}

/** A parsed frequency (or angle) grid. */
export interface ParsedRange {
  start: number;
  stop: number;
  count: number;
  /** the grid, endpoints included; geometric spacing when parsed with `log: true` */
  values: number[];
}

/**
 * A grid 'START:STOP:COUNT' (endpoints included), a list 'X1,X2,…' (as
 * `table` takes) or a single value 'X'. `log: true` spaces the points
 * geometrically (START, STOP > 0). Each end (each list value) is checked
 * against `constraints`.
 */
export function parseRange(
  option: string,
  text: string,
  { log = false, maxCount = 100_000, ...constraints }: NumberConstraints & { log?: boolean; maxCount?: number } = {},
): ParsedRange {
  if (text.includes(',')) {
    if (text.includes(':')) throw new UsageError(`${option} expects START:STOP:COUNT or a list X1,X2,…, not both, got '${text}'`);
    const values = parseNumberList(option, text, constraints);
    if (values.length > maxCount) throw new UsageError(`${option} takes at most ${maxCount} values, got ${values.length}`);
    if (log && values.some((v) => !(v > 0))) throw new UsageError(`${option} must be > 0 on a logarithmic grid, got '${text}'`);
    return { start: values[0], stop: values[values.length - 1], count: values.length, values };
  }
  const parts = text.split(':');
  if (parts.length === 1) {
    const value = parseNumber(option, parts[0], constraints);
    if (log && !(value > 0)) throw new UsageError(`${option} must be > 0 on a logarithmic grid, got ${text}`);
    return { start: value, stop: value, count: 1, values: [value] };
  }
  if (parts.length !== 3) throw new UsageError(`${option} expects START:STOP:COUNT or a single value, got '${text}'`);
  const start = parseNumber(option, parts[0], constraints);
  const stop = parseNumber(option, parts[1], constraints);
  const count = parseNumber(`${option} COUNT`, parts[2], { min: 1, max: maxCount, integer: true });
  if (count === 1 && start !== stop) throw new UsageError(`${option} needs COUNT ≥ 2 when START ≠ STOP, got '${text}'`);
  if (log && !(start > 0 && stop > 0))
    throw new UsageError(`${option} must be > 0 at both ends on a logarithmic grid, got '${text}'`);
  const values = log ? logGrid(start, stop, count) : linearGrid(start, stop, count);
  return { start, stop, count, values };
}

/** Mass unit for physical output: g, kg or msun (solar masses). */
export function parseMassUnit(option: string, text: string): MassUnit {
  if ((MASS_UNITS as readonly string[]).includes(text)) return text as MassUnit;
  throw new UsageError(`${option} expects one of ${MASS_UNITS.join(', ')}, got '${text}'`);
}

/**
 * The mass unit the command line writes for geometric units (G = c = 1, the
 * mass only sets the length scale); `kerr` takes it, the physical commands do not.
 */
export const GEOMETRIC_UNIT = 'geometric';

/** A hole mass from the command line: the number of --mass and the unit of --unit. */
export interface MassOption<U extends string> {
  mass: number;
  unit: U;
}

/** The raw --mass and --unit of a command line. */
export interface MassValues {
  mass?: string;
  unit?: string;
}

/**
 * --mass and --unit, given together or not at all (undefined). One rule in
 * every command: a mass always names its unit, so `--mass 1e15` alone is
 * refused rather than read as grams in one command and as geometric units in
 * another. `geometric` lets `kerr` take a mass in geometric units.
 */
export function parseMassOption(values: MassValues): MassOption<MassUnit> | undefined;
/** The same, also taking `--unit geometric`. */
export function parseMassOption(
  values: MassValues,
  options: { geometric: true },
): MassOption<MassUnit | typeof GEOMETRIC_UNIT> | undefined;
export function parseMassOption(
  values: MassValues,
  { geometric = false } = {},
): MassOption<MassUnit | typeof GEOMETRIC_UNIT> | undefined {
  const units: string[] = geometric ? [...MASS_UNITS, GEOMETRIC_UNIT] : [...MASS_UNITS];
  if (values.mass === undefined && values.unit === undefined) return undefined;
  if (values.mass === undefined) throw new UsageError('--unit needs --mass');
  if (values.unit === undefined)
    throw new UsageError(`--mass needs --unit (${units.join(', ')}): a mass without its unit is ambiguous`);
  if (!units.includes(values.unit)) throw new UsageError(`--unit expects one of ${units.join(', ')}, got '${values.unit}'`);
  const mass = parseNumber('--mass', values.mass, { min: 0, exclusive: true });
  return { mass, unit: values.unit as MassUnit | typeof GEOMETRIC_UNIT };
}

/** A mode number that may be half-integer: '3', '-1/2', '1.5'; the physics checks live in the solvers. */
export function parseModeNumber(option: string, text: string): number {
  const fraction = /^\s*([+-]?)(\d+)\s*\/\s*2\s*$/.exec(text);
  const value = fraction ? (fraction[1] === '-' ? -1 : 1) * (Number(fraction[2]) / 2) : parseNumber(option, text);
  if (!Number.isInteger(2 * value)) throw new UsageError(`${option} expects an integer or half-integer, got '${text}'`);
  return value === 0 ? 0 : value;
}
