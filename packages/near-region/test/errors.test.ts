import { describe, expect, test } from 'vitest';
import { compareNearRegion, nearRegionForm, validityMap } from '@penumbra/near-region';
import { parameterOf } from '../../../test/helpers.js';

const mode = { field: { spin: 1 }, l: 1, m: 1 } as const;

describe('input validation: InputError naming the parameter', () => {
  test('a = 0 is refused (T_L, T_R diverge; the two-temperature form needs rotation), naming hole.a', () => {
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0 }, mode, omega: 0.01 }))).toBe('hole.a');
    expect(() => compareNearRegion({ hole: { a: 0 }, mode, omega: 0.01 })).toThrow(/T_L and T_R diverge/);
  });

  test('a < 0 is refused with the mirror (|a|, −m) named in the message', () => {
    expect(() => nearRegionForm({ hole: { a: -0.5 }, mode, omega: 0.01 })).toThrow(/mirror image of \(\|a\|, −m\)/);
  });

  test('the comparison keeps the solver ranges: a ≤ 0.9999 M and 1e-5 ≤ Mω ≤ 30; the form alone takes 1e-8 M ≤ a < M, 0 < Mω ≤ 30', () => {
    expect(parameterOf(() => compareNearRegion({ hole: { a: 0.99995 }, mode, omega: 0.01 }))).toBe('hole.a');
    expect(parameterOf(() => compareNearRegion({ hole: { a: 0.5 }, mode, omega: 1e-6 }))).toBe('omega');
    // Mω = 1e-6 < mΩ_H: a superradiant (negative) Γ_near, outside the solver's ranges but within the form's
    expect(nearRegionForm({ hole: { a: 0.99995 }, mode, omega: 1e-6 }).gammaNearRegion).toBeLessThan(0);
    expect(parameterOf(() => nearRegionForm({ hole: { a: 1 }, mode, omega: 0.01 }))).toBe('hole.a');
    expect(parameterOf(() => nearRegionForm({ hole: { a: 5e-324 }, mode, omega: 0.01 }))).toBe('hole.a');
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode, omega: 31 }))).toBe('omega');
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode, omega: 0 }))).toBe('omega');
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode, omega: Number.NaN }))).toBe('omega');
  });

  test('bad modes, massive fields, unknown keys and unknown options are refused by name', () => {
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode: { field: { spin: 1 }, l: 0, m: 0 }, omega: 0.1 }))).toMatch(
      /^mode/,
    );
    expect(
      parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode: { field: { spin: 0, mass: 0.1 }, l: 0, m: 0 }, omega: 0.1 })),
    ).toBe('mode.field.mass');
    expect(parameterOf(() => nearRegionForm({ hole: { a: 0.5 }, mode, omega: 0.1, extra: 1 } as never))).toBe('problem.extra');
    expect(parameterOf(() => compareNearRegion({ hole: { a: 0.5 }, mode, omega: 0.1 }, { tol: 1 }))).toBe('tol');
    expect(parameterOf(() => compareNearRegion({ hole: { a: 0.5 }, mode, omega: 0.1 }, { integrator: 'x' } as never))).toMatch(
      /integrator/,
    );
  });

  test('a validity map refuses empty or non-numeric grids by name', () => {
    expect(parameterOf(() => validityMap({ mode, aValues: [], omegaValues: [0.1] }))).toBe('aValues');
    expect(parameterOf(() => validityMap({ mode, aValues: [0.5], omegaValues: [0.1, Number.NaN] }))).toBe('omegaValues[1]');
  });
});
