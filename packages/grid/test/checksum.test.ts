import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import { GridError, gridChunks, mergeRuns, runGrid, validateGrid } from '@penumbra/grid';
import { chunkPath, inspectChunk } from '@penumbra/grid/internal';
import { tableFiles } from './support.js';

const work = mkdtempSync(join(tmpdir(), 'penumbra-checksum-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

// 4 scalar points of one mode, 2 points per chunk: 2 chunks, milliseconds in this thread.
const grid = validateGrid({
  fieldSpins: [0],
  holeA: [0.5],
  frequencies: { values: [0.2, 0.3, 0.4, 0.5] },
  l: { max: 0 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 2,
});
const chunk = gridChunks(grid)[1];
const reference = join(work, 'reference');
beforeAll(async () => {
  await runGrid({ grid, out: reference, workers: 0 });
});

/** The ways a chunk file is damaged, each turning the reference text of chunk 1 into a damaged one. */
const damages: [string, (text: string) => string][] = [
  // The last digit of the first Γ value, changed: still valid JSON.
  [
    'one changed digit of a Γ',
    (t) => t.replace(/("gamma":\d\.\d+)(\d)/, (_, head: string, d: string) => head + ((Number(d) + 1) % 10)),
  ],
  ['the trailing newline cut', (t) => t.slice(0, -1)],
  ['truncated to half its length', (t) => t.slice(0, Math.floor(t.length / 2))],
  [
    'another grid hash, with a checksum that matches the edited text',
    (t) => {
      const body = t
        .replace(/"gridHash":"[0-9a-f]+"/, '"gridHash":"0123456789abcdef"')
        .replace(/,"sha256":"[0-9a-f]{64}"\}\n$/, '');
      return `${body},"sha256":"${bytesToHex(sha256(utf8ToBytes(body)))}"}\n`;
    },
  ],
];

function damagedCopy(name: string, damage: (text: string) => string): string {
  const dir = join(work, name.replace(/\W+/g, '-'));
  cpSync(reference, dir, { recursive: true });
  const path = chunkPath(dir, chunk.index);
  const text = readFileSync(path, 'utf8');
  const damaged = damage(text);
  expect(damaged).not.toBe(text);
  writeFileSync(path, damaged);
  return dir;
}

describe('chunk checksums', () => {
  test('an undamaged chunk reads as ok and ends in the sha256 of the text before its checksum key', () => {
    const read = inspectChunk(reference, grid, chunk);
    expect(read.status).toBe('ok');
    const text = readFileSync(chunkPath(reference, chunk.index), 'utf8');
    const match = /^(.*),"sha256":"([0-9a-f]{64})"\}\n$/s.exec(text)!;
    expect(bytesToHex(sha256(utf8ToBytes(match[1])))).toBe(match[2]);
  });

  for (const [name, damage] of damages) {
    test(`a chunk with ${name} is corrupt: resume names it, recomputes only it and gives the reference bytes; merge refuses it by file name`, async () => {
      const dir = damagedCopy(name, damage);
      expect(inspectChunk(dir, grid, chunk).status).toBe('corrupt');

      const mergeOut = join(work, `merged-${name.replace(/\W+/g, '-')}`);
      let error: unknown;
      try {
        mergeRuns([dir], mergeOut);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(GridError);
      expect((error as GridError).message).toContain(`${chunkPath(dir, chunk.index)} is corrupt (`);
      expect((error as GridError).message).not.toMatch(/in none of the directories/);

      const corrupt: string[] = [];
      const resumed = await runGrid({ grid, out: dir, workers: 0, onCorruptChunk: ({ path }) => corrupt.push(path) });
      expect(corrupt).toEqual([chunkPath(dir, chunk.index)]);
      expect(resumed.chunksCorrupt).toBe(1);
      expect(resumed.chunksSkipped).toBe(1);
      expect(resumed.tasksComputed).toBe(chunk.end - chunk.first);
      expect(tableFiles(dir)).toEqual(tableFiles(reference));
    });
  }

  test('a chunk of format 2 (no checksum) is not corrupt but older: resume recomputes it without a corrupt notice; merge refuses it naming the file and its format', async () => {
    const dir = damagedCopy('format 2', (t) =>
      t.replace('penumbra-grid-chunk/3', 'penumbra-grid-chunk/2').replace(/,"sha256":"[0-9a-f]{64}"\}\n$/, '}\n'),
    );
    expect(inspectChunk(dir, grid, chunk)).toMatchObject({ status: 'old', format: 'penumbra-grid-chunk/2' });
    expect(() => mergeRuns([dir], join(work, 'merged-format-2'))).toThrow(
      `${chunkPath(dir, chunk.index)} is an older chunk format (penumbra-grid-chunk/2)`,
    );
    const corrupt: string[] = [];
    const resumed = await runGrid({ grid, out: dir, workers: 0, onCorruptChunk: ({ path }) => corrupt.push(path) });
    expect(corrupt).toEqual([]);
    expect(resumed.tasksComputed).toBe(chunk.end - chunk.first);
    expect(tableFiles(dir)).toEqual(tableFiles(reference));
  });
});
