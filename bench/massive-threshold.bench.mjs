// Massive scalar near threshold on random modes: the work against the
// massless mode of the same l, m, a, ω (right-hand-side evaluations, which
// do not depend on the machine's load, and CPU time per call: the median of
// seven interleaved batches, the order rotated, after a warm-up pass over all
// modes), and the honesty of the error estimate against a tight
// integrator-only solve ('ode' at tol 1e-11).
// Modes: l ≤ 4, a ∈ [0, 0.99], Mω ∈ [0.05, 2], v = k∞/ω ∈ [0.02, 0.5]
// (log-uniform), tol 1e-8. Run: `npx tsc -b && node bench/massive-threshold.bench.mjs`.
import { greybody } from '@penumbra/flux';
import { fmt, interleavedCpuMs, median, seededMulberry, table } from './lib.mjs';

const N = Number(process.argv[2] ?? 40);
const random = seededMulberry(20261203);
const problem = (x, mass) => ({
  hole: { a: x.a },
  mode: { field: mass > 0 ? { spin: 0, mass } : { spin: 0 }, l: x.l, m: x.m },
  omega: x.omega,
});
const rows = [];
const records = [];
const modes = [];
for (let i = 0; i < N; i++) {
  const l = Math.floor(random() * 5);
  const m = -l + Math.floor(random() * (2 * l + 1));
  const x = { a: 0.99 * random(), l, m, omega: 0.05 * 40 ** random() };
  const v = 0.02 * 25 ** random();
  modes.push({ x, v, mass: x.omega * Math.sqrt(1 - v * v) });
}
// warm-up: every code path compiled before the first timing
for (const { x, mass } of modes) {
  greybody(problem(x, mass));
  greybody(problem(x, 0));
}
for (const { x, v, mass } of modes) {
  const { l, m } = x;
  const g = greybody(problem(x, mass));
  const g0 = greybody(problem(x, 0));
  const t = greybody(problem(x, mass), { tol: 1e-11, oscillation: 'ode' });
  const error = Math.abs(g.gamma / t.gamma - 1);
  const [ms, ms0] = interleavedCpuMs([() => greybody(problem(x, mass)), () => greybody(problem(x, 0))], 15, 100000, {
    rotate: true,
    batches: 7,
  });
  const record = {
    ...x,
    fieldMass: mass,
    v,
    gamma: g.gamma,
    relError: g.relError,
    error,
    rhsRatio: g.diagnostics.rhsEvaluations / g0.diagnostics.rhsEvaluations,
    cpuRatio: ms / ms0,
    msMassive: ms,
    msMassless: ms0,
  };
  records.push(record);
  rows.push([
    x.a.toFixed(3),
    l,
    m,
    fmt(x.omega, 3),
    fmt(v, 2),
    fmt(g.gamma, 4),
    fmt(g.relError, 2),
    fmt(error, 2),
    fmt(error / g.relError, 2),
    fmt(record.rhsRatio, 2),
    fmt(1e3 * ms, 3),
    fmt(1e3 * ms0, 3),
    fmt(record.cpuRatio, 2),
  ]);
}
console.log('massive scalar near threshold, tol 1e-8, against the massless mode and a tight (tol 1e-11, integrator-only) solve');
console.log(
  table(
    ['a', 'l', 'm', 'Mω', 'v', 'Γ', 'relError', 'true error', 'true/est', 'RHS ratio', 'µs massive', 'µs massless', 'CPU ratio'],
    rows,
  ),
);
const ratios = records.map((r) => r.rhsRatio);
const honesty = records.filter((r) => Math.abs(r.gamma) >= 1e-30).map((r) => r.error / r.relError);
const cpu = records.map((r) => r.cpuRatio);
console.log(
  `RHS ratio massive/massless: median ${fmt(median(ratios), 2)}, max ${fmt(Math.max(...ratios), 2)}; CPU ratio: median ${fmt(median(cpu), 2)}, max ${fmt(Math.max(...cpu), 2)}, above 2: ${cpu.filter((c) => c > 2).length}; true error / estimate: max ${fmt(Math.max(...honesty), 2)} (must stay < 1)`,
);
