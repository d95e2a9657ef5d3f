/**
 * Atomic files: every file of a run directory is written to a temporary name
 * and renamed into place, so a killed run leaves either the old file or the
 * complete new one; temporaries of killed runs on this host are cleaned up.
 */
import { closeSync, existsSync, fsyncSync, openSync, readdirSync, renameSync, unlinkSync, writeSync } from 'node:fs';
import { hostname } from 'node:os';
import { basename, dirname, join } from 'node:path';

const tmpTag = `.tmp-${hostname().replace(/[^A-Za-z0-9_-]/g, '_')}-`;

/** Write-then-rename, with the data flushed to disk before the rename. */
export function writeFileAtomic(path: string, text: string): void {
  const tmp = join(dirname(path), `.${basename(path)}${tmpTag}${process.pid}`);
  const fd = openSync(tmp, 'w');
  try {
    writeSync(fd, text);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  renameSync(tmp, path);
}

/** Removes temporary files of killed runs on this host (a live process's files are left alone). */
export function removeStaleTemporaries(dir: string): void {
  if (!existsSync(dir)) return;
  for (const name of readdirSync(dir)) {
    const at = name.lastIndexOf(tmpTag);
    if (!name.startsWith('.') || at < 0) continue;
    const pid = Number(name.slice(at + tmpTag.length));
    if (!Number.isInteger(pid) || pid === process.pid || isAlive(pid)) continue;
    try {
      unlinkSync(join(dir, name));
    } catch {
      // another process got there first
    }
  }
}

function isAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}
