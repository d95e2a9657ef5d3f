// Cost of a massive Dirac mode against a massless s = 1/2 mode of the same
// j, m, a and ω, at the default tolerance 1e-8 (docs/massive-dirac.md; the
// target: at most twice). Both signs of κ are timed; the ratio is CPU time
// massive/massless (process CPU time, immune to preemption on a shared
// machine). Also prints the number of right-hand-side evaluations of each,
// the stated error against tol-1e-12 solves and the accuracy against the
// 30-digit mpmath reference (test/fixtures/massive-dirac), as true error / relError.
//
// Timing: warm-up passes over every mode first (4 s of CPU, so that no row
// pays for the compilation of code the later rows share), then per mode
// ROUNDS rounds, each timing every function once (cpuMs, BATCH_MS of
// CPU), the order rotated from round to round, half of them in a first sweep
// over the modes and the rest in a second. A row's times are the least
// over the rounds (load and collections only ever add CPU time), its ratio
// the ratio of those; the median over the rounds of massive/massless within
// one round is recorded beside it (pairedRatio).
// The near-threshold rows (Mω = 2.5, v = k∞/ω = 0.05, where the far series
// converges only at ~1e4 M) are summarised apart.
//
// Run after `npm run build`:
//   node bench/massive-dirac.bench.mjs [--baseline DIR] [--worst] [--cold] [--rounds N] [--name NAME]
// --baseline DIR: also times DIR's build (e.g. /tmp/base-main, its own massless
//   and massive solves) in the same rounds, and prints its ratios beside ours.
// --cold: no call repeats the problem of the one before (see `varied`).
// --worst: only the modes that were at or above 2 in the last recorded runs, more rounds.
// Results: bench/results/<NAME, default massive-dirac>-<date>.json.
import { readFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { fmt, median, table, writeResult } from './lib.mjs';

const args = process.argv.slice(2);
const option = (name) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : undefined;
};
const worstOnly = args.includes('--worst');
const ROUNDS = Number(option('--rounds') ?? (worstOnly ? 16 : 8));
const BATCH_MS = 10;
const baselineDir = option('--baseline');
const baseline = baselineDir ? await import(`${baselineDir}/packages/flux/dist/index.js`) : undefined;

const NEAR_MU = 2.5 * Math.sqrt(1 - 0.05 ** 2);
let CASES = [];
for (const a of [0, 0.7, 0.99]) {
  for (const [l, m] of [
    [0.5, 0.5],
    [1.5, -0.5],
    [2.5, 2.5],
  ]) {
    for (const [omega, mu] of [
      [0.3, 0.1],
      [0.8, 0.4],
      [0.0505, 0.05],
    ]) {
      CASES.push({ a, l, m, omega, mu, near: false });
    }
    CASES.push({ a, l, m, omega: 2.5, mu: NEAR_MU, near: true });
  }
}
if (worstOnly) {
  // at or above 2 in bench/results/massive-dirac-2026-12-04.json or in the first runs of 2026-12-05
  const worst = [
    [0, 0.5, 2.5],
    [0.7, 0.5, 2.5],
    [0, 2.5, 0.8],
    [0.7, 0.5, 0.3],
    [0.99, 2.5, 0.3],
    [0, 2.5, 2.5],
    [0.7, 2.5, 0.8],
  ];
  CASES = CASES.filter((c) => worst.some(([a, l, omega]) => c.a === a && c.l === l && c.omega === omega));
}

const masslessProblem = (c) => ({ hole: { a: c.a }, mode: { field: { spin: 0.5 }, l: c.l, m: c.m }, omega: c.omega });
const massiveProblem = (c, kappaSign) => ({
  hole: { a: c.a },
  mode: { field: { spin: 0.5, mass: c.mu }, l: c.l, m: c.m, kappaSign },
  omega: c.omega,
});

/**
 * With --cold, every call moves ω by a few parts in 1e7 (a cycle of 97), so
 * that no solve repeats the one before it: what a sum over frequencies pays
 * (the spin-weighted eigenvalue then warm-starts, λ and the far series are
 * solved afresh); without, each call repeats the same problem.
 */
const cold = args.includes('--cold');
function varied(problem) {
  if (!cold) return () => problem;
  let i = 0;
  return () => ({ ...problem, omega: problem.omega * (1 + 3e-7 * (i++ % 97)) });
}

