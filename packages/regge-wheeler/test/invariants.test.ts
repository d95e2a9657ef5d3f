import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { schwarzschildGreybody } from '@penumbra/regge-wheeler';
import { integrateOnce } from '@penumbra/regge-wheeler/internal';

const SPINS = [0, 0.5, 1, 2] as const;

// Flux conservation of a real potential: |A_in|² = 1 + |A_out|² (Wronskian of ψ and ψ̄).
describe('flux conservation Γ + R = 1 (Wronskian identity of a real potential)', () => {
  it('holds to 1e-10 for random spin, l ≤ |s| + 4 and 1e-3 ≤ Mω ≤ 5 (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...SPINS),
        fc.integer({ min: 0, max: 4 }),
        fc.double({ min: Math.log(1e-3), max: Math.log(5), noNaN: true }),
        (spin, lOffset, logOmega) => {
          const r = schwarzschildGreybody({ field: { spin }, l: spin + lOffset, omega: Math.exp(logOmega) });
          expect(r.residual).toBeLessThan(1e-10);
          expect(Math.abs(r.gamma + r.reflection - 1)).toBe(r.residual);
          expect(r.diagnostics.errorEstimate).toBeLessThanOrEqual(1e-11);
          expect(r.gamma).toBeGreaterThan(0);
          expect(r.gamma).toBeLessThanOrEqual(1 + 1e-10);
        },
      ),
      { numRuns: 20, seed: 20260412 },
    );
  });
});

describe('Dirac potential: the supersymmetric partners W² + dW/dr* and W² − dW/dr* (Chandrasekhar 1983)', () => {
  for (const [l, omega] of [
    [0.5, 1e-3],
    [0.5, 0.2],
    [1.5, 0.35],
    [3.5, 0.9],
    [6.5, 5],
  ] as const) {
    it(`give the same Γ to 1e-10 relative for l = ${l}, Mω = ${omega}`, () => {
      const plus = integrateOnce({ field: { spin: 0.5 }, l, omega }, { diracSign: 1 });
      const minus = integrateOnce({ field: { spin: 0.5 }, l, omega }, { diracSign: -1 });
      expect(Math.abs(minus.gamma / plus.gamma - 1)).toBeLessThan(1e-10);
    });
  }
});

// Each case: Γ must not move when a numerical choice moves. Stated tolerance 1e-10 relative (the requirement).
const CASES: Array<[number, number, number]> = [
  [0, 0, 1e-3],
  [0, 3, 0.4],
  [0.5, 2.5, 0.05],
  [1, 1, 0.25],
  [2, 2, 0.6],
  [2, 6, 1.5],
  [1, 4, 5],
];

describe('independence of the numerical choices (change in Γ ≤ 1e-10 relative)', () => {
  for (const [spin, l, omega] of CASES) {
    const label = `s = ${spin}, l = ${l}, Mω = ${omega}`;
    it(`${label}: start radius 2M(1 + 0.15) → 2M(1 + 0.03) and 2M(1 + 0.45)`, () => {
      const base = integrateOnce({ field: { spin }, l, omega });
      for (const startOffset of [0.03, 0.45]) {
        const moved = integrateOnce({ field: { spin }, l, omega }, { startOffset });
        expect(Math.abs(moved.gamma / base.gamma - 1)).toBeLessThan(1e-10);
      }
    });
    it(`${label}: matching radius moved outward by factors 2 and 5`, () => {
      const base = integrateOnce({ field: { spin }, l, omega });
      for (const factor of [2, 5]) {
        const moved = integrateOnce({ field: { spin }, l, omega }, { matchRadius: factor * base.matchRadius /* M = 1 */ });
        expect(moved.matchRadius).toBeGreaterThanOrEqual(factor * base.matchRadius * 0.999);
        expect(Math.abs(moved.gamma / base.gamma - 1)).toBeLessThan(1e-10);
      }
    });
    it(`${label}: tol 1e-11 → 1e-12 and step tolerance ÷ 100`, () => {
      const base = schwarzschildGreybody({ field: { spin }, l, omega });
      const tighter = schwarzschildGreybody({ field: { spin }, l, omega }, { tol: 1e-12 });
      expect(Math.abs(tighter.gamma / base.gamma - 1)).toBeLessThan(1e-10);
      const fineSteps = integrateOnce({ field: { spin }, l, omega }, { stepToleranceFactor: 0.01 });
      expect(Math.abs(fineSteps.gamma / base.gamma - 1)).toBeLessThan(1e-10);
    });
  }

  it('the error estimate is honest: |Γ(tol 1e-11) − Γ(tol 1e-12)|/Γ ≤ errorEstimate + 1e-12 over the cases', () => {
    for (const [spin, l, omega] of CASES) {
      const base = schwarzschildGreybody({ field: { spin }, l, omega });
      const tighter = schwarzschildGreybody({ field: { spin }, l, omega }, { tol: 1e-12 });
      expect(Math.abs(tighter.gamma / base.gamma - 1)).toBeLessThanOrEqual(base.diagnostics.errorEstimate + 1e-12);
    }
  });
});

describe('result record', () => {
  it('echoes the query and carries diagnostics (steps, RHS evaluations, series terms, radii, method)', () => {
    const r = schwarzschildGreybody({ field: { spin: 2 }, l: 3, omega: 0.7, mass: 2 });
    expect(r).toMatchObject({ spin: 2, l: 3, omega: 0.7, mass: 2 });
    expect(r.diagnostics.startRadius).toBeGreaterThan(4);
    expect(r.diagnostics.startRadius).toBeLessThan(8);
    expect(r.diagnostics.matchRadius).toBeGreaterThan(20);
    expect(r.diagnostics.steps).toBeGreaterThan(100);
    expect(r.diagnostics.rhsEvaluations).toBeGreaterThanOrEqual(6 * r.diagnostics.steps);
    expect(r.diagnostics.seriesTerms).toBeGreaterThan(10);
    expect(r.diagnostics.method).toMatch(/Regge–Wheeler/);
    expect(schwarzschildGreybody({ field: { spin: 0.5 }, l: 0.5, omega: 0.7 }).diagnostics.method).toMatch(/Dirac/);
  });
});
