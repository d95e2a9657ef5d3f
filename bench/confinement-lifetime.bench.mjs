// How the evaporation moves with the confinement scale Λ (common practice, no
// source; default 0.3 GeV): the lifetime of Standard-Model holes (a* = 0) at
// Λ/2, Λ and 2Λ, as ratios to the default, with each lifetime's error
// estimate; the mass released in the last second; and the mass whose lifetime
// is the age of the universe. The totals at one (M, a*): bench/content.bench.mjs.
//
// Run: npx tsc -b && node bench/confinement-lifetime.bench.mjs
import { DEFAULT_CONFINEMENT_SCALE_GEV, evaporateHole, massForLifetime, massLossRates, resolveContent } from '@penumbra/emission';
import { fmt, table, writeResult } from './lib.mjs';

const species = resolveContent(['standard-model']);
const scales = [DEFAULT_CONFINEMENT_SCALE_GEV / 2, DEFAULT_CONFINEMENT_SCALE_GEV, DEFAULT_CONFINEMENT_SCALE_GEV * 2];
const rates = scales.map((confinementScaleGeV) => massLossRates({ species, confinementScaleGeV }));
const rows = [];
const out = [];
for (const mass of [1e13, 1e14, 1e15]) {
  const runs = rates.map((r) => evaporateHole({ rates: r, mass, unit: 'g', aStar0: 0 }, { finalSeconds: [1] }));
  const base = runs[1];
  for (const [i, ev] of runs.entries()) {
    const last = ev.finalStages[0];
    rows.push([
      fmt(mass),
      fmt(scales[i]),
      ev.lifetimeSeconds.toExponential(3),
      fmt(ev.lifetimeSeconds / base.lifetimeSeconds, 3),
      fmt(ev.diagnostics.errorEstimate),
      last.massGrams.toExponential(4),
      fmt(last.massGrams / base.finalStages[0].massGrams, 6),
    ]);
    out.push({
      mass,
      scale: scales[i],
      lifetimeSeconds: ev.lifetimeSeconds,
      relError: ev.diagnostics.errorEstimate,
      lastSecondGrams: last.massGrams,
    });
  }
}
console.log('Standard-Model lifetime (a* = 0) with the confinement scale halved and doubled: ratio to the default');
console.log(table(['M₀ [g]', 'Λ [GeV]', 'lifetime [s]', '/ default', 'rel. error', 'last 1 s [g]', '/ default'], rows));
const age = rates.map((r) => massForLifetime({ rates: r }));
console.log('mass whose lifetime is the age of the universe (a* = 0)');
console.log(
  table(
    ['Λ [GeV]', 'mass [g]', '/ default', 'rel. error'],
    age.map((a, i) => [fmt(scales[i]), a.massGrams.toExponential(4), fmt(a.massGrams / age[1].massGrams, 4), fmt(a.relError)]),
  ),
);
writeResult('confinement-lifetime', {
  scales,
  lifetimes: out,
  ageMass: age.map((a, i) => ({ scale: scales[i], massGrams: a.massGrams, relError: a.relError })),
});
