/**
 * The documented range end to end: l up to 200 (core's MAX_L is 230), |a| up
 * to 0.99999 M, Mω up to 30. Each check is against something outside the
 * code path: flux conservation Γ + R = 1 with R from an independent solve of
 * the −|s| field (Teukolsky & Press, ApJ 193, 443 (1974)); the geometric-
 * optics capture cross-section 27πM² (Misner, Thorne & Wheeler, Gravitation,
 * 1973); a solve at the tightest tolerance 1e-12; the s = 2 superradiant
 * peak's rise toward about 138 % as a → M (Teukolsky & Press 1974, value
 * from memory). The full sweep is bench/range.bench.mjs.
 */
import { describe, expect, it } from 'vitest';
import { MAX_L, MAX_SOLVER_A_RATIO, type FieldSpin } from '@penumbra/core';
import { kerrHole } from '@penumbra/kerr';
import { absorptionCrossSection, automaticMaxL, greybody } from '@penumbra/flux';

const SPINS: FieldSpin[] = [0, 0.5, 1, 2];
/** l and m of a boson mode; for the fermion l − 1/2 and m moved 1/2 toward zero (m = 0 → 1/2). */
const lm = (spin: FieldSpin, l: number, m: number) =>
  spin === 0.5 ? { l: l - 0.5, m: m < 0 ? m + 0.5 : Math.max(m - 0.5, 0.5) } : { l, m };

describe('the documented range: l up to 200, |a| up to 0.99999 M, Mω up to 30', () => {
  it('the limits: l ≤ 230 and |a| ≤ 0.99999 M are accepted', () => {
    expect(MAX_L).toBeGreaterThanOrEqual(200);
    expect(MAX_SOLVER_A_RATIO).toBe(0.99999);
  });

  for (const spin of SPINS) {
    it(`s = ${spin}: flux is conserved, |Γ + R − 1| ≤ 1e-8, at l = 150 (Mω = 30, in the transition band, a = 0) and l = 200 (Mω = 30, m = l, a = 0.9)`, () => {
      for (const [a, l, m] of [
        [0, 150, 0],
        [0.9, 200, 200],
      ]) {
        const r = greybody({ hole: { a }, mode: { field: { spin }, ...lm(spin, l, m) }, omega: 30 });
        expect(r.residual).toBeLessThanOrEqual(1e-8);
        expect(r.relError).toBeLessThanOrEqual(1e-8);
      }
    });
  }

  for (const spin of SPINS) {
    it(`s = ${spin}, a = 0.99999 M: flux is conserved to 1e-8 (l = 2, m = ±2, Mω = 0.5 and 3) and Γ(l = m = 2, Mω = 0.5) agrees with a tol-1e-11 solve to 1e-8 (1e-12 is refused there: below the rounding floor)`, () => {
      for (const [m, omega] of [
        [2, 0.5],
        [-2, 0.5],
        [2, 3],
        [-2, 3],
      ]) {
        const r = greybody({ hole: { a: 0.99999 }, mode: { field: { spin }, ...lm(spin, 2, m) }, omega });
        expect(r.residual).toBeLessThanOrEqual(1e-8);
      }
      const problem = { hole: { a: 0.99999 }, mode: { field: { spin }, ...lm(spin, 2, 2) }, omega: 0.5 };
      const tight = greybody(problem, { tol: 1e-11, reflection: false });
      expect(Math.abs(greybody(problem).gamma / tight.gamma - 1)).toBeLessThanOrEqual(1e-8);
    });
  }

  it('a = 0.99999 M, Mω = 10 (the near-horizon solution winds about 2e3 radians per e-fold of r − r+): s = 2, l = 2, m = 0 has |Γ + R − 1| ≤ 1e-8 and |Γ − 1| ≤ 1e-8', () => {
    const r = greybody({ hole: { a: 0.99999 }, mode: { field: { spin: 2 }, l: 2, m: 0 }, omega: 10 });
    expect(r.residual).toBeLessThanOrEqual(1e-8);
    expect(Math.abs(r.gamma - 1)).toBeLessThanOrEqual(1e-8);
  });

  it('s = 2, l = m = 2: the superradiant peak rises from a = 0.9999 to 0.99999 M by more than 5 % and stays below 138 % (Teukolsky & Press 1974, value from memory), above 130 %', () => {
    const peak = (a: number) => {
      const top = 2 * kerrHole({ a }).omegaH;
      const f = (w: number) =>
        greybody({ hole: { a }, mode: { field: { spin: 2 }, l: 2, m: 2 }, omega: w }, { tol: 1e-7, reflection: false })
          .amplification;
      // golden-section search over the top of the band, where the peak sits near extremality
      let lo = 0.95 * top,
        hi = 0.9999 * top;
      const g = (Math.sqrt(5) - 1) / 2;
      for (let i = 0; i < 18; i++) {
        const x1 = hi - g * (hi - lo),
          x2 = lo + g * (hi - lo);
        if (f(x1) > f(x2)) hi = x2;
        else lo = x1;
      }
      return f((lo + hi) / 2);
    };
    const p4 = peak(0.9999);
    const p5 = peak(0.99999);
    expect(p5).toBeGreaterThan(p4 + 0.05);
    expect(p5).toBeGreaterThan(1.3);
    expect(p5).toBeLessThan(1.38);
  });

  it('σ at Mω = 30, a = 0, s = 0 (l-sum to l > 150) is the geometric-optics capture cross-section 27πM² (Misner, Thorne & Wheeler 1973) to 0.5 %', () => {
    const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin: 0 }, omega: 30 }, { tol: 1e-3 });
    expect(Math.abs(r.sigma / (27 * Math.PI) - 1)).toBeLessThanOrEqual(5e-3);
    expect(r.diagnostics.lMax).toBeGreaterThan(150);
  });

  it('σ at Mω = 10, a = 0 is 27πM² (Misner, Thorne & Wheeler 1973) to 0.5 % for every spin', () => {
    for (const spin of SPINS) {
      const r = absorptionCrossSection({ hole: { a: 0 }, field: { spin }, omega: 10 }, { tol: 1e-4 });
      expect(Math.abs(r.sigma / (27 * Math.PI) - 1)).toBeLessThanOrEqual(5e-3);
    }
  });

  it('the automatic maxL is the geometric-optics cut plus 20 shells, capped at MAX_L: 176 at Mω = 30, a = 0 and 230 at Mω = 30, a → M', () => {
    expect(automaticMaxL(30, 0)).toBe(Math.ceil(30 * 3 * Math.sqrt(3) - 0.5) + 20);
    expect(automaticMaxL(30, 0.99999)).toBe(MAX_L);
    expect(automaticMaxL(0.1, 0)).toBe(21);
  });
});
