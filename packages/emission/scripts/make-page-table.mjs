#!/usr/bin/env node
/**
 * Generates data/page-table.json: per-dof power and torque/a* of the four
 * massless field spins on the θ = arcsin a* grid used by pageTable(), the
 * table behind pageFunctions() and the `penumbra evolve` command.
 *
 * Run from /work/main after `npx tsc -b`:
 *   node packages/emission/scripts/make-page-table.mjs [points=50] [tol=1e-5] [aMax=0.99]
 * Work is split over two worker threads (one grid node and spin per task).
 */
import { Worker, isMainThread, parentPort, workerData } from 'node:worker_threads';
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

if (isMainThread) {
  const points = Number(process.argv[2] ?? 50);
  const tol = Number(process.argv[3] ?? 1e-5);
  const aMax = Number(process.argv[4] ?? 0.99);
  const spins = [0, 0.5, 1, 2];
  const thetaMax = Math.asin(aMax);
  const theta = Array.from({ length: points }, (_, i) => (thetaMax * i) / (points - 1));
  const aStar = theta.map((t, i) => (i === points - 1 ? aMax : Math.sin(t)));
  // Expensive tasks (large a*, high spin) first for a balanced split.
  const tasks = [];
  for (let i = points - 1; i >= 0; i--) for (const spin of spins) tasks.push({ i, spin, a: aStar[i] });
  const results = new Map();
  const started = Date.now();
  let next = 0;
  let calls = 0;
  await Promise.all([0, 1].map(() => new Promise((resolve, reject) => {
    const w = new Worker(fileURLToPath(import.meta.url), { workerData: { tol } });
    const feed = () => {
      if (next >= tasks.length) { w.terminate(); resolve(); return; }
      w.postMessage(tasks[next++]);
    };
    w.on('message', (r) => {
      results.set(`${r.i}:${r.spin}`, r);
      calls += r.gammaCalls;
      process.stderr.write(`\rpage table: ${results.size}/${tasks.length} (${((Date.now() - started) / 1000).toFixed(0)} s)`);
      feed();
    });
    w.on('error', reject);
    feed();
  })));
  process.stderr.write('\n');
  const rows = spins.map((spin) => {
    const get = (i) => results.get(`${i}:${spin}`);
    const power = aStar.map((_, i) => get(i).power);
    const powerError = aStar.map((_, i) => get(i).powerError);
    const torqueOverA = aStar.map((a, i) => (i === 0 ? NaN : get(i).torque / a));
    const torqueOverAError = aStar.map((a, i) => (i === 0 ? NaN : get(i).torqueError / a));
    // even series in θ: g0 ≈ (4 g(h) − g(2h))/3 (same rule as pageTable())
    torqueOverA[0] = (4 * torqueOverA[1] - torqueOverA[2]) / 3;
    torqueOverAError[0] = (4 * torqueOverAError[1] + torqueOverAError[2]) / 3;
    return { spin, power, torqueOverA, powerError, torqueOverAError };
  });
  const table = { aStar, theta, spins: rows, tol, gammaCalls: calls };
  const out = fileURLToPath(new URL('../data/page-table.json', import.meta.url));
  writeFileSync(out, `${JSON.stringify({ generatedBy: 'packages/emission/scripts/make-page-table.mjs', seconds: (Date.now() - started) / 1000, ...table })}\n`);
  console.log(`wrote ${out}: ${points} nodes × 4 spins, tol ${tol}, ${calls} greybody solves, ${((Date.now() - started) / 1000).toFixed(1)} s`);
} else {
  const { emissionTotals } = await import('@penumbra/emission');
  parentPort.on('message', ({ i, spin, a }) => {
    const r = emissionTotals({ spin, a }, { tol: workerData.tol });
    parentPort.postMessage({
      i, spin, power: r.power.value, powerError: r.power.absError,
      torque: r.torque.value, torqueError: r.torque.absError, gammaCalls: r.diagnostics.gammaCalls,
    });
  });
}
