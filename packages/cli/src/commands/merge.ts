import { GridError, mergeRuns } from '@penumbra/grid';
import { UsageError, type Command } from '../command.js';
import { countsText, failuresText } from '../gridSummary.js';
import { parseOptions } from '../options.js';

/** `penumbra merge`. */
export const command: Command = {
  name: 'merge',
  summary: "combine the output directories of 'penumbra table --shard' runs into one table",
  usage: `Usage: penumbra merge DIR... --out OUT

Checks that every DIR holds the same grid, that together they hold every
chunk of it, that every chunk passes its checksum and that a chunk found
twice is the same, then writes OUT with the tables a single unsharded run
would have written (byte for byte; only
OUT/run.json, the timing record, differs). OUT may be new, empty, or one of
the DIRs. Any problem: one message, exit code 2, nothing written.

Options:
  --out OUT    output directory
  -h, --help   this text

Example:
  penumbra merge part-1 part-2 part-3 --out table
`,
  run(argv, io) {
    const { values, positionals } = parseOptions(argv, { out: { type: 'string' } }, true);
    const problems: string[] = [];
    if (positionals.length === 0) problems.push('missing the shard directories to merge');
    if (values.out === undefined) problems.push('missing --out OUT (the output directory)');
    if (problems.length) throw new UsageError(problems.join('; '));
    let result: ReturnType<typeof mergeRuns>;
    try {
      result = mergeRuns(positionals, values.out!);
    } catch (error) {
      if (error instanceof GridError) throw new UsageError(error.message);
      throw error;
    }
    io.stderr(
      `penumbra merge: ${result.chunks} chunks from ${result.sources.length} directories: ${countsText(result.summary)}; wrote ${result.files.join(', ')}\n`,
    );
    io.stderr(failuresText(result.summary));
    return 0;
  },
};
