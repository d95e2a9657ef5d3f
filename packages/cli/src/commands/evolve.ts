import {
  bundledPageTable,
  evolutionTimeUnitSeconds,
  evolveHole,
  KNOWN_SPECIES,
  pageFunctions,
  pageTable,
  type PageTable,
} from '@penumbra/emission';
import type { Column } from '@penumbra/core';
import type { Command } from '../command.js';
import { UsageError } from '../command.js';
import { INACCURATE_COLUMN, isInaccurate, warnInaccurate } from '../accuracy.js';
import { formatError, formatNumber, formatTable } from '../format.js';
import { parseMassOption, parseNameList, parseNumber, parseNumberList, parseOptions, requireOption } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';

/** CSV columns of the track: the keys of the JSON track points (the mass in the unit of --unit). */
const trackColumns = (unit: string): Column[] => [
  { name: 'timeSeconds', unit: 's', description: 'time since the start' },
  { name: 'mass', unit, description: 'mass of the hole' },
  { name: 'aStar', unit: '1', description: "the hole's a/M" },
  { ...INACCURATE_COLUMN, description: 'true when the lifetime (and so the times) has an estimated relative error above 1e-3' },
];

/** `penumbra evolve`. */
export const command: Command = {
  name: 'evolve',
  summary: "evaporation history of a hole: lifetime and the track a*(M) from Page's f(a*), g(a*)",
  usage: `Usage: penumbra evolve --a A [--mass M --unit g|kg|msun] [--content LIST] [--below A1,A2,…] [--table-points N] [--json|--csv]

Integrates dM/dt = −f(a*)/M², dJ/dt = −g(a*) a*/M (Page 1976) from a* = a/M.
f and g come from the table shipped with @penumbra/emission (50 nodes,
a* ≤ 0.99); --table-points N recomputes a table of N nodes (slow: minutes).

Options:
  --a A             the hole's initial a/M (0 … 0.99 with the shipped table)
  --mass M          initial mass (default 1 g), always with --unit g, kg or msun
  --content LIST    species, from photon, graviton, neutrino-e, neutrino-mu, neutrino-tau,
                    scalar (default: photons, gravitons, three neutrino species)
  --below LIST      report when a* first falls below these values, each in (0, 1);
                    values at or above the starting a* are reported as reached
                    at the start (default 0.5,0.1, those below the starting a*)
  --table-points N  compute a fresh f, g table with N nodes instead of the shipped one
  --points N        track points printed (default 40)
  --json            JSON {lifetimeSeconds, lifetimeOverMassCubed, relError, inaccurate, track: [{time, mass, aStar}], crossings, diagnostics}
  --csv             the track as CSV (columns timeSeconds, mass, aStar, inaccurate; units in the header)

A lifetime whose estimated relative error (ODE and f, g table) exceeds 1e-3
prints a warning on stderr and carries inaccurate: true.
  -h, --help        this text

Limits:
  0 ≤ a* ≤ 0.99 with the shipped table, up to 0.9999 with --table-points;
  --table-points from 5 to 2000; masses 1e-100 … 1e100 kg (see 'penumbra kerr --help')

Example:
  penumbra evolve --a 0.99 --mass 1e15 --unit g --json
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      a: { type: 'string' },
      mass: { type: 'string' },
      unit: { type: 'string' },
      content: { type: 'string' },
      below: { type: 'string' },
      'table-points': { type: 'string' },
      points: { type: 'string' },
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const aStar = parseNumber('--a', requireOption(values.a, '--a', "the hole's initial a/M"), { min: 0, max: 0.9999 });
    const { mass, unit } = parseMassOption(values) ?? { mass: 1, unit: 'g' };
    const content =
      values.content === undefined ? undefined : parseNameList('--content', values.content, Object.keys(KNOWN_SPECIES));
    // the default milestones are those still ahead of the hole; explicit ones are all reported
    const below =
      values.below === undefined
        ? [0.5, 0.1].filter((t) => t < aStar)
        : parseNumberList('--below', values.below, { min: 0, max: 1, exclusive: true });
    const nPrint =
      values.points === undefined ? 40 : parseNumber('--points', values.points, { min: 2, max: 100_000, integer: true });
    let table: PageTable;
    if (values['table-points'] !== undefined) {
      const n = parseNumber('--table-points', values['table-points'], { min: 5, max: 2000, integer: true });
      table = pageTable(
        { points: n, aMax: Math.max(0.99, aStar) },
        { onPoint: (done, total) => io.stderr(`evolve: f, g table ${done}/${total}\n`) },
      );
    } else {
      table = bundledPageTable();
      if (aStar > table.aStar[table.aStar.length - 1]) {
        throw new UsageError(
          `--a ${aStar} is beyond the shipped table (a* ≤ ${table.aStar[table.aStar.length - 1]}); add --table-points N`,
        );
      }
    }
    const fns = pageFunctions({ table, content });
    const ev = evolveHole({ functions: fns, aStar0: aStar }, { aStarThresholds: below });
    const unitSeconds = evolutionTimeUnitSeconds(mass, unit);
    // Thin the track to about nPrint points evenly spaced in mass (ODE steps crowd at small M), keeping the ends.
    const picked: typeof ev.track = [];
    for (let k = 0, j = 0; k < nPrint - 1; k++) {
      const target = 1 - k / (nPrint - 1);
      while (j < ev.track.length - 1 && ev.track[j].massRatio > target) j++;
      if (picked[picked.length - 1] !== ev.track[j]) picked.push(ev.track[j]);
    }
    picked.push(ev.track[ev.track.length - 1]);
    const track = picked.map((p) => ({ timeSeconds: p.time * unitSeconds, mass: p.massRatio * mass, aStar: p.aStar }));
    const relError = ev.diagnostics.errorEstimate;
    const inaccurate = isInaccurate(relError);
    const result = {
      aStar0: aStar,
      mass0: mass,
      unit,
      lifetimeSeconds: ev.lifetime * unitSeconds,
      lifetimeOverMassCubed: ev.lifetime,
      relError,
      inaccurate,
      crossings: ev.crossings.map((c) => ({
        aStar: c.aStar,
        timeSeconds: c.time * unitSeconds,
        atStart: c.atStart,
        reached: c.reached,
      })),
      f0: fns.f(aStar),
      g0: fns.g(aStar),
      track,
      diagnostics: { ...ev.diagnostics, interpolationError: fns.interpolationError, nodeError: fns.nodeError },
    };
    warnInaccurate(io, [{ what: `lifetime (f, g table error ${formatError(ev.diagnostics.tableError)})`, relError }]);
    writeOutput(io, format, {
      json: () => result,
      csv: () => ({ columns: trackColumns(unit), rows: track.map((p) => [p.timeSeconds, p.mass, p.aStar, inaccurate]) }),
      text: () =>
        `evaporation of a hole of ${formatNumber(mass, 6)} ${unit}, a* = ${aStar}\n` +
        `lifetime: ${formatNumber(result.lifetimeSeconds, 6)} s  (${formatNumber(ev.lifetime, 8)} M₀³ in Planck units; ` +
        `rel. error ${formatError(relError)}${inaccurate ? ', above 1e-3' : ''})\n` +
        result.crossings
          .map((c) =>
            c.atStart
              ? `a* ≤ ${c.aStar} from the start\n`
              : c.reached
                ? `a* < ${c.aStar} after ${formatNumber(c.timeSeconds, 6)} s\n`
                : `a* stays at or above ${c.aStar} until the end\n`,
          )
          .join('') +
        formatTable([
          ['t [s]', `M [${unit}]`, 'a*'],
          ...track.map((p) => [formatNumber(p.timeSeconds, 6), formatNumber(p.mass, 6), formatNumber(p.aStar, 6)]),
        ]),
    });
    return 0;
  },
};
