import { describe, expect, test } from 'vitest';
import fc from 'fast-check';
import { delta, kerrHole } from '@penumbra/kerr';

const relativeError = (value: number, reference: number) => Math.abs(value - reference) / Math.abs(reference);

describe('Schwarzschild limit a = 0 (Schwarzschild 1916; Misner, Thorne & Wheeler, Gravitation, 1973, ch. 31)', () => {
  for (const M of [1, 2.5, 1e-3, 7e4]) {
    test(`M = ${M}: r+ = 2M, r- = 0, Ω_H = 0, κ = 1/(4M), T_H = 1/(8πM), A = 16πM², S = 4πM² to 1e-15 relative`, () => {
      const hole = kerrHole({ a: 0, mass: M });
      expect(relativeError(hole.rPlus, 2 * M)).toBeLessThan(1e-15);
      expect(hole.rMinus).toBe(0);
      expect(hole.omegaH).toBe(0);
      expect(relativeError(hole.kappa, 1 / (4 * M))).toBeLessThan(1e-15);
      expect(relativeError(hole.temperature, 1 / (8 * Math.PI * M))).toBeLessThan(1e-15);
      expect(relativeError(hole.area, 16 * Math.PI * M * M)).toBeLessThan(1e-15);
      expect(relativeError(hole.entropy, 4 * Math.PI * M * M)).toBeLessThan(1e-15);
    });
  }
});

describe('Kerr closed forms (Bardeen, Press & Teukolsky, ApJ 178, 347 (1972))', () => {
  const spins = [0.1, 0.5, 0.9, -0.9, 0.99, 0.9999, 1 - 1e-12];
  for (const a of spins) {
    test(`a = ${a}: r± = M ± √(M² − a²), Ω_H = a/(r+² + a²), κ = (r+ − r−)/(2(r+² + a²)), A = 4π(r+² + a²) to 1e-14 relative`, () => {
      const hole = kerrHole({ a: a });
      // Reference evaluated in the textbook form; (1 − a)(1 + a) is exact enough for these spins.
      const root = Math.sqrt((1 - a) * (1 + a));
      const rPlus = 1 + root;
      const rMinus = 1 - root;
      expect(relativeError(hole.rPlus, rPlus)).toBeLessThan(1e-14);
      // 1 − root loses digits near a = 0 in the reference, not in kerrHole: compare with a loose floor there.
      expect(Math.abs(hole.rMinus - rMinus)).toBeLessThan(1e-15);
      expect(relativeError(hole.omegaH, a / (rPlus * rPlus + a * a))).toBeLessThan(1e-14);
      expect(relativeError(hole.area, 4 * Math.PI * (rPlus * rPlus + a * a))).toBeLessThan(1e-14);
      expect(relativeError(hole.kappa, (2 * root) / (2 * (rPlus * rPlus + a * a)))).toBeLessThan(1e-14);
      expect(relativeError(hole.temperature, hole.kappa / (2 * Math.PI))).toBeLessThan(1e-15);
      expect(hole.entropy).toBe(hole.area / 4);
      expect(hole.angularMomentum).toBe(a);
    });
  }

  test('r− = a²/r+ keeps full relative accuracy at small spin (a = 1e-9: r− = a²/4 to 1e-15 relative, value from the series r− = a²/(2M) + O(a⁴))', () => {
    const hole = kerrHole({ a: 1e-9 });
    expect(relativeError(hole.rMinus, 1e-18 / 2)).toBeLessThan(1e-15);
  });

  test('near extremality κ keeps full relative accuracy: a = 1 − 1e-12 gives κ = √(2e-12)/(2(1 + √(2e-12))) to 1e-9 relative (series in ε = 1 − a)', () => {
    const epsilon = 1e-12;
    const hole = kerrHole({ a: 1 - epsilon });
    // √(M² − a²) = √(ε(2 − ε)); a is the double nearest 1 − 1e-12, so compare with that a.
    const a = hole.a;
    const root = Math.sqrt((1 - a) * (1 + a));
    expect(relativeError(hole.kappa, root / (2 * (1 + root)))).toBeLessThan(1e-9);
    expect(relativeError(root, Math.sqrt(2 * epsilon))).toBeLessThan(1e-3);
  });
});

