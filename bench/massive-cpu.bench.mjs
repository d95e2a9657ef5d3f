// CPU cost of a massive-scalar greybody factor against the massless one of
// the same l, m, a and ω (the target: at most twice), for this build and a
// baseline build, all four interleaved in one process: the modes of
// bench/massive.bench.mjs (30) and the 40 random near-threshold modes of
// bench/massive-threshold.bench.mjs (v = k∞/ω ∈ [0.02, 0.5]), tol 1e-8.
// Each function's figure is the median of BATCHES batches of CPU time per
// call (cpuMsPerCall), the order rotated from batch to batch, after every
// function has run every mode three times (JIT warm-up); the least of the
// batches is recorded too (load on a shared machine only adds to it).
// Run: `npx tsc -b && node bench/massive-cpu.bench.mjs [baseline root] [tag]`
// (baseline default /tmp/base-main, a built checkout). Results:
// bench/results/massive-cpu-<date><tag>.json.
import { writeFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { benchDir, cpuMsPerCall, fmt, median, seededMulberry, table, today } from './lib.mjs';

const baseRoot = process.argv[2] ?? '/tmp/base-main';
const tag = process.argv[3] ?? '';
const { greybody: baseGreybody } = await import(`${baseRoot}/packages/flux/dist/index.js`);
const BATCHES = 9;
const MIN_CPU_MS = 15;

const problem = (x, mass) => ({
  hole: { a: x.a },
  mode: { field: mass > 0 ? { spin: 0, mass } : { spin: 0 }, l: x.l, m: x.m },
  omega: x.omega,
});

// the modes of massive.bench.mjs: field mass a fraction f of ω, v = √(1 − f²)
const modes = [];
for (const x of [
  { a: 0, l: 0, m: 0, omega: 0.3 },
  { a: 0, l: 2, m: 0, omega: 0.8 },
  { a: 0.9, l: 1, m: 1, omega: 0.4 },
  { a: 0.7, l: 2, m: -1, omega: 1.2 },
  { a: 0.99, l: 3, m: 3, omega: 2 },
])
  for (const f of [0.1, 0.5, 0.75, 0.9, 0.99, 0.9987])
    modes.push({ set: 'massive', ...x, mass: f * x.omega, v: Math.sqrt(1 - f * f) });
// the modes of massive-threshold.bench.mjs (the same generator and draws)
const random = seededMulberry(20261203);
for (let i = 0; i < 40; i++) {
  const l = Math.floor(random() * 5);
  const m = -l + Math.floor(random() * (2 * l + 1));
  const x = { a: 0.99 * random(), l, m, omega: 0.05 * 40 ** random() };
  const v = 0.02 * 25 ** random();
  modes.push({ set: 'threshold', ...x, mass: x.omega * Math.sqrt(1 - v * v), v });
}

const fnsOf = (x) => [
  () => greybody(problem(x, x.mass)),
  () => greybody(problem(x, 0)),
  () => baseGreybody(problem(x, x.mass)),
  () => baseGreybody(problem(x, 0)),
];
for (let pass = 0; pass < 3; pass++) for (const x of modes) for (const f of fnsOf(x)) f();

const records = [];
for (const x of modes) {
  const fns = fnsOf(x);
  for (const f of fns) f();
  const times = fns.map(() => []);
  for (let b = 0; b < BATCHES; b++)
    for (let k = 0; k < fns.length; k++) {
      const j = (b + k) % fns.length;
      times[j].push(cpuMsPerCall(fns[j], MIN_CPU_MS, 100000));
    }
  const [ms, ms0, base, base0] = times.map(median);
  const [least, least0, leastBase, leastBase0] = times.map((t) => Math.min(...t));
  const g = greybody(problem(x, x.mass));
  const g0 = greybody(problem(x, 0));
  records.push({
    ...x,
    ratio: ms / ms0,
    baseRatio: base / base0,
    speedup: base / ms,
    masslessDrift: ms0 / base0,
    msMassive: ms,
    msMassless: ms0,
    msBaseMassive: base,
    msBaseMassless: base0,
    leastRatio: least / least0,
    leastBaseRatio: leastBase / leastBase0,
    rhsRatio: g.diagnostics.rhsEvaluations / g0.diagnostics.rhsEvaluations,
    relError: g.relError,
  });
}

const label = (r) => `${r.set === 'massive' ? 'M' : 'T'} a=${fmt(r.a, 2)} l=${r.l} m=${r.m} Mω=${fmt(r.omega, 3)}`;
console.log(`massive / massless CPU per greybody call at the same l, m, a, ω (tol 1e-8), this build against ${baseRoot}`);
console.log(
  table(
    [
      'mode',
      'v',
      'µs massive',
      'µs massless',
      'ratio',
      'ratio base',
      'least: ratio',
      'ratio base',
      'base/this massive',
      'massless this/base',
      'RHS ratio',
    ],
    records.map((r) => [
      label(r),
      fmt(r.v, 2),
      fmt(1e3 * r.msMassive, 3),
      fmt(1e3 * r.msMassless, 3),
      fmt(r.ratio, 2),
      fmt(r.baseRatio, 2),
      fmt(r.leastRatio, 2),
      fmt(r.leastBaseRatio, 2),
      fmt(r.speedup, 2),
      fmt(r.masslessDrift, 2),
      fmt(r.rhsRatio, 2),
    ]),
  ),
);
for (const set of ['massive', 'threshold', 'all']) {
  const rs = records.filter((r) => set === 'all' || r.set === set);
  const line = (key) => `median ${fmt(median(rs.map((r) => r[key])), 2)}, max ${fmt(Math.max(...rs.map((r) => r[key])), 2)}`;
  console.log(
    `${set} (${rs.length} modes): ratio this build ${line('ratio')}; baseline ${line('baseRatio')}; least of the batches: this build ${line('leastRatio')}, baseline ${line('leastBaseRatio')}; massless this/base ${line('masslessDrift')}`,
  );
}
console.log(
  `above 2: this build ${records.filter((r) => r.ratio > 2).length} (least of the batches ${records.filter((r) => r.leastRatio > 2).length}), baseline ${records.filter((r) => r.baseRatio > 2).length} (${records.filter((r) => r.leastBaseRatio > 2).length}) of ${records.length}`,
);
const over = records.filter((r) => r.ratio > 2);
console.log(
  `rows above 2 (this build): ${over.length}${over.map((r) => `\n  ${label(r)} v=${fmt(r.v, 2)}: ${fmt(r.ratio, 2)} (baseline ${fmt(r.baseRatio, 2)})`).join('')}`,
);
const overBase = records.filter((r) => r.baseRatio > 2);
console.log(
  `rows above 2 (baseline): ${overBase.length}${overBase.map((r) => `\n  ${label(r)} v=${fmt(r.v, 2)}: ${fmt(r.baseRatio, 2)} (this build ${fmt(r.ratio, 2)})`).join('')}`,
);
const path = `${benchDir}/results/massive-cpu-${today()}${tag}.json`;
writeFileSync(path, `${JSON.stringify({ baseline: baseRoot, batches: BATCHES, minCpuMs: MIN_CPU_MS, records }, null, 1)}\n`);
console.log(`written ${path}`);
