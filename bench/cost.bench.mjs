// Cost of penumbra's greybody factors at the 1e-8 target (the default):
//  1. median time and RHS evaluations per mode over s ∈ {0, 1/2, 1, 2}, l ≤ 6,
//     all m, a ∈ {0, 0.7, 0.99} and 40 log-spaced frequencies in [0.01, 3]/M;
//     a seeded uniform sample if the full set would exceed the time budget;
//  2. growth of the cost with Mω up to 20 and with l up to 50.
// Run with `npm run bench` (builds first). Results: bench/results/cost-<date>.json.
import os from 'node:os';
import { FIELD_SPINS } from '@penumbra/core';
import { greybody } from '@penumbra/flux';
import { clearSpheroidalCache } from '@penumbra/spheroidal';
import { fmt, maximum, median, relDiff, table, writeResult } from './lib.mjs';

/** A bench mode record { spin, l, m, a, omega } as a greybody problem. */
const asProblem = (x) => ({ hole: { a: x.a }, mode: { field: { spin: x.spin }, l: x.l, m: x.m }, omega: x.omega });

const TOL = 1e-8;
const BUDGET_SECONDS = Number(process.env.PENUMBRA_COST_BUDGET ?? 150);
const SEED = 20240607;
const SPINS = FIELD_SPINS;
const SPIN_PARAMETERS = [0, 0.7, 0.99];
const OMEGAS = Array.from({ length: 40 }, (_, i) => 0.01 * Math.pow(300, i / 39));

function coverageSet() {
  const modes = [];
  for (const spin of SPINS) {
    for (let l = spin; l <= 6; l++) {
      for (let m = -l; m <= l; m++) {
        for (const a of SPIN_PARAMETERS) {
          for (const omega of OMEGAS) modes.push({ spin, l, m, a, omega });
        }
      }
    }
  }
  return modes;
}

/** Deterministic pseudo-random numbers (mulberry32) for a reproducible sample. */
function rng(seed) {
  let t = seed >>> 0;
  return () => {
    t = (t + 0x6d2b79f5) >>> 0;
    let x = Math.imul(t ^ (t >>> 15), 1 | t);
    x = (x + Math.imul(x ^ (x >>> 7), 61 | x)) ^ x;
    return ((x ^ (x >>> 14)) >>> 0) / 4294967296;
  };
}

function sample(list, size, seed) {
  const random = rng(seed);
  const copy = list.map((x, i) => ({ x, i, key: random() }));
  copy.sort((p, q) => p.key - q.key);
  // keep the natural order (frequency ascending within a mode) among the chosen
  return copy
    .slice(0, size)
    .sort((p, q) => p.i - q.i)
    .map((p) => p.x);
}

function solveTimed(mode) {
  const t0 = performance.now();
  try {
    const r = greybody(asProblem(mode), { tol: TOL });
    return {
      ok: true,
      ms: performance.now() - t0,
      rhs: r.diagnostics.rhsEvaluations,
      relError: r.relError,
      residual: r.residual,
      gamma: r.gamma,
    };
  } catch (e) {
    return { ok: false, ms: performance.now() - t0, error: `${e.name}: ${e.message}` };
  }
}

