/**
 * radialFunction of a massive Dirac mode (flux/src/radialFunctionDirac.ts):
 * Chandrasekhar's radial pair (Proc. R. Soc. A 349, 571 (1976)) on a grid.
 * Checks: the conserved current |P₊|² − |P₋|² (docs/massive-dirac.md §3,
 * from the pair's anti-Hermitian coupling), the greybody Γ read off the
 * samples far out (P₊ + qP₋ = (1 − q²)A e^{−iθ} at leading order in 1/r), and
 * μ → 0 against the massless s = 1/2 Teukolsky R (P₊ = Δ^{1/2}R₊ at μ = 0,
 * the in-project massless route).
 */
import { describe, expect, it } from 'vitest';
import { greybody, radialFunction } from '@penumbra/flux';
import { parameterOf } from '../../../test/helpers.js';

const dirac = (a: number, l: number, m: number, omega: number, mass: number, kappaSign: 1 | -1) => ({
  hole: { a },
  mode: { field: { spin: 0.5 as const, mass }, l, m, kappaSign },
  omega,
});
const abs = (z: { re: number; im: number }) => Math.hypot(z.re, z.im);

describe('radialFunction of a massive Dirac mode', () => {
  it('keeps the conserved current |P₊|² − |P₋|² = 1 (the horizon normalisation of greybody) to 1e-9 from r₊ + 0.01 to 300 M, and its ln|A| gives greybody’s Γ to 1e-9 (a = 0.7, j = 3/2, m = 1/2, Mω = 0.5, Mμ = 0.2, κ < 0)', () => {
    const problem = dirac(0.7, 1.5, 0.5, 0.5, 0.2, -1);
    const radii = [300, 1.72, 2, 3, 5, 10, 30, 100];
    const f = radialFunction(problem, radii, { tol: 1e-10 });
    expect(f.samples.map((s) => s.r)).toEqual([...radii].sort((x, y) => x - y));
    for (const s of f.samples) expect(Math.abs(abs(s.pPlus) ** 2 - abs(s.pMinus) ** 2 - 1)).toBeLessThan(1e-9);
    const g = greybody(problem, { tol: 1e-10 });
    expect(f.lambda).toBe(g.diagnostics.lambda);
    const gamma = ((0.5 + f.kInf) / (2 * f.kInf)) * Math.exp(-2 * f.logAbsIn);
    expect(Math.abs(gamma / g.gamma - 1)).toBeLessThan(1e-9);
  });

  it('far out, the incoming amplitude read off the samples, |P₊ + qP₋|/(1 − q²) with q = μ/(ω + k∞), gives greybody’s Γ within 3/(k∞r) at r = 1000, 2000, 4000 M (a = 0.7, j = 3/2, Mω = 0.35, Mμ = 0.2, Γ ≈ 0.05)', () => {
    const [omega, mu] = [0.35, 0.2];
    const problem = dirac(0.7, 1.5, 0.5, omega, mu, -1);
    const g = greybody(problem, { tol: 1e-10 });
    const f = radialFunction(problem, [1000, 2000, 4000], { tol: 1e-10 });
    const q = mu / (omega + f.kInf);
    for (const s of f.samples) {
      const A = Math.hypot(s.pPlus.re + q * s.pMinus.re, s.pPlus.im + q * s.pMinus.im) / (1 - q * q);
      const gamma = (omega + f.kInf) / (2 * f.kInf) / (A * A);
      expect(Math.abs(gamma / g.gamma - 1)).toBeLessThan(3 / (f.kInf * s.r));
    }
  });

  it('tends to the massless s = 1/2 Teukolsky solution as μ → 0: |P₊| = |Δ^{1/2}R₊| up to shifts O(μ) of opposite sign for the two signs of κ (doubling μ doubles them within 5 %), a = 0.6, j = 3/2, m = 1/2, Mω = 0.4', () => {
    const [a, omega] = [0.6, 0.4];
    const radii = [1.9, 2.5, 4, 8, 20, 45];
    const massless = radialFunction({ hole: { a }, mode: { field: { spin: 0.5 }, l: 1.5, m: 0.5 }, omega }, radii, {
      tol: 1e-10,
    });
    const [rPlus, rMinus] = [1 + Math.sqrt(1 - a * a), 1 - Math.sqrt(1 - a * a)];
    const shift = (mu: number, kappaSign: 1 | -1) =>
      radialFunction(dirac(a, 1.5, 0.5, omega, mu, kappaSign), radii, { tol: 1e-10 }).samples.map(
        (s, i) => abs(s.pPlus) / (Math.sqrt((s.r - rPlus) * (s.r - rMinus)) * abs(massless.samples[i].R)) - 1,
      );
    const [p1, m1, p2] = [shift(1e-4, 1), shift(1e-4, -1), shift(2e-4, 1)];
    for (let i = 1; i < radii.length; i++) {
      expect(Math.abs(p1[i])).toBeLessThan(1e-3);
      expect(Math.abs(p1[i] + m1[i])).toBeLessThan(0.05 * Math.abs(p1[i]));
      expect(Math.abs(p2[i] / p1[i] - 2)).toBeLessThan(0.1);
    }
  });

  it('refuses a massive spin-1/2 mode without kappaSign (mode.kappaSign), ω ≤ μ (omega), a radius inside the horizon (radii[i]) and unknown options', () => {
    const ok = dirac(0.5, 0.5, 0.5, 0.3, 0.1, 1);
    const noSign = { ...ok, mode: { field: { spin: 0.5, mass: 0.1 }, l: 0.5, m: 0.5 } };
    expect(parameterOf(() => radialFunction(noSign, [3]))).toBe('mode.kappaSign');
    expect(parameterOf(() => radialFunction({ ...ok, omega: 0.1 }, [3]))).toBe('omega');
    expect(parameterOf(() => radialFunction(ok, [3, 1.5]))).toBe('radii[1]');
    expect(parameterOf(() => radialFunction(ok, [3], { reflection: false } as never))).toBe('options.reflection');
  });
});
