import { afterAll, describe, expect, test } from 'vitest';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { gridHash, readTableFile, runGrid, validateGrid } from '@penumbra/grid';
import { chunkFileName, outputDirProblems } from '@penumbra/grid/internal';

const work = mkdtempSync(join(tmpdir(), 'penumbra-store-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

// One scalar mode at two frequencies, one point per chunk: a few milliseconds in this thread.
const RAW = {
  fieldSpins: [0],
  holeA: [0.5],
  frequencies: { values: [0.2, 0.4] },
  l: { max: 0 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 1,
};

describe('run directories across format changes', () => {
  test('a directory of format 1 (grid.json with holeSpins, old chunks) holds the same grid, is resumed with every chunk recomputed, and gets the grid.json a new run writes', async () => {
    const grid = validateGrid(RAW);
    const fresh = join(work, 'fresh');
    await runGrid({ grid, out: fresh, workers: 0 });

    const old = join(work, 'old');
    mkdirSync(join(old, 'chunks'), { recursive: true });
    const { holeA, ...rest } = RAW;
    writeFileSync(
      join(old, 'grid.json'),
      JSON.stringify({ format: 'penumbra-grid/1', gridHash: '1f946858da7c1764', grid: { ...rest, holeSpins: holeA } }, null, 2) +
        '\n',
    );
    // A chunk of format 1: rows keyed by `s`, status 'ok', reason in `failure`.
    const oldRow = {
      s: 0,
      a: 0.5,
      omega: 0.2,
      l: 0,
      m: 0,
      status: 'ok',
      gamma: 0.5,
      relError: 1e-9,
      steps: 1,
      rhsEvaluations: 1,
      failure: null,
    };
    writeFileSync(
      join(old, 'chunks', chunkFileName(0)),
      JSON.stringify({
        format: 'penumbra-grid-chunk/1',
        gridHash: '1f946858da7c1764',
        chunk: 0,
        tasks: [0, 1],
        results: [{ index: 0, rows: { modes: [oldRow] } }],
      }) + '\n',
    );

    expect(outputDirProblems(old, grid)).toEqual([]);
    const run = await runGrid({ grid, out: old, workers: 0 });
    expect(run.chunksSkipped).toBe(0);
    expect(run.chunksComputed).toBe(2);
    for (const name of ['grid.json', 'modes.csv', 'table.json', `chunks/${chunkFileName(0)}`, `chunks/${chunkFileName(1)}`]) {
      expect(readFileSync(join(old, name), 'utf8')).toBe(readFileSync(join(fresh, name), 'utf8'));
    }
    expect(readdirSync(join(old, 'chunks'))).toHaveLength(2);
    const table = readTableFile(old);
    expect(table.gridHash).toBe(gridHash(grid));
    expect(table.tables.modes!.rows.map((r) => [r.spin, r.status, r.message])).toEqual([
      [0, 'success', null],
      [0, 'success', null],
    ]);
  });
});
