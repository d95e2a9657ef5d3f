import { compareNearRegion, nearRegionForm } from '@penumbra/near-region';

// A photon mode l = m = 1 of a hole with a = 0.5 M at Mω = 1e-3 (geometric units, M = 1).
const mode = { field: { spin: 1 }, l: 1, m: 1 };
const c = compareNearRegion({ hole: { a: 0.5 }, mode, omega: 1e-3 });
console.log(`T_L = ${c.TL.toFixed(6)}, T_R = ${c.TR.toFixed(6)}, c_L = c_R = ${c.cL}, (h_L, h_R) = (${c.hL}, ${c.hR})`);
console.log(`Γ_near = ${c.gammaNearRegion.toExponential(4)}, Γ = ${c.gamma.toExponential(4)}, ratio = ${c.ratio.toFixed(4)}`);

// The form alone (no solve) reaches where the solver does not: a = 0.99999 M.
const near = nearRegionForm({ hole: { a: 0.99999 }, mode, omega: 0.6 });
console.log(
  `a = 0.99999: T_R = ${near.TR.toExponential(3)}, Cardy entropy / (A/4) = ${(near.cardyEntropy / near.entropy).toFixed(12)}`,
);
