/**
 * Merging shard directories: same grid everywhere, every chunk present,
 * duplicated chunks byte-identical. The result is the directory a single
 * run would have written (apart from its run.json timing file).
 */
import { existsSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { canonicalGridJson, GridError, gridHash, type GridSpec } from './grid.js';
import { writeFileAtomic } from './files.js';
import { CHUNK_DIR, chunkFileName, GRID_FILE, initOutputDir, inspectChunk, outputDirProblems, readGridFile } from './store.js';
import { assembleTables, writeTables, type TableSummary } from './tables.js';
import type { TaskResult } from './compute.js';
import { gridChunks } from './tasks.js';

/** What a merge did. */
export interface MergeSummary {
  gridHash: string;
  sources: string[];
  chunks: number;
  files: string[];
  summary: TableSummary;
}

/** Checks and merges; throws GridError (listing every problem) before writing anything. */
export function mergeRuns(sources: readonly string[], out: string): MergeSummary {
  const problems: string[] = [];
  if (sources.length === 0) throw new GridError(['no input directories given'], 'cannot merge');
  let grid: GridSpec | undefined;
  let first = '';
  for (const dir of sources) {
    if (!existsSync(dir) || !statSync(dir).isDirectory()) {
      problems.push(`${dir} is not a directory`);
      continue;
    }
    if (!existsSync(join(dir, GRID_FILE))) {
      problems.push(`${dir} holds no ${GRID_FILE} (not the output of 'penumbra table')`);
      continue;
    }
    const held = readGridFile(dir);
    if (typeof held === 'string') problems.push(held);
    else if (!grid) {
      grid = held;
      first = dir;
    } else if (canonicalGridJson(held) !== canonicalGridJson(grid)) {
      problems.push(`${dir} holds a different grid (${gridHash(held)}) from ${first} (${gridHash(grid)})`);
    }
  }
  if (problems.length || !grid) throw new GridError(problems, 'cannot merge');

  const chunks = gridChunks(grid);
  const chosen: { source: string; text: string; results: TaskResult[] }[] = [];
  const missing: number[] = [];
  for (const chunk of chunks) {
    let pick: (typeof chosen)[number] | undefined;
    let found = false;
    for (const dir of sources) {
      const read = inspectChunk(dir, grid, chunk);
      if (read.status !== 'missing') found = true;
      if (read.status === 'corrupt')
        problems.push(`${read.path} is corrupt (${read.problem}); rerun 'penumbra table' on ${dir} to recompute it`);
      if (read.status === 'old')
        problems.push(`${read.path} is an older chunk format (${read.format}); rerun 'penumbra table' on ${dir} to recompute it`);
      if (read.status !== 'ok') continue;
      const { text, file } = read;
      if (!pick) pick = { source: dir, text, results: file.results };
      else if (pick.text !== text) problems.push(`chunk ${chunk.index} differs between ${pick.source} and ${dir}`);
    }
    if (pick) chosen.push(pick);
    else if (!found) missing.push(chunk.index);
  }
  if (missing.length) {
    const list = missing.length > 12 ? `${missing.slice(0, 12).join(', ')}, … (${missing.length} in all)` : missing.join(', ');
    problems.push(
      `incomplete: chunk${missing.length > 1 ? 's' : ''} ${list} of ${chunks.length} are in none of the directories (a shard not run or not finished?)`,
    );
  }
  problems.push(...outputDirProblems(out, grid));
  if (problems.length) throw new GridError(problems, 'cannot merge');

  const started = Date.now();
  initOutputDir(out, grid);
  const outAbs = resolve(out);
  chosen.forEach((c, i) => {
    if (resolve(c.source) !== outAbs) writeFileAtomic(join(out, CHUNK_DIR, chunkFileName(chunks[i].index)), c.text);
  });
  const assembled = assembleTables(
    grid,
    chosen.flatMap((c) => c.results),
  );
  const files = writeTables(out, assembled);
  writeFileAtomic(
    join(out, 'run.json'),
    JSON.stringify(
      {
        kind: 'merge',
        mergedAt: new Date(started).toISOString(),
        seconds: (Date.now() - started) / 1000,
        sources: sources.map((s) => resolve(s)),
        node: process.version,
      },
      null,
      2,
    ) + '\n',
  );
  return { gridHash: gridHash(grid), sources: [...sources], chunks: chunks.length, files, summary: assembled.summary };
}
