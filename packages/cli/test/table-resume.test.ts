import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { cliBin, ensureBuilt, repositoryRoot, tableFiles, writeGridFile } from '../../grid/test/support.js';
import { run } from './helpers.js';

// 8 points of 8 modes (s = 1, l ≤ 2), one point per chunk: long enough to kill part-way.
const GRID = {
  fieldSpins: [1],
  holeA: [0.5, 0.9],
  frequencies: { spacing: 'linear', from: 0.1, to: 1.3, count: 4 },
  l: { max: 2 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 1,
};

let work = '';
let gridFile = '';
let buildProblem: string | undefined;

beforeAll(() => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-resume-'));
  gridFile = writeGridFile(work, GRID);
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

function spawnTable(out: string): {
  child: ChildProcess;
  done: Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>;
} {
  const child = spawn(process.execPath, [cliBin, 'table', gridFile, '--out', out, '--workers', '1'], {
    cwd: repositoryRoot,
    stdio: ['ignore', 'ignore', 'pipe'],
  });
  let stderr = '';
  child.stderr!.on('data', (d) => (stderr += d));
  const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null; stderr: string }>((resolve) =>
    child.on('close', (code, signal) => resolve({ code, signal, stderr })),
  );
  return { child, done };
}

const chunkCount = (out: string) =>
  existsSync(join(out, 'chunks')) ? readdirSync(join(out, 'chunks')).filter((n) => n.startsWith('chunk-')).length : 0;

describe('killed and restarted runs', () => {
  test('a run killed with SIGKILL after its first chunk, then restarted, skips the finished chunks and equals an uninterrupted run byte for byte', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const reference = await run('table', gridFile, '--out', join(work, 'reference'), '--workers', '2', '--quiet');
    expect(reference.code, reference.stderr).toBe(0);

    const out = join(work, 'killed');
    const first = spawnTable(out);
    const deadline = Date.now() + 60_000;
    while (chunkCount(out) === 0 && Date.now() < deadline) await new Promise((r) => setTimeout(r, 10));
    first.child.kill('SIGKILL');
    const killed = await first.done;
    expect(killed.signal).toBe('SIGKILL');
    const finishedBeforeKill = chunkCount(out);
    expect(finishedBeforeKill).toBeGreaterThan(0);
    expect(finishedBeforeKill).toBeLessThan(8);
    expect(existsSync(join(out, 'table.json'))).toBe(false);

    const second = spawnTable(out);
    const resumed = await second.done;
    expect(resumed.code, resumed.stderr).toBe(0);
    const skipped = Number(/(\d+) of 8 chunks already finished/.exec(resumed.stderr)?.[1]);
    expect(skipped).toBeGreaterThanOrEqual(finishedBeforeKill);
    expect(tableFiles(out)).toEqual(tableFiles(join(work, 'reference')));
    // No temporary file of the killed run is left behind.
    expect(readdirSync(join(out, 'chunks')).filter((n) => n.includes('.tmp-'))).toEqual([]);
  });
});
