import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import {
  ConvergenceError,
  attempt,
  csvField,
  linearGrid,
  logGrid,
  oneOf,
  parseFieldSpin,
  requireMassless,
  validateField,
  sumLShells,
  sumLShellVectors,
  toCsv,
  validateHole,
  validateMode,
  validateOptions,
  validateTolerance,
} from '../src/index.js';
import { inputErrorOf } from '../../../test/helpers.js';

describe('field spins', () => {
  test("'1/2', '0.5' and 0.5 name the same field spin; 3/2 and 'x' are refused naming the parameter", () => {
    expect(parseFieldSpin('1/2')).toBe(0.5);
    expect(parseFieldSpin(' 1 / 2 ')).toBe(0.5);
    expect(parseFieldSpin(0.5)).toBe(0.5);
    expect(parseFieldSpin('2')).toBe(2);
    expect(inputErrorOf(() => parseFieldSpin(1.5, 'mode.field.spin')).parameter).toBe('mode.field.spin');
    expect(inputErrorOf(() => parseFieldSpin('x')).allowed).toBe('one of 0, 1/2, 1, 2');
  });
  test('a mode needs l ≥ spin, |m| ≤ l, l − spin and m − spin integers', () => {
    expect(validateMode({ field: { spin: '1/2' }, l: 0.5, m: -0.5 })).toEqual({ spin: 0.5, fieldMass: 0, l: 0.5, m: -0.5 });
    expect(inputErrorOf(() => validateMode({ field: { spin: 1 }, l: 0, m: 0 })).parameter).toBe('mode.l');
    expect(inputErrorOf(() => validateMode({ field: { spin: 1 }, l: 2, m: 3 })).parameter).toBe('mode.m');
    expect(inputErrorOf(() => validateMode({ field: { spin: 1 }, l: 2, m: 0, n: 1 })).parameter).toBe('mode.n');
    expect(inputErrorOf(() => validateMode(null)).parameter).toBe('mode');
  });
  test('a field carries its mass Mμ: absent means 0; negative, NaN, text or ≥ 30 refused naming field.mass', () => {
    expect(validateField({ spin: 0 })).toEqual({ spin: 0, mass: 0 });
    expect(validateField({ spin: '1/2', mass: 0.25 })).toEqual({ spin: 0.5, mass: 0.25 });
    for (const bad of [-1e-3, Number.NaN, '0.1', null, 30, Number.POSITIVE_INFINITY]) {
      expect(inputErrorOf(() => validateField({ spin: 0, mass: bad })).parameter).toBe('field.mass');
    }
    expect(inputErrorOf(() => validateMode({ field: { spin: 1, mass: -1 }, l: 1, m: 0 })).parameter).toBe('mode.field.mass');
    expect(inputErrorOf(() => requireMassless({ spin: 1, mass: 0.1 })).parameter).toBe('field.mass');
    expect(() => requireMassless({ spin: 1, mass: 0 })).not.toThrow();
  });
  test('a hole needs a finite mass > 0 and |a| ≤ 0.99999 M for the solver; unknown keys refused', () => {
    expect(validateHole({ a: -0.5 })).toEqual({ a: -0.5, mass: 1 });
    expect(inputErrorOf(() => validateHole({ a: 1 })).parameter).toBe('hole.a');
    expect(inputErrorOf(() => validateHole({ a: 0.5, mass: -1 })).parameter).toBe('hole.mass');
    expect(inputErrorOf(() => validateHole({ a: 0.5, spin: 1 })).parameter).toBe('hole.spin');
  });
});

