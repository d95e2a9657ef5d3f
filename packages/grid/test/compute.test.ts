import { describe, expect, test, vi } from 'vitest';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { attempt, ConvergenceError, exactDiagnostics, MAX_L } from '@penumbra/core';

const failing = (extra: object) =>
  new ConvergenceError('greybody factor did not reach the requested accuracy', {
    ...exactDiagnostics('test double'),
    message: 'relative error 3e-4 > tol',
    errorEstimate: 3e-4,
    ...extra,
  });

// One mode of the grid refuses to converge; everything else is the real solver.
vi.mock('@penumbra/flux', async (importOriginal) => {
  const real = await importOriginal<typeof import('@penumbra/flux')>();
  const greybody = (problem: import('@penumbra/flux').GreybodyProblem, options: object) => {
    if (problem.mode.l === 1 && problem.mode.m === 1 && problem.omega === 0.3)
      throw failing({ l: 1, m: 1, relError: 3e-4, attempts: 3 });
    return real.greybody(problem, options);
  };
  return {
    ...real,
    greybody,
    tryGreybody: (problem: import('@penumbra/flux').GreybodyProblem, options: object) =>
      attempt(() => greybody(problem, options)),
    // The l-sum meets the same failing mode after the modes of lower l and m.
    absorptionCrossSection: (
      problem: import('@penumbra/flux').CrossSectionProblem,
      options: { tol: number; onMode?: (r: import('@penumbra/flux').GreybodySolution) => void },
    ) => {
      if (problem.omega !== 0.3) return real.absorptionCrossSection(problem, options);
      for (const [l, m] of [
        [0, 0],
        [1, -1],
        [1, 0],
      ]) {
        options.onMode?.(
          real.greybody(
            { hole: problem.hole, mode: { field: problem.field, l, m }, omega: problem.omega },
            { tol: options.tol, reflection: false },
          ),
        );
      }
      throw failing({ spin: problem.field.spin, l: 1, m: 1, relError: 3e-4 });
    },
  };
});

const { assembleTables, computeTask, runGrid, validateGrid } = await import('@penumbra/grid');

describe('failed modes', () => {
  test("a mode that does not converge becomes a row with status 'not-converged' and the solver's message with its diagnostics; the other modes of the point are computed", () => {
    const r = computeTask({
      index: 0,
      s: 0,
      a: 0.5,
      omega: 0.3,
      l: { min: 0, max: 1 },
      tolerance: 1e-6,
      quantities: ['gamma', 'reflection'],
    });
    const rows = r.rows.modes!;
    expect(rows.map((row) => `${row.l},${row.m},${row.status}`)).toEqual([
      '0,0,success',
      '1,-1,success',
      '1,0,success',
      '1,1,not-converged',
    ]);
    const failed = rows[3];
    expect(failed.gamma).toBeNull();
    expect(failed.reflection).toBeNull();
    expect(failed.message).toMatch(/^greybody factor did not reach the requested accuracy; diagnostics: .*"relError":0.0003/);
    expect(typeof rows[0].gamma).toBe('number');
    expect(rows[0].message).toBeNull();
  });

  test("a mode refused as input (l beyond core's MAX_L) becomes a row with status 'invalid-input' and the InputError's message", () => {
    const r = computeTask({
      index: 0,
      s: 0,
      a: 0.5,
      omega: 0.3,
      l: { min: MAX_L + 1, max: MAX_L + 1 },
      tolerance: 1e-6,
      quantities: ['gamma'],
    });
    const rows = r.rows.modes!;
    expect(rows).toHaveLength(2 * (MAX_L + 1) + 1);
    expect(rows.every((row) => row.status === 'invalid-input' && row.gamma === null)).toBe(true);
    expect(rows[0].message).toMatch(new RegExp(`^invalid mode\\.l = ${MAX_L + 1}: allowed`));
  });

  test('in the automatic l range a failing mode (from the l-sum) fails the cross-section and is listed as a failed mode row, never a number', () => {
    const r = computeTask({
      index: 0,
      s: 0,
      a: 0.5,
      omega: 0.3,
      l: 'auto',
      tolerance: 1e-6,
      quantities: ['gamma', 'crossSection'],
    });
    expect(r.rows.crossSection![0]).toMatchObject({ status: 'not-converged', sigma: null });
    const modes = r.rows.modes!;
    expect(modes.at(-1)).toMatchObject({ l: 1, m: 1, status: 'not-converged', gamma: null });
    expect(modes.slice(0, -1).every((row) => row.status === 'success' && typeof row.gamma === 'number')).toBe(true);
  });

  test('a run with a failing mode completes every other point, leaves the CSV cells empty and lists the failure in the summary', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'penumbra-grid-')), 'run');
    try {
      const grid = validateGrid({
        fieldSpins: [0],
        holeA: [0.5],
        frequencies: { values: [0.1, 0.3] },
        l: { max: 1 },
        quantities: ['gamma'],
        chunkSize: 1,
      });
      const result = await runGrid({ grid, out, workers: 0 });
      expect(result.complete).toBe(true);
      expect(result.summary!.rows.modes).toBe(8);
      expect(result.summary!.failed.modes).toBe(1);
      expect(result.summary!.failures[0]).toMatchObject({
        table: 'modes',
        spin: 0,
        omega: 0.3,
        l: 1,
        m: 1,
        status: 'not-converged',
      });
      const csv = readFileSync(join(out, 'modes.csv'), 'utf8').trim().split('\n');
      expect(csv[8]).toMatch(
        /^0,0.5,0.3,1,1,not-converged,,,,,"greybody factor did not reach the requested accuracy; diagnostics: /,
      );
    } finally {
      rmSync(join(out, '..'), { recursive: true, force: true });
    }
  });
});

