import { describe, expect, it } from 'vitest';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { pageLowFrequencyGamma } from './page-formula.js';

// (spin, l) pairs with Γ ≥ 1e-30 at Mω = 1e-4 and 1e-3.
const MODES: Array<[number, number]> = [
  [0, 0],
  [0, 1],
  [0, 2],
  [0.5, 0.5],
  [0.5, 1.5],
  [1, 1],
  [1, 2],
  [2, 2],
];

describe('low-frequency limit: Page, Phys. Rev. D 13, 198 (1976) / Starobinsky & Churilov (1974) formula from physics.md', () => {
  for (const [spin, l] of MODES) {
    it(`s = ${spin}, l = ${l}: ratio numerical/formula − 1 is below 8·Mω at Mω = 1e-3 and 1e-4 and shrinks about tenfold between them`, () => {
      const deviations = [1e-3, 1e-4].map((Momega) => {
        const { gamma } = schwarzschildGreybody({ field: { spin }, l, omega: Momega });
        return gamma / pageLowFrequencyGamma(spin, l, Momega) - 1;
      });
      const [atMilli, atTenthMilli] = deviations;
      expect(Math.abs(atMilli)).toBeLessThan(8 * 1e-3);
      expect(Math.abs(atTenthMilli)).toBeLessThan(8 * 1e-4);
      // Linear approach to the limit: the deviation scales with Mω.
      expect(Math.abs(atMilli / atTenthMilli)).toBeGreaterThan(8);
      expect(Math.abs(atMilli / atTenthMilli)).toBeLessThan(12);
    });
  }

  it('the first correction is 1 + 2πMω (Sommerfeld factor of the long-range tail, physics.md): slope (ratio − 1)/Mω = 2π to 1% at Mω = 1e-4', () => {
    for (const [spin, l] of MODES) {
      const Momega = 1e-4;
      const { gamma } = schwarzschildGreybody({ field: { spin }, l, omega: Momega });
      const slope = (gamma / pageLowFrequencyGamma(spin, l, Momega) - 1) / Momega;
      expect(Math.abs(slope / (2 * Math.PI) - 1)).toBeLessThan(0.01);
    }
  });

  it('scales with the hole mass: Γ(M = 3, ω) equals Γ(M = 1, 3ω) to 1e-10 relative', () => {
    const heavy = schwarzschildGreybody({ field: { spin: 1 }, l: 1, omega: 0.01, mass: 3 });
    const unit = schwarzschildGreybody({ field: { spin: 1 }, l: 1, omega: 0.03 });
    expect(Math.abs(heavy.gamma / unit.gamma - 1)).toBeLessThan(1e-10);
  });
});

function lowFrequencyCrossSection(spin: number, Momega: number): number {
  // σ = (π/ω²) Σ (2l+1) Γ_l; two terms suffice at Mω ≤ 1e-3 (the next is ~(Mω)² smaller).
  let sum = 0;
  for (let l = spin; l <= spin + 1; l++) sum += (2 * l + 1) * schwarzschildGreybody({ field: { spin }, l, omega: Momega }).gamma;
  return (Math.PI / (Momega * Momega)) * sum;
}

describe('low-frequency absorption cross-sections', () => {
  it('s = 0: σ → A_H = 16πM² (Das, Gibbons & Mathur, Phys. Rev. Lett. 78, 417 (1997)); |σ/16πM² − 1| < 8·Mω at Mω = 1e-3, 1e-4 and shrinking', () => {
    const dev = [1e-3, 1e-4].map((w) => lowFrequencyCrossSection(0, w) / (16 * Math.PI) - 1);
    expect(Math.abs(dev[0])).toBeLessThan(8e-3);
    expect(Math.abs(dev[1])).toBeLessThan(8e-4);
    expect(Math.abs(dev[1])).toBeLessThan(Math.abs(dev[0]) / 5);
  });

  // 2πM² is the a = 0, l = 1/2 value of the Page (1976) low-frequency formula
  // quoted in physics.md: Γ → (Mω)², two m states; the same limit is given by
  // Unruh, Phys. Rev. D 14, 3251 (1976) (value from memory).
  it('s = 1/2: σ → 2πM² (Page 1976 low-frequency formula, physics.md); |σ/2πM² − 1| < 8·Mω at Mω = 1e-3, 1e-4 and shrinking', () => {
    const dev = [1e-3, 1e-4].map((w) => lowFrequencyCrossSection(0.5, w) / (2 * Math.PI) - 1);
    expect(Math.abs(dev[0])).toBeLessThan(8e-3);
    expect(Math.abs(dev[1])).toBeLessThan(8e-4);
    expect(Math.abs(dev[1])).toBeLessThan(Math.abs(dev[0]) / 5);
  });
});
