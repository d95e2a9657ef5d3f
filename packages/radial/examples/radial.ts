import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';

// The s = 2 radial equation of a hole with a = 0.9 M, for m = 2, Mω = 0.5 and
// a given separation constant λ (from @penumbra/spheroidal in real use).
const hole = kerrHole({ a: 0.9 });
const problem = { hole, s: 2, m: 2, omega: 0.5, lambda: -1.5 };

// Two-sided route: −s field from the horizon, Teukolsky–Starobinsky map, +s field outward.
const two = solveTwoSided(problem, { tol: 1e-12 });
const { rhsEvaluations, errorEstimate } = two.diagnostics;
console.log(
  `two-sided: ln|Z_in| = ${two.logAbsZInPlus.toFixed(10)} (${rhsEvaluations} evaluations, relative error ≤ ${errorEstimate.toExponential(1)})`,
);

// One-sided shooting of the +s field, with the solution sampled on a grid of radii.
const one = solveRadial(problem, { tol: 1e-12, grid: [3, 10] });
console.log(
  `one-sided: ln|Z_in| = ${one.logAbsZIn.toFixed(10)}; R(10M) = ${one.samples[1].R.re.toExponential(4)} + ${one.samples[1].R.im.toExponential(4)}i`,
);
