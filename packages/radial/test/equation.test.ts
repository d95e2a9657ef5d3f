/**
 * The one definition of the radial equation (src/equation.ts) against
 * Teukolsky's radial equation as published (Teukolsky, ApJ 185, 635 (1973),
 * eq. 4.9), multiplied by Δ:
 *   Δ²R'' + (s+1)ΔΔ'R' + [K² − 2is(r − M)K + Δ(4isωr − λ)]R = 0,
 * written out here independently in plain complex arithmetic, and the
 * equations built from it by substitution against the forms derived in
 * docs/method.md (sections 3 and 7).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ConvergenceError } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import {
  cpolyAt,
  equationRhs,
  makeStepper,
  phaseEquation,
  radialEquation,
  scale,
  substitutePhase,
  type CPoly,
  type EvaluationCounter,
} from '@penumbra/radial/internal';

type C = [number, number];
const cmul = (x: C, y: C): C => [x[0] * y[0] - x[1] * y[1], x[0] * y[1] + x[1] * y[0]];
const cadd = (...zs: C[]): C => zs.reduce<C>((acc, z) => [acc[0] + z[0], acc[1] + z[1]], [0, 0]);
const creal = (x: number): C => [x, 0];
const ci = (x: number): C => [0, x];

/** Δ, Δ', K, ϖ and U of Teukolsky (1973) at r, written out directly. */
function published(a: number, M: number, s: number, m: number, omega: number, lambda: number, r: number) {
  const delta = r * r - 2 * M * r + a * a;
  const dDelta = 2 * (r - M);
  const varpi = r * r + a * a;
  const K = varpi * omega - a * m;
  const U = cadd(creal(K * K), ci(-2 * s * (r - M) * K), cmul(creal(delta), [-lambda, 4 * s * omega * r]));
  return { delta, dDelta, varpi, K, U };
}

const relErr = (got: C, want: C, scale: number) => Math.hypot(got[0] - want[0], got[1] - want[1]) / scale;

const params = fc.record({
  a: fc.double({ min: -0.999, max: 0.999, noNaN: true }),
  s: fc.constantFrom(-2, -1, -0.5, 0, 0.5, 1, 2),
  m: fc.integer({ min: -3, max: 3 }),
  omega: fc.double({ min: 0.01, max: 3, noNaN: true }),
  lambda: fc.double({ min: -5, max: 20, noNaN: true }),
  x: fc.double({ min: 0.01, max: 50, noNaN: true }),
  center: fc.constantFrom('zero', 'horizon', 'point'),
});

