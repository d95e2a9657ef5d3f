import { InputError } from '@penumbra/core';
import { backgroundJson, backgroundReport, backgroundText } from '../background.js';
import { UsageError, type Command } from '../command.js';
import { parseHoleA, parseMassUnit, parseNumber, parseOptions, requireOption } from '../options.js';
import { JSON_OPTION, outputFormat, writeOutput } from '../output.js';

/** `penumbra kerr`. */
export const command: Command = {
  name: 'kerr',
  summary: 'background quantities of a Kerr hole (horizons, Ω_H, κ, T_H, area, entropy)',
  usage: `Usage: penumbra kerr --a A [--mass M [--unit g|kg|msun]] [--json]

Options:
  --a A        the hole's spin parameter a/M, with |a/M| < 1 (the extremal
               hole a = M is only a limit)
  --mass M     hole mass; geometric units (default 1) unless --unit is given
  --unit U     physical unit of --mass: g, kg or msun (solar masses); adds
               temperatures in K and GeV, Ω_H in rad/s, lengths in m, entropy in k_B
  --json       one JSON object with keys rPlus, rMinus, omegaH, kappa,
               temperature, area, entropy (geometric units), plus "physical"
               when --unit is given
  -h, --help   this text

Examples:
  penumbra kerr --a 0.9
  penumbra kerr --a 0.9 --mass 1e15 --unit g --json
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      a: { type: 'string' },
      mass: { type: 'string' },
      unit: { type: 'string' },
      ...JSON_OPTION,
    });
    const format = outputFormat(values);
    const aStar = parseHoleA('--a', requireOption(values.a, '--a', "the hole's a/M"));
    const unit = values.unit === undefined ? undefined : parseMassUnit('--unit', values.unit);
    if (unit !== undefined && values.mass === undefined) throw new UsageError('--unit needs --mass');
    const mass = values.mass === undefined ? 1 : parseNumber('--mass', values.mass, { min: 0, exclusive: true });
    const report = massChecked(values.mass, () => backgroundReport({ aStar, mass, unit }));
    writeOutput(io, format, { json: () => backgroundJson(report), text: () => backgroundText(report) });
    return 0;
  },
};

/** A mass the background cannot represent becomes one line naming --mass and its range. */
function massChecked<T>(text: string | undefined, compute: () => T): T {
  try {
    return compute();
  } catch (error) {
    if (error instanceof InputError && error.parameter === 'mass')
      throw new UsageError(`--mass must be in ${error.allowed}, got ${text}`);
    throw error;
  }
}
