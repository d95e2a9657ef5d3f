// The massless limit of the massive per-dof totals (packages/emission/src/speciesBounds.ts):
// |totals(Mμ) − totals(0)|/totals(0) for spins 0, 1/2, 1 (spin 1 against (2 × photon + 1 × scalar)/3,
// the μ → 0 limit of the Proca field) at a = 0 and 0.5 (spin 1 at a = 0 only: exact Proca), for the
// number rate and the power, against the bound masslessProxyBound(Mμ) = Mμ + 200 (Mμ)². Prints the
// ratio difference/bound (must stay below 1) and CPU seconds per solve. Run after `npm run build`:
//   node bench/massless-limit.bench.mjs
import { emissionTotals } from '@penumbra/emission';
import { masslessProxyBound } from '@penumbra/emission/internal';
import { fmt, table, writeResult } from './lib.mjs';

const TOL = 1e-5;
const cpu = (fn) => {
  const c0 = process.cpuUsage();
  const r = fn();
  const c = process.cpuUsage(c0);
  return { r, s: (c.user + c.system) / 1e6 };
};
const rows = [];
let worst = 0;
for (const [spin, a] of [
  [0, 0],
  [0, 0.5],
  [0.5, 0],
  [0.5, 0.5],
  [1, 0],
]) {
  const base =
    spin === 1
      ? (() => {
          const t = emissionTotals({ hole: { a }, field: { spin: 1 } }, { tol: TOL });
          const s = emissionTotals({ hole: { a }, field: { spin: 0 } }, { tol: TOL });
          return { n: (2 * t.numberRate.value + s.numberRate.value) / 3, p: (2 * t.power.value + s.power.value) / 3 };
        })()
      : (() => {
          const t = emissionTotals({ hole: { a }, field: { spin } }, { tol: TOL });
          return { n: t.numberRate.value, p: t.power.value };
        })();
  for (const mu of [1e-4, 1e-3, 1e-2, 0.05]) {
    const { r, s } = cpu(() => emissionTotals({ hole: { a }, field: { spin, mass: mu } }, { tol: TOL }));
    const dn = Math.abs(r.numberRate.value / base.n - 1);
    const dp = Math.abs(r.power.value / base.p - 1);
    const b = masslessProxyBound(mu);
    worst = Math.max(worst, dn / b, dp / b);
    rows.push([spin, a, mu, fmt(dn), fmt(dp), fmt(b), fmt(Math.max(dn, dp) / b), s.toFixed(1)]);
  }
}
console.log(table(['spin', 'a*', 'Mμ', '|ΔN|/N', '|ΔP|/P', 'bound', 'worst/bound', 'cpu s'], rows));
console.log(`worst difference/bound: ${fmt(worst)} (must be < 1)`);
writeResult('massless-limit', { tol: TOL, rows, worst });
