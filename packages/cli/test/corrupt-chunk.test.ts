import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { cpSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { sha256 } from '@noble/hashes/sha2.js';
import { bytesToHex, utf8ToBytes } from '@noble/hashes/utils.js';
import { ensureBuilt, tableFiles, writeGridFile } from '../../grid/test/support.js';
import { run } from './helpers.js';

// One scalar mode at 4 frequencies, 2 points per chunk: 2 chunks in milliseconds.
const GRID = {
  fieldSpins: [0],
  holeA: [0.5],
  frequencies: { values: [0.2, 0.3, 0.4, 0.5] },
  l: { max: 0 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 2,
};
const CHUNK = join('chunks', 'chunk-000001.json');

let work = '';
let gridFile = '';
let buildProblem: string | undefined;
beforeAll(async () => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-corrupt-'));
  gridFile = writeGridFile(work, GRID);
  if (buildProblem) return;
  const single = await run('table', gridFile, '--out', join(work, 'single'), '--workers', '1', '--quiet');
  if (single.code !== 0) throw new Error(single.stderr);
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

const damages: [string, (text: string) => string][] = [
  [
    'one changed digit of a Γ',
    (t) => t.replace(/("gamma":\d\.\d+)(\d)/, (_, head: string, d: string) => head + ((Number(d) + 1) % 10)),
  ],
  ['its trailing newline cut', (t) => t.slice(0, -1)],
  ['its second half missing', (t) => t.slice(0, Math.floor(t.length / 2))],
  [
    'another grid hash under a matching checksum',
    (t) => {
      const body = t
        .replace(/"gridHash":"[0-9a-f]+"/, '"gridHash":"0123456789abcdef"')
        .replace(/,"sha256":"[0-9a-f]{64}"\}\n$/, '');
      return `${body},"sha256":"${bytesToHex(sha256(utf8ToBytes(body)))}"}\n`;
    },
  ],
];

describe('penumbra table and merge with a damaged chunk file', () => {
  for (const [name, damage] of damages) {
    test(`a chunk with ${name}: merge exits 2 with one line naming the file as corrupt and writes nothing; table names it on stderr, recomputes it, exits 0 and matches the undamaged run byte for byte`, async (context) => {
      if (buildProblem) context.skip(buildProblem);
      const dir = join(work, name.replace(/\W+/g, '-'));
      cpSync(join(work, 'single'), dir, { recursive: true });
      const path = join(dir, CHUNK);
      writeFileSync(path, damage(readFileSync(path, 'utf8')));

      const out = `${dir}-merged`;
      const merged = await run('merge', dir, '--out', out);
      expect(merged.code).toBe(2);
      expect(merged.stderr).toMatch(/^penumbra: cannot merge: \S+chunk-000001\.json is corrupt \([^\n]+\)[^\n]*\n$/);
      expect(merged.stderr).toContain(path);
      expect(existsSync(out)).toBe(false);

      const resumed = await run('table', gridFile, '--out', dir, '--workers', '1', '--quiet');
      expect(resumed.code, resumed.stderr).toBe(0);
      expect(resumed.stderr).toContain(`penumbra table: ${path} is corrupt (`);
      expect(resumed.stderr).toMatch(/; recomputing it\n/);
      expect(resumed.stderr).toMatch(/1 chunks \(2 points\) computed, 1 already done/);
      expect(tableFiles(dir)).toEqual(tableFiles(join(work, 'single')));
    });
  }
});
