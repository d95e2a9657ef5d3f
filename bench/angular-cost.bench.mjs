// Cost of the angular eigenvalue and the input checks inside a greybody solve
// (issue 14), this build against a base build (default /tmp/angular-base: a
// copy of the base branch's packages/*/dist with its own node_modules/@penumbra
// links; BASE=/path overrides).
//
// 1. Identity: A from spheroidalEigenvalue of both builds on N random real-c
//    problems (every s, l ≤ 12, all m, |c| ≤ 30, warm-cache order and again
//    with continuation off), and Γ of both builds on the greybody workload
//    below: compared bit for bit (Object.is).
// 2. Speed: N random Kerr modes (s ∈ {0, 1/2, 1, 2}, l ≤ 6, all m,
//    0.01 ≤ Mω ≤ 3 log-uniform, a uniform in [0, 0.9999]), Γ alone
//    (reflection: false) at tol 1e-8, CPU time per solve (process.cpuUsage),
//    both builds interleaved in blocks of 25 (order alternating), a warm-up
//    pass and three measured passes;
//    and the eigenvalue alone on the same sequence of (s, l, m, c) with the
//    same cache history, so its share of a solve is eigenvalue / greybody.
// Run: npx tsc -b && node bench/angular-cost.bench.mjs [N]
import os from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { writeFileSync } from 'node:fs';
import { benchDir, median, seededRandom } from './lib.mjs';

const N = Number(process.argv[2] ?? 1000);
const BASE = process.env.BASE ?? '/tmp/angular-base';
const load = async (root) => ({
  flux: await import(pathToFileURL(join(root, 'packages/flux/dist/index.js')).href),
  spheroidal: await import(pathToFileURL(join(root, 'packages/spheroidal/dist/index.js')).href),
});
const builds = { base: await load(BASE), new: await load(join(benchDir, '..')) };

const rand = seededRandom(41);
const spins = [0, 0.5, 1, 2];
const modes = [];
for (let i = 0; i < N; i++) {
  const spin = spins[Math.floor(rand() * 4)];
  const l = spin + Math.floor(rand() * (6 - Math.ceil(spin) + 1));
  const m = -l + Math.floor(rand() * (2 * l + 1));
  const omega = 0.01 * 300 ** rand();
  const a = 0.9999 * rand();
  modes.push({ hole: { a }, mode: { field: { spin }, l, m }, omega });
}
const weights = [-2, -1, -0.5, 0, 0.5, 1, 2];
const problems = [];
for (let i = 0; i < 4 * N; i++) {
  const s = weights[Math.floor(rand() * 7)];
  const l = Math.abs(s) + Math.floor(rand() * 12);
  const m = -l + Math.floor(rand() * (2 * l + 1));
  const c = (rand() < 0.5 ? -1 : 1) * 30 * rand() ** 2;
  problems.push({ s, l, m, c });
}

// 1. identity
let eigenSame = 0;
let eigenWorst = 0;
for (const options of [undefined, { continuation: false }]) {
  for (const b of Object.values(builds)) b.spheroidal.clearSpheroidalCache();
  for (const p of problems) {
    const u = builds.base.spheroidal.spheroidalEigenvalue(p, options);
    const v = builds.new.spheroidal.spheroidalEigenvalue(p, options);
    // A and everything derived from the settled eigenpair; the work counters (steps, rhsEvaluations) may differ
    const same = ['errorEstimate', 'residual', 'truncation'].every((k) => Object.is(u.diagnostics[k], v.diagnostics[k]));
    if (same && Object.is(u.A, v.A) && Object.is(u.E, v.E)) eigenSame++;
    else eigenWorst = Math.max(eigenWorst, Math.abs(u.A - v.A) / Math.max(1, Math.abs(u.A)));
  }
}
let gammaSame = 0;
let gammaFailed = 0;
for (const b of Object.values(builds)) b.spheroidal.clearSpheroidalCache();
for (const p of modes) {
  const x = builds.base.flux.tryGreybody(p, { reflection: false });
  const y = builds.new.flux.tryGreybody(p, { reflection: false });
  if (x.status !== 'success' || y.status !== 'success') {
    gammaFailed++;
    if (x.status === y.status) gammaSame++;
  } else if (Object.is(x.solution.gamma, y.solution.gamma) && Object.is(x.solution.relError, y.solution.relError)) gammaSame++;
}
console.log(
  `identity: A, E, errorEstimate, residual and truncation bit-identical in ${eigenSame} of ${2 * problems.length} problems (worst relative difference otherwise ${eigenWorst})`,
);
console.log(
  `identity: Γ and its error estimate bit-identical in ${gammaSame} of ${modes.length} modes (${gammaFailed} not solved)`,
);

