import { describe, expect, test } from 'vitest';
import { absorptionCrossSection } from '@penumbra/flux';

const sigma = (spin: 0 | 0.5 | 1, a: number, omega: number, mass?: number) =>
  absorptionCrossSection({ hole: { a }, field: mass === undefined ? { spin } : { spin, mass }, omega }, { tol: 1e-7 }).sigma;

describe('cross-sections of massive Dirac and vector fields average over their spin states', () => {
  test('massive Dirac (a = 0.5, Mω = 0.4): σ tends to the massless one-helicity s = 1/2 σ as μ → 0, the gap falling ≈ 4× when Mμ halves (the two κ signs shift Γ by ±O(μ), their mean by O(μ²): Γ(κ, μ) = Γ(−κ, −μ), Page 1976)', () => {
    const massless = sigma(0.5, 0.5, 0.4);
    const gap = (mu: number) => Math.abs(sigma(0.5, 0.5, 0.4, mu) / massless - 1);
    const [g1, g2] = [gap(4e-3), gap(2e-3)];
    expect(g2).toBeLessThan(1e-4);
    expect(g1 / g2).toBeGreaterThan(3);
    expect(g1 / g2).toBeLessThan(5);
  });
  test('massive vector (a = 0, Mω = 0.4): σ tends to (2σ_photon + σ_scalar)/3 as μ → 0 — two transverse polarisations become the photon and the longitudinal one a scalar (Stueckelberg decoupling, docs/massive-vector.md) — the gap falling ≈ 4× when Mμ halves', () => {
    const limit = (2 * sigma(1, 0, 0.4) + sigma(0, 0, 0.4)) / 3;
    const gap = (mu: number) => Math.abs(sigma(1, 0, 0.4, mu) / limit - 1);
    const [g1, g2] = [gap(4e-3), gap(2e-3)];
    expect(g2).toBeLessThan(1e-4);
    expect(g1 / g2).toBeGreaterThan(3);
    expect(g1 / g2).toBeLessThan(5);
  });
});
