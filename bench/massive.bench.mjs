// Cost of a massive-scalar greybody factor against the massless one of the
// same l, m, a and ω (the target: at most twice), at the default tol 1e-8,
// for field masses from Mμ = 0.1 Mω up to near threshold (v = k∞/ω down to
// 0.05), plus the accuracy against the 30-digit mpmath reference in
// test/fixtures/massive. Run: `npm run build && node bench/massive.bench.mjs`.
// Results: bench/results/massive-<date><tag>.json (tag: the first argument,
// default 'c', the third measurement of 2026-12-03).
import { readFileSync, writeFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { benchDir, fmt, interleavedCpuMs, median, relDiff, table, today } from './lib.mjs';

const MODES = [
  { a: 0, l: 0, m: 0, omega: 0.3 },
  { a: 0, l: 2, m: 0, omega: 0.8 },
  { a: 0.9, l: 1, m: 1, omega: 0.4 },
  { a: 0.7, l: 2, m: -1, omega: 1.2 },
  { a: 0.99, l: 3, m: 3, omega: 2 },
];
// field mass as a fraction of ω; v = k∞/ω = √(1 − f²)
const FRACTIONS = [0.1, 0.5, 0.75, 0.9, 0.99, 0.9987];

const problem = (x, mass) => ({
  hole: { a: x.a },
  mode: { field: mass > 0 ? { spin: 0, mass } : { spin: 0 }, l: x.l, m: x.m },
  omega: x.omega,
});

/** Median over seven interleaved batches of CPU ms per call, the order rotated (load spikes and the garbage one leaves to the next excluded), massive and massless. */
const pairCost = (massive, massless) => interleavedCpuMs([massive, massless], 40, 100000, { rotate: true, batches: 7 });

// warm-up: every code path compiled before the first timing (the first row measured the compiler otherwise)
for (let pass = 0; pass < 3; pass++)
  for (const x of MODES) {
    greybody(problem(x, 0));
    for (const f of FRACTIONS) greybody(problem(x, f * x.omega));
  }

const rows = [];
const records = [];
for (const x of MODES) {
  const massless = greybody(problem(x, 0));
  for (const f of FRACTIONS) {
    const mass = f * x.omega;
    const g = greybody(problem(x, mass));
    const [ms, msMassless] = pairCost(
      () => greybody(problem(x, mass)),
      () => greybody(problem(x, 0)),
    );
    const record = {
      ...x,
      fieldMass: mass,
      v: Math.sqrt(1 - f * f),
      gamma: g.gamma,
      relError: g.relError,
      residual: g.residual,
      timeRatio: ms / msMassless,
      rhsRatio: g.diagnostics.rhsEvaluations / massless.diagnostics.rhsEvaluations,
      msMassive: ms,
      msMassless,
      matchRadius: g.diagnostics.matchRadius,
      farTerms: g.diagnostics.farTerms,
      steps: g.diagnostics.steps,
      stepsMassless: massless.diagnostics.steps,
    };
    records.push(record);
    rows.push([
      `a=${x.a} l=${x.l} m=${x.m} Mω=${x.omega}`,
      fmt(mass, 3),
      fmt(record.v, 2),
      fmt(ms, 2),
      fmt(msMassless, 2),
      fmt(record.timeRatio, 2),
      fmt(record.rhsRatio, 2),
      fmt(g.diagnostics.matchRadius, 2),
    ]);
  }
}
console.log('massive / massless cost at the same l, m, a, ω (tol 1e-8; CPU ms per greybody call)');
console.log(table(['mode', 'Mμ', 'v', 'ms massive', 'ms massless', 'time ratio', 'RHS ratio', 'r_match'], rows));
const ratios = records.map((r) => r.timeRatio);
const within = records.filter((r) => r.v >= 0.1);
const rhs = records.map((r) => r.rhsRatio);
console.log(
  `time ratio: median ${fmt(median(ratios), 2)}, max ${fmt(Math.max(...ratios), 2)}; for v ≥ 0.1 max ${fmt(Math.max(...within.map((r) => r.timeRatio)), 2)} (target ≤ 2)`,
);
console.log(`RHS ratio: median ${fmt(median(rhs), 2)}, max ${fmt(Math.max(...rhs), 2)}`);

const reference = JSON.parse(readFileSync(new URL('../test/fixtures/massive/reference.json', import.meta.url), 'utf8')).rows;
const accuracy = reference.map((r) => {
  const g = greybody({ hole: { a: r.a }, mode: { field: { spin: 0, mass: r.fieldMass }, l: r.l, m: r.m }, omega: r.omega });
  return { ...r, error: relDiff(g.gamma, Number(r.gamma_str)), relError: g.relError };
});
console.log('\naccuracy against the 30-digit mpmath reference (test/fixtures/massive)');
console.log(
  table(
    ['a', 'l', 'm', 'Mω', 'Mμ', 'Γ', 'actual rel. error', 'estimate', 'actual/estimate'],
    accuracy.map((r) => [
      r.a,
      r.l,
      r.m,
      r.omega,
      r.fieldMass,
      fmt(r.gamma, 6),
      fmt(r.error, 2),
      fmt(r.relError, 2),
      fmt(r.error / r.relError, 2),
    ]),
  ),
);
// later measurements of the day are tagged ('b', 'c', …) so the earlier ones stay for comparison
const path = `${benchDir}/results/massive-${today()}${process.argv[2] ?? 'c'}.json`;
writeFileSync(path, `${JSON.stringify({ records, accuracy }, null, 1)}\n`);
console.log(`written ${path}`);
