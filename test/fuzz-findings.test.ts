/**
 * Regression tests for what the 5× hostile-input fuzz (bench/fuzz.bench.mjs 5)
 * found: each input once gave Infinity, NaN, a plain Error or a TypeError.
 */
import { describe, expect, test } from 'vitest';
import { bundledPageTable, evolveHole, massLossRates, pageFunctions } from '@penumbra/emission';
import { greybody, lowFrequencyGreybody } from '@penumbra/flux';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial } from '@penumbra/radial';
import { spheroidalEigenvalue } from '@penumbra/spheroidal';
import { parameterOf } from './helpers.js';

describe('inputs the long fuzz run found, now finite or a typed error', () => {
  test('lowFrequencyGreybody equals the factorial form at l = 1, stays finite at l = 86 (where 172! overflows: it gave NaN), and at l = 90, Mω = 0.1 (Γ ~ 1e-577) is an InputError naming omega', () => {
    const p = (l: number, omega: number) => ({ hole: { a: 0.5 }, mode: { field: { spin: 0 }, l, m: 0 }, omega });
    const g = lowFrequencyGreybody(p(1, 0.01));
    expect(Number.isFinite(g) && g > 0).toBe(true);
    // Γ(l = 1) by the factorials, the Page–Starobinsky form with k = ω (m = 0): [1!1!/(2!·3!!)]² (1 + (k/κ)²) 2(k/κ) ((r+ − r−)ω)³
    const h = kerrHole({ a: 0.5 });
    const x = 0.01 / h.kappa;
    expect(g).toBeCloseTo((1 / 36) * (1 + x * x) * 2 * x * ((h.rPlus - h.rMinus) * 0.01) ** 3, 20);
    const high = lowFrequencyGreybody(p(86, 10));
    expect(Number.isFinite(high) && high > 0).toBe(true);
    expect(parameterOf(() => lowFrequencyGreybody(p(90, 0.1)))).toBe('omega');
  });
  test('solveRadial refuses a hole not made by kerrHole and a subnormal ω, naming hole and omega', () => {
    const hole = kerrHole({ a: 0.5 });
    expect(parameterOf(() => solveRadial({ hole: {} as never, s: 0, m: 0, omega: 0.3, lambda: 2 }))).toBe('hole');
    expect(parameterOf(() => solveRadial({ hole, s: 0, m: 0, omega: 5e-324, lambda: 0 }))).toBe('omega');
  });
  test('a subnormal spheroidal c gives the c = 0 eigenvalue exactly (the change is below c² ~ 1e-645)', () => {
    expect(spheroidalEigenvalue({ s: 1, l: 1, m: 0, c: -6e-323 }).A).toBe(spheroidalEigenvalue({ s: 1, l: 1, m: 0, c: 0 }).A);
  });
  test('evolveHole reports a threshold never crossed as reached: false at the lifetime, not NaN', () => {
    const page = pageFunctions({ table: bundledPageTable() });
    const history = evolveHole({ functions: page, aStar0: 0.5 }, { aStarThresholds: [0.1] });
    expect(history.crossings[0].reached).toBe(true);
    // g = 2f keeps a* constant (da*/du = −a*(g/f − 2) = 0): a* = 0.5 never falls below 0.3.
    const constant = evolveHole(
      { functions: { ...page, g: (a: number) => 2 * page.f(a) }, aStar0: 0.5 },
      { aStarThresholds: [0.3] },
    );
    expect(constant.crossings[0]).toEqual({ aStar: 0.3, time: constant.lifetime, atStart: false, reached: false });
  });
  test('greybody itself is unaffected: Γ(s = 0, l = 1, a = 0.5, Mω = 0.3) is finite and positive', () => {
    expect(greybody({ hole: { a: 0.5 }, mode: { field: { spin: 0 }, l: 1, m: 0 }, omega: 0.3 }).gamma).toBeGreaterThan(0);
  });
  test('massLossRates of a species with 0 dof and a mass of 1e-296 GeV states finite errors (its table-wide scan ran without end: the hole masses overflowed) and 0 relative error where nothing is emitted (it gave NaN)', () => {
    const r = massLossRates({ species: [{ name: 'photon', spin: 0, dof: 0, massGeV: 1.0186760097899475e-296 }] });
    expect(r.at(1e15, 0).error).toEqual({ interpolation: { f: 0, g: 0 }, node: { f: 0, g: 0 }, f: 0, g: 0 });
    expect(Number.isFinite(r.interpolationError.f) && Number.isFinite(r.nodeError.g)).toBe(true);
  });
});
