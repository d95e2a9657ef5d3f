/**
 * Invariants that need no reference values: the m → −m, a → −a symmetry of
 * the Teukolsky equations (physics notes: A_{s l −m}(−c) = A_{s l m}(c), and
 * the radial equation depends on a and m only through am, a² and Ω_H m), flux
 * conservation Γ + R = 1 with R from an independent (−s field) solve, bounds
 * outside the superradiant band, and independence of the answer from the
 * numerical choices (start point, switching radius, matching radius,
 * tolerance, integrator).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { kerrHole } from '@penumbra/kerr';
import { greybody } from '@penumbra/flux';

const spinArb = fc.constantFrom(0 as const, 0.5 as const, 1 as const, 2 as const);
const modeArb = spinArb.chain((spin) =>
  fc.integer({ min: 0, max: 3 }).chain((dl) => {
    const l = spin + dl;
    return fc.integer({ min: 0, max: 2 * l }).map((i) => ({ spin, l, m: i - l }));
  }),
);

describe('greybody invariants', () => {
  it('Γ_{s l m}(ω; a) = Γ_{s l −m}(ω; −a) to 1e-9 relative (property, fast-check)', () => {
    fc.assert(
      fc.property(
        modeArb,
        fc.double({ min: -0.999, max: 0.999, noNaN: true }),
        fc.double({ min: 0.02, max: 2.5, noNaN: true }),
        (mode, a, omega) => {
          const g1 = greybody(
            { hole: { a }, mode: { field: { spin: mode.spin }, l: mode.l, m: mode.m }, omega },
            { tol: 1e-10, reflection: false },
          );
          const g2 = greybody(
            { hole: { a: -a }, mode: { field: { spin: mode.spin }, l: mode.l, m: -mode.m }, omega },
            { tol: 1e-10, reflection: false },
          );
          return Math.abs(g1.gamma / g2.gamma - 1) < 1e-9;
        },
      ),
      { numRuns: 30, seed: 3 },
    );
  });

  it('conserves flux: |Γ + R − 1| < 1e-8 with R from the −s field, and 0 ≤ Γ ≤ 1 outside the superradiant band (property, fast-check)', () => {
    fc.assert(
      fc.property(
        modeArb,
        fc.double({ min: -0.9999, max: 0.9999, noNaN: true }),
        fc.double({ min: 1e-3, max: 4, noNaN: true }),
        (mode, a, omega) => {
          const g = greybody({ hole: { a }, mode: { field: { spin: mode.spin }, l: mode.l, m: mode.m }, omega });
          const superradiant = mode.spin !== 0.5 && omega < mode.m * kerrHole({ a: a }).omegaH;
          const bounded = superradiant || (g.gamma >= 0 && g.gamma <= 1 + 1e-8);
          return g.residual < 1e-8 && g.relError <= 1e-8 && bounded;
        },
      ),
      { numRuns: 40, seed: 11 },
    );
  });

  const cases = [
    { hole: { a: 0.9 }, mode: { field: { spin: 0 as const }, l: 2, m: 1 }, omega: 0.4 },
    { hole: { a: 0.7 }, mode: { field: { spin: 0.5 as const }, l: 1.5, m: 0.5 }, omega: 0.6 },
    { hole: { a: 0.999 }, mode: { field: { spin: 1 as const }, l: 1, m: 1 }, omega: 0.3 },
    { hole: { a: 0.9999 }, mode: { field: { spin: 2 as const }, l: 2, m: 2 }, omega: 0.6 },
    { hole: { a: 0.5 }, mode: { field: { spin: 2 as const }, l: 4, m: -3 }, omega: 1.2 },
  ];
  for (const c of cases) {
    it(`s=${c.mode.field.spin} l=${c.mode.l} m=${c.mode.m} a=${c.hole.a} Mω=${c.omega}: Γ moves < 1e-9 when the start point, matching radius, tolerance or integrator change`, () => {
      const ref = greybody(c, { tol: 1e-11 }).gamma;
      const variants = [
        greybody(c, { tol: 1e-11, startFraction: 0.05 }),
        greybody(c, { tol: 1e-11, matchRadius: 2 * greybody(c).diagnostics.matchRadius }),
        greybody(c, { tol: 1e-9 }),
        greybody(c, { tol: 1e-10, integrator: 'cash-karp' }),
      ];
      for (const v of variants) expect(Math.abs(v.gamma / ref - 1)).toBeLessThan(1e-9);
    });
  }

  it('stays accurate at high frequency with large l (s = 0, l = 50, m = 10, a = 0.9, Mω = 20): residual < 1e-9, Γ ≈ 1', () => {
    const g = greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0 }, l: 50, m: 10 }, omega: 20 });
    expect(g.residual).toBeLessThan(1e-9);
    expect(Math.abs(g.gamma - 1)).toBeLessThan(1e-8);
  });
});
