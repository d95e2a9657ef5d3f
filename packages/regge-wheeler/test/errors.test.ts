import { describe, expect, it } from 'vitest';
import { ConvergenceError } from '@penumbra/core';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { ProcaExtrapolation, integrateOnce } from '@penumbra/regge-wheeler/internal';
import { parameterOf } from '../../../test/helpers.js';

const show = (x: unknown) => JSON.stringify(x, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? String(v) : v));

describe('input validation throws InputError naming the parameter', () => {
  const bad: Array<[string, unknown]> = [
    ['problem', null],
    ['problem', 'spin 0'],
    ['field', { field: 0, l: 0, omega: 0.1 }],
    ['field.spin', { field: { spin: 1.5 }, l: 2, omega: 0.1 }],
    ['field.spin', { field: { spin: -1 }, l: 1, omega: 0.1 }],
    ['field.spin', { field: { spin: Number.NaN }, l: 1, omega: 0.1 }],
    ['l', { field: { spin: 1 }, l: 0, omega: 0.1 }],
    ['l', { field: { spin: 2 }, l: 2.5, omega: 0.1 }],
    ['l', { field: { spin: 0.5 }, l: 1, omega: 0.1 }],
    ['l', { field: { spin: 0 }, l: Number.POSITIVE_INFINITY, omega: 0.1 }],
    ['omega', { field: { spin: 0 }, l: 0, omega: 0 }],
    ['omega', { field: { spin: 0 }, l: 0, omega: -0.3 }],
    ['omega', { field: { spin: 0 }, l: 0, omega: Number.NaN }],
    ['omega', { field: { spin: 0 }, l: 0, omega: Number.POSITIVE_INFINITY }],
    ['mass', { field: { spin: 0 }, l: 0, omega: 0.1, mass: 0 }],
    ['problem.m', { field: { spin: 0 }, l: 0, m: 0, omega: 0.1 }],
  ];
  for (const [parameter, problem] of bad) {
    it(`rejects ${parameter} in ${show(problem)}`, () => {
      expect(parameterOf(() => schwarzschildGreybody(problem as never))).toBe(parameter);
    });
  }

  const badOptions: Array<[string, unknown]> = [
    ['options', null],
    ['tol', { tol: 0 }],
    ['tol', { tol: 1e-15 }],
    ['tol', { tol: 0.5 }],
    ['tol', { tol: Number.NaN }],
    ['options.startOffset', { startOffset: 0.1 }],
  ];
  for (const [parameter, options] of badOptions) {
    it(`rejects the option ${parameter} in ${show(options)}`, () => {
      expect(parameterOf(() => schwarzschildGreybody({ field: { spin: 0 }, l: 0, omega: 0.1 }, options as never))).toBe(
        parameter,
      );
    });
  }

  it('validates the options of a single integration: startOffset in (0, 0.5], diracSign ±1, integer maxSteps, no unknown keys', () => {
    const problem = { field: { spin: 0 }, l: 0, omega: 0.1 };
    expect(parameterOf(() => integrateOnce(problem, { startOffset: 0.6 }))).toBe('startOffset');
    expect(parameterOf(() => integrateOnce(problem, { diracSign: 0 } as never))).toBe('diracSign');
    expect(parameterOf(() => integrateOnce(problem, { maxSteps: 2.5 }))).toBe('maxSteps');
    expect(parameterOf(() => integrateOnce(problem, { steps: 10 } as never))).toBe('options.steps');
  });

  it("accepts the field spin as '1/2' and 0.5 alike (core's parseFieldSpin): identical Γ", () => {
    const text = schwarzschildGreybody({ field: { spin: '1/2' }, l: 0.5, omega: 0.2 });
    const number = schwarzschildGreybody({ field: { spin: 0.5 }, l: 0.5, omega: 0.2 });
    expect(text.spin).toBe(0.5);
    expect(text.gamma).toBe(number.gamma);
  });
});

describe('non-convergence throws ConvergenceError with full diagnostics', () => {
  it('an exhausted step budget is reported, not returned as a number', () => {
    let caught: unknown;
    try {
      integrateOnce({ field: { spin: 0 }, l: 2, omega: 0.3 }, { maxSteps: 10 });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConvergenceError);
    const d = (caught as ConvergenceError).diagnostics;
    expect(d.steps).toBe(11);
    expect(d.rhsEvaluations).toBeGreaterThan(0);
    expect(d.errorEstimate).toBe(Infinity);
    expect(typeof d.method).toBe('string');
    expect(typeof d.message).toBe('string');
    expect(d).toHaveProperty('matchRadius');
  });
  it("the Proca extrapolation integrator's step-size underflow (one channel started inside the horizon, singular at r = 2M) is a ConvergenceError with its method, steps, evaluations and radius", () => {
    const y = Float64Array.from([1, 0, 0, 0]);
    const equations = { channels: 1 as const, mu2: 0, w2: 1, L: 0, q0: new Float64Array(1), q1: new Float64Array(1) };
    const stepper = new ProcaExtrapolation(y, equations, 1, 0.01, 1e-10, 1, 'singular test');
    let caught: unknown;
    try {
      while (stepper.step(3));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(ConvergenceError);
    const d = (caught as ConvergenceError).diagnostics as ConvergenceError['diagnostics'] & { r: number };
    expect(d.method).toBe('singular test');
    expect(d.steps).toBe(stepper.steps);
    expect(d.steps).toBeGreaterThan(0);
    expect(d.rhsEvaluations).toBe(stepper.evaluations);
    expect(d.errorEstimate).toBe(Infinity);
    // stopped short of the singularity at r = 2
    expect(d.r).toBeLessThan(2);
    expect(d.r).toBeGreaterThan(1.99);
    expect(d.message).toMatch(/step size underflow at r = /);
  });
});
