import { existsSync, readFileSync } from 'node:fs';
import {
  defaultWorkers,
  formatDuration,
  GridError,
  gridFromFlags,
  hasGridFlags,
  parseShard,
  progressPrinter,
  runGrid,
  runProblems,
  validateGrid,
  type GridSpec,
  type RunSummary,
  type ShardSpec,
} from '@penumbra/grid';
import { UsageError, type Command } from '../command.js';
import { limitsHelp } from '../limits.js';
import { countsText, failuresText } from '../gridSummary.js';
import { parseOptions } from '../options.js';

/** `penumbra table`. */
export const command: Command = {
  name: 'table',
  summary: 'compute a grid of Γ, reflection, cross-sections or spectra on every core; sharded and resumable',
  usage: `Usage: penumbra table GRID.json --out DIR [--workers N] [--shard K/N] [--quiet]
       penumbra table --spins LIST --a LIST --omega RANGE [grid options] --out DIR
       penumbra table --species LIST --mass M --unit g|kg|msun --a LIST --omega RANGE [grid options] --out DIR

Computes every point of the grid on a pool of worker threads and writes
DIR/modes.csv, DIR/cross-section.csv, DIR/spectra.csv (units in the headers,
geometric units with M = 1) and DIR/table.json. Points are written in chunks,
each atomically: rerunning the same command after an interruption skips the
finished chunks and gives the same bytes. Each chunk file ends in a sha256
checksum; a chunk that fails it (edited, cut short) is named and recomputed. A mode that does not converge is a
row with status 'not-converged' and the solver's message, never a number.
CSV headers are camelCase names with units in brackets (relError [1]), the
same names as the keys of table.json. See docs/grid.md.

Options:
  --out DIR           output directory; new, empty, or holding this same grid
  --workers N         worker threads (default: every core, ${defaultWorkers()} here)
  --shard K/N         compute only shard K of N (cost-balanced, deterministic);
                      combine the shards with 'penumbra merge'
  --quiet             no progress bar on stderr

Grid options (instead of GRID.json):
  --spins LIST        field spins, e.g. 0,1/2,1,2
  --fields LIST       instead of --spins: fields SPIN[:MASS] with MASS = Mμ
                      (units of 1/M), e.g. 0,0:0.2,1/2:0.2
  --species LIST      instead of --spins: emitted species, names (electron,
                      standard-model, ...) or NAME:SPIN:DOF[:MASS_GEV]; needs
                      --mass and --unit (each species' Mμ comes from them)
  --mass M, --unit U  the hole's mass of --species, U one of g, kg, msun
  --a LIST            the holes' spin parameters a/M, e.g. 0,0.5,0.9
  --omega RANGE       frequencies Mω: FROM:TO:COUNT, or a list W1,W2,...
  --spacing S         linear (default) or log, for FROM:TO:COUNT
  --l L               modes of gamma/reflection: MAX, MIN:MAX, or auto (default;
                      the l range the cross-section sum needs)
  --tol T             relative accuracy (default 1e-6)
  --quantities LIST   gamma, reflection, crossSection, spectra (default gamma)
  --chunk-size N      grid points per output chunk (default 16)

Massive fields below their threshold (Mω ≤ Mμ) are rows with status
'invalid-input': no wave reaches infinity there.

GRID.json holds the same as an object, e.g.
  {"fieldSpins": [0, 1], "holeA": [0, 0.9],
   "frequencies": {"spacing": "log", "from": 0.01, "to": 2, "count": 40},
   "l": {"min": 0, "max": 3}, "tolerance": 1e-6,
   "quantities": ["gamma", "reflection"], "chunkSize": 16}
and "fields": [0, {"spin": 0, "mass": 0.2}] or "species": ["electron",
{"name": "dark", "spin": 0, "dof": 1, "massGeV": 0.01}] with "holeMass":
{"value": 1e16, "unit": "g"} in place of "fieldSpins".

Every problem with the grid, the directory or the options is reported at
once, with exit code 2, before anything is written.

${limitsHelp(['l', 'a', 'omega', 'tol'])}`,
  async run(argv, io) {
    const { values, positionals } = parseOptions(
      argv,
      {
        out: { type: 'string' },
        workers: { type: 'string' },
        shard: { type: 'string' },
        quiet: { type: 'boolean' },
        spins: { type: 'string' },
        fields: { type: 'string' },
        species: { type: 'string' },
        mass: { type: 'string' },
        unit: { type: 'string' },
        a: { type: 'string' },
        omega: { type: 'string' },
        spacing: { type: 'string' },
        l: { type: 'string' },
        tol: { type: 'string' },
        quantities: { type: 'string' },
        'chunk-size': { type: 'string' },
      },
      true,
    );
    const problems: string[] = [];
    const flags = {
      spins: values.spins,
      fields: values.fields,
      species: values.species,
      mass: values.mass,
      unit: values.unit,
      a: values.a,
      omega: values.omega,
      spacing: values.spacing,
      l: values.l,
      tol: values.tol,
      quantities: values.quantities,
      chunkSize: values['chunk-size'],
    };
    let raw: unknown;
    if (positionals.length > 1) problems.push(`expected one grid file, got ${positionals.length}: ${positionals.join(' ')}`);
    if (positionals.length >= 1 && hasGridFlags(flags))
      problems.push('give either GRID.json or grid options (--spins, --a, --omega, ...), not both');
    else if (positionals.length === 1) raw = readGridJson(positionals[0], problems);
    else if (hasGridFlags(flags)) raw = gridFromFlags(flags);
    else if (positionals.length === 0)
      problems.push('missing the grid: give GRID.json or grid options (--spins, --a, --omega, ...)');

    let grid: GridSpec | undefined;
    if (raw !== undefined) {
      try {
        grid = validateGrid(raw);
      } catch (error) {
        if (!(error instanceof GridError)) throw error;
        problems.push(...error.problems);
      }
    }
    let shard: ShardSpec = { k: 1, n: 1 };
    if (values.shard !== undefined) {
      const parsed = parseShard(values.shard);
      if (typeof parsed === 'string') problems.push(parsed);
      else shard = parsed;
    }
    let workers = defaultWorkers();
    if (values.workers !== undefined) {
      workers = /^\s*\d+\s*$/.test(values.workers) ? Number(values.workers) : Number.NaN;
      if (!(Number.isInteger(workers) && workers >= 1 && workers <= 1024))
        problems.push(`--workers expects an integer from 1 to 1024, got '${values.workers}'`);
    }
    if (values.out === undefined) problems.push('missing --out DIR (the output directory)');
    else if (grid) problems.push(...runProblems({ grid, out: values.out, workers }));
    if (problems.length)
      throw new UsageError(
        problems.length === 1
          ? problems[0]
          : `${problems.length} problems: ${problems.map((p, i) => `(${i + 1}) ${p}`).join('; ')}`,
      );

    const out = values.out!;
    const showProgress = !values.quiet;
    const result = await runGrid({
      grid: grid!,
      out,
      workers,
      shard,
      onCorruptChunk: ({ path, problem }) => io.stderr(`penumbra table: ${path} is corrupt (${problem}); recomputing it\n`),
      onStart: (info) => {
        if (info.skipped > 0)
          io.stderr(`penumbra table: resuming in ${out}: ${info.skipped} of ${info.chunks} chunks already finished\n`);
      },
      onProgress: showProgress ? progressPrinter(io.stderr, Boolean(process.stderr.isTTY)) : undefined,
    });
    io.stderr(summaryText(result, out));
    return 0;
  },
};

function readGridJson(path: string, problems: string[]): unknown {
  if (!existsSync(path)) {
    problems.push(`grid file ${path} does not exist`);
    return undefined;
  }
  try {
    return JSON.parse(readFileSync(path, 'utf8'));
  } catch (error) {
    problems.push(`grid file ${path} is not valid JSON (${(error as Error).message})`);
    return undefined;
  }
}

function summaryText(r: RunSummary, out: string): string {
  const where = r.shard.n > 1 ? `shard ${r.shard.k}/${r.shard.n}: ` : '';
  let text = `penumbra table: ${where}${r.chunksComputed} chunks (${r.tasksComputed} points) computed, ${r.chunksSkipped} already done, in ${formatDuration(r.seconds)} with ${r.workers} worker${r.workers > 1 ? 's' : ''}\n`;
  if (r.complete && r.summary) {
    text += `penumbra table: grid complete: ${countsText(r.summary)}; wrote ${r.files.join(', ')}\n`;
    text += failuresText(r.summary);
  } else {
    text += `penumbra table: ${r.missingChunks} chunks of the grid are not in ${out} yet; when every shard has finished, run 'penumbra merge DIR... --out OUT'\n`;
  }
  return text;
}