describe('the radial equation, written once', () => {
  it('has the coefficients Δ², (s+1)ΔΔ′ and U of Teukolsky (1973) eq. 4.9 about any centre, to 1e-12 of their size (property, fast-check)', () => {
    fc.assert(
      fc.property(params, ({ a, s, m, omega, lambda, x, center }) => {
        const hole = kerrHole({ a });
        const r = hole.rPlus + x;
        const c = center === 'zero' ? 0 : center === 'horizon' ? hole.rPlus : r - 0.3;
        const eq = radialEquation(hole, { s, m, omega, lambda }, c);
        const want = published(a, 1, s, m, omega, lambda, r);
        const at = (p: CPoly) => cpolyAt(p, r - c);
        const size = want.varpi * want.varpi * (1 + omega * omega + Math.abs(lambda) + Math.abs(s));
        expect(relErr(at(eq.A), creal(want.delta * want.delta), size)).toBeLessThan(1e-12);
        expect(relErr(at(eq.B), creal((s + 1) * want.delta * want.dDelta), size)).toBeLessThan(1e-12);
        expect(relErr(at(eq.C), want.U, size)).toBeLessThan(1e-12);
        expect(relErr(at(eq.K), creal(want.K), want.varpi * (omega + 1))).toBeLessThan(1e-13);
      }),
      { numRuns: 200, seed: 11 },
    );
  });

  it('with R = e^{iσωr*}g gives the far-zone equation of docs/method.md §3 (Q_σ with −2amωϖ + a²m² in place of K² − ω²ϖ²), to 1e-12 of its size', () => {
    fc.assert(
      fc.property(params, fc.constantFrom<1 | -1>(1, -1), ({ a, s, m, omega, lambda, x }, sigma) => {
        const hole = kerrHole({ a });
        const r = hole.rPlus + x;
        const eq = radialEquation(hole, { s, m, omega, lambda });
        const far = substitutePhase(eq, scale(eq.varpi, sigma * omega));
        const { delta, dDelta, varpi, K } = published(a, 1, s, m, omega, lambda, r);
        const Q = cadd(
          ci(sigma * omega * (2 * r * delta + s * dDelta * varpi)),
          creal(-2 * a * m * omega * varpi + a * a * m * m),
          ci(-2 * s * (r - 1) * K),
          cmul(creal(delta), [-lambda, 4 * s * omega * r]),
        );
        const B: C = [(s + 1) * delta * dDelta, 2 * sigma * omega * varpi * delta];
        const size = varpi * varpi * (1 + omega * omega + Math.abs(lambda) + Math.abs(s) + a * a * m * m);
        expect(relErr(cpolyAt(far.B, r), B, size)).toBeLessThan(1e-12);
        expect(relErr(cpolyAt(far.C, r), Q, size)).toBeLessThan(1e-12);
        expect(far.C.re[4]).toBe(0); // the r⁴ terms cancel exactly
      }),
      { numRuns: 200, seed: 12 },
    );
  });

  it('with u = e^{iφ}R, φ′ = K/Δ, gives Δu″ + [(s+1)Δ′ − 2iK]u′ + [2i(2s − 1)ωr − λ − 2isΔ′K/Δ]u = 0 (docs/method.md §7), times Δ, to 1e-12 of its size', () => {
    fc.assert(
      fc.property(params, ({ a, s, m, omega, lambda, x }) => {
        const hole = kerrHole({ a });
        const r = hole.rPlus + x;
        const eq = phaseEquation(radialEquation(hole, { s, m, omega, lambda }, hole.rPlus));
        const { delta, dDelta, varpi, K } = published(a, 1, s, m, omega, lambda, r);
        const B: C = [delta * (s + 1) * dDelta, -2 * K * delta];
        const Cc: C = [-lambda * delta, delta * 2 * (2 * s - 1) * omega * r - 2 * s * dDelta * K];
        const size = varpi * varpi * (1 + omega * omega + Math.abs(lambda) + Math.abs(s));
        expect(relErr(cpolyAt(eq.B, x), B, size)).toBeLessThan(1e-12);
        expect(relErr(cpolyAt(eq.C, x), Cc, size)).toBeLessThan(1e-12);
      }),
      { numRuns: 200, seed: 13 },
    );
  });

  it('drives the integrator right-hand side: R″ = −((s+1)Δ′/Δ)R′ − (U/Δ²)R from Teukolsky (1973) eq. 4.9, to 1e-12 relative', () => {
    const hole = kerrHole({ a: 0.9 });
    const mode = { s: 2, m: 2, omega: 0.5, lambda: -1.5 };
    const counter = { evaluations: 0 };
    const rhs = equationRhs(radialEquation(hole, mode, hole.rPlus), counter);
    for (const r of [hole.rPlus + 1e-3, 2.5, 40]) {
      const y = [0.3, -1.1, 2.0, 0.7];
      const dy = [0, 0, 0, 0];
      rhs(dy, y, r);
      const { delta, dDelta, U } = published(0.9, 1, 2, 2, 0.5, -1.5, r);
      const want = cadd(
        cmul(creal((-3 * dDelta) / delta), [y[2], y[3]]),
        cmul([-U[0] / delta ** 2, -U[1] / delta ** 2], [y[0], y[1]]),
      );
      expect(dy.slice(0, 2)).toEqual([y[2], y[3]]);
      expect(relErr([dy[2], dy[3]], want, Math.hypot(...want))).toBeLessThan(1e-12);
    }
    expect(counter.evaluations).toBe(3);
  });
});

