/**
 * Visible accuracy: a printed value whose estimated relative error exceeds
 * ACCURACY_LIMIT carries a warning on stderr (whatever the format) and an
 * `inaccurate` flag in JSON and CSV, so a result that is only good to a few
 * per cent never looks like a precise one.
 */
import type { Column } from '@penumbra/core';
import type { CliIO } from './command.js';
import { formatError } from './format.js';

/** Relative error above which a value is flagged (1e-3). */
export const ACCURACY_LIMIT = 1e-3;

/** True when an estimated relative error is above ACCURACY_LIMIT (or not a number at all). */
export function isInaccurate(relError: number): boolean {
  return !(Math.abs(relError) <= ACCURACY_LIMIT);
}

/** The CSV column of the flag. */
export const INACCURATE_COLUMN: Column = {
  name: 'inaccurate',
  unit: '',
  description: `true where the estimated relative error exceeds ${ACCURACY_LIMIT}`,
};

/** A printed value and its estimated relative error. */
export interface Estimated {
  /** what the value is, e.g. 'lifetime' or 'σ at Mω = 0.3' */
  what: string;
  relError: number;
}

/**
 * One stderr line naming the values above ACCURACY_LIMIT (the first three and
 * a count); nothing when all are within it.
 */
export function warnInaccurate(io: CliIO, values: readonly Estimated[]): void {
  const bad = values.filter((v) => isInaccurate(v.relError));
  if (bad.length === 0) return;
  const named = bad
    .slice(0, 3)
    .map((v) => `${v.what} (${formatError(v.relError)})`)
    .join(', ');
  const more = bad.length > 3 ? ` and ${bad.length - 3} more` : '';
  io.stderr(`penumbra: warning: estimated relative error above ${ACCURACY_LIMIT}: ${named}${more}\n`);
}