/** The functions timed for one mode: [massless, κ+, κ−] of this build, then the same of the baseline. */
function functions(c) {
  const builds = baseline ? [greybody, baseline.greybody] : [greybody];
  return builds.flatMap((g) => {
    const [p0, p1, p2] = [masslessProblem(c), massiveProblem(c, 1), massiveProblem(c, -1)].map(varied);
    return [() => g(p0()), () => g(p1()), () => g(p2())];
  });
}

// Warm-up: passes over every function of every mode for WARMUP_MS of CPU (measured: the optimising compiler
// and the first collections settle only after ~1 s of calls; with a few passes the first rows' solves cost 5× more).
const WARMUP_MS = Number(option('--warmup') ?? 4000);
{
  const all = CASES.flatMap(functions);
  const t0 = process.cpuUsage();
  let used = 0;
  while (used < WARMUP_MS) {
    for (const f of all) f();
    const d = process.cpuUsage(t0);
    used = (d.user + d.system) / 1e3;
  }
}

/**
 * CPU ms per call of fn over at least minMs: calls in chunks of 8 between
 * readings of the CPU clock (reading it after every call was measured at a
 * few per cent of a 50 µs solve).
 */
function cpuMs(fn, minMs) {
  const start = process.cpuUsage();
  let calls = 0;
  let used = 0;
  do {
    for (let i = 0; i < 8; i++) fn();
    calls += 8;
    const d = process.cpuUsage(start);
    used = (d.user + d.system) / 1e3;
  } while (used < minMs);
  return used / calls;
}

/**
 * Appends to t[j] the CPU ms per call of fns[j] in each of `count` rounds
 * (order rotated from round to round, starting at round `first`).
 */
function rounds(fns, t, first, count) {
  // a discarded batch of each first (measured: without it the first mode timed after the warm-up still cost up to 1.6× more)
  for (const f of fns) cpuMs(f, BATCH_MS);
  for (let i = first; i < first + count; i++) {
    for (let k = 0; k < fns.length; k++) {
      const j = (i + k) % fns.length;
      t[j].push(cpuMs(fns[j], BATCH_MS));
    }
  }
}
// The rounds of every mode in two sweeps over the list, so that a disturbance of a few seconds (the compiler
// still busy with the first modes, a burst of load) reaches only part of any row's rounds.
const times = CASES.map((c) => functions(c).map(() => []));
const firstSweep = Math.ceil(ROUNDS / 2);
for (const [first, count] of [
  [0, firstSweep],
  [firstSweep, ROUNDS - firstSweep],
]) {
  CASES.forEach((c, i) => {
    rounds(functions(c), times[i], first, count);
  });
}
/** Median over the rounds of the ratio of two functions' times in the same round. */
const pairedRatio = (num, den) => median(num.map((x, i) => x / den[i]));
/** Ratio of the least times over the rounds. */
const bestRatio = (num, den) => Math.min(...num) / Math.min(...den);

