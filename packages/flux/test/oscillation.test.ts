/**
 * The 'riccati' oscillation route (default; docs/method.md, section 9)
 * against the earlier integrator-only route ('ode', kept for cross-checks):
 * for modes whose far zone or near-horizon zone holds many oscillations, the
 * two agree within the reported error, and the reported error covers the
 * difference from a tighter integrator-only solve (honest estimate).
 */
import { describe, expect, it } from 'vitest';
import { greybody } from '@penumbra/flux';

const modes = [
  { label: 's = 0, l = 40, m = 20, a = 0.7, Mω = 1 (far zone to ~300 M)', spin: 0, l: 40, m: 20, a: 0.7, omega: 1 },
  { label: 's = 2, l = 2, m = 2, a = 0.99, Mω = 20 (near-horizon winding)', spin: 2, l: 2, m: 2, a: 0.99, omega: 20 },
  { label: 's = 1/2, l = 25/2, m = 1/2, a = 0, Mω = 12', spin: 0.5, l: 12.5, m: 0.5, a: 0, omega: 12 },
  {
    label: 'massive scalar l = 3, m = 3, a = 0.99, Mω = 2 at v = k∞/ω = 0.05',
    spin: 0,
    l: 3,
    m: 3,
    a: 0.99,
    omega: 2,
    mass: 2 * Math.sqrt(1 - 0.05 ** 2),
  },
];

describe("greybody: the 'riccati' route against the 'ode' route", () => {
  for (const x of modes) {
    it(`${x.label}: |Γ_riccati/Γ_ode − 1| ≤ relError ≤ 1e-8, and |Γ_riccati/Γ_tight − 1| ≤ relError for an 'ode' solve at tol 1e-11`, () => {
      const problem = {
        hole: { a: x.a },
        mode: { field: x.mass ? { spin: x.spin, mass: x.mass } : { spin: x.spin }, l: x.l, m: x.m },
        omega: x.omega,
      };
      const ric = greybody(problem);
      const ode = greybody(problem, { oscillation: 'ode' });
      const tight = greybody(problem, { oscillation: 'ode', tol: 1e-11 });
      const lg = (g: { log10Gamma?: number }) => g.log10Gamma ?? Number.NaN;
      const rel = (a: number, b: number) => Math.abs(Math.expm1((a - b) * Math.LN10));
      expect(ric.relError).toBeLessThanOrEqual(1e-8);
      expect(rel(lg(ric), lg(ode))).toBeLessThanOrEqual(ric.relError + ode.relError);
      expect(rel(lg(ric), lg(tight))).toBeLessThanOrEqual(ric.relError);
      expect(ric.diagnostics.rhsEvaluations).toBeLessThan(ode.diagnostics.rhsEvaluations);
    });
  }

  it("refuses an unknown oscillation name with an InputError naming 'oscillation'", () => {
    expect(() =>
      greybody({ hole: { a: 0 }, mode: { field: { spin: 0 }, l: 0, m: 0 }, omega: 0.3 }, { oscillation: 'wkb' as never }),
    ).toThrow(/oscillation/);
  });
});
