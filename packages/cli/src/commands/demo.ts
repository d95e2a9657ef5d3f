import type { FieldSpin } from '@penumbra/core';
import { greybody, type GreybodySolution } from '@penumbra/flux';
import { backgroundJson, backgroundReport, backgroundText } from '../background.js';
import type { Command } from '../command.js';
import { greybodyJson } from '../greybodyTable.js';
import { formatNumber, formatTable, parseOptions, writeJson } from '../options.js';

/** The built-in demo hole: a = 0.7 M in geometric units. */
export const DEMO_SPIN_RATIO = 0.7;
const DEMO_OMEGAS = [0.05, 0.2, 0.4, 0.8, 1.5];
/** The lowest co-rotating mode of each field: l = m = max(s, 1/2 for neutrinos). */
const DEMO_MODES: { spin: FieldSpin; l: number; m: number; label: string }[] = [
  { spin: 0, l: 1, m: 1, label: 'scalar   s=0   l=1   m=1  ' },
  { spin: 0.5, l: 0.5, m: 0.5, label: 'neutrino s=1/2 l=1/2 m=1/2' },
  { spin: 1, l: 1, m: 1, label: 'photon   s=1   l=1   m=1  ' },
  { spin: 2, l: 2, m: 2, label: 'graviton s=2   l=2   m=2  ' },
];

export const command: Command = {
  name: 'demo',
  summary: `greybody factors of every field for a built-in demo hole (a = ${DEMO_SPIN_RATIO} M)`,
  usage: `Usage: penumbra demo [--json]

Computes the greybody factors Γ_slm(ω) of the lowest co-rotating mode of the
scalar, neutrino, photon and graviton fields at ${DEMO_OMEGAS.length} frequencies for the
built-in demo hole a = ${DEMO_SPIN_RATIO} M (geometric units, M = 1), with the conservation
residual |Γ + R − 1| and the error estimate of each, after the hole's Kerr
background. Negative Γ marks superradiant amplification.

Options:
  --json       one JSON object: {"hole": <penumbra kerr --json>, "greybody": [...]}
  -h, --help   this text
`,
  run(argv, io) {
    const { values } = parseOptions(argv, { json: { type: 'boolean' } });
    const report = backgroundReport({ spinRatio: DEMO_SPIN_RATIO, mass: 1 });
    const results: { label: string; r: GreybodySolution }[] = [];
    for (const mode of DEMO_MODES) {
      for (const omega of DEMO_OMEGAS) {
        results.push({ label: mode.label, r: greybody({ hole: { a: DEMO_SPIN_RATIO }, mode: { field: { spin: mode.spin }, l: mode.l, m: mode.m }, omega }) });
      }
    }
    if (values.json) {
      writeJson(io, { hole: backgroundJson(report), greybody: results.map(({ r }) => greybodyJson(r)) });
      return 0;
    }
    io.stdout('penumbra demo hole\n' + backgroundText(report) + '\n');
    io.stdout('greybody factors (Γ < 0: superradiant amplification)\n');
    io.stdout(
      formatTable([
        ['mode', 'Mω', 'Γ', '|Γ+R−1|', 'rel. error'],
        ...results.map(({ label, r }) => [
          label, formatNumber(r.omega, 4), formatNumber(r.gamma, 9), r.residual.toExponential(1), r.relError.toExponential(1),
        ]),
      ]),
    );
    return 0;
  },
};
