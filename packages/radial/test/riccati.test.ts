/**
 * Riccati steps across oscillatory stretches (docs/method.md, section 9):
 * the collocation pieces against exact polynomial calculus, one step
 * against Bessel functions (reference values: mpmath 1.3.0 besselj/bessely
 * at 30 digits), and whole solves against the earlier 'ode' route, which
 * is kept as the cross-check.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial, solveTwoSided } from '@penumbra/radial';
import {
  chebyshevDerivative,
  chebyshevRule,
  integrateHybridLeg,
  integrateLeg,
  radialEquation,
  riccatiStep,
  startAtHorizon,
  type RiccatiEquation,
} from '@penumbra/radial/internal';

describe('Chebyshev–Lobatto collocation (Trefethen, Spectral Methods in MATLAB, SIAM 2000)', () => {
  it('the 16-node differentiation matrix differentiates t^7 exactly and the Clenshaw–Curtis weights integrate t^6 to 2/7 (to 1e-13)', () => {
    const { n, t, D, w } = chebyshevRule(16);
    let integral = 0;
    for (let i = 0; i < n; i++) {
      let d = 0;
      for (let j = 0; j < n; j++) d += D[i * n + j] * t[j] ** 7;
      expect(Math.abs(d - 7 * t[i] ** 6)).toBeLessThan(1e-12);
      integral += w[i] * t[i] ** 6;
    }
    expect(Math.abs(integral - 2 / 7)).toBeLessThan(1e-13);
  });

  it('the folded product (chebyshevDerivative) differentiates t^9 + i t^4 exactly at 16 and 15 nodes, read at an offset (to 1e-12)', () => {
    for (const nodes of [16, 15]) {
      const rule = chebyshevRule(nodes);
      const o = 3;
      const re = new Float64Array(nodes + o),
        im = new Float64Array(nodes + o);
      for (let j = 0; j < nodes; j++) {
        re[o + j] = rule.t[j] ** 9;
        im[o + j] = rule.t[j] ** 4;
      }
      const dRe = new Float64Array(nodes),
        dIm = new Float64Array(nodes);
      chebyshevDerivative(rule, re, im, o, dRe, dIm);
      for (let i = 0; i < nodes; i++) {
        expect(Math.abs(dRe[i] - 9 * rule.t[i] ** 8)).toBeLessThan(1e-12);
        expect(Math.abs(dIm[i] - 4 * rule.t[i] ** 3)).toBeLessThan(1e-12);
      }
    }
  });
});

/** x²R'' + xR' + x²R = 0 (Bessel, ν = 0) as A R'' + B R' + C R = 0 with A = Δ², Δ = x. */
const bessel: RiccatiEquation = {
  delta: Float64Array.from([0, 1, 0]),
  bRe: Float64Array.from([0, 1, 0, 0, 0]),
  bIm: new Float64Array(5),
  cRe: Float64Array.from([0, 0, 1, 0, 0]),
  cIm: new Float64Array(5),
};
// mpmath 1.3.0, 30 digits: J0, Y0 and their derivatives −J1, −Y1
const J0 = {
  50: [0.0558123276692518150047504785294, 0.0975118281251751376614589538737],
  100: [0.0199858503042231224242283909508, 0.0771453520141121580326854949272],
};
const Y0 = {
  50: [-0.0980649954700770790292114534404, 0.0567956685620147679418195492378],
  100: [-0.0772443133650831522542282213672, 0.0203723120027597933047039326664],
};

describe('one Riccati step', () => {
  it('carries J0 + iY0 (value and derivative) from x = 50 to 100 — 50 radians in one step — to 1e-12 relative (mpmath besselj/bessely)', () => {
    const y = Float64Array.from([J0[50][0], Y0[50][0], J0[50][1], Y0[50][1]]);
    const scale = new Float64Array(1);
    const step = riccatiStep(bessel, 50, 100, y, 1e-12, scale);
    expect(step.ok).toBe(true);
    expect(scale[0]).toBe(0);
    const size = Math.hypot(J0[100][0], Y0[100][0]);
    expect(Math.hypot(y[0] - J0[100][0], y[1] - Y0[100][0]) / size).toBeLessThan(1e-12);
    expect(Math.hypot(y[2] - J0[100][1], y[3] - Y0[100][1]) / size).toBeLessThan(1e-12);
  });

  it('costs no more passes across 1e4 radians than across 50 (x from 1e4 to 2e4 against 50 to 100): the cost does not grow with the oscillations', () => {
    const scale = new Float64Array(1);
    const near = riccatiStep(bessel, 50, 100, Float64Array.from([1, 0, 0, 1]), 1e-12, scale);
    const far = riccatiStep(bessel, 1e4, 2e4, Float64Array.from([1, 0, 0, 1]), 1e-12, scale);
    expect(near.ok && far.ok).toBe(true);
    expect(far.passes).toBeLessThanOrEqual(near.passes);
  });

  it('refuses a stretch with a turning point (x from 0.5 to 1 has ∫|W|/2 du ≈ 0.5 rad): the caller integrates it instead', () => {
    const step = riccatiStep(bessel, 0.5, 1, Float64Array.from([1, 0, 0, 1]), 1e-12, new Float64Array(1));
    expect(step.ok).toBe(false);
  });
});

const hole = kerrHole({ a: 0.7 });

