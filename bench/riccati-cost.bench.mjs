// CPU cost of one Riccati step (riccatiStep.ts) against one right-hand-side
// evaluation of the integrator, on rungs of an l = 75 mode (s = 0, m = 38,
// a = 0.99, Mω = 1: one rung in the evanescent zone inside the turning point
// r ≈ l/ω, one in the wave zone outside), at the leg tolerance of the
// default greybody tol (1e-11). A step costs what that many evaluations
// cost: the figure that decides when a rung is worth a Riccati step.
// With BASE=/path/to/another/checkout (built) both builds are timed, each in
// rounds alternating with the other (least CPU time of the rounds).
// Run: npx tsc -b && node bench/riccati-cost.bench.mjs
import os from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { benchDir, fmt } from './lib.mjs';

const load = async (root) => ({
  radial: await import(pathToFileURL(join(root, 'packages/radial/dist/internal.js')).href),
  kerr: await import(pathToFileURL(join(root, 'packages/kerr/dist/index.js')).href),
});
const builds = [['new', await load(join(benchDir, '..'))]];
if (process.env.BASE) builds.unshift(['base', await load(process.env.BASE)]);

function timer({ radial: I, kerr }) {
  const hole = kerr.kerrHole({ a: 0.99 });
  const mode = { s: 0, m: 38, omega: 1, lambda: 75 * 76 };
  const eq = I.radialEquation(hole, mode, hole.rPlus);
  const e = I.riccatiEquation(eq, hole.rPlus);
  const y = new Float64Array(4),
    scale = new Float64Array(1);
  const rungs = [
    [14.684 - hole.rPlus, 28.226 - hole.rPlus],
    [217.82, 434.5],
  ];
  const step = ([xa, xb], N) => {
    let st;
    const t0 = process.cpuUsage();
    for (let i = 0; i < N; i++) {
      y.set([1, 0, 0, 1]);
      st = I.riccatiStep(e, xa, xb, y, 1e-11, scale);
    }
    const t = process.cpuUsage(t0);
    return { ns: ((t.user + t.system) * 1e3) / N, st };
  };
  const counter = { evaluations: 0 };
  const leg = () => ({
    hole,
    mode,
    equation: eq,
    y: new Float64Array([1, 0, 0, 1]),
    from: 30,
    to: 60,
    stops: [],
    tol: 1e-11 / 3,
    integrator: 'gbs',
    maxSteps: 1e6,
    variable: 'r',
    counter,
    method: 'bench',
  });
  const ode = (N) => {
    counter.evaluations = 0;
    const t0 = process.cpuUsage();
    for (let i = 0; i < N; i++) I.integrateLeg(leg());
    const t = process.cpuUsage(t0);
    return ((t.user + t.system) * 1e3) / counter.evaluations;
  };
  return { rungs, step, ode };
}

const timers = builds.map(([name, b]) => [name, timer(b)]);
const best = Object.fromEntries(
  timers.map(([name, T]) => [name, { steps: T.rungs.map(() => Infinity), ode: Infinity, info: [] }]),
);
for (const [, T] of timers) {
  for (const r of T.rungs) T.step(r, 2000);
  T.ode(200);
}
for (let round = 0; round < 6; round++) {
  const order = round % 2 ? [...timers].reverse() : timers;
  for (const [name, T] of order) {
    const rec = best[name];
    T.rungs.forEach((r, i) => {
      const { ns, st } = T.step(r, 5000);
      rec.steps[i] = Math.min(rec.steps[i], ns);
      rec.info[i] = st;
    });
    rec.ode = Math.min(rec.ode, T.ode(300));
  }
}
console.log(
  `load average ${os
    .loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')}; least CPU time of 6 rounds`,
);
for (const [name, T] of timers) {
  const rec = best[name];
  T.rungs.forEach(([xa, xb], i) => {
    const st = rec.info[i];
    console.log(
      `${name}: rung x ${fmt(xa, 4)} → ${fmt(xb, 4)}: ${st.ok ? 'ok' : 'failed'}, ${st.passes} passes; ${fmt(rec.steps[i] / 1e3, 3)} µs per step = ${fmt(rec.steps[i] / rec.ode, 3)} integrator evaluations (${fmt(rec.ode, 3)} ns each)`,
    );
  });
}
if (process.env.BASE)
  console.log(
    `base/new per step: ${best.base.steps.map((x, i) => fmt(x / best.new.steps[i], 3)).join(', ')}; per integrator evaluation ${fmt(best.base.ode / best.new.ode, 3)}`,
  );
