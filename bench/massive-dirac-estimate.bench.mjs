// The accumulation bound of one massive Dirac radial solve
// (packages/flux/src/massiveDirac.ts, SINGLE_SOLVE_CHARGE): the error of Γ
// (twice that of ln|A|) against tol-1e-14 solves, divided by steps × tol, over
// a ≤ 0.99, j ≤ 9/2, Mω 0.05–2.5, v = 0.05–0.995, both signs of κ, at
// tol 1e-10, 1e-11, 1e-12. The charge 2 must stay above the largest ratio.
// Run after `npm run build`: node bench/massive-dirac-estimate.bench.mjs
import { kerrHole } from '@penumbra/kerr';
import { solveMassiveDiracRadial } from '@penumbra/radial';
import { diracAngularEigenvalue } from '@penumbra/spheroidal';
import { fmt, table } from './lib.mjs';

const rows = [];
let worst = 0;
let solves = 0;
for (const a of [0, 0.5, 0.9, 0.99]) {
  for (const [j, m] of [
    [0.5, 0.5],
    [0.5, -0.5],
    [1.5, 1.5],
    [2.5, -1.5],
    [4.5, 4.5],
  ]) {
    for (const omega of [0.05, 0.3, 1, 2.5]) {
      for (const f of [0.1, 0.7, 0.99, 0.9987]) {
        for (const kappaSign of [1, -1]) {
          const mu = f * omega;
          const lambda = diracAngularEigenvalue({ j, m, aOmega: a * omega, aMu: a * mu, kappaSign }).lambda;
          const p = { hole: kerrHole({ a, mass: 1 }), omega, m, mu, lambda };
          const ref = solveMassiveDiracRadial(p, { tol: 1e-14 });
          for (const tol of [1e-10, 1e-11, 1e-12]) {
            const s = solveMassiveDiracRadial(p, { tol });
            solves++;
            const err = Math.abs(Math.expm1(2 * (s.logAbsIn - ref.logAbsIn)));
            const ratio = err / (s.diagnostics.steps * tol);
            if (err > 1e-13) worst = Math.max(worst, ratio);
            rows.push([a, j, m, omega, fmt(mu, 4), kappaSign, tol, s.diagnostics.steps, fmt(err), fmt(ratio)]);
          }
        }
      }
    }
  }
}
rows.sort((x, y) => Number(y[9]) - Number(x[9]));
console.log(table(['a', 'j', 'm', 'Mω', 'Mμ', 'κ sign', 'tol', 'steps', 'error of Γ', 'error/(steps·tol)'], rows.slice(0, 15)));
console.log(`${solves} solves: largest error of Γ/(steps × tol) ${fmt(worst)} (charged 2)`);
