import { afterAll, beforeAll, describe, expect, test } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureBuilt } from '../../grid/test/support.js';
import { run } from './helpers.js';

let work = '';
let buildProblem: string | undefined;
beforeAll(() => {
  buildProblem = ensureBuilt();
  work = mkdtempSync(join(tmpdir(), 'penumbra-table-species-'));
}, 180_000);
afterAll(() => rmSync(work, { recursive: true, force: true }));

describe('penumbra table with species and massive fields', () => {
  test('--species (a registry name and a user NAME:SPIN:DOF:MASS_GEV) with --mass/--unit writes spectra rows per species; a point below threshold is a listed invalid-input row, exit 0', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const out = join(work, 'species');
    const r = await run(
      'table',
      '--species',
      'electron,dark:0:1:0.01',
      '--mass',
      '1e16',
      '--unit',
      'g',
      '--a',
      '0.5',
      '--omega',
      '0.2,0.5',
      '--quantities',
      'spectra',
      '--tol',
      '1e-4',
      '--workers',
      '1',
      '--out',
      out,
      '--quiet',
    );
    expect(r.code, r.stderr).toBe(0);
    const lines = readFileSync(join(out, 'spectra.csv'), 'utf8').trim().split('\n');
    expect(lines[0]).toMatch(/^species,dof \[1\],spin \[1\],fieldMass \[1\/M\],a \[M\],omega \[1\/M\],status,/);
    expect(lines.slice(1).map((l) => l.split(',').slice(0, 2).concat(l.split(',')[6]).join(','))).toEqual([
      'electron,4,success',
      'electron,4,success',
      'dark,1,invalid-input',
      'dark,1,success',
    ]);
    expect(r.stderr).toMatch(/invalid-input spectra: dark spin=0 Mμ=0\.376\d* a=0\.5 ω=0\.2: .*no wave reaches infinity/);
    // the spectra plot draws one series per species, named by it (not one per spin)
    const plot = await run('plot', out, '--quantity', 'spectra', '--out', join(work, 'species.svg'));
    expect(plot.code, plot.stderr).toBe(0);
    const svg = readFileSync(join(work, 'species.svg'), 'utf8');
    expect(svg).toContain('electron (s = 1/2)');
    expect(svg).toContain('dark (s = 0)');
  });

  test('penumbra plot reads a massive-field mode table (kappaSign and polarization empty on the rows of other fields)', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const out = join(work, 'fields');
    const grid = ['--fields', '0:0.2,1/2:0.2', '--a', '0', '--omega', '0.1,0.5', '--l', '0:1', '--tol', '1e-4'];
    const r = await run('table', ...grid, '--workers', '1', '--out', out, '--quiet');
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(join(out, 'modes.csv'), 'utf8').split('\n')[0]).toBe(
      'spin [1],fieldMass [1/M],a [M],omega [1/M],l [1],m [1],kappaSign,status,gamma [1],relError [1],steps,rhsEvaluations,message',
    );
    const plot = await run('plot', out, '--spin', '1/2', '--out', join(work, 'fields.svg'));
    expect(plot.code, plot.stderr).toBe(0);
    // one of the two κ signs is drawn, and the figure says which and that the other is not
    const svg = readFileSync(join(work, 'fields.svg'), 'utf8');
    expect(svg).toMatch(/Mμ = 0\.2, κ sign [+−] \(1 other field of this spin in the data not drawn\)/);
  });

  test('bad --fields, --species and --unit are all reported at once with exit code 2, nothing written', async (context) => {
    if (buildProblem) context.skip(buildProblem);
    const r = await run(
      'table',
      '--fields',
      '0:0.2,1/2:x',
      '--species',
      'top',
      '--unit',
      'lb',
      '--a',
      '0',
      '--omega',
      '0.5',
      '--out',
      join(work, 'bad'),
    );
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/give one of fields, species, not both/);
    expect(r.stderr).toMatch(/holeMass\.unit: expected one of g, kg, msun, got 'lb'/);
    expect(r.stderr).toMatch(/fields\[1\]\.mass: expected Mμ with 0 ≤ Mμ < 30 \(units of 1\/M\), got 'x'/);
  });
});
