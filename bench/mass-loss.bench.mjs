// f(M, a*), g(M, a*) with massive species, and the evaporation they drive.
// Run after building:  npx tsc -b && node bench/mass-loss.bench.mjs [--skip-direct] [--tol 1e-3]
// Prints:
//  (1) the regeneration time of the shipped tables (written into the modules by
//      their scripts) against the one-hour budget on two cores, as a ratio;
//  (2) the tabulated f of one dof of each massive spin against massLossAt (direct
//      emissionTotals) at off-grid (Mμ, a*), with the stated error, as ratios;
//  (3) f(M) of the Standard Model at a* = 0 in MacGibbon's normalisation
//      (Phys. Rev. D 44, 376 (1991), from memory: dM/dt = −5.34e25 f (M/g)⁻² g/s);
//  (4) the mass whose lifetime is the age of the universe (a* = 0) against
//      about 5e14 g (Carr, Kohri, Sendouda & Yokoyama, Phys. Rev. D 81, 104019 (2010), from memory),
//      the lifetime and final stage of a 1e15 g hole with a* = 0.5, and the time of one SM f at one (M, a*) on demand.
// Results: bench/results/mass-loss-<date>.json.
import os from 'node:os';
import {
  FIELD_MASS_PER_GRAM_GEV,
  bundledMassiveRateTable,
  evaporateHole,
  massForLifetime,
  massLossAt,
  massLossRates,
  resolveContent,
} from '@penumbra/emission';
import { SHIPPED_MASSIVE_RATE_TABLE, SHIPPED_PAGE_TABLE } from '@penumbra/emission/internal';
import { CODATA2018 } from '@penumbra/kerr';
import { writeResult } from './lib.mjs';

const args = process.argv.slice(2);
const opt = (name, dflt) => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : dflt;
};
const tol = Number(opt('--tol', 1e-3));
const out = { machine: `${os.cpus()[0]?.model ?? '?'} × ${os.cpus().length}, load ${os.loadavg()[0].toFixed(1)}` };
console.log(`machine: ${out.machine}`);

// (1) regeneration time
const ratio = SHIPPED_MASSIVE_RATE_TABLE;
const regen = ratio.seconds + SHIPPED_PAGE_TABLE.seconds;
out.regeneration = {
  massiveSeconds: ratio.seconds,
  pageSeconds: SHIPPED_PAGE_TABLE.seconds,
  grid: `${ratio.fieldMass.length} Mμ × ${ratio.aStar.length} a* × ${ratio.spins.length} spins, tol ${ratio.tol}`,
  ratioToHour: regen / 3600,
};
console.log(
  `(1) tables regenerated in ${ratio.seconds.toFixed(0)} s (massive ratios, ${out.regeneration.grid}) + ${SHIPPED_PAGE_TABLE.seconds.toFixed(0)} s (Page table) = ${(regen / 3600).toFixed(2)} × the one-hour budget (two workers; load at generation not recorded)`,
);

