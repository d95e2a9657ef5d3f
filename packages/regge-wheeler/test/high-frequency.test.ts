import { describe, expect, it } from 'vitest';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';

/** σ = (π/ω²) Σ_{l ≤ lMax} (2l+1) Γ_l for the scalar field. */
function scalarCrossSection(Momega: number, lMax: number): { sigma: number; lastGamma: number } {
  let sum = 0;
  let lastGamma = 0;
  for (let l = 0; l <= lMax; l++) {
    lastGamma = schwarzschildGreybody({ field: { spin: 0 }, l, omega: Momega }, { tol: 1e-6 }).gamma;
    sum += (2 * l + 1) * lastGamma;
  }
  return { sigma: (Math.PI / (Momega * Momega)) * sum, lastGamma };
}

describe('high-frequency absorption cross-section', () => {
  // Geometric-optics capture cross-section 27πM² (Misner, Thorne & Wheeler,
  // Gravitation, 1973). The approach is oscillatory in Mω; the 2 % band is a
  // loose tolerance (common practice, no source): the measured excursions are
  // 0.6–0.8 % at Mω = 3–5.
  for (const Momega of [3, 4, 5]) {
    it(`s = 0 at Mω = ${Momega}: σ/27πM² is within 2 % of 1 (l ≤ 40; the dropped tail is below 1e-30)`, () => {
      const { sigma, lastGamma } = scalarCrossSection(Momega, 40);
      expect(lastGamma).toBeLessThan(1e-30);
      expect(Math.abs(sigma / (27 * Math.PI) - 1)).toBeLessThan(0.02);
    });
  }

  it('Γ → 1 for l well below the critical 3√3·Mω (capture) and Γ → 0 well above it (s = 2, Mω = 2): Γ_2 > 1 − 1e-9, Γ_20 < 1e-6', () => {
    expect(schwarzschildGreybody({ field: { spin: 2 }, l: 2, omega: 2 }).gamma).toBeGreaterThan(1 - 1e-9);
    expect(schwarzschildGreybody({ field: { spin: 2 }, l: 20, omega: 2 }).gamma).toBeLessThan(1e-6);
  });
});
