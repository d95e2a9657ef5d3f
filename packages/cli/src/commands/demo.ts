import { backgroundJson, backgroundReport, backgroundText } from '../background.js';
import type { Command } from '../command.js';
import { parseOptions, writeJson } from '../options.js';

/** The built-in demo hole: a = 0.7 M in geometric units. */
export const DEMO_SPIN_RATIO = 0.7;

export const command: Command = {
  name: 'demo',
  summary: `run penumbra on a built-in demo hole (a = ${DEMO_SPIN_RATIO} M)`,
  usage: `Usage: penumbra demo [--json]

Prints the Kerr background of the built-in demo hole, a = ${DEMO_SPIN_RATIO} M.

Options:
  --json       one JSON object (the keys of 'penumbra kerr --json')
  -h, --help   this text
`,
  run(argv, io) {
    const { values } = parseOptions(argv, { json: { type: 'boolean' } });
    const report = backgroundReport({ spinRatio: DEMO_SPIN_RATIO, mass: 1 });
    if (values.json) {
      writeJson(io, backgroundJson(report));
    } else {
      io.stdout('penumbra demo hole\n' + backgroundText(report));
    }
    return 0;
  },
};
