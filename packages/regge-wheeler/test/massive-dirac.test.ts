/**
 * The massive Dirac real-potential route (docs/massive-dirac.md, section 4;
 * Chandrasekhar's reduction, The Mathematical Theory of Black Holes, 1983).
 * Its agreement with the Kerr route is tested in packages/flux; here: flux
 * conservation of the real problem, the μ → 0 limit against the massless
 * Dirac potential of this package, and the refusals.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { schwarzschildGreybody, schwarzschildMassiveDiracGreybody } from '@penumbra/regge-wheeler';

describe('schwarzschildMassiveDiracGreybody', () => {
  it('conserves flux, |Γ + R − 1| ≤ 1e-10, with an error estimate ≤ 1e-10 (j = 3/2, κ = −2, Mω = 0.6, Mμ = 0.3)', () => {
    const r = schwarzschildMassiveDiracGreybody({ l: 1.5, kappaSign: -1, omega: 0.6, fieldMass: 0.3 });
    expect(r.residual).toBeLessThan(1e-10);
    expect(r.diagnostics.errorEstimate).toBeLessThan(1e-10);
  });

  it('tends to the massless Dirac potential W² ± dW/dr* result as μ → 0: the shifts of the two signs are opposite (their mean is 10× closer than either) at Mμ = 1e-2 (j = 1/2, Mω = 0.3)', () => {
    const massless = schwarzschildGreybody({ field: { spin: 0.5 }, l: 0.5, omega: 0.3 }).gamma;
    const plus = schwarzschildMassiveDiracGreybody({ l: 0.5, kappaSign: 1, omega: 0.3, fieldMass: 1e-2 }).gamma;
    const minus = schwarzschildMassiveDiracGreybody({ l: 0.5, kappaSign: -1, omega: 0.3, fieldMass: 1e-2 }).gamma;
    const mean = Math.abs((plus + minus) / 2 - massless);
    expect(Math.sign(plus - massless)).toBe(-Math.sign(minus - massless));
    expect(10 * mean).toBeLessThan(Math.min(Math.abs(plus - massless), Math.abs(minus - massless)));
  });

  it('refuses ω ≤ μ with InputError naming omega', () => {
    expect(() => schwarzschildMassiveDiracGreybody({ l: 0.5, kappaSign: 1, omega: 0.1, fieldMass: 0.1 })).toThrow(InputError);
    expect(() => schwarzschildMassiveDiracGreybody({ l: 0.5, kappaSign: 1, omega: 0.1, fieldMass: 0.1 })).toThrow(/omega/);
  });
});
