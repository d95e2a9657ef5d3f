/**
 * f(M, a*), g(M, a*) with massive species (massLossRates, from the shipped
 * massive/massless ratio table) and the evaporation they drive: the tables
 * against direct solves at off-grid points, MacGibbon's normalised f(M), the
 * mass whose lifetime is the age of the universe, energy conservation.
 */
import { describe, expect, test } from 'vitest';
import { CODATA2018 } from '@penumbra/kerr';
import {
  FIELD_MASS_PER_GRAM_GEV,
  bundledMassiveRateTable,
  evaporateHole,
  massForLifetime,
  massLossAt,
  massLossRates,
  resolveContent,
} from '@penumbra/emission';
import { nodeRatio, withoutNode } from '@penumbra/emission/internal';

const table = bundledMassiveRateTable();
const rowOf = (spin: 0 | 0.5 | 1) => table.spins.find((r) => r.spin === spin)!;
const sm = resolveContent(['standard-model']);
const smRates = massLossRates({ species: sm });
const { G, hbar, c } = CODATA2018;
/** f in MacGibbon's normalisation: dM/dt = −5.34e25 f (M/g)⁻² g s⁻¹ (Phys. Rev. D 44, 376 (1991), value from memory). */
const macGibbon = (f: number) => (f * ((hbar * c ** 4) / G ** 2) * 1e9) / 5.34e25;

