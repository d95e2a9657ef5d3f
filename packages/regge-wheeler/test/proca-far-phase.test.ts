/**
 * The phase-form far zone (proca/farPhase.ts): near threshold the far
 * solutions are summed where their asymptotic series converges and carried
 * inward by Chebyshev collocation of the Riccati form. Checks: Γ agrees with
 * the direct route, which integrates the horizon solutions out to where the
 * series converges (itself pinned to the 30-digit mpmath references in
 * proca-reference.test.ts), and the carried solutions are outgoing waves with
 * the flux the series gives them (flux conservation of the Proca current,
 * docs/massive-vector.md §2).
 */
import { describe, expect, it } from 'vitest';
import { procaRadialSolution } from '@penumbra/regge-wheeler';
import { PHASE_SLACK, defaultPhaseRadius, integrateProca, sectorModel } from '@penumbra/regge-wheeler/internal';

const MODES: Array<['odd' | 'monopole', number, number, number]> = [
  ['odd', 1, 0.3, 0.2996],
  ['odd', 3, 1.5, 1.4981],
  ['odd', 2, 0.8, 0.792],
  ['monopole', 0, 0.3, 0.2996],
];
const EVEN: Array<[number, number, number]> = [
  [1, 0.3, 0.2996],
  [3, 1.5, 1.4981],
];

describe('Proca far zone carried in phase form (near threshold)', () => {
  it.each(MODES)(
    '%s l = %i, Mω = %f, Mμ = %f: Γ agrees with the direct far start to 1e-10, at an inner matching radius',
    (sector, l, omega, mu) => {
      const model = sectorModel(sector, l, omega, mu);
      // the phase form asked for at the default phase radius (whether the default route takes it is carryPays' choice)
      const carried = integrateProca(model, { startOffset: 0.09, stepTolerance: 1e-12, phaseRadius: defaultPhaseRadius(model) });
      const direct = integrateProca(model, { startOffset: 0.09, stepTolerance: 1e-12, phaseRadius: false });
      expect(carried.phaseSteps).toBeGreaterThan(0);
      // it ends at the phase radius, or at the end of a whole interval up to PHASE_SLACK outside it
      expect(carried.matchRadius).toBeGreaterThanOrEqual(defaultPhaseRadius(model) * (1 - 1e-12));
      expect(carried.matchRadius).toBeLessThanOrEqual(PHASE_SLACK * defaultPhaseRadius(model));
      expect(carried.matchRadius).toBeLessThan(carried.farStartRadius / 5);
      expect(Math.abs(carried.gammas[0] / direct.gammas[0] - 1)).toBeLessThan(1e-10);
      expect(carried.residual).toBeLessThan(1e-10);
    },
  );

  it.each(EVEN)(
    'even l = %i, Mω = %f, Mμ = %f (two channels): both Γ of the sector agree with the direct far start to 1e-10',
    (l, omega, mu) => {
      const model = sectorModel('even', l, omega, mu);
      const carried = integrateProca(model, { startOffset: 0.09, stepTolerance: 1e-12, phaseRadius: defaultPhaseRadius(model) });
      const direct = integrateProca(model, { startOffset: 0.09, stepTolerance: 1e-12, phaseRadius: false });
      expect(carried.phaseSteps).toBeGreaterThan(0);
      expect(carried.matchRadius).toBeGreaterThanOrEqual(defaultPhaseRadius(model) * (1 - 1e-12));
      expect(carried.matchRadius).toBeLessThanOrEqual(PHASE_SLACK * defaultPhaseRadius(model));
      for (const i of [0, 1]) expect(Math.abs(carried.gammas[i] / direct.gammas[i] - 1)).toBeLessThan(1e-10);
      expect(carried.residual).toBeLessThan(1e-10);
    },
  );

  it('the default route carries where the phase per interval is large (even l = 2, Mω = 0.8, Mμ = 0.799: ~17 rad) and not at ~7 rad (even l = 1, Mω = 0.3, Mμ = 0.297)', () => {
    const far = integrateProca(sectorModel('even', 2, 0.8, 0.799), { startOffset: 0.5, stepTolerance: 1.5e-11 });
    expect(far.phaseSteps).toBeGreaterThan(0);
    const near = integrateProca(sectorModel('even', 1, 0.3, 0.297), { startOffset: 0.5, stepTolerance: 1.5e-11 });
    expect(near.phaseSteps).toBe(0);
  });

  it('below the phase it pays for (even l = 1, Mω = 0.3, v = 0.3: ~17 rad) the direct route is kept', () => {
    const model = sectorModel('even', 1, 0.3, 0.3 * Math.sqrt(1 - 0.09));
    const run = integrateProca(model, { startOffset: 0.09, stepTolerance: 1e-11 });
    expect(run.phaseSteps).toBe(0);
    expect(run.matchRadius).toBe(run.farStartRadius);
  });

  it('the solution sampled inside the carried zone keeps its flux to 1e-9 (odd l = 2, Mω = 0.8, Mμ = 0.799, tol 1e-8: step tolerances above the collocation floor)', () => {
    const radii = [3, 20, 60, 200, 600, 1200, 3000];
    const sol = procaRadialSolution({ field: { spin: 1, mass: 0.799 }, l: 2, omega: 0.8, polarization: 'odd' }, radii, {
      tol: 1e-8,
    });
    const inner = sol.diagnostics.matchRadius;
    expect(radii.filter((r) => r > inner && r < 1000).length).toBeGreaterThan(2);
    for (const s of sol.samples) expect(Math.abs(s.flux / sol.horizonFlux - 1)).toBeLessThan(1e-9);
  });
});
