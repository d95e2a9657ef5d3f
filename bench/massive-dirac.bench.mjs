// Cost of a massive Dirac mode against a massless s = 1/2 mode of the same
// j, m, a and ω, at the default tolerance 1e-8 (docs/massive-dirac.md). Both
// signs of κ are timed; the ratio is CPU time massive/massless (process CPU
// time, immune to preemption on a shared machine). Also prints the number of
// right-hand-side evaluations of each, and the accuracy against the 30-digit
// mpmath reference (test/fixtures/massive-dirac) as true error / relError.
// Massless and massive are timed in interleaved batches (median of three).
// The near-threshold rows (Mω = 2.5, v = k∞/ω = 0.05, where the far series
// converges only at ~1e4 M) are summarised apart.
// Run after `npm run build`:
//   node bench/massive-dirac.bench.mjs
// Results: bench/results/massive-dirac-<date>.json.
import { readFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { fmt, interleavedCpuMs, median, table, writeResult } from './lib.mjs';

/** Median over three interleaved batches of CPU ms per call, each batch starting with a different function. */
const cost = (fns) => interleavedCpuMs(fns, 40, 2000, { rotate: true });

const CASES = [];
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
    CASES.push({ a, l, m, omega: 2.5, mu: 2.5 * Math.sqrt(1 - 0.05 ** 2), near: true });
  }
}

const rows = [];
const records = [];
for (const c of CASES) {
  const massless = { hole: { a: c.a }, mode: { field: { spin: 0.5 }, l: c.l, m: c.m }, omega: c.omega };
  const nMassless = greybody(massless).diagnostics.rhsEvaluations;
  const massive = (kappaSign) => ({
    hole: { a: c.a },
    mode: { field: { spin: 0.5, mass: c.mu }, l: c.l, m: c.m, kappaSign },
    omega: c.omega,
  });
  const [tMassless, tPlus, tMinus] = cost([() => greybody(massless), () => greybody(massive(1)), () => greybody(massive(-1))]);
  for (const [kappaSign, tMassive] of [
    [1, tPlus],
    [-1, tMinus],
  ]) {
    const g = greybody(massive(kappaSign));
    const nMassive = g.diagnostics.rhsEvaluations;
    records.push({
      ...c,
      kappaSign,
      msMassless: tMassless,
      msMassive: tMassive,
      ratio: tMassive / tMassless,
      nMassless,
      nMassive,
      gamma: g.gamma,
      relError: g.relError,
    });
    rows.push([
      c.a,
      c.l,
      c.m,
      c.omega,
      fmt(c.mu, 4),
      kappaSign,
      fmt(tMassless),
      fmt(tMassive),
      fmt(tMassive / tMassless),
      nMassless,
      nMassive,
    ]);
  }
}
console.log(
  table(['a', 'j', 'm', 'Mω', 'Mμ', 'κ sign', 'massless ms', 'massive ms', 'ratio', 'rhs massless', 'rhs massive'], rows),
);
function summary(label, rs) {
  const time = rs.map((r) => r.ratio).sort((x, y) => x - y);
  const evals = rs.map((r) => r.nMassive / r.nMassless).sort((x, y) => x - y);
  console.log(
    `${label}, ${rs.length} modes: massive/massless CPU time median ${fmt(median(time))}, max ${fmt(time.at(-1))}, min ${fmt(time[0])}; right-hand-side evaluations median ${fmt(median(evals))}, max ${fmt(evals.at(-1))}`,
  );
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
console.log(`written ${writeResult('massive-dirac', { records, accuracy })}`);
