// The Proca far zone carried inward in phase form (packages/regge-wheeler/src/proca/farPhase.ts)
// against the direct far start (the horizon solutions integrated out to where the asymptotic
// series converges), near threshold: right-hand-side evaluations, CPU time per integration
// (interleaved, best of 7 batches) and the difference of Γ, at step tolerance 1e-11, for one
// channel (odd, monopole) and for the two-channel even sector (all forced: the default carries only one
// channel, and only past the phase per interval of carryPays, printed as "phase").
// With PROCA_BASELINE=<another built checkout>, that checkout's phase form is timed too (interleaved).
// Run after `npm run build`: node bench/proca-far-phase.bench.mjs
import { defaultPhaseRadius, farZonePhase, integrateProca, sectorModel } from '@penumbra/regge-wheeler/internal';
import { fmt, leastCpuMsPerCall, table } from './lib.mjs';

const baselineDir = process.env.PROCA_BASELINE;
const baseline = baselineDir ? await import(`${baselineDir}/packages/regge-wheeler/dist/internal.js`) : undefined;

const rows = [];
for (const [sector, l, omega] of [
  ['monopole', 0, 0.3],
  ['odd', 1, 0.3],
  ['odd', 2, 0.8],
  ['odd', 3, 1.5],
  ['even', 1, 0.3],
  ['even', 3, 1.5],
]) {
  for (const v of [0.14, 0.05]) {
    const model = sectorModel(sector, l, omega, omega * Math.sqrt(1 - v * v));
    const controls = { startOffset: 0.09, stepTolerance: 1e-11 };
    const forced = { ...controls, phaseRadius: defaultPhaseRadius(model) };
    const direct = { ...controls, phaseRadius: false };
    const a = integrateProca(model, forced);
    const b = integrateProca(model, direct);
    const baseModel = baseline?.sectorModel(sector, l, omega, omega * Math.sqrt(1 - v * v));
    // warm the JIT on every route first (the collocation code is compiled late)
    for (let i = 0; i < 150; i++) {
      integrateProca(model, forced);
      integrateProca(model, direct);
      baseline?.integrateProca(baseModel, forced);
    }
    const [ta, tb] = [
      leastCpuMsPerCall(() => integrateProca(model, forced), 7, 30),
      leastCpuMsPerCall(() => integrateProca(model, direct), 7, 30),
    ];
    const tc = baseline ? leastCpuMsPerCall(() => baseline.integrateProca(baseModel, forced), 7, 30) : Number.NaN;
    rows.push([
      sector,
      l,
      omega,
      v,
      fmt(b.matchRadius, 4),
      fmt(a.matchRadius, 3),
      fmt(farZonePhase(model, a.matchRadius, b.matchRadius), 3),
      a.phaseSteps,
      `${b.rhsEvaluations}/${a.rhsEvaluations}`,
      fmt(tb, 3),
      fmt(ta, 3),
      fmt(ta / tb, 2),
      fmt(Math.abs(a.gammas[0] / b.gammas[0] - 1), 2),
      fmt(tc, 3),
      fmt(ta / tc, 2),
    ]);
  }
}
console.log(
  table(
    [
      'sector',
      'l',
      'Mω',
      'v',
      'far start',
      'inner match',
      'intervals',
      'RHS direct/phase',
      'ms direct',
      'ms phase',
      'phase/direct',
      '|ΔΓ|/Γ',
      'ms phase baseline',
      'phase/baseline',
    ],
    rows,
  ),
);
