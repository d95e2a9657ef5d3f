import { InputError } from '@penumbra/core';
import { backgroundJson, backgroundReport, backgroundText } from '../background.js';
import { UsageError, type Command } from '../command.js';
import { GEOMETRIC_UNIT, parseHoleA, parseMassOption, parseOptions, requireOption } from '../options.js';
import { JSON_OPTION, outputFormat, writeOutput } from '../output.js';

/** `penumbra kerr`. */
export const command: Command = {
  name: 'kerr',
  summary: 'background quantities of a Kerr hole (horizons, Ω_H, κ, T_H, area, entropy)',
  usage: `Usage: penumbra kerr --a A [--mass M --unit g|kg|msun|geometric] [--json]

Options:
  --a A        the hole's spin parameter a/M, with |a/M| < 1 (the extremal
               hole a = M is only a limit)
  --mass M     hole mass (default: M = 1, geometric units); always with --unit,
               as in every penumbra command
  --unit U     unit of --mass: g, kg or msun (solar masses) add temperatures in
               K and GeV, Ω_H in rad/s, lengths in m, entropy in k_B;
               geometric takes M in geometric units (G = c = 1, 1e-150 … 1e150)
  --json       one JSON object with keys rPlus, rMinus, omegaH, kappa,
               temperature, area, entropy (geometric units), plus "physical"
               when --unit is given
  -h, --help   this text

Limits:
  |a/M| < 1; M from 1e-150 to 1e150 in geometric units, from 1e-100 to 1e100 kg
  (1e-97 … 1e103 g, 5.03e-131 … 5.03e69 msun) in physical units

Examples:
  penumbra kerr --a 0.9
  penumbra kerr --a 0.9 --mass 1e15 --unit g --json
  penumbra kerr --a 0.5 --mass 2 --unit geometric
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
    const given = parseMassOption(values, { geometric: true });
    const mass = given?.mass ?? 1;
    const unit = given === undefined || given.unit === GEOMETRIC_UNIT ? undefined : given.unit;
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
