import { invertTortoise, kerrHole, nearRegion, physicalBackground, tortoise } from '@penumbra/kerr';

// A hole with a = 0.9 M in geometric units (G = c = ħ = k_B = 1, M = 1).
const hole = kerrHole({ a: 0.9 });
console.log(`r+ = ${hole.rPlus.toFixed(6)}, Ω_H = ${hole.omegaH.toFixed(6)}, T_H = ${hole.temperature.toExponential(6)}`);

// Tortoise coordinate and its inverse, with the inversion's diagnostics.
const rStar = tortoise(hole, 10);
const back = invertTortoise(hole, rStar);
console.log(`r*(10) = ${rStar.toFixed(6)}, r(r*) = ${back.r} after ${back.iterations} Newton steps`);

// Near-region temperatures: the Cardy entropy equals A/4.
const near = nearRegion(hole);
console.log(`T_L = ${near.TL.toFixed(6)}, T_R = ${near.TR.toFixed(6)}, c = ${near.cL.toFixed(2)}`);

// The same hole at 1e15 g in physical units.
const physical = physicalBackground(hole, 1e15, 'g');
console.log(`T_H = ${(physical.temperatureGeV * 1e3).toFixed(3)} MeV = ${physical.temperatureK.toExponential(3)} K`);
