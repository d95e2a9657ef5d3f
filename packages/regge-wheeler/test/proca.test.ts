import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import { procaGreybody, schwarzschildGreybody, type ProcaPolarization } from '@penumbra/regge-wheeler';
import { integrateProca, sectorModel } from '@penumbra/regge-wheeler/internal';

const proca = (pol: ProcaPolarization, l: number, omega: number, mu: number, tol = 1e-10) =>
  procaGreybody({ field: { spin: 1, mass: mu }, l, omega, polarization: pol }, { tol });
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

// Massless limits (docs/massive-vector.md, "Massless limit"): the odd sector
// becomes the Regge–Wheeler s = 1 equation, the even sector splits into the
// transverse s = 1 mode and the longitudinal mode, which obeys the massless
// scalar equation of the same l (Stueckelberg decoupling). The reference
// values are the in-project Regge–Wheeler solver, itself pinned to mpmath
// (reference-fixture.test.ts).
describe('Proca Γ as Mμ → 0 (Regge–Wheeler s = 1 and s = 0 limits)', () => {
  const cases: Array<[ProcaPolarization, number, number, number]> = [
    // polarisation, Proca l, massless spin, massless l
    ['odd', 1, 1, 1],
    ['even-1', 1, 1, 1],
    ['even-2', 1, 0, 1],
    ['monopole', 0, 0, 0],
  ];
  for (const [pol, l, spin, lRef] of cases) {
    it(`${pol}, l = ${l}, Mω = 0.3: Γ(Mμ) − Γ(massless s = ${spin}) shrinks as (Mμ)² (ratio of differences at Mμ = 4e-3 and 2e-3 within 4 ± 0.05) and is below 2e-4 relative at Mμ = 2e-3`, () => {
      const massless = schwarzschildGreybody({ field: { spin }, l: lRef, omega: 0.3 }).gamma;
      const d2 = proca(pol, l, 0.3, 4e-3).gamma - massless;
      const d1 = proca(pol, l, 0.3, 2e-3).gamma - massless;
      expect(Math.abs(d1 / massless)).toBeLessThan(2e-4);
      expect(d2 / d1).toBeGreaterThan(3.95);
      expect(d2 / d1).toBeLessThan(4.05);
    });
  }
});

describe('Proca flux conservation (unitarity of the S-matrix, conserved Proca current)', () => {
  const cases: Array<[ProcaPolarization, number, number, number]> = [
    ['odd', 2, 0.4, 0.2],
    ['even-1', 1, 0.3, 0.1],
    ['even-1', 2, 0.5, 0.2],
    ['even-1', 1, 0.21, 0.2],
    ['monopole', 0, 0.5, 0.4],
  ];
  for (const [pol, l, omega, mu] of cases) {
    it(`${pol}, l = ${l}, Mω = ${omega}, Mμ = ${mu}: every entry of |T + R − 1| ≤ 1e-9 and every Γ in (0, 1)`, () => {
      const s = proca(pol, l, omega, mu);
      expect(s.residual).toBeLessThan(1e-9);
      for (const g of s.sectorGammas) {
        expect(g).toBeGreaterThan(0);
        expect(g).toBeLessThan(1);
      }
    });
  }
});

describe('Proca even sector: per-channel Γ depends on the basis, their sum does not (trace of the absorption matrix)', () => {
  it('l = 2, Mω = 0.5, Mμ = 0.2: rotating the raw channel basis at both ends by 0.7 rad moves the diagonal entries by > 1e-3 but the eigen-Γ and the sum by ≤ 1e-12 relative', () => {
    const model = sectorModel('even', 2, 0.5, 0.2);
    const controls = { startOffset: 0.15, stepTolerance: 1e-13 };
    const a = integrateProca(model, controls);
    const b = integrateProca(model, { ...controls, basisAngle: 0.7 });
    expect(Math.abs(a.channelDiagonal[0] - b.channelDiagonal[0])).toBeGreaterThan(1e-3);
    const sum = (x: number[]) => x[0] + x[1];
    expect(relative(sum(b.channelDiagonal), sum(a.channelDiagonal))).toBeLessThan(1e-12);
    expect(relative(sum(a.gammas), sum(a.channelDiagonal))).toBeLessThan(1e-12);
    expect(relative(b.gammas[0], a.gammas[0])).toBeLessThan(1e-12);
    expect(relative(b.gammas[1], a.gammas[1])).toBeLessThan(1e-12);
  });
});

