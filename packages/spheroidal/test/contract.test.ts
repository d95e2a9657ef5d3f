import { readFileSync } from 'node:fs';
import { ConvergenceError } from '@penumbra/core';
import { spheroidalEigenvalue, spheroidalEigenvalueComplex, spheroidalHarmonic } from '@penumbra/spheroidal';
import { basisLayout, buildBand, buildComplexBand, leaverRoot } from '@penumbra/spheroidal/internal';
import { describe, expect, it } from 'vitest';
import { parameterOf } from '../../../test/helpers.js';

describe('the solve contract of the spheroidal solves', () => {
  it('refuses a missing or malformed problem with an InputError naming the parameter the caller gave (problem.l, an unknown key as problem.a)', () => {
    const solves = [
      (p: unknown) => spheroidalEigenvalue(p as never),
      (p: unknown) => spheroidalHarmonic(p as never),
      (p: unknown) => spheroidalEigenvalueComplex(p as never),
    ];
    for (const solve of solves) {
      expect(parameterOf(() => solve(null))).toBe('problem');
      expect(parameterOf(() => solve('s=0'))).toBe('problem');
      expect(parameterOf(() => solve({ s: 0, l: 2, m: 0, c: 1, a: 0.9 }))).toBe('problem.a');
      expect(parameterOf(() => solve({ s: '0', l: 2, m: 0, c: 1 }))).toBe('problem.s');
      expect(parameterOf(() => solve({ s: 0, l: Number.NaN, m: 0, c: 1 }))).toBe('problem.l');
      expect(parameterOf(() => solve({ s: 0, l: 2, m: '0', c: 1 }))).toBe('problem.m');
    }
  });

  it('validates options: null, unknown keys and unknown names are InputErrors naming the key', () => {
    const q = { s: 0, l: 2, m: 0, c: 1 };
    expect(parameterOf(() => spheroidalEigenvalue(q, null as never))).toBe('options');
    expect(parameterOf(() => spheroidalEigenvalue(q, { tol: 1e-10 } as never))).toBe('options.tol');
    expect(parameterOf(() => spheroidalEigenvalue(q, { leaver: 'on' } as never))).toBe('leaver');
    expect(parameterOf(() => spheroidalEigenvalue(q, { continuation: 'yes' } as never))).toBe('continuation');
    expect(parameterOf(() => spheroidalHarmonic(q, { leavers: 'check' } as never))).toBe('options.leavers');
    expect(parameterOf(() => spheroidalEigenvalueComplex({ ...q, c: { re: 1, im: 0.5 } }, { leaver: 'check' } as never))).toBe(
      'options.leaver',
    );
    expect(spheroidalEigenvalue(q, {}).A).toBe(spheroidalEigenvalue(q).A);
  });

  it('reports core Diagnostics (method, steps, rhsEvaluations, errorEstimate, message) for real and complex c, with errorEstimate between 0 and 1e-10', () => {
    for (const d of [
      spheroidalEigenvalue({ s: -2, l: 3, m: 1, c: 2.5 }, { continuation: false, leaver: 'check' }).diagnostics,
      spheroidalEigenvalueComplex({ s: -2, l: 3, m: 1, c: { re: 2.5, im: -0.5 } }).diagnostics,
    ]) {
      expect(typeof d.method).toBe('string');
      expect(d.steps).toBeGreaterThan(0);
      expect(d.rhsEvaluations).toBeGreaterThanOrEqual(d.steps);
      expect(d.errorEstimate).toBeGreaterThan(0);
      expect(d.errorEstimate).toBeLessThan(1e-10);
      expect(d.message).toMatch(/^converged/);
    }
    expect(spheroidalEigenvalue({ s: 1, l: 2, m: 0, c: 0 }).diagnostics).toMatchObject({
      method: 'exact',
      steps: 0,
      rhsEvaluations: 0,
      errorEstimate: 0,
    });
  });

  it('gives an errorEstimate at or above the actual difference from scipy.special.obl_cv on every fixture row (s = 0, |c| ≤ 20)', () => {
    const fixture = JSON.parse(readFileSync(new URL('./fixtures/oblate-cv.json', import.meta.url), 'utf8')) as {
      rows: { m: number; l: number; c: number; cv: number }[];
    };
    for (const { m, l, c, cv } of fixture.rows) {
      const r = spheroidalEigenvalue({ s: 0, l, m, c }, { continuation: false });
      expect(Math.abs(r.A - cv) / Math.max(1, Math.abs(cv))).toBeLessThanOrEqual(r.diagnostics.errorEstimate);
    }
  });

  it('throws ConvergenceError carrying full Diagnostics when Newton on the continued fraction fails', () => {
    let caught: unknown;
    try {
      leaverRoot(0, 0, 2, 1e6, 0, 1, 3);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConvergenceError);
    const d = (caught as ConvergenceError).diagnostics;
    expect(d).toMatchObject({ method: 'leaver-newton', steps: 3, rhsEvaluations: 3, errorEstimate: Infinity });
    expect(typeof d.message).toBe('string');
  });

  it('assembles the complex band at Im c = 0 with exactly the real band’s entries (bit-identical: both build K = A₀ − c²X² + 2csX from the same terms)', () => {
    for (const [s, l, m, c] of [
      [-2, 3, 1, 4.7],
      [0, 4, 1, -9.3],
      [0.5, 2.5, -1.5, 1.1],
      [2, 7, -7, 20],
    ] as const) {
      const { lFirst, stride } = basisLayout(s, l, m);
      const real = buildBand(s, m, c, lFirst, stride, 30);
      const complex = buildComplexBand(s, m, c, 0, lFirst, stride, 30);
      for (const [r, z] of [
        [real.d0, complex.d0r],
        [real.d1, complex.d1r],
        [real.d2, complex.d2r],
        [real.e0, complex.e0r],
        [real.e1, complex.e1r],
        [real.e2, complex.e2r],
      ]) {
        expect(Array.from(z)).toEqual(Array.from(r));
      }
    }
  });
});
