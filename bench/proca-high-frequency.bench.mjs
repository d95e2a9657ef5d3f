// Massive vector (Proca) on Schwarzschild: absorption cross-section per
// polarisation against the geometric-optics capture cross-section 27πM²
// (Misner, Thorne & Wheeler, Gravitation, 1973), for ω ≫ μ; and the cost of
// a Proca Γ against the massless Regge–Wheeler Γ of the same l and ω.
// σ_P = (π/k∞²) Σ_l (2l+1) Γ_{l,P}; the polarisation-averaged σ is
// (π/(3k∞²)) Σ_l (2l+1) Σ_P Γ_{l,P} (the monopole counts at l = 0).
// Run: node bench/proca-high-frequency.bench.mjs (after npx tsc -b).
import { procaGreybody, schwarzschildGreybody } from '../packages/regge-wheeler/dist/index.js';
import { integrateProca, sectorModel } from '../packages/regge-wheeler/dist/internal.js';

const MU = 0.1;
const capture = 27 * Math.PI;
for (const omega of [0.5, 1, 2, 3]) {
  const k2 = omega * omega - MU * MU;
  const lMax = Math.ceil(5.2 * omega + 12);
  const controls = { startOffset: 0.15, stepTolerance: 1e-10 };
  let odd = 0;
  let even1 = 0;
  let even2 = 0;
  const mono = integrateProca(sectorModel('monopole', 0, omega, MU), controls).gammas[0];
  for (let l = 1; l <= lMax; l++) {
    odd += (2 * l + 1) * integrateProca(sectorModel('odd', l, omega, MU), controls).gammas[0];
    const e = integrateProca(sectorModel('even', l, omega, MU), controls).gammas;
    even1 += (2 * l + 1) * e[0];
    even2 += (2 * l + 1) * e[1];
  }
  const f = Math.PI / k2;
  const avg = (f * (odd + even1 + even2 + mono)) / 3;
  console.log(
    `Mω = ${omega}, Mμ = ${MU}, l ≤ ${lMax}: σ/27πM² odd ${((f * odd) / capture).toFixed(4)}, even-1 ${((f * even1) / capture).toFixed(4)}, ` +
      `even-2 + monopole ${((f * (even2 + mono)) / capture).toFixed(4)}, polarisation average ${(avg / capture).toFixed(4)}`,
  );
}

// Cost: one Proca Γ (two integrations, tol 1e-8) against one massless Γ of the same l, ω.
for (const [l, omega] of [
  [1, 0.3],
  [3, 1],
]) {
  const time = (fn) => {
    const t0 = performance.now();
    for (let i = 0; i < 3; i++) fn();
    return (performance.now() - t0) / 3;
  };
  const massless = time(() => schwarzschildGreybody({ field: { spin: 1 }, l, omega }, { tol: 1e-8 }));
  for (const pol of ['odd', 'even-1']) {
    const t = time(() => procaGreybody({ field: { spin: 1, mass: MU }, l, omega, polarization: pol }, { tol: 1e-8 }));
    console.log(
      `cost l = ${l}, Mω = ${omega}, ${pol}: ${t.toFixed(0)} ms vs massless s = 1 ${massless.toFixed(0)} ms (ratio ${(t / massless).toFixed(2)})`,
    );
  }
}
