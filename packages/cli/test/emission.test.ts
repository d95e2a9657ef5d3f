import { describe, expect, test } from 'vitest';
import { CODATA2018 } from '@penumbra/kerr';
import { emissionTotals } from '@penumbra/emission';
import { run } from './helpers.js';

describe('penumbra emission', () => {
  test('prints totals per dof with numberRate, power, torque and relError, equal to the library result', async () => {
    const r = await run('emission', '--a', '0', '--spin', '1', '--tol', '1e-4', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    for (const key of ['numberRate', 'power', 'torque']) {
      expect(json[key]).toHaveProperty('value');
      expect(json[key]).toHaveProperty('relError');
    }
    const lib = emissionTotals({ hole: { a: 0 }, field: { spin: 1 } }, { tol: 1e-4 });
    expect(json.power.value).toBe(lib.power.value);
    // photons: 2 dof × P ≈ 3.36e-5/M² (Page, Phys. Rev. D 13, 198 (1976), value from memory), three figures
    expect(Math.abs((2 * json.power.value) / 3.36e-5 - 1)).toBeLessThan(2e-3);
  });
  test('without --a the hole is non-rotating: the same totals as --a 0', async () => {
    const given = await run('emission', '--a', '0', '--spin', '1', '--tol', '1e-3', '--json');
    const omitted = await run('emission', '--spin', '1', '--tol', '1e-3', '--json');
    expect(omitted.code).toBe(0);
    expect(omitted.stdout).toBe(given.stdout);
  });
  test('with --mass the power is also given in watts, P̂ ħc⁶/(G²M²) with CODATA 2018 constants (to 1e-12)', async () => {
    const json = JSON.parse(
      (await run('emission', '--a', '0', '--spin', '0', '--mass', '1e15', '--unit', 'g', '--tol', '1e-3', '--json')).stdout,
    );
    const { G, hbar, c } = CODATA2018;
    expect(Math.abs(json.physical.powerWatts / ((json.power.value * hbar * c ** 6) / (G * G * 1e24)) - 1)).toBeLessThan(1e-12);
  });
  test('a frequency grid adds spectrum rows; CSV carries units in the header', async () => {
    const j = JSON.parse(
      (await run('emission', '--a', '0', '--spin', '0', '--omega', '0.1:0.3:3', '--tol', '1e-3', '--json')).stdout,
    );
    expect(j.spectrum).toHaveLength(3);
    expect(j.spectrum[1].omega).toBeCloseTo(0.2, 15);
    const csv = (await run('emission', '--a', '0', '--spin', '0', '--omega', '0.1:0.3:3', '--tol', '1e-3', '--csv')).stdout
      .trim()
      .split('\n');
    expect(csv[0]).toBe('omega [1/M],number [1],energy [1/M],torque [1],relError [1],lMax [1],inaccurate');
    expect(csv).toHaveLength(4);
    const cells = csv[2].split(',');
    expect(cells).toEqual(
      ['omega', 'number', 'energy', 'torque', 'relError', 'lMax', 'inaccurate'].map((k) => String(j.spectrum[1][k])),
    );
  });
  test('the text spectrum carries every column of the JSON rows with units in the header, and E [GeV], d²N/dtdE [GeV⁻¹ s⁻¹] with --mass, each equal to the JSON value to 6 significant figures', async () => {
    const args = [
      'emission',
      '--a',
      '0.5',
      '--spin',
      '1',
      '--omega',
      '0.1:0.3:3',
      '--mass',
      '1e15',
      '--unit',
      'g',
      '--tol',
      '1e-3',
    ];
    const j = JSON.parse((await run(...args, '--json')).stdout);
    const text = (await run(...args)).stdout.split('\n');
    const head = text.findIndex((line) => line.includes('Mω'));
    for (const column of [
      'd²N/dtdω [1]',
      'd²E/dtdω [1/M]',
      'd²J/dtdω [1]',
      'rel. error',
      'l max',
      'E [GeV]',
      'd²N/dtdE [GeV⁻¹ s⁻¹]',
    ])
      expect(text[head]).toContain(column);
    const cells = text[head + 2].trim().split(/\s+/).map(Number);
    const row = j.spectrum[1];
    const expected = [row.omega, row.number, row.energy, row.torque, row.relError, row.lMax, row.energyGeV, row.perGeVPerSecond];
    for (const [i, value] of expected.entries()) expect(Math.abs(cells[i] / value - 1)).toBeLessThan(i === 4 ? 0.05 : 5e-6);
  });
  test('without --omega the CSV holds the totals, one row per quantity and unit, with the values of the JSON output', async () => {
    const json = JSON.parse((await run('emission', '--a', '0', '--spin', '0', '--tol', '1e-3', '--json')).stdout);
    const csv = (await run('emission', '--a', '0', '--spin', '0', '--tol', '1e-3', '--csv')).stdout.trim().split('\n');
    expect(csv[0]).toBe('quantity,value,unit,relError [1],inaccurate');
    expect(csv[2]).toBe(`power,${json.power.value},1/M^2,${json.power.relError},${json.power.inaccurate}`);
  });
  test('a spin list runs each spin in one process: JSON an array of the single-spin objects, CSV the single-spin rows led by the spin (consistency, common practice, no source)', async () => {
    const singles = await Promise.all(
      ['1/2', '0'].map(async (spin) =>
        JSON.parse((await run('emission', '--a', '0.3', '--spin', spin, '--tol', '1e-3', '--json')).stdout),
      ),
    );
    const both = await run('emission', '--a', '0.3', '--spin', '1/2,0', '--tol', '1e-3', '--json');
    expect(both.code).toBe(0);
    expect(JSON.parse(both.stdout)).toEqual(singles);
    const csv = (await run('emission', '--a', '0.3', '--spin', '1/2,0', '--tol', '1e-3', '--csv')).stdout.trim().split('\n');
    expect(csv[0]).toBe('spin [1],quantity,value,unit,relError [1],inaccurate');
    expect(csv).toHaveLength(7);
    expect(csv[5]).toBe(`0,power,${singles[1].power.value},1/M^2,${singles[1].power.relError},${singles[1].power.inaccurate}`);
    const bad = await run('emission', '--a', '0', '--spin', '0,', '--tol', '1e-3');
    expect(bad.code).toBe(2);
  });
  test('bad input gives one readable line and exit code 2', async () => {
    for (const argv of [
      ['emission', '--a', '0', '--spin', '3'],
      ['emission', '--a', '1.5', '--spin', '1'],
      ['emission', '--a', '0', '--spin', '1', '--tol', '0.5'],
      ['emission', '--a', '0', '--spin', '1', '--mass', '-1'],
      ['emission', '--a', '0', '--spin', '1', '--omega', '0.3:0.1:3'],
    ]) {
      const r = await run(...argv);
      expect(r.code).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
    }
  });
});
