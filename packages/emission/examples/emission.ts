import {
  bundledPageTable,
  contentTotals,
  emissionTotals,
  evolutionTimeUnitSeconds,
  evolveHole,
  pageFunctions,
  toPhysicalRates,
} from '@penumbra/emission';

// Photon emission per degree of freedom from a Schwarzschild hole (M = 1, geometric units).
const photon = emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 1e-4 });
console.log(
  `photons (2 dof): dE/dt = ${(2 * photon.power.value).toExponential(4)} / M² ± ${photon.power.relError.toExponential(0)}`,
);

// All default species (photons, gravitons, three neutrino species) from a 1e15 g hole with a* = 0.5.
const all = contentTotals({ hole: { a: 0.5 } }, { tol: 1e-3 });
const watts = toPhysicalRates({ numberRate: all.numberRate.value, power: all.power.value, torque: all.torque.value }, 1e15, 'g');
console.log(`a* = 0.5, 1e15 g: P = ${watts.powerWatts.toExponential(3)} W, dJ/dt > 0: ${all.torque.value > 0}`);

// Lifetime of a 1e15 g hole born with a* = 0.9, from the shipped f(a*), g(a*) table.
const functions = pageFunctions({ table: bundledPageTable() });
const history = evolveHole({ functions, aStar0: 0.9 }, { aStarThresholds: [0.1] });
const seconds = history.lifetime * evolutionTimeUnitSeconds(1e15, 'g');
console.log(
  `lifetime ${seconds.toExponential(3)} s; a* < 0.1 after ${(history.crossings[0].time / history.lifetime).toFixed(3)} of it`,
);
