import { MAX_L, type Column, type FieldSpin, OMEGA_COLUMN } from '@penumbra/core';
import { absorptionCrossSection } from '@penumbra/flux';
import { INACCURATE_COLUMN, isInaccurate, warnInaccurate } from '../accuracy.js';
import type { Command } from '../command.js';
import { FIELD_MASS_HELP, FIELD_MASS_OPTIONS, fieldWithMass } from '../fieldMass.js';
import { limitsHelp } from '../limits.js';
import { formatError, formatNumber, formatTable } from '../format.js';
import { parseFieldSpin, parseNumber, parseOptions, parseRange, requireOption } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';
import { progressReporter, shellProgress } from '../progress.js';

/** The CSV columns: the keys of the JSON rows. */
const COLUMNS: Column[] = [
  OMEGA_COLUMN,
  { name: 'sigma', unit: 'M^2', description: 'absorption cross-section σ = (π/ω²) Σ Γ of one helicity' },
  { name: 'lMax', unit: '1', description: 'largest l summed' },
  { name: 'droppedBound', unit: 'M^2', description: 'bound on the l-shells not summed' },
  { name: 'relError', unit: '1', description: 'estimated relative error of σ (mode errors plus dropped l-shells)' },
  { name: 'modes', unit: '', description: 'greybody solves' },
  INACCURATE_COLUMN,
];

/** `penumbra cross-section`. */
export const command: Command = {
  name: 'cross-section',
  summary: 'absorption cross-section σ(ω) = (π/ω²) Σ Γ_slm, with its l-truncation bound',
  usage: `Usage: penumbra cross-section --spin S --a A --omega W|START:STOP:COUNT [--tol T] [--json|--csv]

Geometric units (M = 1): σ in M², ω is Mω, a is a/M. For a massive field
σ = (π/k∞²) Σ Γ with k∞ = √(ω² − μ²) the wavenumber at infinity, per spin
state: a massive spin-1/2 field averages the two signs of κ, a massive
spin-1 field (a = 0 only) its three polarisations.

Options:
  --spin S     field spin: 0, 1/2, 1, 2
  --a A        the hole's spin parameter a/M (|a/M| ≤ 0.99999)
  --omega W    frequency Mω, a grid START:STOP:COUNT or a list W1,W2,…
  ${FIELD_MASS_HELP}
  --mass M     hole mass, only to convert --field-mass from an energy unit (results stay in units of M)
  --unit U     g, kg or msun (required with --mass)
  --log        space a frequency grid geometrically
  --tol T      relative accuracy of each Γ and of the l-sum (default 1e-6)
  --json       JSON array of {omega, sigma, lMax, droppedBound, relError, modes, inaccurate}
  --csv        CSV with units in the header
  -h, --help   this text

A σ whose estimated relative error exceeds 1e-3 prints a warning on stderr and
carries inaccurate: true in JSON and CSV.

${limitsHelp(['a', 'omega', 'tol'])}  the l-sum stops at l = ${MAX_L}; a frequency that needs more is refused before any work\n
Example:
  penumbra cross-section --spin 0 --a 0 --omega 0.05:3:30 --csv
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      spin: { type: 'string' },
      a: { type: 'string' },
      omega: { type: 'string' },
      log: { type: 'boolean' },
      tol: { type: 'string' },
      ...FIELD_MASS_OPTIONS,
      mass: { type: 'string' },
      unit: { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the field spin'));
    const a = parseNumber('--a', requireOption(values.a, '--a', "the hole's a/M"));
    const grid = parseRange('--omega', requireOption(values.omega, '--omega', 'the frequency Mω'), {
      min: 0,
      exclusive: true,
      log: values.log ?? false,
      maxCount: 10_000,
    });
    const tol = values.tol === undefined ? 1e-6 : parseNumber('--tol', values.tol);
    const field = fieldWithMass(spin as FieldSpin, values);
    const progress = progressReporter(io, 'cross-section: frequencies done', grid.count);
    const rows = grid.values.map((omega, i) => {
      const onMode = shellProgress(io, `cross-section at Mω = ${omega}`, 5 * omega);
      const r = absorptionCrossSection({ hole: { a }, field, omega }, { tol, onMode });
      progress(i + 1);
      const { lMax, droppedBound, modes } = r.diagnostics;
      return { omega, sigma: r.sigma, lMax, droppedBound, relError: r.relError, modes, inaccurate: isInaccurate(r.relError) };
    });
    warnInaccurate(
      io,
      rows.map((r) => ({ what: `σ at Mω = ${r.omega}`, relError: r.relError })),
    );
    writeOutput(io, format, {
      json: () => rows,
      csv: () => ({ columns: COLUMNS, rows: rows.map((r) => COLUMNS.map((c) => r[c.name as keyof typeof r])) }),
      text: () =>
        `absorption cross-section, s = ${spin}, a = ${a} M${field.mass ? `, Mμ = ${field.mass}` : ''} (σ in M²; 27π = ${formatNumber(27 * Math.PI, 6)})\n` +
        formatTable([
          ['Mω', 'σ/M²', 'l max', 'rel. error'],
          ...rows.map((r) => [formatNumber(r.omega, 6), formatNumber(r.sigma, 8), String(r.lMax), formatError(r.relError)]),
        ]),
    });
    return 0;
  },
};
