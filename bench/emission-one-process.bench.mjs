// Emission totals of the four spins at a = 0.9 to 1e-6 in ONE fresh Node process, against the 2 s
// target and beside the two-lane figure of bench/emission.bench.mjs.
//   npx tsc -b && node bench/emission-one-process.bench.mjs [--runs 5]
// Why a single process: a fresh lane pays 4–5× a warm run for its first totals (V8 compiles the
// solver on its compiler threads), so two lanes pay that twice, while one process keeps its main
// thread busy and lets the compiler threads use the second core. The wall time is from spawning
// `node` to its exit (start-up and module loading included); CPU is the child's, all threads.
import { spawnSync } from 'node:child_process';
import os from 'node:os';
import { benchDir, median, writeResult } from './lib.mjs';

const child = `
const { emissionTotals } = await import('@penumbra/emission');
const out = [];
for (const spin of [0, 2, 0.5, 1]) {
  const r = emissionTotals({ hole: { a: 0.9 }, field: { spin } }, { tol: 1e-6 });
  out.push({ spin, power: r.power.value, powerError: r.power.absError });
}
const u = process.resourceUsage();
console.log(JSON.stringify({ out, cpuSeconds: (u.userCPUTime + u.systemCPUTime) / 1e6 }));
`;

const args = process.argv.slice(2);
const runs = Number(args[args.indexOf('--runs') + 1] ?? 5) || 5;
const load = os.loadavg()[0];
const walls = [];
const cpus = [];
let last;
for (let i = 0; i < runs; i++) {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['--input-type=module', '-e', child], { cwd: benchDir, encoding: 'utf8' });
  const wall = (performance.now() - t0) / 1000;
  if (r.status !== 0) throw new Error(r.stderr);
  last = JSON.parse(r.stdout);
  walls.push(wall);
  cpus.push(last.cpuSeconds);
}
const least = Math.min(...walls);
console.log(
  `Emission totals, four spins at a = 0.9, tol 1e-6, one fresh process per run (${runs} runs) on ${os.cpus().length} cores, load average ${load.toFixed(1)} before`,
);
console.log(
  `wall (spawn to exit): least ${least.toFixed(2)} s, median ${median(walls).toFixed(2)} s (ratio of the least to the 2 s target ${(least / 2).toFixed(2)}); CPU of the process, all threads: least ${Math.min(...cpus).toFixed(2)} s, median ${median(cpus).toFixed(2)} s`,
);
for (const o of last.out)
  console.log(`  spin ${o.spin}: power·M² ${o.power.toExponential(8)} ± ${o.powerError.toExponential(1)}`);
writeResult('emission-one-process', { machine: { cores: os.cpus().length, load }, runs, walls, cpus, totals: last.out });