describe('Proca even sector: one integration gives the Γ of both even polarisations (the two eigenvalues of one absorption matrix)', () => {
  it('l = 1, Mω = 0.3, Mμ = 0.15, tol 1e-8: even-2 right after even-1 reuses its integration (no new steps), equal bit for bit to a fresh even-2 solve; the same polarisation again solves afresh', () => {
    const first = proca('even-1', 1, 0.3, 0.15, 1e-8);
    const shared = proca('even-2', 1, 0.3, 0.15, 1e-8);
    const fresh = proca('even-2', 1, 0.3, 0.15, 1e-8);
    const again = proca('even-2', 1, 0.3, 0.15, 1e-8);
    expect(first.diagnostics.steps).toBeGreaterThan(0);
    expect(shared.diagnostics.steps).toBe(0);
    expect(shared.diagnostics.rhsEvaluations).toBe(0);
    expect(shared.diagnostics.message).toMatch(/earlier call/);
    expect(fresh.diagnostics.steps).toBe(first.diagnostics.steps);
    expect(again.diagnostics.steps).toBe(first.diagnostics.steps);
    expect(shared.gamma).toBe(fresh.gamma);
    expect(shared.diagnostics.errorEstimate).toBe(fresh.diagnostics.errorEstimate);
    expect(shared.sectorGammas).toEqual([first.gamma, fresh.gamma]);
    // another tol is another solve
    expect(proca('even-1', 1, 0.3, 0.15, 1e-9).diagnostics.steps).toBeGreaterThan(0);
  });
});

describe('Proca far zone: the answer does not move with the matching radius (long-range log phase in the series)', () => {
  for (const [sector, l, omega, mu] of [
    ['even', 1, 0.21, 0.2],
    ['monopole', 0, 0.25, 0.2],
  ] as const) {
    it(`${sector}, l = ${l}, Mω = ${omega}, Mμ = ${mu} (near threshold, η = Mμ²/k∞ = ${((mu * mu) / Math.sqrt(omega * omega - mu * mu)).toFixed(2)}): Γ at matching radii 80M and 400M agree to 1e-9`, () => {
      const model = sectorModel(sector, l, omega, mu);
      const near = integrateProca(model, { startOffset: 0.15, stepTolerance: 1e-14, matchRadius: 80 });
      const far = integrateProca(model, { startOffset: 0.15, stepTolerance: 1e-14, matchRadius: 400 });
      for (const [i, g] of near.gammas.entries()) expect(relative(g, far.gammas[i])).toBeLessThan(1e-9);
    });
  }
});

describe('Proca integrators: the extrapolation loop against the Cash–Karp RK45 route (two independent integrators)', () => {
  for (const [polarization, l, omega, mu] of [
    ['odd', 1, 0.3, 0.1],
    ['even-1', 2, 0.8, 0.4],
    ['even-2', 1, 0.22, 0.2],
    ['monopole', 0, 0.3, 0.29],
  ] as const) {
    it(`${polarization}, l = ${l}, Mω = ${omega}, Mμ = ${mu}: Γ agrees to 1e-9 relative at tol 1e-10, with ≥ 2× fewer right-hand-side evaluations`, () => {
      const problem = { field: { spin: 1 as const, mass: mu }, l, omega, polarization };
      const gbs = procaGreybody(problem, { tol: 1e-10 });
      const ck = procaGreybody(problem, { tol: 1e-10, integrator: 'cash-karp' });
      expect(relative(gbs.gamma, ck.gamma)).toBeLessThan(1e-9);
      expect(2 * gbs.diagnostics.rhsEvaluations).toBeLessThan(ck.diagnostics.rhsEvaluations);
    });
  }
  it('an unknown integrator is an InputError naming integrator', () => {
    const problem = { field: { spin: 1 as const, mass: 0.1 }, l: 1, omega: 0.3, polarization: 'odd' as const };
    expect(() => procaGreybody(problem, { integrator: 'rk4' as never })).toThrow(/integrator/);
  });
});

describe('Proca input errors name the parameter', () => {
  it('ω ≤ μ is an InputError naming omega that says no wave reaches infinity', () => {
    expect(() => proca('odd', 1, 0.2, 0.2)).toThrow(InputError);
    expect(() => proca('odd', 1, 0.2, 0.2)).toThrow(/omega.*no wave reaches infinity/);
  });
  it('a massless vector is refused naming field.mass; l = 0 takes only the monopole, l ≥ 1 not the monopole', () => {
    expect(() => proca('odd', 1, 0.3, 0)).toThrow(/field\.mass/);
    expect(() => proca('odd', 0, 0.3, 0.1)).toThrow(/polarization/);
    expect(() => proca('monopole', 1, 0.3, 0.1)).toThrow(/polarization/);
  });
});
