/**
 * The limits of the computations, as each command's --help states them. Read
 * from the packages' own constants so the help follows the code.
 */
import { MAX_L, MAX_SOLVER_A_RATIO, TOLERANCE_RANGE } from '@penumbra/core';
import { MOMEGA_RANGE } from '@penumbra/flux';

/** Which limits a command's help lists. */
export type LimitName = 'l' | 'a' | 'omega' | 'tol';

const LINES: Record<LimitName, string> = {
  l: `l from |s| to ${MAX_L} (l − s an integer), |m| ≤ l`,
  a: `|a/M| ≤ ${MAX_SOLVER_A_RATIO} for the wave equations (the extremal hole a = M is only a limit)`,
  omega: `Mω from ${MOMEGA_RANGE.min} to ${MOMEGA_RANGE.max}`,
  tol: `tolerance from ${TOLERANCE_RANGE.min} to ${TOLERANCE_RANGE.max}`,
};

/** A "Limits:" block for a command's usage text. */
export function limitsHelp(names: readonly LimitName[]): string {
  return `Limits:\n${names.map((n) => `  ${LINES[n]}\n`).join('')}`;
}
