/**
 * The s = 0 radial equation with the Klein–Gordon mass term −μ²r²
 * (docs/massive-fields.md): the far-zone series with the long-range phase
 * k∞r* + (Mμ²/k∞)L(r) must solve the equation — checked by Abel's identity
 * (the Wronskian Δ(R₁R₂' − R₁'R₂) of two solutions is constant; Teukolsky,
 * ApJ 185, 635 (1973) for the equation) and its value 2ik∞ fixed by the
 * leading terms — and problems are validated.
 */
import { describe, expect, it } from 'vitest';
import { kerrHole } from '@penumbra/kerr';
import { solveRadial } from '@penumbra/radial';
import { evaluateFar, farSeries } from '@penumbra/radial/internal';

const modes = [
  { a: 0, s: 0, m: 0, omega: 0.4, lambda: 2, mu: 0.3 },
  { a: 0.9, s: 0, m: 1, omega: 0.4, lambda: 1.39, mu: 0.3 },
  { a: 0.99, s: 0, m: 2, omega: 1.1, lambda: 5.2, mu: 1.0 },
];

describe('massive far-zone series', () => {
  for (const { a, ...mode } of modes) {
    it(`the in/out Wronskian Δ(R_in R_out' − R_in' R_out) equals 2ik∞ at two radii to 1e-12 (a=${a}, Mω=${mode.omega}, Mμ=${mode.mu})`, () => {
      const hole = kerrHole({ a });
      const kInf = Math.sqrt(mode.omega ** 2 - mode.mu ** 2);
      const fin = farSeries(hole, mode, -1),
        fout = farSeries(hole, mode, 1);
      expect(fin.p).toBeCloseTo(-1, 12);
      expect(fout.beta).toBeCloseTo((hole.mass * mode.mu ** 2) / kInf, 14);
      for (const r of [80 / kInf, 240 / kInf]) {
        const p = evaluateFar(hole, mode, fin, r),
          q = evaluateFar(hole, mode, fout, r);
        const d = (r - hole.rPlus) * (r - hole.rMinus);
        const re = d * (p.R[0] * q.dR[0] - p.R[1] * q.dR[1] - (p.dR[0] * q.R[0] - p.dR[1] * q.R[1]));
        const im = d * (p.R[0] * q.dR[1] + p.R[1] * q.dR[0] - (p.dR[0] * q.R[1] + p.dR[1] * q.R[0]));
        expect(Math.hypot(re, im - 2 * kInf) / (2 * kInf)).toBeLessThan(1e-12);
      }
    });
  }

  it('plane waves are wrong at every radius: the long-range phase β L(r) of the solution changes by β ln 3 ≈ 0.37 rad between k∞r = 100 and 300, so no constant amplitude absorbs it (a = 0, Mω = 0.4, Mμ = 0.3)', () => {
    const hole = kerrHole({ a: 0 });
    const mode = { s: 0, m: 0, omega: 0.4, lambda: 2, mu: 0.3 };
    const out = farSeries(hole, mode, 1);
    const kInf = Math.sqrt(0.4 ** 2 - 0.3 ** 2);
    const phaseGap = (r: number) => {
      const withLog = evaluateFar(hole, mode, out, r);
      const plain = evaluateFar(hole, mode, { ...out, beta: 0 }, r);
      expect(Math.abs(Math.hypot(...withLog.R) / Math.hypot(...plain.R) - 1)).toBeLessThan(1e-12);
      return Math.atan2(withLog.R[1], withLog.R[0]) - Math.atan2(plain.R[1], plain.R[0]);
    };
    const drift = Math.abs(Math.sin(phaseGap(300 / kInf) - phaseGap(100 / kInf)));
    expect(drift).toBeCloseTo(Math.sin(((0.3 * 0.3) / kInf) * Math.log(3)), 2);
    expect(drift).toBeGreaterThan(0.3);
  });
});

describe('massive radial problems', () => {
  const hole = kerrHole({ a: 0.5 });
  it('refuses μ for s ≠ 0 (naming mu), |ω| ≤ μ (naming omega) and a negative μ', () => {
    expect(() => solveRadial({ hole, s: 1, m: 0, omega: 0.4, lambda: 2, mu: 0.1 })).toThrow(
      expect.objectContaining({ parameter: 'mu' }),
    );
    expect(() => solveRadial({ hole, s: 0, m: 0, omega: 0.3, lambda: 2, mu: 0.3 })).toThrow(
      expect.objectContaining({ parameter: 'omega' }),
    );
    expect(() => solveRadial({ hole, s: 0, m: 0, omega: 0.4, lambda: 2, mu: -0.1 })).toThrow(
      expect.objectContaining({ parameter: 'mu' }),
    );
  });
  it('μ = 0 given explicitly is the massless solve exactly', () => {
    const a = solveRadial({ hole, s: 0, m: 1, omega: 0.4, lambda: 2.1, mu: 0 });
    const b = solveRadial({ hole, s: 0, m: 1, omega: 0.4, lambda: 2.1 });
    expect(a.logAbsZIn).toBe(b.logAbsZIn);
    expect(a.logAbsZOut).toBe(b.logAbsZOut);
  });
});
