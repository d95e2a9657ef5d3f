import type { FieldSpin } from '@penumbra/core';
import { greybody, type GreybodySolution } from '@penumbra/flux';
import { warnInaccurate } from '../accuracy.js';
import type { Command } from '../command.js';
import { limitsHelp } from '../limits.js';
import { formatTable } from '../format.js';
import { greybodyJson, greybodyTable, greybodyTextRows } from '../greybodyTable.js';
import { parseFieldSpin, parseModeNumber, parseNumber, parseOptions, parseRange, requireOption } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';
import { progressReporter } from '../progress.js';

/** `penumbra greybody`. */
export const command: Command = {
  name: 'greybody',
  summary: 'greybody factor Γ_slm(ω), reflection and diagnostics for one mode, at one frequency or a range',
  usage: `Usage: penumbra greybody --spin S --l L --m M --a A --omega W|START:STOP:COUNT [options]

Geometric units: the hole mass is 1, ω is Mω, a is a/M (|a/M| ≤ 0.9999).

Options:
  --spin S     field spin: 0, 1/2 (or 0.5), 1, 2
  --l L        multipole, l ≥ S with l − S an integer
  --m M        azimuthal number, |m| ≤ l with m − S an integer
  --a A        the hole's spin parameter a/M; negative: counter-rotating relative to m > 0
  --omega W    frequency Mω in [1e-5, 30], a grid START:STOP:COUNT or a list W1,W2,…
  --log        space a frequency grid geometrically
  --tol T      requested relative accuracy of Γ (default 1e-8, 1e-12 … 1e-2)
  --json       JSON: one object, or an array for a grid
  --csv        CSV with units in the header
  -h, --help   this text

Every result carries |Γ + R − 1| (R from an independent solve of the −s field)
and an error estimate; a mode that cannot reach --tol is an error, not a number.
A Γ whose estimated relative error exceeds 1e-3 prints a warning on stderr and
carries inaccurate: true in JSON and CSV.

${limitsHelp(['l', 'a', 'omega', 'tol'])}
Examples:
  penumbra greybody --spin 1 --l 1 --m 1 --a 0.9 --omega 0.3 --json
  penumbra greybody --spin 2 --l 2 --m 2 --a 0.99 --omega 0.01:2:40 --csv
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      spin: { type: 'string' },
      l: { type: 'string' },
      m: { type: 'string' },
      a: { type: 'string' },
      omega: { type: 'string' },
      log: { type: 'boolean' },
      tol: { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the field spin'));
    const l = parseModeNumber('--l', requireOption(values.l, '--l', 'the multipole'));
    const m = parseModeNumber('--m', requireOption(values.m, '--m', 'the azimuthal number'));
    const a = parseNumber('--a', requireOption(values.a, '--a', "the hole's a/M"));
    const omegaText = requireOption(values.omega, '--omega', 'the frequency Mω or START:STOP:COUNT');
    const grid = parseRange('--omega', omegaText, { min: 0, exclusive: true, log: values.log ?? false, maxCount: 10_000 });
    const tol = values.tol === undefined ? undefined : parseNumber('--tol', values.tol);
    const results: GreybodySolution[] = [];
    const progress = progressReporter(io, 'greybody: frequencies done', grid.count);
    for (const [i, omega] of grid.values.entries()) {
      results.push(greybody({ hole: { a }, mode: { field: { spin: spin as FieldSpin }, l, m }, omega }, { tol }));
      progress(i + 1);
    }
    const single = grid.count === 1 && !/[:,]/.test(omegaText);
    warnInaccurate(
      io,
      results.map((r) => ({ what: `Γ at Mω = ${r.omega}`, relError: r.relError })),
    );
    writeOutput(io, format, {
      json: () => (single ? greybodyJson(results[0]) : results.map(greybodyJson)),
      csv: () => greybodyTable(results),
      text: () => `greybody factor, s = ${spin}, l = ${l}, m = ${m}, a = ${a} M\n` + formatTable(greybodyTextRows(results)),
    });
    return 0;
  },
};