function coverage() {
  const all = coverageSet();
  // warm-up on a small spread of modes, then estimate the cost of the full set
  const probe = sample(all, 400, SEED + 1);
  for (const mode of probe) solveTimed(mode);
  const t0 = performance.now();
  for (const mode of probe) solveTimed(mode);
  const perMode = (performance.now() - t0) / probe.length;
  const estimate = (perMode * all.length) / 1e3;
  const full = estimate <= BUDGET_SECONDS;
  const chosen = full ? all : sample(all, Math.max(500, Math.floor((BUDGET_SECONDS * 1e3) / perMode)), SEED);
  const how = full
    ? `full set (${all.length} modes; estimated ${fmt(estimate)} s)`
    : `seeded uniform sample of ${chosen.length} of ${all.length} modes (mulberry32 seed ${SEED}); the full set was estimated at ${fmt(estimate)} s against a budget of ${BUDGET_SECONDS} s`;
  console.log(
    `coverage set: ${how}; frequencies taken in ascending order per mode (the spheroidal continuation cache is used as in a spectrum scan)`,
  );

  clearSpheroidalCache();
  const started = performance.now();
  const results = chosen.map((mode) => ({ ...mode, ...solveTimed(mode) }));
  const seconds = (performance.now() - started) / 1e3;

  // achieved accuracy on a subsample, against tol 1e-12
  const check = sample(
    results.filter((r) => r.ok),
    200,
    SEED + 2,
  ).map((r) => {
    const ref = greybody(asProblem(r), { tol: 1e-12, reflection: false }).gamma;
    return { ...r, reference: ref, achieved: relDiff(r.gamma, ref) };
  });

  const rows = [];
  const bySpin = [];
  for (const spin of SPINS) {
    const set = results.filter((r) => r.spin === spin);
    const ok = set.filter((r) => r.ok);
    const acc = check.filter((r) => r.spin === spin);
    const s = {
      spin,
      modes: set.length,
      failures: set.length - ok.length,
      medianMs: median(ok.map((r) => r.ms)),
      p90Ms: ok.length ? ok.map((r) => r.ms).sort((x, y) => x - y)[Math.floor(0.9 * (ok.length - 1))] : Number.NaN,
      medianRhsEvaluations: median(ok.map((r) => r.rhs)),
      maxReportedRelError: maximum(ok.map((r) => r.relError)),
      maxResidual: maximum(ok.map((r) => r.residual)),
      accuracyChecked: acc.length,
      maxAchievedRelError: maximum(acc.map((r) => r.achieved)),
      medianAchievedRelError: median(acc.map((r) => r.achieved)),
    };
    bySpin.push(s);
    rows.push([
      spin,
      s.modes,
      s.failures,
      fmt(s.medianMs),
      fmt(s.p90Ms),
      Math.round(s.medianRhsEvaluations),
      fmt(s.maxReportedRelError),
      fmt(s.maxResidual),
      `${fmt(s.medianAchievedRelError)} / ${fmt(s.maxAchievedRelError)} (${s.accuracyChecked})`,
    ]);
  }
  console.log(
    table(
      [
        'spin',
        'modes',
        'failed',
        'median ms',
        'p90 ms',
        'median RHS evals',
        'max est. error',
        'max |Γ+R−1|',
        'achieved median / max (n checked)',
      ],
      rows,
    ),
  );
  console.log(`total ${fmt(seconds)} s for ${results.length} modes`);
  return {
    how,
    full,
    totalModes: all.length,
    timedModes: results.length,
    seconds,
    frequencies: OMEGAS,
    bySpin,
    failures: results.filter((r) => !r.ok).map(({ spin, l, m, a, omega, error }) => ({ spin, l, m, a, omega, error })),
  };
}

function growthPoint(mode) {
  const r = greybody(asProblem(mode), { tol: TOL });
  // median of single solves (eigenvalue cache cleared): robust on a shared machine
  const ms = median(
    Array.from({ length: 7 }, () => {
      clearSpheroidalCache();
      const t0 = performance.now();
      greybody(asProblem(mode), { tol: TOL });
      return performance.now() - t0;
    }),
  );
  return {
    ...mode,
    gamma: r.gamma,
    relError: r.relError,
    rhsEvaluations: r.diagnostics.rhsEvaluations,
    steps: r.diagnostics.steps,
    matchRadius: r.diagnostics.matchRadius,
    ms,
  };
}

function growth() {
  const omegas = [0.01, 0.03, 0.1, 0.3, 1, 3, 10, 20];
  const withOmega = [];
  for (const spin of SPINS) {
    const l = spin === 0.5 ? 2.5 : 2;
    const m = spin === 0.5 ? 0.5 : 1;
    for (const omega of omegas) withOmega.push(growthPoint({ spin, l, m, a: 0.7, omega }));
  }
  console.log(
    '\ncost against Mω (l = 2 (5/2 for s = 1/2), m = 1 (1/2), a = 0.7; eigenvalue solve included): ms / RHS evaluations',
  );
  console.log(
    table(
      ['spin', ...omegas.map((w) => `Mω=${w}`)],
      SPINS.map((spin) => [spin, ...withOmega.filter((r) => r.spin === spin).map((r) => `${fmt(r.ms)} / ${r.rhsEvaluations}`)]),
    ),
  );

  const ls = [2, 5, 10, 20, 30, 40, 50];
  const withL = [];
  for (const omega of [1, 10]) {
    for (const spin of [0, 2]) {
      for (const l of ls) withL.push(growthPoint({ spin, l, m: 0, a: 0.7, omega }));
    }
  }
  console.log('\ncost against l (m = 0, a = 0.7; eigenvalue solve included): ms / RHS evaluations');
  console.log(
    table(
      ['spin, Mω', ...ls.map((l) => `l=${l}`)],
      [0, 2].flatMap((spin) =>
        [1, 10].map((omega) => [
          `s=${spin}, Mω=${omega}`,
          ...withL.filter((r) => r.spin === spin && r.omega === omega).map((r) => `${fmt(r.ms)} / ${r.rhsEvaluations}`),
        ]),
      ),
    ),
  );
  return { withOmega, withL };
}

function main() {
  const cpus = os.cpus();
  console.log(
    `cost benchmark at tol ${TOL}; node ${process.version}; ${cpus[0]?.model ?? 'cpu'} × ${cpus.length}; load average ${os
      .loadavg()
      .map((x) => x.toFixed(1))
      .join(' ')}`,
  );
  const cov = coverage();
  const gr = growth();
  const path = writeResult('cost', {
    date: new Date().toISOString(),
    node: process.version,
    cpu: cpus[0]?.model,
    cpus: cpus.length,
    loadAverage: os.loadavg(),
    tol: TOL,
    coverage: cov,
    growth: gr,
  });
  console.log(`\nresults: ${path}`);
}

main();