describe('quantities', () => {
  test('σ_abs at Mω = 1.5 for a = 0, s = 0 lies within 5 % of the geometric-optics capture cross-section 27πM² (Misner, Thorne & Wheeler, Gravitation, 1973)', () => {
    const r = computeTask({ index: 0, s: 0, a: 0, omega: 1.5, l: 'auto', tolerance: 1e-6, quantities: ['crossSection'] });
    const sigma = r.rows.crossSection![0].sigma as number;
    expect(Math.abs(sigma / (27 * Math.PI) - 1)).toBeLessThan(0.05);
  });

  test('at a = 0 the automatic mode table repeats Γ over every m of a shell (spherical symmetry) and its Γ sum times π/ω² is σ to 1e-12 relative', () => {
    const omega = 0.4;
    const r = computeTask({ index: 0, s: 1, a: 0, omega, l: 'auto', tolerance: 1e-6, quantities: ['gamma', 'crossSection'] });
    const modes = r.rows.modes!;
    const shell2 = modes.filter((row) => row.l === 2);
    expect(shell2.map((row) => row.m)).toEqual([-2, -1, 0, 1, 2]);
    expect(new Set(shell2.map((row) => row.gamma)).size).toBe(1);
    const sum = modes.reduce((acc, row) => acc + (row.gamma as number), 0);
    const sigma = r.rows.crossSection![0].sigma as number;
    expect(Math.abs(((Math.PI / omega ** 2) * sum) / sigma - 1)).toBeLessThan(1e-12);
  });

  test('assembled tables carry units in the CSV header and the same rows in table.json', () => {
    const grid = validateGrid({
      fieldSpins: [0],
      holeA: [0],
      frequencies: { values: [0.2] },
      quantities: ['crossSection', 'spectra'],
    });
    const results = [computeTask({ index: 0, s: 0, a: 0, omega: 0.2, l: 'auto', tolerance: 1e-6, quantities: grid.quantities })];
    const { files } = assembleTables(grid, results);
    expect(files.map((f) => f.name)).toEqual(['cross-section.csv', 'spectra.csv', 'table.json']);
    expect(files[0].text.split('\n')[0]).toBe(
      'spin [1],a [M],omega [1/M],status,sigma [M^2],relError [1],droppedBound [M^2],lMax [1],modes,message',
    );
    expect(files[1].text.split('\n')[0]).toMatch(/number \[1\],energy \[1\/M\],torque \[1\]/);
    const json = JSON.parse(files[2].text);
    expect(json.format).toBe('penumbra-grid-table/2');
    expect(json.tables.crossSection.columns.map((c: { name: string }) => c.name)).toEqual(
      files[0].text
        .split('\n')[0]
        .split(',')
        .map((h) => h.replace(/ \[.*\]$/, '')),
    );
    expect(json.tables.crossSection.rows[0]).toEqual({ ...results[0].rows.crossSection![0] });
    expect(json.tables.crossSection.rows[0].sigma).toBe(results[0].rows.crossSection![0].sigma);
  });
});
