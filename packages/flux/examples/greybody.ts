import { absorptionCrossSection, greybody, lowFrequencyGreybody } from '@penumbra/flux';

// A photon mode (s = 1, l = m = 1) of a hole with a = 0.9 M, at Mω = 0.3.
const photon = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.3 });
console.log(
  `photon: Γ = ${photon.gamma.toExponential(9)}, |Γ+R−1| = ${photon.residual.toExponential(1)}, error ≈ ${photon.relError.toExponential(1)}`,
);

// Inside the superradiant band ω < mΩ_H the wave is amplified: Γ < 0.
const graviton = greybody({ hole: { a: 0.99 }, mode: { field: { spin: 2 }, l: 2, m: 2 }, omega: 0.8 });
console.log(`graviton: amplification ${(100 * graviton.amplification).toFixed(3)} %, superradiant: ${graviton.superradiant}`);

// Deep in the low-frequency regime Γ ~ (Mω)^(2l+2) is still computed to full accuracy.
const tiny = greybody({ hole: { a: 0.5 }, mode: { field: { spin: 2 }, l: 3, m: 0 }, omega: 1e-3 });
const page = lowFrequencyGreybody({ hole: { a: 0.5 }, mode: { field: { spin: 2 }, l: 3, m: 0 }, omega: 1e-3 });
console.log(`s=2 l=3: Γ = ${tiny.gamma.toExponential(6)}, Page's formula ${page.toExponential(6)}`);

// σ(ω) of a scalar field at a = 0 approaches 27πM² at high frequency.
const sigma = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 2 }, { tol: 1e-6 });
console.log(`σ(Mω = 2) = ${(sigma.sigma / (27 * Math.PI)).toFixed(4)} × 27πM² (l ≤ ${sigma.diagnostics.lMax})`);
