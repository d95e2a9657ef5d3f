// Far-zone cost: the 'riccati' oscillation route (default) against the earlier
// 'ode' route (integrator throughout), CPU time per greybody factor at the
// default tol 1e-8 (Γ, reflection and error estimate; spheroidal eigenvalue
// cached), runs of the two routes interleaved on the shared machine:
//  1. the median mode (random sample of s ∈ {0, 1/2, 1, 2}, l ≤ 6, Mω ≤ 3,
//     a ∈ {0, 0.7, 0.99}), the reference of "within 3× of the median";
//  2. cost against Mω up to 30 (l = s or 2, m = l) and against l up to 100
//     (m = l/2 rounded, Mω ∈ {1, 10, 30}) for every spin and a ∈ {0, 0.7, 0.99};
//  3. massive / massless cost at the same l, m, a and ω down to v = k∞/ω = 0.05
//     (the modes of bench/massive.bench.mjs);
//  4. near-extremal counter-rotating modes (a = 0.99999, m < 0), where the
//     near-horizon solution winds like x^(−ik/2κ);
//  5. accuracy: |Γ_riccati/Γ_ode − 1| and the reported relError at each point.
// Run: `npm run build && node bench/far-zone.bench.mjs`. Results: bench/results/far-zone-<date>.json
// (and the printed tables, saved by hand, in far-zone-<date>.txt).
import os from 'node:os';
import { greybody } from '@penumbra/flux';
import { fmt, interleavedCpuMs, maximum, median, seededMulberry, table, writeResult } from './lib.mjs';

const SPINS = [0, 0.5, 1, 2];
const AS = [0, 0.7, 0.99];
const problem = (x) => ({
  hole: { a: x.a },
  mode: { field: x.mass ? { spin: x.spin, mass: x.mass } : { spin: x.spin }, l: x.l, m: x.m },
  omega: x.omega,
});

/** CPU ms per call of each route, interleaved (three alternations, median of each). */
function costs(x, minCpuMs = 25) {
  const p = problem(x);
  const run = (oscillation) => () => greybody(p, { oscillation });
  const [ode, riccati] = interleavedCpuMs([run('ode'), run('riccati')], minCpuMs, 200);
  return { ode, riccati };
}

function point(x) {
  const a = greybody(problem(x), { oscillation: 'ode' });
  const b = greybody(problem(x));
  const c = costs(x);
  const lg = (g) => g.log10Gamma ?? Number.NaN;
  return {
    ...x,
    log10Gamma: lg(b),
    diff: Math.abs(Math.expm1((lg(b) - lg(a)) * Math.LN10)),
    relError: b.relError,
    relErrorOde: a.relError,
    rhsOde: a.diagnostics.rhsEvaluations,
    rhsRiccati: b.diagnostics.rhsEvaluations,
    msOde: c.ode,
    msRiccati: c.riccati,
  };
}

function medianSet(count) {
  const random = seededMulberry(20261203);
  const modes = [];
  while (modes.length < count) {
    const spin = SPINS[Math.floor(random() * 4)];
    const l = spin + Math.floor(random() * (7 - spin));
    const m = -l + Math.floor(random() * (2 * l + 1));
    modes.push({ spin, l, m, a: AS[Math.floor(random() * 3)], omega: 0.01 * 300 ** random() });
  }
  return modes.map(point);
}

const lowest = (spin) => (spin === 0.5 ? 0.5 : spin === 0 ? 0 : spin);

