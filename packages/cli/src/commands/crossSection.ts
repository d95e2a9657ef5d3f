import type { FieldSpin } from '@penumbra/core';
import { absorptionCrossSection } from '@penumbra/flux';
import type { Command } from '../command.js';
import {
  formatNumber,
  formatTable,
  parseFieldSpin,
  parseNumber,
  parseOptions,
  parseRange,
  progressReporter,
  requireOption,
  writeJson,
} from '../options.js';

export const command: Command = {
  name: 'cross-section',
  summary: 'absorption cross-section σ(ω) = (π/ω²) Σ Γ_slm, with its l-truncation bound',
  usage: `Usage: penumbra cross-section --spin S --a SPIN --omega W|START:STOP:COUNT [--tol T] [--json|--csv]

Geometric units (M = 1): σ in M², ω is Mω, a is a/M.

Options:
  --spin S     field spin: 0, 1/2, 1, 2
  --a SPIN     hole spin a/M (|a/M| ≤ 0.9999)
  --omega W    frequency Mω, or a grid START:STOP:COUNT
  --log        space a frequency grid geometrically
  --tol T      relative accuracy of each Γ and of the l-sum (default 1e-6)
  --json       JSON array of {omega, sigma, lMax, droppedBound, relError, modes}
  --csv        CSV with units in the header
  -h, --help   this text

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
      json: { type: 'boolean' },
      csv: { type: 'boolean' },
    });
    const spin = parseFieldSpin('--spin', requireOption(values.spin, '--spin', 'the field spin'));
    const a = parseNumber('--a', requireOption(values.a, '--a', 'the hole spin a/M'));
    const grid = parseRange('--omega', requireOption(values.omega, '--omega', 'the frequency Mω'), {
      min: 0, exclusive: true, log: values.log ?? false, maxCount: 10_000,
    });
    const tol = values.tol === undefined ? 1e-6 : parseNumber('--tol', values.tol);
    const progress = progressReporter(io, 'cross-section: frequencies done', grid.count);
    const rows = grid.values.map((omega, i) => {
      const r = absorptionCrossSection({ hole: { a }, field: { spin: spin as FieldSpin }, omega }, { tol });
      progress(i + 1);
      const { lMax, droppedBound, modes } = r.diagnostics;
      return { omega, sigma: r.sigma, lMax, droppedBound, relError: r.relError, modes };
    });
    if (values.json) writeJson(io, rows);
    else if (values.csv) {
      io.stdout(['omega [1/M],sigma [M^2],l_max,dropped_bound [M^2],rel_error [1],modes', ...rows.map((r) => [r.omega, r.sigma, r.lMax, r.droppedBound, r.relError, r.modes].join(','))].join('\n') + '\n');
    } else {
      io.stdout(`absorption cross-section, s = ${spin}, a = ${a} M (σ in M²; 27π = ${formatNumber(27 * Math.PI, 6)})\n`);
      io.stdout(formatTable([['Mω', 'σ/M²', 'l max', 'rel. error'], ...rows.map((r) => [formatNumber(r.omega, 6), formatNumber(r.sigma, 8), String(r.lMax), r.relError.toExponential(1)])]));
    }
    return 0;
  },
};
