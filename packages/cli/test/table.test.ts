import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parse } from 'csv-parse/sync';
import { ensureBuilt, tableFiles, writeGridFile } from '../../grid/test/support.js';
import { run } from './helpers.js';

// 2 field spins × 2 holes × 3 frequencies = 12 points; l ≤ 1: (4 + 3) × 6 = 42 modes at tol 1e-6.
const GRID = {
  fieldSpins: [0, 1],
  holeA: [0, 0.6],
  frequencies: { spacing: 'log', from: 0.1, to: 0.9, count: 3 },
  l: { max: 1 },
  tolerance: 1e-6,
  quantities: ['gamma', 'reflection'],
  chunkSize: 2,
};

let work = '';
let gridFile = '';
let buildProblem: string | undefined;

beforeAll(() => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-table-'));
  gridFile = writeGridFile(work, GRID);
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('penumbra table', () => {
  test('1 and 2 workers write byte-identical tables and chunks', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const one = await run('table', gridFile, '--out', join(work, 'w1'), '--workers', '1', '--quiet');
    const two = await run('table', gridFile, '--out', join(work, 'w2'), '--workers', '2');
    expect(one.code, one.stderr).toBe(0);
    expect(two.code, two.stderr).toBe(0);
    expect(two.stderr).toMatch(/\[#+\] 100% {2}12\/12 points {2}elapsed \S+ {2}ETA 0s/);
    expect(two.stderr).toMatch(/grid complete: modes 42 rows \(0 failed\)/);
    const a = tableFiles(join(work, 'w1'));
    const chunks = Array.from({ length: 6 }, (_, i) => `chunks/chunk-00000${i}.json`);
    expect(Object.keys(a).sort()).toEqual([...chunks, 'grid.json', 'modes.csv', 'table.json']);
    expect(tableFiles(join(work, 'w2'))).toEqual(a);
    expect(JSON.parse(readFileSync(join(work, 'w2', 'run.json'), 'utf8')).workers).toBe(2);
  });

  test('modes.csv parses with csv-parse (an RFC 4180 parser) and every cell round-trips to table.json exactly', (context) => {
    if (buildProblem) context.skip(buildProblem);
    const dir = join(work, 'w1');
    const records: string[][] = parse(readFileSync(join(dir, 'modes.csv'), 'utf8'));
    const json = JSON.parse(readFileSync(join(dir, 'table.json'), 'utf8'));
    const table = json.tables.modes;
    const header = records[0];
    expect(header).toEqual(table.columns.map((c: { name: string; unit: string }) => (c.unit ? `${c.name} [${c.unit}]` : c.name)));
    expect(header.slice(0, 3)).toEqual(['spin [1]', 'a [M]', 'omega [1/M]']);
    expect(records.length - 1).toBe(table.rows.length);
    table.rows.forEach((row: Record<string, unknown>, i: number) => {
      table.columns.forEach((c: { name: string }, j: number) => {
        const cell = records[i + 1][j];
        const value = row[c.name];
        if (value === null) expect(cell).toBe('');
        else if (typeof value === 'number') expect(Number(cell)).toBe(value);
        else expect(cell).toBe(value);
      });
    });
    expect(json.summary).toMatchObject({ points: 12, rows: { modes: 42 }, failed: { modes: 0 } });
  });

  test('grid flags describe the same grid as the file: rerunning into the same directory skips every chunk', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const before = tableFiles(join(work, 'w1'));
    const again = await run(
      'table',
      '--spins',
      '0,1',
      '--a',
      '0,0.6',
      '--omega',
      '0.1:0.9:3',
      '--spacing',
      'log',
      '--l',
      '1',
      '--quantities',
      'gamma,reflection',
      '--chunk-size',
      '2',
      '--out',
      join(work, 'w1'),
      '--workers',
      '1',
    );
    expect(again.code, again.stderr).toBe(0);
    expect(again.stderr).toMatch(/resuming in .*: 6 of 6 chunks already finished/);
    expect(tableFiles(join(work, 'w1'))).toEqual(before);
  });

  describe('bad input: one message, exit code 2, nothing written', () => {
    const cases: [string, () => string[], RegExp][] = [
      [
        'a malformed grid file',
        () => [writeRaw('bad.json', '{"fieldSpins": [0,'), '--out', join(work, 'n1')],
        /is not valid JSON/,
      ],
      [
        'a contradictory grid (l range holding no s = 2 mode, both frequency forms)',
        () => [
          writeGridFile(work, { ...GRID, fieldSpins: [2], frequencies: { values: [0.1], spacing: 'log' } }, 'c.json'),
          '--out',
          join(work, 'n2'),
        ],
        /2 problems: \(1\) frequencies: give either "values" or .*; \(2\) l: the range 0…1 holds no mode of field spin 2/,
      ],
      [
        'an output directory holding a different grid',
        () => [writeGridFile(work, { ...GRID, tolerance: 1e-7 }, 'd.json'), '--out', join(work, 'w1')],
        /already holds a different grid/,
      ],
      [
        'an output directory that cannot be created (its parent is a file)',
        () => [gridFile, '--out', join(gridFile, 'sub')],
        /cannot be created: .* is not a directory/,
      ],
      [
        'shard 5/4',
        () => [gridFile, '--out', join(work, 'n3'), '--shard', '5/4'],
        /--shard expects K\/N with integers 1 ≤ K ≤ N .* got '5\/4'/,
      ],
      ['shard 0/0', () => [gridFile, '--out', join(work, 'n4'), '--shard', '0/0'], /got '0\/0'/],
      [
        'a grid file and grid flags together',
        () => [gridFile, '--a', '0.5', '--out', join(work, 'n5')],
        /either GRID.json or grid options/,
      ],
    ];
    for (const [name, args, message] of cases) {
      test(name, async () => {
        const before = snapshot();
        const result = await run('table', ...args());
        expect(result.code).toBe(2);
        expect(result.stdout).toBe('');
        expect(result.stderr).toMatch(/^penumbra: [^\n]+\n$/);
        expect(result.stderr).toMatch(message);
        expect(snapshot()).toEqual(before);
      });
    }
  });
});

function writeRaw(name: string, text: string): string {
  writeFileSync(join(work, name), text);
  return join(work, name);
}

/** Every path under the work directory with its size, to show nothing was written. */
function snapshot(): string[] {
  const out: string[] = [];
  const walk = (dir: string) => {
    for (const e of readdirSync(dir, { withFileTypes: true })) {
      const p = join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (!/\.json$/.test(e.name) || dir !== work) out.push(`${p} ${readFileSync(p).length}`);
    }
    out.push(dir);
  };
  if (existsSync(work)) walk(work);
  mkdirSync(work, { recursive: true });
  return out.sort();
}
