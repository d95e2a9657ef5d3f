// Cost of a Proca (massive vector, a = 0) greybody factor against the massless
// s = 1 one of the same l, m, a = 0 and ω (the target: at most twice), at tol
// 1e-8 with its error estimate, for Mμ from 0.1 Mω up to near threshold
// (v = k∞/ω down to 0.05), for the new extrapolation integrator and the earlier
// Cash–Karp route; then the accuracy of both against the 30-digit mpmath
// reference (packages/regge-wheeler/test/fixtures/proca-reference.json) and
// against tol-1e-11 solves, as true error / relError. The monopole (l = 0) has
// no massless partner: it is timed against the massless l = 1 mode.
// Per call: one call for the polarisation (a fresh solve). Per Γ: the same,
// except that for even-1 and even-2 it is the CPU of the pair even-1 then
// even-2 of the same mode over 2 (where one integration serves both).
// CPU time, interleaved batches, best of five (PROCA_BATCHES, PROCA_BATCH_MS below). Run after `npm run build`:
//   node bench/proca-speed.bench.mjs
// With PROCA_BASELINE=<another built checkout> the "before" column is that
// checkout's default route instead of Cash–Karp (same process, interleaved),
// and PROCA_RESULT names the JSON file under bench/results.
// Results: bench/results/proca-speed-2026-12-03b.json, proca-2026-12-04-speed.json, proca-2026-12-04c-speed.txt,
// proca-2026-12-05f-speed-run1.txt, -run2.txt (defaults), -run3.txt (PROCA_BATCHES=15 PROCA_BATCH_MS=20),
// -run4.txt (PROCA_WARMUP=3).
import { readFileSync, writeFileSync } from 'node:fs';
import { greybody } from '@penumbra/flux';
import { benchDir, cpuMsPerCall, fmt, median, table } from './lib.mjs';

const MODES = [
  { l: 0, omega: 0.3, pols: ['monopole'] },
  { l: 1, omega: 0.3, pols: ['odd', 'even-1', 'even-2'] },
  { l: 2, omega: 0.8, pols: ['odd', 'even-1', 'even-2'] },
  { l: 3, omega: 1.5, pols: ['odd', 'even-1'] },
];
const FRACTIONS = [0.1, 0.5, 0.9, 0.99, 0.9987];
const TOL = 1e-8;
const baselineDir = process.env.PROCA_BASELINE;
const baseline = baselineDir ? await import(`${baselineDir}/packages/flux/dist/index.js`) : undefined;
const beforeGreybody = (problem, opts) =>
  baseline ? baseline.greybody(problem, opts) : greybody(problem, { ...opts, integrator: 'cash-karp' });

const massless = (x) => ({ hole: { a: 0 }, mode: { field: { spin: 1 }, l: Math.max(1, x.l), m: 0 }, omega: x.omega });
const massive = (x, mass) => ({ hole: { a: 0 }, mode: { field: { spin: 1, mass }, l: x.l, m: 0 }, omega: x.omega });

// PROCA_BATCHES / PROCA_BATCH_MS: more and shorter batches (the best of them is less often one a neighbour's
// load inflated: two builds doing the same work scatter 0.67–1.35 per row at the default 5 × 60 ms)
const BATCHES = Number(process.env.PROCA_BATCHES ?? 5);
const BATCH_MS = Number(process.env.PROCA_BATCH_MS ?? 60);

function cost(fns) {
  for (const f of fns) f();
  const t = fns.map(() => []);
  for (let i = 0; i < BATCHES; i++) {
    for (const [j, f] of fns.entries()) t[j].push(cpuMsPerCall(f, BATCH_MS, 400));
  }
  // best of the batches: on a shared machine load only ever adds CPU time (cache, frequency)
  return t.map((x) => Math.min(...x));
}

// PROCA_WARMUP=n: n untimed passes over every row's calls first (both builds and the massless mode), so
// that the first rows (the monopole) are not timed while the compiler is still at work on the code the
// later ones share
for (let pass = 0; pass < Number(process.env.PROCA_WARMUP ?? 0); pass++) {
  for (const x of MODES) {
    for (const f of FRACTIONS) {
      for (const polarization of x.pols) {
        greybody(massive(x, f * x.omega), { tol: TOL, polarization });
        beforeGreybody(massive(x, f * x.omega), { tol: TOL, polarization });
      }
    }
    greybody(massless(x), { tol: TOL });
  }
}

