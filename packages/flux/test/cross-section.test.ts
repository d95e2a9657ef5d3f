/**
 * Absorption cross-sections. Low frequency: s = 0 → A_H = 16πM² (Das, Gibbons
 * & Mathur, Phys. Rev. Lett. 78, 417 (1997)); s = 1/2 → 2πM² (from the Page
 * low-frequency formula, Phys. Rev. D 13, 198 (1976), summed over m = ±1/2);
 * s = 1 → (4/3)A_H M²ω² and s = 2 → (16/45)A_H M⁴ω⁴ (same formula, l = s only,
 * physics notes). High frequency: the geometric-optics capture cross-section
 * 27πM² (Misner, Thorne & Wheeler, Gravitation (1973)), approached with
 * oscillations that decay like 1/(Mω).
 */
import { describe, expect, it } from 'vitest';
import { absorptionCrossSection } from '@penumbra/flux';

const AH = 16 * Math.PI;

describe('absorption cross-section at a = 0', () => {
  it('s = 0 tends to the horizon area 16πM²: σ/A_H − 1 shrinks like Mω (within 4·2πMω at Mω = 1e-3)', () => {
    const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 1e-3 });
    expect(Math.abs(r.sigma / AH - 1)).toBeLessThan(4 * 2 * Math.PI * 1e-3);
    expect(r.relError).toBeLessThan(1e-6);
  });
  it('s = 1/2 tends to 2πM² (within 4·2πMω at Mω = 1e-3)', () => {
    const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0.5 }, omega: 1e-3 });
    expect(Math.abs(r.sigma / (2 * Math.PI) - 1)).toBeLessThan(4 * 2 * Math.PI * 1e-3);
  });
  it('s = 1 follows (4/3) A_H M² ω² and s = 2 follows (16/45) A_H M⁴ ω⁴ at Mω = 1e-3 (within 5 %)', () => {
    const w = 1e-3;
    const s1 = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 1 }, omega: w });
    const s2 = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 2 }, omega: w });
    expect(Math.abs(s1.sigma / ((4 / 3) * AH * w * w) - 1)).toBeLessThan(0.05);
    expect(Math.abs(s2.sigma / ((16 / 45) * AH * w ** 4) - 1)).toBeLessThan(0.05);
  });
  it('s = 0 approaches the capture cross-section 27πM² at high frequency (within 3 % at Mω = 3, 2 % at Mω = 5)', () => {
    const s3 = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 3 }, { tol: 1e-6 });
    const s5 = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 5 }, { tol: 1e-6 });
    expect(Math.abs(s3.sigma / (27 * Math.PI) - 1)).toBeLessThan(0.03);
    expect(Math.abs(s5.sigma / (27 * Math.PI) - 1)).toBeLessThan(0.02);
    expect(s5.diagnostics.droppedBound).toBeLessThan(1e-6 * s5.sigma);
  });
  it('reports its truncation: the dropped-tail bound is below the tolerance and lMax exceeds 5Mω', () => {
    const r = absorptionCrossSection({ hole: { a: 0.7 }, field: { spin: 1 }, omega: 1 }, { tol: 1e-6 });
    expect(r.diagnostics.droppedBound / Math.abs(r.sigma)).toBeLessThan(1e-6);
    expect(r.diagnostics.lMax).toBeGreaterThan(5);
  });
});