function main() {
  const started = Date.now();
  const load = () =>
    os
      .loadavg()
      .map((x) => x.toFixed(1))
      .join(' ');
  console.log(`far-zone bench, tol 1e-8; node ${process.version}; ${os.cpus().length} cpus; load average ${load()}`);
  const med = medianSet(Number(process.env.PENUMBRA_FAR_MEDIAN ?? 40));
  const medRic = median(med.map((r) => r.msRiccati));
  const medOde = median(med.map((r) => r.msOde));
  console.log(`\n1. median over ${med.length} random modes (l ≤ 6, Mω ≤ 3): riccati ${fmt(medRic)} ms, ode ${fmt(medOde)} ms`);

  const omegas = [1, 3, 10, 20, 30];
  const byOmega = [];
  for (const spin of SPINS)
    for (const a of AS)
      for (const omega of omegas) {
        const l = Math.max(lowest(spin), spin === 0.5 ? 2.5 : 2);
        byOmega.push(point({ spin, l, m: l, a, omega }));
      }
  console.log('\n2a. cost against Mω (l = 2, 5/2 for s = 1/2; m = l): ms riccati / ms ode (ratio riccati/median)');
  console.log(
    table(
      ['spin, a', ...omegas.map((w) => `Mω=${w}`)],
      SPINS.flatMap((spin) =>
        AS.map((a) => [
          `s=${spin}, a=${a}`,
          ...byOmega
            .filter((r) => r.spin === spin && r.a === a)
            .map((r) => `${fmt(r.msRiccati)} / ${fmt(r.msOde)} (${fmt(r.msRiccati / medRic, 1)})`),
        ]),
      ),
    ),
  );

  const ls = [10, 25, 50, 75, 100];
  const byL = [];
  for (const omega of [1, 10, 30])
    for (const spin of SPINS)
      for (const a of AS)
        for (const l0 of ls) {
          const l = spin === 0.5 ? l0 + 0.5 : l0;
          const m = spin === 0.5 ? Math.round(l / 2) + 0.5 : Math.round(l / 2);
          byL.push(point({ spin, l, m, a, omega }));
        }
  console.log('\n2b. cost against l (m ≈ l/2): ms riccati / ms ode (ratio riccati/median)');
  console.log(
    table(
      ['Mω, spin, a', ...ls.map((l) => `l=${l}`)],
      [1, 10, 30].flatMap((omega) =>
        SPINS.flatMap((spin) =>
          AS.map((a) => [
            `${omega}, s=${spin}, a=${a}`,
            ...byL
              .filter((r) => r.omega === omega && r.spin === spin && r.a === a)
              .map((r) => `${fmt(r.msRiccati)} / ${fmt(r.msOde)} (${fmt(r.msRiccati / medRic, 1)})`),
          ]),
        ),
      ),
    ),
  );
  const wide = [...byOmega, ...byL];
  console.log(
    `\nworst riccati cost over Mω ≤ 30, l ≤ 100: ${fmt(maximum(wide.map((r) => r.msRiccati)))} ms = ${fmt(
      maximum(wide.map((r) => r.msRiccati)) / medRic,
    )} × the median (ode route: ${fmt(maximum(wide.map((r) => r.msOde)))} ms = ${fmt(maximum(wide.map((r) => r.msOde)) / medOde)} × its median)`,
  );

  const MASSIVE = [
    { a: 0, l: 0, m: 0, omega: 0.3 },
    { a: 0, l: 2, m: 0, omega: 0.8 },
    { a: 0.9, l: 1, m: 1, omega: 0.4 },
    { a: 0.7, l: 2, m: -1, omega: 1.2 },
    { a: 0.99, l: 3, m: 3, omega: 2 },
  ];
  const FRACTIONS = [0.5, 0.9, 0.99, 0.9987];
  const massive = [];
  for (const x of MASSIVE) {
    const massless = costs({ ...x, spin: 0 });
    for (const f of FRACTIONS) {
      const r = point({ ...x, spin: 0, mass: f * x.omega });
      massive.push({
        ...r,
        v: Math.sqrt(1 - f * f),
        ratioRiccati: r.msRiccati / massless.riccati,
        ratioOde: r.msOde / massless.ode,
      });
    }
  }
  console.log('\n3. massive scalar / massless cost at the same l, m, a, ω: riccati (ode)');
  console.log(
    table(
      ['a, l, m, Mω', ...FRACTIONS.map((f) => `v=${fmt(Math.sqrt(1 - f * f), 1)}`)],
      MASSIVE.map((x) => [
        `${x.a}, ${x.l}, ${x.m}, ${x.omega}`,
        ...massive
          .filter((r) => r.a === x.a && r.l === x.l && r.omega === x.omega)
          .map((r) => `${fmt(r.ratioRiccati)} (${fmt(r.ratioOde)})`),
      ]),
    ),
  );
  console.log(
    `worst massive/massless: riccati ${fmt(maximum(massive.map((r) => r.ratioRiccati)))}, ode ${fmt(maximum(massive.map((r) => r.ratioOde)))}`,
  );

  const EXTREMAL = [
    { spin: 0, l: 2, m: -2, a: 0.99999, omega: 30 },
    { spin: 2, l: 2, m: -2, a: 0.99999, omega: 3 },
    { spin: 1, l: 20, m: -20, a: 0.9999, omega: 5 },
    { spin: 0.5, l: 10.5, m: -10.5, a: 0.99999, omega: 10 },
  ];
  const extremal = EXTREMAL.map(point);
  console.log('\n4. near-extremal counter-rotating modes: ms riccati / ms ode (ratio riccati/median)');
  console.log(
    table(
      ['spin, l, m, a, Mω', 'cost', 'relError'],
      extremal.map((r) => [
        `${r.spin}, ${r.l}, ${r.m}, ${r.a}, ${r.omega}`,
        `${fmt(r.msRiccati)} / ${fmt(r.msOde)} (${fmt(r.msRiccati / medRic)})`,
        fmt(r.relError),
      ]),
    ),
  );

  const all = [...med, ...wide, ...massive, ...extremal].filter((r) => Number.isFinite(r.diff) && r.log10Gamma > -30);
  console.log(
    `\n5. accuracy over ${all.length} points with |Γ| ≥ 1e-30: largest |Γ_riccati/Γ_ode − 1| ${fmt(maximum(all.map((r) => r.diff)))}, largest relError ${fmt(
      maximum(all.map((r) => r.relError)),
    )}`,
  );
  console.log(`load average at the end ${load()}; ${((Date.now() - started) / 1000).toFixed(0)} s`);
  const path = writeResult('far-zone', {
    medianMs: { riccati: medRic, ode: medOde },
    median: med,
    byOmega,
    byL,
    massive,
    extremal,
    load: load(),
  });
  console.log(`results: ${path}`);
}

main();
