import { describe, expect, test } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { greybody, type GreybodySolution } from '@penumbra/flux';

const MIN_NORMAL = 2.2250738585072014e-308;
const solve = (spin: 0 | 0.5 | 1 | 2, l: number, m: number, a: number, omega: number): GreybodySolution =>
  greybody({ hole: { a }, mode: { field: { spin }, l, m }, omega });

describe('greybody factors below the double range are reported honestly', () => {
  test('s = 2, l = 30, Mω = 1e-5 (Γ ≈ 10^-409): gamma is 0 with underflow = true and a finite log10Gamma; no subnormal is returned', () => {
    const r = solve(2, 30, 0, 0, 1e-5);
    expect(r.underflow).toBe(true);
    expect(r.gamma).toBe(0);
    expect(r.amplification).toBe(0);
    expect(Number.isFinite(r.log10Gamma)).toBe(true);
    expect(r.log10Gamma!).toBeLessThan(Math.log10(MIN_NORMAL));
    expect(r.relError).toBeLessThan(1e-8);
  });

  test('log10Gamma follows the low-frequency law Γ ∝ (Mω)^(2l+2) across the underflow (Starobinsky 1973; Page, PRD 13, 198 (1976)): slope 62 for l = 30 to 1e-3', () => {
    const lo = solve(2, 30, 0, 0, 1e-5);
    const hi = solve(2, 30, 0, 0, 2e-5);
    expect(Math.abs((hi.log10Gamma! - lo.log10Gamma!) / Math.log10(2) - 62)).toBeLessThan(1e-3);
  });

  test('a superradiant mode below the range keeps its sign in the flags: underflow = true, superradiant = true, gamma 0, log10Gamma finite', () => {
    const r = solve(2, 30, 30, 0.9, 1e-5);
    expect(r).toMatchObject({ underflow: true, superradiant: true, gamma: 0, amplification: 0 });
    expect(Number.isFinite(r.log10Gamma)).toBe(true);
  });

  test('for a normal Γ, log10Gamma = log10|Γ| to 1e-12 absolute and underflow = false (s = 1, l = 1, a = 0.9, Mω = 0.3)', () => {
    const r = solve(1, 1, 1, 0.9, 0.3);
    expect(r.underflow).toBe(false);
    expect(Math.abs(r.log10Gamma! - Math.log10(Math.abs(r.gamma)))).toBeLessThan(1e-12);
  });

  test('at the exact superradiant threshold ω = mΩ_H the diagnostics are finite (radii 0, message says why), Γ = 0 exactly and log10Gamma is absent', () => {
    const omega = kerrHole({ a: 0.5 }).omegaH;
    const r = solve(1, 1, 1, 0.5, omega);
    expect(r.diagnostics.startRadius).toBe(0);
    expect(r.diagnostics.matchRadius).toBe(0);
    expect(r.diagnostics.message).toMatch(/no integration/);
    expect(r.gamma).toBe(0);
    expect(r.underflow).toBe(false);
    expect('log10Gamma' in r).toBe(false);
  });

  test('JSON.stringify of solutions (threshold, underflow, superradiant, fermion, s = 0) contains no null: no NaN or ±Infinity anywhere', () => {
    const omegaH = kerrHole({ a: 0.5 }).omegaH;
    const solutions = [
      solve(1, 1, 1, 0.5, omegaH),
      solve(2, 2, 2, 0.5, 2 * omegaH),
      solve(2, 30, 0, 0, 1e-5),
      solve(2, 2, 2, 0.99, 0.3),
      solve(0.5, 0.5, 0.5, 0.7, 0.2),
      solve(0, 0, 0, 0.3, 0.1),
    ];
    for (const r of solutions) expect(JSON.stringify(r)).not.toContain('null');
  });
});
