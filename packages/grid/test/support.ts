/**
 * Test helper: the pool loads dist/worker.js and the spawned CLI loads
 * packages/cli/dist, so tests that run them build first (tsc -b is
 * incremental: a no-op when dist is current).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { GridError, validateGrid } from '@penumbra/grid';

export const repositoryRoot = fileURLToPath(new URL('../../../', import.meta.url));
export const cliBin = fileURLToPath(new URL('../../cli/bin/penumbra.js', import.meta.url));
const builtFiles = ['../dist/worker.js', '../../cli/dist/main.js'].map((p) => fileURLToPath(new URL(p, import.meta.url)));

/** Builds the CLI and its references; returns a reason if the build is unusable. */
export function ensureBuilt(): string | undefined {
  const build = spawnSync('npx', ['tsc', '-b', 'packages/cli'], { cwd: repositoryRoot, encoding: 'utf8' });
  if (builtFiles.every((f) => existsSync(f))) return undefined;
  return `tsc -b packages/cli failed: ${build.stdout}${build.stderr}`.slice(0, 400);
}

/** Every file below `dir` except the run*.json timing records, as relative path → bytes. */
export function tableFiles(dir: string): Record<string, string> {
  const out: Record<string, string> = {};
  const walk = (sub: string) => {
    for (const entry of readdirSync(join(dir, sub), { withFileTypes: true })) {
      const rel = sub ? `${sub}/${entry.name}` : entry.name;
      if (entry.isDirectory()) walk(rel);
      else if (!/^run(-shard-\d+-of-\d+)?\.json$/.test(entry.name)) out[rel] = readFileSync(join(dir, rel), 'utf8');
    }
  };
  walk('');
  return out;
}

/** A small grid file for CLI tests: tens of modes at tol 1e-6. */
export function writeGridFile(dir: string, grid: object, name = 'grid.json'): string {
  const path = join(dir, name);
  writeFileSync(path, JSON.stringify(grid));
  return path;
}

/** The problems validateGrid lists for a grid description (none: []). */
export function problemsOf(raw: unknown): string[] {
  try {
    validateGrid(raw);
  } catch (error) {
    if (error instanceof GridError) return error.problems;
    throw error;
  }
  return [];
}