describe("the 'riccati' route against the earlier 'ode' route", () => {
  const cases = [
    { label: 's = 0, l = 40, Mω = 1 (far zone at 200 M)', s: 0, m: 20, omega: 1, lambda: 40 * 41 },
    { label: 's = 0, l = 2, Mω = 30 (near-horizon winding)', s: 0, m: 2, omega: 30, lambda: 6 },
    {
      label: 'massive s = 0, l = 3, Mω = 2, v = 0.05 (matching at 2300 M)',
      s: 0,
      m: 3,
      omega: 2,
      lambda: 12,
      mu: 2 * Math.sqrt(1 - 0.05 ** 2),
    },
  ];
  for (const c of cases) {
    it(`${c.label}: ln|Z_in| agrees to 1e-9 and the Riccati solve's errorEstimate covers its difference from a 1e-14 'ode' solve`, () => {
      const { label: _label, ...mode } = c;
      const problem = { hole: mode.mu ? kerrHole({ a: 0.99 }) : hole, ...mode };
      const ric = solveRadial(problem, { tol: 1e-11 });
      const ode = solveRadial(problem, { tol: 1e-11, oscillation: 'ode' });
      const tight = solveRadial(problem, { tol: 1e-14, oscillation: 'ode' });
      expect(Math.abs(ric.logAbsZIn - ode.logAbsZIn)).toBeLessThan(1e-9);
      expect(Math.abs(ric.logAbsZIn - tight.logAbsZIn)).toBeLessThan(ric.diagnostics.errorEstimate);
      expect(ric.diagnostics.rhsEvaluations).toBeLessThan(ode.diagnostics.rhsEvaluations);
    });
  }

  for (const c of [
    { l: 0, omega: 0.3 },
    { l: 2, omega: 0.8 },
  ]) {
    it(`massive s = 0 near threshold (a = 0, l = ${c.l}, Mω = ${c.omega}, v = k∞/ω = 0.05): Riccati steps carry the far zone, ln|Z_in| is within the errorEstimate of a 1e-14 'ode' solve and the work is at most twice the massless mode's`, () => {
      const hole0 = kerrHole({ a: 0 });
      const massless = { hole: hole0, s: 0, m: 0, omega: c.omega, lambda: c.l * (c.l + 1) };
      const problem = { ...massless, mu: c.omega * Math.sqrt(1 - 0.05 ** 2) };
      const ric = solveRadial(problem, { tol: 1e-11 });
      const tight = solveRadial(problem, { tol: 1e-14, oscillation: 'ode' });
      expect(ric.diagnostics.riccatiSteps).toBeGreaterThan(0);
      expect(Math.abs(ric.logAbsZIn - tight.logAbsZIn)).toBeLessThan(ric.diagnostics.errorEstimate);
      expect(ric.diagnostics.rhsEvaluations).toBeLessThan(2 * solveRadial(massless, { tol: 1e-11 }).diagnostics.rhsEvaluations);
    });
  }

  it('two-sided s = 2, l = 20, Mω = 10: ln|Z_in| of the +s field agrees with the ode route to 1e-9 with less work', () => {
    const problem = { hole, s: 2, m: 4, omega: 10, lambda: 20 * 21 - 6 };
    const ric = solveTwoSided(problem, { tol: 1e-11 });
    const ode = solveTwoSided(problem, { tol: 1e-11, oscillation: 'ode' });
    expect(Math.abs(ric.logAbsZInPlus - ode.logAbsZInPlus)).toBeLessThan(1e-9);
    expect(ric.diagnostics.rhsEvaluations).toBeLessThan(ode.diagnostics.rhsEvaluations);
  });

  it('two-sided s = 2, l = 20 at the barrier peak (Mω = 3.95, reflection of order 1): ln|Y_out| of the −s field agrees with the ode route to 1e-9', () => {
    const problem = { hole, s: 2, m: 4, omega: 3.95, lambda: 20 * 21 - 6 };
    const ric = solveTwoSided(problem, { tol: 1e-11 });
    const ode = solveTwoSided(problem, { tol: 1e-11, oscillation: 'ode' });
    expect(Math.abs(ric.logAbsYOutMinus - ode.logAbsYOutMinus)).toBeLessThan(1e-9);
    expect(Math.abs(ric.logAbsZInPlus - ode.logAbsZInPlus)).toBeLessThan(1e-9);
  });

  it('a low-frequency leg where no rung qualifies is the integrator leg bit for bit (s = 0, l = 2, Mω = 0.1)', () => {
    const mode = { s: 0, m: 1, omega: 0.1, lambda: 6 };
    const equation = radialEquation(hole, mode, hole.rPlus);
    const start = startAtHorizon(hole, mode, equation);
    const leg = (y: Float64Array) => ({
      hole,
      mode,
      equation,
      y,
      from: hole.rPlus + start.x0,
      fromOffset: start.x0,
      to: 100,
      stops: [],
      tol: 1e-11,
      integrator: 'odex' as const,
      maxSteps: 1e6,
      variable: 'plain' as const,
      counter: { evaluations: 0 },
      method: 'test',
    });
    const y0 = [start.R[0], start.R[1], start.dR[0], start.dR[1]];
    const a = Float64Array.from(y0),
      b = Float64Array.from(y0);
    const hybrid = integrateHybridLeg(leg(a), 'riccati');
    integrateLeg(leg(b));
    expect(hybrid.riccatiSteps).toBe(0);
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('refuses an unknown oscillation name with an InputError naming the key', () => {
    expect(() => solveRadial({ hole, s: 0, m: 0, omega: 1, lambda: 2 }, { oscillation: 'wkb' as never })).toThrow(/oscillation/);
  });
});
