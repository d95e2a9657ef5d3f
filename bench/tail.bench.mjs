// Per-mode cost distribution of greybody at the default tol 1e-8: median and
// 99th percentile CPU time and RHS evaluations over
//   (1) random Kerr modes: s ∈ {0, 1/2, 1, 2}, l ≤ 6, all m, 0.01 ≤ Mω ≤ 3,
//       a uniform in [0, 0.9999];
//   (2) near-extremal counter-rotating modes: a ∈ {0.999, 0.9999}, m < 0;
// with and without the reflection. CPU time per call (process.cpuUsage), so
// preemption on a shared machine does not count; the load is printed.
// Run: npx tsc -b && node bench/tail.bench.mjs [N]
import os from 'node:os';
import { greybody } from '@penumbra/flux';
import { fmt, seededRandom } from './lib.mjs';

const N = Number(process.argv[2] ?? 1000);
const rand = seededRandom(17);
const spins = [0, 0.5, 1, 2];
function mode(counterRotating) {
  const spin = spins[Math.floor(rand() * 4)];
  const l = spin + Math.floor(rand() * (7 - Math.ceil(spin)));
  let m = -l + Math.floor(rand() * (2 * l + 1));
  if (counterRotating && m >= 0) m = -l;
  const a = counterRotating ? (rand() < 0.5 ? 0.999 : 0.9999) : 0.9999 * rand();
  return { hole: { a }, mode: { field: { spin }, l, m }, omega: 0.01 * 300 ** rand() };
}
const sets = [
  ['random Kerr, a ≤ 0.9999', Array.from({ length: N }, () => mode(false))],
  ['near-extremal counter-rotating (a ∈ {0.999, 0.9999}, m < 0)', Array.from({ length: Math.ceil(N / 4) }, () => mode(true))],
];
const quantile = (xs, q) => {
  const s = [...xs].sort((x, y) => x - y);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
};
for (const p of sets[0][1].slice(0, 200)) greybody(p); // warm the JIT
console.log(
  `load average ${os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')}; ${os.cpus()[0]?.model} × ${os.cpus().length}`,
);
let medianAll = Number.NaN;
for (const [label, modes] of sets) {
  for (const reflection of [true, false]) {
    const ms = [];
    const evals = [];
    let failed = 0;
    for (const p of modes) {
      const t0 = process.cpuUsage();
      try {
        const r = greybody(p, { reflection });
        const t = process.cpuUsage(t0);
        ms.push((t.user + t.system) / 1e3);
        evals.push(r.diagnostics.rhsEvaluations);
      } catch {
        failed++;
      }
    }
    const med = quantile(ms, 0.5);
    if (Number.isNaN(medianAll)) medianAll = med;
    console.log(
      `${label}, reflection ${reflection}: ${ms.length} modes (${failed} refused/failed); CPU ms median ${fmt(med, 3)}, p90 ${fmt(quantile(ms, 0.9), 3)}, p99 ${fmt(quantile(ms, 0.99), 3)}, max ${fmt(Math.max(...ms), 3)}; RHS evaluations median ${quantile(evals, 0.5)}, p99 ${quantile(evals, 0.99)}; median / random-Kerr median ${fmt(med / medianAll)}`,
    );
  }
}