describe('the three integrators', () => {
  /** A stepper for R″ = −R at tol 1e-12, counting its evaluations in `counter`. */
  const harmonic = (integrator: 'gbs' | 'odex' | 'cash-karp', maxSteps: number, counter: EvaluationCounter, origin?: number) =>
    makeStepper({
      integrator,
      rhs: (dy, y) => {
        counter.evaluations++;
        dy[0] = y[2];
        dy[1] = y[3];
        dy[2] = -y[0];
        dy[3] = -y[1];
      },
      tol: 1e-12,
      rPlus: -1,
      maxSteps,
      method: 'harmonic test',
      counter,
      origin,
    });
  for (const integrator of ['gbs', 'odex', 'cash-karp'] as const) {
    it(`'${integrator}' (loaded by a plain ESM import) integrates R″ = −R over one period to cos and −sin within 1e-9 (exact solution)`, () => {
      const stepper = harmonic(integrator, 10_000, { evaluations: 0 });
      const y = new Float64Array([1, 0, 0, 1]);
      const res = stepper.advance(y, 0, 2 * Math.PI, 0.01, 1e150);
      expect(res.r).toBe(2 * Math.PI);
      expect(Math.abs(y[0] - 1)).toBeLessThan(1e-9);
      expect(Math.abs(y[2])).toBeLessThan(1e-9);
    });
    it(`'${integrator}' past its step limit throws a ConvergenceError with the caller's method, its steps, the evaluation count and the radius reached`, () => {
      const counter = { evaluations: 0 };
      const origin = 2;
      const stepper = harmonic(integrator, 5, counter, origin);
      let thrown: unknown;
      try {
        stepper.advance(new Float64Array([1, 0, 0, 1]), 0, 1000, 0.01, 1e150);
      } catch (e) {
        thrown = e;
      }
      expect(thrown).toBeInstanceOf(ConvergenceError);
      const d = (thrown as ConvergenceError).diagnostics as ConvergenceError['diagnostics'] & Record<string, unknown>;
      expect(d).toMatchObject({ method: 'harmonic test', errorEstimate: Infinity, integrator, maxSteps: 5 });
      expect(d.steps).toBeGreaterThanOrEqual(5);
      expect(d.rhsEvaluations).toBe(counter.evaluations);
      expect(d.rhsEvaluations).toBeGreaterThan(0);
      // stopped on the way: the radius is origin + argument, past the start and short of the end
      expect(d.r).toBeGreaterThan(origin);
      expect(d.r).toBeLessThan(origin + 1000);
      expect(d.message).toMatch(new RegExp(`^${integrator} exceeded its step limit of 5 steps at r = `));
    });
  }
});

describe("'gbs' against 'odex' through the generic right-hand side", () => {
  it("returns the same doubles, step counts and evaluation counts as 'odex' for the s = −2 radial equation (a = 0.9, Mω = 0.7) and its 'phase' form, from r+ + 0.05 to 60 with rescaling stops", () => {
    const hole = kerrHole({ a: 0.9 });
    const mode = { s: -2, m: 1, omega: 0.7, lambda: 3.1 };
    for (const form of ['plain', 'phase'] as const) {
      const base = radialEquation(hole, mode, hole.rPlus);
      const eq = form === 'phase' ? phaseEquation(base) : base;
      const run = (integrator: 'gbs' | 'odex') => {
        const counter = { evaluations: 0 };
        const stepper = makeStepper({
          integrator,
          rhs: equationRhs(eq, counter),
          tol: 1e-11,
          rPlus: hole.rPlus,
          maxSteps: 1e5,
          method: 'radial equation',
          counter,
        });
        const y = new Float64Array([1e-3, 2e-3, 0.5, -0.25]);
        const out: number[] = [];
        let r = hole.rPlus + 0.05;
        let h = 0.01;
        for (const target of [hole.rPlus + 0.2, 3, 10, 60]) {
          while (r < target) {
            const res = stepper.advance(y, r, target, h, 1e6);
            out.push(res.r, res.steps, res.h, ...y);
            r = res.r;
            h = res.h;
            if (Math.abs(y[0]) + Math.abs(y[1]) > 1e6) for (let i = 0; i < 4; i++) y[i] *= 1e-6;
          }
        }
        return { out, evaluations: counter.evaluations };
      };
      expect(run('gbs')).toEqual(run('odex'));
    }
  });
});
