import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { kerrHole } from '@penumbra/kerr';
import { conformalWeights, nearRegionForm } from '@penumbra/near-region';

// Castro, Maloney & Strominger, Phys. Rev. D 82, 024008 (2010): T_L = (r+ + r−)/(4πa), T_R = (r+ − r−)/(4πa),
// c_L = c_R = 12J, ω_L = 2M²ω/a, ω_R = 2M²ω/a − m, and ω_L/T_L + ω_R/T_R = (ω − mΩ_H)/T_H.
const spin = fc.constantFrom(0, 0.5, 1, 2);
const modeArb = spin.chain((s) =>
  fc.integer({ min: 0, max: 4 }).chain((dl) => {
    const l = s + dl;
    return fc.integer({ min: 0, max: 2 * l }).map((j) => ({ field: { spin: s }, l, m: j - l }));
  }),
);
const holeArb = fc.record({
  mass: fc.double({ min: 1e-2, max: 1e3, noNaN: true }),
  aStar: fc.double({ min: 1e-4, max: 0.99999, noNaN: true }),
});

describe('two-temperature identities (Castro, Maloney & Strominger, Phys. Rev. D 82, 024008 (2010))', () => {
  test('ω_L/T_L + ω_R/T_R equals (ω − mΩ_H)/T_H for random holes and modes to 1e-12 of the larger term (property)', () => {
    fc.assert(
      fc.property(holeArb, modeArb, fc.double({ min: 1e-6, max: 10, noNaN: true }), ({ mass, aStar }, mode, mOmega) => {
        const hole = { a: aStar * mass, mass };
        const omega = mOmega / mass;
        const form = nearRegionForm({ hole, mode, omega });
        const kerr = kerrHole(hole);
        const expected = (omega - mode.m * kerr.omegaH) / kerr.temperature;
        const scale = Math.abs(form.omegaL / form.TL) + Math.abs(form.omegaR / form.TR);
        expect(Math.abs(form.boltzmannExponent - expected)).toBeLessThan(1e-12 * scale);
        expect(Math.abs(form.omegaL - (2 * mass * mass * omega) / hole.a)).toBeLessThanOrEqual(1e-15 * form.omegaL);
        expect(form.omegaR).toBe(form.omegaL - mode.m);
      }),
      { numRuns: 400, seed: 20261203 },
    );
  });

  test('the Cardy entropy (π²/3)(c_L T_L + c_R T_R) of the form equals A/4 for random holes to 1e-13 relative, c_L = c_R = 12J to 1e-15 (property)', () => {
    fc.assert(
      fc.property(holeArb, ({ mass, aStar }) => {
        const form = nearRegionForm({
          hole: { a: aStar * mass, mass },
          mode: { field: { spin: 0 }, l: 0, m: 0 },
          omega: 1e-3 / mass,
        });
        expect(Math.abs(form.cardyEntropy / form.entropy - 1)).toBeLessThan(1e-13);
        expect(Math.abs(form.cL / (12 * aStar * mass * mass) - 1)).toBeLessThan(1e-15);
        expect(form.cR).toBe(form.cL);
      }),
      { numRuns: 300, seed: 20261203 },
    );
  });

  test('a = 0.6, M = 1: T_L = 2/(2.4π), T_R = 1.6/(2.4π), ω_L = ω/0.3 to 1e-15 relative (hand evaluation)', () => {
    const form = nearRegionForm({ hole: { a: 0.6 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.03 });
    expect(Math.abs(form.TL / (2 / (2.4 * Math.PI)) - 1)).toBeLessThan(1e-15);
    expect(Math.abs(form.TR / (1.6 / (2.4 * Math.PI)) - 1)).toBeLessThan(1e-15);
    expect(Math.abs(form.omegaL / 0.1 - 1)).toBeLessThan(1e-15);
  });

  test('a scalar has h_L = h_R = l + 1 (Castro, Maloney & Strominger 2010); every spin has h_R − h_L = s (docs/near-region.md)', () => {
    for (const l of [0, 1, 2, 5]) expect(conformalWeights(0, l)).toEqual({ hL: l + 1, hR: l + 1 });
    for (const s of [0.5, 1, 2] as const) {
      for (const l of [s, s + 1, s + 3]) expect(conformalWeights(s, l)).toEqual({ hL: l + 1 - s, hR: l + 1 });
    }
  });

  test('sinh carries the Boltzmann factors of bosons (Γ_near changes sign with k) and cosh those of fermions (Γ_near > 0)', () => {
    const at = (spin: 0 | 0.5 | 1 | 2, l: number, m: number, omega: number) =>
      nearRegionForm({ hole: { a: 0.9 }, mode: { field: { spin }, l, m }, omega });
    // Ω_H(a = 0.9) ≈ 0.3134: Mω = 0.1 is inside the superradiant band of m = 1, Mω = 0.5 above it.
    for (const spin of [0, 1, 2] as const) {
      expect(at(spin, 2, 1, 0.1).gammaNearRegion).toBeLessThan(0);
      expect(at(spin, 2, 1, 0.5).gammaNearRegion).toBeGreaterThan(0);
      expect(at(spin, 2, 1, 0.1).thermalFactor).toBe('sinh');
    }
    expect(at(0.5, 1.5, 0.5, 0.1).gammaNearRegion).toBeGreaterThan(0);
    expect(at(0.5, 1.5, 0.5, 0.1).thermalFactor).toBe('cosh');
  });
});
