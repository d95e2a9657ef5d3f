import { describe, expect, test } from 'vitest';
import { adaptiveKronrod, adaptiveNested, fejerFirstWeights, fejerWeights, kronrodPanel } from '@penumbra/emission/internal';

describe('Gauss–Kronrod rule (QUADPACK qk15 nodes, Piessens et al. 1983)', () => {
  test('the 15-point Kronrod rule integrates x^k on [0, 1] exactly for k ≤ 22 (to 1e-14 relative)', () => {
    for (let k = 0; k <= 22; k++) {
      const p = kronrodPanel((x) => [x ** k], 0, 1, 1);
      expect(Math.abs(p.value[0] * (k + 1) - 1)).toBeLessThan(1e-14);
    }
  });
  test('the embedded 7-point Gauss rule is exact to degree 13: its error estimate is at the rounding floor there (below 1e-13)', () => {
    for (let k = 0; k <= 13; k++) expect(kronrodPanel((x) => [x ** k], -1, 1, 1).error[0]).toBeLessThan(1e-13);
  });
  test('adaptive integration of x³e^{−x} over [0, 60] gives Γ(4) = 6 (Abramowitz & Stegun 6.1.1) to 1e-10 relative', () => {
    const r = adaptiveKronrod((x) => [x ** 3 * Math.exp(-x), x * Math.exp(-x)], [0, 60], [1e-11, 1e-11]);
    expect(Math.abs(r.value[0] / 6 - 1)).toBeLessThan(1e-10);
    expect(Math.abs(r.value[1] - 1)).toBeLessThan(1e-10);
    expect(r.error[0]).toBeLessThan(1e-10);
  });
});

describe('nested Fejér rules (Fejér 1933; weights after Waldvogel, BIT 46, 195 (2006))', () => {
  const moment = (k: number) => (k % 2 === 1 ? 0 : 2 / (k + 1)); // ∫_{−1}^{1} x^k dx
  test('the second rule on the N − 1 points cos(jπ/N) integrates x^k on [−1, 1] exactly for k ≤ N − 2 (to 1e-14), N = 4 … 64', () => {
    for (const N of [4, 8, 16, 32, 64]) {
      const w = fejerWeights(N);
      for (let k = 0; k <= N - 2; k++) {
        let s = 0;
        for (let j = 1; j < N; j++) s += w[j - 1] * Math.cos((j * Math.PI) / N) ** k;
        expect(Math.abs(s - moment(k))).toBeLessThan(1e-14);
      }
    }
  });
  test('the first rule on the n zeros of T_n integrates x^k exactly for k ≤ n − 1 (to 1e-14), n = 2 … 32', () => {
    for (const n of [2, 4, 8, 16, 32]) {
      const w = fejerFirstWeights(n);
      for (let k = 0; k <= n - 1; k++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += w[i] * Math.cos(((2 * i + 1) * Math.PI) / (2 * n)) ** k;
        expect(Math.abs(s - moment(k))).toBeLessThan(1e-14);
      }
    }
  });
  test('adaptive nested integration of x³e^{−x} over [0, 60] gives Γ(4) = 6 (Abramowitz & Stegun 6.1.1) to 1e-10, its error estimate above the true error', () => {
    const r = adaptiveNested((x) => [x ** 3 * Math.exp(-x), x * Math.exp(-x)], [0, 60], [1e-11, 1e-11]);
    expect(Math.abs(r.value[0] / 6 - 1)).toBeLessThan(1e-10);
    expect(Math.abs(r.value[1] - 1)).toBeLessThan(1e-10);
    expect(r.error[0]).toBeGreaterThanOrEqual(Math.abs(r.value[0] - 6));
    expect(r.error[1]).toBeGreaterThanOrEqual(Math.abs(r.value[1] - 1));
  });
  test('raising a panel reuses every value: one panel of e^{−x} to 1e-14 costs 7, 15, 31 or 63 evaluations, none at a repeated node', () => {
    const seen = new Set<number>();
    let repeats = 0;
    const r = adaptiveNested(
      (x) => {
        if (seen.has(x)) repeats++;
        seen.add(x);
        return [Math.exp(-x)];
      },
      [0, 2],
      [1e-14],
    );
    expect(repeats).toBe(0);
    expect(r.panels).toBe(1);
    expect([7, 15, 31, 63]).toContain(r.evaluations);
    expect(Math.abs(r.value[0] - (1 - Math.exp(-2)))).toBeLessThan(1e-14);
  });
  test('the reported error is at least the true error for peaked integrands x^p e^{−x/t} on [0, 1] (p = 0 … 40, t = 0.01 … 0.3; Γ-function values, A&S 6.5.1), tolerances 1e-3 … 1e-9', () => {
    // ∫_0^1 x^p e^{−x/t} dx = t^{p+1} γ(p + 1, 1/t); γ by its series (A&S 6.5.29)
    const lowerGamma = (a: number, x: number) => {
      let term = 1 / a;
      let sum = term;
      for (let n = 1; n < 2000 && term > 1e-18 * sum; n++) {
        term *= x / (a + n);
        sum += term;
      }
      return Math.exp(a * Math.log(x) - x) * sum;
    };
    let checked = 0;
    for (const p of [0, 2, 5, 11, 19, 40])
      for (const t of [0.01, 0.03, 0.1, 0.3])
        for (const tol of [1e-3, 1e-6, 1e-9]) {
          const exact = t ** (p + 1) * lowerGamma(p + 1, 1 / t);
          const r = adaptiveNested((x) => [x ** p * Math.exp(-x / t)], [0, 1], [0], tol);
          expect(r.error[0]).toBeGreaterThanOrEqual(Math.abs(r.value[0] - exact) - 1e-15 * exact);
          expect(r.error[0]).toBeLessThanOrEqual(tol * Math.abs(r.value[0]));
          checked++;
        }
    expect(checked).toBe(72);
  });
});
