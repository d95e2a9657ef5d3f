/**
 * Primary spectra per species (contentSpectra): d²N/(dt dE) in GeV⁻¹ s⁻¹
 * against E in GeV, all of a species' dof. Checked against the species'
 * totals in physical units: ∫ E d²N/(dt dE) dE is its power dE/dt in GeV s⁻¹
 * (energy conservation, no external source needed), which ties the units of
 * the two together; and a massive species' spectrum is 0 at and below E = m.
 */
import { describe, expect, test } from 'vitest';
import { contentSpectra, contentTotals, toPhysicalRates } from '@penumbra/emission';

describe('primary spectra per species', () => {
  test('∫ E d²N/(dt dE) dE of each species equals its dE/dt from contentTotals to 5e-3 (a 1e15 g hole, a* = 0: photons, electrons and a 10 MeV user scalar; trapezoid in ln E on 40 points from 2e-4 to 1.5 GeV)', () => {
    const content = ['photon', 'electron', { name: 'dark-scalar', spin: 0 as const, dof: 1, massGeV: 0.01 }];
    const physicalMass = { value: 1e15, unit: 'g' as const };
    const n = 40;
    const energiesGeV = Array.from({ length: n }, (_, i) => 2e-4 * (1.5 / 2e-4) ** (i / (n - 1)));
    const spectra = contentSpectra({ hole: { a: 0 }, content, physicalMass, energiesGeV }, { tol: 1e-3 });
    const totals = contentTotals({ hole: { a: 0 }, content, physicalMass }, { tol: 1e-3 });
    expect(spectra.species.map((s) => s.name)).toEqual(['photon', 'electron', 'dark-scalar']);
    for (const [k, sp] of spectra.species.entries()) {
      let integral = 0;
      for (let i = 1; i < n; i++) {
        const [e0, e1] = [energiesGeV[i - 1], energiesGeV[i]];
        integral += 0.5 * (e1 * e1 * sp.perGeVPerSecond[i] + e0 * e0 * sp.perGeVPerSecond[i - 1]) * Math.log(e1 / e0);
      }
      const row = totals.species[k];
      const power = toPhysicalRates({ numberRate: row.numberRate, power: row.power, torque: row.torque }, 1e15, 'g');
      expect(Math.abs(integral / power.powerGeVPerSecond - 1)).toBeLessThan(5e-3);
    }
    const dark = spectra.species[2];
    for (const [i, e] of energiesGeV.entries()) if (e <= 0.01) expect(dark.perGeVPerSecond[i]).toBe(0);
  });
});
