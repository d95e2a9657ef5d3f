/** Progress of long loops on stderr. */
import type { CliIO } from './command.js';

/** Progress on stderr for long loops: at most ~10 lines. */
export function progressReporter(io: CliIO, label: string, total: number): (done: number) => void {
  const every = Math.max(1, Math.ceil(total / 10));
  return (done) => {
    if (total > 4 && (done % every === 0 || done === total)) io.stderr(`${label}: ${done}/${total}\n`);
  };
}

/**
 * Progress of one long l-sum on stderr: a line each time the sum reaches a
 * further tenth of its geometric-optics cut `lCut` (at least 10 shells apart),
 * silent for sums that end below l = 20. Takes every solved mode's l.
 */
export function shellProgress(io: CliIO, label: string, lCut: number): (mode: { mode: { l: number } }) => void {
  const every = Math.max(10, Math.ceil(lCut / 10));
  let next = Math.max(20, every);
  return ({ mode: { l } }) => {
    if (l < next) return;
    io.stderr(`${label}: l-shells up to l = ${l} (the sum stops past l ≈ ${Math.ceil(lCut)})\n`);
    next = l + every;
  };
}
