// Standard-Model totals of one hole (contentTotals, packages/emission/src/content.ts): CPU seconds per
// (M, a*) against the 10 s target, the relative error reached, and how the power and number rate move
// when the confinement scale (default 0.3 GeV, common practice, no source) is halved or doubled.
// CPU time is process CPU (immune to preemption on a shared machine; a loaded machine still inflates it
// through shared caches and cores). The whole bench takes a few minutes. Run after `npm run build`:
//   node bench/content.bench.mjs [TOL]
import { contentTotals, DEFAULT_CONFINEMENT_SCALE_GEV } from '@penumbra/emission';
import os from 'node:os';
import { fmt, table, writeResult } from './lib.mjs';

const tol = Number(process.argv[2] ?? 1e-3);
const cpu = (fn) => {
  const c0 = process.cpuUsage();
  const r = fn();
  const c = process.cpuUsage(c0);
  return { r, s: (c.user + c.system) / 1e6 };
};
const sm = (value, a, confinementScaleGeV = DEFAULT_CONFINEMENT_SCALE_GEV) =>
  contentTotals({ hole: { a }, content: ['standard-model'], physicalMass: { value, unit: 'g' } }, { tol, confinementScaleGeV });

const speed = [];
for (const [M, a] of [
  [1e15, 0],
  [1e13, 0],
  [1e11, 0],
  [1e15, 0.5],
  [1e13, 0.5],
]) {
  const { r, s } = cpu(() => sm(M, a));
  speed.push([
    M,
    a,
    fmt(r.diagnostics.temperatureGeV),
    fmt(r.power.value),
    fmt(r.power.relError),
    r.diagnostics.gammaCalls,
    s.toFixed(1),
    fmt(s / 10),
  ]);
}
console.log(`SM totals, tol ${tol}: CPU seconds against the 10 s target (load average ${os.loadavg()[0].toFixed(1)})`);
console.log(table(['M [g]', 'a*', 'T_H [GeV]', 'power [1/M²]', 'relError', 'Γ solves', 'cpu s', 'cpu/10 s'], speed));

const scale = [];
// holes whose temperature is near the default scale, where the rule matters
for (const M of [1e13, 2e13, 4e13, 7e13, 1e14]) {
  const base = sm(M, 0);
  const half = sm(M, 0, DEFAULT_CONFINEMENT_SCALE_GEV / 2);
  const twice = sm(M, 0, DEFAULT_CONFINEMENT_SCALE_GEV * 2);
  scale.push([
    M,
    fmt(base.diagnostics.temperatureGeV),
    fmt(half.power.value / base.power.value),
    fmt(twice.power.value / base.power.value),
    fmt(half.numberRate.value / base.numberRate.value),
    fmt(twice.numberRate.value / base.numberRate.value),
  ]);
}
console.log(`Confinement scale ${DEFAULT_CONFINEMENT_SCALE_GEV} GeV halved and doubled (a* = 0): ratios to the default`);
console.log(table(['M [g]', 'T_H [GeV]', 'P(Λ/2)/P', 'P(2Λ)/P', 'N(Λ/2)/N', 'N(2Λ)/N'], scale));
writeResult('content', {
  tol,
  loadAverage: os.loadavg()[0],
  speedColumns: ['M [g]', 'a*', 'T_H [GeV]', 'power [1/M²]', 'relError', 'Γ solves', 'cpu s', 'cpu/10 s'],
  speed,
  scaleColumns: ['M [g]', 'T_H [GeV]', 'P(Λ/2)/P', 'P(2Λ)/P', 'N(Λ/2)/N', 'N(2Λ)/N'],
  scale,
});
