import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { greybody } from '@penumbra/flux';

const vector = (mu: number, l: number, omega: number, polarization?: 'odd' | 'even-1' | 'even-2' | 'monopole') =>
  greybody({ hole: { a: 0 }, mode: { field: { spin: 1, mass: mu }, l, m: 0 }, omega }, polarization ? { polarization } : {});

describe('greybody for a massive vector (spin 1, mass > 0) at a = 0', () => {
  // Teukolsky route for the massless photon (Teukolsky 1973; Teukolsky & Press
  // 1974 flux normalisation) against the Proca transverse modes as Mμ → 0:
  // the difference is O((Mμ)²), measured 3.1e-6 relative at Mμ = 1e-3
  // (docs/massive-vector.md §4), so 1e-5 at Mμ = 1e-3 leaves room.
  it('odd and even-1 at Mμ = 1e-3, l = 1, Mω = 0.3 agree with the massless s = 1 Teukolsky Γ to 1e-5 relative', () => {
    const photon = greybody({ hole: { a: 0 }, mode: { field: { spin: 1 }, l: 1, m: 0 }, omega: 0.3 }).gamma;
    for (const pol of ['odd', 'even-1'] as const) {
      const g = vector(1e-3, 1, 0.3, pol).gamma;
      expect(Math.abs(g - photon) / photon).toBeLessThan(1e-5);
    }
  });
  it('even-2 at Mμ = 1e-3 (longitudinal) agrees with the massless scalar Teukolsky Γ of the same l to 1e-4 relative', () => {
    const scalar = greybody({ hole: { a: 0 }, mode: { field: { spin: 0 }, l: 1, m: 0 }, omega: 0.3 }).gamma;
    const g = vector(1e-3, 1, 0.3, 'even-2').gamma;
    expect(Math.abs(g - scalar) / scalar).toBeLessThan(1e-4);
  });
  it('the result names its polarisation (default odd, monopole at l = 0) and the field mass; Γ + R = 1 within 1e-9', () => {
    const odd = vector(0.1, 1, 0.3);
    expect(odd.polarization).toBe('odd');
    expect(odd.mode.field.mass).toBe(0.1);
    expect(odd.residual).toBeLessThan(1e-9);
    expect(vector(0.1, 0, 0.3).polarization).toBe('monopole');
  });
  it('refuses a ≠ 0 naming hole.a, ω ≤ μ naming omega, and a polarisation for a massless field naming polarization', () => {
    const kerr = () => greybody({ hole: { a: 0.3 }, mode: { field: { spin: 1, mass: 0.1 }, l: 1, m: 0 }, omega: 0.3 });
    expect(kerr).toThrow(InputError);
    expect(kerr).toThrow(/hole\.a.*not yet verified/);
    expect(() => vector(0.3, 1, 0.3)).toThrow(/omega/);
    expect(() =>
      greybody({ hole: { a: 0 }, mode: { field: { spin: 1 }, l: 1, m: 0 }, omega: 0.3 }, { polarization: 'odd' }),
    ).toThrow(/polarization/);
  });
});
