#!/usr/bin/env node
// Grid throughput: modes per second with 1 and with 2 workers (scaling
// efficiency) and peak resident memory, on a 10,000-mode grid of Γ
// (s = 0 and 1, a = 0.3/0.6/0.9, 68 log-spaced Mω in [0.05, 2], l ≤ 4, tol 1e-6).
// 9,996 modes (the nearest whole grid to 10,000). --sample N runs only the
// cost-balanced shard 1 of N, a deterministic slice of the same grid, for
// slow machines; the default (1) runs the whole grid (~10-30 s per worker count).
// Usage: npx tsc -b && node bench/grid.bench.mjs [--sample N] [--workers 1,2]
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir, availableParallelism } from 'node:os';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { runGrid, validateGrid, gridChunks, shardChunks, gridTasks } from '../packages/grid/dist/index.js';
import { explicitModes } from '../packages/grid/dist/internal.js';

const { values } = parseArgs({
  options: { sample: { type: 'string', default: '1' }, workers: { type: 'string', default: '1,2' } },
});
const sample = Number(values.sample);
const workerCounts = values.workers.split(',').map(Number);

const grid = validateGrid({
  fieldSpins: [0, 1],
  holeA: [0.3, 0.6, 0.9],
  frequencies: { spacing: 'log', from: 0.05, to: 2, count: 68 },
  l: { max: 4 },
  tolerance: 1e-6,
  quantities: ['gamma'],
  chunkSize: 8,
});
const tasks = gridTasks(grid);
const modesOf = (task) => explicitModes(task.s, grid.l).length;
const fullModes = tasks.reduce((n, t) => n + modesOf(t), 0);
const chunks = gridChunks(grid, tasks);
const shard = { k: 1, n: sample };
const mine = shardChunks(chunks, shard);
const sampleModes = mine.reduce((n, i) => n + tasks.slice(chunks[i].first, chunks[i].end).reduce((m, t) => m + modesOf(t), 0), 0);

console.log(
  `grid: ${tasks.length} points, ${fullModes} modes; sample: shard 1/${sample}, ${mine.length} of ${chunks.length} chunks, ${sampleModes} modes`,
);
console.log(`machine: ${availableParallelism()} cores, Node ${process.version}`);

const results = [];
for (const workers of workerCounts) {
  const dir = mkdtempSync(join(tmpdir(), 'penumbra-grid-bench-'));
  let peakRss = process.memoryUsage().rss;
  const sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 50);
  const cpuBefore = process.cpuUsage();
  const started = performance.now();
  const run = await runGrid({ grid, out: join(dir, 'out'), workers, shard });
  const seconds = (performance.now() - started) / 1000;
  // user + system time of every thread of this process (the workers are threads)
  const cpu = process.cpuUsage(cpuBefore);
  const cpuSeconds = (cpu.user + cpu.system) / 1e6;
  clearInterval(sampler);
  peakRss = Math.max(peakRss, process.memoryUsage().rss);
  // Modes actually written, failed ones included (they cost a full attempt too).
  let modes = 0,
    failed = 0;
  for (const name of readdirSync(join(dir, 'out', 'chunks'))) {
    for (const r of JSON.parse(readFileSync(join(dir, 'out', 'chunks', name), 'utf8')).results) {
      modes += r.rows.modes.length;
      failed += r.rows.modes.filter((row) => row.status !== 'ok').length;
    }
  }
  rmSync(dir, { recursive: true, force: true });
  const rate = modes / seconds;
  results.push({ workers, modes, failed, seconds, rate, cpuSeconds, peakRssMiB: peakRss / 2 ** 20 });
  console.log(
    `workers ${workers}: ${modes} modes (${failed} failed) in ${seconds.toFixed(1)} s = ${rate.toFixed(1)} modes/s; CPU ${cpuSeconds.toFixed(1)} s (${((1000 * cpuSeconds) / modes).toFixed(2)} ms/mode, ${(cpuSeconds / seconds).toFixed(2)} cores busy); peak RSS ${(peakRss / 2 ** 20).toFixed(0)} MiB (chunks computed ${run.chunksComputed})`,
  );
}
const one = results.find((r) => r.workers === 1);
for (const r of results) {
  if (one && r.workers > 1)
    console.log(
      `scaling ${r.workers} workers: speed-up ${(r.rate / one.rate).toFixed(2)}, efficiency ${((100 * r.rate) / one.rate / r.workers).toFixed(0)} %`,
    );
}
if (one) {
  const withMore = results
    .filter((r) => r.workers > 1)
    .map((r) => `, ${(fullModes / r.rate / 60).toFixed(1)} min with ${r.workers}`);
  console.log(
    `estimated full ${fullModes}-mode grid: ${(fullModes / one.rate / 60).toFixed(1)} min with 1 worker${withMore.join('')}`,
  );
}
