// The phase-form carry of the Proca far solutions alone (carryFarSolutions,
// packages/regge-wheeler/src/proca/farPhase.ts), even sector (two channels) near threshold:
// CPU time per carry of this build against a baseline build (PROCA_BASELINE, default /tmp/base-e7f),
// interleaved batches of 5 ms, best of 40 each, on the same inputs: the far start radius and step tolerance of the
// default route (singleExtrapolationSolve at tol 1e-10), the series solutions there, carried in to the
// default phase radius with the default slack. Prints the ratio and the largest relative difference of the
// carried solutions (each entry against the largest entry of its column); then Γ of even-1 and even-2
// (procaGreybody, default options) of both builds and their relative difference.
// Run after `npm run build`: node bench/proca-carry.bench.mjs
import { fmt, leastCpuMsPerCall, table } from './lib.mjs';

const here = new URL('../packages/regge-wheeler/dist/proca/', import.meta.url).pathname;
const baseDir = `${process.env.PROCA_BASELINE ?? '/tmp/base-e7f'}/packages/regge-wheeler/dist/proca/`;
const load = async (dir) => ({
  ...(await import(`${dir}farPhase.js`)),
  ...(await import(`${dir}sectors.js`)),
  ...(await import(`${dir}series.js`)),
  ...(await import(`${dir}integrate.js`)),
  ...(await import(`${dir}greybody.js`)),
});
const builds = [await load(here), await load(baseDir)];
const greybodies = [
  await import(new URL('../packages/regge-wheeler/dist/proca/greybody.js', import.meta.url).pathname),
  await import(`${baseDir}greybody.js`),
];

const setup = (lib, l, omega, mu) => {
  const model = lib.sectorModel('even', l, omega, mu);
  const solve = lib.singleExtrapolationSolve(model, 1e-10, lib.procaSpan(model));
  const stepTol = solve.stepTolerance;
  const rStart = solve.fine.farStartRadius;
  const target = lib.farTruncation(stepTol);
  const far = [0, 1].map((c) => lib.outgoingFarSolution(model, c, rStart, target));
  const rEnd = lib.defaultPhaseRadius(model);
  const run = () => lib.carryFarSolutions(model, far, rStart, rEnd, stepTol, [], lib.PHASE_SLACK);
  return { run, stepTol, rStart, rEnd };
};

/** Near-threshold even-sector modes (l, Mω, Mμ) of the carry timing and the Γ comparison. */
const MODES = [
  [1, 0.3, 0.2996],
  [2, 0.8, 0.799],
  [2, 0.8, 0.792],
  [3, 1.5, 1.498],
  [3, 1.5, 1.485],
];

const rows = [];
for (const [l, omega, mu] of MODES) {
  const [a, b] = builds.map((lib) => setup(lib, l, omega, mu));
  const ca = a.run();
  const cb = b.run();
  let diff = 0;
  for (let col = 0; col < 2; col++) {
    const entries = (c) => [...c.far[col].u, ...c.far[col].p];
    const ea = entries(ca);
    const eb = entries(cb);
    const scale = Math.max(...eb.map((z) => Math.hypot(z[0], z[1])));
    for (let i = 0; i < ea.length; i++) diff = Math.max(diff, Math.hypot(ea[i][0] - eb[i][0], ea[i][1] - eb[i][1]) / scale);
  }
  for (let i = 0; i < 300; i++) {
    a.run();
    b.run();
  }
  let ta = Infinity;
  let tb = Infinity;
  for (let round = 0; round < 40; round++) {
    ta = Math.min(ta, leastCpuMsPerCall(a.run, 1, 5));
    tb = Math.min(tb, leastCpuMsPerCall(b.run, 1, 5));
  }
  const v = Math.sqrt(1 - (mu / omega) ** 2);
  rows.push([
    l,
    omega,
    mu,
    fmt(v, 3),
    fmt(a.stepTol, 2),
    fmt(a.rStart, 4),
    fmt(ca.endRadius, 4),
    `${ca.steps}/${cb.steps}`,
    fmt(ta * 1000, 3),
    fmt(tb * 1000, 3),
    fmt(tb / ta, 3),
    fmt(diff, 2),
  ]);
}
console.log(
  table(
    ['l', 'Mω', 'Mμ', 'v', 'step tol', 'r start', 'r end', 'intervals new/base', 'µs new', 'µs base', 'base/new', 'max rel diff'],
    rows,
  ),
);

const gammaRows = [];
for (const [l, omega, mu] of MODES) {
  for (const polarization of ['even-1', 'even-2']) {
    const problem = { field: { spin: 1, mass: mu }, l, omega, polarization };
    const [a, b] = greybodies.map((g) => g.procaGreybody(problem).gamma);
    gammaRows.push([
      l,
      omega,
      mu,
      polarization,
      'default',
      a.toExponential(12),
      b.toExponential(12),
      fmt(Math.abs(a / b - 1), 2),
    ]);
  }
  // one integration with the carry forced to the default phase radius (step tolerance 1e-11)
  const [fa, fb] = builds.map((lib) => {
    const model = lib.sectorModel('even', l, omega, mu);
    const controls = {
      startOffset: lib.singleStartOffset(model),
      stepTolerance: 1e-11,
      phaseRadius: lib.defaultPhaseRadius(model),
    };
    return lib.integrateProca(model, controls).gammas;
  });
  for (let i = 0; i < 2; i++) {
    gammaRows.push([
      l,
      omega,
      mu,
      `even-${i + 1}`,
      'carry forced',
      fa[i].toExponential(12),
      fb[i].toExponential(12),
      fmt(Math.abs(fa[i] / fb[i] - 1), 2),
    ]);
  }
}
console.log();
console.log(table(['l', 'Mω', 'Mμ', 'polarisation', 'route', 'Γ new', 'Γ base', '|ΔΓ|/Γ'], gammaRows));
