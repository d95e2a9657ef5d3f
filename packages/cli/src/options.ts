/**
 * Parsing helpers shared by the commands. All of them throw UsageError (a
 * malformed command line) or InputError from @penumbra/kerr (a well-formed
 * value outside the physics range); main.ts prints either as one line with
 * exit code 2.
 */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { kerrHole, MASS_UNITS, type MassUnit } from '@penumbra/kerr';
import { UsageError, type CliIO } from './command.js';

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
    throw new UsageError(conciseParseError(error));
  }
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

export interface NumberConstraints {
  min?: number;
  max?: number;
  /** min and max themselves are excluded */
  exclusive?: boolean;
  integer?: boolean;
}

/** A finite number from the command line, e.g. parseNumber('--mass', '1e15', { min: 0, exclusive: true }). */
export function parseNumber(option: string, text: string, constraints: NumberConstraints = {}): number {
  const trimmed = text.trim();
  const value = trimmed === '' ? Number.NaN : Number(trimmed);
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
  if (items.some((item) => item.trim() === '')) throw new UsageError(`${option} expects a comma-separated list of numbers, got '${text}'`);
  return items.map((item) => parseNumber(option, item, constraints));
}

/**
 * The hole spin a/M, |a/M| < 1. A well-formed number outside that range
 * throws the InputError of kerrHole, whose message explains the extremal limit.
 */
export function parseSpinRatio(option: string, text: string): number {
  const value = parseNumber(option, text);
  kerrHole({ a: value, mass: 1 });
  return value;
}

/** Field spins penumbra knows: scalar, neutrino, photon, graviton. */
export const FIELD_SPINS: readonly number[] = [0, 0.5, 1, 2];

/**
 * A field spin (weight) s: '0', '1/2' or '0.5', '1', '2', with a sign if
 * `allowNegative`. `allowed` narrows the accepted |s|.
 */
export function parseFieldSpin(
  option: string,
  text: string,
  { allowed = FIELD_SPINS, allowNegative = false }: { allowed?: readonly number[]; allowNegative?: boolean } = {},
): number {
  const fraction = /^\s*([+-]?)(\d+)\s*\/\s*2\s*$/.exec(text);
  const value = fraction ? (fraction[1] === '-' ? -1 : 1) * (Number(fraction[2]) / 2) : Number(text.trim() === '' ? Number.NaN : text);
  const names = allowed.map((s) => (Number.isInteger(s) ? String(s) : `${2 * s}/2`)).join(', ');
  if (!Number.isFinite(value) || !allowed.includes(Math.abs(value)) || (!allowNegative && value < 0)) {
    throw new UsageError(`${option} expects a field spin ${allowNegative ? '±' : ''}{${names}}, got '${text}'`);
  }
  return value === 0 ? 0 : value;
}

export interface ParsedRange {
  start: number;
  stop: number;
  count: number;
  /** the grid, endpoints included; geometric spacing when parsed with `log: true` */
  values: number[];
}

/**
 * A grid 'START:STOP:COUNT' (endpoints included) or a single value 'X'.
 * `log: true` spaces the points geometrically (START, STOP > 0). Each end
 * is checked against `constraints`.
 */
export function parseRange(
  option: string,
  text: string,
  { log = false, maxCount = 100_000, ...constraints }: NumberConstraints & { log?: boolean; maxCount?: number } = {},
): ParsedRange {
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
  if (log && !(start > 0 && stop > 0)) throw new UsageError(`${option} must be > 0 at both ends on a logarithmic grid, got '${text}'`);
  const values = Array.from({ length: count }, (_, i) => {
    if (i === 0) return start;
    if (i === count - 1) return stop;
    const t = i / (count - 1);
    return log ? start * (stop / start) ** t : start + (stop - start) * t;
  });
  return { start, stop, count, values };
}

/** Mass unit for physical output: g, kg or msun (solar masses). */
export function parseMassUnit(option: string, text: string): MassUnit {
  if ((MASS_UNITS as readonly string[]).includes(text)) return text as MassUnit;
  throw new UsageError(`${option} expects one of ${MASS_UNITS.join(', ')}, got '${text}'`);
}

/** Write one JSON document (two-space indent) and a newline. */
export function writeJson(io: CliIO, value: unknown): void {
  io.stdout(JSON.stringify(value, null, 2) + '\n');
}

/** A number for people: `digits` significant figures, exponent form outside [1e-4, 1e6). */
export function formatNumber(value: number, digits = 10): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-4 && magnitude < 1e6) return String(Number(value.toPrecision(digits)));
  return value.toExponential(digits - 1).replace(/\.?0+e/, 'e').replace('e+', 'e');
}

/** Rows of text cells as lines with left-aligned columns, two spaces apart. */
export function formatTable(rows: readonly (readonly string[])[], indent = '  '): string {
  const columns = Math.max(...rows.map((row) => row.length));
  const widths = Array.from({ length: columns }, (_, i) => Math.max(...rows.map((row) => (row[i] ?? '').length)));
  return rows.map((row) => (indent + row.map((cell, i) => cell.padEnd(widths[i])).join('  ')).trimEnd()).join('\n') + '\n';
}

/** A mode number that may be half-integer: '3', '-1/2', '1.5'. */
export function parseModeNumber(option: string, text: string): number {
  const fraction = /^\s*([+-]?)(\d+)\s*\/\s*2\s*$/.exec(text);
  if (fraction) return (fraction[1] === '-' ? -1 : 1) * (Number(fraction[2]) / 2);
  const value = parseNumber(option, text);
  if (!Number.isInteger(2 * value)) throw new UsageError(`${option} expects an integer or half-integer, got '${text}'`);
  return value;
}

/** Progress on stderr for long loops: at most ~10 lines. */
export function progressReporter(io: CliIO, label: string, total: number): (done: number) => void {
  const every = Math.max(1, Math.ceil(total / 10));
  return (done) => {
    if (total > 4 && (done % every === 0 || done === total)) io.stderr(`${label}: ${done}/${total}\n`);
  };
}