describe('identities for random holes (fast-check)', () => {
  const holeArbitrary = fc.record({
    mass: fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
    // subnormal spins lose relative precision in a = (a/M)·M; they are not physics
    spinRatio: fc.double({ min: -0.9999, max: 0.9999, noNaN: true }).filter((s) => s === 0 || Math.abs(s) > 1e-100),
  });

  test('Δ(r±) = 0 and Δ(r) = r² − 2Mr + a² away from the roots, to 1e-12 relative (definition, Bardeen, Press & Teukolsky 1972)', () => {
    fc.assert(
      fc.property(holeArbitrary, fc.double({ min: 1.5, max: 100, noNaN: true }), ({ mass, spinRatio }, factor) => {
        const hole = kerrHole({ a: spinRatio * mass, mass });
        expect(delta(hole, hole.rPlus) === 0).toBe(true);
        expect(delta(hole, hole.rMinus) === 0).toBe(true);
        const r = factor * hole.rPlus;
        const a = hole.a;
        const reference = r * r - 2 * mass * r + a * a;
        expect(Math.abs(delta(hole, r) - reference)).toBeLessThan(1e-12 * (r * r + a * a));
      }),
    );
  });

  test('Smarr formula M = 2 Ω_H J + 2 T_H S holds to 1e-13 relative (Smarr, Phys. Rev. Lett. 30, 71 (1973))', () => {
    fc.assert(
      fc.property(holeArbitrary, ({ mass, spinRatio }) => {
        const hole = kerrHole({ a: spinRatio * mass, mass });
        const smarr = 2 * hole.omegaH * hole.angularMomentum + 2 * hole.temperature * hole.entropy;
        expect(relativeError(smarr, mass)).toBeLessThan(1e-13);
      }),
    );
  });

  test('first law dM = T_H dS + Ω_H dJ holds along random directions to 1e-8 (Bardeen, Carter & Hawking, Commun. Math. Phys. 31, 161 (1973); Richardson-extrapolated central differences)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.5, max: 2, noNaN: true }),
        fc.double({ min: -0.99, max: 0.99, noNaN: true }),
        fc.double({ min: -1, max: 1, noNaN: true }),
        (mass, spinRatio, direction) => {
          // Vary (M, J) along (1, direction); S as a function of (M, J).
          const J = spinRatio * mass * mass;
          const entropyAt = (m: number, j: number) => kerrHole({ a: j / m, mass: m }).entropy;
          const central = (h: number) =>
            (entropyAt(mass + h, J + direction * h) - entropyAt(mass - h, J - direction * h)) / (2 * h);
          // S is singular at extremality |J| = M²: keep the step well inside that distance.
          const h = (1e-3 * (mass * mass - Math.abs(J))) / mass;
          const dS = (4 * central(h / 2) - central(h)) / 3;
          const hole = kerrHole({ a: J / mass, mass });
          // 1 = T dS/dλ + Ω dJ/dλ along the path λ ↦ (M + λ, J + direction·λ)
          const rhs = hole.temperature * dS + hole.omegaH * direction;
          expect(Math.abs(rhs - 1)).toBeLessThan(1e-8);
        },
      ),
    );
  });

  test('scaling: lengths scale as M, Ω_H and T_H as 1/M, A as M² at fixed a/M, to 1e-14 + 4e-16/(1 − (a/M)²) relative (dimensional analysis, common practice, no source; the second term is the rounding of a = (a/M)·M amplified near extremality)', () => {
    fc.assert(
      fc.property(holeArbitrary, ({ mass, spinRatio }) => {
        const unit = kerrHole({ a: spinRatio, mass: 1 });
        const hole = kerrHole({ a: spinRatio * mass, mass });
        const tolerance = 1e-14 + 4e-16 / (1 - spinRatio * spinRatio);
        expect(relativeError(hole.rPlus, unit.rPlus * mass)).toBeLessThan(tolerance);
        expect(relativeError(hole.temperature, unit.temperature / mass)).toBeLessThan(tolerance);
        expect(relativeError(hole.area, unit.area * mass * mass)).toBeLessThan(tolerance);
        if (hole.a !== 0) expect(relativeError(hole.omegaH, unit.omegaH / mass)).toBeLessThan(tolerance);
      }),
    );
  });

  test('a → −a flips Ω_H and J and leaves r±, κ, T_H, A unchanged exactly (reflection symmetry φ → −φ)', () => {
    fc.assert(
      fc.property(holeArbitrary, ({ mass, spinRatio }) => {
        const plus = kerrHole({ a: spinRatio * mass, mass });
        const minus = kerrHole({ a: -spinRatio * mass, mass });
        expect(minus.rPlus).toBe(plus.rPlus);
        expect(minus.rMinus).toBe(plus.rMinus);
        expect(minus.kappa).toBe(plus.kappa);
        expect(minus.area).toBe(plus.area);
        expect(minus.omegaH).toBe(-plus.omegaH);
        expect(minus.angularMomentum).toBe(-plus.angularMomentum);
      }),
    );
  });
});
