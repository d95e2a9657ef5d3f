import { describe, expect, test } from 'vitest';
import { greybody } from '@penumbra/flux';
import { run } from './helpers.js';

describe('penumbra greybody', () => {
  test('prints one JSON object with the documented keys, equal to the library result', async () => {
    const r = await run('greybody', '--spin', '1', '--l', '1', '--m', '1', '--a', '0.9', '--omega', '0.3', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    for (const key of ['spin', 'l', 'm', 'a', 'omega', 'gamma', 'reflection', 'residual', 'relError', 'diagnostics']) {
      expect(json).toHaveProperty(key);
    }
    expect(json.gamma).toBe(greybody({ hole: { a: 0.9 }, mode: { field: { spin: 1 }, l: 1, m: 1 }, omega: 0.3 }).gamma);
    expect(json.diagnostics).toHaveProperty('rhsEvaluations');
  });
  test('--field-mass: a massive scalar prints the massless keys plus fieldMass, equal to the library; --field-mass 0 prints the massless output byte for byte', async () => {
    const args = ['greybody', '--spin', '0', '--l', '1', '--m', '1', '--a', '0.9', '--omega', '0.4'];
    const massive = await run(...args, '--field-mass', '0.3', '--json');
    expect(massive.code).toBe(0);
    const json = JSON.parse(massive.stdout);
    const massless = JSON.parse((await run(...args, '--json')).stdout);
    expect(Object.keys(json).filter((k) => k !== 'fieldMass')).toEqual(Object.keys(massless));
    expect(json.fieldMass).toBe(0.3);
    expect(json.gamma).toBe(
      greybody({ hole: { a: 0.9 }, mode: { field: { spin: 0, mass: 0.3 }, l: 1, m: 1 }, omega: 0.4 }).gamma,
    );
    expect((await run(...args, '--field-mass', '0', '--json')).stdout).toBe((await run(...args, '--json')).stdout);
  });
  test('--field-mass with --field-mass-unit MeV and a hole mass converts μc² to Mμ = GMμc²/(ħc³) (CODATA 2018 G, h, c, eV) to 1e-12, and needs --mass', async () => {
    const args = ['greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omega', '0.5'];
    const r = await run(...args, '--field-mass', '135', '--field-mass-unit', 'MeV', '--mass', '1e14', '--unit', 'g', '--json');
    expect(r.code).toBe(0);
    const [G, hbar, c, eV] = [6.6743e-11, 6.62607015e-34 / (2 * Math.PI), 299792458, 1.602176634e-19];
    const expected = (G * 1e11 * 135e6 * eV) / (hbar * c ** 3);
    expect(Math.abs(JSON.parse(r.stdout).fieldMass / expected - 1)).toBeLessThan(1e-12);
    const missing = await run(...args, '--field-mass', '135', '--field-mass-unit', 'MeV');
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/--mass/);
  });
  test('--field-mass refuses ω ≤ μ (no wave reaches infinity) and a massive field of spin 2 (no massive route), naming the parameter', async () => {
    const below = await run(
      'greybody',
      '--spin',
      '0',
      '--l',
      '1',
      '--m',
      '1',
      '--a',
      '0.9',
      '--omega',
      '0.25',
      '--field-mass',
      '0.3',
    );
    expect(below.code).not.toBe(0);
    expect(below.stderr).toMatch(/omega/);
    expect(below.stderr).toMatch(/no wave reaches infinity/);
    const vector = await run(
      'greybody',
      '--spin',
      '2',
      '--l',
      '2',
      '--m',
      '1',
      '--a',
      '0.9',
      '--omega',
      '0.4',
      '--field-mass',
      '0.3',
    );
    expect(vector.code).not.toBe(0);
    expect(vector.stderr).toMatch(/field\.mass/);
    const negative = await run(
      'greybody',
      '--spin',
      '0',
      '--l',
      '1',
      '--m',
      '1',
      '--a',
      '0.9',
      '--omega',
      '0.4',
      '--field-mass',
      '-1',
    );
    expect(negative.code).not.toBe(0);
  });
  test('accepts half-integer spins and mode numbers as 1/2 and 0.5', async () => {
    const a = JSON.parse(
      (await run('greybody', '--spin', '1/2', '--l', '3/2', '--m', '-1/2', '--a', '0.5', '--omega', '0.4', '--json')).stdout,
    );
    const b = JSON.parse(
      (await run('greybody', '--spin', '0.5', '--l', '1.5', '--m', '-0.5', '--a', '0.5', '--omega', '0.4', '--json')).stdout,
    );
    expect(a.gamma).toBe(b.gamma);
  });
  test('a frequency grid gives a JSON array, and CSV with units in the header', async () => {
    const j = JSON.parse(
      (await run('greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omega', '0.1:0.5:3', '--json')).stdout,
    );
    expect(j).toHaveLength(3);
    expect(j.map((x: { omega: number }) => x.omega)).toEqual([0.1, 0.1 + (0.5 - 0.1) / 2, 0.5]);
    const csv = (await run('greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omega', '0.1:0.5:3', '--csv')).stdout
      .trim()
      .split('\n');
    expect(csv[0]).toBe(
      'spin [1],l [1],m [1],a [M],omega [1/M],gamma [1],log10Gamma [1],reflection [1],residual [1],relError [1],k [1/M],superradiant,matchRadius [M],rhsEvaluations,inaccurate',
    );
    expect(csv).toHaveLength(4);
    // Every CSV column is a JSON key (matchRadius and rhsEvaluations of the diagnostics) with the same value.
    csv[0].split(',').forEach((header, i) => {
      const name = header.replace(/ \[.*\]$/, '');
      const value = name in j[1] ? j[1][name] : j[1].diagnostics[name];
      expect(csv[2].split(',')[i]).toBe(String(value));
    });
  });
  test('refuses l < s with one readable line and exit code 2', async () => {
    const r = await run('greybody', '--spin', '2', '--l', '1', '--m', '0', '--a', '0.5', '--omega', '0.3');
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^penumbra: .*l/);
  });
  test('refuses |a| > M and ω ≤ 0 with exit code 2', async () => {
    expect((await run('greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '1.2', '--omega', '0.3')).code).toBe(2);
    expect((await run('greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0.5', '--omega', '0')).code).toBe(2);
  });
});

describe('penumbra cross-section', () => {
  test('CSV headers are the keys of the JSON rows, with units', async () => {
    const args = ['cross-section', '--spin', '0', '--a', '0', '--omega', '0.5', '--tol', '1e-4'];
    const json = JSON.parse((await run(...args, '--json')).stdout);
    const csv = (await run(...args, '--csv')).stdout.trim().split('\n');
    expect(csv[0]).toBe('omega [1/M],sigma [M^2],lMax [1],droppedBound [M^2],relError [1],modes,inaccurate');
    expect(csv[1]).toBe(
      ['omega', 'sigma', 'lMax', 'droppedBound', 'relError', 'modes', 'inaccurate'].map((k) => String(json[0][k])).join(','),
    );
  });

  test('s = 0 at a = 0 and Mω = 2 is within 5 % of the capture cross-section 27πM² (Misner, Thorne & Wheeler 1973)', async () => {
    const j = JSON.parse((await run('cross-section', '--spin', '0', '--a', '0', '--omega', '2', '--json')).stdout);
    expect(Math.abs(j[0].sigma / (27 * Math.PI) - 1)).toBeLessThan(0.05);
  });
});

describe('penumbra demo', () => {
  test('prints the demo hole a = 0.7 M and greybody factors of all four fields with residuals below 1e-8', async () => {
    const r = await run('demo', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.stdout);
    expect(json.hole.rPlus).toBe(1 + Math.sqrt(0.51));
    const spins = new Set(json.greybody.map((g: { spin: number }) => g.spin));
    expect([...spins].sort()).toEqual([0, 0.5, 1, 2]);
    for (const g of json.greybody) expect(g.residual).toBeLessThan(1e-8);
    const text = (await run('demo')).stdout;
    expect(text).toContain('a = 0.7 M');
    expect(text).toContain('graviton');
  });
});
