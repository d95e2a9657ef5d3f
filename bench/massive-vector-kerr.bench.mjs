// The massive vector on a spinning hole (packages/emission/src/massiveModes.ts): its approximation
// [2·Γ(massless s = 1, Kerr) + Γ(massive scalar, Kerr)]/3 times the Schwarzschild Proca ratio.
// Measures, for the per-dof power and number rate:
//  - at a = 0, the mass correction the ratio carries: exact Proca / (2·photon + massive scalar)/3 − 1
//    (the approximation's error is bounded by this correction if its a-dependence is no larger
//    than the correction itself: the stated bound);
//  - for a* = 0.1 and 0.3, the same quotient for the approximation, approx / (2·photon + scalar)/3 − 1,
//    i.e. how the ratio's effect varies with a.
// Prints CPU seconds per solve. Run after `npm run build`: node bench/massive-vector-kerr.bench.mjs [TOL]
import { writeFileSync } from 'node:fs';
import { emissionTotals } from '@penumbra/emission';
import { benchDir, fmt, table, today } from './lib.mjs';

const tol = Number(process.argv[2] ?? 1e-3);
const cpu = (fn) => {
  const c0 = process.cpuUsage();
  const r = fn();
  const c = process.cpuUsage(c0);
  return { r, s: (c.user + c.system) / 1e6 };
};
const rows = [];
for (const mu of [0.05, 0.2]) {
  for (const a of [0, 0.1, 0.3]) {
    const photon = emissionTotals({ hole: { a }, field: { spin: 1 } }, { tol });
    const scalar = emissionTotals({ hole: { a }, field: { spin: 0, mass: mu } }, { tol });
    const { r, s } = cpu(() => emissionTotals({ hole: { a }, field: { spin: 1, mass: mu } }, { tol }));
    const comboP = (2 * photon.power.value + scalar.power.value) / 3;
    const comboN = (2 * photon.numberRate.value + scalar.numberRate.value) / 3;
    rows.push([
      mu,
      a,
      a === 0 ? 'exact Proca' : 'approximation',
      fmt(r.power.value / comboP - 1),
      fmt(r.numberRate.value / comboN - 1),
      fmt(r.power.relError),
      s.toFixed(1),
    ]);
  }
}
console.log(`massive vector per dof against (2·photon + massive scalar)/3, tol ${tol}`);
console.log(table(['Mμ', 'a*', 'Γ', 'P/Pcombo − 1', 'N/Ncombo − 1', 'relError', 'cpu s'], rows));
// the second measurement of the day is tagged 'b' so the first stays for comparison
writeFileSync(`${benchDir}/results/massive-vector-kerr-${today()}b.json`, `${JSON.stringify({ tol, rows }, null, 1)}\n`);
