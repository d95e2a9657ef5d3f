#!/usr/bin/env node
// Kill and resume on a large grid: how much finished work survives a SIGKILL.
// A child process runs the grid on a worker pool and kills itself with SIGKILL
// (no clean-up, as a batch system or the OOM killer would) once a given share of
// the grid's tasks has finished. We then count the chunk files on disk, verify
// them by resuming, and compare the resumed tables byte for byte with an
// uninterrupted run. Grid: spins 0, 1/2, 1, 2 × a ∈ {0, 0.5, 0.9, 0.99} × 280
// log-spaced Mω in [0.01, 2], l ≤ 4: 4,480 points, 100,800 modes, 140 chunks.
// Usage: npx tsc -b && node bench/kill-resume.bench.mjs [--fractions 0.5,0.8,0.95,0.99] [--count 280]
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';

const { values } = parseArgs({
  options: {
    fractions: { type: 'string', default: '0.5,0.8,0.95,0.99' },
    count: { type: 'string', default: '280' },
    child: { type: 'string' },
    out: { type: 'string' },
  },
});

const grid = {
  fieldSpins: [0, 0.5, 1, 2],
  holeA: [0, 0.5, 0.9, 0.99],
  frequencies: { spacing: 'log', from: 0.01, to: 2, count: Number(values.count) },
  l: { max: 4 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 32,
};

const { runGrid, validateGrid } = await import('../packages/grid/dist/index.js');

if (values.child !== undefined) {
  // Child: run, and SIGKILL ourselves once the requested share of tasks is done.
  const killAt = Number(values.child);
  await runGrid({
    grid: validateGrid(grid),
    out: values.out,
    onProgress: (p) => {
      if (killAt < 1 && p.doneTasks >= killAt * p.totalTasks) process.kill(process.pid, 'SIGKILL');
    },
  });
  process.exit(0);
}

const self = new URL(import.meta.url).pathname;
const runChild = (fraction, out) =>
  spawnSync(process.execPath, [self, '--child', String(fraction), '--out', out, '--count', values.count], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
const chunkFiles = (out) => {
  try {
    return readdirSync(join(out, 'chunks')).filter((n) => n.endsWith('.json')).length;
  } catch {
    return 0;
  }
};
const tables = (out) =>
  readdirSync(out)
    .filter((n) => !n.startsWith('chunks') && n !== 'run.json') // run.json records this run (skipped chunks, timing)
    .sort()
    .map((n) => [n, readFileSync(join(out, n))]);

const work = mkdtempSync(join(tmpdir(), 'penumbra-kill-'));
const reference = join(work, 'reference');
let started = performance.now();
runChild(1, reference);
const fullSeconds = (performance.now() - started) / 1000;
const totalChunks = chunkFiles(reference);
const refTables = tables(reference);
console.log(`uninterrupted run: ${totalChunks} chunks in ${fullSeconds.toFixed(1)} s`);

for (const fraction of values.fractions.split(',').map(Number)) {
  const out = join(work, `killed-${fraction}`);
  const killed = runChild(fraction, out);
  const onDisk = chunkFiles(out);
  started = performance.now();
  const resumed = await runGrid({ grid: validateGrid(grid), out });
  const resumeSeconds = (performance.now() - started) / 1000;
  const mine = tables(out);
  const differing = refTables
    .filter(([n, bytes]) => {
      const other = mine.find(([m]) => m === n);
      return !other || Buffer.compare(bytes, other[1]) !== 0;
    })
    .map(([n]) => n);
  const same = differing.length === 0 && mine.length === refTables.length;
  console.log(
    `killed (${killed.signal ?? `exit ${killed.status}`}) after ${(100 * fraction).toFixed(0)} % of tasks: ` +
      `${onDisk} of ${totalChunks} chunks on disk (${((100 * onDisk) / totalChunks).toFixed(0)} %, ideal ≥ ${Math.floor(fraction * totalChunks) - 2}); ` +
      `resume skipped ${resumed.chunksSkipped}, computed ${resumed.chunksComputed} in ${resumeSeconds.toFixed(1)} s; tables ${same ? 'byte-identical' : `DIFFER (${differing.join(', ')})`} to the uninterrupted run`,
  );
}
rmSync(work, { recursive: true, force: true });
