import { readFileSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { smallCSeries, spheroidalEigenvalue, spheroidalEigenvalueComplex } from '@penumbra/spheroidal';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

type Z = { re: number; im: number };
const dist = (a: Z, b: Z) => Math.hypot(a.re - b.re, a.im - b.im) / Math.max(1, Math.hypot(b.re, b.im));
const A = (s: number, l: number, m: number, c: Z) => spheroidalEigenvalueComplex({ s, l, m, c }).A;

// Modes and complex c inside the supported range |c| ≤ 10, |Im c| ≤ |Re c|, |Im c| ≤ 4.
const modeArb = fc.constantFrom(-2, -1, -0.5, 0, 0.5, 1, 2).chain((s) =>
  fc.integer({ min: 0, max: 4 }).chain((dl) => {
    const l = Math.abs(s) + dl;
    return fc.integer({ min: 0, max: 2 * l }).map((k) => ({ s, l, m: -l + k }));
  }),
);
const cArb = fc
  .record({
    r: fc.double({ min: 0.05, max: 9.9, noNaN: true }),
    t: fc.double({ min: -1, max: 1, noNaN: true }),
    flip: fc.boolean(),
  })
  .map(({ r, t, flip }) => {
    const re = r * Math.cos((t * Math.PI) / 4) * (flip ? -1 : 1);
    const im = Math.max(-4, Math.min(4, r * Math.sin((t * Math.PI) / 4)));
    return { re, im };
  });

describe('spheroidalEigenvalueComplex', () => {
  it('reduces to the real-c eigenvalue at Im c = 0 (bit-identical) and as Im c → 0: Re A to 1e-13, Im A / Im c → dA/dc of the real eigenvalue (Cauchy–Riemann) to 1e-6', () => {
    for (const [s, l, m, c] of [
      [-2, 2, 2, 1.5],
      [0, 3, 1, -6],
      [1, 4, -2, 9.5],
      [0.5, 1.5, 0.5, 3],
    ] as const) {
      const real = (x: number) => spheroidalEigenvalue({ s, l, m, c: x }, { continuation: false }).A;
      const exact = A(s, l, m, { re: c, im: 0 });
      expect(Object.is(exact.re, real(c))).toBe(true);
      expect(exact.im).toBe(0);
      const h = 1e-4;
      const slope = (real(c + h) - real(c - h)) / (2 * h);
      const nearby = A(s, l, m, { re: c, im: 1e-9 });
      expect(Math.abs(nearby.re - real(c)) / Math.max(1, Math.abs(real(c)))).toBeLessThan(1e-13);
      expect(Math.abs(nearby.im / 1e-9 - slope) / Math.max(1, Math.abs(slope))).toBeLessThan(1e-6);
    }
  });

  it('matches 30-digit mpmath values of the spectral problem (fixture by make_complex_fixture.py, branch tracked from real c) to 1e-13 relative', () => {
    const fixture = JSON.parse(readFileSync(new URL('./fixtures/complex-c.json', import.meta.url), 'utf8')) as {
      rows: { s: number; l: number; m: number; c_re: number; c_im: number; A_re: number; A_im: number }[];
    };
    expect(fixture.rows.length).toBeGreaterThan(30);
    for (const r of fixture.rows) {
      const got = A(r.s, r.l, r.m, { re: r.c_re, im: r.c_im });
      expect(dist(got, { re: r.A_re, im: r.A_im }), JSON.stringify(r)).toBeLessThan(1e-13);
    }
  });

  it('follows the second-order small-c series of Press & Teukolsky (1973) / Seidel (1989) for complex c with a remainder below 2|c|³ at |c| = 0.01, 0.02', () => {
    for (const s of [-2, -1, -0.5, 0, 0.5, 1, 2]) {
      for (let l = Math.abs(s); l <= Math.abs(s) + 3; l++) {
        for (let m = -l; m <= l; m++) {
          const [A0, A1, A2] = smallCSeries(s, l, m);
          for (const c of [
            { re: 0.008, im: 0.006 },
            { re: -0.015, im: 0.013 },
          ]) {
            const c2 = { re: c.re * c.re - c.im * c.im, im: 2 * c.re * c.im };
            const series = { re: A0 + A1 * c.re + A2 * c2.re, im: A1 * c.im + A2 * c2.im };
            const got = A(s, l, m, c);
            expect(Math.hypot(got.re - series.re, got.im - series.im)).toBeLessThan(2 * Math.hypot(c.re, c.im) ** 3);
          }
        }
      }
    }
  });

  it('agrees with Leaver’s continued fraction (J. Math. Phys. 27, 1238 (1986)) in complex arithmetic to 1e-10 across the supported range', () => {
    let worst = 0;
    for (const s of [-2, 0, 0.5, 1]) {
      for (const l of [Math.abs(s), Math.abs(s) + 3]) {
        for (const m of [-l, l]) {
          for (const [re, im] of [
            [9.7, 2],
            [-7, 4],
            [4, -4],
            [2.5, 1],
            [-0.3, -0.3],
            [6, -3.5],
          ]) {
            const r = spheroidalEigenvalueComplex({ s, l, m, c: { re, im } });
            worst = Math.max(worst, r.diagnostics.agreement);
          }
        }
      }
    }
    expect(worst).toBeLessThan(1e-10);
  });

  it('obeys A_{−s l m}(c) = A_{s l m}(c) + 2s for complex c to 1e-12 (spin-reversal symmetry of E, Teukolsky 1973; fast-check)', () => {
    fc.assert(
      fc.property(modeArb, cArb, ({ s, l, m }, c) => {
        const plus = A(s, l, m, c);
        const minus = A(-s, l, m, c);
        expect(dist(minus, { re: plus.re + 2 * s, im: plus.im })).toBeLessThan(1e-12);
      }),
      { numRuns: 40 },
    );
  });

  it('obeys A_{s l −m}(−c) = A_{s l m}(c) for complex c to 1e-12 (x → −x symmetry of the angular equation; fast-check)', () => {
    fc.assert(
      fc.property(modeArb, cArb, ({ s, l, m }, c) => {
        expect(dist(A(s, l, -m, { re: -c.re, im: -c.im }), A(s, l, m, c))).toBeLessThan(1e-12);
      }),
      { numRuns: 40 },
    );
  });

  it('obeys A(c̄) = conj A(c) for real s, m to 1e-12 (the equation has real coefficients apart from c; fast-check)', () => {
    fc.assert(
      fc.property(modeArb, cArb, ({ s, l, m }, c) => {
        const a = A(s, l, m, c);
        expect(dist(A(s, l, m, { re: c.re, im: -c.im }), { re: a.re, im: -a.im })).toBeLessThan(1e-12);
      }),
      { numRuns: 40 },
    );
  });

  it('reports diagnostics (path steps, truncation, residual, continued-fraction agreement) and E = A + s(s + 1)', () => {
    const r = spheroidalEigenvalueComplex({ s: -2, l: 2, m: 2, c: { re: 3, im: -1 } });
    expect(r.diagnostics.pathSteps).toBeGreaterThan(0);
    expect(r.diagnostics.truncation).toBeGreaterThan(3);
    expect(r.diagnostics.residual).toBeLessThan(1e-14);
    expect(r.E).toEqual({ re: r.A.re + 2, im: r.A.im });
  });

  it('throws InputError for c outside |c| ≤ 10, |Im c| ≤ |Re c|, |Im c| ≤ 4, non-finite or malformed c, and bad mode numbers', () => {
    const bad: [unknown, string][] = [
      [{ re: 10, im: 0.5 }, 'problem.c'],
      [{ re: 1, im: 1.5 }, 'problem.c'],
      [{ re: 0, im: 0.1 }, 'problem.c'],
      [{ re: 6, im: 4.5 }, 'problem.c'],
      [{ re: Number.NaN, im: 0 }, 'problem.c'],
      [{ re: 1, im: Infinity }, 'problem.c'],
      [null, 'problem.c'],
      ['not a number', 'problem.c'],
    ];
    for (const [c, parameter] of bad) {
      let caught: unknown;
      try {
        spheroidalEigenvalueComplex({ s: 0, l: 2, m: 0, c: c as Z });
      } catch (e) {
        caught = e;
      }
      expect(caught, JSON.stringify(c)).toBeInstanceOf(InputError);
      expect((caught as InputError).parameter).toBe(parameter);
    }
    expect(() => spheroidalEigenvalueComplex({ s: -2, l: 1, m: 0, c: { re: 1, im: 0 } })).toThrow(InputError);
  });
});