// 2. speed, interleaved blocks: each build keeps its own caches across the pass
// (as in one process solving a list of modes), cleared at the start of each pass
// so that the greybody pass and the eigenvalue-only pass see the same history.
const cpu = (fn) => {
  const t0 = process.cpuUsage();
  fn();
  const t = process.cpuUsage(t0);
  return (t.user + t.system) / 1000;
};
const BLOCK = 25;
const ROUNDS = 4;
const perSolve = { base: [], new: [] };
const perEigen = { base: [], new: [] };
const pass = (store, run) => {
  for (const b of Object.values(builds)) b.spheroidal.clearSpheroidalCache();
  for (let start = 0; start < modes.length; start += BLOCK) {
    const block = modes.slice(start, start + BLOCK);
    const order = (start / BLOCK) % 2 ? ['base', 'new'] : ['new', 'base'];
    for (const name of order) store[name].push(cpu(() => run(builds[name], block)) / block.length);
  }
};
for (let round = 0; round < ROUNDS; round++) {
  // round 0 compiles the code of both builds; its figures are dropped
  const solve = { base: [], new: [] };
  const eigen = { base: [], new: [] };
  pass(solve, ({ flux }, block) => {
    for (const p of block) flux.tryGreybody(p, { reflection: false });
  });
  pass(eigen, ({ spheroidal }, block) => {
    for (const p of block)
      spheroidal.spheroidalEigenvalue({ s: p.mode.field.spin, l: p.mode.l, m: p.mode.m, c: p.hole.a * p.omega });
  });
  if (round === 0) continue;
  for (const name of ['base', 'new']) {
    perSolve[name].push(...solve[name]);
    perEigen[name].push(...eigen[name]);
  }
}
const summary = {};
for (const name of ['base', 'new']) {
  const solve = median(perSolve[name]);
  const eigen = median(perEigen[name]);
  const mean = (v) => v.reduce((x, y) => x + y, 0) / v.length;
  summary[name] = {
    msPerSolve: solve,
    msPerEigenvalue: eigen,
    eigenvalueShare: eigen / solve,
    meanMsPerSolve: mean(perSolve[name]),
    meanMsPerEigenvalue: mean(perEigen[name]),
  };
  console.log(
    `${name}: ${(1000 * solve).toFixed(1)} µs CPU per greybody solve (median of ${perSolve[name].length} blocks of ${BLOCK}, ${ROUNDS - 1} passes after a warm-up pass), eigenvalue ${(1000 * eigen).toFixed(1)} µs = ${((100 * eigen) / solve).toFixed(1)} % of a solve`,
  );
}
console.log(
  `mean over all blocks (outliers included): solve ${(1000 * summary.base.meanMsPerSolve).toFixed(1)} → ${(1000 * summary.new.meanMsPerSolve).toFixed(1)} µs, eigenvalue ${(1000 * summary.base.meanMsPerEigenvalue).toFixed(1)} → ${(1000 * summary.new.meanMsPerEigenvalue).toFixed(1)} µs`,
);
const ratios = perSolve.base.map((b, i) => perSolve.new[i] / b);
const eigenRatios = perEigen.base.map((b, i) => perEigen.new[i] / b);
console.log(`new/base per block (median): solve ${median(ratios).toFixed(3)}, eigenvalue ${median(eigenRatios).toFixed(3)}`);
const out = {
  date: new Date().toISOString(),
  machine: `${os.cpus()[0]?.model} ×${os.cpus().length}, load ${os.loadavg()[0].toFixed(1)}, node ${process.version}`,
  base: BASE,
  workload: `${N} random Kerr modes, s ∈ {0, 1/2, 1, 2}, l ≤ 6, 0.01 ≤ Mω ≤ 3, 0 ≤ a ≤ 0.9999, reflection false, tol 1e-8`,
  identity: {
    eigenvalueProblems: 2 * problems.length,
    eigenvalueBitIdentical: eigenSame,
    eigenWorst,
    modes: modes.length,
    gammaBitIdentical: gammaSame,
    notSolved: gammaFailed,
  },
  summary,
  medianRatioNewOverBase: { solve: median(ratios), eigenvalue: median(eigenRatios) },
};
writeFileSync(join(benchDir, 'results/angular-cost-2026-12-03.json'), `${JSON.stringify(out, null, 2)}\n`);
