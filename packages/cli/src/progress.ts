/** Progress of long loops on stderr. */
import type { CliIO } from './command.js';

/** Progress on stderr for long loops: at most ~10 lines. */
export function progressReporter(io: CliIO, label: string, total: number): (done: number) => void {
  const every = Math.max(1, Math.ceil(total / 10));
  return (done) => {
    if (total > 4 && (done % every === 0 || done === total)) io.stderr(`${label}: ${done}/${total}\n`);
  };
}
