/**
 * The arguments that name one mode at one hole over a frequency grid — --spin,
 * --l, --m, --a, --omega, --log, --tol — with their help lines and parsing,
 * shared by the commands that solve single modes (greybody, near-region).
 */
import type { FieldSpin } from '@penumbra/core';
import { type ParsedRange, parseFieldSpin, parseModeNumber, parseNumber, parseRange, requireOption } from './options.js';

/** Help lines of --spin, --l and --m. */
export const MODE_HELP = `--spin S     field spin: 0, 1/2 (or 0.5), 1, 2
  --l L        multipole, l ≥ S with l − S an integer
  --m M        azimuthal number, |m| ≤ l with m − S an integer`;

/** parseOptions specs of the mode arguments. */
export const MODE_OPTIONS = {
  spin: { type: 'string' },
  l: { type: 'string' },
  m: { type: 'string' },
  a: { type: 'string' },
  omega: { type: 'string' },
  log: { type: 'boolean' },
  tol: { type: 'string' },
} as const;

/** A parsed mode: its numbers, the frequency grid, the text it came from, and --tol if given. */
export interface ModeArguments {
  spin: FieldSpin;
  l: number;
  m: number;
  a: number;
  grid: ParsedRange;
  /** the --omega text, e.g. to tell a single frequency from a one-point grid */
  omegaText: string;
  tol: number | undefined;
}

/** Read the mode arguments (each required but --log and --tol); UsageError names the first bad one. */
export function parseModeArguments(values: {
  spin?: string;
  l?: string;
  m?: string;
  a?: string;
  omega?: string;
  log?: boolean;
  tol?: string;
}): ModeArguments {
  const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the field spin')) as FieldSpin;
  const l = parseModeNumber('--l', requireOption(values.l, '--l', 'the multipole'));
  const m = parseModeNumber('--m', requireOption(values.m, '--m', 'the azimuthal number'));
  const a = parseNumber('--a', requireOption(values.a, '--a', "the hole's a/M"));
  const omegaText = requireOption(values.omega, '--omega', 'the frequency Mω or START:STOP:COUNT');
  const grid = parseRange('--omega', omegaText, { min: 0, exclusive: true, log: values.log ?? false, maxCount: 10_000 });
  const tol = values.tol === undefined ? undefined : parseNumber('--tol', values.tol);
  return { spin, l, m, a, grid, omegaText, tol };
}
