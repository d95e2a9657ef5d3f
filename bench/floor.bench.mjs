// Cost of one greybody factor against its floor (issue 14): Γ alone with its
// error estimate (reflection: false) at the default tol 1e-8 over N random Kerr
// modes (s ∈ {0, 1/2, 1, 2}, l ≤ 6, all m, 0.01 ≤ Mω ≤ 3 log-uniform, a
// uniform in [0, 0.9999]), CPU time per call (process.cpuUsage, so preemption
// on the shared machine does not count) and RHS evaluations; the share of
// modes whose estimate needed the check solve (diagnostics.checkEvaluations > 0
// where the build reports it; an older build can be made to report it by
// adding `checkEvaluations: extraEvaluations` to its greybody diagnostics).
//
// With a second build given (BASE=/path/to/another/checkout, built), both are
// run interleaved mode by mode (order alternating), and per-mode ratios are
// printed: on a loaded shared machine ratios of interleaved runs are the
// figures to read.
// --grid instead runs the tail grid (lib.mjs tailGrid; least CPU time of three
// runs per mode) and prints the worst mode's cost.
// --warmup=W first runs W other random modes (see below): the cost once the JIT has settled.
// --rounds=K runs the measurement K times over all modes and keeps each mode's least CPU time (noise bursts).
// --wall times each call by the main thread's elapsed time (see below) instead of the process's CPU time.
// Run: npx tsc -b && node bench/floor.bench.mjs [N] [--reflection] [--tol=1e-8] [--grid] [--reps=R] [--rounds=K] [--warmup=W] [--wall]
import os from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { writeFileSync } from 'node:fs';
import { benchDir, fmt, seededRandom, tailGrid } from './lib.mjs';

// the first argument that is not a flag (`--warmup=5000` alone keeps the default N)
const N = Number(process.argv.slice(2).find((x) => !x.startsWith('--')) ?? 1000);
const reflection = process.argv.includes('--reflection');
const tolArg = process.argv.find((x) => x.startsWith('--tol='));
const tol = tolArg ? Number(tolArg.slice(6)) : 1e-8;
const BASE = process.env.BASE;
const load = async (root) => (await import(pathToFileURL(join(root, 'packages/flux/dist/index.js')).href)).greybody;
const builds = [['new', await load(join(benchDir, '..'))]];
if (BASE) builds.unshift(['base', await load(BASE)]);

const rand = seededRandom(41);
const spins = [0, 0.5, 1, 2];
const grid = process.argv.includes('--grid');
const roundsArg = process.argv.find((x) => x.startsWith('--rounds='));
/**
 * passes over all modes, each mode's least CPU time over every pass kept (--rounds=4: a burst of load from other
 * processes, which lasts seconds and so spans all REPS runs of the modes it hits, is met by a mode in at most one
 * pass; default 1)
 */
