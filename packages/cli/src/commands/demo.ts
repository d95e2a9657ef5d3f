import type { FieldSpin } from '@penumbra/core';
import { greybody, type GreybodySolution } from '@penumbra/flux';
import { backgroundJson, backgroundReport, backgroundText } from '../background.js';
import type { Command } from '../command.js';
import { formatError, formatNumber, formatTable } from '../format.js';
import { greybodyJson } from '../greybodyTable.js';
import { parseOptions } from '../options.js';
import { JSON_OPTION, outputFormat, writeOutput } from '../output.js';

/** The built-in demo hole: a = 0.7 M in geometric units. */
export const DEMO_A_STAR = 0.7;
const DEMO_OMEGAS = [0.05, 0.2, 0.4, 0.8, 1.5];
/** The lowest co-rotating mode of each field: l = m = max(s, 1/2 for neutrinos). */
const DEMO_MODES: { spin: FieldSpin; l: number; m: number; label: string }[] = [
  { spin: 0, l: 1, m: 1, label: 'scalar   s=0   l=1   m=1  ' },
  { spin: 0.5, l: 0.5, m: 0.5, label: 'neutrino s=1/2 l=1/2 m=1/2' },
  { spin: 1, l: 1, m: 1, label: 'photon   s=1   l=1   m=1  ' },
  { spin: 2, l: 2, m: 2, label: 'graviton s=2   l=2   m=2  ' },
];

/** `penumbra demo`. */
export const command: Command = {
  name: 'demo',
  summary: `greybody factors of every field for a built-in demo hole (a = ${DEMO_A_STAR} M)`,
  usage: `Usage: penumbra demo [--json]

Computes the greybody factors Γ_slm(ω) of the lowest co-rotating mode of the
scalar, neutrino, photon and graviton fields at ${DEMO_OMEGAS.length} frequencies for the
built-in demo hole a = ${DEMO_A_STAR} M (geometric units, M = 1), with the conservation
residual |Γ + R − 1| and the error estimate of each, after the hole's Kerr
background. Negative Γ marks superradiant amplification.

Options:
  --json       one JSON object: {"hole": <penumbra kerr --json>, "greybody": [...]}
  -h, --help   this text
`,
  run(argv, io) {
    const format = outputFormat(parseOptions(argv, JSON_OPTION).values);
    const report = backgroundReport({ aStar: DEMO_A_STAR, mass: 1 });
    const results: { label: string; r: GreybodySolution }[] = [];
    for (const mode of DEMO_MODES) {
      for (const omega of DEMO_OMEGAS) {
        results.push({
          label: mode.label,
          r: greybody({ hole: { a: DEMO_A_STAR }, mode: { field: { spin: mode.spin }, l: mode.l, m: mode.m }, omega }),
        });
      }
    }
    writeOutput(io, format, {
      json: () => ({ hole: backgroundJson(report), greybody: results.map(({ r }) => greybodyJson(r)) }),
      text: () =>
        'penumbra demo hole\n' +
        backgroundText(report) +
        '\n' +
        'greybody factors (Γ < 0: superradiant amplification)\n' +
        formatTable([
          ['mode', 'Mω', 'Γ', '|Γ+R−1|', 'rel. error'],
          ...results.map(({ label, r }) => [
            label,
            formatNumber(r.omega, 4),
            formatNumber(r.gamma, 9),
            formatError(r.residual),
            formatError(r.relError),
          ]),
        ]),
    });
    return 0;
  },
};
