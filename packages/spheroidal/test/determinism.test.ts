import { clearSpheroidalCache, spheroidalEigenvalue, spheroidalHarmonic } from '@penumbra/spheroidal';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';

// Property (common practice, no source): a result must not depend on which
// other points were solved before it, so that grids give identical numbers for
// any worker count or order.
const modes = [
  { s: -2, l: 2, m: 2 },
  { s: -2, l: 5, m: -3 },
  { s: -1, l: 3, m: 0 },
  { s: -0.5, l: 2.5, m: 1.5 },
  { s: 0, l: 4, m: 1 },
  { s: 2, l: 7, m: -7 },
];
const cValue = fc.double({ min: -20, max: 20, noNaN: true });
const call = fc.record({ mode: fc.constantFrom(...modes), c: cValue });

describe('history independence of spheroidalEigenvalue', () => {
  it('gives a bit-identical A cold and after any sequence of other calls (fast-check over call orders)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...modes), cValue, fc.array(call, { maxLength: 25 }), (mode, c, history) => {
        clearSpheroidalCache();
        const cold = spheroidalEigenvalue({ ...mode, c });
        const coldHarmonic = spheroidalHarmonic({ ...mode, c }, { continuation: false }).evaluate(0.7);
        clearSpheroidalCache();
        for (const h of history) spheroidalEigenvalue({ ...h.mode, c: h.c });
        // Also a nearby point of the same mode, so that the warm path is taken.
        spheroidalEigenvalue({ ...mode, c: c + 0.03 });
        const warm = spheroidalEigenvalue({ ...mode, c });
        expect(Object.is(warm.A, cold.A)).toBe(true);
        const warmHarmonic = spheroidalHarmonic({ ...mode, c: c - 0.02 }) && spheroidalHarmonic({ ...mode, c }).evaluate(0.7);
        expect(Object.is(warmHarmonic.S, coldHarmonic.S)).toBe(true);
      }),
      { numRuns: 60 },
    );
  });

  it('keeps a repeated point bit-identical while later solves of the mode reuse its stores (band sizes growing and shrinking)', () => {
    // The next solve of a mode builds its band and eigenvector in the stores of the last one (eigenvalue.ts):
    // a harmonic read at once must still be that of a cold solve, at every size the sweep passes through.
    const mode = { s: -2, l: 4, m: -1 };
    const cs = [0.3, 6, 0.5, 12, 1, 18, 0.2, 18, 18];
    clearSpheroidalCache();
    for (const c of cs) {
      const warm = spheroidalHarmonic({ ...mode, c });
      const cold = spheroidalHarmonic({ ...mode, c }, { continuation: false });
      expect(Array.from(warm.coefficients)).toEqual(Array.from(cold.coefficients));
      expect(Object.is(warm.A, cold.A)).toBe(true);
    }
  });

  it('gives bit-identical values along a c-sweep in forward, backward and shuffled order', () => {
    const cs = Array.from({ length: 41 }, (_, i) => -10 + 0.5 * i);
    const solve = (order: number[]) => {
      clearSpheroidalCache();
      const out = new Map<number, number>();
      for (const i of order) out.set(i, spheroidalEigenvalue({ s: -2, l: 3, m: 1, c: cs[i] }).A);
      return out;
    };
    const forward = solve(cs.map((_, i) => i));
    const backward = solve(cs.map((_, i) => cs.length - 1 - i));
    const shuffled = solve(cs.map((_, i) => (i * 17) % cs.length));
    for (let i = 0; i < cs.length; i++) {
      expect(Object.is(backward.get(i), forward.get(i))).toBe(true);
      expect(Object.is(shuffled.get(i), forward.get(i))).toBe(true);
    }
  });
});

describe('pairs of pole-concentrated modes at large |c|', () => {
  // At c = 30 the lowest two eigenvalues of these modes agree to all digits
  // (the eigenfunctions sit at opposite poles); the count of eigenvalues steps
  // by two there. The value is checked against Leaver's continued fraction
  // (Leaver, J. Math. Phys. 27, 1238 (1986)), an independent method.
  const pairs = [
    { s: 2, l: 2, m: -2 },
    { s: 1, l: 2, m: -2 },
    { s: 0.5, l: 2.5, m: -2.5 },
  ];
  it('solves them warm and cold to the same bits without the dense eigen-solve', () => {
    for (const mode of pairs) {
      const c = 29.9997;
      clearSpheroidalCache();
      const cold = spheroidalEigenvalue({ ...mode, c }, { continuation: false, leaver: 'check' });
      spheroidalEigenvalue({ ...mode, c: c * (1 - 1e-9) });
      const warm = spheroidalEigenvalue({ ...mode, c });
      expect(Object.is(warm.A, cold.A)).toBe(true);
      expect(cold.diagnostics.method).toBe('spectral-rqi');
      expect(warm.diagnostics.method).toBe('spectral-rqi');
      expect(cold.diagnostics.agreement).toBeLessThan(1e-7);
    }
  });
});
