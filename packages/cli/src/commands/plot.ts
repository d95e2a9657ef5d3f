import { accessSync, constants, existsSync, statSync } from 'node:fs';
import { InputError } from '@penumbra/core';
import { dirname, resolve } from 'node:path';
import { writeFileAtomic } from '@penumbra/grid';
import { renderSvg, SCALE_TYPES, type ScaleType } from '@penumbra/plot';
import { UsageError, type Command } from '../command.js';
import { parseFieldSpin, parseMassUnit, parseNumber, parseOptions } from '../options.js';
import { PLOT_QUANTITIES, PlotDataError, type PlotOptions, type PlotQuantity } from '../plotCommon.js';
import { plotFigure } from '../plotFigure.js';
import { readPlotData, type PlotData } from '../plotRead.js';
import { parseModeList } from '../plotOptions.js';

export const command: Command = {
  name: 'plot',
  summary: 'draw what a penumbra command wrote (CSV, JSON or a table) as an SVG figure',
  usage: `Usage: penumbra plot FILE --out FIG.svg [--quantity Q] [--l LIST] [--m LIST] [options]

FILE is any CSV or JSON a penumbra command wrote (greybody, cross-section,
emission --omega, evolve, spheroidal --theta, demo), or a table directory
from 'penumbra table' (or its table.json or CSV files). Axes carry units
and their scales follow the data (log where it spans decades, symmetric-log
where Γ changes sign); failed rows are left out and counted in the subtitle.

Quantities (default: the first the data has):
  gamma           Γ(ω) by mode: colour = m, dash = l; superradiant band
                  0 < ω < mΩₕ shaded and each mΩₕ marked (bosons)
  amplification   −Γ on a linear axis where Γ < 0 (superradiance)
  reflection      reflected fraction by mode
  crossSection    σ(ω) in M² with 27πM², 16πM² (s = 0), 2πM² (s = 1/2)
  spectra         d²N/(dt dω) per species, log axes; in GeV⁻¹ s⁻¹ against
                  E in GeV with a mass (--mass, or emission --mass output)
  energySpectra   the power spectrum, the same way
  track           evolve output: M, a* and Tₕ against time
  harmonic        spheroidal --theta output: S(θ)

Options:
  --out FIG.svg       the SVG file to write
  --quantity Q        one of the quantities above
  --spin S            field spin to draw (mode plots: default the first;
                      summed plots: default all)
  --a A               the hole's a/M to draw (same defaults)
  --l LIST            multipoles to draw, e.g. 2 or 1,2 or 1:3 (default all)
  --m LIST            azimuthal numbers to draw, e.g. 2 or -2:2 (default all)
  --x-scale S         linear, log or symlog (default: from the data)
  --y-scale S         linear, log or symlog (default: from the data)
  --mass M            hole mass for physical axes (E in GeV, s⁻¹), with --unit
  --unit U            g (default), kg or msun
  -h, --help          this text

Examples:
  penumbra plot out/table.json --spin 2 --l 2 --m 2 --out gamma.svg
  penumbra plot out/table.json --quantity amplification --m 2 --out amp.svg
  penumbra greybody --spin 1 --l 1 --m 1 --a 0.9 --omega 0.05:1:40 --csv > g.csv
  penumbra plot g.csv --out g.svg
`,
  async run(argv, io) {
    const { values, positionals } = parseOptions(
      argv,
      {
        out: { type: 'string' },
        quantity: { type: 'string' },
        spin: { type: 'string' },
        a: { type: 'string' },
        l: { type: 'string' },
        m: { type: 'string' },
        'x-scale': { type: 'string' },
        'y-scale': { type: 'string' },
        mass: { type: 'string' },
        unit: { type: 'string' },
      },
      true,
    );
    const problems: string[] = [];
    const collect = <T>(f: () => T): T | undefined => {
      try {
        return f();
      } catch (error) {
        if (error instanceof UsageError) problems.push(error.message);
        else throw error;
        return undefined;
      }
    };
    if (positionals.length !== 1) problems.push(`expected one FILE (CSV, JSON or a table directory), got ${positionals.length}`);
    if (values.out === undefined) problems.push('missing --out FIG.svg');
    else problems.push(...svgTargetProblems(values.out));
    const options: PlotOptions = {};
    if (values.quantity !== undefined) {
      if ((PLOT_QUANTITIES as readonly string[]).includes(values.quantity)) options.quantity = values.quantity as PlotQuantity;
      else problems.push(`--quantity expects one of ${PLOT_QUANTITIES.join(', ')}, got '${values.quantity}'`);
    }
    for (const [flag, key] of [
      ['x-scale', 'xScale'],
      ['y-scale', 'yScale'],
    ] as const) {
      const text = values[flag];
      if (text === undefined) continue;
      if ((SCALE_TYPES as readonly string[]).includes(text)) options[key] = text as ScaleType;
      else problems.push(`--${flag} expects one of ${SCALE_TYPES.join(', ')}, got '${text}'`);
    }
    if (values.spin !== undefined) options.spin = collect(() => parseFieldSpin('--spin', values.spin!));
    if (values.a !== undefined) options.a = collect(() => parseNumber('--a', values.a!));
    if (values.l !== undefined) options.l = collect(() => parseModeList('--l', values.l!));
    if (values.m !== undefined) options.m = collect(() => parseModeList('--m', values.m!));
    if (values.mass !== undefined) options.mass = collect(() => parseNumber('--mass', values.mass!, { min: 0, exclusive: true }));
    if (values.unit !== undefined) {
      options.unit = collect(() => parseMassUnit('--unit', values.unit!));
      if (values.mass === undefined) problems.push('--unit needs --mass');
    }
    let data: PlotData[] | undefined;
    if (positionals.length === 1) {
      const path = positionals[0];
      if (!existsSync(path)) problems.push(`${path} does not exist`);
      else {
        try {
          data = readPlotData(path);
        } catch (error) {
          problems.push(`cannot read ${path}: ${(error as Error).message}`);
        }
      }
    }
    if (problems.length)
      throw new UsageError(
        problems.length === 1
          ? problems[0]
          : `${problems.length} problems: ${problems.map((p, i) => `(${i + 1}) ${p}`).join('; ')}`,
      );
    let result: ReturnType<typeof plotFigure>;
    try {
      result = plotFigure(data!, options);
    } catch (error) {
      if (error instanceof PlotDataError) throw new UsageError(`cannot plot: ${error.message}`);
      throw error;
    }
    const svg = await renderSvg(result.figure);
    try {
      writeFileAtomic(values.out!, svg);
    } catch (error) {
      const code = (error as NodeJS.ErrnoException).code;
      throw new InputError('--out', 'a file penumbra can write', values.out, code ?? (error as Error).message);
    }
    const omitted = result.omitted ? `, ${result.omitted} rows left out` : '';
    io.stderr(
      `penumbra plot: ${result.quantity}: ${result.series.length} series, ${result.points} points${omitted}; ${result.xScale} x axis, ${result.yScale} y axis; wrote ${values.out}\n`,
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