// (2) off-grid accuracy of the tables against direct solves, one dof of each massive spin
const table = bundledMassiveRateTable();
const mids = (xs) => xs.slice(0, -1).map((x, i) => 0.5 * (x + xs[i + 1]));
const muProbe = [mids(table.fieldMass)[1], mids(table.fieldMass)[4], mids(table.fieldMass)[7]];
const aProbe = [mids(table.aStar)[1], mids(table.aStar)[3]];
out.offGrid = [];
if (!args.includes('--skip-direct')) {
  console.log('(2) tabulated f against massLossAt (one dof, M = 1 g, massGeV = Mμ/FIELD_MASS_PER_GRAM_GEV):');
  for (const spin of [0, 0.5, 1])
    for (const mu of muProbe)
      for (const a of aProbe) {
        const species = [{ name: `s${spin}`, spin, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
        const rates = massLossRates({ species });
        const t0 = performance.now();
        const direct = massLossAt({ species, massGrams: 1, aStar: a }, { tol });
        const ms = performance.now() - t0;
        const tab = rates.at(1, a);
        const errF = Math.abs(tab.f / direct.f - 1);
        const errG = Math.abs(tab.g / direct.g - 1);
        const statedF = rates.interpolationError.f + rates.nodeError.f + direct.fRelError;
        const statedG = rates.interpolationError.g + rates.nodeError.g + direct.gRelError;
        out.offGrid.push({ spin, mu, a, errF, statedF, errG, statedG, ms });
        console.log(
          `   spin ${spin} Mμ ${mu.toFixed(4)} a* ${a.toFixed(3)}: |Δf|/f ${errF.toExponential(1)} (stated ${statedF.toExponential(1)}, ratio ${(errF / statedF).toFixed(2)}), |Δg|/g ${errG.toExponential(1)} (stated ${statedG.toExponential(1)}, ratio ${(errG / statedG).toFixed(2)}), direct ${(ms / 1000).toFixed(1)} s`,
        );
      }
}

// (3) MacGibbon's normalisation
const sm = resolveContent(['standard-model']);
const smRates = massLossRates({ species: sm });
const { G, hbar, c } = CODATA2018;
const gramsCubedPerSecond = ((hbar * c ** 4) / G ** 2) * 1e9;
const toMacGibbon = (f) => (f * gramsCubedPerSecond) / 5.34e25;
out.macGibbon = [];
console.log('(3) f(M) of the Standard Model at a* = 0 in MacGibbon normalisation (f = 1: photons, gravitons, 3 ν):');
for (let e = 8; e <= 20; e += 0.5) {
  const M = 10 ** e;
  const f = smRates.f(M, 0);
  const T = 1 / (8 * Math.PI * M * FIELD_MASS_PER_GRAM_GEV);
  out.macGibbon.push({ massGrams: M, temperatureGeV: T, f: toMacGibbon(f) });
  console.log(`   M = 1e${e.toFixed(1)} g  T_H = ${T.toExponential(2)} GeV  f = ${toMacGibbon(f).toFixed(3)}`);
}

// (4) age of the universe, a 1e15 g history, on-demand speed
const age = massForLifetime({ rates: smRates });
out.ageMass = { massGrams: age.massGrams, ratioTo5e14: age.massGrams / 5e14, relError: age.relError };
console.log(
  `(4) mass with lifetime 13.787 Gyr, a* = 0: ${age.massGrams.toExponential(4)} g (${(age.massGrams / 5e14).toFixed(3)} × 5e14 g)`,
);
const ev = evaporateHole({ rates: smRates, mass: 1e15, unit: 'g', aStar0: 0.5 }, { finalSeconds: [1] });
out.history = {
  lifetimeSeconds: ev.lifetimeSeconds,
  relError: ev.diagnostics.errorEstimate,
  energyBalance: ev.energyBalance.relError,
  final1s: { massGrams: ev.finalStages[0].massGrams, energyGeV: ev.finalStages[0].energyGeV },
};
console.log(
  `    1e15 g, a* = 0.5: lifetime ${ev.lifetimeSeconds.toExponential(4)} s (rel. error ${ev.diagnostics.errorEstimate.toExponential(1)}), energy balance ${ev.energyBalance.relError.toExponential(1)}, last 1 s: ${ev.finalStages[0].massGrams.toExponential(3)} g = ${ev.finalStages[0].energyGeV.toExponential(3)} GeV`,
);
if (!args.includes('--skip-direct')) {
  const t0 = performance.now();
  const d = massLossAt({ species: sm, massGrams: 1e15, aStar: 0.5 }, { tol });
  const s = (performance.now() - t0) / 1000;
  const tab = smRates.at(1e15, 0.5);
  out.onDemand = { seconds: s, solves: d.diagnostics.solves, fTable: tab.f, fDirect: d.f };
  console.log(
    `    on demand, SM at 1e15 g, a* = 0.5, tol ${tol}: ${s.toFixed(1)} s for ${d.diagnostics.solves} totals solves (${(s / 10).toFixed(2)} × the 10 s budget); table/direct f = ${(tab.f / d.f).toFixed(5)}`,
  );
}
writeResult('mass-loss', out);
