/**
 * The emission spectrum of a massive scalar: Hawking's rate per degree of
 * freedom (1/2π) Σ Γ/(e^{(ω − mΩ_H)/T_H} − 1) (Hawking 1975; Page, Phys. Rev.
 * D 13, 198 (1976)) with the massive Γ (docs/massive-fields.md), zero at and
 * below the threshold Mω ≤ Mμ where no wave reaches infinity.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { emissionSpectrum } from '@penumbra/emission';

describe('emission spectrum of a massive scalar', () => {
  it('is exactly 0 at and below the threshold Mω ≤ Mμ and positive above it (a = 0.7, Mμ = 0.1)', () => {
    const s = emissionSpectrum({ hole: { a: 0.7 }, field: { spin: 0, mass: 0.1 }, grid: [0.05, 0.1, 0.12, 0.3] }, { tol: 1e-5 });
    expect(s.points.map((p) => p.number).slice(0, 2)).toEqual([0, 0]);
    for (const p of s.points.slice(2)) expect(p.number).toBeGreaterThan(0);
    expect(s.field).toEqual({ spin: 0, mass: 0.1 });
  });

  it('tends to the massless spectrum as Mμ → 0 at rate O(μ²): relative change at Mω = 0.3, a = 0.7 shrinks 100 ± 3 × for Mμ 1e-2 → 1e-3', () => {
    const grid = [0.3];
    const n = (mass?: number) =>
      emissionSpectrum({ hole: { a: 0.7 }, field: mass === undefined ? { spin: 0 } : { spin: 0, mass }, grid }, { tol: 1e-8 })
        .points[0].number;
    const n0 = n();
    const d = [1e-2, 1e-3].map((mu) => n(mu) / n0 - 1);
    expect(Math.abs(d[0])).toBeLessThan(1e-2);
    expect(d[0] / d[1]).toBeGreaterThan(97);
    expect(d[0] / d[1]).toBeLessThan(103);
  });

  it('refuses a massive spin-2 field with an InputError naming field.mass (no massive graviton route)', () => {
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 2, mass: 0.1 }, grid: [0.3] })).toThrow(InputError);
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 2, mass: 0.1 }, grid: [0.3] })).toThrow(
      expect.objectContaining({ parameter: 'field.mass' }),
    );
  });
});
