// The accumulation bound of one Proca integration by the extrapolation loop
// (packages/regge-wheeler/src/proca/greybody.ts, SINGLE_SOLVE_CHARGE): the
// error of Γ against tol-1e-12 Cash–Karp solves, divided by the charged steps
// (chargedSteps: at least 40) × step tolerance, from the start the solve
// takes (singleStartOffset), over 84 modes (every sector, l ≤ 6, Mω 0.1–3, v = 0.05–0.995) at
// step tolerances 1e-10, 1e-11, 1e-12. The charge must stay above the largest
// ratio printed. Run after `npm run build`: node bench/proca-estimate.bench.mjs
import { procaGreybody } from '@penumbra/regge-wheeler';
import { chargedSteps, integrateProca, sectorModel, singleStartOffset } from '@penumbra/regge-wheeler/internal';
import { fmt, table } from './lib.mjs';

const modes = [];
for (const [l, omega] of [
  [0, 0.1],
  [0, 0.3],
  [0, 1.2],
  [1, 0.3],
  [1, 0.8],
  [2, 0.5],
  [2, 1.5],
  [4, 1],
  [6, 3],
]) {
  for (const f of [0.1, 0.6, 0.95, 0.9987]) {
    for (const pol of l === 0 ? ['monopole'] : ['odd', 'even-1', 'even-2']) modes.push([pol, l, omega, f * omega]);
  }
}
let worst = 0;
let fallbacks = 0;
const rows = [];
for (const [pol, l, omega, mu] of modes) {
  // reference: Cash–Karp at tol 1e-12, or 1e-11 where 1e-12 is out of its reach (then only errors above 1e-11 count)
  const problem = { field: { spin: 1, mass: mu }, l, omega, polarization: pol };
  let ref;
  let floor = 1e-12;
  try {
    ref = procaGreybody(problem, { tol: 1e-12, integrator: 'cash-karp' });
  } catch {
    ref = procaGreybody(problem, { tol: 1e-11, integrator: 'cash-karp' });
    floor = 1e-11;
    fallbacks++;
  }
  const sector = pol === 'odd' ? 'odd' : pol === 'monopole' ? 'monopole' : 'even';
  const index = pol === 'even-2' ? 1 : 0;
  for (const s of [1e-10, 1e-11, 1e-12]) {
    const model = sectorModel(sector, l, omega, mu);
    const r = integrateProca(model, { startOffset: singleStartOffset(model), stepTolerance: s });
    const err = Math.abs(r.gammas[index] / ref.gamma - 1);
    const ratio = err / (chargedSteps(r.steps) * s);
    // below the floor the reference's own error dominates
    if (err > floor) worst = Math.max(worst, ratio);
    rows.push([pol, l, omega, fmt(mu, 4), s, r.steps, r.rhsEvaluations, fmt(err), fmt(ratio)]);
  }
}
rows.sort((x, y) => Number(y[8]) - Number(x[8]));
console.log(
  table(['pol', 'l', 'Mω', 'Mμ', 'step tol', 'steps', 'RHS', 'error of Γ', 'error/(charged steps·tol)'], rows.slice(0, 15)),
);
console.log(
  `${modes.length} modes × 3 step tolerances (${fallbacks} references at tol 1e-11): largest error/(charged steps × step tolerance) ${fmt(worst)} (charged 3)`,
);
