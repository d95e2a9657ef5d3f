import { InputError } from '@penumbra/core';
import { greybody, type GreybodySolution, type ProcaPolarization } from '@penumbra/flux';
import { warnInaccurate } from '../accuracy.js';
import type { Command } from '../command.js';
import { MODE_HELP, MODE_OPTIONS, parseModeArguments } from '../modeArguments.js';
import { FIELD_MASS_HELP, FIELD_MASS_OPTIONS, fieldWithMass } from '../fieldMass.js';
import { limitsHelp } from '../limits.js';
import { formatTable } from '../format.js';
import { greybodyJson, greybodyTable, greybodyTextRows } from '../greybodyTable.js';
import { parseNumber, parseOptions } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';
import { progressReporter } from '../progress.js';

/** --kappa-sign: 1 or -1. */
function parseKappaSign(text: string): 1 | -1 {
  const k = parseNumber('--kappa-sign', text);
  if (k !== 1 && k !== -1) throw new InputError('--kappa-sign', '1 or -1', text);
  return k;
}

/** `penumbra greybody`. */
export const command: Command = {
  name: 'greybody',
  summary: 'greybody factor Γ_slm(ω), reflection and diagnostics for one mode, at one frequency or a range',
  usage: `Usage: penumbra greybody --spin S --l L --m M --a A --omega W|START:STOP:COUNT [options]

Geometric units: the hole mass is 1, ω is Mω, a is a/M (|a/M| ≤ 0.99999).

Options:
  ${MODE_HELP}
  --a A        the hole's spin parameter a/M; negative: counter-rotating relative to m > 0
  --omega W    frequency Mω in [1e-5, 30], a grid START:STOP:COUNT or a list W1,W2,…
  ${FIELD_MASS_HELP}
  --mass M     hole mass, only to convert --field-mass from an energy unit (results stay in units of M)
  --unit U     g, kg or msun (required with --mass)
  --kappa-sign K    massive spin 1/2 only: the sign (1 or -1) of the Dirac
               quantum number κ = ±(l + 1/2); -1 includes the s-wave
  --log        space a frequency grid geometrically
  --polarization P massive vector only: odd, even-1, even-2 (l ≥ 1) or monopole (l = 0);
               default odd (monopole at l = 0); see docs/massive-vector.md
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
  penumbra greybody --spin 0 --l 1 --m 1 --a 0.9 --omega 0.4 --field-mass 0.3 --json
  penumbra greybody --spin 0 --l 0 --m 0 --a 0 --omega 0.5 --field-mass 135 --field-mass-unit MeV --mass 1e14 --unit g
  penumbra greybody --spin 1 --l 1 --m 0 --a 0 --omega 0.3 --field-mass 0.1 --polarization even-2 --json
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      ...MODE_OPTIONS,
      'kappa-sign': { type: 'string' },
      ...FIELD_MASS_OPTIONS,
      mass: { type: 'string' },
      unit: { type: 'string' },
      polarization: { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const { spin, l, m, a, grid, omegaText, tol } = parseModeArguments(values);
    const field = fieldWithMass(spin, values);
    const fieldMass = field.mass ?? 0;
    const kappaSign = values['kappa-sign'] === undefined ? undefined : parseKappaSign(values['kappa-sign']);
    const polarization = values.polarization as ProcaPolarization | undefined;
    const options = polarization === undefined ? { tol } : { tol, polarization };
    const results: GreybodySolution[] = [];
    const progress = progressReporter(io, 'greybody: frequencies done', grid.count);
    for (const [i, omega] of grid.values.entries()) {
      results.push(
        greybody({ hole: { a }, mode: { field, l, m, ...(kappaSign === undefined ? {} : { kappaSign }) }, omega }, options),
      );
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
      text: () =>
        `greybody factor, s = ${spin}, l = ${l}, m = ${m}, a = ${a} M${fieldMass > 0 ? `, Mμ = ${fieldMass}` : ''}\n` +
        formatTable(greybodyTextRows(results)),
    });
    return 0;
  },
};
