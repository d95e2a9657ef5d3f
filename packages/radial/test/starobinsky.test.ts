/**
 * The Teukolsky–Starobinsky map D^{2s} (Teukolsky & Press, ApJ 193, 443
 * (1974)) takes −s solutions to +s solutions. Checks: (i) near the horizon the
 * mapped −s horizon series equals h_s times the +s horizon series, with the
 * closed-form factor h_s = Π 2(2Mr+)((s−j)κ − ik) derived in docs/method.md;
 * (ii) the two-sided route and the one-sided +s route give the same |Z_in| for
 * modes where the one-sided route is well conditioned.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';
import { horizonSeriesStart, starobinskyHorizonFactor, starobinskyMapAt } from '@penumbra/radial/internal';

const cases = [
  { a: 0, s: 0.5, m: 0.5, omega: 0.3, lambdaPlus: 0 },
  { a: 0.8, s: 1, m: 1, omega: 0.2, lambdaPlus: 0.7 },
  { a: 0.95, s: 2, m: 2, omega: 0.6, lambdaPlus: -1.9 },
  { a: 0.5, s: 2, m: -1, omega: 1.3, lambdaPlus: 4.2 },
];

describe('Teukolsky–Starobinsky map', () => {
  for (const c of cases) {
    it(`maps the −s horizon solution to h_s × the +s horizon solution to 1e-9 (a=${c.a}, s=${c.s}, m=${c.m})`, () => {
      const hole = kerrHole({ a: c.a });
      const b = hole.rPlus - hole.rMinus;
      const minus = { s: -c.s, m: c.m, omega: c.omega, lambda: c.lambdaPlus + 2 * c.s };
      const plus = { s: c.s, m: c.m, omega: c.omega, lambda: c.lambdaPlus };
      const x = 0.1 * b;
      const rm = horizonSeriesStart(hole, minus, x);
      const rp = horizonSeriesStart(hole, plus, x);
      const map = starobinskyMapAt(hole, minus, hole.rPlus + x);
      const mul = (z: number[], w: number[]) => [z[0] * w[0] - z[1] * w[1], z[0] * w[1] + z[1] * w[0]];
      const a0R = mul(map.a0, rm.R),
        b0dR = mul(map.b0, rm.dR);
      const mapped = [a0R[0] + b0dR[0], a0R[1] + b0dR[1]];
      const expected = mul(starobinskyHorizonFactor(hole, c.s, c.omega - c.m * hole.omegaH), rp.R);
      const err = Math.hypot(mapped[0] - expected[0], mapped[1] - expected[1]) / Math.hypot(expected[0], expected[1]);
      expect(err).toBeLessThan(1e-9);
    });
    it(`two-sided and one-sided +s routes agree on ln|Z_in| to 1e-9 (a=${c.a}, s=${c.s}, m=${c.m})`, () => {
      const hole = kerrHole({ a: c.a });
      const p = { hole, s: c.s, m: c.m, omega: c.omega, lambda: c.lambdaPlus };
      const one = solveRadial(p, { tol: 1e-13 });
      const two = solveTwoSided(p, { tol: 1e-13 });
      expect(Math.abs(one.logAbsZIn - two.logAbsZInPlus)).toBeLessThan(1e-9);
    });
  }
  it('the two-sided route does not move when the switching radius moves (s = 2, a = 0.9999, deep superradiant, 1e-9)', () => {
    const hole = kerrHole({ a: 0.9999 });
    const p = { hole, s: 2, m: 2, omega: 0.0164, lambda: -2.0 };
    const ref = solveTwoSided(p, { tol: 1e-13 }).logAbsZInPlus;
    for (const rs of [hole.rPlus + 0.3, hole.rPlus + 3]) {
      expect(Math.abs(solveTwoSided(p, { tol: 1e-13, switchRadius: rs }).logAbsZInPlus - ref)).toBeLessThan(1e-9);
    }
  });
});

describe('+s and −s formulations', () => {
  it('give the same |Z_in| where both are computed: |Y_in| of the −s field, mapped by (2ω)^{2s}/|h_s|, matches |Z_in| of the +s field (1e-6 relative, property, fast-check)', async () => {
    const fc = (await import('fast-check')).default;
    fc.assert(
      fc.property(
        fc.constantFrom(0.5, 1, 2),
        fc.double({ min: -0.99, max: 0.99, noNaN: true }),
        fc.double({ min: 0.2, max: 1.5, noNaN: true }),
        fc.double({ min: -2, max: 6, noNaN: true }),
        (s, a, omega, lambdaPlus) => {
          const hole = kerrHole({ a: a });
          const m = s;
          const sol = solveTwoSided({ hole, s, m, omega, lambda: lambdaPlus }, { tol: 1e-13 });
          const h = starobinskyHorizonFactor(hole, s, omega - m * hole.omegaH);
          // D^{2s} maps e^{−iωr*}/r to (−2iω)^{2s} e^{−iωr*}/r: Z_in = (−2iω)^{2s} Y_in / h_s.
          const lnFromMinus = 2 * s * Math.log(2 * omega) + sol.logAbsYInMinus - Math.log(Math.hypot(h[0], h[1]));
          return Math.abs(Math.expm1(lnFromMinus - sol.logAbsZInPlus)) < 1e-6;
        },
      ),
      { numRuns: 30, seed: 5 },
    );
  });
});

describe('formulation independence', () => {
  it('integrating u = e^{iφ}R (ingoing phase removed) instead of R moves ln|Z_in| by < 1e-9 (s = 0, 1/2, 1, 2; a up to 0.9999)', () => {
    const cases = [
      { a: 0, s: 0, m: 0, omega: 0.3, lambda: 2 },
      { a: 0.9, s: 0.5, m: 0.5, omega: 0.2, lambda: 0.4 },
      { a: 0.7, s: 1, m: 1, omega: 0.3, lambda: 0.1 },
      { a: 0.9999, s: 2, m: 2, omega: 0.6, lambda: -2.5 },
    ];
    for (const c of cases) {
      const hole = kerrHole({ a: c.a });
      const p = { hole, s: c.s, m: c.m, omega: c.omega, lambda: c.lambda };
      const plain = c.s === 0 ? solveRadial(p, { tol: 1e-12 }).logAbsZIn : solveTwoSided(p, { tol: 1e-12 }).logAbsZInPlus;
      const phase =
        c.s === 0
          ? solveRadial(p, { tol: 1e-12, variable: 'phase' }).logAbsZIn
          : solveTwoSided(p, { tol: 1e-12, variable: 'phase' }).logAbsZInPlus;
      expect(Math.abs(plain - phase)).toBeLessThan(1e-9);
    }
  });
});