const rows = [];
const records = [];
for (const [caseIndex, c] of CASES.entries()) {
  const nMassless = greybody(masslessProblem(c)).diagnostics.rhsEvaluations;
  const t = times[caseIndex];
  for (const [kappaSign, index] of [
    [1, 1],
    [-1, 2],
  ]) {
    const g = greybody(massiveProblem(c, kappaSign));
    const nMassive = g.diagnostics.rhsEvaluations;
    // the stated error against a tol-1e-12 solve
    const tight = greybody(massiveProblem(c, kappaSign), { tol: 1e-12 });
    const trueError = Math.abs(g.gamma / tight.gamma - 1);
    const ratio = bestRatio(t[index], t[0]);
    const record = {
      ...c,
      kappaSign,
      msMassless: Math.min(...t[0]),
      msMassive: Math.min(...t[index]),
      ratio,
      pairedRatio: pairedRatio(t[index], t[0]),
      ratioSpread: [Math.min(...t[index].map((x, i) => x / t[0][i])), Math.max(...t[index].map((x, i) => x / t[0][i]))],
      nMassless,
      nMassive,
      gamma: g.gamma,
      relError: g.relError,
      errorVsTight: trueError,
    };
    if (baseline) {
      record.msMasslessBaseline = Math.min(...t[3]);
      record.msMassiveBaseline = Math.min(...t[index + 3]);
      record.ratioBaseline = bestRatio(t[index + 3], t[3]);
      record.speedup = bestRatio(t[index + 3], t[index]);
      const b = baseline.greybody(massiveProblem(c, kappaSign));
      record.gammaBaseline = b.gamma;
      record.relErrorBaseline = b.relError;
    }
    records.push(record);
    rows.push([
      c.a,
      c.l,
      c.m,
      c.omega,
      fmt(c.mu, 4),
      kappaSign,
      fmt(record.msMassless),
      fmt(record.msMassive),
      fmt(ratio),
      fmt(record.pairedRatio),
      ...(baseline ? [fmt(record.ratioBaseline), fmt(record.speedup)] : []),
      nMassless,
      nMassive,
    ]);
  }
}
console.log(
  `${cold ? 'cold (ω moved by parts in 1e7 from call to call); ' : ''}${ROUNDS} rounds of ${BATCH_MS} ms CPU per function and mode after ${WARMUP_MS} ms of warm-up; times: least over the rounds; ratio = massive/massless of those; paired median = median over the rounds of massive/massless in one round${baseline ? `; baseline ${baselineDir}` : ''}`,
);
console.log(
  table(
    [
      'a',
      'j',
      'm',
      'Mω',
      'Mμ',
      'κ sign',
      'massless ms',
      'massive ms',
      'ratio',
      'paired median',
      ...(baseline ? ['baseline ratio', 'speed-up'] : []),
      'rhs massless',
      'rhs massive',
    ],
    rows,
  ),
);
function summary(label, rs) {
  if (rs.length === 0) return;
  const stats = (xs) => {
    const v = [...xs].sort((x, y) => x - y);
    return `median ${fmt(median(v))}, max ${fmt(v.at(-1))}, min ${fmt(v[0])}`;
  };
  const over = rs.filter((r) => r.ratio > 2).length;
  let line = `${label}, ${rs.length} modes: massive/massless CPU time ${stats(rs.map((r) => r.ratio))}; ${over} above 2`;
  if (baseline) {
    const overBase = rs.filter((r) => r.ratioBaseline > 2).length;
    line += `; baseline ${stats(rs.map((r) => r.ratioBaseline))}, ${overBase} above 2; speed-up over baseline ${stats(rs.map((r) => r.speedup))}`;
  }
  const evals = rs.map((r) => r.nMassive / r.nMassless);
  line += `; right-hand-side evaluations massive/massless median ${fmt(median(evals))}, max ${fmt(Math.max(...evals))}`;
  console.log(line);
}
summary('all', records);
summary(
  'Mω ≤ 0.8',
  records.filter((r) => !r.near),
);
summary(
  'near threshold, Mω = 2.5, v = 0.05',
  records.filter((r) => r.near),
);
{
  const worst = Math.max(...records.map((r) => r.errorVsTight / r.relError));
  console.log(
    `stated error against tol-1e-12 solves: largest |Γ/Γ_tight − 1| / relError ${fmt(worst)}${worst > 1 ? ' (ABOVE 1: an estimate below the true error)' : ''}`,
  );
}
if (baseline) {
  const moved = Math.max(
    ...records.map((r) => Math.abs(r.gamma / r.gammaBaseline - 1) / Math.max(r.relError, r.relErrorBaseline)),
  );
  console.log(`Γ against the baseline: largest |Γ/Γ_baseline − 1| / max(relError) ${fmt(moved)}`);
}

const fixture = JSON.parse(readFileSync(new URL('../test/fixtures/massive-dirac/massive-dirac.json', import.meta.url), 'utf8'));
const accuracy = [];
for (const r of fixture.values) {
  const p = {
    hole: { a: Number(r.a) },
    mode: {
      field: { spin: 0.5, mass: Number(r.fieldMass ?? r.mu) },
      l: Number(r.j ?? r.l),
      m: Number(r.m),
      kappaSign: Number(r.kappaSign),
    },
    omega: Number(r.omega),
  };
  const reference = Number(r.gamma_str ?? r.gamma);
  const g = greybody(p);
  const error = Math.abs(g.gamma / reference - 1);
  accuracy.push({ ...p, reference, error, relError: g.relError, ratio: error / g.relError });
}
console.log(
  `accuracy against the 30-digit reference (test/fixtures/massive-dirac, ${accuracy.length} rows, tol 1e-8): largest true error ${fmt(Math.max(...accuracy.map((a) => a.error)))}, largest true error / relError ${fmt(Math.max(...accuracy.map((a) => a.ratio)))}`,
);
const name = option('--name') ?? `massive-dirac${worstOnly ? '-worst' : ''}${cold ? '-cold' : ''}`;
console.log(
  `written ${writeResult(name, { cold, rounds: ROUNDS, batchMs: BATCH_MS, baseline: baselineDir ?? null, records, accuracy })}`,
);
