/**
 * The far-zone carry of the massive Dirac pair (radial/src/dirac/farRiccati.ts,
 * docs/massive-dirac.md section 3) against the ODE integrated out to the far
 * series (farCarry: false, the route it replaces), near threshold at high
 * energy where the series converges only at ~1e4 M. λ = κ = ±(j + ½) at a = 0
 * (Chandrasekhar 1976). Independent check at a = 0 against the real-potential
 * route: packages/flux/test/massive-dirac.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveMassiveDiracRadial } from '@penumbra/radial';

const omega = 2.5;
const mu = omega * Math.sqrt(1 - 0.05 ** 2); // v = k∞/ω = 0.05
const problem = (lambda: number) => ({ hole: kerrHole({ a: 0, mass: 1 }), omega, m: 0.5, mu, lambda });

describe('massive Dirac far-zone carry', () => {
  it('gives ln|A| and ln|B| of the ODE-to-series route within both error estimates, from a matching radius ~1000× smaller and with ≥ 10× fewer evaluations (a = 0, j = 3/2, Mω = 2.5, v = 0.05, both signs)', () => {
    for (const lambda of [2, -2]) {
      const carried = solveMassiveDiracRadial(problem(lambda), { tol: 1e-12 });
      const direct = solveMassiveDiracRadial(problem(lambda), { tol: 1e-12, farCarry: false });
      const d = carried.diagnostics;
      expect(d.carrySteps).toBeGreaterThan(0);
      expect(d.seriesRadius / d.matchRadius).toBeGreaterThan(500);
      expect(direct.diagnostics.carrySteps).toBe(0);
      const bound = d.errorEstimate + direct.diagnostics.errorEstimate;
      expect(Math.abs(carried.logAbsIn - direct.logAbsIn)).toBeLessThan(bound);
      // |B| ~ 1e-5 |A| here: its error is relative to |A|
      expect(
        Math.abs(Math.exp(carried.logAbsOut - carried.logAbsIn) - Math.exp(direct.logAbsOut - direct.logAbsIn)),
      ).toBeLessThan(bound);
      expect(10 * d.rhsEvaluations).toBeLessThan(direct.diagnostics.rhsEvaluations);
    }
  });

  it('conserves the current: (ω + k∞)/(2k∞|A|²) + |B/A|² = 1 to 1e-11 with the carry (a = 0, j = 1/2, same energy)', () => {
    const s = solveMassiveDiracRadial(problem(-1), { tol: 1e-12 });
    const kInf = s.kInf;
    const gamma = ((omega + kInf) / (2 * kInf)) * Math.exp(-2 * s.logAbsIn);
    expect(s.diagnostics.carrySteps).toBeGreaterThan(0);
    expect(Math.abs(gamma + Math.exp(2 * (s.logAbsOut - s.logAbsIn)) - 1)).toBeLessThan(1e-11);
  });
});
