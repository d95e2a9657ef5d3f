/**
 * The massive scalar (Klein–Gordon) field on Kerr: Γ for Mω > Mμ. Sources
 * beside each check; the derivation of the far-zone series with its
 * long-range phase and of the flux normalisation is docs/massive-fields.md.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { absorptionCrossSection, greybody, radialFunction } from '@penumbra/flux';

interface Row {
  l: number;
  m: number;
  a: number;
  omega: number;
  fieldMass: number;
  gamma_str: string;
  reflection_str: string;
  digits: number;
}
const fixture = JSON.parse(readFileSync(new URL('../../../test/fixtures/massive/reference.json', import.meta.url), 'utf8'));
const rows: Row[] = fixture.rows;

const scalar = (a: number, l: number, m: number, omega: number, mass: number) =>
  greybody({ hole: { a }, mode: { field: { spin: 0, mass }, l, m }, omega });

describe('massive scalar greybody factor', () => {
  it(`matches all ${rows.length} rows of the 30-digit mpmath reference (test/fixtures/massive) to 1e-8 relative, within 10× the reported error estimate (floor 1e-11)`, () => {
    expect(rows.length).toBeGreaterThanOrEqual(6);
    for (const r of rows) {
      const where = `l=${r.l} m=${r.m} a=${r.a} Mω=${r.omega} Mμ=${r.fieldMass}`;
      expect(r.digits, where).toBeGreaterThan(30);
      const g = scalar(r.a, r.l, r.m, r.omega, r.fieldMass);
      const err = Math.abs(g.gamma / Number(r.gamma_str) - 1);
      expect(err, where).toBeLessThan(1e-8);
      expect(err, where).toBeLessThan(10 * Math.max(g.relError, 1e-11));
      expect(Math.abs(g.reflection - Number(r.reflection_str)), where).toBeLessThan(1e-8);
    }
  });

  it('conserves flux: |Γ + R − 1| ≤ 1e-8 with R from the outgoing amplitude of the same solve (Wronskian of u = √(r² + a²) R, docs/massive-fields.md)', () => {
    for (const [a, l, m, w, mu] of [
      [0.9, 1, 1, 0.4, 0.3],
      [0.5, 2, -2, 0.7, 0.6],
      [0.99, 1, 1, 0.3, 0.2],
      [0, 0, 0, 0.05, 0.04],
    ]) {
      expect(scalar(a, l, m, w, mu).residual).toBeLessThan(1e-8);
    }
  });

  it('--field-mass 0 is the massless computation: every number identical (massless path, μ = 0 exactly)', () => {
    const massless = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0 }, l: 1, m: 1 }, omega: 0.4 });
    const zero = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0, mass: 0 }, l: 1, m: 1 }, omega: 0.4 });
    expect(zero).toEqual(massless);
  });

  it('μ → 0 is continuous with the massless Γ at rate O(μ²): the difference scales by 100 ± 1 % when Mμ drops tenfold (the mass enters as μ²)', () => {
    const g0 = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0 }, l: 1, m: 1 }, omega: 0.4 }).gamma;
    const d = [1e-2, 1e-3].map((mu) => scalar(0.9, 1, 1, 0.4, mu).gamma - g0);
    expect(Math.abs(d[0])).toBeLessThan(1e-3);
    expect(d[0] / d[1]).toBeGreaterThan(99);
    expect(d[0] / d[1]).toBeLessThan(101);
  });

  it('does not move with the matching radius: Γ at r_match = default, 200M, 500M agrees to 1e-9 relative (the long-range phase is in the far series)', () => {
    const base = scalar(0.9, 1, 1, 0.4, 0.3).gamma;
    for (const matchRadius of [200, 500]) {
      const g = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0, mass: 0.3 }, l: 1, m: 1 }, omega: 0.4 }, { matchRadius });
      expect(Math.abs(g.gamma / base - 1)).toBeLessThan(1e-9);
    }
  });

  it('Γ_{l m}(ω; a) = Γ_{l −m}(ω; −a) to 1e-9 relative (property, fast-check; the equations depend on a, m through am, a², mΩ_H)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 2 }).chain((l) => fc.integer({ min: -l, max: l }).map((m) => ({ l, m }))),
        fc.double({ min: -0.99, max: 0.99, noNaN: true }),
        fc.double({ min: 0.05, max: 1.5, noNaN: true }),
        fc.double({ min: 0.01, max: 0.95, noNaN: true }),
        ({ l, m }, a, omega, fraction) => {
          const mu = fraction * omega;
          const g1 = scalar(a, l, m, omega, mu).gamma;
          const g2 = scalar(-a, l, -m, omega, mu).gamma;
          return Math.abs(g1 - g2) <= 1e-9 * Math.abs(g1) + 1e-300;
        },
      ),
      { numRuns: 12, seed: 12 },
    );
  });

  it('Γ < 0 exactly for μ < ω < mΩ_H (superradiance, Teukolsky & Press, ApJ 193, 443 (1974); Zel’dovich’s condition ω < mΩ_H), Γ > 0 above it: a = 0.99, l = m = 1, Mμ = 0.2', () => {
    const omegaH = kerrHole({ a: 0.99 }).omegaH;
    for (let i = 1; i < 12; i++) {
      const w = 0.2 + ((omegaH - 0.2) * i) / 12;
      expect(scalar(0.99, 1, 1, w, 0.2).gamma, `Mω=${w}`).toBeLessThan(0);
    }
    for (const w of [omegaH * 1.02, omegaH * 1.3, 0.9]) expect(scalar(0.99, 1, 1, w, 0.2).gamma, `Mω=${w}`).toBeGreaterThan(0);
  });

  it('refuses ω ≤ μ with an InputError naming omega that says no wave reaches infinity (bound states)', () => {
    for (const w of [0.3, 0.2]) {
      let error: unknown;
      try {
        scalar(0.9, 1, 1, w, 0.3);
      } catch (e) {
        error = e;
      }
      expect(error).toBeInstanceOf(InputError);
      expect((error as InputError).parameter).toBe('omega');
      expect((error as Error).message).toMatch(/no wave reaches infinity/);
      expect((error as Error).message).toMatch(/bound states/);
    }
  });

  it('refuses a massive field of a spin without a massive route with an InputError naming mode.field.mass', () => {
    expect(() => greybody({ hole: { a: 0.5 }, mode: { field: { spin: 2, mass: 0.1 }, l: 2, m: 1 }, omega: 0.4 })).toThrow(
      expect.objectContaining({ parameter: 'mode.field.mass' }),
    );
  });

  it('echoes the field mass in the solution (mode.field.mass) and keeps the massless keys', () => {
    const g = scalar(0.9, 1, 1, 0.4, 0.3);
    expect(g.mode.field).toEqual({ spin: 0, mass: 0.3 });
    const massless = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0 }, l: 1, m: 1 }, omega: 0.4 });
    expect(Object.keys(g).sort()).toEqual(Object.keys(massless).sort());
  });

  it('radialFunction takes a massive scalar: ln|Z_in| equals the one behind Γ = (k/k∞)(2Mr+)/|Z_in|² to 1e-8', () => {
    const g = scalar(0.9, 1, 1, 0.4, 0.3);
    const f = radialFunction({ hole: { a: 0.9 }, mode: { field: { spin: 0, mass: 0.3 }, l: 1, m: 1 }, omega: 0.4 }, [3, 10]);
    const hole = kerrHole({ a: 0.9 });
    const kInf = Math.sqrt(0.4 * 0.4 - 0.3 * 0.3);
    const gamma = ((g.k / kInf) * 2 * hole.rPlus) / Math.exp(2 * f.logAbsZIn);
    expect(Math.abs(gamma / g.gamma - 1)).toBeLessThan(1e-8);
    expect(f.samples.length).toBe(2);
  });
});

describe('massive scalar cross-section', () => {
  it('low velocity: the s-wave σ = (π/k∞²)Γ approaches A_H ξ/((1 − e^{−ξ})v), ξ = 2πMω(1 + v²)/v (physics notes, after Unruh, Phys. Rev. D 14, 3251 (1976)) — within 1.2 % at Mμ = 0.01 for v = 0.5 … 0.01, and the deviation falls ≥ 3× each time Mμ halves', () => {
    const AH = 16 * Math.PI;
    const deviation = (mu: number, v: number) => {
      const w = mu / Math.sqrt(1 - v * v);
      const k = w * v;
      const sigma = (Math.PI / (k * k)) * scalar(0, 0, 0, w, mu).gamma;
      const xi = (2 * Math.PI * w * (1 + v * v)) / v;
      return sigma / ((AH * xi) / ((1 - Math.exp(-xi)) * v)) - 1;
    };
    for (const v of [0.5, 0.1, 0.01]) {
      const d = [0.02, 0.01, 0.005].map((mu) => Math.abs(deviation(mu, v)));
      expect(d[1], `v=${v}`).toBeLessThan(0.012);
      expect(d[0] / d[1], `v=${v}`).toBeGreaterThan(3);
      expect(d[1] / d[2], `v=${v}`).toBeGreaterThan(3);
    }
  });

  it('high energy: σ → 27πM² for ω ≫ μ at a = 0 (Misner, Thorne & Wheeler, Gravitation (1973)) — within 3 % at Mω = 3, Mμ = 0.3, and within 1 % of the massless σ there', () => {
    const massive = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0, mass: 0.3 }, omega: 3 }, { tol: 1e-6 });
    const massless = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 3 }, { tol: 1e-6 });
    expect(Math.abs(massive.sigma / (27 * Math.PI) - 1)).toBeLessThan(0.03);
    expect(Math.abs(massive.sigma / massless.sigma - 1)).toBeLessThan(0.01);
    expect(massive.field).toEqual({ spin: 0, mass: 0.3 });
  });

  it('geometric optics for slow particles: σ → π b_c², b_c² = M²(8v⁴ + 20v² − 1 + (1 + 8v²)^{3/2})/(2v⁴) (capture of massive particles by a Schwarzschild hole, value from memory; 27M² at v = 1, 16M²/v² as v → 0) — within 3 % at Mω = 3 for v = 0.8 and 0.6', () => {
    for (const v of [0.8, 0.6]) {
      const mu = 3 * Math.sqrt(1 - v * v);
      const s = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0, mass: mu }, omega: 3 }, { tol: 1e-6 });
      const v2 = v * v;
      const bc2 = (8 * v2 * v2 + 20 * v2 - 1 + (1 + 8 * v2) ** 1.5) / (2 * v2 * v2);
      expect(Math.abs(s.sigma / (Math.PI * bc2) - 1), `v=${v}`).toBeLessThan(0.03);
    }
  });

  it('refuses Mω ≤ Mμ with an InputError naming omega', () => {
    expect(() => absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0, mass: 0.5 }, omega: 0.4 })).toThrow(
      expect.objectContaining({ parameter: 'omega' }),
    );
  });
});