const records = [];
const rows = [];
for (const x of MODES) {
  for (const f of FRACTIONS) {
    const mass = f * x.omega;
    for (const polarization of x.pols) {
      const opts = { tol: TOL, polarization };
      // per Γ of the even sector: even-1 then even-2 of the same mode (as the emission and cross-section sums
      // ask for them), CPU of the pair over 2; one integration gives both where the checkout shares it
      const even = polarization.startsWith('even');
      const pair = (fn) => () => {
        fn(massive(x, mass), { tol: TOL, polarization: 'even-1' });
        fn(massive(x, mass), { tol: TOL, polarization: 'even-2' });
      };
      const [tNew, tOld, tMassless, tPairNew, tPairOld] = cost([
        () => greybody(massive(x, mass), opts),
        () => beforeGreybody(massive(x, mass), opts),
        () => greybody(massless(x), { tol: TOL }),
        ...(even ? [pair(greybody), pair(beforeGreybody)] : []),
      ]);
      const perGammaNew = even ? tPairNew / 2 : tNew;
      const perGammaOld = even ? tPairOld / 2 : tOld;
      const g = greybody(massive(x, mass), opts);
      const gOld = beforeGreybody(massive(x, mass), opts);
      const ref = greybody(massive(x, mass), { tol: 1e-11, polarization });
      const r = {
        l: x.l,
        omega: x.omega,
        fieldMass: mass,
        v: Math.sqrt(1 - f * f),
        polarization,
        gamma: g.gamma,
        relError: g.relError,
        errorVsTight: Math.abs(g.gamma / ref.gamma - 1),
        relErrorTight: ref.relError,
        ratioAfter: tNew / tMassless,
        ratioBefore: tOld / tMassless,
        perGammaAfter: perGammaNew / tMassless,
        perGammaBefore: perGammaOld / tMassless,
        msPairAfter: even ? tPairNew : Number.NaN,
        msPairBefore: even ? tPairOld : Number.NaN,
        msAfter: tNew,
        msBefore: tOld,
        msMassless: tMassless,
        rhsAfter: g.diagnostics.rhsEvaluations,
        rhsBefore: gOld.diagnostics.rhsEvaluations,
        beforeVsAfter: Math.abs(gOld.gamma / g.gamma - 1),
      };
      records.push(r);
      rows.push([
        x.l,
        x.omega,
        fmt(mass, 3),
        fmt(r.v, 2),
        polarization,
        fmt(tMassless, 2),
        fmt(tOld, 2),
        fmt(tNew, 2),
        fmt(r.ratioBefore, 2),
        fmt(r.ratioAfter, 2),
        fmt(r.perGammaBefore, 2),
        fmt(r.perGammaAfter, 2),
        `${r.rhsBefore}/${r.rhsAfter}`,
        fmt(r.relError, 2),
        fmt(r.errorVsTight / r.relError, 2),
      ]);
    }
  }
}
console.log(
  `Proca (a = 0) / massless s = 1 greybody, CPU ms per call at tol ${TOL} (interleaved, best of ${BATCHES} batches of ${BATCH_MS} ms)`,
);
console.log(`before: ${baselineDir ? `default route of ${baselineDir}` : 'Cash–Karp route'}; after: this checkout`);
console.log(
  'ratio: one call for this polarisation (a fresh solve) / one massless call; per Γ: the same, but for even-1 and even-2 the CPU of the pair even-1 then even-2 over 2 (one integration gives both where it is shared)',
);
console.log(
  table(
    [
      'l',
      'Mω',
      'Mμ',
      'v',
      'pol',
      'massless',
      'before',
      'after',
      'ratio before',
      'ratio after',
      'per Γ before',
      'per Γ after',
      'RHS before/after',
      'relError',
      'err vs 1e-11 / relError',
    ],
    rows,
  ),
);
const after = records.map((r) => r.ratioAfter);
const before = records.map((r) => r.ratioBefore);
const gBefore = records.map((r) => r.perGammaBefore);
const gAfter = records.map((r) => r.perGammaAfter);
console.log(
  `ratio to massless per call: before median ${fmt(median(before))}, max ${fmt(Math.max(...before))}; after median ${fmt(median(after))}, max ${fmt(Math.max(...after))} (target ≤ 2)`,
);
console.log(
  `ratio to massless per Γ: before median ${fmt(median(gBefore))}, max ${fmt(Math.max(...gBefore))}; after median ${fmt(median(gAfter))}, max ${fmt(Math.max(...gAfter))} (target ≤ 2)`,
);
for (const [name, keep] of [
  ['even sector', (r) => r.polarization.startsWith('even')],
  ['odd + monopole', (r) => !r.polarization.startsWith('even')],
  ['v ≤ 0.141', (r) => r.v < 0.15],
  ['even, v ≤ 0.141', (r) => r.polarization.startsWith('even') && r.v < 0.15],
  ['v = 0.051', (r) => r.v < 0.06],
]) {
  const kept = records.filter(keep);
  const b = kept.map((r) => r.ratioBefore);
  const a = kept.map((r) => r.ratioAfter);
  const gb = kept.map((r) => r.perGammaBefore);
  const ga = kept.map((r) => r.perGammaAfter);
  console.log(
    `  ${name} (${kept.length}): per call before median ${fmt(median(b))}, max ${fmt(Math.max(...b))}; after median ${fmt(median(a))}, max ${fmt(Math.max(...a))}; per Γ before median ${fmt(median(gb))}, max ${fmt(Math.max(...gb))}; after median ${fmt(median(ga))}, max ${fmt(Math.max(...ga))}`,
  );
}
// per (l, m) mode with every polarisation: odd + the even pair (l ≥ 1) or the monopole, against one massless
// solve (which serves both helicities of the massless vector)
const shells = [];
for (const r of records.filter((q) => q.polarization === 'odd' || q.polarization === 'monopole')) {
  const pair = records.find((q) => q.l === r.l && q.fieldMass === r.fieldMass && q.polarization === 'even-1');
  const after = r.msAfter + (pair ? pair.msPairAfter : 0);
  const before = r.msBefore + (pair ? pair.msPairBefore : 0);
  shells.push({ after: after / r.msMassless, before: before / r.msMassless });
}
console.log(
  `per (l, m) mode, every polarisation (odd + even-1 + even-2, or the monopole) / one massless solve (${shells.length}): before median ${fmt(median(shells.map((x) => x.before)))}, max ${fmt(Math.max(...shells.map((x) => x.before)))}; after median ${fmt(median(shells.map((x) => x.after)))}, max ${fmt(Math.max(...shells.map((x) => x.after)))}`,
);
console.log(
  `largest (error against tol-1e-11 solve) / relError: ${fmt(Math.max(...records.map((r) => r.errorVsTight / r.relError)))}`,
);

