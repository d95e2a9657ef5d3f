import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { InputError } from '@penumbra/core';
import { cardyEntropy, kerrHole, nearRegion } from '@penumbra/kerr';

// Hidden conformal symmetry of the Kerr near region: Castro, Maloney & Strominger,
// Phys. Rev. D 82, 024008 (2010): T_L = (r+ + r−)/(4πa), T_R = (r+ − r−)/(4πa), c_L = c_R = 12J.
describe('near-region temperatures and the Cardy formula (Phys. Rev. D 82, 024008 (2010))', () => {
  test('Cardy entropy (π²/3)(c_L T_L + c_R T_R) equals A/4 for random holes to 1e-13 relative (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e4, noNaN: true }),
        fc.double({ min: -0.9999, max: 0.9999, noNaN: true }).filter((s) => Math.abs(s) > 1e-6),
        (mass, spinRatio) => {
          const hole = kerrHole({ a: spinRatio * mass, mass });
          const entropy = cardyEntropy(nearRegion(hole));
          expect(Math.abs(entropy - hole.area / 4) / (hole.area / 4)).toBeLessThan(1e-13);
        },
      ),
      { numRuns: 500 },
    );
  });

  test('a = 0.6, M = 1: r± = 1.8, 0.2 so T_L = 2/(2.4π), T_R = 1.6/(2.4π), c_L = c_R = 7.2 to 1e-15 relative (hand evaluation of the formulas)', () => {
    const near = nearRegion(kerrHole({ a: 0.6 }));
    expect(Math.abs(near.TL - 2 / (2.4 * Math.PI)) / near.TL).toBeLessThan(1e-15);
    expect(Math.abs(near.TR - 1.6 / (2.4 * Math.PI)) / near.TR).toBeLessThan(1e-15);
    expect(near.cL).toBeCloseTo(7.2, 14);
    expect(near.cR).toBe(near.cL);
  });

  test('T_R/T_H = 2Mr+/a (both formulas share r+ − r−) to 1e-14 relative', () => {
    const hole = kerrHole({ a: 0.8, mass: 1.3 });
    const near = nearRegion(hole);
    expect(Math.abs(near.TR / hole.temperature - (2 * hole.mass * hole.rPlus) / hole.a) / near.TR).toBeLessThan(1e-14);
  });

  test('the near-region description needs rotation: a = 0 throws InputError naming a', () => {
    expect(() => nearRegion(kerrHole({ a: 0 }))).toThrow(InputError);
    expect(() => nearRegion(kerrHole({ a: 0 }))).toThrow(/invalid hole.a = 0/);
  });
});