describe('options and tolerance', () => {
  test('unknown option keys and method names are refused with an InputError naming them', () => {
    const spec = { tol: validateTolerance, method: oneOf(['odex', 'cash-karp'] as const) };
    expect(validateOptions({ tol: 1e-6 }, spec)).toEqual({ tol: 1e-6 });
    expect(inputErrorOf(() => validateOptions({ tolerance: 1e-6 }, spec)).parameter).toBe('options.tolerance');
    expect(inputErrorOf(() => validateOptions({ method: 'bogus' }, spec)).parameter).toBe('method');
    expect(inputErrorOf(() => validateOptions(null, spec)).parameter).toBe('options');
    expect(inputErrorOf(() => validateTolerance(1e-13)).allowed).toBe('1e-12 ≤ tol ≤ 0.01');
  });
  test('attempt turns InputError and ConvergenceError into statuses and lets other errors through', () => {
    expect(attempt(() => 1)).toMatchObject({ status: 'success', solution: 1 });
    expect(attempt(() => validateTolerance(2)).status).toBe('invalid-input');
    const d = { method: 'm', steps: 1, rhsEvaluations: 2, errorEstimate: 1, message: 'x' };
    expect(
      attempt(() => {
        throw new ConvergenceError('no', d);
      }).status,
    ).toBe('not-converged');
    expect(() =>
      attempt(() => {
        throw new TypeError('bug');
      }),
    ).toThrow(TypeError);
  });
});

describe('grids, l-shell sums and tables', () => {
  test('grids keep their endpoints exactly and refuse counts beyond 1e6 at once', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-4, max: 10, noNaN: true }),
        fc.double({ min: 1e-4, max: 10, noNaN: true }),
        fc.integer({ min: 2, max: 50 }),
        (a, b, n) => {
          const lin = linearGrid(a, b, n);
          const log = logGrid(a, b, n);
          return lin[0] === a && lin[n - 1] === b && log[0] === a && log[n - 1] === b && lin.length === n;
        },
      ),
      { seed: 42, numRuns: 200 },
    );
    expect(inputErrorOf(() => linearGrid(0, 1, 1e9)).parameter).toBe('count');
  });
  test('a geometric series 2^-l summed to 1e-12 has a tail bound at or above the true tail', () => {
    const sum = sumLShells(0, { lCut: 3, tol: 1e-12, maxL: 200 }, (l) => 2 ** -l);
    const trueTail = 2 - sum.total; // Σ 2^-l = 2
    expect(sum.tailBound).toBeGreaterThanOrEqual(trueTail * (1 - 1e-12));
    expect(sum.tailBound).toBeLessThan(1e-11);
  });
  test('a series that does not fall is a ConvergenceError, not a truncation', () => {
    expect(() => sumLShells(0, { lCut: 0, tol: 1e-6, maxL: 30 }, () => 1)).toThrow(ConvergenceError);
  });
  test('shells with two quantities (2^-l and 3^-l) stop only when both are negligible; each tail bound is at or above its true tail (Σ 2^-l = 2, Σ 3^-l = 3/2)', () => {
    const sum = sumLShellVectors(0, { lCut: 0, tol: 1e-10, maxL: 200 }, (l) => [3 ** -l, 2 ** -l]);
    expect(sum.lMax).toBe(sumLShells(0, { lCut: 0, tol: 1e-10, maxL: 200 }, (l) => 2 ** -l).lMax);
    expect(sum.tailBounds[0]).toBeGreaterThanOrEqual((1.5 - sum.totals[0]) * (1 - 1e-12));
    expect(sum.tailBounds[1]).toBeGreaterThanOrEqual((2 - sum.totals[1]) * (1 - 1e-12));
    expect(sum.q[1]).toBe(0.5);
  });
  test("a sum that hits maxL throws a ConvergenceError with full diagnostics, maxL and the caller's context", () => {
    try {
      sumLShells(0, { lCut: 0, tol: 1e-6, maxL: 5, context: () => ({ rhsEvaluations: 42, omega: 0.3 }) }, () => 1);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ConvergenceError);
      const d = (e as ConvergenceError).diagnostics as unknown as Record<string, unknown>;
      for (const key of ['method', 'steps', 'errorEstimate', 'message']) expect(d).toHaveProperty(key);
      expect(d).toMatchObject({ maxL: 5, rhsEvaluations: 42, omega: 0.3 });
    }
  });
  test('CSV fields with commas, quotes or newlines are quoted (RFC 4180); headers carry units', () => {
    expect(csvField('a,b')).toBe('"a,b"');
    expect(csvField('say "x"')).toBe('"say ""x"""');
    const csv = toCsv({
      columns: [
        { name: 'omega', unit: '1/M' },
        { name: 'label', unit: '' },
      ],
      rows: [[0.5, 'x,y']],
    });
    expect(csv).toBe('omega [1/M],label\n0.5,"x,y"\n');
  });
});
