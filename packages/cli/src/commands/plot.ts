import { accessSync, constants, existsSync, statSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { dirname, resolve } from 'node:path';
import { GridError, readTable, writeFileAtomic, type GridTable } from '@penumbra/grid';
import { renderSvg } from '@penumbra/plot';
import { UsageError, type Command } from '../command.js';
import { parseFieldSpin, parseNumber, parseOptions } from '../options.js';
import { PLOT_QUANTITIES, tableFigure, type PlotQuantity } from '../tableFigure.js';
import { tableShapeProblem } from '../tableShape.js';

export const command: Command = {
  name: 'plot',
  summary: "draw a table from 'penumbra table' as an SVG figure (Γ(ω) by mode, σ(ω), spectra)",
  usage: `Usage: penumbra plot TABLE --out FIG.svg [--quantity Q] [--spin S] [--a SPIN]

TABLE is a table directory or its table.json. Axes carry units (geometric,
M = 1) and turn logarithmic where the data span two decades or more; failed
rows are left out and counted in the subtitle.

Options:
  --out FIG.svg   the SVG file to write
  --quantity Q    ${PLOT_QUANTITIES.join(', ')}
                  (default: gamma, else crossSection, else spectra)
  --spin S        field spin to draw (gamma, reflection: default the first;
                  crossSection, spectra: default all)
  --a SPIN        hole spin a/M to draw (same defaults)
  -h, --help      this text

Example:
  penumbra plot out/table.json --quantity gamma --spin 1 --a 0.9 --out gamma.svg
`,
  async run(argv, io) {
    const { values, positionals } = parseOptions(
      argv,
      {
        out: { type: 'string' },
        quantity: { type: 'string' },
        spin: { type: 'string' },
        a: { type: 'string' },
      },
      true,
    );
    const problems: string[] = [];
    if (positionals.length !== 1) problems.push(`expected one TABLE (a directory or table.json), got ${positionals.length}`);
    if (values.out === undefined) problems.push('missing --out FIG.svg');
    else problems.push(...svgTargetProblems(values.out));
    let quantity: PlotQuantity | undefined;
    if (values.quantity !== undefined) {
      if ((PLOT_QUANTITIES as readonly string[]).includes(values.quantity)) quantity = values.quantity as PlotQuantity;
      else problems.push(`--quantity expects one of ${PLOT_QUANTITIES.join(', ')}, got '${values.quantity}'`);
    }
    const collect = <T>(f: () => T): T | undefined => {
      try {
        return f();
      } catch (error) {
        if (error instanceof UsageError) problems.push(error.message);
        else throw error;
        return undefined;
      }
    };
    const s = values.spin === undefined ? undefined : collect(() => parseFieldSpin('--spin', values.spin!));
    const a = values.a === undefined ? undefined : collect(() => parseNumber('--a', values.a!));
    let table: GridTable | undefined;
    if (positionals.length === 1) {
      const path = positionals[0];
      if (!existsSync(path)) problems.push(`${path} does not exist`);
      else {
        try {
          table = readTable(path);
        } catch (error) {
          // a TypeError here means a file of the wrong shape; its text names no file
          const detail = error instanceof TypeError ? 'not a well-formed penumbra table' : (error as Error).message;
          problems.push(`cannot read ${path}: ${detail}`);
        }
        const shape = table && tableShapeProblem(table);
        if (shape) {
          problems.push(`cannot read ${path}: not a well-formed penumbra table (${shape})`);
          table = undefined;
        }
      }
    }
    if (problems.length)
      throw new UsageError(
        problems.length === 1
          ? problems[0]
          : `${problems.length} problems: ${problems.map((p, i) => `(${i + 1}) ${p}`).join('; ')}`,
      );
    let result: Awaited<ReturnType<typeof tableFigure>>;
    try {
      result = tableFigure(table!, { quantity, s, a });
    } catch (error) {
      if (error instanceof GridError) throw new UsageError(error.message);
      throw error;
    }
    const svg = await renderSvg(result.figure);
    try {
      writeFileAtomic(values.out!, svg);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new InputError('--out', 'a file penumbra can write', values.out, code ?? (error as Error).message);
    }
    const omitted = result.omitted ? `, ${result.omitted} failed rows left out` : '';
    io.stderr(
      `penumbra plot: ${result.quantity}: ${result.series.length} series, ${result.points} points${omitted}; ${result.xLog ? 'log' : 'linear'} ω axis, ${result.yScale} y axis; wrote ${values.out}\n`,
    );
    return 0;
  },
};

function svgTargetProblems(out: string): string[] {
  const path = resolve(out);
  if (existsSync(path) && statSync(path).isDirectory()) return [`--out ${out} is a directory; give a file name such as fig.svg`];
  const parent = dirname(path);
  if (!existsSync(parent) || !statSync(parent).isDirectory()) return [`--out ${out}: directory ${parent} does not exist`];
  if (!writable(parent)) return [`--out ${out}: directory ${parent} is not writable`];
  // A read-only file (no write bit at all, or not writable by this user) is never replaced, not even by root.
  if (existsSync(path) && (!writable(path) || (statSync(path).mode & 0o222) === 0))
    return [`--out ${out} is read-only; refusing to replace it`];
  return [];
}

function writable(path: string): boolean {
  try {
    accessSync(path, constants.W_OK);
    return true;
  } catch {
    return false;
  }
}
