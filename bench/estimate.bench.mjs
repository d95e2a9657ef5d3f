// Honesty of the single-solve error estimate of greybody factors, and what
// skipping the check solve saves (packages/flux/src/errorEstimate.ts).
//
// For every mode and tolerance it runs (a) `greybody` itself and compares its
// relError with the true error, and (b) the two solves the estimate is built
// from, by hand (first solve at tol·1e-3; check solve at ten times that, start
// 0.6×, matching radius 1.4×), to show the single-solve estimate
// (accumulation bound + 25 ε √N) against the true error on every mode, also
// where greybody ran the check solve instead.
// Mode sets:
//   fixture — the 649 rows of the 40-digit mpmath fixture (test/fixtures/greybody),
//             at tol 1e-8, 1e-10, 1e-12; true error against the fixture;
//   random  — l ≤ s + 4, 0.01 ≤ Mω ≤ 5, a ∈ {0 … 0.9999}, at tol 1e-8, 1e-10;
//   wide    — l up to s + 39, Mω up to 20, a up to 0.99999, massive scalars
//             1.02μ ≤ ω ≤ 4μ, at tol 1e-8, 1e-10;
//   random and wide: true error against `greybody` at tol 1e-11 (skipped
//   where that is refused).
// Also printed: the true error of the first solve against the bare sum of the
// loop's own accepted per-step estimates (radial's localErrorSum × tol ×
// amplification + series truncations) and the rounding floor, which is what
// flux's single-solve estimate multiplies by LOCAL_ERROR_FACTOR; and how many
// greybody calls ran the check solve.
// Run: npx tsc -b && node bench/estimate.bench.mjs [N random] [N wide]
// (PENUMBRA_RESULT_TAG=2026-12-03b names the result file)
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { greybody, horizonFactor } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';
import { radialSeparationConstant, spheroidalEigenvalue } from '@penumbra/spheroidal';
import { writeFileSync } from 'node:fs';
import { benchDir, fmt, seededRandom } from './lib.mjs';

const N_RANDOM = Number(process.argv[2] ?? 500);
const N_WIDE = Number(process.argv[3] ?? 400);
const ROUNDING = 25 * Number.EPSILON;

const problemOf = (x) => ({
  hole: { a: x.a },
  mode: { field: x.mu ? { spin: 0, mass: x.mu } : { spin: x.spin }, l: x.l, m: x.m },
  omega: x.omega,
});

/** ln|Γ| and the radial diagnostics of one solve, as flux's greybody makes it (massless or massive scalar). */
function solveMode(x, opts) {
  const hole = kerrHole({ a: x.a });
  const kInf = x.mu ? Math.sqrt(x.omega * x.omega - x.mu * x.mu) : x.omega;
  const A = spheroidalEigenvalue({ s: x.spin, l: x.l, m: x.m, c: x.a * kInf }).A;
  const lambda = radialSeparationConstant(A, x.a, x.omega, x.m);
  const k = x.omega - x.m * hole.omegaH;
  if (x.spin === 0) {
    const h = horizonFactor(0, hole, kInf, k);
    const sol = solveRadial({ hole, s: 0, m: x.m, omega: x.omega, lambda, ...(x.mu ? { mu: x.mu } : {}) }, opts);
    return { ln: Math.log(Math.abs(h)) - 2 * sol.logAbsZIn, d: sol.diagnostics, hole };
  }
  const h = horizonFactor(x.spin, hole, x.omega, k);
  const sol = solveTwoSided({ hole, s: x.spin, m: x.m, omega: x.omega, lambda }, opts);
  return { ln: Math.log(Math.abs(h)) - 2 * sol.logAbsZInPlus, d: sol.diagnostics, hole };
}

function components(x, tol) {
  const odeTol = Math.max(tol * 1e-3, 1e-14);
  const first = solveMode(x, { tol: odeTol, reflection: false });
  const { hole } = first;
  const fraction = (first.d.startRadius - hole.rPlus) / (hole.rPlus - hole.rMinus);
  const check = solveMode(x, {
    tol: odeTol * 10,
    startFraction: 0.6 * fraction,
    matchRadius: 1.4 * first.d.matchRadius,
    reflection: false,
  });
  const d = first.d;
  return {
    ln: first.ln,
    single: d.errorEstimate + ROUNDING * Math.sqrt(d.rhsEvaluations),
    // the loop's own accepted per-step estimates, unscaled (flux multiplies by LOCAL_ERROR_FACTOR)
    local: d.amplification * d.localErrorSum * d.tol + d.horizonTruncation + d.farTruncation,
    floor: ROUNDING * Math.sqrt(d.rhsEvaluations),
    evaluations: first.d.rhsEvaluations,
    checkEvaluations: check.d.rhsEvaluations,
  };
}

const rand = seededRandom(5);
const pick = (list) => list[Math.floor(rand() * list.length)];