const fixture = JSON.parse(
  readFileSync(new URL('../packages/regge-wheeler/test/fixtures/proca-reference.json', import.meta.url), 'utf8'),
).modes;
const value = (t) => {
  const [a, b] = t.split('/').map(Number);
  return b === undefined ? a : a / b;
};
const accuracy = [];
for (const row of fixture) {
  const x = { l: row.l, omega: value(row.Momega) };
  const reference = Number(row.gamma);
  for (const tol of [1e-8, 1e-10]) {
    for (const integrator of ['gbs', 'cash-karp']) {
      const g = greybody(massive(x, value(row.Mmu)), { tol, polarization: row.polarization, integrator });
      const error = Math.abs(g.gamma / reference - 1);
      accuracy.push({ ...row, tol, integrator, error, relError: g.relError, ratio: error / g.relError });
    }
  }
}
console.log('\naccuracy against the 30-digit mpmath reference (proca-reference.json); integrator gbs = the extrapolation loop');
console.log(
  table(
    ['pol', 'l', 'Mω', 'Mμ', 'tol', 'integrator', 'true error', 'relError', 'true/relError'],
    accuracy.map((a) => [a.polarization, a.l, a.Momega, a.Mmu, a.tol, a.integrator, fmt(a.error), fmt(a.relError), fmt(a.ratio)]),
  ),
);
const worst = (name) => Math.max(...accuracy.filter((a) => a.integrator === name).map((a) => a.ratio));
console.log(`largest true error / relError: extrapolation ${fmt(worst('gbs'))}, cash-karp ${fmt(worst('cash-karp'))}`);
const path = `${benchDir}/results/${process.env.PROCA_RESULT ?? 'proca-speed-2026-12-03b.json'}`;
writeFileSync(path, `${JSON.stringify({ tol: TOL, records, accuracy }, null, 1)}\n`);
console.log(`written ${path}`);
