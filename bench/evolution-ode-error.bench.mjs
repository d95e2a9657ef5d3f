// The ODE part of the lifetime's error estimate (packages/emission/src/odeError.ts).
//
// evolveHole with the shipped massless table, for the default content and for
// photons, gravitons, neutrinos and a scalar alone, a* from 0 to 0.99 in steps
// of 0.011, at odeTol 1e-8 … 1e-4, against the same run at odeTol 1e-11
// (1e-10 where that refuses): the largest true error / odeTol, true error /
// (halvedTolChange + odeTol) and true error / odeError (the bound used, which
// must stay below 1). Errors below 3e-9 are skipped: the reference is good to
// about 1e-9 there. Also the whole errorEstimate (odeError + tableError)
// against the reference: it must exceed the true error everywhere.
//
// Run: npx tsc -b && node bench/evolution-ode-error.bench.mjs [--quick]
import { bundledPageTable, evolveHole, pageFunctions } from '@penumbra/emission';
import { fmt, table, writeResult } from './lib.mjs';

const quick = process.argv.includes('--quick');
const step = quick ? 0.033 : 0.011;
const tols = [1e-8, 1e-7, 1e-6, 1e-5, 1e-4];
const contents = [undefined, ['photon'], ['graviton'], ['neutrino-e'], ['scalar']];
const shipped = bundledPageTable();
const worst = { perTol: [0, ''], perChange: [0, ''], perBound: [0, ''], perEstimate: [0, ''] };
let cases = 0;
for (const content of contents) {
  const fns = pageFunctions({ table: shipped, content });
  for (let a = 0; a <= 0.99; a += step) {
    let ref;
    try {
      ref = evolveHole({ functions: fns, aStar0: a }, { odeTol: 1e-11 });
    } catch {
      ref = evolveHole({ functions: fns, aStar0: a }, { odeTol: 1e-10 });
    }
    for (const odeTol of tols) {
      const ev = evolveHole({ functions: fns, aStar0: a }, { odeTol });
      const err = Math.abs(ev.lifetime / ref.lifetime - 1);
      const d = ev.diagnostics;
      const where = `${content ? content.join('+') : 'default'}, a* = ${a.toFixed(3)}, odeTol ${odeTol}`;
      const note = (key, r) => {
        if (r > worst[key][0]) worst[key] = [r, where];
      };
      note('perEstimate', err / d.errorEstimate);
      if (err < 3e-9) continue;
      cases++;
      note('perTol', err / odeTol);
      note('perChange', err / (d.halvedTolChange + odeTol));
      note('perBound', err / d.odeError);
    }
  }
}
console.log(`evolveHole lifetime, reported run against odeTol 1e-11, ${cases} cases with a true error ≥ 3e-9`);
console.log(
  table(
    ['ratio', 'largest', 'where'],
    [
      ['true error / odeTol', fmt(worst.perTol[0]), worst.perTol[1]],
      ['true error / (halvedTolChange + odeTol)', fmt(worst.perChange[0]), worst.perChange[1]],
      ['true error / odeError (bound, < 1 wanted)', fmt(worst.perBound[0]), worst.perBound[1]],
      ['true error / errorEstimate (< 1 wanted)', fmt(worst.perEstimate[0]), worst.perEstimate[1]],
    ],
  ),
);
writeResult('evolution-ode-error', { step, tols, cases, worst });
