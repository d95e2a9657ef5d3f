import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { ConvergenceError, InputError } from '@penumbra/core';
import {
  horizonDistanceFromTortoise,
  invertTortoise,
  kerrHole,
  radiusFromTortoise,
  tortoise,
  tortoiseDerivative,
  tortoiseFromHorizonDistance,
} from '@penumbra/kerr';

const fixture = JSON.parse(readFileSync(new URL('./fixtures/tortoise.json', import.meta.url), 'utf8')) as {
  rows: { a: string; x: string; rStar: string }[];
};

const spins = [0, 0.3, -0.6, 0.9, 0.99, 0.999, 0.9999, -0.9999];
/** x = r − r+ on a logarithmic grid from 1e-12 M to 1e8 M, 8 points per decade. */
const horizonDistances = Array.from({ length: 20 * 8 + 1 }, (_, i) => 10 ** (-12 + i / 8));

describe('tortoise coordinate r*(x), x = r − r+ (docs/kerr.md)', () => {
  test(`matches a 60-digit mpmath evaluation of the closed form (fixtures/tortoise.json, ${fixture.rows.length} points, x from 1e-12 to 3.7e8, a up to ±0.9999) to 4 ulp of the largest term`, () => {
    for (const row of fixture.rows) {
      const hole = kerrHole({ a: Number(row.a) });
      const x = Number(row.x);
      const reference = Number(row.rStar);
      const value = tortoiseFromHorizonDistance(hole, x);
      // The terms are r, 2M ln((x + b)/2M) and (2Mr+/b) ln(1 + b/x); the largest sets the rounding scale.
      const b = hole.rPlus - hole.rMinus;
      const scale = Math.max(Math.abs(reference), hole.rPlus + x, ((2 * hole.rPlus) / b) * Math.log1p(b / x));
      expect(Math.abs(value - reference), `a = ${row.a}, x = ${row.x}`).toBeLessThanOrEqual(4 * Number.EPSILON * scale);
    }
  });

  test('Schwarzschild: r* = r + 2M ln(r/2M − 1) (Regge & Wheeler, Phys. Rev. 108, 1063 (1957)) to 1e-14 of max(|r*|, r) for M = 1 and M = 3', () => {
    for (const M of [1, 3]) {
      const hole = kerrHole({ a: 0, mass: M });
      for (const x of horizonDistances) {
        const r = 2 * M + x;
        const reference = r + 2 * M * Math.log(x / (2 * M));
        const value = tortoiseFromHorizonDistance(hole, x * (M / M));
        expect(Math.abs(value - reference)).toBeLessThan(1e-14 * Math.max(Math.abs(reference), r));
      }
    }
  });

  test('round trip x → r* → x holds to 1e-14 relative in x for x from 1e-12 to 1e8 and a up to ±0.9999 (grid of 161 × 8 points)', () => {
    let worst = 0;
    for (const a of spins) {
      const hole = kerrHole({ a: a });
      for (const x of horizonDistances) {
        const back = horizonDistanceFromTortoise(hole, tortoiseFromHorizonDistance(hole, x));
        worst = Math.max(worst, Math.abs(back - x) / x);
      }
    }
    expect(worst).toBeLessThan(1e-14);
  });

  test('round trip x → r* → x holds to 1e-14 relative in x for random holes (property, log-uniform x in [1e-12, 1e8], |a| ≤ 0.9999, M in [0.1, 10])', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.9999, max: 0.9999, noNaN: true }),
        fc.double({ min: -12, max: 8, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        (spinRatio, log10x, mass) => {
          const hole = kerrHole({ a: spinRatio * mass, mass });
          const x = mass * 10 ** log10x;
          const inversion = invertTortoise(hole, tortoiseFromHorizonDistance(hole, x));
          expect(Math.abs(inversion.horizonDistance - x) / x).toBeLessThan(1e-14);
          expect(Math.abs(inversion.residual)).toBeLessThanOrEqual(2 * inversion.residualFloor);
          expect(inversion.iterations).toBeLessThanOrEqual(20);
        },
      ),
      { numRuns: 2000 },
    );
  });

  test('round trip r → r* → r in Boyer–Lindquist r holds to 1e-14 relative in x = r − r+ when r − r+ is exact (r = r+ + x)', () => {
    for (const a of spins) {
      const hole = kerrHole({ a: a });
      for (const x of horizonDistances) {
        const r = hole.rPlus + x;
        const xExact = r - hole.rPlus; // the x this r represents
        const back = radiusFromTortoise(hole, tortoise(hole, r)) - hole.rPlus;
        expect(Math.abs(back - xExact) / xExact, `a = ${a}, x = ${x}`).toBeLessThan(
          1e-14 + 2 * Number.EPSILON * (hole.rPlus / xExact),
        );
      }
    }
  });

  test('derivative identity dr*/dr = (r² + a²)/Δ: Richardson-extrapolated central differences (step x/500) agree to 1e-9 relative for x from 1e-12 to 1e8', () => {
    for (const a of spins) {
      const hole = kerrHole({ a: a });
      for (const x of horizonDistances.filter((_, i) => i % 4 === 0)) {
        const h = x / 500;
        const central = (step: number) =>
          (tortoiseFromHorizonDistance(hole, x + step) - tortoiseFromHorizonDistance(hole, x - step)) / (2 * step);
        const richardson = (4 * central(h / 2) - central(h)) / 3;
        const r = hole.rPlus + x;
        // Δ = x (x + r+ − r−) avoids forming r − r+ again.
        const exact = (r * r + a * a) / (x * (x + hole.rPlus - hole.rMinus));
        expect(Math.abs(richardson - exact) / exact, `a = ${a}, x = ${x}`).toBeLessThan(1e-9);
        // tortoiseDerivative takes r, so r − r+ carries an absolute rounding of ulp(r+): compare where that is small.
        if (x > 1e-3) expect(Math.abs(tortoiseDerivative(hole, r) - exact) / exact).toBeLessThan(1e-12);
      }
    }
  });

  test('r* is strictly increasing in x (property: dr*/dr > 0 outside the horizon)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -0.9999, max: 0.9999, noNaN: true }),
        fc.double({ min: -12, max: 8, noNaN: true }),
        (a, log10x) => {
          const hole = kerrHole({ a: a });
          const x = 10 ** log10x;
          expect(tortoiseFromHorizonDistance(hole, x * 1.001)).toBeGreaterThan(tortoiseFromHorizonDistance(hole, x));
        },
      ),
    );
  });

  test('inversion reaches the float range limits: r* = −1e6 gives x = 0 (r = r+), r* = 1e300 gives x = r* to 1e-15 relative, x = 1e-200 round-trips to 2e-13 relative', () => {
    const hole = kerrHole({ a: 0.5 });
    const deep = invertTortoise(hole, -1e6);
    expect(deep.horizonDistance).toBe(0);
    expect(deep.r).toBe(hole.rPlus);
    const far = horizonDistanceFromTortoise(hole, 1e300);
    expect(Math.abs(far - 1e300) / 1e300).toBeLessThan(1e-15);
    // x = 1e-200: storing r* ≈ (2Mr+/b) ln x in one double limits x to about |ln x|·ε ≈ 1e-13 relative.
    const tiny = horizonDistanceFromTortoise(hole, tortoiseFromHorizonDistance(hole, 1e-200));
    expect(Math.abs(tiny - 1e-200) / 1e-200).toBeLessThan(2e-13);
  });

  test('rejects points on or inside the horizon and non-finite input with InputError', () => {
    const hole = kerrHole({ a: 0.7 });
    expect(() => tortoise(hole, hole.rPlus)).toThrow(InputError);
    expect(() => tortoise(hole, 0.5)).toThrow(/r > r\+/);
    expect(() => tortoise(hole, Number.NaN)).toThrow(InputError);
    expect(() => tortoiseFromHorizonDistance(hole, 0)).toThrow(InputError);
    expect(() => tortoiseFromHorizonDistance(hole, -1)).toThrow(InputError);
    expect(() => tortoiseFromHorizonDistance(hole, Number.POSITIVE_INFINITY)).toThrow(InputError);
    expect(() => horizonDistanceFromTortoise(hole, Number.NaN)).toThrow(/invalid rStar = NaN/);
    expect(() => radiusFromTortoise(hole, Number.NEGATIVE_INFINITY)).toThrow(InputError);
  });

  test('ConvergenceError carries its diagnostics object (constructed directly)', () => {
    const error = new ConvergenceError('tortoise inversion did not converge', { iterations: 100 });
    expect(error.name).toBe('ConvergenceError');
    expect(error.diagnostics).toEqual({ iterations: 100 });
    expect(error.message).toContain('"iterations":100');
  });
});
