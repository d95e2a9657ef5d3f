// Honesty of greybody error estimates at tight tolerances.
//
// Part 1: every row of the high-precision fixture (test/fixtures/greybody,
// an independent 40–50 digit mpmath calculation; Kerr rows through the
// Teukolsky route, Schwarzschild rows at a = 0) solved with `greybody` at
// tol 1e-12: how many error estimates are below the true error, the largest
// ratio true error / estimate, how many results miss the requested tolerance,
// how many ConvergenceErrors or up-front refusals, and whether Γ ever exceeds
// 1 + its error for a non-superradiant mode. Also the Regge–Wheeler solver
// (`schwarzschildGreybody`) on the Schwarzschild rows at its own tol 1e-12.
//
// Part 2: the s = 2, l = m = 2 superradiant band (121 points in 0 < ω < 2Ω_H)
// and near-extremal holes at tol 1e-10 and 1e-12: outcome counts, and the
// estimate against a solve at a 100 times tighter integrator tolerance.
//
// Run: npx tsc -b && node bench/honesty.bench.mjs [--quick]
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { tryGreybody } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { benchDir, fmt, maximum, median } from './lib.mjs';

const quick = process.argv.includes('--quick');
const fixture = JSON.parse(readFileSync(join(benchDir, '..', 'test', 'fixtures', 'greybody', 'reference.json'), 'utf8'));

const problemOf = (row) => ({
  hole: { a: row.a },
  mode: { field: { spin: row.spin }, l: row.l, m: row.m ?? (row.spin === 0.5 ? 0.5 : 0) },
  omega: row.omega,
});

function honesty(label, rows, solve) {
  const t0 = performance.now();
  const out = { solved: 0, refused: 0, notConverged: 0, below: 0, missed: 0, overOne: 0, ratios: [], errors: [], worst: [] };
  for (const row of rows) {
    const r = solve(row);
    if (r.status === 'invalid-input') {
      out.refused++;
      continue;
    }
    if (r.status === 'not-converged') {
      out.notConverged++;
      continue;
    }
    out.solved++;
    const { gamma, relError } = r.solution;
    const ref = row.gamma;
    const trueError = Math.abs(gamma / ref - 1);
    const ratio = trueError / relError;
    out.ratios.push(ratio);
    out.errors.push(trueError);
    if (ratio > 1) out.below++;
    if (trueError > TOL) out.missed++;
    if (!(row.superradiant && row.spin !== 0.5) && gamma > 1 + relError * Math.abs(gamma)) out.overOne++;
    out.worst.push({ ratio, trueError, relError, row });
  }
  out.worst.sort((x, y) => y.ratio - x.ratio);
  const sec = (performance.now() - t0) / 1e3;
  console.log(
    `${label}: ${rows.length} modes in ${sec.toFixed(0)} s — solved ${out.solved}, refused (InputError naming tol) ${out.refused}, ConvergenceError ${out.notConverged}`,
  );
  console.log(
    `  estimates below true error: ${out.below} of ${out.solved}; max ratio true/estimate ${fmt(maximum(out.ratios))}, median ${fmt(median(out.ratios))}`,
  );
  console.log(
    `  true error vs fixture: max ${fmt(maximum(out.errors))}, median ${fmt(median(out.errors))}; missed tol ${TOL}: ${out.missed}; Γ > 1 + error (non-superradiant): ${out.overOne}`,
  );
  for (const w of out.worst.slice(0, 5)) {
    const { spin, l, m, a, omega } = w.row;
    console.log(
      `    ratio ${fmt(w.ratio)}: s=${spin} l=${l} m=${m} a=${a} Mω=${omega} true ${fmt(w.trueError)} estimate ${fmt(w.relError)}`,
    );
  }
  return out;
}

const TOL = 1e-12;
let kerrRows = fixture.kerr.rows;
let schwRows = fixture.schwarzschild.rows;
if (quick) {
  kerrRows = kerrRows.filter((_, i) => i % 6 === 0);
  schwRows = schwRows.filter((_, i) => i % 6 === 0);
}

console.log('Part 1: greybody at tol 1e-12 against the mpmath fixture (test/fixtures/greybody/reference.json)');
honesty('Kerr rows (Teukolsky route)', kerrRows, (row) => tryGreybody(problemOf(row), { tol: TOL }));
honesty('Schwarzschild rows through greybody', schwRows, (row) => tryGreybody(problemOf(row), { tol: TOL }));
honesty('Schwarzschild rows through schwarzschildGreybody', schwRows, (row) => {
  try {
    const s = schwarzschildGreybody({ field: { spin: row.spin }, l: row.l, omega: row.omega }, { tol: TOL });
    return { status: 'success', solution: { gamma: s.gamma, relError: s.diagnostics.errorEstimate } };
  } catch (e) {
    return { status: e?.name === 'InputError' ? 'invalid-input' : 'not-converged' };
  }
});

console.log('\nPart 2: s = 2, l = m = 2 superradiant band and near-extremal holes, against a solve 100× tighter');
const bandPoints = quick ? 31 : 121;
for (const tol of [1e-10, 1e-12]) {
  for (const a of [0.99, 0.999, 0.9936, 0.995]) {
    const hole = kerrHole({ a });
    const top = 2 * hole.omegaH;
    let ok = 0;
    let refused = 0;
    let failed = 0;
    let below = 0;
    let maxRatio = 0;
    let maxTrue = 0;
    for (let i = 1; i <= bandPoints; i++) {
      const omega = (top * i) / (bandPoints + 1);
      const problem = { hole: { a }, mode: { field: { spin: 2 }, l: 2, m: 2 }, omega };
      const r = tryGreybody(problem, { tol });
      if (r.status === 'invalid-input') refused++;
      else if (r.status === 'not-converged') failed++;
      else {
        ok++;
        const ref = tryGreybody(problem, { tol: Math.max(tol / 100, 1e-12) });
        if (ref.status === 'success' && tol > 1e-12) {
          const trueError = Math.abs(r.solution.gamma / ref.solution.gamma - 1);
          maxTrue = Math.max(maxTrue, trueError);
          const ratio = trueError / r.solution.relError;
          maxRatio = Math.max(maxRatio, ratio);
          if (ratio > 1) below++;
        }
      }
    }
    console.log(
      `  tol ${tol} a=${a}: ${bandPoints} points in 0 < Mω < 2MΩ_H = ${fmt(top * hole.mass, 4)}: solved ${ok}, refused ${refused}, ConvergenceError ${failed}` +
        (tol > 1e-12
          ? `; vs 100× tighter: max difference ${fmt(maxTrue)}, estimates below it ${below}, max ratio ${fmt(maxRatio)}`
          : ''),
    );
  }
}
const extremal = [0.9936, 0.995, 0.999, 0.9999];
for (const tol of [1e-10, 1e-12]) {
  for (const a of extremal) {
    let ok = 0;
    let refused = 0;
    let failed = 0;
    let n = 0;
    for (const spin of [0, 0.5, 1, 2]) {
      for (const omega of [0.05, 0.3, 1, 2]) {
        const l = Math.max(spin, spin === 0.5 ? 0.5 : 1);
        const r = tryGreybody({ hole: { a }, mode: { field: { spin }, l, m: l }, omega }, { tol });
        n++;
        if (r.status === 'invalid-input') refused++;
        else if (r.status === 'not-converged') failed++;
        else ok++;
      }
    }
    console.log(
      `  tol ${tol} a=${a}: ${n} modes (s = 0, ½, 1, 2; l = m = max(s, 1); Mω = 0.05…2): solved ${ok}, refused ${refused}, ConvergenceError ${failed}`,
    );
  }
}
