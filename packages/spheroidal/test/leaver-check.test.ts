/**
 * Leaver's continued fraction as a check of real-c eigenvalues (issue: the
 * check reported agreement 0.34 at s = −2, l = 4, m = 1, c = 40 while the
 * eigenvalue was right; 'polish' moved c = 20 values away from the reference).
 * References: scipy.special.obl_cv (general-purpose library, s = 0,
 * fixtures/oblate-cv.json) and the identity A_{−s} = A_s + 2s (E = A + s(s+1)
 * symmetric in s → −s; Teukolsky 1973, shared physics notes), confirmed to
 * 40 digits in test/fixtures/greybody.
 */
import { readFileSync } from 'node:fs';
import { spheroidalEigenvalue } from '@penumbra/spheroidal';
import { describe, expect, it } from 'vitest';

describe("Leaver's continued fraction as a check of real-c eigenvalues", () => {
  it('agrees with the spectral value to 1e-12 at |c| = 40 for s = ±2, ±1 of both signs of c (s = −2, l = 4, m = 1, c = 40 used to report 0.34)', () => {
    for (const [s, l, m] of [
      [-2, 4, 1],
      [2, 4, 1],
      [-2, 2, 2],
      [-1, 3, 0],
      [1, 5, -3],
    ]) {
      for (const c of [40, -40]) {
        const r = spheroidalEigenvalue({ s, l, m, c }, { leaver: 'check', continuation: false });
        expect(r.diagnostics.agreement).toBeLessThanOrEqual(1e-12);
      }
    }
  });

  it('agrees to 1e-8 where the continued fraction is least precise (|c| = 15…20, measured ≤ 8e-9) and keeps A_{−s} = A_s + 2s to 1e-12 relative', () => {
    for (const [s, l, m, c] of [
      [-1, 5, -3, 20],
      [1, 5, -3, 20],
      [0, 2, 2, 15],
      [-2, 4, 1, 20],
    ]) {
      const r = spheroidalEigenvalue({ s, l, m, c }, { leaver: 'check', continuation: false });
      expect(r.diagnostics.agreement).toBeLessThanOrEqual(1e-8);
      const mirror = spheroidalEigenvalue({ s: -s, l, m, c }, { continuation: false });
      expect(Math.abs(mirror.A - (r.A + 2 * s)) / Math.max(1, Math.abs(r.A))).toBeLessThanOrEqual(1e-12);
    }
  });

  it("with 'polish' never moves a value beyond its error estimate: every scipy.special.obl_cv fixture row (s = 0, |c| ≤ 20) stays within errorEstimate of the reference, and within it of the unpolished value", () => {
    const fixture = JSON.parse(readFileSync(new URL('./fixtures/oblate-cv.json', import.meta.url), 'utf8')) as {
      rows: { m: number; l: number; c: number; cv: number }[];
    };
    for (const { m, l, c, cv } of fixture.rows) {
      const plain = spheroidalEigenvalue({ s: 0, l, m, c }, { continuation: false });
      const polished = spheroidalEigenvalue({ s: 0, l, m, c }, { continuation: false, leaver: 'polish' });
      const scale = Math.max(1, Math.abs(cv));
      expect(Math.abs(polished.A - cv) / scale).toBeLessThanOrEqual(polished.diagnostics.errorEstimate);
      expect(Math.abs(polished.A - plain.A) / scale).toBeLessThanOrEqual(plain.diagnostics.errorEstimate);
    }
  });

  it("is off by default: no continued-fraction figures in the diagnostics unless leaver is 'check' or 'polish'", () => {
    const d = spheroidalEigenvalue({ s: -2, l: 3, m: 1, c: 7 }, { continuation: false }).diagnostics;
    expect(d.agreement).toBeUndefined();
    expect(d.continuedFractionDepth).toBeUndefined();
    expect(d.method).not.toMatch(/leaver/);
  });
});
