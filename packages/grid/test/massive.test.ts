import { afterAll, describe, expect, test } from 'vitest';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { emissionSpectrum, KNOWN_SPECIES } from '@penumbra/emission';
import {
  canonicalGridJson,
  computeTask,
  gridHash,
  gridTasks,
  mergeRuns,
  readTableFile,
  runGrid,
  validateGrid,
} from '@penumbra/grid';
import { outputDirProblems, taskMessage } from '@penumbra/grid/internal';
import { problemsOf, tableFiles } from './support.js';

const work = mkdtempSync(join(tmpdir(), 'penumbra-massive-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));

const sha = (text: string) => createHash('sha256').update(text).digest('hex');

// The grid of fixtures/massless-grid.sha256.json: two massless spins, every table, 0.3 s of CPU in this thread.
const masslessGrid = {
  fieldSpins: [0, '1/2'],
  holeA: [0.5],
  frequencies: { values: [0.1, 0.4] },
  tolerance: 1e-4,
  quantities: ['gamma', 'crossSection', 'spectra'],
  chunkSize: 2,
};

describe('grids written before masses and species', () => {
  test('a massless grid writes the same bytes as before (SHA-256 of every file against the fixture written by the earlier grid package), and `fields` of massless spins is the same grid', async () => {
    const fixture = JSON.parse(readFileSync(new URL('./fixtures/massless-grid.sha256.json', import.meta.url), 'utf8')) as {
      files: Record<string, string>;
    };
    const out = join(work, 'massless');
    await runGrid({ grid: validateGrid(masslessGrid), out, workers: 0 });
    const files = tableFiles(out);
    expect(Object.fromEntries(Object.entries(files).map(([name, text]) => [name, sha(text)]))).toEqual(fixture.files);

    const { fieldSpins, ...rest } = masslessGrid;
    const asFields = validateGrid({ ...rest, fields: [0, { spin: '1/2', mass: 0 }] });
    expect(canonicalGridJson(asFields)).toBe(canonicalGridJson(validateGrid(masslessGrid)));
    expect(fieldSpins).toHaveLength(2);
  });
});

describe('grid descriptions with massive fields and species', () => {
  const base = { holeA: [0], frequencies: { values: [0.1, 0.5] }, quantities: ['crossSection'] };

  test('masses and species enter the identity: another mass, another hole mass or another species is another hash', () => {
    const massive = validateGrid({ ...base, fields: [{ spin: 0, mass: 0.2 }] });
    expect(canonicalGridJson(massive)).toMatch(/^\{"fields":\[\{"spin":0,"mass":0.2\}\],"holeA"/);
    expect(gridHash(validateGrid({ ...base, fields: [{ spin: 0, mass: 0.3 }] }))).not.toBe(gridHash(massive));
    expect(gridHash(validateGrid({ ...base, fieldSpins: [0] }))).not.toBe(gridHash(massive));

    const species = { ...base, species: ['electron'], holeMass: { value: 1e16, unit: 'g' } };
    const grid = validateGrid(species);
    expect(JSON.parse(canonicalGridJson(grid))).toMatchObject({
      species: [{ name: 'electron', spin: 0.5, dof: 4, massGeV: KNOWN_SPECIES.electron.massGeV }],
      holeMass: { value: 1e16, unit: 'g' },
    });
    // The canonical text reads back as the same grid (grid.json of a resumed run).
    expect(canonicalGridJson(validateGrid(JSON.parse(canonicalGridJson(grid))))).toBe(canonicalGridJson(grid));
    expect(gridHash(validateGrid({ ...species, holeMass: { value: 1e13, unit: 'kg' } }))).not.toBe(gridHash(grid));
    expect(gridHash(validateGrid({ ...species, species: [{ name: 'electron', dof: 2 }] }))).not.toBe(gridHash(grid));
  });

  test("a species' Mμ is G M m/(ħ c) from CODATA 2018 constants (G, ħ, c, e; CODATA 2018 recommended values), for g, kg and solar masses alike", () => {
    // ħ = h/2π with h exact in the 2019 SI (6.62607015e-34 J s).
    const [G, hbar, c, e] = [6.6743e-11, 6.62607015e-34 / (2 * Math.PI), 299792458, 1.602176634e-19];
    const mu = (kg: number, GeV: number) => (G * kg * GeV * 1e9 * e) / (hbar * c ** 3);
    const one = (holeMass: object) =>
      validateGrid({ ...base, species: [{ name: 'dark-scalar', spin: 0, dof: 1, massGeV: 0.01 }], holeMass }).fields[0];
    expect(one({ value: 1e16, unit: 'g' }).mass / mu(1e13, 0.01) - 1).toBeCloseTo(0, 12);
    expect(one({ value: 1e13, unit: 'kg' }).mass / mu(1e13, 0.01) - 1).toBeCloseTo(0, 12);
    // 1e-20 solar masses: the IAU 2015 nominal GM☉ / G is close to 1.98841e30 kg (from memory); 1e-4 relative is loose enough.
    expect(one({ value: 1e-20, unit: 'msun' }).mass / mu(1.98841e10, 0.01) - 1).toBeLessThan(1e-4);
    expect(one({ value: 1e16, unit: 'g' })).toMatchObject({ spin: 0, species: { name: 'dark-scalar', dof: 1 } });
  });

  test('every problem is listed at once: bad masses, a massive spin 2, unknown keys, unknown and too heavy species, a missing or a stray hole mass, two field keys', () => {
    const problems = problemsOf({
      ...base,
      fields: [
        { spin: 0, mass: -1 },
        { spin: 2, mass: 0.1 },
        { spin: 1, mass: 0.1, charge: 1 },
        { spin: 0, mass: 40 },
      ],
      holeMass: { value: 1, unit: 'g' },
    });
    expect(problems).toEqual([
      'holeMass: applies to species only (give the mass of a field as Mμ in fields)',
      'fields[0].mass: expected Mμ with 0 ≤ Mμ < 30 (units of 1/M), got -1',
      'fields[1].mass: spin 2 takes mass 0 only (no massive spin-2 route), got 0.1',
      "fields[2]: unknown key 'charge' (allowed: spin, mass)",
      'fields[3].mass: expected Mμ with 0 ≤ Mμ < 30 (units of 1/M), got 40',
    ]);
    const species = problemsOf({
      ...base,
      species: ['photon', 'axion', { name: 'dark', spin: 3, dof: 1 }, 'top', { name: 'x', spin: 0, dof: 1, color: 3 }, 'photon'],
      holeMass: { value: 1e18, unit: 'g' },
    });
    expect(species).toHaveLength(5);
    expect(species[0]).toMatch(/^species\[1\]: expected one of photon, .*got 'axion'/);
    expect(species[1]).toMatch(/^species\[2\]\.spin: expected one of 0, 1\/2, 1, 2, got 3/);
    // top, 172.57 GeV, on a 1e18 g hole: Mμ ≈ 6.5e5, far above the solvers' range; the message names the key and the largest mass.
    expect(species[2]).toBe(
      'species[3].massGeV: top of 172.57 GeV on a hole of 1.00e+18 g has Mμ = 6.49e+5; allowed 0 ≤ Mμ < 30, i.e. massGeV < 0.00797 on this hole',
    );
    expect(species[3]).toBe("species[4]: unknown key 'color' (allowed: name, spin, dof, massGeV)");
    expect(species[4]).toBe("species[5]: species 'photon' appears twice");
    expect(problemsOf({ ...base, species: ['photon'] })).toEqual([
      'holeMass: missing; species need the hole\'s mass to set Mμ (e.g. {"value": 1e15, "unit": "g"})',
    ]);
    expect(problemsOf({ ...base, species: ['photon'], holeMass: { value: 1e15, unit: 'lb' } })).toEqual([
      "holeMass.unit: expected one of g, kg, msun, got 'lb'",
    ]);
    expect(problemsOf({ ...base, fieldSpins: [0], fields: [0] })).toEqual(['give one of fieldSpins, fields, not both']);
    expect(problemsOf({ ...base, fields: [0, { spin: 0 }] })).toEqual(['fields[1]: {"spin":0} appears twice']);
  });
});

describe('massive fields through the tables', () => {
  test('below threshold (Mω ≤ Mμ) every table has a failed row saying no wave reaches infinity; the run completes and lists them', async () => {
    const out = join(work, 'threshold');
    const grid = validateGrid({
      fields: [{ spin: 0, mass: 0.2 }],
      holeA: [0],
      frequencies: { values: [0.1, 0.2, 0.5] },
      tolerance: 1e-4,
      quantities: ['gamma', 'crossSection', 'spectra'],
    });
    const run = await runGrid({ grid, out, workers: 0 });
    expect(run.complete).toBe(true);
    expect(run.summary!.failed).toEqual({ modes: 2, crossSection: 2, spectra: 2 });
    for (const file of ['modes.csv', 'cross-section.csv', 'spectra.csv']) {
      const lines = readFileSync(join(out, file), 'utf8').trim().split('\n');
      expect(lines[0]).toMatch(/^spin \[1\],fieldMass \[1\/M\],a \[M\],omega \[1\/M\],/);
      const below = lines.slice(1).filter((l) => Number(l.split(',')[3]) <= 0.2);
      expect(below.length).toBeGreaterThanOrEqual(2);
      for (const l of below) expect(l).toMatch(/invalid-input,.*no wave reaches infinity/);
    }
    // σ → 27πM² for ω ≫ μ at a = 0 (geometric capture; Misner, Thorne & Wheeler, Gravitation, 1973): 15 % at Mω = 0.5, Mμ = 0.2.
    const sigma = Number(readFileSync(join(out, 'cross-section.csv'), 'utf8').trim().split('\n')[3].split(',')[5]);
    expect(Math.abs(sigma / (27 * Math.PI) - 1)).toBeLessThan(0.15);
  });

  test('a massive Dirac mode is listed per sign of κ and a massive vector per polarisation (monopole at l = 0); Dirac Γ lies in [0, 1] (no superradiance for fermions: Unruh, Phys. Rev. Lett. 31, 1265 (1973), from memory); a massive vector on a spinning hole is refused naming hole.a', () => {
    const grid = validateGrid({
      fields: [
        { spin: '1/2', mass: 0.2 },
        { spin: 1, mass: 0.2 },
      ],
      holeA: [0.5],
      frequencies: { values: [0.5] },
      l: { max: 1 },
      tolerance: 1e-4,
    });
    const [dirac, vector] = gridTasks(grid).map((t) => computeTask(taskMessage(grid, t)).rows.modes!);
    expect(dirac.map((r) => `${r.l},${r.m},${r.kappaSign}`)).toEqual(['0.5,-0.5,1', '0.5,-0.5,-1', '0.5,0.5,1', '0.5,0.5,-1']);
    for (const r of dirac) expect(r.gamma as number).toBeGreaterThanOrEqual(0);
    for (const r of dirac) expect(r.gamma as number).toBeLessThanOrEqual(1);
    expect(vector.map((r) => `${r.l},${r.polarization}`).slice(0, 4)).toEqual(['0,monopole', '1,odd', '1,even-1', '1,even-2']);
    expect(vector.every((r) => r.status === 'invalid-input' && /^invalid hole\.a = 0\.5/.test(String(r.message)))).toBe(true);
  });

  test('with l auto, the mode table of a massive Dirac field at a = 0 lists both κ signs for every m, and π/(ω² − μ²) times half their Γ sum is σ to 1e-12 relative (σ averages the two signs)', () => {
    const [omega, mu] = [0.5, 0.2];
    const r = computeTask({
      index: 0,
      s: 0.5,
      fieldMass: mu,
      a: 0,
      omega,
      l: 'auto',
      tolerance: 1e-4,
      quantities: ['gamma', 'crossSection'],
    });
    const modes = r.rows.modes!;
    expect(modes.slice(0, 4).map((row) => `${row.l},${row.m},${row.kappaSign}`)).toEqual([
      '0.5,-0.5,1',
      '0.5,-0.5,-1',
      '0.5,0.5,1',
      '0.5,0.5,-1',
    ]);
    const sum = modes.reduce((acc, row) => acc + (row.gamma as number) / 2, 0);
    const sigma = r.rows.crossSection![0].sigma as number;
    expect(Math.abs(((Math.PI / (omega ** 2 - mu ** 2)) * sum) / sigma - 1)).toBeLessThan(1e-12);
  });
});

describe('species grids', () => {
  const speciesGrid = {
    species: ['electron', { name: 'dark-scalar', spin: 0, dof: 1, massGeV: 0.01 }],
    holeMass: { value: 1e16, unit: 'g' },
    holeA: [0.5],
    frequencies: { values: [0.2, 0.5] },
    tolerance: 1e-4,
    quantities: ['spectra'],
    chunkSize: 1,
  };

  test("spectra rows carry the species, its dof and Mμ, and the species' rates: dof × emissionSpectrum's per-dof values to 1e-12", async () => {
    const out = join(work, 'species');
    const grid = validateGrid(speciesGrid);
    await runGrid({ grid, out, workers: 0 });
    const table = readTableFile(out);
    expect(table.tables.spectra!.columns.slice(0, 6).map((c) => c.name)).toEqual([
      'species',
      'dof',
      'spin',
      'fieldMass',
      'a',
      'omega',
    ]);
    const rows = table.tables.spectra!.rows;
    expect(rows.map((r) => `${r.species},${r.dof},${r.status}`)).toEqual([
      'electron,4,success',
      'electron,4,success',
      'dark-scalar,1,invalid-input',
      'dark-scalar,1,success',
    ]);
    const electron = emissionSpectrum(
      { hole: { a: 0.5 }, field: { spin: 0.5, mass: grid.fields[0].mass }, grid: [0.2] },
      { tol: 1e-4 },
    ).points[0];
    expect(Math.abs((rows[0].number as number) / (4 * electron.number) - 1)).toBeLessThan(1e-12);
    expect(Math.abs((rows[0].energy as number) / (4 * electron.energy) - 1)).toBeLessThan(1e-12);
  });

  test('shards of a species grid merge into the bytes of one run; a directory of the same grid with another hole mass is refused', async () => {
    const grid = validateGrid(speciesGrid);
    for (const k of [1, 2]) await runGrid({ grid, out: join(work, `shard-${k}`), workers: 0, shard: { k, n: 2 } });
    mergeRuns([join(work, 'shard-1'), join(work, 'shard-2')], join(work, 'merged'));
    const single = join(work, 'species-single');
    await runGrid({ grid, out: single, workers: 0 });
    expect(tableFiles(join(work, 'merged'))).toEqual(tableFiles(single));
    const other = validateGrid({ ...speciesGrid, holeMass: { value: 2e16, unit: 'g' } });
    expect(outputDirProblems(single, other).join('\n')).toMatch(/different grid|holds grid/);
  });
});
