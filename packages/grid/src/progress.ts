/** A one-line progress bar with an ETA, for stderr. */
import type { Progress } from './run.js';

/** A duration as 42s, 3m07s or 2h05m. */
export function formatDuration(seconds: number): string {
  if (!Number.isFinite(seconds)) return '?';
  const s = Math.round(seconds);
  if (s < 60) return `${s}s`;
  const m = Math.floor(s / 60);
  if (m < 60) return `${m}m${String(s % 60).padStart(2, '0')}s`;
  return `${Math.floor(m / 60)}h${String(m % 60).padStart(2, '0')}m`;
}

/** One progress line: bar, percentage, points done, elapsed time and ETA. */
export function formatProgress(p: Progress, width = 30): string {
  const filled = Math.min(width, Math.round(p.fraction * width));
  const bar = '#'.repeat(filled) + '-'.repeat(width - filled);
  const percent = `${Math.floor(p.fraction * 100)}%`.padStart(4);
  const eta = p.etaSeconds === undefined ? '?' : formatDuration(p.etaSeconds);
  return `[${bar}] ${percent}  ${p.doneTasks}/${p.totalTasks} points  elapsed ${formatDuration(p.elapsedSeconds)}  ETA ${eta}`;
}

/**
 * Redraws in place on a terminal; elsewhere (logs, batch jobs) prints a line
 * at most every `intervalSeconds` and at the end.
 */
export function progressPrinter(write: (text: string) => void, tty: boolean, intervalSeconds = 10): (p: Progress) => void {
  let last = -Infinity;
  return (p) => {
    const end = p.doneTasks === p.totalTasks;
    const now = Date.now() / 1000;
    if (tty) {
      if (!end && now - last < 0.1) return;
      last = now;
      write(`\r${formatProgress(p)}\x1b[K${end ? '\n' : ''}`);
      return;
    }
    if (!end && now - last < intervalSeconds) return;
    last = now;
    write(formatProgress(p) + '\n');
  };
}
