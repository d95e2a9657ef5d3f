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

const table = bundledMassiveRateTable();
const sm = resolveContent(['standard-model']);
const smRates = massLossRates({ species: sm });
const { G, hbar, c } = CODATA2018;
/** f in MacGibbon's normalisation: dM/dt = −5.34e25 f (M/g)⁻² g s⁻¹ (Phys. Rev. D 44, 376 (1991), value from memory). */
const macGibbon = (f: number) => (f * ((hbar * c ** 4) / G ** 2) * 1e9) / 5.34e25;

describe('f(M, a*) and g(M, a*) with massive species', () => {
  test('the tabulated f, g of one dof of a massive scalar agree with direct emissionTotals (massLossAt, tol 1e-3) at an off-grid (Mμ, a*) within the stated interpolation + node + direct errors (spins 1/2 and 1: bench/mass-loss.bench.mjs)', () => {
    const mu = 0.5 * (table.fieldMass[4] + table.fieldMass[5]);
    const a = 0.5 * (table.aStar[1] + table.aStar[2]);
    const species = [{ name: 'heavy', spin: 0 as const, dof: 1, massGeV: mu / FIELD_MASS_PER_GRAM_GEV }];
    const rates = massLossRates({ species });
    const direct = massLossAt({ species, massGrams: 1, aStar: a }, { tol: 1e-3 });
    const tab = rates.at(1, a);
    expect(Math.abs(tab.f / direct.f - 1)).toBeLessThan(rates.interpolationError.f + rates.nodeError.f + direct.fRelError);
    expect(Math.abs(tab.g / direct.g - 1)).toBeLessThan(rates.interpolationError.g + rates.nodeError.g + direct.gRelError);
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

  test('the mass whose lifetime is the age of the universe at a* = 0 is about 5e14 g within 20 % (Carr, Kohri, Sendouda & Yokoyama, Phys. Rev. D 81, 104019 (2010), value from memory)', () => {
    const r = massForLifetime({ rates: smRates });
    expect(r.massGrams / 5e14).toBeGreaterThan(0.8);
    expect(r.massGrams / 5e14).toBeLessThan(1.2);
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
