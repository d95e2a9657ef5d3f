/** Option values of `penumbra plot` that other commands do not take. */
import { UsageError } from './command.js';
import { parseModeNumber } from './options.js';

/** A set of l or m values: `2`, `1,2,3`, `-2:2` (every integer or half-integer step between), or a mix (`0,2:3`). */
export function parseModeList(option: string, text: string): number[] {
  const values: number[] = [];
  for (const item of text.split(',')) {
    if (item.trim() === '') throw new UsageError(`${option} expects a list such as 2 or 1,2 or -2:2, got '${text}'`);
    const [from, to, extra] = item.split(':');
    if (extra !== undefined) throw new UsageError(`${option} expects FROM:TO in a range, got '${item}'`);
    const first = parseModeNumber(option, from);
    const last = to === undefined ? first : parseModeNumber(option, to);
    if (last < first) throw new UsageError(`${option} range ${item} runs backwards`);
    if (!Number.isInteger(last - first)) throw new UsageError(`${option} range ${item} mixes integers and half-integers`);
    if (last - first > 1000) throw new UsageError(`${option} range ${item} is too long (at most 1000 values)`);
    for (let v = first; v <= last; v++) values.push(v);
  }
  return [...new Set(values)];
}
