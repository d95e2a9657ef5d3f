/**
 * Massive Dirac greybody factors on Kerr (docs/massive-dirac.md). Sources:
 * Chandrasekhar, Proc. R. Soc. A 349, 571 (1976) and Page, Phys. Rev. D 14,
 * 1509 (1976) for the equations; the in-project massless s = 1/2 Teukolsky
 * route and Schwarzschild real-potential route as independent checks;
 * physics.md (verified there by an independent high-precision calculation)
 * for the near-threshold ratio of the two signs; the mpmath fixture
 * test/fixtures/massive-dirac/ for 30-digit values.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { greybody, radialFunction } from '@penumbra/flux';
import { massiveDiracGreybody } from '@penumbra/flux/internal';
import { schwarzschildMassiveDiracGreybody } from '@penumbra/regge-wheeler';

const dirac = (a: number, l: number, m: number, omega: number, mass: number, kappaSign: 1 | -1, tol = 1e-10) =>
  greybody({ hole: { a }, mode: { field: { spin: 0.5, mass }, l, m, kappaSign }, omega }, { tol });

const fixture = JSON.parse(
  readFileSync(new URL('../../../test/fixtures/massive-dirac/massive-dirac.json', import.meta.url), 'utf8'),
) as { values: { a: number; l: number; m: number; omega: number; fieldMass: number; kappaSign: 1 | -1; gamma: string }[] };

describe('massive Dirac greybody factor', () => {
  it('matches the 34-digit mpmath values (test/fixtures/massive-dirac, an independent implementation) to 1e-9 relative at tol 1e-10, within its own error estimate', () => {
    expect(fixture.values.length).toBeGreaterThanOrEqual(2);
    for (const v of fixture.values) {
      const r = dirac(v.a, v.l, v.m, v.omega, v.fieldMass, v.kappaSign, 1e-10);
      const err = Math.abs(r.gamma / Number(v.gamma) - 1);
      expect(err).toBeLessThan(1e-9);
      expect(err).toBeLessThan(10 * r.relError + 1e-14);
    }
  });

  it('at μ = 0 both signs equal the massless s = 1/2 Teukolsky Γ to 1e-9 relative (a = 0.9, j = 3/2, m = 1/2, Mω = 0.4; in-project massless route)', () => {
    const problem = (kappaSign: 1 | -1) => ({
      hole: { a: 0.9 },
      mode: { field: { spin: 0.5, mass: 0 }, l: 1.5, m: 0.5, kappaSign },
      omega: 0.4,
    });
    const massless = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0.5 }, l: 1.5, m: 0.5 }, omega: 0.4 }, { tol: 1e-10 });
    for (const kappaSign of [1, -1] as const) {
      const g = massiveDiracGreybody(problem(kappaSign), { tol: 1e-10 }).gamma;
      expect(Math.abs(g / massless.gamma - 1)).toBeLessThan(1e-9);
    }
  });

  it('μ → 0 is continuous with shifts O(μ) of opposite sign for the two signs, since Γ(κ, μ) = Γ(−κ, −μ) (ratio of shifts −1 within 5 %, halving μ halves them within 5 %)', () => {
    const base = greybody({ hole: { a: 0 }, mode: { field: { spin: 0.5 }, l: 0.5, m: 0.5 }, omega: 0.2 }, { tol: 1e-11 }).gamma;
    const shift = (mu: number, s: 1 | -1) => dirac(0, 0.5, 0.5, 0.2, mu, s, 1e-11).gamma - base;
    const [p1, m1, p2] = [shift(2e-3, 1), shift(2e-3, -1), shift(1e-3, 1)];
    expect(Math.abs(p1 / m1 + 1)).toBeLessThan(0.05);
    expect(Math.abs(p1 / p2 - 2)).toBeLessThan(0.1);
  });

  it('agrees with the Schwarzschild real-potential route (Ŵ² + dŴ/dr̂*) at a = 0 to 1e-9 relative, both signs, also near threshold where the far waves are carried in from ~4000 M (j = 5/2, Mω = 0.6, v = k∞/ω = 0.05)', () => {
    for (const [l, omega, mu] of [
      [0.5, 0.15, 0.12],
      [1.5, 0.6, 0.3],
      [2.5, 0.6, 0.6 * Math.sqrt(1 - 0.05 ** 2)],
    ]) {
      for (const kappaSign of [1, -1] as const) {
        const kerr = dirac(0, l, 0.5, omega, mu, kappaSign, 1e-11).gamma;
        const ref = schwarzschildMassiveDiracGreybody({ l, kappaSign, omega, fieldMass: mu }, { tol: 1e-10 }).gamma;
        expect(Math.abs(kerr / ref - 1)).toBeLessThan(1e-9);
      }
    }
  });

  it('conserves flux: |Γ + R − 1| ≤ 1e-9 with R from the outgoing amplitude (a = 0.7, j = 3/2, m = −1/2, Mω = 0.8, Mμ = 0.4)', () => {
    for (const kappaSign of [1, -1] as const) expect(dirac(0.7, 1.5, -0.5, 0.8, 0.4, kappaSign).residual).toBeLessThan(1e-9);
  });

  it('Γ(m, a) = Γ(−m, −a) to 1e-9 relative (a = 0.8, j = 3/2, m = 1/2, Mω = 0.5, Mμ = 0.2)', () => {
    for (const kappaSign of [1, -1] as const) {
      const g1 = dirac(0.8, 1.5, 0.5, 0.5, 0.2, kappaSign).gamma;
      const g2 = dirac(-0.8, 1.5, -0.5, 0.5, 0.2, kappaSign).gamma;
      expect(Math.abs(g1 / g2 - 1)).toBeLessThan(1e-9);
    }
  });

  it('is never negative, also where a boson would be superradiant (a = 0.99, j = m = 5/2, Mω = 0.3 < mΩ_H, Mμ = 0.1)', () => {
    for (const kappaSign of [1, -1] as const) {
      const r = dirac(0.99, 2.5, 2.5, 0.3, 0.1, kappaSign, 1e-8);
      expect(r.k).toBeLessThan(0);
      expect(r.gamma).toBeGreaterThan(0);
      expect(r.superradiant).toBe(false);
    }
  });

  it('near threshold the two signs differ: Γ(κ = +1)/Γ(κ = −1) ≈ 5e-3 (within 20 %) at Mμ = 0.05, ω = 1.01μ, j = 1/2 (physics.md, independently verified), and → 1 within 1 % at ω = 20μ', () => {
    const near = dirac(0, 0.5, 0.5, 0.0505, 0.05, 1, 1e-9).gamma / dirac(0, 0.5, 0.5, 0.0505, 0.05, -1, 1e-9).gamma;
    expect(Math.abs(near / 5e-3 - 1)).toBeLessThan(0.2);
    const far = dirac(0, 0.5, 0.5, 1.0, 0.05, 1, 1e-9).gamma / dirac(0, 0.5, 0.5, 1.0, 0.05, -1, 1e-9).gamma;
    expect(Math.abs(far - 1)).toBeLessThan(0.01);
  });

  it('refuses ω ≤ μ with InputError naming omega, and a massive spin-1/2 mode without kappaSign naming mode.kappaSign', () => {
    expect(() => dirac(0, 0.5, 0.5, 0.1, 0.1, 1)).toThrow(InputError);
    try {
      dirac(0, 0.5, 0.5, 0.09, 0.1, 1);
    } catch (e) {
      expect((e as InputError).parameter).toBe('omega');
    }
    try {
      greybody({ hole: { a: 0 }, mode: { field: { spin: 0.5, mass: 0.1 }, l: 0.5, m: 0.5 }, omega: 0.3 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).parameter).toBe('mode.kappaSign');
    }
  });

  it('reports the sign it computed and an honest error: relError at tol 1e-8 is within 10× of the difference to a tol 1e-12 solve (a = 0.5, j = 1/2, Mω = 0.3, Mμ = 0.1)', () => {
    const coarse = dirac(0.5, 0.5, 0.5, 0.3, 0.1, -1, 1e-8);
    const fine = dirac(0.5, 0.5, 0.5, 0.3, 0.1, -1, 1e-12);
    expect(coarse.mode.kappaSign).toBe(-1);
    expect(coarse.relError).toBeLessThanOrEqual(1e-8);
    expect(Math.abs(coarse.gamma / fine.gamma - 1)).toBeLessThan(10 * coarse.relError);
  });
});

describe('radialFunction of massive fields without a Teukolsky radial function', () => {
  it('samples the massive Dirac pair (radial-function-dirac.test.ts) and the Proca field at a = 0 (massive-vector-radial.test.ts); a massive spin-2 field is an InputError naming mode.field.mass', () => {
    const dirac = { hole: { a: 0.5 }, mode: { field: { spin: 0.5, mass: 0.1 }, l: 0.5, m: 0.5, kappaSign: 1 }, omega: 0.3 };
    const proca = { hole: { a: 0 }, mode: { field: { spin: 1, mass: 0.1 }, l: 1, m: 0 }, omega: 0.3 };
    const graviton = { hole: { a: 0 }, mode: { field: { spin: 2, mass: 0.1 }, l: 2, m: 0 }, omega: 0.3 };
    expect(radialFunction(dirac as never, [3, 5]).samples).toHaveLength(2);
    expect(radialFunction(proca as never, [3, 5]).samples).toHaveLength(2);
    expect(() => radialFunction(graviton as never, [3, 5])).toThrow(InputError);
    expect(() => radialFunction(graviton as never, [3, 5])).toThrow(/mode\.field\.mass/);
  });
});