const fixture = JSON.parse(readFileSync(join(benchDir, '..', 'test', 'fixtures', 'greybody', 'reference.json'), 'utf8'));
const fixtureRows = [...fixture.kerr.rows, ...fixture.schwarzschild.rows].map((r) => ({
  spin: r.spin,
  l: r.l,
  m: r.m ?? (r.spin === 0.5 ? 0.5 : 0),
  a: r.a,
  omega: r.omega,
  lnRef: Math.log(Math.abs(r.gamma)),
}));
const randomRows = Array.from({ length: N_RANDOM }, () => {
  const spin = pick([0, 0.5, 1, 2]);
  const l = spin + Math.floor(rand() * 5);
  return {
    spin,
    l,
    m: -l + Math.floor(rand() * (2 * l + 1)),
    a: pick([0, 0.5, 0.9, 0.99, 0.999, 0.9999]),
    omega: 0.01 * 500 ** rand(),
  };
});
const wideRows = Array.from({ length: N_WIDE }, () => {
  const kind = Math.floor(rand() * 4);
  const a = pick([0, 0.7, 0.99, 0.999, 0.9999, 0.99999]);
  if (kind === 3) {
    const mu = pick([0.05, 0.2, 0.5]);
    const l = Math.floor(rand() * 4);
    return { spin: 0, mu, l, m: -l + Math.floor(rand() * (2 * l + 1)), a, omega: mu * (1.02 + 3 * rand() ** 2) };
  }
  const spin = pick([0, 0.5, 1, 2]);
  const l = spin + Math.floor(rand() * (kind === 0 ? 40 : 6));
  return { spin, l, m: -l + Math.floor(rand() * (2 * l + 1)), a, omega: kind === 1 ? 3 + 17 * rand() : 0.01 * 1000 ** rand() };
});

const summary = [];
const t0 = performance.now();
for (const [label, rows, tols] of [
  ['fixture', fixtureRows, [1e-8, 1e-10, 1e-12]],
  ['random', randomRows, [1e-8, 1e-10]],
  ['wide', wideRows, [1e-8, 1e-10]],
]) {
  const refs = rows.map((x) => {
    if (x.lnRef !== undefined) return x.lnRef;
    try {
      const g = greybody(problemOf(x), { tol: 1e-11, reflection: false });
      return g.underflow ? Number.NaN : Math.log(Math.abs(g.gamma));
    } catch {
      return Number.NaN;
    }
  });
  for (const tol of tols) {
    const s = {
      label,
      tol,
      n: 0,
      skipped: 0,
      failed: 0,
      below: 0,
      worst: 0,
      singleBelow: 0,
      singleWorst: 0,
      evalNow: 0,
      evalCheckAlways: 0,
      localWorst: 0,
      localWorstAboveFloor: 0,
      checks: 0,
      worstMode: null,
      localWorstMode: null,
    };
    rows.forEach((x, i) => {
      if (!Number.isFinite(refs[i])) {
        s.skipped++;
        return;
      }
      let g;
      let c;
      try {
        g = greybody(problemOf(x), { tol, reflection: false });
        c = components(x, tol);
      } catch {
        s.failed++;
        return;
      }
      s.n++;
      const trueError = Math.abs(Math.expm1(Math.log(Math.abs(g.gamma)) - refs[i]));
      const singleTrue = Math.abs(Math.expm1(c.ln - refs[i]));
      if (trueError > g.relError) s.below++;
      if (trueError / g.relError > s.worst) s.worstMode = { ...x, trueError, relError: g.relError };
      s.worst = Math.max(s.worst, trueError / g.relError);
      if (g.diagnostics.checkEvaluations > 0) s.checks++;
      // the integration part alone: true error beyond the rounding floor against the raw local-error sum
      const r = singleTrue / (c.local + c.floor);
      if (r > s.localWorst) s.localWorstMode = { ...x, singleTrue, local: c.local, floor: c.floor };
      s.localWorst = Math.max(s.localWorst, r);
      s.localWorstAboveFloor = Math.max(s.localWorstAboveFloor, Math.max(singleTrue - c.floor, 0) / c.local);
      if (singleTrue > c.single) s.singleBelow++;
      s.singleWorst = Math.max(s.singleWorst, singleTrue / c.single);
      s.evalNow += g.diagnostics.rhsEvaluations;
      s.evalCheckAlways += c.evaluations + c.checkEvaluations;
    });
    summary.push(s);
    console.log(
      `  worst greybody mode ${JSON.stringify(s.worstMode)}\n  worst local-sum mode ${JSON.stringify(s.localWorstMode)}`,
    );
    console.log(
      `${label} tol ${tol}: ${s.n} modes (${s.skipped} without reference, ${s.failed} refused/not converged); ` +
        `greybody relError below the true error: ${s.below}, worst true/relError ${fmt(s.worst)}; ` +
        `single-solve estimate below the true error: ${s.singleBelow}, worst ${fmt(s.singleWorst)}; ` +
        `true/(raw local-error sum + floor) worst ${fmt(s.localWorst)}, (true − floor)/local-error sum worst ${fmt(s.localWorstAboveFloor)}; ` +
        `check solves ${s.checks} of ${s.n}; ` +
        `RHS evaluations against always checking: ${fmt(s.evalNow / s.evalCheckAlways)}`,
    );
  }
}
console.log(`total ${fmt((performance.now() - t0) / 1e3)} s`);
const file = join(
  benchDir,
  'results',
  `estimate-${process.env.PENUMBRA_RESULT_TAG ?? new Date().toISOString().slice(0, 10)}.json`,
);
writeFileSync(file, `${JSON.stringify({ date: new Date().toISOString(), summary }, null, 1)}\n`);
console.log(`results: ${file}`);
