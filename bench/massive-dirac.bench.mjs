// Cost of a massive Dirac mode against a massless s = 1/2 mode of the same
// j, m, a and ω, at the default tolerance 1e-8 (docs/massive-dirac.md). Both
// signs of κ are timed; the ratio is CPU time massive/massless (process CPU
// time, immune to preemption on a shared machine). Also prints the number of
// right-hand-side evaluations of each. Run after `npm run build`:
//   node bench/massive-dirac.bench.mjs
import { greybody } from '@penumbra/flux';
import { cpuMsPerCall, fmt, median, table } from './lib.mjs';

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
      CASES.push({ a, l, m, omega, mu });
    }
  }
}

const rows = [];
const ratios = [];
for (const c of CASES) {
  const massless = { hole: { a: c.a }, mode: { field: { spin: 0.5 }, l: c.l, m: c.m }, omega: c.omega };
  const tMassless = cpuMsPerCall(() => greybody(massless), 50, 20);
  const nMassless = greybody(massless).diagnostics.rhsEvaluations;
  for (const kappaSign of [1, -1]) {
    const massive = { hole: { a: c.a }, mode: { field: { spin: 0.5, mass: c.mu }, l: c.l, m: c.m, kappaSign }, omega: c.omega };
    const tMassive = cpuMsPerCall(() => greybody(massive), 50, 20);
    const nMassive = greybody(massive).diagnostics.rhsEvaluations;
    ratios.push(tMassive / tMassless);
    rows.push([
      c.a,
      c.l,
      c.m,
      c.omega,
      c.mu,
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
const sorted = [...ratios].sort((x, y) => x - y);
console.log(
  `massive/massless CPU time over ${ratios.length} modes: median ${fmt(median(ratios))}, max ${fmt(sorted.at(-1))}, min ${fmt(sorted[0])}`,
);
