/**
 * Emission per degree of freedom of massive fields of spin 0, 1/2 and 1
 * (docs/emission.md, "Massive fields"): Hawking's rate (1/2π) Σ Γ/(e^{(ω − mΩ_H)/T_H} ∓ 1)
 * (Hawking 1975; Page, Phys. Rev. D 13, 198 (1976)) with the massive greybody
 * factors of @penumbra/flux, emitted only above the threshold ω > μ.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { emissionSpectrum, emissionTotals } from '@penumbra/emission';

const rel = (x: number, y: number) => Math.abs(x / y - 1);

describe('emission of massive fields per degree of freedom', () => {
  it('massive scalar totals at Mμ = 1e-3 equal the massless totals to 1e-3 relative (a = 0; continuity in μ, physics notes: O(μ²) away from threshold)', () => {
    const m0 = emissionTotals({ hole: { a: 0 }, field: { spin: 0 } }, { tol: 1e-4 });
    const m1 = emissionTotals({ hole: { a: 0 }, field: { spin: 0, mass: 1e-3 } }, { tol: 1e-4 });
    expect(rel(m1.power.value, m0.power.value)).toBeLessThan(1e-3);
    expect(rel(m1.numberRate.value, m0.numberRate.value)).toBeLessThan(1e-3);
    expect(m1.field).toEqual({ spin: 0, mass: 1e-3 });
    expect(m1.approximation).toBeUndefined();
  });

  it('a massive spin-1/2 spectrum at Mμ = 1e-4 equals the massless one to 1e-5 relative (a = 0 and a = 0.5): at μ = 0 both signs of κ give the massless Γ (Page, Phys. Rev. D 14, 1509 (1976))', () => {
    for (const a of [0, 0.5]) {
      const grid = [0.3, 1.2];
      const m0 = emissionSpectrum({ hole: { a }, field: { spin: 0.5 }, grid }, { tol: 1e-5 });
      const m1 = emissionSpectrum({ hole: { a }, field: { spin: 0.5, mass: 1e-4 }, grid }, { tol: 1e-5 });
      m1.points.forEach((p, i) => {
        expect(rel(p.number, m0.points[i].number)).toBeLessThan(1e-5);
      });
    }
  });

  it('a massive vector at a = 0 and Mμ = 1e-4 gives 3 × (per dof) = 2 × photon + 1 × massless scalar to 3e-3 at Mω = 0.3, 0.6 (the μ → 0 limit of the Proca field is Maxwell plus a scalar: Stueckelberg, value from memory)', () => {
    const grid = [0.3, 0.6];
    const vector = emissionSpectrum({ hole: { a: 0 }, field: { spin: 1, mass: 1e-4 }, grid }, { tol: 1e-4 });
    const photon = emissionSpectrum({ hole: { a: 0 }, field: { spin: 1 }, grid }, { tol: 1e-5 });
    const scalar = emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid }, { tol: 1e-5 });
    vector.points.forEach((p, i) => {
      expect(rel(3 * p.number, 2 * photon.points[i].number + scalar.points[i].number)).toBeLessThan(3e-3);
    });
    expect(vector.approximation).toBeUndefined();
  });

  it('for E ≫ m each massive spectrum tends to the massless one: at Mμ = 0.05 the relative difference shrinks from Mω = 0.3 to 2.4 and is below 3e-3 there (spins 0, 1/2 at a = 0.5; spin 1 at a = 0)', () => {
    const grid = [0.3, 2.4];
    for (const [spin, a] of [
      [0, 0.5],
      [0.5, 0.5],
      [1, 0],
    ] as const) {
      const m0 = emissionSpectrum({ hole: { a }, field: { spin }, grid }, { tol: 1e-4 });
      const m1 = emissionSpectrum({ hole: { a }, field: { spin, mass: 0.05 }, grid }, { tol: 1e-4 });
      const d = m1.points.map((p, i) => rel(p.number, m0.points[i].number));
      expect(d[1]).toBeLessThan(3e-3);
      expect(d[1]).toBeLessThan(d[0]);
    }
  });

  it('a massive vector on a spinning hole names its approximation, which joins the exact a = 0 Proca result continuously: a = 1e-3 within 2e-4 of a = 0 at Mμ = 0.05 (docs/emission.md)', () => {
    const grid = [0.3, 0.6];
    const exact = emissionSpectrum({ hole: { a: 0 }, field: { spin: 1, mass: 0.05 }, grid }, { tol: 1e-5 });
    const approx = emissionSpectrum({ hole: { a: 1e-3 }, field: { spin: 1, mass: 0.05 }, grid }, { tol: 1e-5 });
    expect(approx.approximation).toMatch(/massive vector on Kerr/);
    approx.points.forEach((p, i) => {
      expect(rel(p.number, exact.points[i].number)).toBeLessThan(2e-4);
    });
  });

  it('is exactly 0 at and below the threshold Mω ≤ Mμ for spins 1/2 and 1 (no wave reaches infinity there)', () => {
    for (const spin of [0.5, 1] as const) {
      const s = emissionSpectrum({ hole: { a: 0 }, field: { spin, mass: 0.2 }, grid: [0.1, 0.2, 0.4] }, { tol: 1e-4 });
      expect(s.points[0].number).toBe(0);
      expect(s.points[1].number).toBe(0);
      expect(s.points[2].number).toBeGreaterThan(0);
    }
  });

  it('massive totals are refused with an InputError naming field.mass for spin 2 and for 0 < Mμ < 1e-5', () => {
    for (const field of [
      { spin: 2, mass: 0.1 },
      { spin: 0, mass: 1e-7 },
    ] as const) {
      expect(() => emissionTotals({ hole: { a: 0 }, field })).toThrow(InputError);
      expect(() => emissionTotals({ hole: { a: 0 }, field })).toThrow(expect.objectContaining({ parameter: 'field.mass' }));
    }
  });
});
