import { describe, expect, test } from 'vitest';
import { emissionSpectrum, emissionTotals } from '@penumbra/emission';

describe('Kerr emission totals', () => {
  test('a → 0: totals at a = 1e-3 equal the Schwarzschild ones to 3e-5 (corrections are O(a²); Page, Phys. Rev. D 14, 3260 (1976))', () => {
    const kerr = emissionTotals({ hole: { a: 1e-3 }, field: { spin: 1 } }, { tol: 1e-5 });
    const schw = emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 1e-5 });
    expect(Math.abs(kerr.power.value / schw.power.value - 1)).toBeLessThan(3e-5);
    expect(Math.abs(kerr.numberRate.value / schw.numberRate.value - 1)).toBeLessThan(3e-5);
    // the torque vanishes linearly: dJ/dt / a stays finite and positive
    expect(kerr.torque.value).toBeGreaterThan(0);
    expect(schw.torque.value).toBe(0);
  });
  test('the torque is positive for a > 0 and flips sign with a (m → −m symmetry, Teukolsky 1973)', () => {
    for (const spin of [0] as const) {
      const plus = emissionTotals({ hole: { a: 0.5 }, field: { spin } }, { tol: 1e-3 });
      expect(plus.torque.value).toBeGreaterThan(0);
      expect(plus.torque.relError).toBeLessThan(1e-3);
      const minus = emissionTotals({ hole: { a: -0.5 }, field: { spin } }, { tol: 1e-3 });
      expect(minus.torque.value).toBe(-plus.torque.value);
      expect(minus.power.value).toBe(plus.power.value);
    }
  });
  test('rotation raises the graviton power (superradiant l = m = 2 emission; Page 1976 trend)', () => {
    const slow = emissionTotals({ hole: { a: 0 }, field: { spin: 2 } }, { tol: 1e-3 });
    const fast = emissionTotals({ hole: { a: 0.7 }, field: { spin: 2 } }, { tol: 1e-3 });
    expect(fast.power.value).toBeGreaterThan(5 * slow.power.value);
    expect(fast.torque.value).toBeGreaterThan(0);
  });
  test('the spectrum per dof is non-negative at every frequency, including the superradiant band (Γ and the Bose factor change sign together)', () => {
    const s = emissionSpectrum({ hole: { a: 0.9 }, field: { spin: 1 }, grid: [0.05, 0.2, 0.31, 0.4, 0.7] }, { tol: 1e-4 });
    for (const p of s.points) {
      expect(p.number).toBeGreaterThan(0);
      expect(p.energy).toBeCloseTo(p.omega * p.number, 15);
      expect(p.relError).toBeLessThan(1e-4);
    }
  });
});
