// Emission benchmark. Run from /work/main after building:
//   npx tsc -b && node bench/emission.bench.mjs [--table-points 50] [--table-tol 1e-5] [--skip-table]
// Measures (1) wall time of the full per-dof totals (number rate, power,
// torque) of all four field spins at a = 0.9 to relative accuracy 1e-6, split
// over two worker threads, and (2) wall time of a 50-node f(a*), g(a*) table
// (4 spins per node, tol 1e-5, a* ≤ 0.99) on the same two workers. Prints the
// reported accuracy of each total and the table's interpolation-error estimate.
// Results: bench/results/emission-<date>.json.
import { Worker, isMainThread, parentPort } from 'node:worker_threads';
import { fileURLToPath } from 'node:url';
import os from 'node:os';
import { FIELD_SPINS } from '@penumbra/core';

if (!isMainThread) {
  const { emissionTotals } = await import('@penumbra/emission');
  parentPort.on('message', (task) => {
    const t0 = performance.now();
    const r = emissionTotals({ hole: { a: task.a }, field: { spin: task.spin } }, { tol: task.tol });
    parentPort.postMessage({
      ...task,
      ms: performance.now() - t0,
      numberRate: r.numberRate,
      power: r.power,
      torque: r.torque,
      gammaCalls: r.diagnostics.gammaCalls,
      lMax: r.diagnostics.lMax,
    });
  });
} else {
  const { pageFunctions } = await import('@penumbra/emission');
  const { writeResult } = await import('./lib.mjs');
  const args = process.argv.slice(2);
  const opt = (name, dflt) => {
    const i = args.indexOf(name);
    return i >= 0 ? args[i + 1] : dflt;
  };
  const tablePoints = Number(opt('--table-points', 50));
  const tableTol = Number(opt('--table-tol', 1e-5));

  /** Run tasks on two workers, longest first; returns results in task order and the wall time. */
  async function pool(tasks, label) {
    const out = new Array(tasks.length);
    let next = 0;
    let done = 0;
    const t0 = performance.now();
    await Promise.all(
      [0, 1].map(
        () =>
          new Promise((resolve, reject) => {
            const w = new Worker(fileURLToPath(import.meta.url));
            const feed = () => {
              if (next >= tasks.length) {
                w.terminate();
                resolve();
              } else {
                const k = next++;
                w.postMessage({ ...tasks[k], k });
              }
            };
            w.on('message', (r) => {
              out[r.k] = r;
              done++;
              if (tasks.length > 8) process.stderr.write(`\r${label}: ${done}/${tasks.length}`);
              feed();
            });
            w.on('error', reject);
            feed();
          }),
      ),
    );
    if (tasks.length > 8) process.stderr.write('\n');
    return { results: out, ms: performance.now() - t0 };
  }

  // (1) totals of the four spins at a = 0.9, tol 1e-6; the pairing balances the two workers.
  const totalsTasks = [2, 0.5, 1, 0].map((spin) => ({ spin, a: 0.9, tol: 1e-6 }));
  const totals = await pool(totalsTasks, 'totals');
  console.log(
    `Emission totals, a = 0.9, tol 1e-6, 2 worker threads on ${os.cpus().length} cores (${os.cpus()[0]?.model ?? ''}), load average ${os.loadavg()[0].toFixed(1)}`,
  );
  console.log('spin  numberRate·M      power·M²         torque·M         max relError  Γ solves  l max  worker ms');
  for (const r of totals.results) {
    const rel = Math.max(r.numberRate.relError, r.power.relError, r.torque.relError);
    console.log(
      `${String(r.spin).padEnd(5)} ${r.numberRate.value.toExponential(7)}  ${r.power.value.toExponential(7)}  ${r.torque.value.toExponential(7)}  ${rel.toExponential(2).padEnd(12)}  ${String(r.gammaCalls).padEnd(8)}  ${String(r.lMax).padEnd(5)}  ${r.ms.toFixed(0)}`,
    );
  }
  console.log(`wall time, all four spins: ${(totals.ms / 1000).toFixed(2)} s (target < 10 s)`);

  let table;
  if (!args.includes('--skip-table')) {
    const thetaMax = Math.asin(0.99);
    const aStar = Array.from({ length: tablePoints }, (_, i) =>
      i === tablePoints - 1 ? 0.99 : Math.sin((thetaMax * i) / (tablePoints - 1)),
    );
    const tasks = [];
    for (let i = tablePoints - 1; i >= 0; i--)
      for (const spin of FIELD_SPINS) tasks.push({ spin, a: aStar[i], tol: tableTol, i });
    const res = await pool(tasks, 'f, g table');
    const spins = FIELD_SPINS.map((spin) => {
      const get = (i) => res.results.find((r) => r.i === i && r.spin === spin);
      const torqueOverA = aStar.map((a, i) => (i === 0 ? NaN : get(i).torque.value / a));
      const torqueOverAError = aStar.map((a, i) => (i === 0 ? NaN : get(i).torque.absError / a));
      torqueOverA[0] = (4 * torqueOverA[1] - torqueOverA[2]) / 3;
      torqueOverAError[0] = (4 * torqueOverAError[1] + torqueOverAError[2]) / 3;
      return {
        spin,
        power: aStar.map((_, i) => get(i).power.value),
        powerError: aStar.map((_, i) => get(i).power.absError),
        torqueOverA,
        torqueOverAError,
      };
    });
    const fns = pageFunctions({
      table: { aStar, theta: aStar.map((_, i) => (thetaMax * i) / (tablePoints - 1)), spins, tol: tableTol, gammaCalls: 0 },
    });
    table = {
      points: tablePoints,
      tol: tableTol,
      seconds: res.ms / 1000,
      interpolationError: fns.interpolationError,
      nodeError: fns.nodeError,
      f0: fns.f(0),
      g0: fns.g(0),
    };
    console.log(
      `f, g table: ${tablePoints} nodes × 4 spins, tol ${tableTol}, a* ≤ 0.99: ${(res.ms / 1000).toFixed(1)} s wall on 2 workers`,
    );
    console.log(
      `  default content: f(0) = ${fns.f(0).toExponential(5)}, g(0) = ${fns.g(0).toExponential(5)}; interpolation error (relative) f ${fns.interpolationError.f.toExponential(1)}, g ${fns.interpolationError.g.toExponential(1)}; node error f ${fns.nodeError.f.toExponential(1)}, g ${fns.nodeError.g.toExponential(1)}`,
    );
  }
  writeResult?.('emission', { totals: { seconds: totals.ms / 1000, rows: totals.results }, table });
}