const ROUNDS = roundsArg ? Number(roundsArg.slice(9)) : 1;
const repsArg = process.argv.find((x) => x.startsWith('--reps='));
/** runs per mode, the least CPU time kept (--reps=3: a mode's cost without the machine's noise; default 1, or 3 on the grid) */
const REPS = repsArg ? Number(repsArg.slice(7)) : grid ? 3 : 1;
const randomMode = () => {
  const spin = spins[Math.floor(rand() * 4)];
  const l = spin + Math.floor(rand() * (7 - Math.ceil(spin)));
  const m = -l + Math.floor(rand() * (2 * l + 1));
  return { hole: { a: 0.9999 * rand() }, mode: { field: { spin }, l, m }, omega: 0.01 * 300 ** rand() };
};
// On the grid each grid mode is followed by a random mode of the default set (`reference`): the grid's cost is read
// against the median of random modes measured in the same passes, under the same load and JIT state.
const gridModes = grid ? tailGrid() : [];
const modes = grid ? gridModes.flatMap((p) => [p, randomMode()]) : Array.from({ length: N }, randomMode);
const isReference = modes.map((_, i) => grid && i % 2 === 1);
const quantile = (xs, q) => {
  const s = [...xs].sort((x, y) => x - y);
  return s[Math.min(s.length - 1, Math.floor(q * s.length))];
};
// warm the JIT of every build: by default on the first 150 modes (every mode on the grid); with --warmup=W on W other
// random modes first (seed 43, the same draws), interleaved like the measurement: after ~5,000 modes the
// optimising compiler has settled, while in the default window its threads' CPU (charged by process.cpuUsage to
// the calls it overlaps) was measured at about twice the solves' own (bench/floor-fresh.bench.mjs prints both)
const warmArg = process.argv.find((x) => x.startsWith('--warmup='));
if (warmArg) {
  const warmRand = seededRandom(43);
  for (let i = 0; i < Number(warmArg.slice(9)); i++) {
    const spin = spins[Math.floor(warmRand() * 4)];
    const l = spin + Math.floor(warmRand() * (7 - Math.ceil(spin)));
    const m = -l + Math.floor(warmRand() * (2 * l + 1));
    const p = { hole: { a: 0.9999 * warmRand() }, mode: { field: { spin }, l, m }, omega: 0.01 * 300 ** warmRand() };
    for (const [, g] of i % 2 ? [...builds].reverse() : builds) g(p, { reflection, tol });
  }
}
// on the grid every mode once: its code paths (Riccati rungs, near-extremal starts, large-l spheroidal seeds) are
// first met there, and a first visit was charged the optimising compiler's CPU on its threads (measured: 17–19 of
// 208 modes above 3× the median, up to 12.7×, with 20 warm-up modes; the same build, interleaved)
// (at ω(1 − 1e-12): the measured calls are then no exact repeats, which the eigenvalue and far-series caches would serve)
for (const [, g] of builds)
  for (const p of grid ? modes : modes.slice(0, 150)) g({ ...p, omega: p.omega * (1 - 1e-12) }, { reflection, tol });

// --wall: the main thread's elapsed time per call instead of the process's CPU time. The optimising compiler runs
// on other threads; with a core to spare its work overlaps the calls without lengthening them, while the process
// CPU time charges it to them. Preemption counts here: use it on a quiet host, beside the CPU figure.
const wall = process.argv.includes('--wall');
const clock = wall
  ? () => performance.now()
  : () => {
      const t = process.cpuUsage();
      return (t.user + t.system) / 1e3;
    };
const rec = Object.fromEntries(
  builds.map(([name]) => [name, { ms: [], evals: [], checks: 0, failed: 0, gamma: [], checkEvals: [] }]),
);
for (let round = 0; round < ROUNDS; round++)
  modes.forEach((p, i) => {
    const order = (i + round) % 2 ? [...builds].reverse() : builds;
    for (const [name, g] of order) {
      const r = rec[name];
      if (round > 0) {
        // a later pass: only a lower CPU time of the same (deterministic) solve replaces the kept one
        if (!Number.isFinite(r.ms[i])) continue;
        for (let rep = 0; rep < REPS; rep++) {
          const t0 = clock();
          // ω moved for every repeat of a later round too: an exact repeat of round 0's problem would hit the
          // eigenvalue and far-series caches (the grid's median was 0.09 ms so measured, 0.13–0.16 ms without)
          g({ ...p, omega: p.omega * (1 - (round * REPS + rep) * 1e-13) }, { reflection, tol });
          r.ms[i] = Math.min(r.ms[i], clock() - t0);
        }
        continue;
      }
      try {
        // the least of REPS runs (the machine is shared; a mode's cost is deterministic)
        let best = Number.POSITIVE_INFINITY;
        let sol;
        for (let rep = 0; rep < REPS; rep++) {
          const t0 = clock();
          // each repeat at ω × (1 − rep·1e-13) (Mω = 30 is the largest allowed): no exact hit in the eigenvalue or far-series caches
          sol = g(rep === 0 ? p : { ...p, omega: p.omega * (1 - rep * 1e-13) }, { reflection, tol });
          best = Math.min(best, clock() - t0);
        }
        r.ms.push(best);
        r.evals.push(sol.diagnostics.rhsEvaluations);
        r.gamma.push(sol.gamma);
        if (sol.diagnostics.checkEvaluations > 0) r.checks++;
        r.checkEvals.push(sol.diagnostics.checkEvaluations ?? 0);
      } catch (e) {
        if (r.failed < 3) console.log(`${name} failed on ${JSON.stringify(p)}: ${e.message.slice(0, 160)}`);
        r.failed++;
        r.ms.push(Number.NaN);
        r.evals.push(Number.NaN);
        r.gamma.push(Number.NaN);
        r.checkEvals.push(0);
      }
    }
  });
