import { describe, expect, test } from 'vitest';
import { run } from './helpers.js';

describe('penumbra evolve', () => {
  test('prints the lifetime and a track with mass falling and a* falling (default content)', async () => {
    const r = await run('evolve', '--a', '0.99', '--mass', '1e15', '--unit', 'g', '--json');
    expect(r.code).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.lifetimeSeconds).toBeGreaterThan(0);
    expect(j.track.length).toBeGreaterThan(10);
    for (let i = 1; i < j.track.length; i++) {
      expect(j.track[i].mass).toBeLessThan(j.track[i - 1].mass);
      expect(j.track[i].aStar).toBeLessThanOrEqual(j.track[i - 1].aStar);
    }
    expect(j.crossings.map((c: { aStar: number }) => c.aStar)).toEqual([0.5, 0.1]);
  });
  test('Schwarzschild lifetime with photons, gravitons and two neutrino species ≈ 8.66e-27 (M/1 g)³ s (Page 1976, value from memory) to 2e-3', async () => {
    const j = JSON.parse(
      (
        await run(
          'evolve',
          '--a',
          '0',
          '--mass',
          '1',
          '--unit',
          'g',
          '--content',
          'photon,graviton,neutrino-e,neutrino-mu',
          '--json',
        )
      ).stdout,
    );
    expect(Math.abs(j.lifetimeSeconds / 8.66e-27 - 1)).toBeLessThan(2e-3);
  });
  test('without --a the hole is non-rotating: the same output as --a 0', async () => {
    const given = await run('evolve', '--a', '0', '--mass', '1e15', '--unit', 'g', '--json', '--points', '5');
    const omitted = await run('evolve', '--mass', '1e15', '--unit', 'g', '--json', '--points', '5');
    expect(omitted.code).toBe(0);
    expect(omitted.stdout).toBe(given.stdout);
  });
  test('CSV track with units in the header; unknown species and out-of-range a* exit with code 2', async () => {
    const csv = (await run('evolve', '--a', '0.5', '--csv', '--points', '5')).stdout.trim().split('\n');
    expect(csv[0]).toBe('timeSeconds [s],mass [g],aStar [1],temperatureGeV [GeV],fRelError [1],inaccurate');
    expect((await run('evolve', '--a', '0.5', '--content', 'axion')).code).toBe(2);
    expect((await run('evolve', '--a', '1.2')).code).toBe(2);
  });
  test('--tol: a lifetime within it prints as without; one whose error estimate exceeds it exits with code 3; a tol outside 1e-12 … 1e-2 (the range of every --tol) exits with code 2', async () => {
    const args = ['evolve', '--a', '0.5', '--mass', '1e15', '--unit', 'g', '--json'];
    const free = JSON.parse((await run(...args)).stdout);
    const within = await run(...args, '--tol', '0.01');
    expect(within.code).toBe(0);
    expect(JSON.parse(within.stdout).lifetimeSeconds).toBe(free.lifetimeSeconds);
    expect(free.relError).toBeGreaterThan(1e-6);
    expect((await run(...args, '--tol', '1e-6')).code).toBe(3);
    for (const tol of ['0.5', '0.05', '1e-13']) expect((await run(...args, '--tol', tol)).code).toBe(2);
  });
  test('--tol also holds the age-of-universe mass: a 1e20 g hole emitting photons, electrons and a user species (a 20 MeV scalar), whose lifetime meets 1e-5, exits with code 3 naming massForLifetime (that mass is known to about 1e-4)', async () => {
    const args = [
      'evolve',
      '--a',
      '0',
      '--mass',
      '1e20',
      '--unit',
      'g',
      '--content',
      'photon,electron,dark-scalar:0:1:0.02',
      '--points',
      '3',
    ];
    const free = JSON.parse((await run(...args, '--json')).stdout);
    expect(free.content.at(-1)).toEqual({ name: 'dark-scalar', spin: 0, dof: 1, massGeV: 0.02 });
    expect(free.species.map((s: { name: string }) => s.name)).toEqual(['photon', 'electron', 'dark-scalar']);
    expect(free.relError).toBeLessThan(1e-5);
    expect(free.massForAgeOfUniverse.relError).toBeGreaterThan(1e-5);
    const r = await run(...args, '--tol', '1e-5');
    expect(r.code).toBe(3);
    expect(r.stderr).toMatch(/massForLifetime: the mass's error estimate exceeds tol = 0\.00001/);
  });
  test('text: the energy each species carries over the whole life, one row per species, the shares adding up to 1 (to the printed 6 digits)', async () => {
    const text = (
      await run('evolve', '--a', '0', '--mass', '1e15', '--unit', 'g', '--content', 'photon,graviton', '--points', '3')
    ).stdout;
    const block = text.split('energy emitted over the life:')[1].split('final ')[0].trim().split('\n');
    expect(block[1].trim().split(/\s+/)).toEqual(['species', 'E', '[GeV]', 'share']);
    const rows = block.slice(2).map((line) => line.trim().split(/\s+/));
    expect(rows.map((r) => r[0])).toEqual(['photon', 'graviton']);
    expect(Math.abs(rows.reduce((t, r) => t + Number(r[2]), 0) - 1)).toBeLessThan(2e-6);
  });
  test('final stages: the last 1 s releases the mass M_τ with M_τ³ × (lifetime per g³) = 1 s to 1e-5, species energies add up to it to 1e-9; a τ longer than the life is the whole life', async () => {
    const j = JSON.parse(
      (await run('evolve', '--a', '0', '--mass', '1e15', '--unit', 'g', '--final', '1,1e40', '--json')).stdout,
    );
    const [last, whole] = j.finalStages;
    const perCube = j.lifetimeSeconds / 1e45;
    expect(Math.abs((perCube * last.massGrams ** 3) / 1 - 1)).toBeLessThan(1e-5);
    const sum = last.species.reduce((t: number, s: { energyGeV: number }) => t + s.energyGeV, 0);
    expect(Math.abs(sum / last.energyGeV - 1)).toBeLessThan(1e-9);
    expect(whole.wholeLife).toBe(true);
    expect(j.energyBalance.relError).toBeLessThan(1e-9);
    expect(j.massForAgeOfUniverse.massGrams).toBeGreaterThan(1e14);
  });
  test('--spectrum: the time-integrated spectrum of the last second per species, CSV in long form with units in the header', async () => {
    const r = await run(
      'evolve',
      '--a',
      '0',
      '--mass',
      '1e12',
      '--unit',
      'g',
      '--content',
      'photon',
      '--spectrum',
      '10:1e5:3',
      '--csv',
    );
    expect(r.code).toBe(0);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toBe('energyGeV [GeV],species,perGeV [GeV^-1]');
    expect(lines).toHaveLength(4);
    for (const line of lines.slice(1)) expect(Number(line.split(',')[2])).toBeGreaterThan(0);
  });
});
