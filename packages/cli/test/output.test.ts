import { describe, expect, test } from 'vitest';
import { headerCell, type Column } from '@penumbra/core';
import { tableColumns, validateGrid } from '@penumbra/grid';
import { greybodyTable, spectrumTable } from '@penumbra/cli/internal';
import { run } from './helpers.js';

describe('one output convention for every command', () => {
  // Commands that write text, JSON or CSV; each would compute for seconds if the flags were accepted.
  const both: string[][] = [
    ['greybody', '--spin', '0', '--l', '0', '--m', '0', '--a', '0', '--omega', '0.3'],
    ['cross-section', '--spin', '0', '--a', '0', '--omega', '0.3'],
    ['emission', '--a', '0', '--spin', '0'],
    ['evolve', '--a', '0.5'],
  ];
  test.each(both)('%s refuses --json with --csv before computing: one UsageError line, exit code 2', async (...argv) => {
    const result = await run(...argv, '--json', '--csv');
    expect(result.code).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toBe(`penumbra: choose one of --json and --csv (see 'penumbra ${argv[0]} --help')\n`);
  });

  test.each([['kerr', '--a', '0.5'], ['demo'], ['spheroidal', '--spin', '0', '--l', '0', '--m', '0', '--c', '0']])(
    '%s writes text or JSON; --csv is an unknown option (one line, exit code 2)',
    async (...argv) => {
      const result = await run(...argv, '--csv');
      expect(result.code).toBe(2);
      expect(result.stderr).toMatch(/^penumbra: unknown option '--csv'[^\n]*\n$/);
    },
  );

  test('a CLI table and the grid table of the same quantity give a column of the same name the same unit; every name is camelCase', async () => {
    const grid = validateGrid({
      fieldSpins: [0],
      holeA: [0],
      frequencies: { values: [0.1] },
      l: 'auto',
      quantities: ['gamma', 'reflection', 'crossSection', 'spectra'],
    });
    const header = (columns: readonly Column[]) => columns.map(headerCell);
    const crossSectionCsv = (
      await run('cross-section', '--spin', '0', '--a', '0', '--omega', '0.1', '--tol', '1e-3', '--csv')
    ).stdout
      .split('\n')[0]
      .split(',');
    const pairs: [string[], string[]][] = [
      [header(greybodyTable([]).columns), header(tableColumns(grid, 'modes'))],
      [crossSectionCsv, header(tableColumns(grid, 'crossSection'))],
      [header(spectrumTable([], true).columns), header(tableColumns(grid, 'spectra'))],
    ];
    for (const [cli, gridHeader] of pairs) {
      const units = new Map(gridHeader.map((h) => [h.replace(/ \[.*\]$/, ''), h]));
      let shared = 0;
      for (const h of cli) {
        const name = h.replace(/ \[.*\]$/, '');
        expect(name).toMatch(/^[a-z][A-Za-z0-9]*$/);
        if (units.has(name)) {
          shared++;
          expect(h).toBe(units.get(name));
        }
      }
      expect(shared).toBeGreaterThanOrEqual(4);
    }
  });
});