const out = {
  date: new Date().toISOString(),
  load: os.loadavg(),
  cpu: `${os.cpus()[0]?.model} × ${os.cpus().length}`,
  n: N,
  reflection,
  tol,
  reps: REPS,
  rounds: ROUNDS,
  clock: wall ? 'wall' : 'cpu',
  builds: {},
};
console.log(
  `load average ${os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(
      ' ',
    )}; ${out.cpu}; ${grid ? `${gridModes.length} grid modes and ${gridModes.length} random` : N} modes, tol ${tol}, reflection ${reflection}; least CPU of ${REPS} runs × ${ROUNDS} rounds per mode`,
);
/** the entries of the measured set (the grid's, or all random modes), or of the reference random modes beside the grid */
const pick = (xs, reference) => xs.filter((_, i) => isReference[i] === reference);
for (const [name] of builds) {
  const r = rec[name];
  const ms = pick(r.ms, false).filter(Number.isFinite);
  const ev = pick(r.evals, false).filter(Number.isFinite);
  const s = {
    medianMs: quantile(ms, 0.5),
    p90Ms: quantile(ms, 0.9),
    p99Ms: quantile(ms, 0.99),
    maxMs: Math.max(...ms),
    medianEvals: quantile(ev, 0.5),
    p99Evals: quantile(ev, 0.99),
    meanEvals: ev.reduce((x, y) => x + y, 0) / ev.length,
    checkFraction: pick(r.checkEvals, false).filter((x) => x > 0).length / ms.length,
    failed: r.failed,
  };
  const worstAt = r.ms.findIndex((x, i) => !isReference[i] && x === s.maxMs);
  if (grid) s.referenceMedianMs = quantile(pick(r.ms, true).filter(Number.isFinite), 0.5);
  s.worstMode = modes[worstAt];
  out.builds[name] = s;
  console.log(
    `${name}: ${wall ? 'wall' : 'CPU'} ms median ${fmt(s.medianMs, 3)}, p90 ${fmt(s.p90Ms, 3)}, p99 ${fmt(s.p99Ms, 3)}, max ${fmt(s.maxMs, 3)}; RHS evaluations median ${s.medianEvals}, p99 ${s.p99Evals}, mean ${fmt(s.meanEvals, 4)}; check solves ${fmt(100 * s.checkFraction, 3)} %; failed ${s.failed}`,
  );
  if (grid) console.log(`  worst mode ${JSON.stringify(s.worstMode)}`);
  if (grid) {
    // every mode above 3× the median, with its multiple of the median (and base/new where a base is given)
    const above = r.ms.map((x, i) => [x, i]).filter(([x, i]) => !isReference[i] && x > 3 * s.medianMs);
    console.log(`  ${above.length} modes above 3× the median; worst/median ${fmt(s.maxMs / s.medianMs, 3)}`);
    for (const [x, i] of above) {
      const ratio = BASE && name === 'new' ? `, base/new ${fmt(rec.base.ms[i] / x, 3)}` : '';
      console.log(`    ${JSON.stringify(modes[i])}: ${fmt(x, 3)} ms = ${fmt(x / s.medianMs, 3)}× median${ratio}`);
    }
    // against the random modes measured beside the grid: the issue's "within 3× of the median" read literally
    const ref = s.referenceMedianMs;
    const aboveRef = r.ms.filter((x, i) => !isReference[i] && x > 3 * ref).length;
    const nearExtremal = r.ms.filter((_, i) => !isReference[i] && modes[i].hole.a >= 0.9999);
    console.log(
      `  against the median of the random modes measured beside them (${fmt(ref, 3)} ms): worst ${fmt(s.maxMs / ref, 3)}×, near-extremal worst ${fmt(Math.max(...nearExtremal) / ref, 3)}×, ${aboveRef} of ${gridModes.length} modes above 3×`,
    );
    // the cost against l and Mω: the median over spins and a ∈ {0, 0.7, 0.99} of each (l, Mω) cell, as a multiple
    // of the random modes' median (the lowest l is s or 2; near-extremal modes are listed below)
    const cells = new Map();
    modes.forEach((p, i) => {
      if (isReference[i] || p.hole.a >= 0.9999) return;
      const key = `${p.mode.l < 20 ? 'lowest' : Math.floor(p.mode.l)}|${p.omega}`;
      if (!cells.has(key)) cells.set(key, []);
      cells.get(key).push(r.ms[i]);
    });
    s.byLOmega = {};
    for (const [key, xs] of cells) s.byLOmega[key] = quantile(xs, 0.5) / ref;
    const rows = [...new Set([...cells.keys()].map((k) => k.split('|')[0]))];
    const cols = [...new Set([...cells.keys()].map((k) => Number(k.split('|')[1])))].sort((x, y) => x - y);
    console.log(`  median cost per (l, Mω) / random modes' median:  Mω = ${cols.join(', ')}`);
    for (const row of rows)
      console.log(
        `    l ${row.padStart(6)}: ${cols.map((c) => (cells.has(`${row}|${c}`) ? fmt(s.byLOmega[`${row}|${c}`], 2) : '–').padStart(5)).join(' ')}`,
      );
    if (BASE && name === 'new') {
      console.log('  near-extremal modes (a ≥ 0.9999):');
      modes.forEach((p, i) => {
        if (p.hole.a < 0.9999) return;
        const x = r.ms[i];
        const b = rec.base.ms[i];
        console.log(
          `    ${JSON.stringify(p)}: base ${fmt(b, 3)} ms = ${fmt(b / out.builds.base.medianMs, 3)}×, new ${fmt(x, 3)} ms = ${fmt(x / s.medianMs, 3)}× median, base/new ${fmt(b / x, 3)}`,
        );
      });
    }
  }
}
if (BASE) {
  const b = rec.base,
    n = rec.new;
  const ratios = b.ms.map((x, i) => x / n.ms[i]).filter(Number.isFinite);
  const evalRatios = b.evals.map((x, i) => x / n.evals[i]).filter(Number.isFinite);
  const dGamma = b.gamma.map((x, i) => Math.abs(n.gamma[i] / x - 1)).filter(Number.isFinite);
  out.ratios = {
    medianTime: quantile(ratios, 0.5),
    medianEvals: quantile(evalRatios, 0.5),
    medianOfMedians: out.builds.base.medianMs / out.builds.new.medianMs,
    p99: out.builds.base.p99Ms / out.builds.new.p99Ms,
    maxGammaChange: Math.max(...dGamma),
  };
  console.log(
    `base/new: median of per-mode CPU ratios ${fmt(out.ratios.medianTime)}, of RHS-evaluation ratios ${fmt(out.ratios.medianEvals)}; ratio of medians ${fmt(out.ratios.medianOfMedians)}, of p99 ${fmt(out.ratios.p99)}; largest |Γ_new/Γ_base − 1| ${fmt(out.ratios.maxGammaChange)}`,
  );
}
const file = join(
  benchDir,
  'results',
  `floor-${process.env.PENUMBRA_RESULT_TAG ?? new Date().toISOString().slice(0, 10)}${tol === 1e-8 ? '' : `-tol${tol}`}${reflection ? '-reflection' : ''}${grid ? '-grid' : ''}${REPS > 1 && !grid ? `-min${REPS}` : ''}${ROUNDS > 1 ? `-rounds${ROUNDS}` : ''}${warmArg ? `-warm${warmArg.slice(9)}` : ''}${wall ? '-wall' : ''}.json`,
);
writeFileSync(file, `${JSON.stringify(out, null, 1)}\n`);
console.log(`results: ${file}`);
