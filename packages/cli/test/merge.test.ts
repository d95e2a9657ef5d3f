import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { cpSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureBuilt, tableFiles, writeGridFile } from '../../grid/test/support.js';
import { run } from './helpers.js';

// 1 field spin × 2 holes × 4 frequencies = 8 points in 4 chunks; modes in the automatic l range and cross-sections.
const GRID = {
  fieldSpins: [1],
  holeA: [0, 0.8],
  frequencies: { values: [0.05, 0.2, 0.5, 0.8] },
  tolerance: 1e-6,
  quantities: ['gamma', 'crossSection'],
  chunkSize: 2,
};

let work = '';
let gridFile = '';
let buildProblem: string | undefined;

beforeAll(async () => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-merge-'));
  gridFile = writeGridFile(work, GRID);
  if (buildProblem) return;
  const single = await run('table', gridFile, '--out', join(work, 'single'), '--workers', '2', '--quiet');
  if (single.code !== 0) throw new Error(single.stderr);
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('penumbra table --shard and penumbra merge', () => {
  test('shards 1/3, 2/3, 3/3 merged give the single run byte for byte (tables, chunks, grid.json)', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    for (const k of [1, 2, 3]) {
      const shard = await run(
        'table',
        gridFile,
        '--out',
        join(work, `part${k}`),
        '--shard',
        `${k}/3`,
        '--workers',
        '1',
        '--quiet',
      );
      expect(shard.code, shard.stderr).toBe(0);
      expect(shard.stderr).toMatch(/not in .* yet; when every shard has finished, run 'penumbra merge/);
    }
    const chunkCounts = [1, 2, 3].map((k) => readdirSync(join(work, `part${k}`, 'chunks')).length);
    expect(chunkCounts.reduce((x, y) => x + y, 0)).toBe(4);
    const merged = await run(
      'merge',
      join(work, 'part1'),
      join(work, 'part2'),
      join(work, 'part3'),
      '--out',
      join(work, 'merged'),
    );
    expect(merged.code, merged.stderr).toBe(0);
    expect(merged.stderr).toMatch(/4 chunks from 3 directories: modes \d+ rows \(0 failed\), crossSection 8 rows \(0 failed\)/);
    const single = tableFiles(join(work, 'single'));
    expect(Object.keys(single)).toContain('cross-section.csv');
    expect(tableFiles(join(work, 'merged'))).toEqual(single);
  });

  test('shards writing into one shared directory leave the complete table there, equal to the single run', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const shared = join(work, 'shared');
    const results = await Promise.all(
      [1, 2].map((k) => run('table', gridFile, '--out', shared, '--shard', `${k}/2`, '--workers', '1', '--quiet')),
    );
    for (const r of results) expect(r.code, r.stderr).toBe(0);
    expect(tableFiles(shared)).toEqual(tableFiles(join(work, 'single')));
  });

  test('merging with a shard missing, or directories of different grids, exits 2 with one message and writes nothing', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const missing = await run('merge', join(work, 'part1'), join(work, 'part2'), '--out', join(work, 'incomplete'));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(
      /^penumbra: cannot merge: incomplete: chunks? [\d, ]+ of 4 are in none of the directories[^\n]*\n$/,
    );
    const other = join(work, 'other');
    cpSync(join(work, 'part1'), other, { recursive: true });
    writeGridFile(other, { format: 'penumbra-grid/2', grid: { ...GRID, tolerance: 1e-7 } });
    const different = await run('merge', join(work, 'part1'), other, '--out', join(work, 'mixed'));
    expect(different.code).toBe(2);
    expect(different.stderr).toMatch(/holds a different grid/);
    expect(readdirSync(work).filter((name) => ['incomplete', 'mixed'].includes(name))).toEqual([]);
  });
});
