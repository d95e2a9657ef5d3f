/**
 * Content totals over species with masses (packages/emission/src/content.ts):
 * the Standard-Model registry, Mμ from the hole's physical mass, the
 * confinement rule, and the bounds that replace solves.
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '@penumbra/core';
import {
  contentTotals,
  emissionTotals,
  KNOWN_SPECIES,
  pageFunctions,
  bundledPageTable,
  resolveContent,
} from '@penumbra/emission';
import { boltzmannSpeciesBound, masslessProxyBound } from '@penumbra/emission/internal';

// CODATA 2018 (G, ħ, c, eV), written out here independently of @penumbra/kerr.
const G = 6.6743e-11;
const HBAR = 1.054571817e-34;
const C = 299792458;
const EV = 1.602176634e-19;
const mu = (holeGrams: number, massGeV: number) => (G * (holeGrams / 1000) * ((massGeV * 1e9 * EV) / C ** 2)) / (HBAR * C);

describe('the species registry', () => {
  it('counts the Standard Model degrees of freedom (photon 2, gluon 16, graviton 2, neutrinos 3 × 2, e μ τ 4 each, quarks 12 each, W± 6, Z 3, Higgs 1, π⁰ 1, π± 2)', () => {
    const sm = resolveContent(['standard-model']);
    const dof = Object.fromEntries(sm.map((s) => [s.name, s.dof]));
    expect(dof).toEqual({
      photon: 2,
      gluon: 16,
      graviton: 2,
      'neutrino-e': 2,
      'neutrino-mu': 2,
      'neutrino-tau': 2,
      electron: 4,
      muon: 4,
      tau: 4,
      up: 12,
      down: 12,
      strange: 12,
      charm: 12,
      bottom: 12,
      top: 12,
      'w-boson': 6,
      'z-boson': 3,
      higgs: 1,
      'pion-neutral': 1,
      'pion-charged': 2,
    });
  });

  it('holds the masses of S. Navas et al. (Particle Data Group), Phys. Rev. D 110, 030001 (2024) to 1e-9 relative (values from memory)', () => {
    const pdg: Record<string, number> = {
      electron: 0.51099895e-3,
      muon: 0.1056583755,
      tau: 1.77693,
      up: 2.16e-3,
      down: 4.7e-3,
      strange: 93.5e-3,
      charm: 1.273,
      bottom: 4.183,
      top: 172.57,
      'w-boson': 80.3692,
      'z-boson': 91.188,
      higgs: 125.2,
      'pion-neutral': 0.1349768,
      'pion-charged': 0.13957039,
    };
    for (const [name, m] of Object.entries(pdg)) expect(Math.abs(KNOWN_SPECIES[name].massGeV / m - 1)).toBeLessThan(1e-9);
    for (const name of ['photon', 'gluon', 'graviton', 'neutrino-e', 'neutrino-mu', 'neutrino-tau'])
      expect(KNOWN_SPECIES[name].massGeV).toBe(0);
  });

  it('takes user species {name, spin, dof, massGeV} and refuses a negative mass naming content[i].massGeV', () => {
    const [d] = resolveContent([{ name: 'dark-photon', spin: 1, dof: 3, massGeV: 0.01 }]);
    expect(d).toEqual({ name: 'dark-photon', spin: 1, dof: 3, massGeV: 0.01 });
    expect(() => resolveContent([{ name: 'x', spin: 0, dof: 1, massGeV: -1 }])).toThrow(
      expect.objectContaining({ parameter: 'content[0].massGeV' }),
    );
  });

  it('the massless Page table refuses a massive species (InputError naming content[0]) instead of emitting it massless', () => {
    expect(() => pageFunctions({ table: bundledPageTable(), content: ['electron'] })).toThrow(InputError);
  });
});

describe('content totals with masses', () => {
  it('Mμ = G M m/(ħc) from the physical mass (CODATA 2018) to 1e-9, and a species with Mμ ≈ 40 is Boltzmann-negligible with a bound below 1e-100 of the total', () => {
    const r = contentTotals(
      { hole: { a: 0 }, content: ['photon', 'muon'], physicalMass: { value: 1e17, unit: 'g' } },
      { tol: 1e-3 },
    );
    const muon = r.species[1];
    expect(Math.abs(muon.fieldMass / mu(1e17, KNOWN_SPECIES.muon.massGeV) - 1)).toBeLessThan(1e-9);
    expect(muon.status).toBe('boltzmann-negligible');
    expect(muon.power).toBe(0);
    expect(muon.errors.power).toBeLessThan(1e-100 * r.power.value);
  });

  it('confinement (common practice, no source): at 1e17 g (T_H ≈ 0.1 MeV) gluons are not emitted; at 1e13 g (T_H ≈ 1 GeV) they are and pions are not', () => {
    const cold = contentTotals(
      { hole: { a: 0 }, content: ['gluon', 'pion-neutral'], physicalMass: { value: 1e17, unit: 'g' } },
      { tol: 1e-3 },
    );
    expect(cold.species.map((s) => s.status)).toEqual(['confinement', 'boltzmann-negligible']);
    const hot = contentTotals(
      { hole: { a: 0 }, content: ['gluon', 'pion-neutral'], physicalMass: { value: 1e13, unit: 'g' } },
      { tol: 1e-3 },
    );
    expect(hot.species.map((s) => s.status)).toEqual(['solved', 'confinement']);
    expect(hot.diagnostics.temperatureGeV).toBeGreaterThan(0.3);
  });

  it('a nearly massless species (Mμ ≈ 2e-5) takes the massless per-dof totals, its bound Mμ + 200 Mμ² in the error', () => {
    const r = contentTotals(
      {
        hole: { a: 0 },
        content: [{ name: 'light', spin: 0, dof: 2, massGeV: 5.2e-6 }],
        physicalMass: { value: 1e15, unit: 'g' },
      },
      { tol: 1e-3 },
    );
    const s = r.species[0];
    expect(s.status).toBe('massless-limit');
    const massless = emissionTotals({ hole: { a: 0 }, field: { spin: 0 } }, { tol: 1e-3 });
    expect(s.power).toBeCloseTo(2 * massless.power.value, 15);
    expect(s.errors.power).toBeGreaterThanOrEqual(2 * masslessProxyBound(s.fieldMass) * massless.power.value);
  });

  it('refuses a massive species without the physical mass, naming physicalMass', () => {
    expect(() => contentTotals({ hole: { a: 0 }, content: ['electron'] })).toThrow(
      expect.objectContaining({ parameter: 'physicalMass' }),
    );
  });

  it('the Boltzmann bound is above the solved massive-scalar totals at Mμ = 0.5 (a = 0.5): number rate and power', () => {
    const exact = emissionTotals({ hole: { a: 0.5 }, field: { spin: 0, mass: 0.5 } }, { tol: 1e-2 });
    const b = boltzmannSpeciesBound(0.5, 0.5);
    expect(b.number).toBeGreaterThan(exact.numberRate.value);
    expect(b.power).toBeGreaterThan(exact.power.value);
  });
});
