/**
 * `penumbra emission --content`: totals over species with per-species rows in
 * physical units, and primary spectra per species in GeV⁻¹ s⁻¹ against E in GeV.
 */
import { describe, expect, test } from 'vitest';
import { contentTotals, toPhysicalRates } from '@penumbra/emission';
import { parseContentList } from '@penumbra/cli/internal';
import { run } from './helpers.js';

const KNOWN = ['photon', 'graviton', 'electron', 'gluon', 'standard-model'];

describe('penumbra emission --content', () => {
  test('the totals row equals the library contentTotals converted with toPhysicalRates (to 1e-12), with one row per species adding up to it', async () => {
    const r = await run('emission', '--a', '0', '--mass', '1e17', '--unit', 'g', '--content', 'photon,graviton,muon', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(json.species.map((s: { species: string }) => s.species)).toEqual(['photon', 'graviton', 'muon']);
    expect(json.species[2].status).toBe('boltzmann-negligible');
    const lib = contentTotals(
      { hole: { a: 0 }, content: ['photon', 'graviton', 'muon'], physicalMass: { value: 1e17, unit: 'g' } },
      { tol: 1e-3 },
    );
    const p = toPhysicalRates({ numberRate: lib.numberRate.value, power: lib.power.value, torque: lib.torque.value }, 1e17, 'g');
    expect(Math.abs(json.total.powerGeVPerSecond / p.powerGeVPerSecond - 1)).toBeLessThan(1e-12);
    // the sum over the species rows is the total row
    for (const key of ['numberRatePerSecond', 'powerGeVPerSecond'])
      expect(
        Math.abs(json.species.reduce((t: number, s: Record<string, number>) => t + s[key], 0) / json.total[key] - 1),
      ).toBeLessThan(1e-12);
  });

  test('CSV of the totals carries units in the header, a row per species and the total', async () => {
    const csv = (await run('emission', '--a', '0', '--mass', '1e17', '--unit', 'g', '--content', 'photon', '--csv')).stdout
      .trim()
      .split('\n');
    expect(csv[0]).toBe(
      'species,spin [1],dof [1],massGeV [GeV],fieldMass [1/M],status,numberRatePerSecond [s^-1],powerGeVPerSecond [GeV s^-1],torqueHbarPerSecond [hbar s^-1],relError [1],inaccurate',
    );
    expect(csv).toHaveLength(3);
    expect(csv[2].startsWith('total,')).toBe(true);
  });

  test('--energy adds the primary spectra table: species, energyGeV [GeV], perGeVPerSecond [GeV^-1 s^-1]; zero at and below E = m', async () => {
    const csv = (
      await run(
        'emission',
        '--a',
        '0',
        '--mass',
        '1e16',
        '--unit',
        'g',
        '--content',
        'x:0:1:0.002',
        '--energy',
        '0.001,0.004',
        '--csv',
        '--tol',
        '1e-2',
      )
    ).stdout
      .trim()
      .split('\n');
    expect(csv[0]).toBe('species,energyGeV [GeV],perGeVPerSecond [GeV^-1 s^-1],relError [1],inaccurate');
    expect(csv).toHaveLength(3);
    expect(Number(csv[1].split(',')[2])).toBe(0);
    expect(Number(csv[2].split(',')[2])).toBeGreaterThan(0);
  });

  test('an unknown species is a usage error with a did-you-mean; --content with --spin is refused', async () => {
    const r = await run('emission', '--a', '0', '--mass', '1e15', '--unit', 'g', '--content', 'photon,electon');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/did you mean electron\?/);
    const both = await run('emission', '--a', '0', '--spin', '1', '--mass', '1e15', '--unit', 'g', '--content', 'photon');
    expect(both.code).toBe(2);
  });

  test('parseContentList reads names and NAME:SPIN:DOF[:MASS_GEV] (spin 1/2 accepted, mass 0 when omitted)', () => {
    expect(parseContentList('--content', 'photon,heavy:1/2:4:2.5,dark:1:3', KNOWN)).toEqual([
      'photon',
      { name: 'heavy', spin: 0.5, dof: 4, massGeV: 2.5 },
      { name: 'dark', spin: 1, dof: 3, massGeV: 0 },
    ]);
    expect(() => parseContentList('--content', 'x:3:1', KNOWN)).toThrow(/SPIN/);
    expect(() => parseContentList('--content', 'x:0:-1', KNOWN)).toThrow(/DOF/);
  });
});