describe('f(M, a*) and g(M, a*) with massive species', () => {
  test('the tabulated f, g of one dof of a massive scalar agree with direct emissionTotals (massLossAt, tol 1e-3) at an off-grid (Mμ, a*) within the stated interpolation + node + direct errors (spins 1/2 and 1: bench/mass-loss.bench.mjs)', () => {
    const scalarRow = rowOf(0);
    const mu = 0.5 * (scalarRow.fieldMass[4] + scalarRow.fieldMass[5]);
    const a = 0.5 * (scalarRow.aStar[1] + scalarRow.aStar[2]);
    const species = [{ name: 'heavy', spin: 0 as const, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
    const rates = massLossRates({ species });
    const direct = massLossAt({ species, massGrams: 1, aStar: a }, { tol: 1e-3 });
    const tab = rates.at(1, a);
    expect(Math.abs(tab.f / direct.f - 1)).toBeLessThan(rates.interpolationError.f + rates.nodeError.f + direct.fRelError);
    expect(Math.abs(tab.g / direct.g - 1)).toBeLessThan(rates.interpolationError.g + rates.nodeError.g + direct.gRelError);
  });

  test('the local error stated by at(M, a*) bounds the difference to direct emissionTotals (massLossAt, tol 1e-3) off the nodes: a massive scalar at (Mμ, a*) = (0.145, 0), (0.21, 0.51), (0.065, 0.78), (0.425, 0.18) (the former worst point of g) and (0.435, 0.134) (a cell midpoint near threshold), a massive Dirac fermion at (0.2625, 0.432) (a cell midpoint where its ratio bends most)', () => {
    for (const [spin, mu, a] of [
      [0, 0.145, 0],
      [0, 0.21, 0.51],
      [0, 0.065, 0.78],
      [0, 0.425, 0.18],
      [0, 0.435, 0.134],
      [0.5, 0.2625, 0.432],
    ] as const) {
      const species = [{ name: 'heavy', spin, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
      const tab = massLossRates({ species }).at(1, a);
      const direct = massLossAt({ species, massGrams: 1, aStar: a }, { tol: 1e-3 });
      expect(Math.abs(tab.f / direct.f - 1)).toBeLessThan(tab.error.f + direct.fRelError);
      if (a > 0) expect(Math.abs(tab.g / direct.g - 1)).toBeLessThan(tab.error.g + direct.gRelError);
    }
  });

  test('leave-one-node-out (each interior θ node, Mμ node and both, spins 0, 1/2, 1; no solves): the left-out node is within the stated interpolation error of f in at least 95 % of cases and within 2× of it in all (common practice, no source)', () => {
    const ratios: number[] = [];
    for (const spin of [0, 0.5, 1] as const) {
      const row = rowOf(spin);
      const nT = row.theta.length;
      const nM = row.fieldMass.length;
      const cases: { drop: { theta?: number; fieldMass?: number }; i: number; j: number }[] = [];
      for (let j = 1; j < nT - 1; j++) for (let i = 1; i < nM; i++) cases.push({ drop: { theta: j }, i, j });
      for (let i = 2; i < nM - 1; i++) for (let j = 0; j < nT; j++) cases.push({ drop: { fieldMass: i }, i, j });
      for (let j = 1; j < nT - 1; j++) for (let i = 2; i < nM - 1; i++) cases.push({ drop: { theta: j, fieldMass: i }, i, j });
      for (const c of cases) {
        const species = [{ name: 'x', spin, dof: 1, massGeV: row.fieldMass[c.i] / FIELD_MASS_PER_GRAM_GEV }];
        const a = row.aStar[c.j];
        const truth = massLossRates({ species }).at(1, a);
        const left = massLossRates({ species, massiveTable: withoutNode(table, c.drop) }).at(1, a);
        ratios.push(Math.abs(left.f / truth.f - 1) / left.error.interpolation.f);
      }
    }
    expect(ratios.length).toBe(1851);
    expect(ratios.filter((r) => r <= 1).length / ratios.length).toBeGreaterThanOrEqual(0.95);
    for (const r of ratios) expect(r).toBeLessThan(2);
  });

  test('the ratio table adds no interpolation error on its own nodes: at every (Mμ, a*) node, one dof of spins 0, 1/2 and 1 has the interpolation error of the massless species alone (the Page table between its nodes) to 1e-12', () => {
    for (const spin of [0, 0.5, 1] as const) {
      const massless = massLossRates({ species: [{ name: 'y', spin, dof: 1, massGeV: 0 }] });
      for (const mu of rowOf(spin).fieldMass.slice(1))
        for (const a of rowOf(spin).aStar) {
          const species = [{ name: 'x', spin, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
          const e = massLossRates({ species }).at(1, a).error.interpolation;
          const e0 = massless.at(1, a).error.interpolation;
          expect(Math.abs(e.f - e0.f)).toBeLessThan(1e-12);
          expect(Math.abs(e.g - e0.g)).toBeLessThan(1e-12);
        }
    }
  });

  test('the lifetime error of a non-rotating Standard-Model hole from 1e15 g is the dt-weighted average of the local error of f along its track: between its smallest and largest value over the track (to 1e-9 relative)', () => {
    const ev = evaporateHole({ rates: smRates, mass: 1e15, unit: 'g', aStar0: 0 }, { finalSeconds: [] });
    const local = ev.track.map((p) => smRates.at(p.massGrams, 0).error.f);
    // the last track point and below: the closed-form rest, with the local error there
    const last = ev.track[ev.track.length - 1].massGrams;
    for (const m of [last / 10, last / 1e3]) local.push(smRates.at(m, 0).error.f);
    expect(ev.diagnostics.tableError).toBeLessThan(Math.max(...local) * (1 + 1e-9));
    expect(ev.diagnostics.tableError).toBeGreaterThan(Math.min(...local) * (1 - 1e-9));
    expect(ev.diagnostics.aStarTableError).toBe(0);
  });

  test('the shares of the species add up to f and g to 1e-14 at every (M, a*) probed', () => {
    for (const m of [1e9, 1e12, 1e15, 1e18])
      for (const a of [0, 0.3]) {
        const p = smRates.at(m, a);
        const sf = p.species.reduce((t, s) => t + s.power, 0);
        const sg = p.species.reduce((t, s) => t + s.torqueOverA, 0);
        expect(Math.abs(sf / p.f - 1)).toBeLessThan(1e-14);
        expect(Math.abs(sg / p.g - 1)).toBeLessThan(1e-14);
      }
  });

  test("MacGibbon's normalised f(M): 1 within 2 % at 1e18 g (photons, gravitons, three neutrinos), rising monotonically as M falls from 1e20 to 1e8 g (MacGibbon, Phys. Rev. D 44, 376 (1991), values from memory)", () => {
    expect(Math.abs(macGibbon(smRates.f(1e18, 0)) - 1)).toBeLessThan(0.02);
    let previous = 0;
    for (let e = 20; e >= 8; e -= 0.25) {
      const f = macGibbon(smRates.f(10 ** e, 0));
      expect(f).toBeGreaterThanOrEqual(previous * (1 - 1e-3));
      previous = f;
    }
    // electrons and positrons (4 dof of spin 1/2) add about 4/6 of the three neutrino species' share once T_H ≫ m_e
    expect(macGibbon(smRates.f(1e15, 0))).toBeGreaterThan(1.5);
  });

  test('the mass whose lifetime is the age of the universe at a* = 0 is about 5e14 g within 20 % (Carr, Kohri, Sendouda & Yokoyama, Phys. Rev. D 81, 104019 (2010), value from memory), with a stated error below 2e-4', () => {
    const r = massForLifetime({ rates: smRates });
    expect(r.massGrams / 5e14).toBeGreaterThan(0.8);
    expect(r.massGrams / 5e14).toBeLessThan(1.2);
    expect(r.relError).toBeLessThan(2e-4);
  });

  test('the lifetimes of Standard-Model holes of 1e15 g at a* = 0, 0.5 and 0.9 meet tol = 1e-3 (the error estimate along the track, ODE + tables, is below it), each shorter as a* grows (a spinning hole radiates faster)', () => {
    let previous = Number.POSITIVE_INFINITY;
    for (const aStar0 of [0, 0.5, 0.9]) {
      const ev = evaporateHole({ rates: smRates, mass: 1e15, unit: 'g', aStar0 }, { finalSeconds: [], tol: 1e-3 });
      expect(ev.diagnostics.errorEstimate).toBeLessThan(1e-3);
      expect(ev.lifetimeSeconds).toBeLessThan(previous);
      previous = ev.lifetimeSeconds;
    }
  });

  test('the lifetimes of Standard-Model holes of 1e10 g (W, Z, Higgs and top at Mμ 0.003–0.0065, inside the first Mμ cell) at a* = 0.5 and 0.9 meet tol = 1e-3', () => {
    for (const aStar0 of [0.5, 0.9]) {
      const ev = evaporateHole({ rates: smRates, mass: 1e10, unit: 'g', aStar0 }, { finalSeconds: [], tol: 1e-3 });
      expect(ev.diagnostics.errorEstimate).toBeLessThan(1e-3);
    }
  });

  test('the row Mμ = 0 of the ratio table: spins 0 and 1/2 are 1 with no error (the massless field over itself); for spin 1 the stated error of (2 P̂₁ + P̂₀)/(3 P̂₁) bounds the change when P̂₀ and P̂₁ move by their own errors in opposite directions (first-order error propagation, to 1e-3 of it)', () => {
    const totals = (power: number, rel: number) => ({
      power,
      powerRel: rel,
      torque: power / 2,
      torqueRel: rel,
      gammaCalls: 0,
      steps: 0,
      rhsEvaluations: 0,
    });
    for (const spin of [0, 0.5] as const) {
      const r = nodeRatio(spin, undefined, totals(2.5e-4, 3e-4));
      expect([r.power, r.torque, r.powerError, r.torqueError]).toEqual([1, 1, 0, 0]);
    }
    const [p1, p0, e1, e0] = [3e-4, 4e-4, 2e-4, 5e-4];
    const r = nodeRatio(1, undefined, totals(p1, e1), totals(p0, e0));
    const ratio = (x1: number, x0: number) => (2 * x1 + x0) / (3 * x1);
    const moved = Math.max(
      Math.abs(ratio(p1 * (1 - e1), p0 * (1 + e0)) / r.power - 1),
      Math.abs(ratio(p1 * (1 + e1), p0 * (1 - e0)) / r.power - 1),
    );
    expect(r.power).toBeCloseTo(ratio(p1, p0), 14);
    expect(Math.abs(moved / r.powerError - 1)).toBeLessThan(1e-3);
  });

  test('energy conservation over a Standard-Model history from 1e13 g, a* = 0.3: Σ species energies = M₀c² to 1e-9, and each final stage to 1e-9; a* falls faster than M', () => {
    const ev = evaporateHole({ rates: smRates, mass: 1e13, unit: 'g', aStar0: 0.3 }, { finalSeconds: [1, 1e3] });
    expect(ev.energyBalance.relError).toBeLessThan(1e-9);
    for (const st of ev.finalStages) {
      const e = st.species.reduce((t, s) => t + s.energyGeV, 0);
      expect(Math.abs(e / st.energyGeV - 1)).toBeLessThan(1e-9);
    }
    for (const p of ev.track.slice(1)) expect(p.aStar / 0.3).toBeLessThan(p.massGrams / 1e13);
  });
  test('the last second does not depend on the formation mass: holes of 1e11, 1e13 and 1e14 g (a* = 0) release the same mass in their last 1 s and 1e4 s to 1e-6', () => {
    const stage = (m: number) =>
      evaporateHole({ rates: smRates, mass: m, unit: 'g', aStar0: 0 }, { finalSeconds: [1, 1e4] }).finalStages;
    const ref = stage(1e11);
    for (const m of [1e13, 1e14])
      for (const [i, st] of stage(m).entries()) expect(Math.abs(st.massGrams / ref[i].massGrams - 1)).toBeLessThan(1e-6);
  });
});
