// Honesty of greybody's error estimate in the tail (issue 14): l up to 100,
// Mω up to 30 and near-extremal counter-rotating modes, where the estimate
// now comes from one solve (Riccati steps charging their own error).
// Each mode is solved at the tested tol (default 1e-8, reflection off) and
// against a reference solve at tol 1e-12 (1e-11 where 1e-12 is refused as
// below the rounding floor); the true error is |Γ/Γ_ref − 1|. Printed per set:
// the worst ratio true error / estimate (through log10 |Γ|, so Γ below the
// double range counts too), the count of estimates below the
// true error (ratio > 1), the count of results missing tol, the check solves
// made, and the five worst modes.
//   set 1: the tail grid (lib.mjs tailGrid, 208 modes);
//   set 2: PASSES passes (default 16) of N random modes (default 25) each,
//          every pass its own seed: s ∈ {0, 1/2, 1, 2}, l uniform in
//          [max(|s|, ...), 100], any m, 0.01 ≤ Mω ≤ 30 log-uniform; a uniform
//          in [0, 0.9999], or in one draw of four near-extremal
//          (a ∈ {0.999, 0.9999, 0.99999}) and counter-rotating (m < 0).
// With --ode the references are integrated without Riccati steps (oscillation
// 'ode', tol 1e-11, or 1e-10 where that is refused), independent of them.
// Run: npx tsc -b && node bench/tail-honesty.bench.mjs [--tol=1e-8] [--passes=16] [--n=25] [--grid-only] [--ode]
import os from 'node:os';
import { tryGreybody } from '@penumbra/flux';
import { fmt, maximum, median, seededRandom, tailGrid } from './lib.mjs';

const arg = (name, fallback) => {
  const a = process.argv.find((x) => x.startsWith(`--${name}=`));
  return a ? Number(a.slice(name.length + 3)) : fallback;
};
const tol = arg('tol', 1e-8);
const PASSES = arg('passes', 16);
const N = arg('n', 25);
const spins = [0, 0.5, 1, 2];

function randomModes(seed) {
  const rand = seededRandom(seed);
  return Array.from({ length: N }, () => {
    const spin = spins[Math.floor(rand() * 4)];
    const lMin = Math.max(spin, spin === 0.5 ? 0.5 : 0);
    const l = lMin + Math.floor(rand() * (101 - Math.ceil(lMin)));
    let m = -l + Math.floor(rand() * (2 * l + 1));
    const extremal = rand() < 0.25;
    if (extremal && m >= 0) m = -m || -l;
    const a = extremal ? [0.999, 0.9999, 0.99999][Math.floor(rand() * 3)] : 0.9999 * rand();
    return { hole: { a }, mode: { field: { spin }, l, m }, omega: 0.01 * 3000 ** rand() };
  });
}

/** --ode: the references integrate every stretch by the ODE integrator (oscillation 'ode'), independent of the Riccati steps. */
const ode = process.argv.includes('--ode');

function reference(p) {
  for (const refTol of ode ? [1e-11, 1e-10] : [1e-12, 1e-11]) {
    const r = tryGreybody(p, { tol: refTol, reflection: false, ...(ode ? { oscillation: 'ode' } : {}) });
    if (r.status === 'success') return { ...r.solution, refTol };
  }
  return undefined;
}

function run(label, modes) {
  const t0 = performance.now();
  const out = { solved: 0, failed: 0, noReference: 0, below: 0, missed: 0, checks: 0, ratios: [], errors: [], worst: [] };
  for (const p of modes) {
    const r = tryGreybody(p, { tol, reflection: false });
    if (r.status !== 'success') {
      out.failed++;
      continue;
    }
    const ref = reference(p);
    if (!ref) {
      out.noReference++;
      continue;
    }
    out.solved++;
    const { relError, diagnostics } = r.solution;
    if (diagnostics.checkEvaluations > 0) out.checks++;
    // through log10 |Γ|: Γ below the double range (gamma 0) is compared too
    const trueError = Math.abs(Math.expm1((r.solution.log10Gamma - ref.log10Gamma) * Math.LN10));
    const ratio = trueError / relError;
    out.ratios.push(ratio);
    out.errors.push(trueError);
    if (ratio > 1) out.below++;
    if (trueError > tol) out.missed++;
    out.worst.push({ ratio, trueError, relError, refError: ref.relError, refTol: ref.refTol, p });
  }
  out.worst.sort((x, y) => y.ratio - x.ratio);
  console.log(
    `${label}: ${modes.length} modes in ${((performance.now() - t0) / 1e3).toFixed(0)} s — compared ${out.solved}, failed at tol ${tol} ${out.failed}, no reference ${out.noReference}; check solves ${out.checks}`,
  );
  console.log(
    `  estimates below the true error: ${out.below} of ${out.solved}; worst true/estimate ${fmt(maximum(out.ratios))}, median ${fmt(median(out.ratios))}; true error max ${fmt(maximum(out.errors))}, missed tol: ${out.missed}`,
  );
  for (const w of out.worst.slice(0, 5)) {
    const { hole, mode, omega } = w.p;
    console.log(
      `    ratio ${fmt(w.ratio)}: s=${mode.field.spin} l=${mode.l} m=${mode.m} a=${hole.a} Mω=${fmt(omega, 3)} true ${fmt(w.trueError)} estimate ${fmt(w.relError)} (reference at tol ${w.refTol}, its estimate ${fmt(w.refError)})`,
    );
  }
  return out;
}

const load = os
  .loadavg()
  .map((x) => x.toFixed(1))
  .join(' ');
const references = ode ? "oscillation 'ode' solves at tol 1e-11 (1e-10)" : 'tol 1e-12 (1e-11) solves';
console.log(`load average ${load}; greybody at tol ${tol} against ${references}`);
const all = [run('tail grid', tailGrid())];
if (!process.argv.includes('--grid-only')) {
  for (let pass = 0; pass < PASSES; pass++)
    all.push(run(`random pass ${pass + 1} (seed ${101 + pass})`, randomModes(101 + pass)));
  const ratios = all.flatMap((o) => o.ratios);
  const below = all.reduce((s, o) => s + o.below, 0);
  const compared = all.reduce((s, o) => s + o.solved, 0);
  const checks = all.reduce((s, o) => s + o.checks, 0);
  console.log(
    `all sets: ${compared} compared; estimates below the true error ${below}; worst true/estimate ${fmt(maximum(ratios))}; check solves ${checks}`,
  );
}
