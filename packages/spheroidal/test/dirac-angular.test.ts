/**
 * The massive Dirac separation constant λ (Chandrasekhar, Proc. R. Soc. A
 * 349, 571 (1976); docs/massive-dirac.md). Checks: the exact a = 0 values
 * λ = κ = ±(j + ½); at μ = 0 the identity λ² = A_{+1/2} + 1 + c² − 2mc with
 * the in-project s = 1/2 spheroidal eigenvalue (itself checked against
 * Leaver's continued fraction); an mpmath Galerkin computation at 40 digits
 * (fixtures/make_dirac_angular_fixture.py); the symmetry λ(κ, aμ) = −λ(−κ, −aμ).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { diracAngularEigenvalue, spheroidalEigenvalue } from '@penumbra/spheroidal';

const fixture = JSON.parse(readFileSync(new URL('./fixtures/dirac-angular.json', import.meta.url), 'utf8')) as {
  values: { j: number; m: number; aOmega: number; aMu: number; kappaSign: 1 | -1; lambda: string }[];
};

describe('massive Dirac angular eigenvalue λ', () => {
  it('equals κ = kappaSign·(j + ½) exactly (to 1e-14) at a = 0 for j ≤ 7/2, every m', () => {
    for (let j = 0.5; j <= 3.5; j++) {
      for (let m = -j; m <= j; m++) {
        for (const kappaSign of [1, -1] as const) {
          const { lambda } = diracAngularEigenvalue({ j, m, aOmega: 0, aMu: 0, kappaSign });
          expect(Math.abs(lambda - kappaSign * (j + 0.5))).toBeLessThan(1e-14);
        }
      }
    }
  });

  it('at μ = 0 satisfies λ² = A_{+1/2,jm}(c) + 1 + c² − 2mc to 1e-12 relative (in-project s = 1/2 spheroidal eigenvalue), also at small c where the spectrum is symmetric about σ = 0', () => {
    for (const [j, m, c] of [
      [0.5, -0.5, -0.01],
      [1.5, 1.5, 0.01],
      [0.5, 0.5, 0.7],
      [1.5, 0.5, -1.3],
      [2.5, -1.5, 4],
      [0.5, -0.5, 12],
      [5.5, 3.5, 20],
    ]) {
      const A = spheroidalEigenvalue({ s: 0.5, l: j, m, c }).A;
      const target = A + 1 + c * c - 2 * m * c;
      for (const kappaSign of [1, -1] as const) {
        const { lambda } = diracAngularEigenvalue({ j, m, aOmega: c, aMu: 0, kappaSign });
        expect(Math.sign(lambda)).toBe(kappaSign);
        expect(Math.abs(lambda * lambda - target) / Math.max(1, target)).toBeLessThan(1e-12);
      }
    }
  });

  it('matches the 40-digit mpmath Galerkin values to 1e-12 relative (fixtures/dirac-angular.json)', () => {
    expect(fixture.values.length).toBeGreaterThanOrEqual(8);
    for (const v of fixture.values) {
      const { lambda, diagnostics } = diracAngularEigenvalue(v);
      const ref = Number(v.lambda);
      expect(Math.abs(lambda / ref - 1)).toBeLessThan(1e-12);
      expect(diagnostics.errorEstimate).toBeLessThan(1e-12);
    }
  });

  it('obeys λ(κ, aμ) = −λ(−κ, −aμ) to 1e-13 (symmetry of the pair under λ → −λ, μ → −μ)', () => {
    for (const [j, m, aw, amu] of [
      [0.5, 0.5, 0.5, 0.3],
      [2.5, -0.5, 3, 2],
    ]) {
      const a = diracAngularEigenvalue({ j, m, aOmega: aw, aMu: amu, kappaSign: 1 }).lambda;
      const b = diracAngularEigenvalue({ j, m, aOmega: aw, aMu: -amu, kappaSign: -1 }).lambda;
      expect(Math.abs(a + b)).toBeLessThan(1e-13 * Math.abs(a));
    }
  });

  it('refuses a bad label with InputError naming it (j integer, |m| > j, kappaSign 0)', () => {
    expect(() => diracAngularEigenvalue({ j: 1, m: 0.5, aOmega: 0, aMu: 0, kappaSign: 1 })).toThrow(InputError);
    expect(() => diracAngularEigenvalue({ j: 0.5, m: 1.5, aOmega: 0, aMu: 0, kappaSign: 1 })).toThrow(/m/);
    expect(() => diracAngularEigenvalue({ j: 0.5, m: 0.5, aOmega: 0, aMu: 0, kappaSign: 0 as 1 })).toThrow(/kappaSign/);
  });
});
