import { describe, expect, test } from 'vitest';
import {
  kerrHole,
  massToKg,
  physicalBackground,
  tortoise,
  tortoiseFromHorizonDistance,
  unitScales,
  type MassUnit,
} from '@penumbra/kerr';
import { inputErrorOf } from '../../../test/helpers.js';

describe('typed input errors name the parameter and its allowed range', () => {
  test.each([
    ['NaN', Number.NaN],
    ['+Infinity', Number.POSITIVE_INFINITY],
    ['-Infinity', Number.NEGATIVE_INFINITY],
  ])('spin a = %s is refused with parameter "a"', (_label, a) => {
    const error = inputErrorOf(() => kerrHole({ a: a }));
    expect(error.parameter).toBe('a');
    expect(error.message).toMatch(/^invalid a = /);
    expect(error.allowed).toContain('|a| < M');
  });

  test.each([
    ['NaN', Number.NaN],
    ['+Infinity', Number.POSITIVE_INFINITY],
    ['-Infinity', Number.NEGATIVE_INFINITY],
    ['0', 0],
    ['-1', -1],
    ['1e200 (A = 8πMr+ would overflow)', 1e200],
    ['1e-200 (M² would underflow)', 1e-200],
  ])('mass M = %s is refused with parameter "mass" and the range 1e-150 ≤ mass ≤ 1e150', (_label, mass) => {
    const error = inputErrorOf(() => kerrHole({ a: 0, mass }));
    expect(error.parameter).toBe('mass');
    expect(error.allowed).toContain('1e-150 ≤ mass ≤ 1e+150');
  });

  test('functions of a background refuse anything that is not one, and a non-number distance, with InputError', () => {
    const hole = kerrHole({ a: 0.5 });
    expect(inputErrorOf(() => tortoise(null as unknown as typeof hole, 3)).parameter).toBe('hole');
    expect(inputErrorOf(() => tortoiseFromHorizonDistance(hole, '1' as unknown as number)).parameter).toBe('x');
    expect(inputErrorOf(() => kerrHole(null as unknown as { a: number })).parameter).toBe('hole');
  });

  test('the extremal hole |a| = M is refused, and the message says it is a limit the horizon-based solvers cannot take', () => {
    for (const a of [1, -1]) {
      const error = inputErrorOf(() => kerrHole({ a: a }));
      expect(error.parameter).toBe('a');
      expect(error.value).toBe(a);
      expect(error.message).toContain('|a| < M = 1');
      expect(error.message).toMatch(/extremal/);
      expect(error.message).toMatch(/limit/);
    }
  });

  test('|a| > M (a = 1.2, a = -3 with M = 2) is refused: no horizon, and the extremal hole is only a limit', () => {
    const over = inputErrorOf(() => kerrHole({ a: 1.2 }));
    expect(over.message).toBe(
      'invalid a = 1.2: allowed |a| < M = 1 (a hole with |a| > M has no horizon; the extremal hole |a| = M is itself only a limit for horizon-based solvers)',
    );
    expect(inputErrorOf(() => kerrHole({ a: -3, mass: 2 })).message).toContain('|a| < M = 2');
  });

  test('non-number input is refused, not coerced', () => {
    expect(inputErrorOf(() => kerrHole({ a: '0.5' as unknown as number })).parameter).toBe('a');
    expect(inputErrorOf(() => kerrHole({ a: 0.5, mass: '1' as unknown as number })).parameter).toBe('mass');
  });

  test('physical mass and unit are checked: mass > 0 and finite, unit one of g, kg, msun', () => {
    expect(inputErrorOf(() => massToKg(-1, 'g')).parameter).toBe('mass');
    expect(inputErrorOf(() => massToKg(Number.NaN, 'kg')).message).toContain('NaN');
    expect(inputErrorOf(() => massToKg(1, 'lb' as MassUnit)).message).toBe(
      `invalid unit = "lb": allowed one of 'g', 'kg', 'msun'`,
    );
    expect(inputErrorOf(() => physicalBackground(kerrHole({ a: 0.5 }), 0, 'g')).parameter).toBe('mass');
    // unitScales takes kilograms: its parameter is massKg, and its range is physicalBackground's
    expect(inputErrorOf(() => unitScales(Number.POSITIVE_INFINITY)).parameter).toBe('massKg');
    expect(inputErrorOf(() => unitScales(1e-300)).parameter).toBe('massKg');
  });

  test('physicalBackground refuses masses whose quantities leave the normal double range (1e-100 … 1e100 kg), and every value inside is finite and nonzero', () => {
    const hole = kerrHole({ a: 0.5 });
    for (const [mass, unit] of [
      [1e300, 'g'],
      [1e-300, 'kg'],
      [1e300, 'msun'],
      [1e101, 'kg'],
      [1e-98, 'g'],
    ] as const) {
      const error = inputErrorOf(() => physicalBackground(hole, mass, unit));
      expect(error.parameter).toBe('mass');
      expect(error.message).toContain(unit);
    }
    for (const [mass, unit] of [
      [1e100, 'kg'],
      [1e-100, 'kg'],
      [1e103, 'g'],
      [1e-97, 'g'],
      [5e69, 'msun'],
      [6e-131, 'msun'],
    ] as const) {
      for (const value of Object.values(physicalBackground(hole, mass, unit))) {
        expect(Number.isFinite(value) && Math.abs(value) >= 2.2250738585072014e-308).toBe(true);
      }
    }
  });
});
