import { describe, expect, test } from 'vitest';
import { ConvergenceError, InputError } from '@penumbra/core';
import {
  contentTotals,
  emissionSpectrum,
  emissionTotals,
  evolveHole,
  pageFunctions,
  resolveContent,
  toPhysicalRates,
  type PageTable,
} from '@penumbra/emission';

describe('typed errors (issue 5, bad input)', () => {
  test('an unknown species and a negative dof throw InputError naming the parameter', () => {
    expect(() => resolveContent(['axion'])).toThrow(InputError);
    expect(() => resolveContent([{ name: 'photon', dof: -1 }])).toThrow(/dof/);
    expect(() => resolveContent([])).toThrow(InputError);
  });
  test('user content may override dof and add a new species with spin and dof', () => {
    const c = resolveContent(['photon', { name: 'graviton', dof: 0 }, { name: 'dark-scalar', spin: 0, dof: 3 }]);
    expect(c.map((s) => [s.name, s.spin, s.dof])).toEqual([
      ['photon', 1, 2],
      ['graviton', 2, 0],
      ['dark-scalar', 0, 3],
    ]);
  });
  test('masses ≤ 0 or non-finite throw InputError', () => {
    expect(() => emissionTotals({ hole: { a: 0, mass: 0 }, field: { spin: 1 } })).toThrow(InputError);
    expect(() => emissionTotals({ hole: { a: 0, mass: Number.NaN }, field: { spin: 1 } })).toThrow(InputError);
    expect(() => toPhysicalRates({ numberRate: 1, power: 1, torque: 0 }, -1, 'g')).toThrow(InputError);
    expect(() => toPhysicalRates({ numberRate: 1, power: 1, torque: 0 }, Infinity, 'kg')).toThrow(InputError);
  });
  test('an empty or non-increasing frequency grid throws InputError', () => {
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [] })).toThrow(InputError);
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [0.2, 0.1] })).toThrow(/increasing/);
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [0.1, 0.1] })).toThrow(InputError);
    expect(() => emissionSpectrum({ hole: { a: 0 }, field: { spin: 0 }, grid: [-0.1] })).toThrow(InputError);
  });
  test('tolerances out of range, a spin beyond the solver range and an unknown field spin throw InputError', () => {
    expect(() => emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 0.5 })).toThrow(InputError);
    expect(() => emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 1e-14 })).toThrow(InputError);
    expect(() => emissionTotals({ hole: { a: 1 }, field: { spin: 1 } })).toThrow(InputError);
    expect(() => emissionTotals({ hole: { a: 0 }, field: { spin: (3 / 2) as never } })).toThrow(InputError);
    expect(() => contentTotals({ hole: { a: 0 }, content: ['tachyon'] })).toThrow(InputError);
  });
  test('an l-sum that cannot converge within maxL throws ConvergenceError with its diagnostics', () => {
    try {
      emissionTotals({ hole: { a: 0 }, field: { spin: 0 } }, { tol: 1e-6, maxL: 1 });
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ConvergenceError);
      const d = (e as ConvergenceError).diagnostics;
      expect(d).toHaveProperty('maxL', 1);
      for (const key of ['method', 'steps', 'rhsEvaluations', 'errorEstimate', 'message']) expect(d).toHaveProperty(key);
      // maxL = 1 cannot pass the geometric-optics cut: refused before any solve (core's requireLShellReach)
      expect(d.rhsEvaluations).toBe(0);
    }
  });
  test('evolution outside the table range or with a bad ODE tolerance throws InputError', () => {
    const table: PageTable = {
      aStar: [0, 0.3, 0.6, 0.8, 0.9].map((x) => x),
      theta: [0, 1, 2, 3, 4].map((i) => (i * Math.asin(0.9)) / 4),
      spins: [
        {
          spin: 1,
          power: [1, 1, 1, 1, 1],
          torqueOverA: [3, 3, 3, 3, 3],
          powerError: [0, 0, 0, 0, 0],
          torqueOverAError: [0, 0, 0, 0, 0],
        },
      ],
      tol: 1e-6,
      gammaCalls: 0,
    };
    table.aStar = table.theta.map((t) => Math.sin(t));
    const fns = pageFunctions({ table, content: ['photon'] });
    expect(() => evolveHole({ functions: fns, aStar0: 0.95 })).toThrow(InputError);
    expect(() => evolveHole({ functions: fns, aStar0: 0.5 }, { odeTol: 1 })).toThrow(InputError);
    // invented demo table (constant f, g): a* ∝ M^{g/f − 2} = M, lifetime 1/(3f) = 1/6 exactly
    const ev = evolveHole({ functions: fns, aStar0: 0.5 });
    expect(Math.abs(ev.lifetime * 6 - 1)).toBeLessThan(1e-7);
  });
});
