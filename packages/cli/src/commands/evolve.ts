import {
  bundledPageTable,
  evolutionTimeUnitSeconds,
  evolveHole,
  pageFunctions,
  pageTable,
  resolveContent,
  type PageTable,
} from '@penumbra/emission';
import type { Column } from '@penumbra/core';
import type { Command } from '../command.js';
import { UsageError } from '../command.js';
import { formatNumber, formatTable } from '../format.js';
import { parseMassUnit, parseNumber, parseNumberList, parseOptions, requireOption } from '../options.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';

/** CSV columns of the track: the keys of the JSON track points (the mass in the unit of --unit). */
const trackColumns = (unit: string): Column[] => [
  { name: 'timeSeconds', unit: 's', description: 'time since the start' },
  { name: 'mass', unit, description: 'mass of the hole' },
  { name: 'aStar', unit: '1', description: "the hole's a/M" },
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
  --mass M          initial mass (default 1 g), with --unit g, kg or msun
  --content LIST    species, e.g. photon,graviton,neutrino-e (default: photons, gravitons, three neutrino species)
  --below LIST      report when a* first falls below these values (default 0.5,0.1)
  --table-points N  compute a fresh f, g table with N nodes instead of the shipped one
  --points N        track points printed (default 40)
  --json            JSON {lifetimeSeconds, lifetimeOverMassCubed, track: [{time, mass, aStar}], crossings, diagnostics}
  --csv             the track as CSV (columns timeSeconds, mass, aStar; units in the header)
  -h, --help        this text

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
    const mass = values.mass === undefined ? 1 : parseNumber('--mass', values.mass, { min: 0, exclusive: true });
    const unit = parseMassUnit('--unit', values.unit ?? 'g');
    const content = values.content === undefined ? undefined : values.content.split(',').map((s) => s.trim());
    if (content) resolveContent(content);
    const below =
      values.below === undefined ? [0.5, 0.1] : parseNumberList('--below', values.below, { min: 0, max: 1, exclusive: true });
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
    const result = {
      aStar0: aStar,
      mass0: mass,
      unit,
      lifetimeSeconds: ev.lifetime * unitSeconds,
      lifetimeOverMassCubed: ev.lifetime,
      crossings: ev.crossings.map((c) => ({ aStar: c.aStar, timeSeconds: c.time * unitSeconds })),
      f0: fns.f(aStar),
      g0: fns.g(aStar),
      track,
      diagnostics: { ...ev.diagnostics, interpolationError: fns.interpolationError, nodeError: fns.nodeError },
    };
    writeOutput(io, format, {
      json: () => result,
      csv: () => ({ columns: trackColumns(unit), rows: track.map((p) => [p.timeSeconds, p.mass, p.aStar]) }),
      text: () =>
        `evaporation of a hole of ${formatNumber(mass, 6)} ${unit}, a* = ${aStar}\n` +
        `lifetime: ${formatNumber(result.lifetimeSeconds, 6)} s  (${formatNumber(ev.lifetime, 8)} M₀³ in Planck units)\n` +
        result.crossings.map((c) => `a* < ${c.aStar} after ${formatNumber(c.timeSeconds, 6)} s\n`).join('') +
        formatTable([
          ['t [s]', `M [${unit}]`, 'a*'],
          ...track.map((p) => [formatNumber(p.timeSeconds, 6), formatNumber(p.mass, 6), formatNumber(p.aStar, 6)]),
        ]),
    });
    return 0;
  },
};
